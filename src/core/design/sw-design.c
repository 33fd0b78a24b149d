/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-design"

#include "config.h"

#include "sw-design.h"

#include "sw-budget.h"
#include "sw-limits.h"
#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

static const char *const root_keys[] = {
  "format", "version", "name", "notes", "payload_kg", "mission", "split", "stages",
  "baseline", NULL
};
static const char *const mission_keys[] = {
  "delta_v_m_s", "orbit", "losses_m_s", "loss_model", NULL
};
static const char *const orbit_keys[] = {
  "altitude_km", "inclination_deg", "site_latitude_deg", NULL
};
static const char *const stage_keys[] = {
  "name", "isp_vac_s", "isp_sl_s", "structural_coefficient", "delta_v_share", NULL
};
/* The optional models add their own keys to the design and to each stage. */
static const char *const *const root_key_lists[] = {
  root_keys, sw_propulsion_design_keys, sw_uncertainty_design_keys, sw_economics_design_keys,
  sw_boosters_design_keys, NULL
};
static const char *const *const stage_key_lists[] = {
  stage_keys, sw_propulsion_stage_keys, sw_reliability_stage_keys, sw_propellant_stage_keys,
  NULL
};

SwDesign *
sw_design_new (void)
{
  SwDesign *d = g_new0 (SwDesign, 1);
  d->split = SW_SPLIT_OPTIMAL;
  d->mission.kind = SW_MISSION_DELTA_V;
  /* The state the loader gives a file without the optional object, so that
   * a new design equals itself after save and load. */
  sw_uncertainty_init (&d->uncertainty);
  sw_economics_init (&d->economics);
  return d;
}

void
sw_stage_init_default (SwStage *stage, guint index)
{
  memset (stage, 0, sizeof *stage);
  g_snprintf (stage->name, sizeof stage->name, _("Stage %u"), index + 1);
  /* Plausible liquid stages (common practice): a first stage with a sea-level
   * Isp, upper stages with lighter structure-to-propellant. */
  stage->isp_vac_s = index == 0 ? 320.0 : 340.0;
  stage->has_isp_sl = index == 0;
  stage->isp_sl_s = index == 0 ? 285.0 : 0.0;
  stage->structural_coefficient = index == 0 ? 0.07 : 0.09;
  stage->delta_v_share = 0.0;
}

SwDesign *
sw_design_new_default (void)
{
  SwDesign *d = sw_design_new ();

  g_strlcpy (d->name, _("Untitled design"), sizeof d->name);
  d->payload_kg = 1000.0;
  d->mission.delta_v_m_s = 9400.0;
  d->n_stages = 2;
  for (guint i = 0; i < d->n_stages; i++)
    {
      sw_stage_init_default (&d->stages[i], i);
      d->stages[i].delta_v_share = 0.5;
      d->stages[i].has_share = TRUE;
    }
  return d;
}

SwDesign *
sw_design_copy (const SwDesign *design)
{
  SwDesign *copy;

  g_return_val_if_fail (design != NULL, NULL);

  copy = g_new (SwDesign, 1);
  memcpy (copy, design, sizeof *copy);
  copy->notes = g_strdup (design->notes);
  copy->baseline = design->baseline != NULL ? sw_design_copy (design->baseline) : NULL;
  return copy;
}

void
sw_design_free (SwDesign *design)
{
  if (design == NULL)
    return;
  g_free (design->notes);
  sw_design_free (design->baseline);
  g_free (design);
}

void
sw_design_set_notes (SwDesign *design, const char *notes)
{
  g_return_if_fail (design != NULL);
  if (g_strcmp0 (design->notes, notes) == 0)
    return;
  g_free (design->notes);
  design->notes = g_strdup (notes);
}

/* Clears the values a file does not carry (the other kind of mission, an
 * absent optional number), so that equality means "saves the same". */
static void
clear_unsaved_values (SwDesign *c)
{
  if (c->mission.kind == SW_MISSION_DELTA_V)
    {
      c->mission.loss_model = SW_LOSS_ALLOWANCE;
      c->mission.altitude_km = c->mission.inclination_deg = c->mission.site_latitude_deg = 0.0;
      c->mission.has_losses = FALSE;
    }
  else
    c->mission.delta_v_m_s = 0.0;
  if (!c->mission.has_losses)
    c->mission.losses_m_s = 0.0;
  for (guint i = 0; i < c->n_stages && i < SW_MAX_STAGES; i++)
    {
      if (!c->stages[i].has_isp_sl)
        c->stages[i].isp_sl_s = 0.0;
      if (!c->stages[i].has_share)
        c->stages[i].delta_v_share = 0.0;
    }
  sw_boosters_clear_unsaved (&c->boosters);
}

