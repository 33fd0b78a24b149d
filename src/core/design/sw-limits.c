/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-limits.h"

#include <math.h>
#include <string.h>

/* The accepted input ranges.  The loader, the GUI's spin buttons and the
 * README's table all read this one table. */
static const SwLimit limits[SW_N_LIMITS] = {
  [SW_LIMIT_PAYLOAD] = { "payload_kg", "kg", 0.1, 1.0e7, FALSE,
    "from a 100 g picosatellite to 10,000 t; beyond that the concept is not a launch vehicle" },
  [SW_LIMIT_DELTA_V] = { "delta_v_m_s", "m/s", 0.0, 30000.0, TRUE,
    "positive; 30 km/s exceeds any chemical multistage mission from the ground" },
  [SW_LIMIT_ALTITUDE] = { "altitude_km", "km", 100.0, 100000.0, FALSE,
    "a circular orbit needs at least 100 km to survive a revolution; 100,000 km covers high orbits" },
  [SW_LIMIT_INCLINATION] = { "inclination_deg", "deg", 0.0, 180.0, FALSE,
    "the full range of inclinations; it must also lie between |latitude| and 180 - |latitude|" },
  [SW_LIMIT_SITE_LATITUDE] = { "site_latitude_deg", "deg", -89.9, 89.9, FALSE,
    "any launch site short of the poles, where the launch azimuth is undefined" },
  [SW_LIMIT_LOSSES] = { "losses_m_s", "m/s", 0.0, 5000.0, FALSE,
    "gravity, drag and steering losses; over 5 km/s no ascent is sensible" },
  [SW_LIMIT_ISP_VAC] = { "isp_vac_s", "s", 50.0, 1000.0, FALSE,
    "cold gas to nuclear-thermal; chemical engines lie between 200 and 470 s" },
  [SW_LIMIT_ISP_SL] = { "isp_sl_s", "s", 0.0, 1000.0, FALSE,
    "0 for a vacuum-only nozzle; never above the stage's vacuum Isp" },
  [SW_LIMIT_STRUCTURAL_COEFFICIENT] = { "structural_coefficient", "", 0.01, 0.6, FALSE,
    "eps = structure/(structure + propellant); below 0.01 no tank survives, above 0.6 it is hardly a stage" },
  [SW_LIMIT_DELTA_V_SHARE] = { "delta_v_share", "", 0.0, 1.0, FALSE,
    "a fraction of the total; manual shares must add up to 1 within 1e-6" },
  [SW_LIMIT_STAGE_COUNT] = { "stages", "", 1.0, SW_MAX_STAGES, FALSE,
    "one to eight stages; more staging events than eight are not a concept worth sizing" },
  [SW_LIMIT_NAME_LENGTH] = { "name", "characters", 0.0, SW_NAME_MAX - 1, FALSE,
    "names are labels, not documents" },
  [SW_LIMIT_NOTES_LENGTH] = { "notes", "characters", 0.0, 65536.0, FALSE,
    "room for a page of notes" },
  [SW_LIMIT_ENGINE_COUNT] = { "engine_count", "", 1.0, 100.0, FALSE,
    "whole number of engines in the stage; clusters beyond 100 are outside concept practice" },
  [SW_LIMIT_ENGINE_RELIABILITY] = { "engine_reliability", "", 0.5, 1.0, FALSE,
    "probability that one engine runs its burn; below 0.5 the stage is not a concept" },
  [SW_LIMIT_ENGINE_FAILURES_TOLERATED] = { "engine_failures_tolerated", "", 0.0, 99.0, FALSE,
    "whole number of engine failures the stage survives; fewer than its engine count" },
  [SW_LIMIT_IGNITION_RELIABILITY] = { "ignition_reliability", "", 0.5, 1.0, FALSE,
    "probability that the stage's start sequence succeeds" },
  [SW_LIMIT_SEPARATION_RELIABILITY] = { "separation_reliability", "", 0.5, 1.0, FALSE,
    "probability that the staging event above this stage succeeds (ignored for the top stage)" },
  [SW_LIMIT_MC_SAMPLES] = { "samples", "", 100.0, 1000000.0, FALSE,
    "whole number; fewer than 100 give no percentiles worth reading, a million is plenty" },
  [SW_LIMIT_MC_SEED] = { "seed", "", 0.0, 4294967295.0, FALSE,
    "whole number that fixes the random stream, so a run can be repeated" },
  [SW_LIMIT_SPREAD_SIGMA_PERCENT] = { "sigma_percent", "%", 0.0, 30.0, FALSE,
    "standard deviation of a normal spread, in percent of the nominal value" },
  [SW_LIMIT_SPREAD_HALF_RANGE_PERCENT] = { "half_range_percent", "%", 0.0, 30.0, FALSE,
    "half width of a uniform spread (nominal plus or minus), in percent of the nominal value" },
  [SW_LIMIT_LOSSES_SIGMA] = { "sigma_m_s", "m/s", 0.0, 2000.0, FALSE,
    "standard deviation of the losses (a normal spread on the required delta-v)" },
  [SW_LIMIT_LOSSES_HALF_RANGE] = { "half_range_m_s", "m/s", 0.0, 2000.0, FALSE,
    "half width of a uniform spread of the losses (plus or minus)" },
  [SW_LIMIT_SENSITIVITY_STEP] = { "step_percent", "%", 0.1, 50.0, FALSE,
    "the plus-or-minus step of the tornado chart, in percent of each nominal value" },
  [SW_LIMIT_THRUST_VAC] = { "thrust_vac_kn", "kN", 0.0, 100000.0, TRUE,
    "total vacuum thrust of the stage; 100 MN is beyond any stage built or studied" },
  [SW_LIMIT_ENGINE_THRUST_VAC] = { "engine_thrust_vac_kn", "kN", 0.0, 20000.0, TRUE,
    "vacuum thrust of one engine (with engine_count); 20 MN covers the largest single chambers" },
  [SW_LIMIT_DIAMETER] = { "diameter_m", "m", 0.1, 30.0, FALSE,
    "outer diameter, the drag reference area; from a sounding-rocket tube to a super-heavy core" },
  [SW_LIMIT_DRAG_POINTS] = { "drag_coefficients", "points", 1.0, 32.0, FALSE,
    "a list of [mach, cd] pairs, Mach increasing; without it a generic slender-vehicle table is used" },
  [SW_LIMIT_DRAG_MACH] = { "mach", "", 0.0, 50.0, FALSE,
    "Mach number of a drag_coefficients point; the coefficient is held constant beyond the table" },
  [SW_LIMIT_DRAG_CD] = { "cd", "", 0.0, 5.0, TRUE,
    "axial drag coefficient on the stage's frontal area; slender vehicles lie between 0.1 and 1" },
  [SW_LIMIT_COAST] = { "coast_before_ignition_s", "s", 0.0, 3600.0, FALSE,
    "unpowered flight from the separation below to this stage's ignition; not for the first stage" },
  [SW_LIMIT_FAIRING_MASS] = { "fairing_mass_kg", "kg", 0.0, 100000.0, FALSE,
    "payload fairing carried on top of the sized vehicle until it is dropped" },
  [SW_LIMIT_FAIRING_ALTITUDE] = { "fairing_jettison_altitude_km", "km", 30.0, 500.0, FALSE,
    "altitude at which the fairing is dropped; common practice is near 100 to 120 km" },
  [SW_LIMIT_FAIRING_DYNAMIC_PRESSURE] = { "fairing_jettison_dynamic_pressure_pa", "Pa", 0.0,
    5000.0, TRUE,
    "the fairing is dropped when the dynamic pressure falls below this value after max-Q" },
  [SW_LIMIT_PITCH_OVER_SPEED] = { "pitch_over_speed_m_s", "m/s", 5.0, 300.0, FALSE,
    "speed relative to the air at which the vertical rise ends and the pitch-over begins" },
  [SW_LIMIT_PITCH_KICK] = { "pitch_kick_deg", "deg", 0.0, 45.0, TRUE,
    "tilt of the thrust at the pitch-over; left out, the solver picks the one that costs least delta-v" },
  [SW_LIMIT_INSERTION_ALTITUDE] = { "insertion_altitude_km", "km", 100.0, 2000.0, FALSE,
    "perigee of a transfer orbit up to the target, circularised at apogee; left out, direct insertion" },
  [SW_LIMIT_MAX_Q_ALPHA] = { "max_q_alpha_kpa_deg", "kPa deg", 1.0, 1000.0, FALSE,
    "dynamic pressure times angle of attack the guided flight keeps below; left out, no limit" },
  [SW_LIMIT_WORK_YEAR_COST] = { "work_year_cost", "money", 0.0, 1.0e8, TRUE,
    "cost of one work-year in the user's currency, to turn work-years into money; left out, work-years only" },
  [SW_LIMIT_PRODUCTION_RUN] = { "production_run", "vehicles", 1.0, 10000.0, FALSE,
    "whole number of vehicles built, over which the learning curve runs" },
  [SW_LIMIT_LEARNING_RATE] = { "learning_rate", "", 0.5, 1.0, FALSE,
    "unit cost falls to this fraction at each doubling of the units built; 1 means no learning" },
  [SW_LIMIT_CER_STAGE_DEV_FACTOR] = { "stage_development_factor", "work-years", 0.0, 1.0e5, TRUE,
    "a in a M^x, development effort of a stage from its dry mass M in kg" },
  [SW_LIMIT_CER_STAGE_DEV_EXPONENT] = { "stage_development_exponent", "", 0.1, 1.5, FALSE,
    "x in a M^x, stage development; below 1, larger stages cost less per kilogram" },
  [SW_LIMIT_CER_STAGE_UNIT_FACTOR] = { "stage_unit_factor", "work-years", 0.0, 1.0e4, TRUE,
    "b in b M^y, first-unit production effort of a stage from its dry mass M in kg" },
  [SW_LIMIT_CER_STAGE_UNIT_EXPONENT] = { "stage_unit_exponent", "", 0.1, 1.5, FALSE,
    "y in b M^y, first-unit production of a stage" },
  [SW_LIMIT_CER_ENGINE_DEV_FACTOR] = { "engine_development_factor", "work-years", 0.0, 1.0e5, TRUE,
    "a in a M^x, development effort of an engine from its dry mass M in kg" },
  [SW_LIMIT_CER_ENGINE_DEV_EXPONENT] = { "engine_development_exponent", "", 0.1, 1.5, FALSE,
    "x in a M^x, engine development" },
  [SW_LIMIT_CER_ENGINE_UNIT_FACTOR] = { "engine_unit_factor", "work-years", 0.0, 1.0e4, TRUE,
    "b in b M^y, first-unit production effort of an engine from its dry mass M in kg" },
  [SW_LIMIT_CER_ENGINE_UNIT_EXPONENT] = { "engine_unit_exponent", "", 0.1, 1.5, FALSE,
    "y in b M^y, first-unit production of an engine" },
  [SW_LIMIT_CER_SYSTEMS_BASE] = { "systems_factor_per_stage", "", 1.0, 1.5, FALSE,
    "f0 = this to the power of the stage count: systems engineering and integration effort" },
  [SW_LIMIT_ENGINE_TYPES] = { "engine_types", "entries", 0.0, SW_MAX_STAGES, FALSE,
    "one entry per engine design; at most one per stage" },
  [SW_LIMIT_ENGINE_DRY_MASS] = { "dry_mass_kg", "kg", 0.0, 100000.0, TRUE,
    "dry mass of one engine of the type, the input of the engine's cost relationships" },
  [SW_LIMIT_ECON_STAGE_INDEX] = { "on_stages", "", 0.0, SW_MAX_STAGES - 1, FALSE,
    "0-based stage index (stages[0] lifts off); it must name a stage of the design" },
  [SW_LIMIT_ENGINE_MASS_FRACTION] = { "engine_mass_fraction", "", 0.0, 0.9, FALSE,
    "engines' share of a stage's dry mass, for a stage without an engine type; from memory, 0.25" },
  [SW_LIMIT_RECOVERY_DELTA_V] = { "recovery_delta_v_m_s", "m/s", 0.0, 5000.0, FALSE,
    "delta-v the recovered first stage keeps for its return; left out, 950 (downrange) or 2750 (launch site), from memory" },
  [SW_LIMIT_BOOSTER_RECOVERY_DELTA_V] = { "booster_recovery_delta_v_m_s", "m/s", 0.0, 5000.0,
    FALSE,
    "delta-v each recovered strap-on booster keeps for its return; left out, the first stage's defaults, 950 (downrange) or 2750 (launch site), from memory" },
  [SW_LIMIT_LANDING_HARDWARE] = { "landing_hardware_fraction", "", 0.0, 1.0, FALSE,
    "legs, fins and their structure as a fraction of the stage's dry mass; from memory, 0.1" },
  [SW_LIMIT_REFURBISHMENT] = { "refurbishment_fraction", "", 0.0, 1.0, FALSE,
    "cost of readying a recovered stage for its next flight, as a fraction of its first-unit cost" },
  [SW_LIMIT_FLIGHTS_PER_STAGE] = { "flights_per_stage", "flights", 1.0, 1000.0, FALSE,
    "whole number of flights one recovered stage makes before it is retired" },
  [SW_LIMIT_DECISION_WEIGHT] = { "decision_weights", "", 0.0, 100.0, FALSE,
    "weight of a criterion in the stage-count decision; 0 leaves it out" },
  [SW_LIMIT_CURRENCY_LENGTH] = { "currency", "characters", 0.0, 16.0, FALSE,
    "label printed beside money (\"kEUR\", \"M$\"); no line breaks or tabs; left out, \"money units\"" },
  [SW_LIMIT_PROPELLANT_LOAD] = { "propellant_kg", "kg", 0.0, 1.0e7, TRUE,
    "a fixed propellant load: the stage is not sized; 10,000 t is beyond any stage built or studied" },
  [SW_LIMIT_MIXTURE_RATIO] = { "mixture_ratio", "", 0.0, 20.0, TRUE,
    "oxidizer over fuel by mass; liquid pairs run from about 1.6 to 6 (Sutton, from memory)" },
  [SW_LIMIT_ULLAGE] = { "ullage_fraction", "", 0.0, 0.5, FALSE,
    "tank volume beyond the propellant's, as a fraction of it; 0.02 to 0.05 is common practice" },
  [SW_LIMIT_COMPONENT_DENSITY] = { "oxidizer_density_kg_m3", "kg/m^3", 10.0, 5000.0, FALSE,
    "density of a propellant component (also fuel_density_kg_m3); liquid hydrogen is about 71, N2O4 about 1441" },
  [SW_LIMIT_PROPELLANT_NAME_LENGTH] = { "propellant.name", "bytes", 1.0, 63.0,
    FALSE, "the name of a propellant of the user's own: a label for the tables and the sheet" },
  [SW_LIMIT_BOOSTER_COUNT] = { "count", "", 0.0, 12.0, FALSE,
    "whole number of strap-on boosters; 0 is no boosters; more than 12 around one core is not a concept we size" },
};

