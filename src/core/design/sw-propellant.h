/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-propellant.h: the per-stage keys of file format version 2 that say what
 * a stage burns and how much of it is fixed, and what follows from them:
 * bulk density, propellant and tank volumes, tank and stage lengths.
 *
 * Stage keys (all optional):
 *   propellant_kg     a fixed propellant load: the stage is not sized (its
 *                     structure follows from its structural coefficient)
 *   propellant        a catalogue name ("lox-kerosene", "lox-hydrogen",
 *                     "lox-methane", "n2o4-udmh", "n2o4-mmh",
 *                     "solid-composite") or an object { "name",
 *                     "oxidizer_density_kg_m3", "fuel_density_kg_m3",
 *                     "mixture_ratio" } for one of the user's own
 *   mixture_ratio     O/F by mass, overriding the propellant's (not for a
 *                     solid)
 *   ullage_fraction   tank volume over propellant volume, minus 1; default
 *                     0.03 (common practice, 2 to 5 percent; from memory)
 *
 * The shape of a stage (with a propellant and diameter_m): two tanks, oxidizer
 * and fuel, each a cylinder closed by two ellipsoidal domes of aspect ratio
 * sqrt 2 (common practice, from memory), plus an intertank and an engine
 * section (see SW_INTERTANK_* and SW_ENGINE_SECTION_*).  A solid stage has one
 * "tank": the motor case holding the grain. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-types.h"

G_BEGIN_DECLS

/* Defaults and shape rules (common practice, from memory; ours to document). */
#define SW_ULLAGE_DEFAULT 0.03
#define SW_DOME_ASPECT_RATIO G_SQRT2
/* Intertank between the two tanks: a quarter of the diameter. */
#define SW_INTERTANK_PER_DIAMETER 0.25
/* Engine section below the lower tank: 0.6 diameters for a liquid stage
 * (the engines' length, thrust structure), 0.2 for a solid's nozzle skirt. */
#define SW_ENGINE_SECTION_PER_DIAMETER 0.6
#define SW_NOZZLE_SKIRT_PER_DIAMETER 0.2

typedef enum {
  SW_PROPELLANT_NONE,             /* no "propellant" key */
  SW_PROPELLANT_LOX_KEROSENE,
  SW_PROPELLANT_LOX_HYDROGEN,
  SW_PROPELLANT_LOX_METHANE,
  SW_PROPELLANT_N2O4_UDMH,
  SW_PROPELLANT_N2O4_MMH,
  SW_PROPELLANT_SOLID_COMPOSITE,
  SW_PROPELLANT_CUSTOM,           /* the user's object */
  SW_N_PROPELLANTS
} SwPropellantKind;

#define SW_PROPELLANT_NAME_MAX 64

typedef struct {
  double   propellant_kg;                  /* valid when has_propellant_kg */
  SwPropellantKind kind;
  char     custom_name[SW_PROPELLANT_NAME_MAX];  /* CUSTOM: zero-filled past the text */
  double   oxidizer_density_kg_m3;         /* CUSTOM */
  double   fuel_density_kg_m3;             /* CUSTOM */
  double   custom_mixture_ratio;           /* CUSTOM */
  double   mixture_ratio;                  /* override, valid when has_mixture_ratio */
  double   ullage_fraction;                /* valid when has_ullage */
  gboolean has_propellant_kg;
  gboolean has_mixture_ratio;
  gboolean has_ullage;
} SwStagePropellant;

/* One entry of the catalogue. */
typedef struct {
  const char *key;                 /* file name of the propellant */
  const char *label;               /* for people (translated by the caller with _()) */
  double      oxidizer_density_kg_m3;
  double      fuel_density_kg_m3;
  double      mixture_ratio;       /* O/F by mass; 0 for a solid */
  gboolean    solid;
} SwPropellantInfo;

extern const char *const sw_propellant_stage_keys[];

/* The catalogue entry of @kind (NONE and CUSTOM: NULL). */
const SwPropellantInfo *sw_propellant_info (SwPropellantKind kind);
gboolean sw_propellant_kind_from_string (const char *text, SwPropellantKind *kind);

gboolean sw_propellant_load_stage (JsonObject *obj, const char *file, const char *path,
                                   SwStagePropellant *prop, GError **error);
void     sw_propellant_save_stage (JsonBuilder *builder, const SwStagePropellant *prop);
/* Range and consistency checks of the keys in memory. */
gboolean sw_propellant_validate_stage (const SwStagePropellant *prop, const char *file,
                                       const char *path, GError **error);
/* TRUE when any key of this module is given (the file is then version 2). */
gboolean sw_propellant_is_used (const SwStagePropellant *prop);
/* Chooses the propellant, keeping the other keys (a mixture ratio left on a
 * solid is then invalid: the caller validates).  CUSTOM starts from the
 * densities and mixture ratio of the propellant it replaces (LOX/kerosene
 * when there was none). */
void     sw_propellant_set_kind (SwStagePropellant *prop, SwPropellantKind kind);

/* ---- what follows ------------------------------------------------------ */

/* Bulk density rho_o rho_f (1 + r) / (rho_f r + rho_o) (Sutton and Biblarz,
 * Rocket Propulsion Elements, 7th ed., eq. 7-2). */
double   sw_bulk_density (double oxidizer_density, double fuel_density, double mixture_ratio);

/* The component densities and the mixture ratio in effect (the override, or
 * the propellant's own); FALSE without a propellant.  A solid has one
 * component: *mixture_ratio 0 and both densities the grain's. */
gboolean sw_propellant_effective (const SwStagePropellant *prop, double *oxidizer_density,
                                  double *fuel_density, double *mixture_ratio,
                                  gboolean *solid);
double   sw_propellant_ullage (const SwStagePropellant *prop);

/* Length of a tank of volume @volume_m3 and diameter @diameter_m: a cylinder
 * between two ellipsoidal domes of aspect ratio @aspect (dome height R/k,
 * volume (2/3) pi R^3 / k each).  A volume below the two domes' gives a
 * tank of two domes only (the domes' height; the cylinder never negative). */
double   sw_tank_length (double volume_m3, double diameter_m, double aspect);

typedef struct {
  gboolean valid;                   /* a propellant is given */
  gboolean solid;
  gboolean has_length;              /* a diameter is given too */
  double   bulk_density_kg_m3;
  double   oxidizer_mass_kg, fuel_mass_kg;
  double   oxidizer_volume_m3, fuel_volume_m3;   /* propellant only */
  double   propellant_volume_m3;
  double   oxidizer_tank_m3, fuel_tank_m3;       /* ullage included */
  double   tank_volume_m3;
  double   oxidizer_tank_length_m, fuel_tank_length_m;   /* solid: the case in oxidizer_* */
  double   intertank_length_m, engine_section_length_m;
  double   length_m;                /* the stage: tanks + intertank + engine section */
} SwStageShape;

/* The shape of a stage carrying @propellant_mass_kg; @diameter_m NAN when
 * none is known. */
void     sw_stage_shape (const SwStagePropellant *prop, double propellant_mass_kg,
                         double diameter_m, SwStageShape *out);

G_END_DECLS