gboolean
sw_design_equal (const SwDesign *a, const SwDesign *b)
{
  SwDesign ca, cb;

  if (a == NULL || b == NULL)
    return a == b;
  if (g_strcmp0 (a->notes, b->notes) != 0 || !sw_design_equal (a->baseline, b->baseline))
    return FALSE;
  /* Compare the plain part field by field through a normalised copy: unused
   * bytes of the name buffers must not decide equality. */
  memcpy (&ca, a, sizeof ca);
  memcpy (&cb, b, sizeof cb);
  ca.notes = cb.notes = NULL;
  ca.baseline = cb.baseline = NULL;
  if (strcmp (ca.name, cb.name) != 0 || ca.n_stages != cb.n_stages)
    return FALSE;
  clear_unsaved_values (&ca);
  clear_unsaved_values (&cb);
  memset (ca.name, 0, sizeof ca.name);
  memset (cb.name, 0, sizeof cb.name);
  for (guint i = 0; i < SW_MAX_STAGES; i++)
    {
      if (i < ca.n_stages && strcmp (ca.stages[i].name, cb.stages[i].name) != 0)
        return FALSE;
      if (i >= ca.n_stages)
        {
          memset (&ca.stages[i], 0, sizeof ca.stages[i]);
          memset (&cb.stages[i], 0, sizeof cb.stages[i]);
        }
      memset (ca.stages[i].name, 0, sizeof ca.stages[i].name);
      memset (cb.stages[i].name, 0, sizeof cb.stages[i].name);
    }
  return memcmp (&ca, &cb, sizeof ca) == 0;
}

/* ---- loading ----------------------------------------------------------- */

typedef struct {
  const char *file;
  GPtrArray  *warnings;
} LoadContext;

static gboolean
copy_text (char *dest, gsize size, const char *text, const LoadContext *ctx, const char *path,
           GError **error)
{
  if (strlen (text) >= size)
    {
      sw_optional_set_error (error, SW_ERROR_RANGE, ctx->file,
                             _("%s: the text is %zu bytes long; at most %zu are accepted"), path,
                             strlen (text), size - 1);
      return FALSE;
    }
  g_strlcpy (dest, text, size);
  return TRUE;
}

static gboolean
load_stage (JsonObject *obj, const LoadContext *ctx, const char *prefix, SwStage *stage,
            GError **error)
{
  const char *name = NULL;
  g_autofree char *name_path = sw_optional_path (prefix, "name");

  sw_optional_warn_unknown_full (obj, ctx->file, prefix, stage_key_lists, ctx->warnings);

  if (!sw_optional_read_string_full (obj, "name", ctx->file, prefix, FALSE, &name, error))
    return FALSE;
  if (name != NULL && !copy_text (stage->name, sizeof stage->name, name, ctx, name_path, error))
    return FALSE;
  return sw_optional_read_number_full (obj, "isp_vac_s", ctx->file, prefix, TRUE,
                                       SW_OPTIONAL_NO_LIMIT, FALSE, &stage->isp_vac_s, NULL, error)
         && sw_optional_read_number_full (obj, "isp_sl_s", ctx->file, prefix, FALSE,
                                          SW_OPTIONAL_NO_LIMIT, FALSE, &stage->isp_sl_s,
                                          &stage->has_isp_sl, error)
         && sw_optional_read_number_full (obj, "structural_coefficient", ctx->file, prefix, TRUE,
                                          SW_OPTIONAL_NO_LIMIT, FALSE,
                                          &stage->structural_coefficient, NULL, error)
         && sw_optional_read_number_full (obj, "delta_v_share", ctx->file, prefix, FALSE,
                                          SW_OPTIONAL_NO_LIMIT, FALSE, &stage->delta_v_share,
                                          &stage->has_share, error)
         && sw_propulsion_load_stage (obj, ctx->file, prefix, &stage->propulsion,
                                      ctx->warnings, error)
         && sw_reliability_load_stage (obj, ctx->file, prefix, &stage->reliability,
                                       ctx->warnings, error)
         && sw_propellant_load_stage (obj, ctx->file, prefix, &stage->propellant, error);
}

