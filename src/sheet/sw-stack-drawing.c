/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-stack-drawing"

#include "config.h"

#include "sw-stack-drawing.h"

#include "sw-format.h"
#include "sw-sheet-private.h"
#include "sw-text-fit.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

static gboolean
stage_used (const SwStackMasses *m, guint i)
{
  return isfinite (m->stage_kg[i]) && m->stage_kg[i] > 0.0;
}

gboolean
sw_stack_masses_from_sizing (const SwSizing *s, SwStackMasses *m)
{
  g_return_val_if_fail (m != NULL, FALSE);

  memset (m, 0, sizeof *m);
  if (s == NULL || !s->feasible)
    return FALSE;
  m->n_stages = MIN (s->n_stages, SW_MAX_STAGES);
  for (guint i = 0; i < m->n_stages; i++)
    {
      m->stage_kg[i] = s->stages[i].unused ? 0.0 : s->stages[i].stage_mass_kg;
      m->structure_kg[i] = s->stages[i].structural_mass_kg;
    }
  m->payload_kg = s->payload_kg;
  if (s->boosters.present && s->boosters.count > 0 && isfinite (s->boosters.booster_mass_kg)
      && s->boosters.booster_mass_kg > 0.0)
    {
      m->n_boosters = MIN (s->boosters.count, SW_BOOSTERS_MAX);
      m->booster_kg = s->boosters.booster_mass_kg;
      m->booster_structure_kg = s->boosters.structural_mass_kg;
    }
  return TRUE;
}

/* The gap between boosters and beside the core, as a share of a booster's
 * width (so the widths below are exact at every scale). */
#define BOOSTER_GAP 0.1

/* Boosters on the left of the core (the rest go right). */
static guint
boosters_left (guint n)
{
  return (n + 1) / 2;
}

double
sw_stack_area_per_kg (const SwStackScale *s)
{
  return s->a * s->b;
}

/* Sums of the shape rule's powers: the widest m^(1/3), the total of m^(2/3)
 * (the cone counts twice), the number of parts and of unused stages. */
static void
stack_sums (const SwStackMasses *m, double *max_cbrt, double *sum_23, guint *n_parts,
            guint *n_unused)
{
  *max_cbrt = cbrt (MAX (m->payload_kg, 0.0));
  *sum_23 = 2.0 * pow (MAX (m->payload_kg, 0.0), 2.0 / 3.0);
  *n_parts = 1;
  *n_unused = 0;
  for (guint i = 0; i < m->n_stages; i++)
    {
      (*n_parts)++;
      if (!stage_used (m, i))
        {
          (*n_unused)++;
          continue;
        }
      *max_cbrt = MAX (*max_cbrt, cbrt (m->stage_kg[i]));
      *sum_23 += pow (m->stage_kg[i], 2.0 / 3.0);
    }
  /* Boosters beside the core widen the widest row (the stack stays centred
   * on the core, so the wider side counts twice); a booster taller than
   * the whole stack raises it. */
  if (m->n_boosters > 0 && m->n_stages > 0)
    {
      double core = stage_used (m, 0) ? cbrt (m->stage_kg[0]) : 0.0;
      *max_cbrt = MAX (*max_cbrt, core + 2.0 * boosters_left (m->n_boosters)
                                           * (1.0 + BOOSTER_GAP) * cbrt (m->booster_kg));
      *sum_23 = MAX (*sum_23, pow (m->booster_kg, 2.0 / 3.0));
    }
}

double
sw_stack_width (const SwStackMasses *m, const SwStackScale *s)
{
  double max_cbrt, sum_23;
  guint n, n_unused;

  stack_sums (m, &max_cbrt, &sum_23, &n, &n_unused);
  return s->a * max_cbrt;
}

double
sw_stack_height (const SwStackMasses *m, const SwStackScale *s, double gap,
                 double unused_height)
{
  double max_cbrt, sum_23;
  guint n, n_unused;

  stack_sums (m, &max_cbrt, &sum_23, &n, &n_unused);
  if (unused_height <= 0.0)
    n -= n_unused;
  return s->b * sum_23 + unused_height * n_unused + gap * (n > 0 ? n - 1 : 0);
}

