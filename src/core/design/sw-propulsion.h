/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-propulsion.h: optional per-stage propulsion and aerodynamics keys, the
 * design-level ascent settings (the "ascent" object), and what follows from
 * them: thrust and Isp against ambient pressure, mass flow, burn time,
 * thrust-to-weight at ignition, drag coefficient against Mach number.
 *
 * Stage keys (all optional; the ascent simulation needs thrust on every stage
 * that fires, and isp_sl_s and diameter_m on the first):
 *   thrust_vac_kn               total vacuum thrust, or
 *   engine_thrust_vac_kn        vacuum thrust of one engine, times engine_count
 *                               (engine_count belongs to the reliability keys)
 *   diameter_m                  drag reference diameter; upper stages without
 *                               one take the diameter of the stage below
 *   drag_coefficients           [[mach, cd], ...], Mach increasing
 *   coast_before_ignition_s     unpowered flight before ignition (not stage 1)
 * Design keys, object "ascent":
 *   fairing_mass_kg, fairing_jettison_altitude_km or
 *   fairing_jettison_dynamic_pressure_pa, pitch_over_speed_m_s, pitch_kick_deg,
 *   insertion_altitude_km (fly to a transfer orbit with this perigee and the
 *   target as apogee, circularise there; left out: direct insertion),
 *   max_q_alpha_kpa_deg (the guided flight keeps dynamic pressure times angle
 *   of attack below it) */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-types.h"

G_BEGIN_DECLS

#define SW_DRAG_TABLE_MAX 32
/* Defaults of the guidance keys. */
#define SW_PITCH_OVER_SPEED_DEFAULT 50.0   /* m/s, common practice */

typedef struct {
  double   thrust_vac_kn;                  /* valid when has_thrust */
  double   engine_thrust_vac_kn;           /* valid when has_engine_thrust */
  double   diameter_m;                     /* valid when has_diameter */
  double   coast_before_ignition_s;        /* 0 when not given */
  double   drag_mach[SW_DRAG_TABLE_MAX];   /* n_drag points, increasing */
  double   drag_cd[SW_DRAG_TABLE_MAX];
  guint    n_drag;                         /* 0: the generic table */
  gboolean present;                        /* any propulsion key was given */
  gboolean has_thrust;
  gboolean has_engine_thrust;
  gboolean has_diameter;
  gboolean has_coast;
} SwStagePropulsion;

typedef struct {
  double   fairing_mass_kg;                      /* 0 when not given */
  double   fairing_jettison_altitude_km;         /* valid when has_fairing_altitude */
  double   fairing_jettison_dynamic_pressure_pa; /* valid when has_fairing_pressure */
  double   pitch_over_speed_m_s;                 /* valid when has_pitch_over_speed */
  double   pitch_kick_deg;                       /* valid when has_pitch_kick */
  double   insertion_altitude_km;                /* valid when has_insertion_altitude */
  double   max_q_alpha_kpa_deg;                  /* valid when has_max_q_alpha */
  gboolean present;                              /* the "ascent" object was given */
  gboolean has_fairing_mass;
  gboolean has_fairing_altitude;
  gboolean has_fairing_pressure;
  gboolean has_pitch_over_speed;
  gboolean has_pitch_kick;
  gboolean has_insertion_altitude;
  gboolean has_max_q_alpha;
  /* Not a key of the file (never loaded or saved): where a flown ascent
   * dropped the fairing, for the sizing of the closed loop's vehicle
   * (sw-sizing.h, SwFairingCarry; set on working copies only). */
  gboolean has_flown_fairing;
  guint    flown_fairing_stage;
  double   flown_fairing_fraction;
} SwDesignAscent;

extern const char *const sw_propulsion_stage_keys[];
extern const char *const sw_propulsion_design_keys[];
extern const char *const sw_propulsion_ascent_keys[];

gboolean sw_propulsion_load_stage (JsonObject *obj, const char *file, const char *path,
                                   SwStagePropulsion *prop, GPtrArray *warnings, GError **error);
gboolean sw_propulsion_load_design (JsonObject *root, const char *file,
                                    SwDesignAscent *ascent, GPtrArray *warnings, GError **error);
void     sw_propulsion_save_stage (JsonBuilder *builder, const SwStagePropulsion *prop);
/* Sets @prop's "present" from its keys, after an edit gave or took one. */
void     sw_propulsion_update_present (SwStagePropulsion *prop);
void     sw_propulsion_save_design (JsonBuilder *builder, const SwDesignAscent *ascent);

/* Range and consistency checks of the keys in memory (what the loader checks;
 * for a design the GUI edits).  @path is the stage's JSON path ("stages[1]");
 * @index its firing position. */
gboolean sw_propulsion_validate_stage (const SwStagePropulsion *prop, guint index,
                                       const char *file, const char *path, GError **error);
gboolean sw_propulsion_validate_design (const SwDesignAscent *ascent, const char *file,
                                        GError **error);

/* ---- what follows from the keys ---------------------------------------- */

/* The generic drag table of a slender vehicle (ours, shaped after common
 * practice: flat subsonic, a transonic rise to a peak near Mach 1.1, a slow
 * supersonic decline). */
extern const double sw_drag_default_mach[];
extern const double sw_drag_default_cd[];
extern const guint  sw_drag_default_points;

/* Total vacuum thrust of the stage in N (per-engine thrust times
 * @engine_count, which the caller takes from the reliability keys); NAN when
 * no thrust is given. */
double   sw_stage_thrust_vac_n (const SwStagePropulsion *prop, guint engine_count);
/* Propellant mass flow T_vac / (Isp_vac g0), kg/s. */
double   sw_propulsion_mass_flow (double thrust_vac_n, double isp_vac_s);
/* Isp and thrust at ambient pressure @p_pa, linear between the vacuum and the
 * sea-level values at constant mass flow (the nozzle's back-pressure term
 * p_a A_e is linear in p_a).  Never negative. */
double   sw_propulsion_isp_at (double isp_vac_s, double isp_sl_s, double p_pa);
double   sw_propulsion_thrust_at (double thrust_vac_n, double isp_vac_s, double isp_sl_s,
                                  double p_pa);
/* Drag coefficient at @mach: linear between the points, constant beyond. */
double   sw_propulsion_drag_coefficient (const SwStagePropulsion *prop, double mach);

G_END_DECLS
