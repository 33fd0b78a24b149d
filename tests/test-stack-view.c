/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI tests of the stack view: rendered offscreen (cairo renderer, Xvfb),
 * the drawn block areas must be proportional to the stage masses the core
 * computed, and the propellant and structure shares inside each block must
 * match the masses.  The proportionality is what the issue asks of the
 * drawing (area proportional to mass), so the check values are the core's
 * masses; the pixel measurement is independent of the widget's layout code. */
#include "config.h"

#include "sw-plot.h"
#include "sw-stack-drawing.h"
#include "sw-stack-view.h"
#include "widget-render.h"

#include <math.h>

#define WIDTH 600
#define HEIGHT 700

/* Measured coverage of one block: total area and the part of it in the
 * structure colour, in pixels, with antialiased edges counted fractionally. */
typedef struct {
  double total;
  double structure;
} Coverage;

static void
sub3 (const double a[4], const double b[4], double out[3])
{
  for (int i = 0; i < 3; i++)
    out[i] = a[i] - b[i];
}

static double
dot3 (const double a[3], const double b[3])
{
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/* Each pixel is bg + alpha (P - bg) + beta (S - bg) with alpha, beta >= 0
 * (P propellant, S structure): a least-squares split per pixel. */
static Coverage
measure (cairo_surface_t *surface, const graphene_rect_t *rc, const double bg[4],
         const double prop[4], const double *structure)
{
  Coverage cov = { 0.0, 0.0 };
  double p[3], s[3] = { 0, 0, 0 };
  int x0 = (int) floor (rc->origin.x) - 2, x1 = (int) ceil (rc->origin.x + rc->size.width) + 2;
  int y0 = (int) floor (rc->origin.y) - 2, y1 = (int) ceil (rc->origin.y + rc->size.height) + 2;

  sub3 (prop, bg, p);
  if (structure != NULL)
    sub3 (structure, bg, s);
  for (int y = y0; y < y1; y++)
    for (int x = x0; x < x1; x++)
      {
        double px[4], d[3], a = 0.0, b = 0.0;
        widget_render_pixel (surface, x, y, px);
        sub3 (px, bg, d);
        if (structure != NULL)
          {
            double pp = dot3 (p, p), ss = dot3 (s, s), ps = dot3 (p, s);
            double dp = dot3 (d, p), ds = dot3 (d, s);
            double det = pp * ss - ps * ps;
            a = (dp * ss - ds * ps) / det;
            b = (ds * pp - dp * ps) / det;
            if (a < 0.0)
              {
                a = 0.0;
                b = ds / ss;
              }
            if (b < 0.0)
              {
                b = 0.0;
                a = dp / pp;
              }
          }
        else
          a = dot3 (d, p) / dot3 (p, p);
        cov.total += CLAMP (a, 0.0, 1.0) + CLAMP (b, 0.0, 1.0);
        cov.structure += CLAMP (b, 0.0, 1.0);
      }
  return cov;
}

static GtkWidget *
show_result (SwAnalysis *result, GtkWidget **view_out)
{
  GtkWidget *view = sw_stack_view_new ();

  sw_stack_view_set_result (SW_STACK_VIEW (view), result);
  *view_out = view;
  return widget_render_show (view, WIDTH, HEIGHT);
}

static void
check_design_areas (const char *basename)
{
  g_autoptr (SwAnalysis) result = widget_render_demo_result (basename);
  const SwSizing *sz = &result->sizing;
  GtkWidget *view, *window;
  cairo_surface_t *surface;
  double bg[4], ref_k = NAN, worst_area = 0.0, worst_share = 0.0;

  g_assert_true (result->ok);
  g_assert_true (sz->feasible);
  window = show_result (result, &view);
  surface = widget_render_window (window);
  g_assert_cmpint (cairo_image_surface_get_width (surface), ==, WIDTH);
  widget_render_pixel (surface, 1, 1, bg);

  /* Strap-on boosters come after the stages: -1 the payload, then the
   * stages, then booster j as n_stages + j. */
  for (int i = -1; i < (int) (sz->n_stages + (sz->boosters.present ? sz->boosters.count : 0));
       i++)
    {
      graphene_rect_t rc, st = GRAPHENE_RECT_INIT (0, 0, 0, 0);
      double mass, prop[4], strc[4], k;
      gboolean has_band = FALSE;
      Coverage cov;

      if (i >= (int) sz->n_stages)
        {
          g_assert_true (sw_stack_view_get_booster_rect (SW_STACK_VIEW (view),
                                                         (guint) i - sz->n_stages, &rc, &st));
          mass = sz->boosters.booster_mass_kg;
          has_band = st.size.height >= 4.0;
        }
      else if (i < 0)
        {
          g_assert_true (sw_stack_view_get_payload_rect (SW_STACK_VIEW (view), &rc));
          mass = result->design->payload_kg;
        }
      else
        {
          if (sz->stages[i].unused)
            continue;
          g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), i, &rc));
          mass = sz->stages[i].stage_mass_kg;
          g_assert_true (sw_stack_view_get_structure_rect (SW_STACK_VIEW (view), i, &st));
          has_band = st.size.height >= 4.0;
        }
      g_assert_cmpfloat (rc.size.width, >, 2.0);
      g_assert_cmpfloat (rc.size.height, >, 2.0);
      g_assert_cmpfloat (rc.origin.x, >=, 0.0);
      g_assert_cmpfloat (rc.origin.y, >=, 0.0);
      g_assert_cmpfloat (rc.origin.x + rc.size.width, <=, WIDTH);
      g_assert_cmpfloat (rc.origin.y + rc.size.height, <=, HEIGHT);

      /* Pure colours from the middle of the propellant part and the band. */
      widget_render_pixel (surface, (int) (rc.origin.x + rc.size.width / 2.0),
                           (int) (rc.origin.y + (rc.size.height - (i >= 0 ? st.size.height : 0))
                                  / 2.0), prop);
      if (has_band)
        widget_render_pixel (surface, (int) (st.origin.x + st.size.width / 2.0),
                             (int) (st.origin.y + st.size.height / 2.0), strc);
      cov = measure (surface, &rc, bg, prop, has_band ? strc : NULL);

      k = cov.total / mass;
      if (isnan (ref_k))
        ref_k = k;
      worst_area = MAX (worst_area, fabs (k / ref_k - 1.0));
      g_test_message ("%s block %d: %.0f px for %.1f kg, %.4f px/kg (%.2f %% off)",
                      basename, i, cov.total, mass, k, 100.0 * (k / ref_k - 1.0));
      /* Area proportional to mass within 3 % (the tolerance). */
      g_assert_cmpfloat (fabs (k / ref_k - 1.0), <, 0.03);

      if (has_band)
        {
          gboolean booster = i >= (int) sz->n_stages;
          const SwStageResult *s = &sz->stages[booster ? 0 : i];
          double want_prop = booster ? sz->boosters.propellant_mass_kg / mass
                                     : s->propellant_mass_kg / s->stage_mass_kg;
          double got_prop = 1.0 - cov.structure / cov.total;
          double want_struct = booster ? sz->boosters.structural_mass_kg / mass
                                       : s->structural_mass_kg / s->stage_mass_kg;
          double got_struct = cov.structure / cov.total;
          g_test_message ("  propellant share %.4f (mass %.4f), structure %.4f (mass %.4f)",
                          got_prop, want_prop, got_struct, want_struct);
          /* Both shares within 3 % of their own value. */
          g_assert_cmpfloat (fabs (got_prop / want_prop - 1.0), <, 0.03);
          g_assert_cmpfloat (fabs (got_struct / want_struct - 1.0), <, 0.03);
          worst_share = MAX (worst_share, fabs (got_struct / want_struct - 1.0));
        }
    }
  g_test_message ("%s: worst area error %.2f %%, worst structure share error %.2f %%",
                  basename, 100.0 * worst_area, 100.0 * worst_share);
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
test_areas_small (void)
{
  check_design_areas ("small-sat-launcher.stagewright");
}

