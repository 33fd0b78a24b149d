/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-design"

#include "config.h"

#include "sw-design-edit.h"

#include "sw-limits.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

/* ---- shares ------------------------------------------------------------ */

static void
set_equal_shares (SwDesign *design)
{
  for (guint i = 0; i < design->n_stages; i++)
    {
      design->stages[i].delta_v_share = 1.0 / design->n_stages;
      design->stages[i].has_share = TRUE;
    }
}

/* Scales the manual shares of every stage to add up to 1 (equal shares when
 * they add up to 0). */
static void
renormalise_shares (SwDesign *design)
{
  double sum = 0.0;

  for (guint i = 0; i < design->n_stages; i++)
    sum += design->stages[i].has_share ? design->stages[i].delta_v_share : 0.0;
  if (!(sum > 1e-12))
    {
      set_equal_shares (design);
      return;
    }
  for (guint i = 0; i < design->n_stages; i++)
    {
      SwStage *s = &design->stages[i];
      s->delta_v_share = s->has_share ? s->delta_v_share / sum : 0.0;
      s->has_share = TRUE;
    }
}

gboolean
sw_design_take_manual_shares (SwDesign *design, const double *shares, guint n_shares)
{
  double sum = 0.0;
  gboolean usable;

  g_return_val_if_fail (design != NULL && design->n_stages > 0, FALSE);

  usable = shares != NULL && n_shares == design->n_stages;
  for (guint i = 0; usable && i < n_shares; i++)
    {
      usable = isfinite (shares[i]) && shares[i] >= 0.0;
      sum += usable ? shares[i] : 0.0;
    }
  usable = usable && sum > 0.0 && isfinite (sum);
  design->split = SW_SPLIT_MANUAL;
  if (!usable)
    {
      set_equal_shares (design);
      return FALSE;
    }
  for (guint i = 0; i < design->n_stages; i++)
    {
      design->stages[i].delta_v_share = shares[i] / sum;
      design->stages[i].has_share = TRUE;
    }
  return TRUE;
}

gboolean
sw_design_set_share_rebalanced (SwDesign *design, guint index, double share)
{
  double rest = 0.0;
  guint n;

  g_return_val_if_fail (design != NULL, FALSE);
  if (index >= design->n_stages)
    return FALSE;

  n = design->n_stages;
  share = isnan (share) ? 0.0 : CLAMP (share, 0.0, 1.0);
  if (n == 1)
    share = 1.0;
  for (guint i = 0; i < n; i++)
    if (i != index)
      rest += design->stages[i].has_share ? design->stages[i].delta_v_share : 0.0;

  /* The others keep their proportions among themselves; if they were all
   * zero they share what is left equally. */
  for (guint i = 0; i < n; i++)
    {
      SwStage *s = &design->stages[i];
      double old = s->has_share ? s->delta_v_share : 0.0;
      if (i == index)
        s->delta_v_share = share;
      else if (rest > 1e-12)
        s->delta_v_share = old / rest * (1.0 - share);
      else
        s->delta_v_share = (1.0 - share) / (n - 1);
      s->has_share = TRUE;
    }
  return TRUE;
}

gboolean
sw_design_move_share (SwDesign *design, guint from, guint to, double amount)
{
  SwStage *a, *b;
  double total;

  g_return_val_if_fail (design != NULL, FALSE);
  if (from >= design->n_stages || to >= design->n_stages)
    return FALSE;

  /* Moving share within one stage changes nothing (the code below would
   * count the stage twice and break the sum). */
  if (from == to || isnan (amount))
    return TRUE;
  a = &design->stages[from];
  b = &design->stages[to];
  total = a->delta_v_share + b->delta_v_share;
  amount = CLAMP (amount, -b->delta_v_share, a->delta_v_share);
  a->delta_v_share -= amount;
  /* The pair keeps its total exactly, so the sum over all stages does not
   * drift over a long drag. */
  b->delta_v_share = total - a->delta_v_share;
  return TRUE;
}