const SwLimit *
sw_limit_get (SwLimitId id)
{
  g_return_val_if_fail (id < SW_N_LIMITS, NULL);
  return &limits[id];
}

gboolean
sw_limit_contains (SwLimitId id, double value)
{
  const SwLimit *l = sw_limit_get (id);

  if (l == NULL || !isfinite (value))
    return FALSE;
  if (l->min_exclusive ? !(value > l->min) : !(value >= l->min))
    return FALSE;
  return value <= l->max;
}

/* Where each limit applies, as the README shows it: the JSON path of the
 * key in a design file ([] stands for any stage or point). */
static const char *const limit_fields[SW_N_LIMITS] = {
  [SW_LIMIT_PAYLOAD] = "`payload_kg`",
  [SW_LIMIT_DELTA_V] = "`mission.delta_v_m_s`",
  [SW_LIMIT_ALTITUDE] = "`mission.orbit.altitude_km`",
  [SW_LIMIT_INCLINATION] = "`mission.orbit.inclination_deg`",
  [SW_LIMIT_SITE_LATITUDE] = "`mission.orbit.site_latitude_deg`",
  [SW_LIMIT_LOSSES] = "`mission.losses_m_s`",
  [SW_LIMIT_ISP_VAC] = "`stages[].isp_vac_s`, `boosters.isp_vac_s`",
  [SW_LIMIT_ISP_SL] = "`stages[].isp_sl_s`, `boosters.isp_sl_s`",
  [SW_LIMIT_STRUCTURAL_COEFFICIENT] = "`stages[].structural_coefficient`, `boosters.structural_coefficient`",
  [SW_LIMIT_DELTA_V_SHARE] = "`stages[].delta_v_share`",
  [SW_LIMIT_STAGE_COUNT] = "`stages` (entries)",
  [SW_LIMIT_NAME_LENGTH] = "`name`, `stages[].name`",
  [SW_LIMIT_NOTES_LENGTH] = "`notes`",
  [SW_LIMIT_ENGINE_COUNT] = "`stages[].engine_count`",
  [SW_LIMIT_ENGINE_RELIABILITY] = "`stages[].engine_reliability`",
  [SW_LIMIT_ENGINE_FAILURES_TOLERATED] = "`stages[].engine_failures_tolerated`",
  [SW_LIMIT_IGNITION_RELIABILITY] = "`stages[].ignition_reliability`",
  [SW_LIMIT_SEPARATION_RELIABILITY] = "`stages[].separation_reliability`",
  [SW_LIMIT_MC_SAMPLES] = "`uncertainty.samples`",
  [SW_LIMIT_MC_SEED] = "`uncertainty.seed`",
  [SW_LIMIT_SPREAD_SIGMA_PERCENT] = "`uncertainty.isp_vac.sigma_percent`, "
                                    "`uncertainty.structural_coefficient.sigma_percent`",
  [SW_LIMIT_SPREAD_HALF_RANGE_PERCENT] = "`uncertainty.isp_vac.half_range_percent`, "
                                         "`uncertainty.structural_coefficient.half_range_percent`",
  [SW_LIMIT_LOSSES_SIGMA] = "`uncertainty.losses.sigma_m_s`",
  [SW_LIMIT_LOSSES_HALF_RANGE] = "`uncertainty.losses.half_range_m_s`",
  [SW_LIMIT_SENSITIVITY_STEP] = "`stagewright-cli sensitivity --step` (`step_percent`)",
  [SW_LIMIT_THRUST_VAC] = "`stages[].thrust_vac_kn`, `boosters.thrust_vac_kn` (per booster)",
  [SW_LIMIT_ENGINE_THRUST_VAC] = "`stages[].engine_thrust_vac_kn`",
  [SW_LIMIT_DIAMETER] = "`stages[].diameter_m`, `boosters.diameter_m`",
  [SW_LIMIT_DRAG_POINTS] = "`stages[].drag_coefficients` (pairs)",
  [SW_LIMIT_DRAG_MACH] = "`stages[].drag_coefficients[][0]` (mach)",
  [SW_LIMIT_DRAG_CD] = "`stages[].drag_coefficients[][1]` (cd)",
  [SW_LIMIT_COAST] = "`stages[].coast_before_ignition_s`",
  [SW_LIMIT_FAIRING_MASS] = "`ascent.fairing_mass_kg`",
  [SW_LIMIT_FAIRING_ALTITUDE] = "`ascent.fairing_jettison_altitude_km`",
  [SW_LIMIT_FAIRING_DYNAMIC_PRESSURE] = "`ascent.fairing_jettison_dynamic_pressure_pa`",
  [SW_LIMIT_PITCH_OVER_SPEED] = "`ascent.pitch_over_speed_m_s`",
  [SW_LIMIT_PITCH_KICK] = "`ascent.pitch_kick_deg`",
  [SW_LIMIT_INSERTION_ALTITUDE] = "`ascent.insertion_altitude_km`",
  [SW_LIMIT_MAX_Q_ALPHA] = "`ascent.max_q_alpha_kpa_deg`",
  [SW_LIMIT_WORK_YEAR_COST] = "`economics.work_year_cost`",
  [SW_LIMIT_PRODUCTION_RUN] = "`economics.production_run`",
  [SW_LIMIT_LEARNING_RATE] = "`economics.learning_rate`",
  [SW_LIMIT_CER_STAGE_DEV_FACTOR] = "`economics.cost_coefficients.stage_development_factor`",
  [SW_LIMIT_CER_STAGE_DEV_EXPONENT] = "`economics.cost_coefficients.stage_development_exponent`",
  [SW_LIMIT_CER_STAGE_UNIT_FACTOR] = "`economics.cost_coefficients.stage_unit_factor`",
  [SW_LIMIT_CER_STAGE_UNIT_EXPONENT] = "`economics.cost_coefficients.stage_unit_exponent`",
  [SW_LIMIT_CER_ENGINE_DEV_FACTOR] = "`economics.cost_coefficients.engine_development_factor`",
  [SW_LIMIT_CER_ENGINE_DEV_EXPONENT] = "`economics.cost_coefficients.engine_development_exponent`",
  [SW_LIMIT_CER_ENGINE_UNIT_FACTOR] = "`economics.cost_coefficients.engine_unit_factor`",
  [SW_LIMIT_CER_ENGINE_UNIT_EXPONENT] = "`economics.cost_coefficients.engine_unit_exponent`",
  [SW_LIMIT_CER_SYSTEMS_BASE] = "`economics.cost_coefficients.systems_factor_per_stage`",
  [SW_LIMIT_ENGINE_TYPES] = "`economics.engine_types` (entries)",
  [SW_LIMIT_ENGINE_DRY_MASS] = "`economics.engine_types[].dry_mass_kg`",
  [SW_LIMIT_ECON_STAGE_INDEX] = "`economics.engine_types[].on_stages[]`, `economics.developed_stages[]`",
  [SW_LIMIT_ENGINE_MASS_FRACTION] = "`economics.engine_mass_fraction`",
  [SW_LIMIT_RECOVERY_DELTA_V] = "`economics.recovery.recovery_delta_v_m_s`",
  [SW_LIMIT_BOOSTER_RECOVERY_DELTA_V] = "`economics.recovery.booster_recovery_delta_v_m_s`",
  [SW_LIMIT_LANDING_HARDWARE] = "`economics.recovery.landing_hardware_fraction`",
  [SW_LIMIT_REFURBISHMENT] = "`economics.recovery.refurbishment_fraction`",
  [SW_LIMIT_FLIGHTS_PER_STAGE] = "`economics.recovery.flights_per_stage`",
  [SW_LIMIT_DECISION_WEIGHT] = "`economics.decision_weights` (`liftoff_mass`, `development`, `cost_per_flight`, `failure`)",
  [SW_LIMIT_CURRENCY_LENGTH] = "`economics.currency`",
  [SW_LIMIT_PROPELLANT_LOAD] = "`stages[].propellant_kg`, `boosters.propellant_kg` (per booster)",
  [SW_LIMIT_MIXTURE_RATIO] = "`stages[].mixture_ratio`, `stages[].propellant.mixture_ratio`, `boosters.mixture_ratio`",
  [SW_LIMIT_ULLAGE] = "`stages[].ullage_fraction`, `boosters.ullage_fraction`",
  [SW_LIMIT_COMPONENT_DENSITY] = "`stages[].propellant.oxidizer_density_kg_m3`, `stages[].propellant.fuel_density_kg_m3` (and the same under `boosters.propellant`)",
  [SW_LIMIT_PROPELLANT_NAME_LENGTH] = "`stages[].propellant.name`, `boosters.propellant.name`",
  [SW_LIMIT_BOOSTER_COUNT] = "`boosters.count`",
};

