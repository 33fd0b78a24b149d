/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-propellant"

#include "config.h"

#include "sw-propellant.h"

#include "sw-limits.h"
#include "sw-optional-keys.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

const char *const sw_propellant_stage_keys[] = {
  "propellant_kg", "propellant", "mixture_ratio", "ullage_fraction", NULL
};
static const char *const custom_keys[] = {
  "name", "oxidizer_density_kg_m3", "fuel_density_kg_m3", "mixture_ratio", NULL
};

/* Component densities: open property data files computed with a reference
 * equation-of-state library, at the normal boiling point (cryogens) or
 * 293.15 K (LOX 1141.17, LH2 70.83, methane 422.36, RP-1 809.95, N2O4
 * 1441.44, UDMH 790.44, MMH 879.84 kg/m^3).  Mixture ratios: Sutton, Rocket
 * Propulsion Elements, table of theoretical performance (from memory), at the
 * values engines run (LOX/LH2 at 6, as engines do).  Composite solid: 1790
 * kg/m^3, the middle of 1750-1820 (from memory). */
static const SwPropellantInfo catalogue[SW_N_PROPELLANTS] = {
  [SW_PROPELLANT_LOX_KEROSENE] = { "lox-kerosene", N_("LOX / kerosene"), 1141.17, 809.95, 2.56,
                                   FALSE },
  [SW_PROPELLANT_LOX_HYDROGEN] = { "lox-hydrogen", N_("LOX / hydrogen"), 1141.17, 70.83, 6.0,
                                   FALSE },
  [SW_PROPELLANT_LOX_METHANE] = { "lox-methane", N_("LOX / methane"), 1141.17, 422.36, 3.5,
                                  FALSE },
  [SW_PROPELLANT_N2O4_UDMH] = { "n2o4-udmh", N_("N2O4 / UDMH"), 1441.44, 790.44, 2.6, FALSE },
  [SW_PROPELLANT_N2O4_MMH] = { "n2o4-mmh", N_("N2O4 / MMH"), 1441.44, 879.84, 2.0, FALSE },
  [SW_PROPELLANT_SOLID_COMPOSITE] = { "solid-composite", N_("Composite solid"), 1790.0, 1790.0,
                                      0.0, TRUE },
};

const SwPropellantInfo *
sw_propellant_info (SwPropellantKind kind)
{
  if (kind <= SW_PROPELLANT_NONE || kind >= SW_PROPELLANT_CUSTOM)
    return NULL;
  return &catalogue[kind];
}

gboolean
sw_propellant_kind_from_string (const char *text, SwPropellantKind *kind)
{
  for (int k = SW_PROPELLANT_LOX_KEROSENE; k < SW_PROPELLANT_CUSTOM; k++)
    if (g_strcmp0 (text, catalogue[k].key) == 0)
      {
        *kind = (SwPropellantKind) k;
        return TRUE;
      }
  return FALSE;
}

static gboolean
load_custom (JsonObject *obj, const char *file, const char *path, SwStagePropellant *prop,
             GError **error)
{
  const char *name = NULL;
  g_autofree char *name_path = sw_optional_path (path, "name");

  g_autoptr (GList) members = json_object_get_members (obj);

  for (GList *m = members; m != NULL; m = m->next)
    if (!g_strv_contains (custom_keys, m->data))
      {
        g_autofree char *p = sw_optional_path (path, m->data);
        sw_optional_set_error (error, SW_ERROR_VALUE, file,
                               _("%s: not a key of a propellant (it takes name, "
                                 "oxidizer_density_kg_m3, fuel_density_kg_m3 and mixture_ratio)"),
                               p);
        return FALSE;
      }
  if (!sw_optional_read_string_full (obj, "name", file, path, TRUE, &name, error))
    return FALSE;
  if (!sw_limit_contains (SW_LIMIT_PROPELLANT_NAME_LENGTH, (double) strlen (name)))
    {
      sw_optional_set_error (error, SW_ERROR_RANGE, file,
                             _("%s: a propellant's name takes 1 to %d bytes"), name_path,
                             (int) sw_limit_get (SW_LIMIT_PROPELLANT_NAME_LENGTH)->max);
      return FALSE;
    }
  g_strlcpy (prop->custom_name, name, sizeof prop->custom_name);
  prop->kind = SW_PROPELLANT_CUSTOM;
  return sw_optional_read_number_full (obj, "oxidizer_density_kg_m3", file, path, TRUE,
                                       SW_LIMIT_COMPONENT_DENSITY, FALSE,
                                       &prop->oxidizer_density_kg_m3, NULL, error)
         && sw_optional_read_number_full (obj, "fuel_density_kg_m3", file, path, TRUE,
                                          SW_LIMIT_COMPONENT_DENSITY, FALSE,
                                          &prop->fuel_density_kg_m3, NULL, error)
         && sw_optional_read_number_full (obj, "mixture_ratio", file, path, TRUE,
                                          SW_LIMIT_MIXTURE_RATIO, FALSE,
                                          &prop->custom_mixture_ratio, NULL, error);
}