gboolean
sw_design_set_split (SwDesign *design, SwSplitMode mode, const double *shares, guint n_shares)
{
  g_return_val_if_fail (design != NULL, FALSE);

  if (mode == design->split)
    return FALSE;
  if (mode == SW_SPLIT_MANUAL)
    sw_design_take_manual_shares (design, shares, n_shares);
  else
    design->split = mode;
  return TRUE;
}

/* ---- the stage list ---------------------------------------------------- */

/* The economics object names stages by index (engine types' stages, the
 * developed stages): when the list changes, those indices follow their
 * stages. */
static guint32
mask_remove_bit (guint32 mask, guint i)
{
  guint32 low = mask & ((1u << i) - 1u);
  guint32 high = i + 1 < 32 ? (mask >> (i + 1)) << i : 0;
  return low | high;
}

static guint32
mask_insert_bit (guint32 mask, guint i, gboolean bit)
{
  guint32 low = mask & ((1u << i) - 1u);
  guint32 high = (mask >> i) << (i + 1);
  return low | high | (bit ? 1u << i : 0u);
}

static void
economics_remove_stage (SwEconomics *e, guint i)
{
  for (guint k = 0; k < e->n_engine_types; k++)
    e->engine_types[k].stage_mask = mask_remove_bit (e->engine_types[k].stage_mask, i);
  e->developed_stages = mask_remove_bit (e->developed_stages, i);
}

/* A copy of stage @i at @i + 1: the same engines, but a new stage, not
 * developed. */
static void
economics_duplicate_stage (SwEconomics *e, guint i)
{
  for (guint k = 0; k < e->n_engine_types; k++)
    {
      guint32 m = e->engine_types[k].stage_mask;
      e->engine_types[k].stage_mask = mask_insert_bit (m, i + 1, (m & (1u << i)) != 0);
    }
  e->developed_stages = mask_insert_bit (e->developed_stages, i + 1, FALSE);
}

static guint32
mask_move_bit (guint32 mask, guint from, guint to)
{
  gboolean bit = (mask & (1u << from)) != 0;
  return mask_insert_bit (mask_remove_bit (mask, from), to, bit);
}

static void
economics_move_stage (SwEconomics *e, guint from, guint to)
{
  for (guint k = 0; k < e->n_engine_types; k++)
    e->engine_types[k].stage_mask = mask_move_bit (e->engine_types[k].stage_mask, from, to);
  e->developed_stages = mask_move_bit (e->developed_stages, from, to);
}

/* Copies whole characters of @text that fit in @size bytes: a name cut
 * inside a character would not be UTF-8, and the loader rejects such a
 * file.  @text must be UTF-8 (checked by the callers). */
static void
copy_name (char *dest, gsize size, const char *text)
{
  const char *end = text;

  while (*end != '\0')
    {
      const char *next = g_utf8_next_char (end);
      if ((gsize) (next - text) >= size)
        break;
      end = next;
    }
  memmove (dest, text, (gsize) (end - text));
  dest[end - text] = '\0';
}

gboolean
sw_design_add_stage (SwDesign *design)
{
  guint n;

  g_return_val_if_fail (design != NULL, FALSE);
  if (design->n_stages >= SW_MAX_STAGES)
    return FALSE;

  n = design->n_stages;
  sw_stage_init_default (&design->stages[n], n);
  design->n_stages = n + 1;
  if (design->split == SW_SPLIT_MANUAL)
    {
      design->stages[n].has_share = TRUE;
      design->stages[n].delta_v_share = 0.0;
      sw_design_set_share_rebalanced (design, n, 1.0 / (n + 1));
    }
  return TRUE;
}

