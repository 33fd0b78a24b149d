/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-reliability"

#include "config.h"

#include "sw-stage-reliability.h"

#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <string.h>

const char *const sw_reliability_stage_keys[] = {
  "engine_count", "engine_reliability", "engine_failures_tolerated", "ignition_reliability",
  "separation_reliability", NULL
};

static gboolean
check_tolerance (const SwStageReliability *rel, const char *file, const char *path,
                 GError **error)
{
  guint n = rel->has_engine_count ? rel->engine_count : 1;

  if (!rel->has_failures_tolerated || rel->failures_tolerated < n)
    return TRUE;
  {
    g_autofree char *p = sw_optional_path (path, "engine_failures_tolerated");
    g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                 _("%s: %s: %u failures tolerated with %u engine(s); a stage tolerates at most "
                   "its engine count minus one"),
                 file != NULL ? file : _("(design)"), p, rel->failures_tolerated, n);
  }
  return FALSE;
}

gboolean
sw_reliability_load_stage (JsonObject *obj, const char *file, const char *path,
                           SwStageReliability *rel, GPtrArray *warnings, GError **error)
{
  double count = 1.0, tolerated = 0.0;

  memset (rel, 0, sizeof *rel);
  if (!sw_optional_read_number (obj, "engine_count", file, path, SW_LIMIT_ENGINE_COUNT, TRUE,
                                &count, &rel->has_engine_count, error)
      || !sw_optional_read_number (obj, "engine_reliability", file, path,
                                   SW_LIMIT_ENGINE_RELIABILITY, FALSE, &rel->engine_reliability,
                                   &rel->has_engine_reliability, error)
      || !sw_optional_read_number (obj, "engine_failures_tolerated", file, path,
                                   SW_LIMIT_ENGINE_FAILURES_TOLERATED, TRUE, &tolerated,
                                   &rel->has_failures_tolerated, error)
      || !sw_optional_read_number (obj, "ignition_reliability", file, path,
                                   SW_LIMIT_IGNITION_RELIABILITY, FALSE,
                                   &rel->ignition_reliability, &rel->has_ignition_reliability,
                                   error)
      || !sw_optional_read_number (obj, "separation_reliability", file, path,
                                   SW_LIMIT_SEPARATION_RELIABILITY, FALSE,
                                   &rel->separation_reliability,
                                   &rel->has_separation_reliability, error))
    return FALSE;
  rel->engine_count = rel->has_engine_count ? (guint) count : 0;
  rel->failures_tolerated = rel->has_failures_tolerated ? (guint) tolerated : 0;
  rel->present = rel->has_engine_count || rel->has_engine_reliability
                 || rel->has_failures_tolerated || rel->has_ignition_reliability
                 || rel->has_separation_reliability;
  return check_tolerance (rel, file, path, error);
}

gboolean
sw_reliability_validate_stage (const SwStageReliability *rel, const char *file,
                               const char *path, GError **error)
{
  g_return_val_if_fail (rel != NULL, FALSE);

  return (!rel->has_engine_count
          || sw_optional_check (SW_LIMIT_ENGINE_COUNT, rel->engine_count, file, path, error))
         && (!rel->has_engine_reliability
             || sw_optional_check (SW_LIMIT_ENGINE_RELIABILITY, rel->engine_reliability, file,
                                   path, error))
         && (!rel->has_failures_tolerated
             || sw_optional_check (SW_LIMIT_ENGINE_FAILURES_TOLERATED, rel->failures_tolerated,
                                   file, path, error))
         && (!rel->has_ignition_reliability
             || sw_optional_check (SW_LIMIT_IGNITION_RELIABILITY, rel->ignition_reliability,
                                   file, path, error))
         && (!rel->has_separation_reliability
             || sw_optional_check (SW_LIMIT_SEPARATION_RELIABILITY, rel->separation_reliability,
                                   file, path, error))
         && check_tolerance (rel, file, path, error);
}

void
sw_reliability_save_stage (JsonBuilder *builder, const SwStageReliability *rel)
{
  if (rel->has_engine_count)
    {
      json_builder_set_member_name (builder, "engine_count");
      json_builder_add_int_value (builder, rel->engine_count);
    }
  if (rel->has_engine_reliability)
    {
      json_builder_set_member_name (builder, "engine_reliability");
      json_builder_add_double_value (builder, rel->engine_reliability);
    }
  if (rel->has_failures_tolerated)
    {
      json_builder_set_member_name (builder, "engine_failures_tolerated");
      json_builder_add_int_value (builder, rel->failures_tolerated);
    }
  if (rel->has_ignition_reliability)
    {
      json_builder_set_member_name (builder, "ignition_reliability");
      json_builder_add_double_value (builder, rel->ignition_reliability);
    }
  if (rel->has_separation_reliability)
    {
      json_builder_set_member_name (builder, "separation_reliability");
      json_builder_add_double_value (builder, rel->separation_reliability);
    }
}

void
sw_reliability_inputs (const SwStageReliability *rel, SwReliabilityInputs *out)
{
  g_return_if_fail (rel != NULL && out != NULL);

  out->engine_count = rel->has_engine_count && rel->engine_count > 0 ? rel->engine_count : 1;
  out->engine_reliability = rel->has_engine_reliability ? rel->engine_reliability : 1.0;
  out->failures_tolerated = rel->has_failures_tolerated
                              ? MIN (rel->failures_tolerated, out->engine_count - 1) : 0;
  out->ignition_reliability = rel->has_ignition_reliability ? rel->ignition_reliability : 1.0;
  out->separation_reliability = rel->has_separation_reliability ? rel->separation_reliability
                                                                : 1.0;
}
