/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-design-fields"

#include "config.h"

#include "sw-design-fields.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

static const SwDesignFieldInfo fields[SW_N_FIELDS] = {
  [SW_FIELD_PAYLOAD] = { "payload_kg", SW_LIMIT_PAYLOAD, FALSE, FALSE, FALSE },
  [SW_FIELD_DELTA_V] = { "mission.delta_v_m_s", SW_LIMIT_DELTA_V, FALSE, FALSE, FALSE },
  [SW_FIELD_ALTITUDE] = { "mission.orbit.altitude_km", SW_LIMIT_ALTITUDE, FALSE, FALSE, FALSE },
  [SW_FIELD_INCLINATION] = { "mission.orbit.inclination_deg", SW_LIMIT_INCLINATION, FALSE,
                             FALSE, FALSE },
  [SW_FIELD_SITE_LATITUDE] = { "mission.orbit.site_latitude_deg", SW_LIMIT_SITE_LATITUDE,
                               FALSE, FALSE, FALSE },
  [SW_FIELD_LOSSES] = { "mission.losses_m_s", SW_LIMIT_LOSSES, FALSE, TRUE, FALSE },
  [SW_FIELD_ISP_VAC] = { "stages[%u].isp_vac_s", SW_LIMIT_ISP_VAC, TRUE, FALSE, FALSE },
  [SW_FIELD_ISP_SL] = { "stages[%u].isp_sl_s", SW_LIMIT_ISP_SL, TRUE, TRUE, FALSE },
  [SW_FIELD_STRUCTURAL_COEFFICIENT] = { "stages[%u].structural_coefficient",
                                        SW_LIMIT_STRUCTURAL_COEFFICIENT, TRUE, FALSE, FALSE },
  [SW_FIELD_THRUST_VAC] = { "stages[%u].thrust_vac_kn", SW_LIMIT_THRUST_VAC, TRUE, TRUE, FALSE },
  [SW_FIELD_ENGINE_THRUST_VAC] = { "stages[%u].engine_thrust_vac_kn", SW_LIMIT_ENGINE_THRUST_VAC,
                                   TRUE, TRUE, FALSE },
  [SW_FIELD_DIAMETER] = { "stages[%u].diameter_m", SW_LIMIT_DIAMETER, TRUE, TRUE, FALSE },
  [SW_FIELD_COAST] = { "stages[%u].coast_before_ignition_s", SW_LIMIT_COAST, TRUE, TRUE, FALSE },
  [SW_FIELD_ENGINE_COUNT] = { "stages[%u].engine_count", SW_LIMIT_ENGINE_COUNT, TRUE, TRUE,
                              TRUE },
  [SW_FIELD_ENGINE_RELIABILITY] = { "stages[%u].engine_reliability",
                                    SW_LIMIT_ENGINE_RELIABILITY, TRUE, TRUE, FALSE },
  [SW_FIELD_FAILURES_TOLERATED] = { "stages[%u].engine_failures_tolerated",
                                    SW_LIMIT_ENGINE_FAILURES_TOLERATED, TRUE, TRUE, TRUE },
  [SW_FIELD_IGNITION_RELIABILITY] = { "stages[%u].ignition_reliability",
                                      SW_LIMIT_IGNITION_RELIABILITY, TRUE, TRUE, FALSE },
  [SW_FIELD_SEPARATION_RELIABILITY] = { "stages[%u].separation_reliability",
                                        SW_LIMIT_SEPARATION_RELIABILITY, TRUE, TRUE, FALSE },
  [SW_FIELD_FAIRING_MASS] = { "ascent.fairing_mass_kg", SW_LIMIT_FAIRING_MASS, FALSE, TRUE,
                              FALSE },
  [SW_FIELD_FAIRING_ALTITUDE] = { "ascent.fairing_jettison_altitude_km",
                                  SW_LIMIT_FAIRING_ALTITUDE, FALSE, TRUE, FALSE },
  [SW_FIELD_FAIRING_PRESSURE] = { "ascent.fairing_jettison_dynamic_pressure_pa",
                                  SW_LIMIT_FAIRING_DYNAMIC_PRESSURE, FALSE, TRUE, FALSE },
  [SW_FIELD_PITCH_OVER_SPEED] = { "ascent.pitch_over_speed_m_s", SW_LIMIT_PITCH_OVER_SPEED,
                                  FALSE, TRUE, FALSE },
  [SW_FIELD_PITCH_KICK] = { "ascent.pitch_kick_deg", SW_LIMIT_PITCH_KICK, FALSE, TRUE, FALSE },
  [SW_FIELD_INSERTION_ALTITUDE] = { "ascent.insertion_altitude_km", SW_LIMIT_INSERTION_ALTITUDE,
                                    FALSE, TRUE, FALSE },
  [SW_FIELD_MAX_Q_ALPHA] = { "ascent.max_q_alpha_kpa_deg", SW_LIMIT_MAX_Q_ALPHA, FALSE, TRUE,
                             FALSE },
  [SW_FIELD_MC_SAMPLES] = { "uncertainty.samples", SW_LIMIT_MC_SAMPLES, FALSE, TRUE, TRUE },
  [SW_FIELD_MC_SEED] = { "uncertainty.seed", SW_LIMIT_MC_SEED, FALSE, TRUE, TRUE },
  [SW_FIELD_PROPELLANT_LOAD] = { "stages[%u].propellant_kg", SW_LIMIT_PROPELLANT_LOAD, TRUE, TRUE,
                                 FALSE },
  [SW_FIELD_MIXTURE_RATIO] = { "stages[%u].mixture_ratio", SW_LIMIT_MIXTURE_RATIO, TRUE, TRUE,
                               FALSE },
  [SW_FIELD_ULLAGE] = { "stages[%u].ullage_fraction", SW_LIMIT_ULLAGE, TRUE, TRUE, FALSE },
  [SW_FIELD_OXIDIZER_DENSITY] = { "stages[%u].propellant.oxidizer_density_kg_m3",
                                  SW_LIMIT_COMPONENT_DENSITY, TRUE, FALSE, FALSE },
  [SW_FIELD_FUEL_DENSITY] = { "stages[%u].propellant.fuel_density_kg_m3",
                              SW_LIMIT_COMPONENT_DENSITY, TRUE, FALSE, FALSE },
  [SW_FIELD_BOOSTER_COUNT] = { "boosters.count", SW_LIMIT_BOOSTER_COUNT, FALSE, FALSE, TRUE },
  [SW_FIELD_BOOSTER_ISP_VAC] = { "boosters.isp_vac_s", SW_LIMIT_ISP_VAC, FALSE, FALSE, FALSE },
  [SW_FIELD_BOOSTER_ISP_SL] = { "boosters.isp_sl_s", SW_LIMIT_ISP_SL, FALSE, TRUE, FALSE },
  [SW_FIELD_BOOSTER_STRUCTURAL_COEFFICIENT] = { "boosters.structural_coefficient",
                                                SW_LIMIT_STRUCTURAL_COEFFICIENT, FALSE, FALSE,
                                                FALSE },
  [SW_FIELD_BOOSTER_THRUST_VAC] = { "boosters.thrust_vac_kn", SW_LIMIT_THRUST_VAC, FALSE, FALSE,
                                    FALSE },
  [SW_FIELD_BOOSTER_PROPELLANT_LOAD] = { "boosters.propellant_kg", SW_LIMIT_PROPELLANT_LOAD,
                                         FALSE, TRUE, FALSE },
  [SW_FIELD_BOOSTER_DIAMETER] = { "boosters.diameter_m", SW_LIMIT_DIAMETER, FALSE, TRUE, FALSE },
  [SW_FIELD_BOOSTER_MIXTURE_RATIO] = { "boosters.mixture_ratio", SW_LIMIT_MIXTURE_RATIO, FALSE,
                                       TRUE, FALSE },
  [SW_FIELD_BOOSTER_ULLAGE] = { "boosters.ullage_fraction", SW_LIMIT_ULLAGE, FALSE, TRUE, FALSE },
  [SW_FIELD_BOOSTER_OXIDIZER_DENSITY] = { "boosters.propellant.oxidizer_density_kg_m3",
                                          SW_LIMIT_COMPONENT_DENSITY, FALSE, FALSE, FALSE },
  [SW_FIELD_BOOSTER_FUEL_DENSITY] = { "boosters.propellant.fuel_density_kg_m3",
                                      SW_LIMIT_COMPONENT_DENSITY, FALSE, FALSE, FALSE },
};