/* A bound as the README shows it: up to ten significant digits, thousands
 * grouped with commas ("10,000,000"). */
static void
append_bound (GString *s, double value)
{
  g_autofree char *text = g_strdup_printf ("%.10g", value);
  const char *digits = text + (text[0] == '-');
  size_t int_len = strspn (digits, "0123456789");

  if (strchr (text, 'e') != NULL || int_len <= 4)
    {
      g_string_append (s, text);
      return;
    }
  g_string_append_len (s, text, digits - text);
  for (size_t i = 0; i < int_len; i++)
    {
      if (i > 0 && (int_len - i) % 3 == 0)
        g_string_append_c (s, ',');
      g_string_append_c (s, digits[i]);
    }
  g_string_append (s, digits + int_len);
}

char *
sw_limits_dup_markdown (void)
{
  GString *s = g_string_new ("| field | unit | range | why |\n|---|---|---|---|\n");

  for (guint i = 0; i < SW_N_LIMITS; i++)
    {
      const SwLimit *l = &limits[i];
      /* A '|' in the text would end the cell: escape it as markdown does. */
      g_auto (GStrv) parts = g_strsplit (l->why, "|", -1);
      g_autofree char *why = g_strjoinv ("\\|", parts);

      g_string_append_printf (s, "| %s | %s | %s", limit_fields[i],
                              l->unit[0] ? l->unit : "-", l->min_exclusive ? "above " : "");
      append_bound (s, l->min);
      g_string_append (s, " to ");
      append_bound (s, l->max);
      g_string_append_printf (s, " | %s |\n", why);
    }
  return g_string_free (s, FALSE);
}