static gboolean
load_mission (JsonObject *obj, const LoadContext *ctx, const char *prefix, SwMission *m,
              GError **error)
{
  JsonObject *orbit;
  gboolean ok, has_dv;
  const char *loss_model = NULL;
  g_autofree char *orbit_path = sw_optional_path (prefix, "orbit");

  sw_optional_warn_unknown (obj, ctx->file, prefix, mission_keys, ctx->warnings);

  orbit = sw_optional_read_object_full (obj, "orbit", ctx->file, prefix, FALSE, &ok, error);
  if (!ok)
    return FALSE;
  if (!sw_optional_read_number_full (obj, "delta_v_m_s", ctx->file, prefix, FALSE,
                                     SW_OPTIONAL_NO_LIMIT, FALSE, &m->delta_v_m_s, &has_dv, error))
    return FALSE;
  if (has_dv && orbit != NULL)
    {
      sw_optional_set_error (error, SW_ERROR_VALUE, ctx->file,
                             _("%s: give either delta_v_m_s or orbit, not both"), prefix);
      return FALSE;
    }
  if (!has_dv && orbit == NULL)
    {
      sw_optional_set_error (error, SW_ERROR_MISSING, ctx->file,
                             _("%s: needs either delta_v_m_s (a number) or orbit (an object)"),
                             prefix);
      return FALSE;
    }
  if (has_dv)
    {
      m->kind = SW_MISSION_DELTA_V;
      return TRUE;
    }

  m->kind = SW_MISSION_ORBIT;
  sw_optional_warn_unknown (orbit, ctx->file, orbit_path, orbit_keys, ctx->warnings);
  if (!sw_optional_read_number_full (orbit, "altitude_km", ctx->file, orbit_path, TRUE,
                                     SW_OPTIONAL_NO_LIMIT, FALSE, &m->altitude_km, NULL, error)
      || !sw_optional_read_number_full (orbit, "inclination_deg", ctx->file, orbit_path, TRUE,
                                        SW_OPTIONAL_NO_LIMIT, FALSE, &m->inclination_deg, NULL,
                                        error)
      || !sw_optional_read_number_full (orbit, "site_latitude_deg", ctx->file, orbit_path, TRUE,
                                        SW_OPTIONAL_NO_LIMIT, FALSE, &m->site_latitude_deg, NULL,
                                        error)
      || !sw_optional_read_number_full (obj, "losses_m_s", ctx->file, prefix, FALSE,
                                        SW_OPTIONAL_NO_LIMIT, FALSE, &m->losses_m_s, &m->has_losses,
                                        error)
      || !sw_optional_read_string_full (obj, "loss_model", ctx->file, prefix, FALSE, &loss_model,
                                        error))
    return FALSE;

  m->loss_model = SW_LOSS_ALLOWANCE;
  if (loss_model != NULL)
    {
      if (strcmp (loss_model, "simulate") == 0)
        m->loss_model = SW_LOSS_SIMULATE;
      else if (strcmp (loss_model, "allowance") != 0)
        {
          g_autofree char *path = sw_optional_path (prefix, "loss_model");
          sw_optional_set_error (error, SW_ERROR_VALUE, ctx->file,
                                 _("%s: \"%s\" is not a loss model; use \"allowance\" or "
                                   "\"simulate\""),
                                 path, loss_model);
          return FALSE;
        }
    }
  if (!m->has_losses && m->loss_model == SW_LOSS_ALLOWANCE && ctx->warnings != NULL)
    {
      g_autofree char *path = sw_optional_path (prefix, "losses_m_s");
      g_ptr_array_add (ctx->warnings,
                       g_strdup_printf (_("%s: %s is missing: no gravity, drag or steering "
                                          "losses are assumed"),
                                        sw_optional_display_file (ctx->file), path));
    }
  return TRUE;
}