gboolean
sw_stack_fit (const SwStackMasses *const *stacks, guint n_stacks, double width, double height,
              double gap, double unused_height, double side_gap, double min_aspect,
              double max_aspect, SwStackScale *scale)
{
  double sum_cbrt = 0.0, max_23 = 0.0, heaviest = 0.0, room_h = INFINITY;
  double room_w = width - side_gap * (n_stacks > 0 ? n_stacks - 1 : 0);
  double r, aspect;

  g_return_val_if_fail (scale != NULL, FALSE);

  scale->a = scale->b = 0.0;
  for (guint j = 0; j < n_stacks; j++)
    {
      double max_cbrt, sum_23, fixed, part_cbrt;
      guint n, n_unused;
      stack_sums (stacks[j], &max_cbrt, &sum_23, &n, &n_unused);
      /* The aspect rule is about one block: the heaviest part's, not the
       * row of core and boosters. */
      part_cbrt = cbrt (MAX (stacks[j]->payload_kg, 0.0));
      for (guint i = 0; i < stacks[j]->n_stages; i++)
        if (stage_used (stacks[j], i))
          part_cbrt = MAX (part_cbrt, cbrt (stacks[j]->stage_kg[i]));
      if (unused_height <= 0.0)
        n -= n_unused;
      fixed = unused_height * n_unused + gap * (n > 0 ? n - 1 : 0);
      sum_cbrt += max_cbrt;
      /* Each stack's height: b sum_23 + fixed <= height. */
      if (sum_23 > 0.0)
        {
          if (!(height - fixed > 0.0))
            return FALSE;
          if ((height - fixed) / sum_23 < room_h)
            {
              room_h = (height - fixed) / sum_23;
              max_23 = sum_23;
            }
        }
      heaviest = MAX (heaviest, part_cbrt);
    }
  if (!(sum_cbrt > 0.0) || !isfinite (room_h) || !(room_w > 0.0) || !(max_23 > 0.0))
    return FALSE;

  /* With b = r a: the heights need a <= room_h / r, the widths
   * a <= room_w / sum_cbrt; both bind at r = room_h / (room_w / sum_cbrt).
   * The heaviest part's height/width is r m^(1/3). */
  r = room_h / (room_w / sum_cbrt);
  aspect = CLAMP (r * heaviest, min_aspect, max_aspect);
  r = aspect / heaviest;
  scale->a = MIN (room_h / r, room_w / sum_cbrt);
  scale->b = r * scale->a;
  return isfinite (scale->a) && scale->a > 0.0 && isfinite (scale->b) && scale->b > 0.0;
}

void
sw_stack_place (const SwStackMasses *m, const SwStackScale *s, double cx, double bottom,
                double gap, double unused_height, SwStackGeometry *g)
{
  double y = bottom, below_w = 0.0;

  g_return_if_fail (m != NULL && s != NULL && g != NULL);

  memset (g, 0, sizeof *g);
  for (guint i = 0; i <= m->n_stages && i < SW_STACK_MAX_PARTS; i++)
    {
      gboolean payload = i == m->n_stages;
      guint k = g->n;
      double mass = payload ? m->payload_kg : m->stage_kg[i];
      double w, h;

      if (!payload && !stage_used (m, i))
        {
          if (unused_height <= 0.0)
            continue;
          g->kind[k] = SW_STACK_PART_UNUSED;
          w = MAX (below_w * 0.8, 24.0);
          h = unused_height;
          mass = 0.0;
        }
      else
        {
          g->kind[k] = payload ? SW_STACK_PART_PAYLOAD : SW_STACK_PART_STAGE;
          w = s->a * cbrt (MAX (mass, 0.0));
          h = (payload ? 2.0 : 1.0) * s->b * pow (MAX (mass, 0.0), 2.0 / 3.0);
          below_w = w;
        }
      if (k > 0)
        y -= gap;
      y -= h;
      g->stage[k] = payload ? -1 : (int) i;
      g->mass_kg[k] = mass;
      g->box[k] = (SwStackBox) { cx - w / 2.0, y, w, h };
      if (g->kind[k] == SW_STACK_PART_STAGE)
        {
          double f = m->stage_kg[i] > 0.0 ? CLAMP (m->structure_kg[i] / m->stage_kg[i], 0.0, 1.0)
                                          : 0.0;
          g->structure[k] = (SwStackBox) { cx - w / 2.0, y + h * (1.0 - f), w, h * f };
        }
      g->width = MAX (g->width, w);
      /* The boosters beside the core, on the ground, a gap apart. */
      if (!payload && i == 0 && g->kind[k] == SW_STACK_PART_STAGE && m->n_boosters > 0)
        {
          double bw = s->a * cbrt (m->booster_kg), bh = s->b * pow (m->booster_kg, 2.0 / 3.0);
          double f = CLAMP (m->booster_structure_kg / m->booster_kg, 0.0, 1.0);
          double hgap = BOOSTER_GAP * bw;
          guint left = boosters_left (m->n_boosters);

          g->n_boosters = m->n_boosters;
          g->booster_mass_kg = m->booster_kg;
          for (guint j = 0; j < m->n_boosters; j++)
            {
              gboolean on_left = j < left;
              guint pos = on_left ? j : j - left;
              double bx = on_left ? cx - w / 2.0 - (pos + 1) * (bw + hgap)
                                  : cx + w / 2.0 + hgap + pos * (bw + hgap);
              g->booster[j] = (SwStackBox) { bx, bottom - bh, bw, bh };
              g->booster_structure[j] = (SwStackBox) { bx, bottom - bh * f, bw, bh * f };
            }
          g->width = MAX (g->width, w + 2.0 * left * (bw + hgap));
        }
      g->n++;
    }
  g->top = y;
}