static void
test_areas_medium (void)
{
  check_design_areas ("medium-cargo.stagewright");
}

/* Boosters beside the core: each a block of its own mass, same area scale. */
static void
test_areas_boosters (void)
{
  check_design_areas ("four-booster-cargo.stagewright");
}

static void
test_areas_solid (void)
{
  check_design_areas ("all-solid-concept.stagewright");
}

/* Pixels within @rc close to @color (distance in RGB below @tol). */
static double
fraction_near (cairo_surface_t *surface, const graphene_rect_t *rc, const GdkRGBA *color,
               double tol)
{
  int n = 0, hit = 0;

  for (int y = (int) ceil (rc->origin.y); y < (int) (rc->origin.y + rc->size.height); y++)
    for (int x = (int) ceil (rc->origin.x); x < (int) (rc->origin.x + rc->size.width); x++)
      {
        double px[4];
        widget_render_pixel (surface, x, y, px);
        n++;
        if (fabs (px[0] - color->red) + fabs (px[1] - color->green)
            + fabs (px[2] - color->blue) < tol)
          hit++;
      }
  return n > 0 ? (double) hit / n : 0.0;
}

static double
fraction_not_bg (cairo_surface_t *surface, const graphene_rect_t *rc, const double bg[4])
{
  int n = 0, hit = 0;

  for (int y = (int) ceil (rc->origin.y); y < (int) (rc->origin.y + rc->size.height); y++)
    for (int x = (int) ceil (rc->origin.x); x < (int) (rc->origin.x + rc->size.width); x++)
      {
        double px[4];
        widget_render_pixel (surface, x, y, px);
        n++;
        if (fabs (px[0] - bg[0]) + fabs (px[1] - bg[1]) + fabs (px[2] - bg[2]) > 0.02)
          hit++;
      }
  return n > 0 ? (double) hit / n : 0.0;
}

static void
test_infeasible (void)
{
  g_autoptr (SwAnalysis) base = widget_render_demo_result ("all-solid-concept.stagewright");
  g_autoptr (SwDesign) design = sw_design_copy (base->design);
  g_autoptr (SwAnalysis) result = NULL;
  GtkWidget *view, *window;
  cairo_surface_t *surface;
  GdkRGBA warning;
  double bg[4];
  int failing;

  /* Four solid stages asked for 25 km/s with the manual split: stages 2 to 4
   * must give more than c ln(1/eps) (the first one, 6.0 of 6.2 km/s, can). */
  design->mission.delta_v_m_s = 25000.0;
  result = sw_analysis_compute (design, 2, NULL);
  g_assert_true (result->ok);
  g_assert_false (result->sizing.feasible);
  g_assert_cmpstr (result->sizing.reason, !=, "");
  failing = result->sizing.infeasible_stage;
  g_assert_cmpint (failing, >=, 0);

  window = show_result (result, &view);
  surface = widget_render_window (window);
  widget_render_pixel (surface, 1, 1, bg);
  sw_plot_palette_color (view, 1, &warning);

  g_assert_cmpfloat (sw_stack_view_get_area_scale (SW_STACK_VIEW (view)), ==, 0.0);
  for (guint i = 0; i < result->sizing.n_stages; i++)
    {
      graphene_rect_t rc;
      g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), i, &rc));
      g_assert_cmpfloat (rc.size.width, >, 20.0);
      g_assert_cmpfloat (rc.size.height, >, 20.0);
      /* Every nominal block is drawn (a tint and an outline at least). */
      g_assert_cmpfloat (fraction_not_bg (surface, &rc, bg), >, 0.9);
      if (!result->sizing.stages[i].feasible)
        /* The stripes in the warning colour cover a good part of the block. */
        g_assert_cmpfloat (fraction_near (surface, &rc, &warning, 0.25), >, 0.15);
      else
        g_assert_cmpfloat (fraction_near (surface, &rc, &warning, 0.25), <, 0.02);
    }
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
test_error (void)
{
  g_autoptr (SwAnalysis) base = widget_render_demo_result ("medium-cargo.stagewright");
  g_autoptr (SwDesign) design = sw_design_copy (base->design);
  g_autoptr (SwAnalysis) result = NULL;
  GtkWidget *view, *window;
  cairo_surface_t *surface;
  graphene_rect_t centre = GRAPHENE_RECT_INIT (0, HEIGHT / 2.0 - 60.0, WIDTH, 120.0);
  double bg[4];

  design->stages[0].isp_vac_s = -5.0;   /* out of range: the design cannot be solved */
  result = sw_analysis_compute (design, 3, NULL);
  g_assert_false (result->ok);
  g_assert_nonnull (result->error_message);

  window = show_result (result, &view);
  surface = widget_render_window (window);
  widget_render_pixel (surface, 1, 1, bg);
  g_assert_false (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, NULL));
  /* The message is drawn in the middle: some text pixels there, not many. */
  g_assert_cmpfloat (fraction_not_bg (surface, &centre, bg), >, 0.005);
  g_assert_cmpfloat (fraction_not_bg (surface, &centre, bg), <, 0.5);
  cairo_surface_destroy (surface);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