static gboolean
is_booster_field (SwDesignField f)
{
  return f >= SW_FIELD_BOOSTER_COUNT && f <= SW_FIELD_BOOSTER_FUEL_DENSITY;
}

const SwDesignFieldInfo *
sw_design_field_info (SwDesignField field)
{
  g_return_val_if_fail (field < SW_N_FIELDS, NULL);
  return &fields[field];
}

char *
sw_design_field_dup_path (SwDesignField field, guint stage)
{
  g_return_val_if_fail (field < SW_N_FIELDS, NULL);
  if (fields[field].per_stage)
    return g_strdup_printf (fields[field].path, stage);
  return g_strdup (fields[field].path);
}

/* Where the value and its "given" flag live; @has is NULL for a required
 * key.  Engine count, failures tolerated, samples and seed are whole
 * numbers stored as integers: @uint_slot instead of @slot. */
typedef struct {
  double   *slot;
  guint    *uint_slot;
  guint32  *u32_slot;
  gboolean *has;
} Slot;

static Slot
slot_of (SwDesign *d, SwDesignField f, guint i)
{
  Slot s = { NULL, NULL, NULL, NULL };
  SwStage *st = &d->stages[i];

  switch (f)
    {
    case SW_FIELD_PAYLOAD: s.slot = &d->payload_kg; break;
    case SW_FIELD_DELTA_V: s.slot = &d->mission.delta_v_m_s; break;
    case SW_FIELD_ALTITUDE: s.slot = &d->mission.altitude_km; break;
    case SW_FIELD_INCLINATION: s.slot = &d->mission.inclination_deg; break;
    case SW_FIELD_SITE_LATITUDE: s.slot = &d->mission.site_latitude_deg; break;
    case SW_FIELD_LOSSES: s.slot = &d->mission.losses_m_s; s.has = &d->mission.has_losses; break;
    case SW_FIELD_ISP_VAC: s.slot = &st->isp_vac_s; break;
    case SW_FIELD_ISP_SL: s.slot = &st->isp_sl_s; s.has = &st->has_isp_sl; break;
    case SW_FIELD_STRUCTURAL_COEFFICIENT: s.slot = &st->structural_coefficient; break;
    case SW_FIELD_THRUST_VAC:
      s.slot = &st->propulsion.thrust_vac_kn; s.has = &st->propulsion.has_thrust; break;
    case SW_FIELD_ENGINE_THRUST_VAC:
      s.slot = &st->propulsion.engine_thrust_vac_kn;
      s.has = &st->propulsion.has_engine_thrust;
      break;
    case SW_FIELD_DIAMETER:
      s.slot = &st->propulsion.diameter_m; s.has = &st->propulsion.has_diameter; break;
    case SW_FIELD_COAST:
      s.slot = &st->propulsion.coast_before_ignition_s; s.has = &st->propulsion.has_coast; break;
    case SW_FIELD_ENGINE_COUNT:
      s.uint_slot = &st->reliability.engine_count; s.has = &st->reliability.has_engine_count;
      break;
    case SW_FIELD_ENGINE_RELIABILITY:
      s.slot = &st->reliability.engine_reliability;
      s.has = &st->reliability.has_engine_reliability;
      break;
    case SW_FIELD_FAILURES_TOLERATED:
      s.uint_slot = &st->reliability.failures_tolerated;
      s.has = &st->reliability.has_failures_tolerated;
      break;
    case SW_FIELD_IGNITION_RELIABILITY:
      s.slot = &st->reliability.ignition_reliability;
      s.has = &st->reliability.has_ignition_reliability;
      break;
    case SW_FIELD_SEPARATION_RELIABILITY:
      s.slot = &st->reliability.separation_reliability;
      s.has = &st->reliability.has_separation_reliability;
      break;
    case SW_FIELD_FAIRING_MASS:
      s.slot = &d->ascent.fairing_mass_kg; s.has = &d->ascent.has_fairing_mass; break;
    case SW_FIELD_FAIRING_ALTITUDE:
      s.slot = &d->ascent.fairing_jettison_altitude_km; s.has = &d->ascent.has_fairing_altitude;
      break;
    case SW_FIELD_FAIRING_PRESSURE:
      s.slot = &d->ascent.fairing_jettison_dynamic_pressure_pa;
      s.has = &d->ascent.has_fairing_pressure;
      break;
    case SW_FIELD_PITCH_OVER_SPEED:
      s.slot = &d->ascent.pitch_over_speed_m_s; s.has = &d->ascent.has_pitch_over_speed; break;
    case SW_FIELD_PITCH_KICK:
      s.slot = &d->ascent.pitch_kick_deg; s.has = &d->ascent.has_pitch_kick; break;
    case SW_FIELD_INSERTION_ALTITUDE:
      s.slot = &d->ascent.insertion_altitude_km; s.has = &d->ascent.has_insertion_altitude;
      break;
    case SW_FIELD_MAX_Q_ALPHA:
      s.slot = &d->ascent.max_q_alpha_kpa_deg; s.has = &d->ascent.has_max_q_alpha; break;
    case SW_FIELD_MC_SAMPLES:
      s.uint_slot = &d->uncertainty.samples; s.has = &d->uncertainty.has_samples; break;
    case SW_FIELD_MC_SEED:
      s.u32_slot = &d->uncertainty.seed; s.has = &d->uncertainty.has_seed; break;
    case SW_FIELD_PROPELLANT_LOAD:
      s.slot = &st->propellant.propellant_kg; s.has = &st->propellant.has_propellant_kg; break;
    case SW_FIELD_MIXTURE_RATIO:
      s.slot = &st->propellant.mixture_ratio; s.has = &st->propellant.has_mixture_ratio; break;
    case SW_FIELD_ULLAGE:
      s.slot = &st->propellant.ullage_fraction; s.has = &st->propellant.has_ullage; break;
    case SW_FIELD_OXIDIZER_DENSITY:
      s.slot = &st->propellant.oxidizer_density_kg_m3; break;
    case SW_FIELD_FUEL_DENSITY:
      s.slot = &st->propellant.fuel_density_kg_m3; break;
    case SW_FIELD_BOOSTER_COUNT: s.uint_slot = &d->boosters.count; break;
    case SW_FIELD_BOOSTER_ISP_VAC: s.slot = &d->boosters.isp_vac_s; break;
    case SW_FIELD_BOOSTER_ISP_SL:
      s.slot = &d->boosters.isp_sl_s; s.has = &d->boosters.has_isp_sl; break;
    case SW_FIELD_BOOSTER_STRUCTURAL_COEFFICIENT:
      s.slot = &d->boosters.structural_coefficient; break;
    case SW_FIELD_BOOSTER_THRUST_VAC: s.slot = &d->boosters.thrust_vac_kn; break;
    case SW_FIELD_BOOSTER_PROPELLANT_LOAD:
      s.slot = &d->boosters.propellant.propellant_kg;
      s.has = &d->boosters.propellant.has_propellant_kg;
      break;
    case SW_FIELD_BOOSTER_DIAMETER:
      s.slot = &d->boosters.diameter_m; s.has = &d->boosters.has_diameter; break;
    case SW_FIELD_BOOSTER_MIXTURE_RATIO:
      s.slot = &d->boosters.propellant.mixture_ratio;
      s.has = &d->boosters.propellant.has_mixture_ratio;
      break;
    case SW_FIELD_BOOSTER_ULLAGE:
      s.slot = &d->boosters.propellant.ullage_fraction;
      s.has = &d->boosters.propellant.has_ullage;
      break;
    case SW_FIELD_BOOSTER_OXIDIZER_DENSITY:
      s.slot = &d->boosters.propellant.oxidizer_density_kg_m3; break;
    case SW_FIELD_BOOSTER_FUEL_DENSITY:
      s.slot = &d->boosters.propellant.fuel_density_kg_m3; break;
    case SW_N_FIELDS:
    default:
      g_assert_not_reached ();
    }
  return s;
}