static SwDesign *
load_design_object (JsonObject *root, const LoadContext *ctx, const char *prefix,
                    gboolean is_baseline, GError **error)
{
  g_autoptr (SwDesign) d = sw_design_new ();
  const char *format = NULL, *name = NULL, *notes = NULL, *split = NULL;
  JsonObject *mission, *baseline;
  JsonNode *version_node, *stages_node;
  JsonArray *stages;
  gboolean ok;
  guint n;

  sw_optional_warn_unknown_full (root, ctx->file, prefix, root_key_lists, ctx->warnings);

  /* format and version are required at the top; a pinned baseline inherits them. */
  if (!sw_optional_read_string_full (root, "format", ctx->file, prefix, !is_baseline, &format,
                                     error))
    return NULL;
  if (format != NULL && strcmp (format, SW_DESIGN_FORMAT) != 0)
    {
      g_autofree char *path = sw_optional_path (prefix, "format");
      sw_optional_set_error (error, SW_ERROR_FORMAT, ctx->file,
                             _("%s: \"%s\" is not a Stagewright design (expected \"%s\")"), path,
                             format, SW_DESIGN_FORMAT);
      return NULL;
    }
  version_node = json_object_get_member (root, "version");
  if (version_node == NULL && !is_baseline)
    {
      sw_optional_set_error (error, SW_ERROR_MISSING, ctx->file,
                             _("version: required number is missing"));
      return NULL;
    }
  if (version_node != NULL)
    {
      g_autofree char *path = sw_optional_path (prefix, "version");
      double v;

      if (!sw_optional_node_is_number (version_node))
        {
          sw_optional_set_error (error, SW_ERROR_TYPE, ctx->file,
                                 _("%s: expected a whole number, found %s"), path,
                                 sw_optional_node_type_name (version_node));
          return NULL;
        }
      v = json_node_get_double (version_node);
      if (!isfinite (v) || v != floor (v) || v < 1)
        {
          sw_optional_set_error (error, SW_ERROR_VALUE, ctx->file,
                                 _("%s: %g is not a format version (whole numbers from 1)"),
                                 path, v);
          return NULL;
        }
      if (v > SW_DESIGN_VERSION)
        {
          sw_optional_set_error (error, SW_ERROR_VERSION, ctx->file,
                                 _("%s: the file is format version %.0f, written by a newer "
                                   "Stagewright; this one reads versions up to %d"),
                                 path, v, SW_DESIGN_VERSION);
          return NULL;
        }
    }

  if (!sw_optional_read_string_full (root, "name", ctx->file, prefix, FALSE, &name, error)
      || !sw_optional_read_string_full (root, "notes", ctx->file, prefix, FALSE, &notes, error))
    return NULL;
  if (name != NULL)
    {
      g_autofree char *path = sw_optional_path (prefix, "name");
      if (!copy_text (d->name, sizeof d->name, name, ctx, path, error))
        return NULL;
    }
  if (notes != NULL)
    sw_design_set_notes (d, notes);

  if (!sw_optional_read_number_full (root, "payload_kg", ctx->file, prefix, TRUE,
                                     SW_OPTIONAL_NO_LIMIT, FALSE, &d->payload_kg, NULL, error))
    return NULL;

  mission = sw_optional_read_object_full (root, "mission", ctx->file, prefix, TRUE, &ok, error);
  if (!ok)
    return NULL;
  {
    g_autofree char *path = sw_optional_path (prefix, "mission");
    if (!load_mission (mission, ctx, path, &d->mission, error))
      return NULL;
  }

  if (!sw_optional_read_string_full (root, "split", ctx->file, prefix, TRUE, &split, error))
    return NULL;
  if (!sw_split_mode_from_string (split, &d->split))
    {
      g_autofree char *path = sw_optional_path (prefix, "split");
      sw_optional_set_error (error, SW_ERROR_VALUE, ctx->file,
                             _("%s: \"%s\" is not a split mode; use \"equal\", \"optimal\" or "
                               "\"manual\""),
                             path, split);
      return NULL;
    }

  stages_node = json_object_get_member (root, "stages");
  {
    g_autofree char *path = sw_optional_path (prefix, "stages");
    if (stages_node == NULL)
      {
        sw_optional_set_error (error, SW_ERROR_MISSING, ctx->file,
                               _("%s: required list of stages is missing"), path);
        return NULL;
      }
    if (json_node_get_node_type (stages_node) != JSON_NODE_ARRAY)
      {
        sw_optional_set_error (error, SW_ERROR_TYPE, ctx->file,
                               _("%s: expected a list of stages, found %s"), path,
                               sw_optional_node_type_name (stages_node));
        return NULL;
      }
    stages = json_node_get_array (stages_node);
    n = json_array_get_length (stages);
    if (n < 1 || n > SW_MAX_STAGES)
      {
        sw_optional_set_error (error, SW_ERROR_RANGE, ctx->file,
                               _("%s: %u stages given; a design has 1 to %d stages"), path, n,
                               SW_MAX_STAGES);
        return NULL;
      }
  }
  d->n_stages = n;
  for (guint i = 0; i < n; i++)
    {
      JsonNode *node = json_array_get_element (stages, i);
      g_autofree char *path = g_strdup_printf ("%s%sstages[%u]", prefix,
                                               prefix[0] ? "." : "", i);

      if (json_node_get_node_type (node) != JSON_NODE_OBJECT)
        {
          sw_optional_set_error (error, SW_ERROR_TYPE, ctx->file,
                                 _("%s: expected a stage object, found %s"), path,
                                 sw_optional_node_type_name (node));
          return NULL;
        }
      g_snprintf (d->stages[i].name, sizeof d->stages[i].name, _("Stage %u"), i + 1);
      if (!load_stage (json_node_get_object (node), ctx, path, &d->stages[i], error))
        return NULL;
    }

  if (!sw_propulsion_load_design (root, ctx->file, &d->ascent, ctx->warnings, error))
    return NULL;
  if (!sw_uncertainty_load_design (root, ctx->file, prefix, &d->uncertainty, ctx->warnings,
                                   error)
      || !sw_economics_load_design (root, ctx->file, prefix, &d->economics, ctx->warnings, error)
      || !sw_boosters_load (root, ctx->file, prefix, &d->boosters, ctx->warnings, error))
    return NULL;

  baseline = sw_optional_read_object_full (root, "baseline", ctx->file, prefix, FALSE, &ok, error);
  if (!ok)
    return NULL;
  if (baseline != NULL)
    {
      g_autofree char *path = sw_optional_path (prefix, "baseline");
      if (is_baseline)
        {
          sw_optional_set_error (error, SW_ERROR_NESTING, ctx->file,
                                 _("%s: a baseline cannot have a baseline of its own"), path);
          return NULL;
        }
      d->baseline = load_design_object (baseline, ctx, path, TRUE, error);
      if (d->baseline == NULL)
        return NULL;
    }

  return g_steal_pointer (&d);
}

/* json-glib's parser recurses; refuse absurd nesting before it sees the text. */
static gboolean
check_nesting (const char *data, gsize length, const LoadContext *ctx, GError **error)
{
  int depth = 0;
  gboolean in_string = FALSE;

  for (gsize i = 0; i < length; i++)
    {
      char ch = data[i];
      if (in_string)
        {
          if (ch == '\\')
            i++;
          else if (ch == '"')
            in_string = FALSE;
          continue;
        }
      if (ch == '"')
        in_string = TRUE;
      else if (ch == '{' || ch == '[')
        {
          if (++depth > SW_DESIGN_MAX_DEPTH)
            {
              sw_optional_set_error (error, SW_ERROR_NESTING, ctx->file,
                                     _("objects and lists are nested more than %d deep; a design "
                                       "never needs that"),
                                     SW_DESIGN_MAX_DEPTH);
              return FALSE;
            }
        }
      else if (ch == '}' || ch == ']')
        depth--;
    }
  return TRUE;
}