static void
source (cairo_t *cr, const double rgba[4])
{
  cairo_set_source_rgba (cr, rgba[0], rgba[1], rgba[2], rgba[3]);
}

static void
part_path (cairo_t *cr, const SwStackGeometry *g, guint i)
{
  const SwStackBox *b = &g->box[i];

  if (g->kind[i] == SW_STACK_PART_PAYLOAD)
    {
      cairo_move_to (cr, b->x, b->y + b->height);
      cairo_line_to (cr, b->x + b->width, b->y + b->height);
      cairo_line_to (cr, b->x + b->width / 2.0, b->y);
      cairo_close_path (cr);
    }
  else
    cairo_rectangle (cr, b->x, b->y, b->width, b->height);
}

void
sw_stack_draw_part (cairo_t *cr, const SwStackGeometry *g, guint i, const SwStackStyle *st,
                    gboolean outline_only)
{
  static const double dash[] = { 4.0, 3.0 };
  const SwStackBox *b;

  g_return_if_fail (cr != NULL && g != NULL && st != NULL && i < g->n);

  b = &g->box[i];
  cairo_save (cr);
  cairo_new_path (cr);
  if (outline_only || g->kind[i] == SW_STACK_PART_UNUSED)
    {
      double lw = MAX (st->line_width, 0.5);
      cairo_set_dash (cr, dash, G_N_ELEMENTS (dash), 0.0);
      cairo_set_line_width (cr, lw);
      if (g->kind[i] == SW_STACK_PART_PAYLOAD)
        source (cr, st->payload);
      else
        source (cr, st->outline[3] > 0.0 ? st->outline : st->structure);
      part_path (cr, g, i);
      cairo_stroke (cr);
      cairo_restore (cr);
      return;
    }
  switch (g->kind[i])
    {
    case SW_STACK_PART_STAGE:
      source (cr, st->propellant);
      cairo_rectangle (cr, b->x, b->y, b->width, b->height - g->structure[i].height);
      cairo_fill (cr);
      source (cr, st->structure);
      cairo_rectangle (cr, g->structure[i].x, g->structure[i].y, g->structure[i].width,
                       g->structure[i].height);
      cairo_fill (cr);
      break;
    case SW_STACK_PART_PAYLOAD:
    default:
      source (cr, st->payload);
      part_path (cr, g, i);
      cairo_fill (cr);
      break;
    }
  if (st->outline[3] > 0.0 && st->line_width > 0.0)
    {
      source (cr, st->outline);
      cairo_set_line_width (cr, st->line_width);
      part_path (cr, g, i);
      cairo_stroke (cr);
    }
  cairo_restore (cr);
}

void
sw_stack_draw_boosters (cairo_t *cr, const SwStackGeometry *g, const SwStackStyle *st,
                        gboolean outline_only)
{
  static const double dash[] = { 4.0, 3.0 };

  g_return_if_fail (cr != NULL && g != NULL && st != NULL);

  for (guint j = 0; j < g->n_boosters; j++)
    {
      const SwStackBox *b = &g->booster[j], *sb = &g->booster_structure[j];

      cairo_save (cr);
      cairo_new_path (cr);
      if (outline_only)
        {
          cairo_set_dash (cr, dash, G_N_ELEMENTS (dash), 0.0);
          cairo_set_line_width (cr, MAX (st->line_width, 0.5));
          source (cr, st->outline[3] > 0.0 ? st->outline : st->structure);
          cairo_rectangle (cr, b->x, b->y, b->width, b->height);
          cairo_stroke (cr);
          cairo_restore (cr);
          continue;
        }
      source (cr, st->propellant);
      cairo_rectangle (cr, b->x, b->y, b->width, b->height - sb->height);
      cairo_fill (cr);
      source (cr, st->structure);
      cairo_rectangle (cr, sb->x, sb->y, sb->width, sb->height);
      cairo_fill (cr);
      if (st->outline[3] > 0.0 && st->line_width > 0.0)
        {
          source (cr, st->outline);
          cairo_set_line_width (cr, st->line_width);
          cairo_rectangle (cr, b->x, b->y, b->width, b->height);
          cairo_stroke (cr);
        }
      cairo_restore (cr);
    }
}

void
sw_stack_draw (cairo_t *cr, const SwStackGeometry *g, const SwStackStyle *st,
               gboolean outline_only)
{
  for (guint i = 0; i < g->n; i++)
    sw_stack_draw_part (cr, g, i, st, outline_only);
  sw_stack_draw_boosters (cr, g, st, outline_only);
}

/* ---- the vehicle to scale ------------------------------------------------- */