test_unused (void)
{
  g_autoptr (SwAnalysis) base = widget_render_demo_result ("small-sat-launcher.stagewright");
  g_autoptr (SwDesign) design = sw_design_copy (base->design);
  g_autoptr (SwAnalysis) result = NULL;
  GtkWidget *view, *window;
  graphene_rect_t rc, below;
  int unused = -1;

  /* A poor third stage (low Isp, heavy structure) on top of two good ones:
   * the optimal split gives it nothing. */
  design->stages[2].isp_vac_s = 60.0;
  design->stages[2].structural_coefficient = 0.5;
  result = sw_analysis_compute (design, 4, NULL);
  g_assert_true (result->ok);
  g_assert_true (result->sizing.feasible);
  g_assert_cmpuint (result->sizing.n_unused, >=, 1);
  for (guint i = 0; i < result->sizing.n_stages; i++)
    if (result->sizing.stages[i].unused)
      unused = (int) i;
  g_assert_cmpint (unused, >, 0);

  window = show_result (result, &view);
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), unused, &rc));
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), unused - 1, &below));
  /* A thin placeholder, not an area (it has no mass). */
  g_assert_cmpfloat (rc.size.height, <, 20.0);
  g_assert_false (sw_stack_view_get_structure_rect (SW_STACK_VIEW (view), unused, NULL));
  g_assert_cmpfloat (rc.origin.y + rc.size.height, <=, below.origin.y);
  gtk_window_destroy (GTK_WINDOW (window));
}

static void
notify_cb (GObject *object, GParamSpec *pspec, int *count)
{
  (*count)++;
}

static void
test_selection (void)
{
  g_autoptr (SwAnalysis) result = widget_render_demo_result ("medium-cargo.stagewright");
  GtkWidget *view = g_object_ref_sink (sw_stack_view_new ());
  int count = 0, selected = 0;

  g_signal_connect (view, "notify::selected-stage", G_CALLBACK (notify_cb), &count);
  sw_stack_view_set_result (SW_STACK_VIEW (view), result);
  sw_stack_view_set_selected (SW_STACK_VIEW (view), 1);
  sw_stack_view_set_selected (SW_STACK_VIEW (view), 1);
  g_assert_cmpint (count, ==, 1);
  g_object_get (view, "selected-stage", &selected, NULL);
  g_assert_cmpint (selected, ==, 1);
  /* A result with fewer stages drops a selection that no longer exists. */
  {
    g_autoptr (SwDesign) one = sw_design_copy (result->design);
    g_autoptr (SwAnalysis) r1 = NULL;
    one->n_stages = 1;
    r1 = sw_analysis_compute (one, 5, NULL);
    sw_stack_view_set_result (SW_STACK_VIEW (view), r1);
    g_assert_cmpint (sw_stack_view_get_selected (SW_STACK_VIEW (view)), ==, -1);
  }
  sw_stack_view_set_result (SW_STACK_VIEW (view), NULL);
  g_assert_null (sw_stack_view_get_result (SW_STACK_VIEW (view)));
  g_object_unref (view);
}

typedef struct {
  int    calls;
  int    lower;
  int    upper;
  double amount;
  gboolean finished;
  int    activated;
} Signals;

static void
share_dragged_cb (SwStackView *view, int lower, int upper, double amount, gboolean finished,
                  Signals *s)
{
  s->calls++;
  s->lower = lower;
  s->upper = upper;
  s->amount = amount;
  s->finished = finished;
}

static void
stage_activated_cb (SwStackView *view, int stage, Signals *s)
{
  s->activated = stage;
}

static GObject *
find_controller (GtkWidget *widget, GType type)
{
  GListModel *list = gtk_widget_observe_controllers (widget);
  GObject *found = NULL;

  for (guint i = 0; i < g_list_model_get_n_items (list) && found == NULL; i++)
    {
      GObject *c = g_list_model_get_item (list, i);
      if (G_TYPE_CHECK_INSTANCE_TYPE (c, type))
        found = c;
      g_object_unref (c);
    }
  g_object_unref (list);
  return found;
}

/* The input handlers, driven through their controllers' signals (a real
 * pointer cannot be scripted portably under Xvfb). */