SwDesign *
sw_design_from_json (JsonNode *root, const char *filename, GPtrArray *warnings, GError **error)
{
  LoadContext ctx = { filename, warnings };
  SwDesign *d;

  g_return_val_if_fail (root != NULL, NULL);

  if (json_node_get_node_type (root) != JSON_NODE_OBJECT)
    {
      sw_optional_set_error (error, SW_ERROR_TYPE, ctx.file,
                             _("the file holds %s; a design is a JSON object"),
                             sw_optional_node_type_name (root));
      return NULL;
    }
  d = load_design_object (json_node_get_object (root), &ctx, "", FALSE, error);
  if (d == NULL)
    return NULL;
  if (!sw_design_validate (d, filename, error))
    {
      sw_design_free (d);
      return NULL;
    }
  return d;
}

SwDesign *
sw_design_load_data (const char *data, gssize length, const char *filename,
                     GPtrArray *warnings, GError **error)
{
  LoadContext ctx = { filename, warnings };
  g_autoptr (JsonParser) parser = NULL;
  g_autoptr (GError) local_error = NULL;
  gsize len;

  g_return_val_if_fail (data != NULL || length == 0, NULL);

  len = length < 0 ? strlen (data) : (gsize) length;
  if (len > SW_DESIGN_MAX_BYTES)
    {
      sw_optional_set_error (error, SW_ERROR_TOO_LARGE, ctx.file,
                             _("the file is %zu bytes; a design file may be at most %d bytes "
                               "(1 MiB)"),
                             len, SW_DESIGN_MAX_BYTES);
      return NULL;
    }
  if (len == 0)
    {
      sw_optional_set_error (error, SW_ERROR_SYNTAX, ctx.file, _("the file is empty"));
      return NULL;
    }
  if (!g_utf8_validate (data, len, NULL))
    {
      sw_optional_set_error (error, SW_ERROR_SYNTAX, ctx.file, _("the file is not UTF-8 text"));
      return NULL;
    }
  if (!check_nesting (data, len, &ctx, error))
    return NULL;

  parser = json_parser_new_immutable ();
  if (!json_parser_load_from_data (parser, data, len, &local_error))
    {
      sw_optional_set_error (error, SW_ERROR_SYNTAX, ctx.file, _("not valid JSON: %s"),
                             local_error->message);
      return NULL;
    }
  if (json_parser_get_root (parser) == NULL)
    {
      sw_optional_set_error (error, SW_ERROR_SYNTAX, ctx.file, _("the file holds no JSON value"));
      return NULL;
    }
  return sw_design_from_json (json_parser_get_root (parser), filename, warnings, error);
}

SwDesign *
sw_design_load (const char *filename, GPtrArray *warnings, GError **error)
{
  LoadContext ctx = { filename, warnings };
  g_autoptr (GError) local_error = NULL;
  g_autofree char *data = NULL;
  GStatBuf st;
  gsize len;

  g_return_val_if_fail (filename != NULL, NULL);

  /* Check the size before reading so a huge file is never pulled into memory. */
  if (g_stat (filename, &st) == 0 && st.st_size > SW_DESIGN_MAX_BYTES)
    {
      sw_optional_set_error (error, SW_ERROR_TOO_LARGE, ctx.file,
                             _("the file is %lld bytes; a design file may be at most %d bytes "
                               "(1 MiB)"),
                             (long long) st.st_size, SW_DESIGN_MAX_BYTES);
      return NULL;
    }
  if (!g_file_get_contents (filename, &data, &len, &local_error))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_IO, "%s", local_error->message);
      return NULL;
    }
  return sw_design_load_data (data, (gssize) len, filename, warnings, error);
}

/* ---- validation -------------------------------------------------------- */