char *
sw_scale_person_label (void)
{
  g_autofree char *n = sw_format_number (SW_PERSON_HEIGHT_M, 1);
  return g_strdup_printf ("%s %s", n, C_("unit", "m"));
}

double
sw_scale_bar_length (double height_m)
{
  double want = height_m / 4.0, decade, best;
  static const double steps[] = { 1.0, 2.0, 5.0 };

  if (!(want > 0.0) || !isfinite (want))
    return 1.0;
  decade = pow (10.0, floor (log10 (want)));
  best = decade;
  for (guint i = 0; i < G_N_ELEMENTS (steps); i++)
    if (steps[i] * decade <= want)
      best = steps[i] * decade;
  return best;
}

gboolean
sw_scale_layout (const SwVehicleShape *v, double x, double y, double w, double h,
                 double left_room, double right_room, SwScaleGeometry *g)
{
  double width_m, s, person_m = SW_PERSON_HEIGHT_M * 0.3, gap = 8.0;
  guint nb;

  g_return_val_if_fail (v != NULL && g != NULL, FALSE);

  memset (g, 0, sizeof *g);
  if (!v->complete || !(v->height_m > 0.0) || !(v->max_diameter_m > 0.0))
    return FALSE;
  /* Boosters beside the core (the hook of sw-vehicle-shape.h): two in profile. */
  nb = v->n_boosters > 0 && v->booster_diameter_m > 0.0 && v->booster_length_m > 0.0
       ? MIN (v->n_boosters, 2) : 0;
  width_m = v->max_diameter_m + (nb > 0 ? 2.0 * v->booster_diameter_m : 0.0);
  /* Metres across: the vehicle, and the person's width beside it. */
  s = MIN (h / MAX (v->height_m, nb > 0 ? v->booster_length_m : 0.0),
           (w - left_room - right_room - 2.0 * gap) / (width_m + person_m));
  if (!(s > 0.0) || !isfinite (s))
    return FALSE;
  g->px_per_m = s;
  g->bottom = y + h;
  g->cx = x + left_room + gap + width_m * s / 2.0
          + MAX (0.0, (w - left_room - right_room - 2.0 * gap - (width_m + person_m) * s) / 2.0);
  g->n_stages = v->n_stages;
  for (guint i = 0; i < v->n_stages; i++)
    {
      const SwStageGeometry *sg = &v->stages[i];
      double d = sg->diameter_m * s, len = sg->shape.length_m * s;
      g->stage[i] = (SwStackBox) { g->cx - d / 2.0, g->bottom - sg->base_m * s - len, d, len };
    }
  g->fairing = (SwStackBox) { g->cx - v->fairing_diameter_m * s / 2.0,
                              g->bottom - v->height_m * s, v->fairing_diameter_m * s,
                              v->fairing_length_m * s };
  g->top = g->bottom - v->height_m * s;
  g->n_boosters_drawn = nb;
  for (guint k = 0; k < nb; k++)
    {
      double bd = v->booster_diameter_m * s;
      double off = (v->max_diameter_m / 2.0) * s + bd / 2.0;
      double bx = g->cx + (k == 0 ? -off : off);
      g->booster[k] = (SwStackBox) { bx - bd / 2.0, g->bottom - v->booster_length_m * s, bd,
                                     v->booster_length_m * s };
    }
  g->person = (SwStackBox) { g->cx + width_m * s / 2.0 + gap, g->bottom - SW_PERSON_HEIGHT_M * s,
                             person_m * s, SW_PERSON_HEIGHT_M * s };
  g->bar_m = sw_scale_bar_length (v->height_m);
  g->bar = (SwStackBox) { x + left_room - 6.0, g->bottom - g->bar_m * s, 6.0, g->bar_m * s };
  return TRUE;
}

static void
scale_capsule (cairo_t *cr, double cx, double bottom_y, double d, double len, double dome)
{
  double r = d / 2.0, top_y = bottom_y - len;
  double h = MIN (dome, len / 2.0);

  /* A cylinder closed by two half-ellipses of height @dome. */
  cairo_new_path (cr);
  cairo_save (cr);
  cairo_translate (cr, cx, top_y + h);
  cairo_scale (cr, r, MAX (h, 1e-6));
  cairo_arc (cr, 0.0, 0.0, 1.0, G_PI, 2.0 * G_PI);
  cairo_restore (cr);
  cairo_line_to (cr, cx + r, bottom_y - h);
  cairo_save (cr);
  cairo_translate (cr, cx, bottom_y - h);
  cairo_scale (cr, r, MAX (h, 1e-6));
  cairo_arc (cr, 0.0, 0.0, 1.0, 0.0, G_PI);
  cairo_restore (cr);
  cairo_close_path (cr);
}

static void
fill_stroke (cairo_t *cr, const double fill[4], const SwScaleStyle *st)
{
  source (cr, fill);
  cairo_fill_preserve (cr);
  if (st->outline[3] > 0.0 && st->line_width > 0.0)
    {
      source (cr, st->outline);
      cairo_set_line_width (cr, st->line_width);
      cairo_stroke (cr);
    }
  else
    cairo_new_path (cr);
}