gboolean
sw_design_duplicate_stage (SwDesign *design, guint index)
{
  SwStage copy;

  g_return_val_if_fail (design != NULL, FALSE);
  if (design->n_stages >= SW_MAX_STAGES || index >= design->n_stages)
    return FALSE;

  copy = design->stages[index];
  {
    /* Translators: name of a duplicated stage; %s is the original's name */
    g_autofree char *copy_of = g_strdup_printf (_("%s (copy)"), design->stages[index].name);
    copy_name (copy.name, sizeof copy.name, copy_of);
    g_strchomp (copy.name);  /* " (copy)" cut after its space */
  }
  memmove (&design->stages[index + 2], &design->stages[index + 1],
           (design->n_stages - index - 1) * sizeof design->stages[0]);
  design->stages[index + 1] = copy;
  design->n_stages++;
  economics_duplicate_stage (&design->economics, index);
  if (design->split == SW_SPLIT_MANUAL)
    {
      design->stages[index].delta_v_share /= 2.0;
      design->stages[index + 1].delta_v_share = design->stages[index].delta_v_share;
    }
  return TRUE;
}

/* The first stage lifts off: a coast before ignition belongs to an upper
 * stage (the file format refuses one on the first), so a stage that
 * becomes the first (its lower stage removed or moved above it) loses its
 * coast.  Else the design would not load back, and the window greys the
 * first stage's coast field, so nobody could clear it. */
static void
first_stage_lifts_off (SwDesign *design)
{
  SwStagePropulsion *p = &design->stages[0].propulsion;

  if (!p->has_coast)
    return;
  p->has_coast = FALSE;
  p->coast_before_ignition_s = 0.0;
  sw_propulsion_update_present (p);
}

gboolean
sw_design_remove_stage (SwDesign *design, guint index)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (design->n_stages <= 1 || index >= design->n_stages)
    return FALSE;

  memmove (&design->stages[index], &design->stages[index + 1],
           (design->n_stages - index - 1) * sizeof design->stages[0]);
  design->n_stages--;
  memset (&design->stages[design->n_stages], 0, sizeof design->stages[0]);
  economics_remove_stage (&design->economics, index);
  if (design->split == SW_SPLIT_MANUAL)
    renormalise_shares (design);
  first_stage_lifts_off (design);
  return TRUE;
}

gboolean
sw_design_move_stage (SwDesign *design, guint from, guint to)
{
  SwStage moving;

  g_return_val_if_fail (design != NULL, FALSE);
  if (from >= design->n_stages || to >= design->n_stages)
    return FALSE;
  if (from == to)
    return TRUE;

  moving = design->stages[from];
  if (from < to)
    memmove (&design->stages[from], &design->stages[from + 1],
             (to - from) * sizeof design->stages[0]);
  else
    memmove (&design->stages[to + 1], &design->stages[to],
             (from - to) * sizeof design->stages[0]);
  design->stages[to] = moving;
  economics_move_stage (&design->economics, from, to);
  first_stage_lifts_off (design);
  return TRUE;
}

/* ---- fields ------------------------------------------------------------ */

gboolean
sw_design_set_name (SwDesign *design, const char *name)
{
  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (!g_utf8_validate (name, -1, NULL))
    return FALSE;
  copy_name (design->name, sizeof design->name, name);
  return TRUE;
}

gboolean
sw_design_set_stage_name (SwDesign *design, guint index, const char *name)
{
  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (index >= design->n_stages || !g_utf8_validate (name, -1, NULL))
    return FALSE;
  copy_name (design->stages[index].name, sizeof design->stages[index].name, name);
  return TRUE;
}

gboolean
sw_design_set_mission_kind (SwDesign *design, SwMissionKind kind, double current_delta_v_m_s)
{
  SwMission *m;

  g_return_val_if_fail (design != NULL, FALSE);
  m = &design->mission;
  if (kind == m->kind)
    return FALSE;
  m->kind = kind;
  if (kind == SW_MISSION_DELTA_V && !sw_limit_contains (SW_LIMIT_DELTA_V, m->delta_v_m_s))
    {
      double dv = round (current_delta_v_m_s);
      m->delta_v_m_s = isfinite (dv) && sw_limit_contains (SW_LIMIT_DELTA_V, dv) ? dv : 9400.0;
    }
  if (kind == SW_MISSION_ORBIT && !sw_limit_contains (SW_LIMIT_ALTITUDE, m->altitude_km))
    {
      m->altitude_km = 400.0;
      m->inclination_deg = 30.0;
      m->site_latitude_deg = 28.0;
      m->losses_m_s = 1500.0;
      m->has_losses = TRUE;
    }
  return TRUE;
}