static gboolean
validate_design (const SwDesign *d, const LoadContext *ctx, const char *prefix, GError **error)
{
  g_autofree char *mission = sw_optional_path (prefix, "mission");
  g_autofree char *orbit = sw_optional_path (mission, "orbit");
  double share_sum = 0.0;
  guint n_sized = 0;

  if (!sw_optional_check (SW_LIMIT_PAYLOAD, d->payload_kg, ctx->file, prefix, error))
    return FALSE;
  if (d->notes != NULL && strlen (d->notes) > sw_limit_get (SW_LIMIT_NOTES_LENGTH)->max)
    {
      g_autofree char *path = sw_optional_path (prefix, "notes");
      sw_optional_set_error (error, SW_ERROR_RANGE, ctx->file,
                             _("%s: the notes are longer than %g bytes"), path,
                             sw_limit_get (SW_LIMIT_NOTES_LENGTH)->max);
      return FALSE;
    }

  if (d->mission.kind == SW_MISSION_DELTA_V)
    {
      if (!sw_optional_check (SW_LIMIT_DELTA_V, d->mission.delta_v_m_s, ctx->file, mission, error))
        return FALSE;
    }
  else
    {
      double az;

      if (!sw_optional_check (SW_LIMIT_ALTITUDE, d->mission.altitude_km, ctx->file, orbit, error)
          || !sw_optional_check (SW_LIMIT_INCLINATION, d->mission.inclination_deg, ctx->file, orbit,
                                 error)
          || !sw_optional_check (SW_LIMIT_SITE_LATITUDE, d->mission.site_latitude_deg, ctx->file,
                                 orbit, error)
          || (d->mission.has_losses
              && !sw_optional_check (SW_LIMIT_LOSSES, d->mission.losses_m_s, ctx->file, mission,
                                     error)))
        return FALSE;
      if (fabs (d->mission.site_latitude_deg) > 89.99
          || !sw_launch_azimuth (d->mission.inclination_deg, d->mission.site_latitude_deg, &az))
        {
          g_autofree char *path = sw_optional_path (orbit, "inclination_deg");
          sw_optional_set_error (error, SW_ERROR_VALUE, ctx->file,
                                 _("%s: an orbit inclined %g deg cannot be reached directly "
                                   "from a site at latitude %g deg; the inclination must lie "
                                   "between %g and %g deg"),
                                 path, d->mission.inclination_deg, d->mission.site_latitude_deg,
                                 fabs (d->mission.site_latitude_deg),
                                 180.0 - fabs (d->mission.site_latitude_deg));
          return FALSE;
        }
    }

  if (d->n_stages < 1 || d->n_stages > SW_MAX_STAGES)
    {
      g_autofree char *path = sw_optional_path (prefix, "stages");
      sw_optional_set_error (error, SW_ERROR_RANGE, ctx->file,
                             _("%s: %u stages; a design has 1 to %d"), path, d->n_stages,
                             SW_MAX_STAGES);
      return FALSE;
    }

  for (guint i = 0; i < d->n_stages; i++)
    {
      const SwStage *s = &d->stages[i];
      g_autofree char *sp = g_strdup_printf ("%s%sstages[%u]", prefix, prefix[0] ? "." : "", i);

      if (!sw_optional_check (SW_LIMIT_ISP_VAC, s->isp_vac_s, ctx->file, sp, error)
          || !sw_optional_check (SW_LIMIT_STRUCTURAL_COEFFICIENT, s->structural_coefficient,
                                 ctx->file, sp, error)
          || (s->has_isp_sl && !sw_optional_check (SW_LIMIT_ISP_SL, s->isp_sl_s, ctx->file, sp,
                                                   error))
          || !sw_reliability_validate_stage (&s->reliability, ctx->file, sp, error)
          || !sw_propulsion_validate_stage (&s->propulsion, i, ctx->file, sp, error)
          || !sw_propellant_validate_stage (&s->propellant, ctx->file, sp, error))
        return FALSE;
      if (s->has_isp_sl && s->isp_sl_s > s->isp_vac_s)
        {
          g_autofree char *path = sw_optional_path (sp, "isp_sl_s");
          sw_optional_set_error (error, SW_ERROR_RANGE, ctx->file,
                                 _("%s: %g s is above the stage's vacuum Isp of %g s; the "
                                   "sea-level Isp must lie between 0 and the vacuum Isp"),
                                 path, s->isp_sl_s, s->isp_vac_s);
          return FALSE;
        }
      /* A stage with a fixed propellant load is not sized: the manual shares
       * split the sized stages' delta-v and a fixed stage needs none. */
      if (!s->propellant.has_propellant_kg)
        n_sized++;
      if (d->split == SW_SPLIT_MANUAL && !s->propellant.has_propellant_kg)
        {
          if (!s->has_share)
            {
              g_autofree char *path = sw_optional_path (sp, "delta_v_share");
              sw_optional_set_error (error, SW_ERROR_MISSING, ctx->file,
                                     _("%s: required for the manual split (a fraction "
                                       "from 0 to 1)"),
                                     path);
              return FALSE;
            }
          if (!sw_optional_check (SW_LIMIT_DELTA_V_SHARE, s->delta_v_share, ctx->file, sp, error))
            return FALSE;
          share_sum += s->delta_v_share;
        }
      else if (s->has_share && !sw_optional_check (SW_LIMIT_DELTA_V_SHARE, s->delta_v_share,
                                                   ctx->file, sp, error))
        return FALSE;
    }

  if (d->split == SW_SPLIT_MANUAL && n_sized > 0 && fabs (share_sum - 1.0) > 1e-6)
    {
      g_autofree char *path = sw_optional_path (prefix, "stages");
      sw_optional_set_error (error, SW_ERROR_VALUE, ctx->file,
                             _("%s: the manual delta_v_share values add up to %.9g; they must add "
                               "up to 1 (within 1e-6)"),
                             path, share_sum);
      return FALSE;
    }

  if (!sw_uncertainty_validate (&d->uncertainty, ctx->file, prefix, error)
      || !sw_economics_validate (&d->economics, d->n_stages, ctx->file, prefix, error)
      || !sw_propulsion_validate_design (&d->ascent, ctx->file, error)
      || !sw_boosters_validate (&d->boosters, ctx->file, prefix, error))
    return FALSE;
  if (d->boosters.count > 0)
    {
      const SwStage *core = &d->stages[0];
      guint engines = core->reliability.has_engine_count ? core->reliability.engine_count : 0;
      double thrust = sw_stage_thrust_vac_n (&core->propulsion, engines);

      if (!(isfinite (thrust) && thrust > 0.0))
        {
          g_autofree char *path = g_strdup_printf ("%s%sstages[0].thrust_vac_kn", prefix,
                                                   prefix[0] ? "." : "");
          sw_optional_set_error (error, SW_ERROR_MISSING, ctx->file,
                                 _("%s: with boosters the first stage (the core) needs its "
                                   "thrust (thrust_vac_kn, or engine_thrust_vac_kn with "
                                   "engine_count): its mass flow sets how much core propellant "
                                   "burns beside the boosters"),
                                 path);
          return FALSE;
        }
    }

  if (d->baseline != NULL)
    {
      g_autofree char *path = sw_optional_path (prefix, "baseline");
      if (d->baseline->baseline != NULL)
        {
          sw_optional_set_error (error, SW_ERROR_NESTING, ctx->file,
                                 _("%s: a baseline cannot have a baseline of its own"), path);
          return FALSE;
        }
      return validate_design (d->baseline, ctx, path, error);
    }
  return TRUE;
}