gboolean
sw_design_field_get (const SwDesign *design, SwDesignField field, guint stage, double *value)
{
  Slot s;
  double v;

  g_return_val_if_fail (design != NULL && field < SW_N_FIELDS, FALSE);
  g_return_val_if_fail (!fields[field].per_stage || stage < design->n_stages, FALSE);

  s = slot_of ((SwDesign *) design, field, fields[field].per_stage ? stage : 0);
  /* The component densities exist for a propellant of the user's own only. */
  if ((field == SW_FIELD_OXIDIZER_DENSITY || field == SW_FIELD_FUEL_DENSITY)
      && design->stages[stage].propellant.kind != SW_PROPELLANT_CUSTOM)
    {
      if (value != NULL)
        *value = 0.0;
      return FALSE;
    }
  if ((field == SW_FIELD_BOOSTER_OXIDIZER_DENSITY || field == SW_FIELD_BOOSTER_FUEL_DENSITY)
      && design->boosters.propellant.kind != SW_PROPELLANT_CUSTOM)
    {
      if (value != NULL)
        *value = 0.0;
      return FALSE;
    }
  v = s.slot != NULL ? *s.slot : s.uint_slot != NULL ? (double) *s.uint_slot : (double) *s.u32_slot;
  if (s.has != NULL && !*s.has)
    {
      if (value != NULL)
        *value = 0.0;
      return FALSE;
    }
  if (value != NULL)
    *value = v;
  return TRUE;
}

/* The "present" flags say whether a group of optional keys was given. */
static void
update_presence (SwDesign *d, SwDesignField f, guint i)
{
  SwStagePropulsion *p = &d->stages[i].propulsion;
  SwStageReliability *r = &d->stages[i].reliability;
  SwDesignAscent *a = &d->ascent;

  switch (f)
    {
    case SW_FIELD_THRUST_VAC:
    case SW_FIELD_ENGINE_THRUST_VAC:
    case SW_FIELD_DIAMETER:
    case SW_FIELD_COAST:
      sw_propulsion_update_present (p);
      break;
    case SW_FIELD_ENGINE_COUNT:
    case SW_FIELD_ENGINE_RELIABILITY:
    case SW_FIELD_FAILURES_TOLERATED:
    case SW_FIELD_IGNITION_RELIABILITY:
    case SW_FIELD_SEPARATION_RELIABILITY:
      r->present = r->has_engine_count || r->has_engine_reliability || r->has_failures_tolerated
                   || r->has_ignition_reliability || r->has_separation_reliability;
      break;
    case SW_FIELD_FAIRING_MASS:
    case SW_FIELD_FAIRING_ALTITUDE:
    case SW_FIELD_FAIRING_PRESSURE:
    case SW_FIELD_PITCH_OVER_SPEED:
    case SW_FIELD_PITCH_KICK:
    case SW_FIELD_INSERTION_ALTITUDE:
    case SW_FIELD_MAX_Q_ALPHA:
      a->present = a->has_fairing_mass || a->has_fairing_altitude || a->has_fairing_pressure
                   || a->has_pitch_over_speed || a->has_pitch_kick
                   || a->has_insertion_altitude || a->has_max_q_alpha;
      break;
    case SW_FIELD_MC_SAMPLES:
    case SW_FIELD_MC_SEED:
      if (d->uncertainty.has_samples || d->uncertainty.has_seed)
        d->uncertainty.present = TRUE;
      break;
    default:
      break;
    }
}

