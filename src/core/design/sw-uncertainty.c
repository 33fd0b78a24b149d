/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-uncertainty"

#include "config.h"

#include "sw-uncertainty.h"

#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <gsl/gsl_randist.h>
#include <string.h>

const char *const sw_uncertainty_design_keys[] = { "uncertainty", NULL };

static const char *const uncertainty_keys[] = {
  "samples", "seed", "isp_vac", "structural_coefficient", "losses", NULL
};
static const char *const relative_keys[] = {
  "distribution", "sigma_percent", "half_range_percent", NULL
};
static const char *const absolute_keys[] = {
  "distribution", "sigma_m_s", "half_range_m_s", NULL
};

void
sw_uncertainty_init (SwUncertainty *unc)
{
  g_return_if_fail (unc != NULL);
  memset (unc, 0, sizeof *unc);
  unc->samples = SW_UNCERTAINTY_DEFAULT_SAMPLES;
  unc->seed = SW_UNCERTAINTY_DEFAULT_SEED;
}

guint
sw_uncertainty_samples (const SwUncertainty *unc)
{
  return unc != NULL && unc->has_samples ? unc->samples : SW_UNCERTAINTY_DEFAULT_SAMPLES;
}

guint32
sw_uncertainty_seed (const SwUncertainty *unc)
{
  return unc != NULL && unc->has_seed ? unc->seed : SW_UNCERTAINTY_DEFAULT_SEED;
}

gboolean
sw_uncertainty_has_spread (const SwUncertainty *unc)
{
  return unc != NULL
         && ((unc->isp.kind != SW_SPREAD_NONE && unc->isp.width > 0.0)
             || (unc->structural_coefficient.kind != SW_SPREAD_NONE
                 && unc->structural_coefficient.width > 0.0)
             || (unc->losses.kind != SW_SPREAD_NONE && unc->losses.width > 0.0));
}

const char *
sw_spread_kind_to_string (SwSpreadKind kind)
{
  switch (kind)
    {
    case SW_SPREAD_NORMAL:
      return "normal";
    case SW_SPREAD_UNIFORM:
      return "uniform";
    case SW_SPREAD_NONE:
    default:
      return "none";
    }
}

static gboolean
load_spread (JsonObject *parent, const char *key, const char *file, const char *prefix,
             gboolean relative, SwSpread *spread, GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, key);
  const char *sigma_key = relative ? "sigma_percent" : "sigma_m_s";
  const char *range_key = relative ? "half_range_percent" : "half_range_m_s";
  const char *dist = NULL, *wanted, *other;
  JsonObject *obj;
  gboolean ok, has_width = FALSE;
  double width = 0.0;

  spread->kind = SW_SPREAD_NONE;
  spread->width = 0.0;
  obj = sw_optional_read_object (parent, key, file, prefix, &ok, error);
  if (!ok)
    return FALSE;
  if (obj == NULL)
    return TRUE;
  sw_optional_warn_unknown (obj, file, path, relative ? relative_keys : absolute_keys, warnings);
  if (!sw_optional_read_string (obj, "distribution", file, path, &dist, error))
    return FALSE;
  if (dist == NULL)
    {
      g_autofree char *p = sw_optional_path (path, "distribution");
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("%s: %s: required text is missing (\"normal\" or \"uniform\")"),
                   file != NULL ? file : _("(design)"), p);
      return FALSE;
    }
  if (strcmp (dist, "normal") == 0)
    spread->kind = SW_SPREAD_NORMAL;
  else if (strcmp (dist, "uniform") == 0)
    spread->kind = SW_SPREAD_UNIFORM;
  else
    {
      g_autofree char *p = sw_optional_path (path, "distribution");
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: %s: \"%s\" is not a distribution; use \"normal\" or \"uniform\""),
                   file != NULL ? file : _("(design)"), p, dist);
      return FALSE;
    }
  wanted = spread->kind == SW_SPREAD_NORMAL ? sigma_key : range_key;
  other = spread->kind == SW_SPREAD_NORMAL ? range_key : sigma_key;
  if (json_object_has_member (obj, other))
    {
      g_autofree char *p = sw_optional_path (path, other);
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: %s: does not belong to a %s distribution; give %s instead"),
                   file != NULL ? file : _("(design)"), p, dist, wanted);
      return FALSE;
    }
  if (!sw_optional_read_number (obj, wanted, file, path,
                                relative ? (spread->kind == SW_SPREAD_NORMAL
                                              ? SW_LIMIT_SPREAD_SIGMA_PERCENT
                                              : SW_LIMIT_SPREAD_HALF_RANGE_PERCENT)
                                         : (spread->kind == SW_SPREAD_NORMAL
                                              ? SW_LIMIT_LOSSES_SIGMA
                                              : SW_LIMIT_LOSSES_HALF_RANGE),
                                FALSE, &width, &has_width, error))
    return FALSE;
  if (!has_width)
    {
      g_autofree char *p = sw_optional_path (path, wanted);
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING, _("%s: %s: required number is missing"),
                   file != NULL ? file : _("(design)"), p);
      return FALSE;
    }
  spread->width = width;
  return TRUE;
}