static void
test_drag_and_click (void)
{
  g_autoptr (SwAnalysis) result = widget_render_demo_result ("small-sat-launcher.stagewright");
  GtkWidget *view, *window;
  GObject *drag, *click;
  graphene_rect_t r0, r1, r2;
  Signals s = { 0, -9, -9, NAN, FALSE, -9 };
  double border_y, cx, stack_h;

  window = show_result (result, &view);
  g_signal_connect (view, "share-dragged", G_CALLBACK (share_dragged_cb), &s);
  g_signal_connect (view, "stage-activated", G_CALLBACK (stage_activated_cb), &s);
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, &r0));
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 1, &r1));
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 2, &r2));
  border_y = (r0.origin.y + r1.origin.y + r1.size.height) / 2.0;
  cx = r0.origin.x + r0.size.width / 2.0;
  stack_h = r0.origin.y + r0.size.height - r2.origin.y;

  drag = find_controller (view, GTK_TYPE_GESTURE_DRAG);
  click = find_controller (view, GTK_TYPE_GESTURE_CLICK);
  g_assert_nonnull (drag);
  g_assert_nonnull (click);

  /* Up by 10 % of the stack: a tenth of the delta-v moves to the lower stage. */
  g_signal_emit_by_name (drag, "drag-begin", cx, border_y);
  g_signal_emit_by_name (drag, "drag-update", 0.0, -0.1 * stack_h);
  g_assert_cmpint (s.calls, ==, 1);
  g_assert_cmpint (s.lower, ==, 0);
  g_assert_cmpint (s.upper, ==, 1);
  /* The block rectangles are single-precision (graphene): 1e-6. */
  g_assert_cmpfloat_with_epsilon (s.amount, 0.1, 1e-6);
  g_assert_false (s.finished);
  g_signal_emit_by_name (drag, "drag-end", 0.0, 0.05 * stack_h);
  g_assert_cmpint (s.calls, ==, 2);
  g_assert_cmpfloat_with_epsilon (s.amount, -0.05, 1e-6);
  g_assert_true (s.finished);

  /* A drag that starts inside a block is not a share drag. */
  g_signal_emit_by_name (drag, "drag-begin", cx, r0.origin.y + r0.size.height / 2.0);
  g_signal_emit_by_name (drag, "drag-update", 0.0, -30.0);
  g_signal_emit_by_name (drag, "drag-end", 0.0, -30.0);
  g_assert_cmpint (s.calls, ==, 2);

  /* A press on the second block selects it. */
  g_signal_emit_by_name (click, "pressed", 1, cx, r1.origin.y + r1.size.height / 2.0);
  g_assert_cmpint (s.activated, ==, 1);
  g_assert_cmpint (sw_stack_view_get_selected (SW_STACK_VIEW (view)), ==, 1);
  /* ... and a press on the border between blocks does not. */
  s.activated = -9;
  g_signal_emit_by_name (click, "pressed", 1, cx, border_y);
  g_assert_cmpint (s.activated, ==, -9);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* Drawn coverage (alpha) inside @b, one pixel of margin for antialiasing. */
static double
alpha_in_box (cairo_surface_t *surface, const SwStackBox *b)
{
  int stride = cairo_image_surface_get_stride (surface);
  int width = cairo_image_surface_get_width (surface);
  int height = cairo_image_surface_get_height (surface);
  const guint8 *data;
  double sum = 0.0;

  cairo_surface_flush (surface);
  data = cairo_image_surface_get_data (surface);
  for (int y = MAX (0, (int) floor (b->y) - 1); y < MIN (height, (int) ceil (b->y + b->height) + 1);
       y++)
    for (int x = MAX (0, (int) floor (b->x) - 1); x < MIN (width, (int) ceil (b->x + b->width) + 1);
         x++)
      sum += ((const guint32 *) (data + y * stride))[x] >> 24;
  return sum / 255.0;
}

/* The routine the sheet and the stack view share, drawn GTK-free at two
 * sizes: every part's measured area over its mass is the same number
 * (area proportional to mass), at each size.  The stack is invented:
 * 120 t, 30 t and 6 t stages with a tenth structure, 1.5 t payload. */
static void
test_shared_drawing_two_sizes (void)
{
  static const double sizes[2][2] = { { 300.0, 500.0 }, { 900.0, 1300.0 } };
  SwStackMasses m = { 3, { 120000.0, 30000.0, 6000.0 }, { 12000.0, 3000.0, 600.0 }, 1500.0 };
  const SwStackMasses *one[1] = { &m };
  /* Opaque fills, no outline: the alpha channel is the drawn area. */
  SwStackStyle st = { { 0.2, 0.4, 0.8, 1.0 }, { 0.1, 0.1, 0.1, 1.0 }, { 0.9, 0.6, 0.1, 1.0 },
                      { 0.0, 0.0, 0.0, 0.0 }, 0.0 };
  double k_size[2];

  for (int z = 0; z < 2; z++)
    {
      cairo_surface_t *surface =
        cairo_image_surface_create (CAIRO_FORMAT_ARGB32, (int) sizes[z][0], (int) sizes[z][1]);
      cairo_t *cr = cairo_create (surface);
      SwStackScale scale;
      SwStackGeometry g;
      double ref = NAN;

      g_assert_true (sw_stack_fit (one, 1, sizes[z][0] - 20.0, sizes[z][1] - 20.0, 6.0, 0.0,
                                   0.0, 0.6, 3.2, &scale));
      sw_stack_place (&m, &scale, sizes[z][0] / 2.0, sizes[z][1] - 10.0, 6.0, 0.0, &g);
      g_assert_cmpuint (g.n, ==, 4);
      g_assert_cmpint (g.kind[3], ==, SW_STACK_PART_PAYLOAD);
      sw_stack_draw (cr, &g, &st, FALSE);
      cairo_destroy (cr);

      for (guint i = 0; i < g.n; i++)
        {
          double mass = i < 3 ? m.stage_kg[i] : m.payload_kg;
          double k = alpha_in_box (surface, &g.box[i]) / mass;

          /* Inside the surface, with margin. */
          g_assert_cmpfloat (g.box[i].x, >=, 9.0);
          g_assert_cmpfloat (g.box[i].y, >=, 9.0);
          g_assert_cmpfloat (g.box[i].x + g.box[i].width, <=, sizes[z][0] - 9.0);
          if (isnan (ref))
            ref = k;
          g_test_message ("%.0f x %.0f: part %u, %.0f px for %.0f kg (%.2f %% off)",
                          sizes[z][0], sizes[z][1], i, k * mass, mass, 100.0 * (k / ref - 1.0));
          /* 1 %: antialiased edges are counted fractionally; the payload
           * cone (about 900 px at the small size) is the least exact. */
          g_assert_cmpfloat (fabs (k / ref - 1.0), <, 0.01);
        }
      /* The first stage's width follows the cube-root rule against the
       * second: (120/30)^(1/3) = 1.5874. */
      g_assert_cmpfloat_with_epsilon (g.box[0].width / g.box[1].width, 1.587401, 1e-5);
      k_size[z] = ref;
      cairo_surface_destroy (surface);
    }
  /* The larger box draws the same stack larger. */
  g_assert_cmpfloat (k_size[1], >, 4.0 * k_size[0]);
}