gboolean
sw_propellant_load_stage (JsonObject *obj, const char *file, const char *path,
                          SwStagePropellant *prop, GError **error)
{
  JsonNode *node = json_object_get_member (obj, "propellant");
  g_autofree char *ppath = sw_optional_path (path, "propellant");

  memset (prop, 0, sizeof *prop);
  if (node != NULL)
    {
      if (JSON_NODE_HOLDS_OBJECT (node))
        {
          if (!load_custom (json_node_get_object (node), file, ppath, prop, error))
            return FALSE;
        }
      else if (JSON_NODE_HOLDS_VALUE (node) && json_node_get_value_type (node) == G_TYPE_STRING)
        {
          const char *text = json_node_get_string (node);
          if (!sw_propellant_kind_from_string (text, &prop->kind))
            {
              sw_optional_set_error (error, SW_ERROR_VALUE, file,
                                     _("%s: unknown propellant \"%s\"; expected lox-kerosene, "
                                       "lox-hydrogen, lox-methane, n2o4-udmh, n2o4-mmh, "
                                       "solid-composite or an object of your own"),
                                     ppath, text);
              return FALSE;
            }
        }
      else
        {
          sw_optional_set_error (error, SW_ERROR_TYPE, file,
                                 _("%s: expected a propellant name or an object, found %s"),
                                 ppath, sw_optional_node_type_name (node));
          return FALSE;
        }
    }
  if (!sw_optional_read_number (obj, "propellant_kg", file, path, SW_LIMIT_PROPELLANT_LOAD,
                                FALSE, &prop->propellant_kg, &prop->has_propellant_kg, error)
      || !sw_optional_read_number (obj, "mixture_ratio", file, path, SW_LIMIT_MIXTURE_RATIO,
                                   FALSE, &prop->mixture_ratio, &prop->has_mixture_ratio, error)
      || !sw_optional_read_number (obj, "ullage_fraction", file, path, SW_LIMIT_ULLAGE, FALSE,
                                   &prop->ullage_fraction, &prop->has_ullage, error))
    return FALSE;
  return sw_propellant_validate_stage (prop, file, path, error);
}

gboolean
sw_propellant_validate_stage (const SwStagePropellant *prop, const char *file,
                              const char *path, GError **error)
{
  g_autofree char *ppath = sw_optional_path (path, "propellant");

  g_return_val_if_fail (prop != NULL, FALSE);

  if ((prop->has_propellant_kg
       && !sw_optional_check (SW_LIMIT_PROPELLANT_LOAD, prop->propellant_kg, file, path, error))
      || (prop->has_mixture_ratio
          && !sw_optional_check (SW_LIMIT_MIXTURE_RATIO, prop->mixture_ratio, file, path, error))
      || (prop->has_ullage
          && !sw_optional_check (SW_LIMIT_ULLAGE, prop->ullage_fraction, file, path, error)))
    return FALSE;
  if (prop->kind >= SW_N_PROPELLANTS)
    {
      sw_optional_set_error (error, SW_ERROR_VALUE, file, _("%s: unknown propellant"), ppath);
      return FALSE;
    }
  if (prop->kind == SW_PROPELLANT_CUSTOM
      && (!sw_optional_check (SW_LIMIT_COMPONENT_DENSITY, prop->oxidizer_density_kg_m3, file,
                              ppath, error)
          || !sw_optional_check (SW_LIMIT_COMPONENT_DENSITY, prop->fuel_density_kg_m3, file,
                                 ppath, error)
          || !sw_optional_check (SW_LIMIT_MIXTURE_RATIO, prop->custom_mixture_ratio, file, ppath,
                                 error)))
    return FALSE;
  if (prop->kind == SW_PROPELLANT_CUSTOM
      && (prop->custom_name[0] == '\0'
          || memchr (prop->custom_name, '\0', sizeof prop->custom_name) == NULL))
    {
      sw_optional_set_error (error, SW_ERROR_RANGE, file,
                             _("%s.name: a propellant's name takes 1 to %d bytes"), ppath,
                             (int) sw_limit_get (SW_LIMIT_PROPELLANT_NAME_LENGTH)->max);
      return FALSE;
    }
  if (prop->has_mixture_ratio && prop->kind == SW_PROPELLANT_SOLID_COMPOSITE)
    {
      g_autofree char *p = sw_optional_path (path, "mixture_ratio");
      sw_optional_set_error (error, SW_ERROR_VALUE, file,
                             _("%s: a solid propellant has no mixture ratio; leave the key out"),
                             p);
      return FALSE;
    }
  if (prop->has_mixture_ratio && prop->kind == SW_PROPELLANT_NONE)
    {
      g_autofree char *p = sw_optional_path (path, "mixture_ratio");
      sw_optional_set_error (error, SW_ERROR_MISSING, file,
                             _("%s: a mixture ratio needs the stage's propellant beside it"), p);
      return FALSE;
    }
  return TRUE;
}