static void
store (SwDesign *d, SwDesignField f, guint i, double value, gboolean given)
{
  Slot s = slot_of (d, f, i);

  /* Boosters from none: the other keys start from plausible values. */
  if (f == SW_FIELD_BOOSTER_COUNT && d->boosters.count == 0 && value > 0.0
      && !sw_limit_contains (SW_LIMIT_ISP_VAC, d->boosters.isp_vac_s))
    sw_boosters_init_default (&d->boosters);
  if (s.has != NULL)
    *s.has = given;
  if (!given)
    value = 0.0;
  if (s.slot != NULL)
    *s.slot = value;
  else if (s.uint_slot != NULL)
    *s.uint_slot = (guint) value;
  else
    *s.u32_slot = (guint32) value;
  /* A left-out sample count or seed reads as its default, as the loader has it. */
  if (!given && f == SW_FIELD_MC_SAMPLES)
    d->uncertainty.samples = SW_UNCERTAINTY_DEFAULT_SAMPLES;
  if (!given && f == SW_FIELD_MC_SEED)
    d->uncertainty.seed = SW_UNCERTAINTY_DEFAULT_SEED;
  update_presence (d, f, i);
}

static gboolean
check_range (SwDesignField f, guint i, double value, GError **error)
{
  const SwLimit *l = sw_limit_get (fields[f].limit);
  g_autofree char *path = sw_design_field_dup_path (f, i);

  if (!isfinite (value))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_NOT_FINITE, _("%s: the value is not a finite number"),
                   path);
      return FALSE;
    }
  if (!sw_limit_contains (fields[f].limit, value))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: %g is outside the accepted range %s%.10g to %.10g%s%s"), path, value,
                   l->min_exclusive ? _("above ") : "", l->min, l->max, l->unit[0] ? " " : "",
                   l->unit);
      return FALSE;
    }
  if (fields[f].whole && value != floor (value))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE, _("%s: %g is not a whole number"), path,
                   value);
      return FALSE;
    }
  return TRUE;
}

/* The rules between keys: a conflict is an error that says which key to
 * change first. */
static gboolean
check_dependencies (const SwDesign *d, SwDesignField f, guint i, double value, GError **error)
{
  const SwStage *st = &d->stages[i];
  g_autofree char *path = sw_design_field_dup_path (f, i);

  if (is_booster_field (f) && f != SW_FIELD_BOOSTER_COUNT && d->boosters.count == 0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("%s: the design has no boosters; set boosters.count first"), path);
      return FALSE;
    }
  switch (f)
    {
    case SW_FIELD_BOOSTER_ISP_VAC:
      if (d->boosters.has_isp_sl && value < d->boosters.isp_sl_s)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: %g s is below the boosters' sea-level Isp of %g s; lower the "
                         "sea-level Isp first"), path, value, d->boosters.isp_sl_s);
          return FALSE;
        }
      break;
    case SW_FIELD_BOOSTER_ISP_SL:
      if (value > d->boosters.isp_vac_s)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: %g s is above the boosters' vacuum Isp of %g s; the sea-level Isp "
                         "lies between 0 and the vacuum Isp"), path, value,
                       d->boosters.isp_vac_s);
          return FALSE;
        }
      break;
    case SW_FIELD_BOOSTER_OXIDIZER_DENSITY:
    case SW_FIELD_BOOSTER_FUEL_DENSITY:
      if (d->boosters.propellant.kind != SW_PROPELLANT_CUSTOM)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the component densities belong to a propellant of your own; "
                         "choose one first"), path);
          return FALSE;
        }
      break;
    case SW_FIELD_BOOSTER_MIXTURE_RATIO:
      if (d->boosters.propellant.kind == SW_PROPELLANT_NONE
          || d->boosters.propellant.kind == SW_PROPELLANT_SOLID_COMPOSITE)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: a mixture ratio needs a liquid propellant; choose one first"),
                       path);
          return FALSE;
        }
      break;
    case SW_FIELD_ISP_VAC:
      if (st->has_isp_sl && value < st->isp_sl_s)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: %g s is below the stage's sea-level Isp of %g s; lower the "
                         "sea-level Isp first"), path, value, st->isp_sl_s);
          return FALSE;
        }
      break;
    case SW_FIELD_ISP_SL:
      if (value > st->isp_vac_s)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: %g s is above the stage's vacuum Isp of %g s; the sea-level Isp "
                         "lies between 0 and the vacuum Isp"), path, value, st->isp_vac_s);
          return FALSE;
        }
      break;
    case SW_FIELD_THRUST_VAC:
      if (st->propulsion.has_engine_thrust)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the stage's thrust is given per engine (engine_thrust_vac_kn); "
                         "give it once"), path);
          return FALSE;
        }
      break;
    case SW_FIELD_ENGINE_THRUST_VAC:
      if (st->propulsion.has_thrust)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the stage's thrust is given as a total (thrust_vac_kn); give it "
                         "once"), path);
          return FALSE;
        }
      if (!st->reliability.has_engine_count)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                       _("%s: a thrust per engine needs the engine count; set it first"), path);
          return FALSE;
        }
      break;
    case SW_FIELD_COAST:
      if (i == 0 && value > 0.0)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the first stage lifts off; a coast before ignition belongs to an "
                         "upper stage"), path);
          return FALSE;
        }
      break;
    case SW_FIELD_ENGINE_COUNT:
      if (st->reliability.has_failures_tolerated && st->reliability.failures_tolerated >= value)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: %g engines cannot tolerate %u engine failures; lower the "
                         "failures tolerated first"), path, value,
                       st->reliability.failures_tolerated);
          return FALSE;
        }
      break;
    case SW_FIELD_FAILURES_TOLERATED:
      {
        guint n = st->reliability.has_engine_count ? st->reliability.engine_count : 1;
        if (value >= n)
          {
            g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                         _("%s: %g failures tolerated needs more than %g engines; the stage has "
                           "%u"), path, value, value, n);
            return FALSE;
          }
      }
      break;
    case SW_FIELD_OXIDIZER_DENSITY:
    case SW_FIELD_FUEL_DENSITY:
      if (st->propellant.kind != SW_PROPELLANT_CUSTOM)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the component densities belong to a propellant of your own; "
                         "choose one first"), path);
          return FALSE;
        }
      break;
    case SW_FIELD_MIXTURE_RATIO:
      if (st->propellant.kind == SW_PROPELLANT_NONE
          || st->propellant.kind == SW_PROPELLANT_SOLID_COMPOSITE)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: a mixture ratio needs a liquid propellant; choose one first"),
                       path);
          return FALSE;
        }
      break;
    case SW_FIELD_FAIRING_ALTITUDE:
      if (d->ascent.has_fairing_pressure)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the fairing is dropped at a dynamic pressure; give one rule"),
                       path);
          return FALSE;
        }
      break;
    case SW_FIELD_FAIRING_PRESSURE:
      if (d->ascent.has_fairing_altitude)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                       _("%s: the fairing is dropped at an altitude; give one rule"), path);
          return FALSE;
        }
      break;
    case SW_FIELD_FAIRING_MASS:
      if (value > 0.0 && !d->ascent.has_fairing_altitude && !d->ascent.has_fairing_pressure)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                       _("%s: a fairing needs a rule for dropping it; give the jettison "
                         "altitude or dynamic pressure first"), path);
          return FALSE;
        }
      break;
    default:
      break;
    }
  return TRUE;
}