gboolean
sw_design_validate (const SwDesign *design, const char *filename, GError **error)
{
  LoadContext ctx = { filename, NULL };

  g_return_val_if_fail (design != NULL, FALSE);
  return validate_design (design, &ctx, "", error);
}

/* ---- saving ------------------------------------------------------------ */

/* Version 1 unless a key of version 2 is used (by the design or its baseline). */
static int
design_format_version (const SwDesign *d)
{
  for (; d != NULL; d = d->baseline)
    {
      if (sw_boosters_is_used (&d->boosters))
        return 2;
      for (guint i = 0; i < d->n_stages && i < SW_MAX_STAGES; i++)
        if (sw_propellant_is_used (&d->stages[i].propellant))
          return 2;
    }
  return 1;
}

static void
build_design (JsonBuilder *b, const SwDesign *d, gboolean is_baseline)
{
  json_builder_begin_object (b);
  if (!is_baseline)
    {
      json_builder_set_member_name (b, "format");
      json_builder_add_string_value (b, SW_DESIGN_FORMAT);
      json_builder_set_member_name (b, "version");
      json_builder_add_int_value (b, design_format_version (d));
    }
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, d->name);
  if (d->notes != NULL)
    {
      json_builder_set_member_name (b, "notes");
      json_builder_add_string_value (b, d->notes);
    }
  sw_optional_add_number (b, "payload_kg", d->payload_kg);

  json_builder_set_member_name (b, "mission");
  json_builder_begin_object (b);
  if (d->mission.kind == SW_MISSION_DELTA_V)
    sw_optional_add_number (b, "delta_v_m_s", d->mission.delta_v_m_s);
  else
    {
      json_builder_set_member_name (b, "orbit");
      json_builder_begin_object (b);
      sw_optional_add_number (b, "altitude_km", d->mission.altitude_km);
      sw_optional_add_number (b, "inclination_deg", d->mission.inclination_deg);
      sw_optional_add_number (b, "site_latitude_deg", d->mission.site_latitude_deg);
      json_builder_end_object (b);
      if (d->mission.has_losses)
        sw_optional_add_number (b, "losses_m_s", d->mission.losses_m_s);
      if (d->mission.loss_model == SW_LOSS_SIMULATE)
        {
          json_builder_set_member_name (b, "loss_model");
          json_builder_add_string_value (b, "simulate");
        }
    }
  json_builder_end_object (b);

  json_builder_set_member_name (b, "split");
  json_builder_add_string_value (b, sw_split_mode_to_string (d->split));

  json_builder_set_member_name (b, "stages");
  json_builder_begin_array (b);
  for (guint i = 0; i < d->n_stages; i++)
    {
      const SwStage *s = &d->stages[i];
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "name");
      json_builder_add_string_value (b, s->name);
      sw_optional_add_number (b, "isp_vac_s", s->isp_vac_s);
      if (s->has_isp_sl)
        sw_optional_add_number (b, "isp_sl_s", s->isp_sl_s);
      sw_optional_add_number (b, "structural_coefficient", s->structural_coefficient);
      if (s->has_share)
        sw_optional_add_number (b, "delta_v_share", s->delta_v_share);
      sw_propulsion_save_stage (b, &s->propulsion);
      sw_reliability_save_stage (b, &s->reliability);
      sw_propellant_save_stage (b, &s->propellant);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);

  sw_propulsion_save_design (b, &d->ascent);
  sw_uncertainty_save_design (b, &d->uncertainty);
  sw_economics_save_design (b, &d->economics);
  sw_boosters_save (b, &d->boosters);

  if (d->baseline != NULL && !is_baseline)
    {
      json_builder_set_member_name (b, "baseline");
      build_design (b, d->baseline, TRUE);
    }
  json_builder_end_object (b);
}