gboolean
sw_design_set_stage_has_isp_sl (SwDesign *design, guint index, gboolean has_isp_sl)
{
  SwStage *s;

  g_return_val_if_fail (design != NULL, FALSE);
  if (index >= design->n_stages)
    return FALSE;
  s = &design->stages[index];
  s->has_isp_sl = has_isp_sl;
  if (s->has_isp_sl && !(s->isp_sl_s > 0.0 && s->isp_sl_s <= s->isp_vac_s))
    s->isp_sl_s = round (0.9 * s->isp_vac_s);  /* a starting value the user will edit */
  return TRUE;
}

/* ---- the baseline ------------------------------------------------------ */

void
sw_design_pin_baseline (SwDesign *design)
{
  SwDesign *pinned;

  g_return_if_fail (design != NULL);
  pinned = sw_design_copy (design);
  g_clear_pointer (&pinned->baseline, sw_design_free);
  sw_design_free (design->baseline);
  design->baseline = pinned;
}

gboolean
sw_design_clear_baseline (SwDesign *design)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (design->baseline == NULL)
    return FALSE;
  g_clear_pointer (&design->baseline, sw_design_free);
  return TRUE;
}

gboolean
sw_design_accept_structural_coefficients (SwDesign *design, const double *eps, guint n,
                                          gboolean *changed, GError **error)
{
  return sw_design_accept_estimated_coefficients (design, eps, n, NAN, changed, error);
}

gboolean
sw_design_accept_estimated_coefficients (SwDesign *design, const double *eps, guint n,
                                         double booster_eps, gboolean *changed, GError **error)
{
  const SwLimit *lim = sw_limit_get (SW_LIMIT_STRUCTURAL_COEFFICIENT);
  double rounded[SW_MAX_STAGES];
  double booster_rounded;
  gboolean moved = FALSE;

  g_return_val_if_fail (design != NULL && (eps != NULL || n == 0), FALSE);

  if (changed != NULL)
    *changed = FALSE;
  if (n != design->n_stages)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("(design): %u estimated structural coefficients for %u stages"),
                   n, design->n_stages);
      return FALSE;
    }
  for (guint i = 0; i < n; i++)
    {
      if (isnan (eps[i]))
        {
          rounded[i] = design->stages[i].structural_coefficient;
          continue;
        }
      rounded[i] = round (eps[i] * 1e4) / 1e4;
      if (!isfinite (rounded[i]) || !sw_limit_contains (SW_LIMIT_STRUCTURAL_COEFFICIENT,
                                                        rounded[i]))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                       _("(design): stages[%u].structural_coefficient: the estimate %g is "
                         "outside the accepted range %g to %g"),
                       i, eps[i], lim->min, lim->max);
          return FALSE;
        }
    }
  booster_rounded = design->boosters.structural_coefficient;
  if (!isnan (booster_eps))
    {
      if (design->boosters.count == 0)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                       _("(design): boosters.structural_coefficient: an estimate for boosters "
                         "the design does not have"));
          return FALSE;
        }
      booster_rounded = round (booster_eps * 1e4) / 1e4;
      if (!isfinite (booster_rounded)
          || !sw_limit_contains (SW_LIMIT_STRUCTURAL_COEFFICIENT, booster_rounded))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                       _("(design): boosters.structural_coefficient: the estimate %g is "
                         "outside the accepted range %g to %g"),
                       booster_eps, lim->min, lim->max);
          return FALSE;
        }
    }
  for (guint i = 0; i < n; i++)
    {
      moved = moved || rounded[i] != design->stages[i].structural_coefficient;
      design->stages[i].structural_coefficient = rounded[i];
    }
  moved = moved || booster_rounded != design->boosters.structural_coefficient;
  design->boosters.structural_coefficient = booster_rounded;
  if (changed != NULL)
    *changed = moved;
  return TRUE;
}