gboolean
sw_uncertainty_load_design (JsonObject *root, const char *file, const char *prefix,
                            SwUncertainty *unc, GPtrArray *warnings, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "uncertainty");
  JsonObject *obj;
  gboolean ok;
  double samples = 0.0, seed = 0.0;

  sw_uncertainty_init (unc);
  obj = sw_optional_read_object (root, "uncertainty", file, prefix, &ok, error);
  if (!ok)
    return FALSE;
  if (obj == NULL)
    return TRUE;
  unc->present = TRUE;
  sw_optional_warn_unknown (obj, file, path, uncertainty_keys, warnings);
  if (!sw_optional_read_number (obj, "samples", file, path, SW_LIMIT_MC_SAMPLES, TRUE, &samples,
                                &unc->has_samples, error)
      || !sw_optional_read_number (obj, "seed", file, path, SW_LIMIT_MC_SEED, TRUE, &seed,
                                   &unc->has_seed, error)
      || !load_spread (obj, "isp_vac", file, path, TRUE, &unc->isp, warnings, error)
      || !load_spread (obj, "structural_coefficient", file, path, TRUE,
                       &unc->structural_coefficient, warnings, error)
      || !load_spread (obj, "losses", file, path, FALSE, &unc->losses, warnings, error))
    return FALSE;
  if (unc->has_samples)
    unc->samples = (guint) samples;
  if (unc->has_seed)
    unc->seed = (guint32) seed;
  return TRUE;
}

static void
save_spread (JsonBuilder *b, const char *key, const SwSpread *spread, gboolean relative)
{
  if (spread->kind == SW_SPREAD_NONE)
    return;
  json_builder_set_member_name (b, key);
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "distribution");
  json_builder_add_string_value (b, sw_spread_kind_to_string (spread->kind));
  if (spread->kind == SW_SPREAD_NORMAL)
    json_builder_set_member_name (b, relative ? "sigma_percent" : "sigma_m_s");
  else
    json_builder_set_member_name (b, relative ? "half_range_percent" : "half_range_m_s");
  json_builder_add_double_value (b, spread->width);
  json_builder_end_object (b);
}

void
sw_uncertainty_save_design (JsonBuilder *builder, const SwUncertainty *unc)
{
  if (unc == NULL || !unc->present)
    return;
  json_builder_set_member_name (builder, "uncertainty");
  json_builder_begin_object (builder);
  if (unc->has_samples)
    {
      json_builder_set_member_name (builder, "samples");
      json_builder_add_int_value (builder, unc->samples);
    }
  if (unc->has_seed)
    {
      json_builder_set_member_name (builder, "seed");
      json_builder_add_int_value (builder, unc->seed);
    }
  save_spread (builder, "isp_vac", &unc->isp, TRUE);
  save_spread (builder, "structural_coefficient", &unc->structural_coefficient, TRUE);
  save_spread (builder, "losses", &unc->losses, FALSE);
  json_builder_end_object (builder);
}

static gboolean
validate_spread (const SwSpread *s, const char *key, gboolean relative, const char *file,
                 const char *prefix, GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, key);

  if (s->kind == SW_SPREAD_NONE)
    return TRUE;
  if (relative)
    return sw_optional_check (s->kind == SW_SPREAD_NORMAL ? SW_LIMIT_SPREAD_SIGMA_PERCENT
                                                          : SW_LIMIT_SPREAD_HALF_RANGE_PERCENT,
                              s->width, file, path, error);
  return sw_optional_check (s->kind == SW_SPREAD_NORMAL ? SW_LIMIT_LOSSES_SIGMA
                                                        : SW_LIMIT_LOSSES_HALF_RANGE,
                            s->width, file, path, error);
}

gboolean
sw_uncertainty_validate (const SwUncertainty *unc, const char *file, const char *prefix,
                         GError **error)
{
  g_autofree char *path = sw_optional_path (prefix, "uncertainty");

  g_return_val_if_fail (unc != NULL, FALSE);
  if (!unc->present)
    return TRUE;
  return (!unc->has_samples
          || sw_optional_check (SW_LIMIT_MC_SAMPLES, unc->samples, file, path, error))
         && validate_spread (&unc->isp, "isp_vac", TRUE, file, path, error)
         && validate_spread (&unc->structural_coefficient, "structural_coefficient", TRUE, file,
                             path, error)
         && validate_spread (&unc->losses, "losses", FALSE, file, path, error);
}

static guint64
mix64 (guint64 z)
{
  z += G_GUINT64_CONSTANT (0x9E3779B97F4A7C15);
  z = (z ^ (z >> 30)) * G_GUINT64_CONSTANT (0xBF58476D1CE4E5B9);
  z = (z ^ (z >> 27)) * G_GUINT64_CONSTANT (0x94D049BB133111EB);
  return z ^ (z >> 31);
}

unsigned long
sw_uncertainty_stream_seed (guint32 seed, guint64 index)
{
  return (unsigned long) (mix64 (((guint64) seed << 32) ^ index)
                          & G_GUINT64_CONSTANT (0xffffffff));
}

double
sw_spread_draw (gsl_rng *r, const SwSpread *s)
{
  switch (s->kind)
    {
    case SW_SPREAD_NORMAL:
      return s->width > 0.0 ? gsl_ran_gaussian_ziggurat (r, s->width) : 0.0;
    case SW_SPREAD_UNIFORM:
      return s->width > 0.0 ? gsl_ran_flat (r, -s->width, s->width) : 0.0;
    case SW_SPREAD_NONE:
    default:
      return 0.0;
    }
}

double
sw_spread_draw_scaled (gsl_rng *r, const SwSpread *s, double nominal, double lo, double hi)
{
  for (int tries = 0; tries < 64; tries++)
    {
      double v = nominal * (1.0 + sw_spread_draw (r, s) / 100.0);
      if (v > lo && v < hi)
        return v;
    }
  return nominal;
}