/* The screen draws the sheet's shapes: the stack view's block widths go as
 * the cube root of the stage masses, like the sheet's. */
static void
test_screen_same_shapes (void)
{
  g_autoptr (SwAnalysis) result = widget_render_demo_result ("all-solid-concept.stagewright");
  GtkWidget *view, *window;
  graphene_rect_t r0, r1;

  window = show_result (result, &view);
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, &r0));
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 1, &r1));
  /* Width ratio = (m0/m1)^(1/3), heights (m0/m1)^(2/3), to float precision. */
  g_assert_cmpfloat_with_epsilon (r0.size.width / r1.size.width,
                                  cbrt (result->sizing.stages[0].stage_mass_kg
                                        / result->sizing.stages[1].stage_mass_kg), 1e-4);
  g_assert_cmpfloat_with_epsilon (r0.size.height / r1.size.height,
                                  pow (result->sizing.stages[0].stage_mass_kg
                                       / result->sizing.stages[1].stage_mass_kg, 2.0 / 3.0),
                                  1e-4);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* Labels keep a number with the word after it (its unit) and the word before
 * it: literal
 * expected text (U+00A0 no-break space, U+2060 word joiner after a slash
 * between letters); spaces elsewhere stay breakable. */
static void
test_glue_units (void)
{
  g_autofree char *a = sw_stack_glue_units ("<b>2 · Upper</b>\n29.9 t · Δv 2,007 m/s\nT/W 0.80 at ignition");
  g_autofree char *b = sw_stack_glue_units ("mass ratio 3.356 · Δv — · share 12.5 % · −0.4 km");
  g_autofree char *c = sw_stack_glue_units ("unused: no propellant");

  g_assert_cmpstr (a, ==, "<b>2 · Upper</b>\n29.9\u00a0t · Δv\u00a02,007\u00a0m/\u2060s\n"
                          "T/\u2060W\u00a00.80\u00a0at ignition");
  g_assert_cmpstr (b, ==, "mass ratio\u00a03.356 · Δv\u00a0— · share\u00a012.5\u00a0% · "
                          "−0.4\u00a0km");
  g_assert_cmpstr (c, ==, "unused: no propellant");
}

/* A label too wide for its column puts its figures on lines of their own,
 * so no line ends in a lone separator ("32.6 t ·"); the title keeps its
 * "2 · Upper". */
static void
test_break_at_separators (void)
{
  g_autofree char *a = sw_stack_break_at_separators ("<b>2 · Upper</b>\n29.9 t · Δv 2,007 m/s\n"
                                                     "mass ratio 3.356 · T/W 0.80 at ignition");
  g_autofree char *b = sw_stack_break_at_separators ("<b>1 · Core</b> · 32.6 t · Δv 3,494 m/s");
  g_autofree char *c = sw_stack_break_at_separators ("<b>Payload</b>\n8,000 kg");

  g_assert_cmpstr (a, ==, "<b>2 · Upper</b>\n29.9 t\nΔv 2,007 m/s\nmass ratio 3.356\n"
                          "T/W 0.80 at ignition");
  g_assert_cmpstr (b, ==, "<b>1 · Core</b>\n32.6 t\nΔv 3,494 m/s");
  g_assert_cmpstr (c, ==, "<b>Payload</b>\n8,000 kg");
}

/* A stage name of one long word (no space to wrap at) is broken inside the
 * word: running over, its label left the blocks no room, and the view drew
 * empty boxes and said the vehicle was infeasible. */
static void
test_long_word_name (void)
{
  g_autoptr (SwAnalysis) first = widget_render_demo_result ("medium-cargo.stagewright");
  g_autoptr (SwDesign) named = sw_design_copy (first->design);
  g_autoptr (SwAnalysis) result = NULL;
  graphene_rect_t block;
  GtkWidget *view = NULL, *window;

  g_strlcpy (named->stages[0].name, "CoreStageWithAVeryLongNameAndNoSpacesAnywhereAtAll",
             sizeof named->stages[0].name);
  result = sw_analysis_compute (named, 1, NULL);
  g_assert_true (result->ok && result->sizing.feasible);
  /* As wide as the stack's pane in a 1280 px window. */
  view = sw_stack_view_new ();
  sw_stack_view_set_result (SW_STACK_VIEW (view), result);
  window = widget_render_show (view, 290, 700);
  widget_render_settle ();
  g_assert_cmpfloat (sw_stack_view_get_area_scale (SW_STACK_VIEW (view)), >, 0.0);
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, &block));
  g_assert_cmpfloat (block.size.width, >, 40.0);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* The cairo drawings in @node's tree, in order, appended to @out (new
 * references). */