/* The edit on a copy must give a design the loader accepts (a rule between
 * keys this file does not know of, such as inclination against latitude). */
static gboolean
check_whole_design (const SwDesign *edited, GError **error)
{
  g_autoptr (GError) local = NULL;
  const char *prefix = "(design): ";

  if (sw_design_validate (edited, NULL, &local))
    return TRUE;
  g_set_error_literal (error, local->domain, local->code,
                       g_str_has_prefix (local->message, prefix)
                       ? local->message + strlen (prefix) : local->message);
  return FALSE;
}

static gboolean
apply_checked (SwDesign *design, SwDesignField field, guint stage, double value, gboolean given,
               GError **error)
{
  g_autoptr (SwDesign) copy = sw_design_copy (design);

  store (copy, field, stage, value, given);
  if (!check_whole_design (copy, error))
    return FALSE;
  store (design, field, stage, value, given);
  return TRUE;
}

static gboolean
check_stage (const SwDesign *design, SwDesignField field, guint stage, GError **error)
{
  if (!fields[field].per_stage || stage < design->n_stages)
    return TRUE;
  g_set_error (error, SW_ERROR, SW_ERROR_USAGE, _("stages[%u]: the design has %u stages"), stage,
               design->n_stages);
  return FALSE;
}

gboolean
sw_design_field_set (SwDesign *design, SwDesignField field, guint stage, double value,
                     GError **error)
{
  g_return_val_if_fail (design != NULL && field < SW_N_FIELDS, FALSE);

  if (!fields[field].per_stage)
    stage = 0;
  return check_stage (design, field, stage, error)
         && check_range (field, stage, value, error)
         && check_dependencies (design, field, stage, value, error)
         && apply_checked (design, field, stage, value, TRUE, error);
}

gboolean
sw_design_set_propellant (SwDesign *design, guint stage, SwPropellantKind kind, GError **error)
{
  g_autoptr (SwDesign) copy = NULL;

  g_return_val_if_fail (design != NULL && kind < SW_N_PROPELLANTS, FALSE);

  if (stage >= design->n_stages)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE, _("stages[%u]: the design has %u stages"),
                   stage, design->n_stages);
      return FALSE;
    }
  if (design->stages[stage].propellant.kind == kind)
    return TRUE;
  copy = sw_design_copy (design);
  sw_propellant_set_kind (&copy->stages[stage].propellant, kind);
  if (!check_whole_design (copy, error))
    return FALSE;
  sw_propellant_set_kind (&design->stages[stage].propellant, kind);
  return TRUE;
}

gboolean
sw_design_field_unset (SwDesign *design, SwDesignField field, guint stage, GError **error)
{
  g_autofree char *path = NULL;

  g_return_val_if_fail (design != NULL && field < SW_N_FIELDS, FALSE);

  if (!fields[field].per_stage)
    stage = 0;
  if (!check_stage (design, field, stage, error))
    return FALSE;
  path = sw_design_field_dup_path (field, stage);
  if (!fields[field].optional)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING, _("%s: required; it cannot be left out"),
                   path);
      return FALSE;
    }
  if (field == SW_FIELD_ENGINE_COUNT && design->stages[stage].reliability.has_failures_tolerated
      && design->stages[stage].reliability.failures_tolerated > 0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: without it the stage has one engine, which cannot tolerate engine "
                     "failures; clear the failures tolerated first"), path);
      return FALSE;
    }
  if (field == SW_FIELD_ENGINE_COUNT && design->stages[stage].propulsion.has_engine_thrust)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: the stage's thrust is given per engine; give it as a total first"),
                   path);
      return FALSE;
    }
  if ((field == SW_FIELD_FAIRING_ALTITUDE || field == SW_FIELD_FAIRING_PRESSURE)
      && design->ascent.has_fairing_mass && design->ascent.fairing_mass_kg > 0.0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("%s: the fairing needs a rule for dropping it; set its mass to 0 first"),
                   path);
      return FALSE;
    }
  return apply_checked (design, field, stage, 0.0, FALSE, error);
}

/* ---- boosters ---------------------------------------------------------- */

static gboolean
check_has_boosters (const SwDesign *design, const char *key, GError **error)
{
  if (design->boosters.count > 0)
    return TRUE;
  g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
               _("boosters.%s: the design has no boosters; set boosters.count first"), key);
  return FALSE;
}

gboolean
sw_design_set_booster_crossfeed (SwDesign *design, gboolean crossfeed, GError **error)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_has_boosters (design, "crossfeed", error))
    return FALSE;
  design->boosters.crossfeed = crossfeed != FALSE;
  return TRUE;
}