JsonNode *
sw_design_to_json (const SwDesign *design)
{
  g_autoptr (JsonBuilder) b = json_builder_new_immutable ();

  g_return_val_if_fail (design != NULL, NULL);
  build_design (b, design, FALSE);
  return json_builder_get_root (b);
}

/* The shortest of %.15g, %.16g and %.17g that reads back as the same double:
 * a file says 0.07, not the 0.070000000000000007 that "%.17g" writes. */
static void
append_shortest (GString *out, double value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  for (int digits = 15; digits <= 17; digits++)
    {
      char format[8];

      g_snprintf (format, sizeof format, "%%.%dg", digits);
      g_ascii_formatd (buf, sizeof buf, format, value);
      if (g_ascii_strtod (buf, NULL) == value)
        break;
    }
  g_string_append (out, buf);
}

/* Rewrites every non-integer number of the generated JSON @text (outside
 * strings) in its shortest exact form; integers stay as written. */
static char *
shorten_numbers (const char *text)
{
  GString *out = g_string_sized_new (strlen (text) + 1);
  const char *p = text;

  while (*p != '\0')
    {
      if (*p == '"')
        {
          const char *q = p + 1;
          while (*q != '\0' && *q != '"')
            q += (*q == '\\' && q[1] != '\0') ? 2 : 1;
          if (*q == '"')
            q++;
          g_string_append_len (out, p, q - p);
          p = q;
        }
      else if (*p == '-' || g_ascii_isdigit (*p))
        {
          const char *q = p + 1;
          gboolean real = FALSE;
          while (g_ascii_isdigit (*q) || *q == '.' || *q == 'e' || *q == 'E' || *q == '+'
                 || *q == '-')
            {
              real = real || *q == '.' || *q == 'e' || *q == 'E';
              q++;
            }
          if (real)
            {
              g_autofree char *token = g_strndup (p, q - p);
              append_shortest (out, g_ascii_strtod (token, NULL));
            }
          else
            g_string_append_len (out, p, q - p);
          p = q;
        }
      else
        g_string_append_c (out, *p++);
    }
  return g_string_free (out, FALSE);
}

char *
sw_design_to_data (const SwDesign *design, gsize *length)
{
  g_autoptr (JsonGenerator) gen = json_generator_new ();
  g_autoptr (JsonNode) root = sw_design_to_json (design);
  g_autofree char *text = NULL;

  json_generator_set_pretty (gen, TRUE);
  json_generator_set_indent (gen, 2);
  json_generator_set_root (gen, root);
  text = json_generator_to_data (gen, NULL);
  /* End with a newline, as text files do. */
  {
    g_autofree char *shortest = shorten_numbers (text);
    char *out = g_strconcat (shortest, "\n", NULL);
    if (length != NULL)
      *length = strlen (out);
    return out;
  }
}

gboolean
sw_design_save (const SwDesign *design, const char *filename, GError **error)
{
  g_autoptr (GError) local_error = NULL;
  g_autofree char *data = NULL;
  gsize len;

  g_return_val_if_fail (design != NULL && filename != NULL, FALSE);

  if (!sw_design_validate (design, filename, error))
    return FALSE;
  data = sw_design_to_data (design, &len);
  /* Temporary file in the same folder, fsync, rename: the old file stays
   * whole until the new one is complete on disk. */
  if (!g_file_set_contents_full (filename, data, (gssize) len,
                                 G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE,
                                 0644, &local_error))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_IO, _("Could not save %s: %s"), filename,
                   local_error->message);
      return FALSE;
    }
  return TRUE;
}

/* ---- derived quantities ------------------------------------------------ */

gboolean
sw_design_budget (const SwDesign *design, SwBudget *out, GError **error)
{
  const SwMission *m;

  g_return_val_if_fail (design != NULL && out != NULL, FALSE);

  m = &design->mission;
  if (m->kind != SW_MISSION_ORBIT)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
                   _("The design states its delta-v directly; a budget needs an orbit mission."));
      return FALSE;
    }
  return sw_budget_compute (m->altitude_km, m->inclination_deg, m->site_latitude_deg,
                            m->has_losses ? m->losses_m_s : 0.0, out, error);
}

gboolean
sw_design_required_delta_v (const SwDesign *design, double *delta_v_m_s, GError **error)
{
  SwBudget budget;

  g_return_val_if_fail (design != NULL && delta_v_m_s != NULL, FALSE);

  if (design->mission.kind == SW_MISSION_DELTA_V)
    {
      *delta_v_m_s = design->mission.delta_v_m_s;
      return TRUE;
    }
  if (!sw_design_budget (design, &budget, error))
    return FALSE;
  *delta_v_m_s = budget.delta_v_m_s;
  return TRUE;
}