static void
collect_cairo_nodes (GskRenderNode *node, GPtrArray *out)
{
  if (node == NULL)
    return;
  switch (gsk_render_node_get_node_type (node))
    {
    case GSK_CAIRO_NODE:
      g_ptr_array_add (out, gsk_render_node_ref (node));
      break;
    case GSK_CONTAINER_NODE:
      for (guint i = 0; i < gsk_container_node_get_n_children (node); i++)
        collect_cairo_nodes (gsk_container_node_get_child (node, i), out);
      break;
    case GSK_TRANSFORM_NODE:
      collect_cairo_nodes (gsk_transform_node_get_child (node), out);
      break;
    case GSK_CLIP_NODE:
      collect_cairo_nodes (gsk_clip_node_get_child (node), out);
      break;
    case GSK_DEBUG_NODE:
      collect_cairo_nodes (gsk_debug_node_get_child (node), out);
      break;
    default:
      break;
    }
}

/* The view's current drawing as the renderer gets it: its cairo nodes. */
static GPtrArray *
view_drawing (GtkWidget *view)
{
  GdkPaintable *paintable = gtk_widget_paintable_new (view);
  GtkSnapshot *snapshot = gtk_snapshot_new ();
  GPtrArray *found = g_ptr_array_new_with_free_func ((GDestroyNotify) gsk_render_node_unref);
  GskRenderNode *node;

  widget_render_settle ();
  gdk_paintable_snapshot (paintable, snapshot, WIDTH, HEIGHT);
  node = gtk_snapshot_free_to_node (snapshot);
  collect_cairo_nodes (node, found);
  if (node != NULL)
    gsk_render_node_unref (node);
  g_object_unref (paintable);
  return found;
}

/* How many nodes of @a are not the very node at the same place in @b. */
static guint
n_changed (GPtrArray *a, GPtrArray *b)
{
  guint n = 0;

  for (guint i = 0; i < a->len; i++)
    n += i >= b->len || g_ptr_array_index (a, i) != g_ptr_array_index (b, i);
  return n + (b->len > a->len ? b->len - a->len : 0);
}

/* Another analysis with the same numbers (a later phase of the same edit)
 * leaves the drawing as it was, so the renderer rasterises nothing; other
 * numbers or another selection draw anew, but not the legend above the
 * stack: it stays the very same node (so the renderer does not repaint
 * it).  The rest is one node over the whole width from the legend down
 * to the bottom, so whatever changes in it the renderer repaints one
 * rectangle (GSK repaints the whole window once a frame's damage has more
 * than 30). */
static void
test_drawing_kept (void)
{
  g_autoptr (SwAnalysis) first_result = widget_render_demo_result ("medium-cargo.stagewright");
  g_autoptr (SwAnalysis) same_result = widget_render_demo_result ("medium-cargo.stagewright");
  g_autoptr (SwAnalysis) other_result = NULL;
  g_autoptr (SwDesign) heavier = sw_design_copy (first_result->design);
  g_autoptr (GPtrArray) first = NULL, same = NULL, other = NULL, selected = NULL;
  GtkWidget *view = NULL;
  GtkWidget *window;

  heavier->payload_kg *= 1.5;
  other_result = sw_analysis_compute (heavier, 1, NULL);
  window = show_result (first_result, &view);
  first = view_drawing (view);
  /* The legend, then the column, the labels and the scale in one node. */
  g_assert_cmpuint (first->len, ==, 2);
  {
    graphene_rect_t legend, body;
    gsk_render_node_get_bounds (g_ptr_array_index (first, 0), &legend);
    gsk_render_node_get_bounds (g_ptr_array_index (first, 1), &body);
    g_assert_cmpfloat (body.origin.x, ==, 0.0);
    g_assert_cmpfloat (body.size.width, ==, gtk_widget_get_width (view));
    g_assert_cmpfloat (body.origin.y + body.size.height, ==, gtk_widget_get_height (view));
    /* From the highest label down: it may reach into the legend's margin. */
    g_assert_cmpfloat (body.origin.y, >, legend.origin.y + legend.size.height / 2.0);
  }

  g_assert_true (same_result != first_result);
  sw_stack_view_set_result (SW_STACK_VIEW (view), same_result);
  same = view_drawing (view);
  g_assert_cmpuint (n_changed (first, same), ==, 0);

  sw_stack_view_set_result (SW_STACK_VIEW (view), other_result);
  other = view_drawing (view);
  g_assert_cmpuint (other->len, ==, first->len);
  g_assert_cmpuint (n_changed (first, other), ==, 1);
  g_assert_true (g_ptr_array_index (other, 0) == g_ptr_array_index (first, 0));

  sw_stack_view_set_selected (SW_STACK_VIEW (view), 0);
  selected = view_drawing (view);
  g_assert_cmpuint (n_changed (other, selected), ==, 1);
  g_assert_true (g_ptr_array_index (selected, 0) == g_ptr_array_index (other, 0));

  gtk_window_destroy (GTK_WINDOW (window));
}

static void
count_paint_cb (GdkFrameClock *clock, guint *n)
{
  (*n)++;
}

/* A new result is drawn as soon as it is set, before any frame paints (an
 * idle of higher priority than the frame clock's), and the frame shows that
 * very drawing: it copies pixels, it draws nothing. */