gboolean
sw_design_set_booster_propellant (SwDesign *design, SwPropellantKind kind, GError **error)
{
  g_autoptr (SwDesign) copy = NULL;

  g_return_val_if_fail (design != NULL && kind < SW_N_PROPELLANTS, FALSE);
  if (!check_has_boosters (design, "propellant", error))
    return FALSE;
  if (design->boosters.propellant.kind == kind)
    return TRUE;
  copy = sw_design_copy (design);
  sw_propellant_set_kind (&copy->boosters.propellant, kind);
  if (!check_whole_design (copy, error))
    return FALSE;
  sw_propellant_set_kind (&design->boosters.propellant, kind);
  return TRUE;
}

/* ---- texts ------------------------------------------------------------- */

static gboolean
check_text (const char *path, const char *text, double max_bytes, GError **error)
{
  if (!g_utf8_validate (text, -1, NULL))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE, _("%s: the text is not valid UTF-8"), path);
      return FALSE;
    }
  if ((double) strlen (text) > max_bytes)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: %lu bytes is longer than the %.0f bytes accepted"), path,
                   (unsigned long) strlen (text), max_bytes);
      return FALSE;
    }
  return TRUE;
}

gboolean
sw_design_field_set_name (SwDesign *design, const char *name, GError **error)
{
  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (!check_text ("name", name, sw_limit_get (SW_LIMIT_NAME_LENGTH)->max, error))
    return FALSE;
  g_strlcpy (design->name, name, sizeof design->name);
  return TRUE;
}

gboolean
sw_design_field_set_stage_name (SwDesign *design, guint stage, const char *name, GError **error)
{
  g_autofree char *path = g_strdup_printf ("stages[%u].name", stage);

  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (!check_stage (design, SW_FIELD_ISP_VAC, stage, error)
      || !check_text (path, name, sw_limit_get (SW_LIMIT_NAME_LENGTH)->max, error))
    return FALSE;
  g_strlcpy (design->stages[stage].name, name, sizeof design->stages[stage].name);
  return TRUE;
}

gboolean
sw_design_set_booster_name (SwDesign *design, const char *name, GError **error)
{
  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (!check_has_boosters (design, "name", error)
      || !check_text ("boosters.name", name, sw_limit_get (SW_LIMIT_NAME_LENGTH)->max, error))
    return FALSE;
  memset (design->boosters.name, 0, sizeof design->boosters.name);
  g_strlcpy (design->boosters.name, name, sizeof design->boosters.name);
  return TRUE;
}

gboolean
sw_design_set_notes_checked (SwDesign *design, const char *notes, GError **error)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (notes != NULL
      && !check_text ("notes", notes, sw_limit_get (SW_LIMIT_NOTES_LENGTH)->max, error))
    return FALSE;
  sw_design_set_notes (design, notes != NULL && notes[0] != '\0' ? notes : NULL);
  return TRUE;
}

gboolean
sw_design_set_thrust (SwDesign *design, guint stage, gboolean per_engine, double thrust_kn,
                      GError **error)
{
  g_autoptr (SwDesign) copy = NULL;
  SwDesignField field = per_engine ? SW_FIELD_ENGINE_THRUST_VAC : SW_FIELD_THRUST_VAC;

  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_stage (design, field, stage, error))
    return FALSE;
  copy = sw_design_copy (design);
  if (!sw_design_field_unset (copy, SW_FIELD_THRUST_VAC, stage, error)
      || !sw_design_field_unset (copy, SW_FIELD_ENGINE_THRUST_VAC, stage, error)
      || (!isnan (thrust_kn) && !sw_design_field_set (copy, field, stage, thrust_kn, error)))
    return FALSE;
  design->stages[stage].propulsion = copy->stages[stage].propulsion;
  return TRUE;
}

gboolean
sw_design_set_fairing_rule (SwDesign *design, gboolean by_pressure, double value,
                            GError **error)
{
  g_autoptr (SwDesign) copy = NULL;
  SwDesignField field = by_pressure ? SW_FIELD_FAIRING_PRESSURE : SW_FIELD_FAIRING_ALTITUDE;
  SwDesignField other = by_pressure ? SW_FIELD_FAIRING_ALTITUDE : SW_FIELD_FAIRING_PRESSURE;

  g_return_val_if_fail (design != NULL, FALSE);
  if (isnan (value))
    {
      copy = sw_design_copy (design);
      if (!sw_design_field_unset (copy, other, 0, error)
          || !sw_design_field_unset (copy, field, 0, error))
        return FALSE;
      design->ascent = copy->ascent;
      return TRUE;
    }
  if (!check_range (field, 0, value, error))
    return FALSE;
  copy = sw_design_copy (design);
  store (copy, other, 0, 0.0, FALSE);
  store (copy, field, 0, value, TRUE);
  if (!check_whole_design (copy, error))
    return FALSE;
  design->ascent = copy->ascent;
  return TRUE;
}

gboolean
sw_design_set_loss_model (SwDesign *design, SwLossModel model, GError **error)
{
  g_autoptr (SwDesign) copy = NULL;

  g_return_val_if_fail (design != NULL, FALSE);
  if (model == SW_LOSS_SIMULATE && design->mission.kind != SW_MISSION_ORBIT)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("mission.loss_model: simulated losses need a circular-orbit mission; a "
                     "delta-v target already includes its losses"));
      return FALSE;
    }
  copy = sw_design_copy (design);
  copy->mission.loss_model = model;
  if (!check_whole_design (copy, error))
    return FALSE;
  design->mission.loss_model = model;
  return TRUE;
}

/* ---- the drag table ---------------------------------------------------- */

static gboolean
parse_number (const char *text, double *value)
{
  g_autofree char *t = g_strstrip (g_strdelimit (g_strdup (text), ",", '.'));
  char *end = NULL;

  if (t[0] == '\0' || strspn (t, "0123456789.eE+-") != strlen (t))
    return FALSE;
  *value = g_ascii_strtod (t, &end);
  return end != NULL && *end == '\0' && isfinite (*value);
}