void
sw_propellant_save_stage (JsonBuilder *b, const SwStagePropellant *prop)
{
  if (prop->has_propellant_kg)
    sw_optional_add_number (b, "propellant_kg", prop->propellant_kg);
  if (prop->kind == SW_PROPELLANT_CUSTOM)
    {
      json_builder_set_member_name (b, "propellant");
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "name");
      json_builder_add_string_value (b, prop->custom_name);
      sw_optional_add_number (b, "oxidizer_density_kg_m3", prop->oxidizer_density_kg_m3);
      sw_optional_add_number (b, "fuel_density_kg_m3", prop->fuel_density_kg_m3);
      sw_optional_add_number (b, "mixture_ratio", prop->custom_mixture_ratio);
      json_builder_end_object (b);
    }
  else if (sw_propellant_info (prop->kind) != NULL)
    {
      json_builder_set_member_name (b, "propellant");
      json_builder_add_string_value (b, sw_propellant_info (prop->kind)->key);
    }
  if (prop->has_mixture_ratio)
    sw_optional_add_number (b, "mixture_ratio", prop->mixture_ratio);
  if (prop->has_ullage)
    sw_optional_add_number (b, "ullage_fraction", prop->ullage_fraction);
}

gboolean
sw_propellant_is_used (const SwStagePropellant *prop)
{
  return prop->has_propellant_kg || prop->kind != SW_PROPELLANT_NONE || prop->has_mixture_ratio
         || prop->has_ullage;
}

void
sw_propellant_set_kind (SwStagePropellant *prop, SwPropellantKind kind)
{
  g_return_if_fail (prop != NULL && kind < SW_N_PROPELLANTS);

  if (kind == SW_PROPELLANT_CUSTOM && prop->kind != SW_PROPELLANT_CUSTOM)
    {
      const SwPropellantInfo *from = sw_propellant_info (prop->kind);
      if (from == NULL || from->solid)
        from = &catalogue[SW_PROPELLANT_LOX_KEROSENE];
      memset (prop->custom_name, 0, sizeof prop->custom_name);
      g_strlcpy (prop->custom_name, "custom", sizeof prop->custom_name);
      prop->oxidizer_density_kg_m3 = from->oxidizer_density_kg_m3;
      prop->fuel_density_kg_m3 = from->fuel_density_kg_m3;
      prop->custom_mixture_ratio = from->mixture_ratio;
    }
  else if (kind != SW_PROPELLANT_CUSTOM)
    {
      memset (prop->custom_name, 0, sizeof prop->custom_name);
      prop->oxidizer_density_kg_m3 = prop->fuel_density_kg_m3 = 0.0;
      prop->custom_mixture_ratio = 0.0;
    }
  prop->kind = kind;
}

/* ---- what follows ------------------------------------------------------ */

double
sw_bulk_density (double rho_o, double rho_f, double r)
{
  return rho_o * rho_f * (1.0 + r) / (rho_f * r + rho_o);
}