/* A cylinder of @b with a nose of @nose px on top (boosters, the fairing). */
static void
nosed_path (cairo_t *cr, const SwStackBox *b, double nose)
{
  double l = b->x, r = b->x + b->width, cx = b->x + b->width / 2.0;
  double base = b->y + b->height, shoulder = b->y + nose;

  cairo_new_path (cr);
  cairo_move_to (cr, l, base);
  cairo_line_to (cr, l, shoulder);
  /* An ogive-like nose: tangent to the wall at the shoulder. */
  cairo_curve_to (cr, l, shoulder - nose * 0.55, cx - b->width * 0.12, b->y, cx, b->y);
  cairo_curve_to (cr, cx + b->width * 0.12, b->y, r, shoulder - nose * 0.55, r, shoulder);
  cairo_line_to (cr, r, base);
  cairo_close_path (cr);
}

void
sw_scale_draw (cairo_t *cr, const SwVehicleShape *v, const SwScaleGeometry *g,
               const SwScaleStyle *st)
{
  double s;

  g_return_if_fail (cr != NULL && v != NULL && g != NULL && st != NULL);
  if (!(g->px_per_m > 0.0))
    return;
  s = g->px_per_m;
  cairo_save (cr);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);

  for (guint k = 0; k < g->n_boosters_drawn; k++)
    {
      nosed_path (cr, &g->booster[k], MIN (g->booster[k].width * 1.2,
                                           g->booster[k].height * 0.3));
      fill_stroke (cr, st->skin, st);
    }

  for (guint i = 0; i < g->n_stages; i++)
    {
      const SwStageGeometry *sg = &v->stages[i];
      const SwStageShape *sh = &sg->shape;
      const SwStackBox *b = &g->stage[i];
      double base = b->y + b->height, d = b->width, dome = sg->diameter_m / 2.0 / SW_DOME_ASPECT_RATIO * s;
      double eng = sh->engine_section_length_m * s, inset = MIN (1.5, d * 0.06);
      double y0 = base - eng;

      /* The stage's wall, with the engine section's nozzle inside it. */
      cairo_new_path (cr);
      cairo_rectangle (cr, b->x, b->y, b->width, b->height);
      fill_stroke (cr, st->skin, st);
      cairo_new_path (cr);
      cairo_move_to (cr, g->cx - d * 0.12, y0 + eng * 0.15);
      cairo_line_to (cr, g->cx + d * 0.12, y0 + eng * 0.15);
      cairo_line_to (cr, g->cx + d * 0.30, base);
      cairo_line_to (cr, g->cx - d * 0.30, base);
      cairo_close_path (cr);
      source (cr, st->mark);
      cairo_fill (cr);

      /* Tanks from the bottom up: fuel, intertank, oxidizer (a solid's case
       * is all "oxidizer"). */
      if (sh->solid)
        {
          scale_capsule (cr, g->cx, y0, d - 2.0 * inset, sh->oxidizer_tank_length_m * s, dome);
          fill_stroke (cr, st->oxidizer, st);
        }
      else
        {
          double fuel = sh->fuel_tank_length_m * s;
          scale_capsule (cr, g->cx, y0, d - 2.0 * inset, fuel, dome);
          fill_stroke (cr, st->fuel, st);
          scale_capsule (cr, g->cx, y0 - fuel - sh->intertank_length_m * s, d - 2.0 * inset,
                         sh->oxidizer_tank_length_m * s, dome);
          fill_stroke (cr, st->oxidizer, st);
        }

      /* The interstage above: a frustum to the next stage's diameter. */
      if (i + 1 < g->n_stages && sg->interstage_length_m > 0.0)
        {
          double top_d = sg->interstage_top_diameter_m * s, y1 = b->y;
          double y2 = y1 - sg->interstage_length_m * s;
          cairo_new_path (cr);
          cairo_move_to (cr, g->cx - d / 2.0, y1);
          cairo_line_to (cr, g->cx - top_d / 2.0, y2);
          cairo_line_to (cr, g->cx + top_d / 2.0, y2);
          cairo_line_to (cr, g->cx + d / 2.0, y1);
          cairo_close_path (cr);
          fill_stroke (cr, st->skin, st);
        }
    }

  nosed_path (cr, &g->fairing, (v->fairing_length_m - v->fairing_cylinder_m) * s);
  fill_stroke (cr, st->fairing, st);

  /* The scale bar: a vertical ruler from the ground, alternate halves
   * filled. */
  source (cr, st->mark);
  cairo_set_line_width (cr, 1.0);
  cairo_new_path (cr);
  cairo_rectangle (cr, g->bar.x + 0.5, g->bar.y + 0.5, g->bar.width - 1.0, g->bar.height - 1.0);
  cairo_stroke (cr);
  cairo_rectangle (cr, g->bar.x, g->bar.y + g->bar.height / 2.0, g->bar.width,
                   g->bar.height / 2.0);
  cairo_fill (cr);

  /* The person: head and body, no more. */
  {
    const SwStackBox *p = &g->person;
    double head = p->height * 0.13, cx = p->x + p->width / 2.0;
    cairo_new_path (cr);
    cairo_arc (cr, cx, p->y + head / 2.0, head / 2.0, 0.0, 2.0 * G_PI);
    cairo_fill (cr);
    cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
    cairo_set_line_width (cr, MAX (1.0, p->width * 0.35));
    cairo_move_to (cr, cx, p->y + head * 1.25);
    cairo_line_to (cr, cx, p->y + p->height * 0.55);
    cairo_stroke (cr);
    cairo_set_line_width (cr, MAX (1.0, p->width * 0.25));
    cairo_move_to (cr, cx - p->width * 0.25, p->y + p->height);
    cairo_line_to (cr, cx, p->y + p->height * 0.55);
    cairo_line_to (cr, cx + p->width * 0.25, p->y + p->height);
    cairo_stroke (cr);
  }

  /* The ground. */
  source (cr, st->outline[3] > 0.0 ? st->outline : st->mark);
  cairo_set_line_width (cr, 1.0);
  cairo_move_to (cr, g->bar.x, g->bottom + 0.5);
  cairo_line_to (cr, g->person.x + g->person.width + 4.0, g->bottom + 0.5);
  cairo_stroke (cr);
  cairo_restore (cr);
}