gboolean
sw_design_set_drag_text (SwDesign *design, guint stage, const char *text, GError **error)
{
  g_autofree char *path = g_strdup_printf ("stages[%u].drag_coefficients", stage);
  g_auto (GStrv) pairs = NULL;
  g_autoptr (SwDesign) copy = NULL;
  SwStagePropulsion *p;
  guint n = 0;

  g_return_val_if_fail (design != NULL && text != NULL, FALSE);
  if (!check_stage (design, SW_FIELD_ISP_VAC, stage, error))
    return FALSE;
  copy = sw_design_copy (design);
  p = &copy->stages[stage].propulsion;
  memset (p->drag_mach, 0, sizeof p->drag_mach);
  memset (p->drag_cd, 0, sizeof p->drag_cd);
  pairs = g_regex_split_simple ("[;\\n]", text, 0, 0);
  for (guint k = 0; pairs[k] != NULL; k++)
    {
      g_auto (GStrv) parts = NULL;
      double mach, cd;

      g_strstrip (pairs[k]);
      if (pairs[k][0] == '\0')
        continue;
      parts = g_strsplit (pairs[k], ":", -1);
      if (g_strv_length (parts) != 2 || !parse_number (parts[0], &mach)
          || !parse_number (parts[1], &cd))
        {
          g_set_error (error, SW_ERROR, SW_ERROR_SYNTAX,
                       _("%s: \"%s\" is not a mach:cd pair; write pairs such as 0.8:0.35, "
                         "separated by ';'"), path, pairs[k]);
          return FALSE;
        }
      if (n >= (guint) sw_limit_get (SW_LIMIT_DRAG_POINTS)->max)
        {
          g_set_error (error, SW_ERROR, SW_ERROR_RANGE, _("%s: more than %g points"), path,
                       sw_limit_get (SW_LIMIT_DRAG_POINTS)->max);
          return FALSE;
        }
      p->drag_mach[n] = mach;
      p->drag_cd[n] = cd;
      n++;
    }
  p->n_drag = n;
  sw_propulsion_update_present (p);
  if (!check_whole_design (copy, error))
    return FALSE;
  design->stages[stage].propulsion = *p;
  return TRUE;
}

char *
sw_design_dup_drag_text (const SwDesign *design, guint stage, char decimal_mark)
{
  const SwStagePropulsion *p;
  GString *s = g_string_new (NULL);

  g_return_val_if_fail (design != NULL && stage < design->n_stages, g_string_free (s, FALSE));
  p = &design->stages[stage].propulsion;
  for (guint k = 0; k < p->n_drag; k++)
    {
      char m[G_ASCII_DTOSTR_BUF_SIZE], c[G_ASCII_DTOSTR_BUF_SIZE];

      g_ascii_formatd (m, sizeof m, "%.6g", p->drag_mach[k]);
      g_ascii_formatd (c, sizeof c, "%.6g", p->drag_cd[k]);
      if (decimal_mark != '.')
        {
          g_strdelimit (m, ".", decimal_mark);
          g_strdelimit (c, ".", decimal_mark);
        }
      g_string_append_printf (s, "%s%s:%s", k > 0 ? "; " : "", m, c);
    }
  return g_string_free (s, FALSE);
}

/* ---- uncertainty spreads ----------------------------------------------- */

gboolean
sw_design_set_spread (SwDesign *design, guint which, SwSpreadKind kind, double width,
                      GError **error)
{
  g_autoptr (SwDesign) copy = NULL;
  SwSpread *s;

  g_return_val_if_fail (design != NULL && which < 3, FALSE);
  copy = sw_design_copy (design);
  s = which == 0 ? &copy->uncertainty.isp
      : which == 1 ? &copy->uncertainty.structural_coefficient : &copy->uncertainty.losses;
  s->kind = kind;
  s->width = kind == SW_SPREAD_NONE ? 0.0 : width;
  copy->uncertainty.present = TRUE;
  if (!check_whole_design (copy, error))
    return FALSE;
  design->uncertainty = copy->uncertainty;
  return TRUE;
}

/* ---- the custom propellant's name -------------------------------------- */

static gboolean
is_blank (const char *text)
{
  for (; *text != '\0'; text++)
    if (!g_ascii_isspace (*text))
      return FALSE;
  return TRUE;
}

static gboolean
check_value (const char *path, SwLimitId limit, double value, gboolean whole, GError **error)
{
  const SwLimit *l = sw_limit_get (limit);

  if (!isfinite (value))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_NOT_FINITE, _("%s: the value is not a finite number"),
                   path);
      return FALSE;
    }
  if (!sw_limit_contains (limit, value))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: %g is outside the accepted range %s%.10g to %.10g%s%s"), path, value,
                   l->min_exclusive ? _("above ") : "", l->min, l->max, l->unit[0] ? " " : "",
                   l->unit);
      return FALSE;
    }
  if (whole && value != floor (value))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE, _("%s: %g is not a whole number"), path,
                   value);
      return FALSE;
    }
  return TRUE;
}

/* The name of @prop, a propellant of the user's own, at @path. */
static gboolean
set_own_propellant_name (SwStagePropellant *prop, const char *path, const char *name,
                         GError **error)
{
  if (prop->kind != SW_PROPELLANT_CUSTOM)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: only a propellant of your own has a name to edit"), path);
      return FALSE;
    }
  if (!check_text (path, name, sw_limit_get (SW_LIMIT_PROPELLANT_NAME_LENGTH)->max, error))
    return FALSE;
  if (is_blank (name))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("%s: a propellant's name takes 1 to %d bytes"), path,
                   (int) sw_limit_get (SW_LIMIT_PROPELLANT_NAME_LENGTH)->max);
      return FALSE;
    }
  memset (prop->custom_name, 0, sizeof prop->custom_name);
  g_strlcpy (prop->custom_name, name, sizeof prop->custom_name);
  return TRUE;
}

gboolean
sw_design_set_propellant_name (SwDesign *design, guint stage, const char *name, GError **error)
{
  g_autofree char *path = g_strdup_printf ("stages[%u].propellant.name", stage);

  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (stage >= design->n_stages)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_USAGE, _("stages[%u]: the design has %u stages"),
                   stage, design->n_stages);
      return FALSE;
    }
  return set_own_propellant_name (&design->stages[stage].propellant, path, name, error);
}

gboolean
sw_design_set_booster_propellant_name (SwDesign *design, const char *name, GError **error)
{
  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (!check_has_boosters (design, "propellant.name", error))
    return FALSE;
  return set_own_propellant_name (&design->boosters.propellant, "boosters.propellant.name", name,
                                  error);
}

/* ---- economics: engine types and developed stages ---------------------- */