static void
test_drawn_ahead (void)
{
  g_autoptr (SwAnalysis) first_result = widget_render_demo_result ("medium-cargo.stagewright");
  g_autoptr (SwAnalysis) other_result = NULL;
  g_autoptr (SwDesign) heavier = sw_design_copy (first_result->design);
  g_autoptr (GPtrArray) shown = NULL;
  GtkWidget *view = NULL;
  GtkWidget *window;
  GskRenderNode *before, *ahead;
  GdkFrameClock *clock;
  guint paints = 0, tries = 0;
  gulong id;

  heavier->payload_kg *= 1.5;
  other_result = sw_analysis_compute (heavier, 1, NULL);
  window = show_result (first_result, &view);
  widget_render_settle ();
  before = sw_stack_view_peek_drawing (SW_STACK_VIEW (view));
  g_assert_nonnull (before);

  clock = gtk_widget_get_frame_clock (view);
  id = g_signal_connect (clock, "paint", G_CALLBACK (count_paint_cb), &paints);
  sw_stack_view_set_result (SW_STACK_VIEW (view), other_result);
  while (sw_stack_view_peek_drawing (SW_STACK_VIEW (view)) == before && tries++ < 1000)
    g_main_context_iteration (NULL, FALSE);
  ahead = sw_stack_view_peek_drawing (SW_STACK_VIEW (view));
  g_assert_true (ahead != before);
  g_assert_cmpuint (paints, ==, 0);
  g_signal_handler_disconnect (clock, id);

  shown = view_drawing (view);
  g_assert_true (sw_stack_view_peek_drawing (SW_STACK_VIEW (view)) == ahead);
  g_assert_cmpuint (shown->len, ==, 2);   /* the legend, the rest */
  gtk_window_destroy (GTK_WINDOW (window));
}

/* ---- the vehicle to scale ------------------------------------------------ */

/* One stage of 100 t of LOX/RP-1 at 3.7 m (the reference notes' tank example,
 * shared reference values "Bulk density and tanks": tanks 6.91 m and 4.19 m
 * long), so the stage is 6.91 + 4.19 + 0.25 D + 0.6 D = 14.25 m long. */
static const char *scale_design =
  "{ \"format\": \"stagewright-design\", \"version\": 2, \"name\": \"S\", \"payload_kg\": 1000,"
  "  \"mission\": { \"delta_v_m_s\": 1000 }, \"split\": \"optimal\","
  "  \"stages\": [ { \"name\": \"A\", \"isp_vac_s\": 300, \"structural_coefficient\": 0.06,"
  "                  \"propellant_kg\": 100000, \"propellant\": \"lox-kerosene\","
  "                  \"mixture_ratio\": 2.56, \"diameter_m\": 3.7 } ] }";

static gboolean
near_color (const double a[4], const double b[4], double tol)
{
  return fabs (a[0] - b[0]) < tol && fabs (a[1] - b[1]) < tol && fabs (a[2] - b[2]) < tol;
}

/* Counts the pixels that differ from @bg (and from @stop when given) from
 * (@x, @y) on in steps (@dx, @dy), until the first that does not. */
static int
run_length (cairo_surface_t *surface, int x, int y, int dx, int dy, const double bg[4],
            const double *stop)
{
  int n = 0, w = cairo_image_surface_get_width (surface);
  int h = cairo_image_surface_get_height (surface);

  for (; x >= 0 && y >= 0 && x < w && y < h; x += dx, y += dy, n++)
    {
      double px[4];
      widget_render_pixel (surface, x, y, px);
      if (near_color (px, bg, 0.02) || (stop != NULL && near_color (px, stop, 0.03)))
        break;
    }
  return n;
}

/* The stage's drawn length and diameter in pixels against the scale bar's
 * drawn length: both measured on the rendered picture, so the check does not
 * rest on the view's layout code.  Within 2 px and 1 %. */
static void
test_to_scale_pixels (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (scale_design, -1, "s.stagewright", NULL, &error);
  g_autoptr (SwAnalysis) result = NULL;
  GtkWidget *view, *window;
  cairo_surface_t *surface;
  graphene_rect_t rc, bar;
  double bg[4], fairing[4], bar_m, px_per_m, len_m, want;
  int bar_px, len_px, dia_px, x, ground;

  g_assert_no_error (error);
  result = sw_analysis_compute (d, 1, NULL);
  g_assert_true (result->ok && result->shape.complete);
  len_m = result->shape.stages[0].shape.length_m;
  g_assert_cmpfloat (fabs (len_m - (6.91 + 4.19 + 0.85 * 3.7)), <, 0.012);  /* reference notes */

  view = sw_stack_view_new ();
  sw_stack_view_set_result (SW_STACK_VIEW (view), result);
  window = widget_render_show (view, WIDTH, HEIGHT);
  sw_stack_view_set_to_scale (SW_STACK_VIEW (view), TRUE);
  widget_render_settle ();
  surface = widget_render_window (window);
  widget_render_pixel (surface, 1, 1, bg);
  g_assert_true (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, &rc));
  g_assert_true (sw_stack_view_get_scale_bar (SW_STACK_VIEW (view), &bar, &bar_m));
  g_assert_true (sw_stack_view_get_payload_rect (SW_STACK_VIEW (view), &(graphene_rect_t) { 0 }));
  px_per_m = sw_stack_view_get_metre_scale (SW_STACK_VIEW (view));
  g_assert_cmpfloat (px_per_m, >, 5.0);

  /* The bar: from just above the ground line up its middle. */
  ground = (int) floor (rc.origin.y + rc.size.height);
  /* The bar is an outline with its lower half filled: its top is the
   * highest drawn pixel of its middle column (searched up to a pixel above
   * where the view says it ends; its label stands higher). */
  {
    int bx = (int) (bar.origin.x + bar.size.width / 2.0), top = ground;
    for (int y = ground - 1; y >= (int) floor (bar.origin.y) - 1; y--)
      {
        double px[4];
        widget_render_pixel (surface, bx, y, px);
        if (!near_color (px, bg, 0.02))
          top = y;
      }
    bar_px = ground - top;
  }
  /* The fairing's colour, from the middle of its cylinder. */
  {
    graphene_rect_t f;
    g_assert_true (sw_stack_view_get_payload_rect (SW_STACK_VIEW (view), &f));
    widget_render_pixel (surface, (int) (f.origin.x + f.size.width / 2.0),
                         (int) (f.origin.y + f.size.height * 0.8), fairing);
  }
  /* The stage: up a line near its wall (outside the nozzle, inside the tanks'
   * cylinders) until the fairing begins. */
  x = (int) (rc.origin.x + rc.size.width / 2.0 + 0.42 * rc.size.width);
  len_px = run_length (surface, x, ground - 1, 0, -1, bg, fairing);
  /* Across the engine section, half-way up it: from the background left of
   * the stage to the background right of it. */
  {
    int y = (int) (ground - 0.3 * 3.7 * px_per_m), x0 = (int) floor (rc.origin.x) - 4;
    double px[4];
    widget_render_pixel (surface, x0, y, px);
    g_assert_true (near_color (px, bg, 0.02));
    while (x0 < WIDTH - 1 && (widget_render_pixel (surface, x0, y, px), near_color (px, bg, 0.02)))
      x0++;
    dia_px = run_length (surface, x0, y, 1, 0, bg, NULL);
  }
  g_test_message ("bar %d px for %g m; stage %d px long, %d px wide; %.3f px/m",
                  bar_px, bar_m, len_px, dia_px, px_per_m);
  want = len_m / bar_m * bar_px;
  g_assert_cmpfloat (fabs (len_px - want), <=, 2.0 + 0.01 * want);
  want = 3.7 / bar_m * bar_px;
  g_assert_cmpfloat (fabs (dia_px - want), <=, 2.0 + 0.01 * want);
  cairo_surface_destroy (surface);

  /* Without a propellant it says so and draws no vehicle. */
  d->stages[0].propellant.kind = SW_PROPELLANT_NONE;
  d->stages[0].propellant.has_mixture_ratio = FALSE;
  g_clear_pointer (&result, sw_analysis_unref);
  result = sw_analysis_compute (d, 2, NULL);
  g_assert_true (result->ok && !result->shape.complete);
  sw_stack_view_set_result (SW_STACK_VIEW (view), result);
  widget_render_settle ();
  g_assert_cmpfloat (sw_stack_view_get_metre_scale (SW_STACK_VIEW (view)), ==, 0.0);
  g_assert_false (sw_stack_view_get_block_rect (SW_STACK_VIEW (view), 0, &rc));
  /* Back to the mass picture: areas again. */
  sw_stack_view_set_to_scale (SW_STACK_VIEW (view), FALSE);
  widget_render_settle ();
  g_assert_cmpfloat (sw_stack_view_get_area_scale (SW_STACK_VIEW (view)), >, 0.0);
  gtk_window_destroy (GTK_WINDOW (window));
}