/* ---- the sheet's panel ---------------------------------------------------- */

#define HEX(c, a) { (((c) >> 16) & 0xff) / 255.0, (((c) >> 8) & 0xff) / 255.0, \
                    ((c) & 0xff) / 255.0, (a) }

/* The sheet's colours (its palette in sw-sheet.c). */
static const double ink[4] = HEX (0x1b2530, 1.0);
static const double muted[4] = HEX (0x5a6672, 1.0);
static const double rule_color[4] = HEX (0xc5cdd5, 1.0);
static const double baseline_color[4] = HEX (0x8a96a3, 1.0);
static const double panel_color[4] = HEX (0xf4f6f8, 1.0);

static const SwStackStyle paper_style = {
  HEX (0xb9d0e3, 1.0), HEX (0x5d7f99, 1.0), HEX (0xd79b2b, 1.0), HEX (0x1b2530, 1.0), 0.7,
};
static const SwStackStyle paper_baseline_style = {
  HEX (0x8a96a3, 1.0), HEX (0x8a96a3, 1.0), HEX (0x8a96a3, 1.0), HEX (0x8a96a3, 1.0), 0.9,
};

static PangoLayout *
panel_text (cairo_t *cr, const char *text, double size, gboolean bold, double width,
            PangoAlignment align)
{
  PangoLayout *layout = pango_cairo_create_layout (cr);
  PangoFontDescription *fd = pango_font_description_from_string ("DejaVu Sans, Sans");
  cairo_font_options_t *fo = cairo_font_options_create ();

  /* The same metrics on every surface, as in the rest of the sheet. */
  cairo_font_options_set_hint_metrics (fo, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (fo, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (pango_layout_get_context (layout), fo);
  pango_layout_context_changed (layout);
  cairo_font_options_destroy (fo);
  pango_font_description_set_absolute_size (fd, size * PANGO_SCALE);
  pango_font_description_set_weight (fd, bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_font_description_free (fd);
  if (width > 0.0)
    {
      pango_layout_set_alignment (layout, align);
      /* One line, whole and a little smaller if need be; only a label
       * too long even then loses whole words, never half of one. */
      sw_text_fit_shrink (layout, text, (int) (width * PANGO_SCALE), 1,
                          MIN (size, MAX (6.0, size * 0.8)));
    }
  else
    pango_layout_set_text (layout, text, -1);
  return layout;
}

/* Draws @text with its vertical centre at @cy (or its top at @cy when
 * !@centred). */
static void
panel_show (cairo_t *cr, const char *text, double x, double cy, gboolean centred, double size,
            gboolean bold, const double color[4], double width, PangoAlignment align)
{
  PangoLayout *layout = panel_text (cr, text, size, bold, width, align);
  int h;

  pango_layout_get_size (layout, NULL, &h);
  source (cr, color);
  /* Through the sheet's text path: an SVG keeps it as text. */
  sw_sheet_show_layout (cr, layout, x, centred ? cy - (double) h / PANGO_SCALE / 2.0 : cy);
  g_object_unref (layout);
}

void
sw_stack_draw_panel (cairo_t *cr, const SwDesign *design, const SwSizing *sizing,
                     const SwSizing *baseline, double x, double y, double w, double h)
{
  SwStackMasses cur, base;
  const SwStackMasses *both[2] = { &cur, &base };
  SwStackGeometry g, bg;
  SwStackScale scale;
  gboolean has_base;
  double label_w = MIN (120.0, w * 0.55), stack_w = w - label_w, bottom = y + h - 14.0;
  double cx, label_y[SW_STACK_MAX_PARTS];

  g_return_if_fail (cr != NULL && design != NULL);

  if (!sw_stack_masses_from_sizing (sizing, &cur))
    {
      source (cr, panel_color);
      cairo_rectangle (cr, x, y, w, h);
      cairo_fill (cr);
      panel_show (cr, _("No stack: the design is infeasible."), x + 8.0, y + h / 2.0, TRUE,
                  7.5, FALSE, muted, w - 16.0, PANGO_ALIGN_LEFT);
      return;
    }
  has_base = sw_stack_masses_from_sizing (baseline, &base);

  /* The first stage stands about three times as tall as it is wide. */
  if (!sw_stack_fit (both, has_base ? 2 : 1, has_base ? stack_w * 0.9 : stack_w * 0.6,
                     bottom - y - 16.0, 0.0, 0.0, stack_w * 0.1, 3.2, 3.2, &scale))
    return;

  cx = x + (has_base ? stack_w * 0.70 : stack_w * 0.5);
  sw_stack_place (&cur, &scale, cx, bottom, 0.0, 0.0, &g);
  sw_stack_draw (cr, &g, &paper_style, FALSE);
  if (has_base)
    {
      double bcx = x + stack_w * 0.26;
      sw_stack_place (&base, &scale, bcx, bottom, 0.0, 0.0, &bg);
      sw_stack_draw (cr, &bg, &paper_baseline_style, TRUE);
      panel_show (cr, _("baseline"), bcx - stack_w * 0.225, bottom + 3.0, FALSE, 6.5, FALSE,
                  baseline_color, stack_w * 0.45, PANGO_ALIGN_CENTER);
    }
  panel_show (cr, has_base ? _("current") : _("area \342\210\235 mass"), cx - stack_w * 0.3,
              bottom + 3.0, FALSE, 6.5, FALSE, muted, stack_w * 0.6, PANGO_ALIGN_CENTER);
  source (cr, rule_color);
  cairo_set_line_width (cr, 0.6);
  cairo_move_to (cr, x + 4, bottom);
  cairo_line_to (cr, x + stack_w - 4, bottom);
  cairo_stroke (cr);

  /* Labels to the right, one per stage of the design (unused ones too),
   * pushed apart so they never overlap, with leaders. */
  {
    double ly[SW_STACK_MAX_PARTS], min_gap = 20.0, lx = x + stack_w + 6.0, prev = INFINITY;
    guint n = cur.n_stages, k = 0;

    for (guint i = 0; i <= n; i++)
      {
        label_y[i] = NAN;
        if (i == n || stage_used (&cur, i))
          {
            /* The payload's label sits level with the cone's base region. */
            label_y[i] = i == n ? g.box[k].y + g.box[k].height * 0.6
                                : g.box[k].y + g.box[k].height / 2.0;
            k++;
          }
        ly[i] = MIN (isfinite (label_y[i]) ? label_y[i] : prev - min_gap, prev - min_gap);
        prev = ly[i];
      }
    /* A column that runs off the top moves down as a whole. */
    if (ly[n] - 8.0 < y)
      {
        double shift = y - (ly[n] - 8.0);
        for (guint i = 0; i <= n; i++)
          ly[i] += shift;
      }
    for (guint i = 0; i <= n; i++)
      {
        g_autofree char *mass = NULL, *title = NULL;

        if (i < n && !isfinite (label_y[i]))
          {
            title = g_strdup_printf ("%u %s", i + 1, design->stages[i].name);
            mass = g_strdup (_("unused: no propellant"));
          }
        else if (i < n)
          {
            title = g_strdup_printf ("%u %s", i + 1, design->stages[i].name);
            g_autofree char *m = sw_format_mass (cur.stage_kg[i]);
            mass = sw_stack_glue_units (m);
          }
        else
          {
            title = g_strdup (_("Payload"));
            g_autofree char *m = sw_format_mass (cur.payload_kg);
            mass = sw_stack_glue_units (m);
          }
        if (isfinite (label_y[i]))
          {
            source (cr, rule_color);
            cairo_set_line_width (cr, 0.5);
            cairo_move_to (cr, cx + g.width / 2.0 + 2.0, label_y[i]);
            cairo_line_to (cr, lx - 3.0, ly[i]);
            cairo_stroke (cr);
          }
        panel_show (cr, title, lx, ly[i] - 4.0, TRUE, 7.5, TRUE, ink, label_w - 8.0,
                    PANGO_ALIGN_LEFT);
        panel_show (cr, mass, lx, ly[i] + 4.5, TRUE, 7.0, FALSE, muted, label_w - 8.0,
                    PANGO_ALIGN_LEFT);
      }
  }
}

static gboolean
is_word_char (gunichar c)
{
  return g_unichar_isalpha (c) || c == ')' || c == '%';
}

static gboolean
starts_number (const char *p)
{
  gunichar c = g_utf8_get_char (p);

  if (g_unichar_isdigit (c))
    return TRUE;
  /* A sign before a digit, or the em dash that stands for no value. */
  if (c == '-' || c == '+' || c == 0x2212 /* − */)
    return g_unichar_isdigit (g_utf8_get_char (g_utf8_next_char (p)));
  return c == 0x2014;
}

char *
sw_stack_glue_units (const char *text)
{
  GString *out;
  gunichar prev = 0;

  g_return_val_if_fail (text != NULL, NULL);

  out = g_string_sized_new (strlen (text) + 16);
  for (const char *p = text; *p != '\0'; p = g_utf8_next_char (p))
    {
      gunichar c = g_utf8_get_char (p);
      const char *next = g_utf8_next_char (p);
      gunichar n = g_utf8_get_char (next);

      if (c == ' '
          && ((g_unichar_isdigit (prev) && (g_unichar_isalpha (n) || g_unichar_isdigit (n)
                                            || n == '%' || n == 0x00B0 /* ° */))
              || (is_word_char (prev) && starts_number (next))))
        g_string_append_unichar (out, 0x00A0);   /* no-break space */
      else
        {
          g_string_append_unichar (out, c);
          if (c == '/' && g_unichar_isalpha (prev) && g_unichar_isalpha (n))
            g_string_append_unichar (out, 0x2060);   /* word joiner */
        }
      prev = c;
    }
  return g_string_free (out, FALSE);
}

static const SwScaleStyle paper_scale_style = {
  HEX (0xdfe5eb, 1.0), HEX (0xb9d0e3, 1.0), HEX (0xe8d9a8, 1.0), HEX (0xf1c27a, 1.0),
  HEX (0x1b2530, 1.0), HEX (0x5a6672, 1.0), 0.4,
};

void
sw_scale_draw_panel (cairo_t *cr, const SwAnalysis *a, double x, double y, double w, double h)
{
  SwScaleGeometry g;
  const SwVehicleShape *v;
  double caption_h = 20.0, bottom;

  g_return_if_fail (cr != NULL && a != NULL);

  v = &a->shape;
  bottom = y + h - caption_h;
  if (!a->ok || !v->complete
      || !sw_scale_layout (v, x, y + 12.0, w, bottom - y - 12.0, SW_SCALE_BAR_ROOM,
                           SW_SCALE_PERSON_ROOM, &g))
    {
      source (cr, panel_color);
      cairo_rectangle (cr, x, y, w, h);
      cairo_fill (cr);
      {
        g_autofree char *text = g_strdup_printf (_("Not drawn to scale. %s"),
                                                 a->ok && v->reason[0] != '\0' ? v->reason
                                                 : _("The vehicle has no shape."));
        PangoLayout *layout = panel_text (cr, text, 6.5, FALSE, 0.0, PANGO_ALIGN_LEFT);
        pango_layout_set_width (layout, (int) ((w - 8.0) * PANGO_SCALE));
        pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
        pango_layout_set_height (layout, (int) ((h - 8.0) * PANGO_SCALE));
        pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_END);
        source (cr, muted);
        sw_sheet_show_layout (cr, layout, x + 4.0, y + 4.0);
        g_object_unref (layout);
      }
      return;
    }
  sw_scale_draw (cr, v, &g, &paper_scale_style);
  {
    g_autofree char *bar = sw_format_length_m (g.bar_m);
    g_autofree char *tall = sw_format_length_m (v->height_m);
    g_autofree char *tall_text = g_strdup_printf (_("%s tall"), tall);
    g_autofree char *person = sw_scale_person_label ();
    g_autofree char *bar_g = sw_stack_glue_units (bar);
    g_autofree char *tall_g = sw_stack_glue_units (tall_text);
    g_autofree char *person_g = sw_stack_glue_units (person);

    panel_show (cr, bar_g, g.bar.x - 2.0, g.bar.y - 9.0, FALSE, 6.0, FALSE, muted, 0.0,
                PANGO_ALIGN_LEFT);
    panel_show (cr, person_g, g.person.x - 4.0, g.person.y - 9.0, FALSE, 6.0, FALSE, muted, 0.0,
                PANGO_ALIGN_LEFT);
    panel_show (cr, _("to scale"), x, g.bottom + 3.0, FALSE, 6.5, FALSE, muted, w,
                PANGO_ALIGN_CENTER);
    panel_show (cr, tall_g, x, g.bottom + 11.0, FALSE, 6.5, FALSE, muted, w, PANGO_ALIGN_CENTER);
  }
}