static gboolean
check_engine_type (const SwDesign *design, guint index, GError **error)
{
  if (index < design->economics.n_engine_types)
    return TRUE;
  g_set_error (error, SW_ERROR, SW_ERROR_USAGE,
               _("economics.engine_types[%u]: the design has %u engine types"), index,
               design->economics.n_engine_types);
  return FALSE;
}

static gboolean
check_econ_stage (const SwDesign *design, const char *path, guint stage, GError **error)
{
  if (stage < design->n_stages)
    return TRUE;
  g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
               _("%s: stage %u is not a stage of the design (it has %u, numbered from 0)"),
               path, stage, design->n_stages);
  return FALSE;
}

static gboolean
engine_name_taken (const SwEconomics *e, const char *name, int except)
{
  for (guint i = 0; i < e->n_engine_types; i++)
    if ((int) i != except && g_strcmp0 (e->engine_types[i].name, name) == 0)
      return TRUE;
  return FALSE;
}

gboolean
sw_design_add_engine_type (SwDesign *design, GError **error)
{
  SwEconomics *e;
  SwEngineType *t;

  g_return_val_if_fail (design != NULL, FALSE);
  e = &design->economics;
  if (e->n_engine_types >= SW_ECONOMICS_MAX_ENGINE_TYPES
      || !sw_limit_contains (SW_LIMIT_ENGINE_TYPES, e->n_engine_types + 1))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_RANGE,
                   _("economics.engine_types: at most %.0f engine types (%s)"),
                   sw_limit_get (SW_LIMIT_ENGINE_TYPES)->max,
                   sw_limit_get (SW_LIMIT_ENGINE_TYPES)->why);
      return FALSE;
    }
  t = &e->engine_types[e->n_engine_types];
  memset (t, 0, sizeof *t);
  for (guint n = e->n_engine_types + 1;; n++)
    {
      /* Translators: the name a new engine type starts with; %u counts from 1 */
      g_snprintf (t->name, sizeof t->name, _("Engine %u"), n);
      if (!engine_name_taken (e, t->name, -1))
        break;
    }
  /* A starting value the user replaces: the cost relationships need a mass. */
  t->dry_mass_kg = SW_ENGINE_TYPE_DEFAULT_DRY_MASS_KG;
  e->n_engine_types++;
  e->present = TRUE;
  return TRUE;
}

gboolean
sw_design_remove_engine_type (SwDesign *design, guint index, GError **error)
{
  SwEconomics *e;

  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_engine_type (design, index, error))
    return FALSE;
  e = &design->economics;
  memmove (&e->engine_types[index], &e->engine_types[index + 1],
           (e->n_engine_types - index - 1) * sizeof e->engine_types[0]);
  e->n_engine_types--;
  memset (&e->engine_types[e->n_engine_types], 0, sizeof e->engine_types[0]);
  return TRUE;
}

gboolean
sw_design_rename_engine_type (SwDesign *design, guint index, const char *name, GError **error)
{
  g_autofree char *path = g_strdup_printf ("economics.engine_types[%u].name", index);
  SwEngineType *t;

  g_return_val_if_fail (design != NULL && name != NULL, FALSE);
  if (!check_engine_type (design, index, error)
      || !check_text (path, name, sizeof design->economics.engine_types[0].name - 1, error))
    return FALSE;
  if (is_blank (name))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE, _("%s: an engine type needs a name"), path);
      return FALSE;
    }
  if (engine_name_taken (&design->economics, name, (int) index))
    {
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: another engine type is already called \"%s\""), path, name);
      return FALSE;
    }
  t = &design->economics.engine_types[index];
  memset (t->name, 0, sizeof t->name);
  g_strlcpy (t->name, name, sizeof t->name);
  return TRUE;
}

gboolean
sw_design_set_engine_type_dry_mass (SwDesign *design, guint index, double kg, GError **error)
{
  g_autofree char *path = g_strdup_printf ("economics.engine_types[%u].dry_mass_kg", index);

  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_engine_type (design, index, error)
      || !check_value (path, SW_LIMIT_ENGINE_DRY_MASS, kg, FALSE, error))
    return FALSE;
  design->economics.engine_types[index].dry_mass_kg = kg;
  return TRUE;
}

gboolean
sw_design_set_engine_type_on_stage (SwDesign *design, guint index, guint stage, gboolean on,
                                    GError **error)
{
  g_autofree char *path = g_strdup_printf ("economics.engine_types[%u].on_stages", index);
  SwEconomics *e;
  int other;

  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_engine_type (design, index, error)
      || !check_econ_stage (design, path, stage, error))
    return FALSE;
  e = &design->economics;
  other = sw_economics_engine_type_of_stage (e, stage);
  if (on && other >= 0 && (guint) other != index)
    {
      /* Never moved silently from the other type: the user takes it off first. */
      g_set_error (error, SW_ERROR, SW_ERROR_VALUE,
                   _("%s: stage %u already uses engine type \"%s\"; a stage has at most one"),
                   path, stage, e->engine_types[other].name);
      return FALSE;
    }
  if (on)
    e->engine_types[index].stage_mask |= 1u << stage;
  else
    e->engine_types[index].stage_mask &= ~(1u << stage);
  return TRUE;
}

gboolean
sw_design_set_engine_type_developed (SwDesign *design, guint index, gboolean developed,
                                     GError **error)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_engine_type (design, index, error))
    return FALSE;
  design->economics.engine_types[index].developed = developed;
  return TRUE;
}

gboolean
sw_design_set_boosters_developed (SwDesign *design, gboolean developed, GError **error)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (design->boosters.count == 0)
    {
      g_set_error (error, SW_ERROR, SW_ERROR_MISSING,
                   _("economics.developed_boosters: the design has no boosters; set "
                     "boosters.count first"));
      return FALSE;
    }
  design->economics.developed_boosters = developed;
  design->economics.present = TRUE;
  return TRUE;
}

gboolean
sw_design_set_stage_developed (SwDesign *design, guint stage, gboolean developed,
                               GError **error)
{
  g_return_val_if_fail (design != NULL, FALSE);
  if (!check_econ_stage (design, "economics.developed_stages", stage, error))
    return FALSE;
  if (developed)
    design->economics.developed_stages |= 1u << stage;
  else
    design->economics.developed_stages &= ~(1u << stage);
  design->economics.present = TRUE;
  return TRUE;
}