/* The T/W on a stage's label is the shown vehicle's: a closed loop that did
 * not converge flew another sizing (its last try), whose figures must not
 * be printed beside this one's masses (seen: "T/W 2.13" on an 85 t first
 * stage of 720 kN). */
static void
test_tw_of_shown_vehicle (void)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR,
                                            "three-stage-simulated.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  const double shares[] = { 0.8, 0.15, 0.05 };
  GtkWidget *view = sw_stack_view_new ();
  SwAnalysis *r;

  g_object_ref_sink (view);
  g_assert_nonnull (d);
  d->split = SW_SPLIT_MANUAL;
  for (guint i = 0; i < 3; i++)
    {
      d->stages[i].has_share = TRUE;
      d->stages[i].delta_v_share = shares[i];
    }
  r = sw_analysis_run (d, NULL, NULL);
  g_assert_true (r->sizing.feasible);
  g_assert_nonnull (r->ascent);
  g_assert_true (r->ascent->closed_loop);
  g_assert_false (r->sized_by_ascent);
  g_assert_true (r->has_stage_figures);
  sw_stack_view_set_result (SW_STACK_VIEW (view), r);
  for (guint i = 0; i < 3; i++)
    g_assert_cmpfloat (sw_stack_view_get_stage_tw (SW_STACK_VIEW (view), i), ==,
                       r->stage_figures[i].ignition_thrust_to_weight);
  /* The first stage's from the shown masses: 720 kN against the liftoff
   * mass, below 1 (test input, worked out: 720e3 / (87.8e3 * 9.80665)). */
  g_assert_cmpfloat (sw_stack_view_get_stage_tw (SW_STACK_VIEW (view), 0), <, 1.0);
  sw_analysis_unref (r);
  g_object_unref (view);
}

int
main (int argc, char **argv)
{
  gtk_test_init (&argc, &argv, NULL);

  g_test_add_func ("/gui/stack-view/glue-units", test_glue_units);
  g_test_add_func ("/gui/stack-view/break-at-separators", test_break_at_separators);
  g_test_add_func ("/gui/stack-view/long-word-name", test_long_word_name);
  g_test_add_func ("/gui/stack-view/tw-of-shown-vehicle", test_tw_of_shown_vehicle);
  g_test_add_func ("/gui/stack-view/drawing-kept", test_drawing_kept);
  g_test_add_func ("/gui/stack-view/drawn-ahead", test_drawn_ahead);
  g_test_add_func ("/gui/stack-view/to-scale-pixels", test_to_scale_pixels);
  g_test_add_func ("/gui/stack-view/areas-small-launcher", test_areas_small);
  g_test_add_func ("/gui/stack-view/areas-medium-cargo", test_areas_medium);
  g_test_add_func ("/gui/stack-view/areas-boosters", test_areas_boosters);
  g_test_add_func ("/gui/stack-view/areas-all-solid", test_areas_solid);
  g_test_add_func ("/gui/stack-view/infeasible", test_infeasible);
  g_test_add_func ("/gui/stack-view/error", test_error);
  g_test_add_func ("/gui/stack-view/unused", test_unused);
  g_test_add_func ("/gui/stack-view/selection", test_selection);
  g_test_add_func ("/gui/stack-view/drag-and-click", test_drag_and_click);
  g_test_add_func ("/gui/stack-view/shared-drawing-two-sizes", test_shared_drawing_two_sizes);
  g_test_add_func ("/gui/stack-view/screen-same-shapes", test_screen_same_shapes);
  return g_test_run ();
}