gboolean
sw_propellant_effective (const SwStagePropellant *prop, double *rho_o, double *rho_f,
                         double *r, gboolean *solid)
{
  const SwPropellantInfo *info = sw_propellant_info (prop->kind);

  if (prop->kind == SW_PROPELLANT_CUSTOM)
    {
      *rho_o = prop->oxidizer_density_kg_m3;
      *rho_f = prop->fuel_density_kg_m3;
      *r = prop->custom_mixture_ratio;
      *solid = FALSE;
    }
  else if (info != NULL)
    {
      *rho_o = info->oxidizer_density_kg_m3;
      *rho_f = info->fuel_density_kg_m3;
      *r = info->mixture_ratio;
      *solid = info->solid;
    }
  else
    return FALSE;
  if (prop->has_mixture_ratio && !*solid)
    *r = prop->mixture_ratio;
  return TRUE;
}

double
sw_propellant_ullage (const SwStagePropellant *prop)
{
  return prop->has_ullage ? prop->ullage_fraction : SW_ULLAGE_DEFAULT;
}

double
sw_tank_length (double volume_m3, double diameter_m, double aspect)
{
  double r = diameter_m / 2.0;
  double dome_volume = (2.0 / 3.0) * G_PI * r * r * r / aspect;
  double cylinder = (volume_m3 - 2.0 * dome_volume) / (G_PI * r * r);

  return MAX (cylinder, 0.0) + 2.0 * r / aspect;
}

void
sw_stage_shape (const SwStagePropellant *prop, double mp, double diameter_m, SwStageShape *out)
{
  double rho_o, rho_f, r, ullage;
  gboolean solid;

  memset (out, 0, sizeof *out);
  out->oxidizer_tank_length_m = out->fuel_tank_length_m = NAN;
  out->intertank_length_m = out->engine_section_length_m = out->length_m = NAN;
  if (!isfinite (mp) || mp < 0.0 || !sw_propellant_effective (prop, &rho_o, &rho_f, &r, &solid))
    {
      out->bulk_density_kg_m3 = out->propellant_volume_m3 = out->tank_volume_m3 = NAN;
      return;
    }
  ullage = sw_propellant_ullage (prop);
  out->valid = TRUE;
  out->solid = solid;
  if (solid)
    {
      /* One component, the grain: all of it counts as "oxidizer" (the case). */
      out->bulk_density_kg_m3 = rho_o;
      out->oxidizer_mass_kg = mp;
      out->oxidizer_volume_m3 = mp / rho_o;
    }
  else
    {
      out->bulk_density_kg_m3 = sw_bulk_density (rho_o, rho_f, r);
      out->oxidizer_mass_kg = mp * r / (1.0 + r);
      out->fuel_mass_kg = mp / (1.0 + r);
      out->oxidizer_volume_m3 = out->oxidizer_mass_kg / rho_o;
      out->fuel_volume_m3 = out->fuel_mass_kg / rho_f;
    }
  out->propellant_volume_m3 = out->oxidizer_volume_m3 + out->fuel_volume_m3;
  out->oxidizer_tank_m3 = out->oxidizer_volume_m3 * (1.0 + ullage);
  out->fuel_tank_m3 = out->fuel_volume_m3 * (1.0 + ullage);
  out->tank_volume_m3 = out->propellant_volume_m3 * (1.0 + ullage);

  if (!(isfinite (diameter_m) && diameter_m > 0.0))
    return;
  out->has_length = TRUE;
  out->oxidizer_tank_length_m = sw_tank_length (out->oxidizer_tank_m3, diameter_m,
                                                SW_DOME_ASPECT_RATIO);
  if (solid)
    {
      out->fuel_tank_length_m = 0.0;
      out->intertank_length_m = 0.0;
      out->engine_section_length_m = SW_NOZZLE_SKIRT_PER_DIAMETER * diameter_m;
    }
  else
    {
      out->fuel_tank_length_m = sw_tank_length (out->fuel_tank_m3, diameter_m,
                                                SW_DOME_ASPECT_RATIO);
      out->intertank_length_m = SW_INTERTANK_PER_DIAMETER * diameter_m;
      out->engine_section_length_m = SW_ENGINE_SECTION_PER_DIAMETER * diameter_m;
    }
  out->length_m = out->oxidizer_tank_length_m + out->fuel_tank_length_m
                  + out->intertank_length_m + out->engine_section_length_m;
}
