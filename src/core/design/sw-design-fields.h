/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-design-fields.h: one named edit per key of the design file, for the
 * window's fields.  Each setter checks the value against the limits table
 * (sw-limits.c) and against the keys it depends on, and on failure leaves
 * the design as it was and returns an error that names the key's JSON path
 * and the accepted range.  A setter never changes another key as a side
 * effect: a conflict (a sea-level Isp above the vacuum Isp, more engine
 * failures tolerated than engines) is an error, not a silent fix. */
#pragma once

#include "sw-design.h"
#include "sw-limits.h"
#include "sw-types.h"

G_BEGIN_DECLS

/* The numeric keys.  Keys of a stage take the stage's index. */
typedef enum {
  SW_FIELD_PAYLOAD,
  SW_FIELD_DELTA_V,
  SW_FIELD_ALTITUDE,
  SW_FIELD_INCLINATION,
  SW_FIELD_SITE_LATITUDE,
  SW_FIELD_LOSSES,
  /* per stage */
  SW_FIELD_ISP_VAC,
  SW_FIELD_ISP_SL,                    /* optional */
  SW_FIELD_STRUCTURAL_COEFFICIENT,
  SW_FIELD_THRUST_VAC,                /* optional */
  SW_FIELD_ENGINE_THRUST_VAC,         /* optional */
  SW_FIELD_DIAMETER,                  /* optional */
  SW_FIELD_COAST,                     /* optional */
  SW_FIELD_ENGINE_COUNT,              /* optional, whole */
  SW_FIELD_ENGINE_RELIABILITY,        /* optional */
  SW_FIELD_FAILURES_TOLERATED,        /* optional, whole */
  SW_FIELD_IGNITION_RELIABILITY,      /* optional */
  SW_FIELD_SEPARATION_RELIABILITY,    /* optional */
  /* the "ascent" object */
  SW_FIELD_FAIRING_MASS,              /* optional */
  SW_FIELD_FAIRING_ALTITUDE,          /* optional */
  SW_FIELD_FAIRING_PRESSURE,          /* optional */
  SW_FIELD_PITCH_OVER_SPEED,          /* optional */
  SW_FIELD_PITCH_KICK,                /* optional */
  SW_FIELD_INSERTION_ALTITUDE,        /* optional */
  SW_FIELD_MAX_Q_ALPHA,               /* optional */
  /* the "uncertainty" object */
  SW_FIELD_MC_SAMPLES,                /* optional, whole */
  SW_FIELD_MC_SEED,                   /* optional, whole */
  /* per stage, format version 2 (sw-propellant.h) */
  SW_FIELD_PROPELLANT_LOAD,           /* optional: a fixed load */
  SW_FIELD_MIXTURE_RATIO,             /* optional: overrides the propellant's */
  SW_FIELD_ULLAGE,                    /* optional */
  SW_FIELD_OXIDIZER_DENSITY,          /* a propellant of the user's own only */
  SW_FIELD_FUEL_DENSITY,              /* a propellant of the user's own only */
  /* the "boosters" object (sw-boosters.h); every one but the count needs
   * boosters (count > 0) */
  SW_FIELD_BOOSTER_COUNT,             /* whole; 0 to SW_BOOSTERS_MAX */
  SW_FIELD_BOOSTER_ISP_VAC,
  SW_FIELD_BOOSTER_ISP_SL,            /* optional */
  SW_FIELD_BOOSTER_STRUCTURAL_COEFFICIENT,
  SW_FIELD_BOOSTER_THRUST_VAC,        /* per booster */
  SW_FIELD_BOOSTER_PROPELLANT_LOAD,   /* optional: a fixed load per booster */
  SW_FIELD_BOOSTER_DIAMETER,          /* optional */
  SW_FIELD_BOOSTER_MIXTURE_RATIO,     /* optional */
  SW_FIELD_BOOSTER_ULLAGE,            /* optional */
  SW_FIELD_BOOSTER_OXIDIZER_DENSITY,  /* a propellant of the user's own only */
  SW_FIELD_BOOSTER_FUEL_DENSITY,      /* a propellant of the user's own only */
  SW_N_FIELDS
} SwDesignField;

typedef struct {
  const char *path;       /* JSON path, "%u" for the stage index */
  SwLimitId   limit;
  gboolean    per_stage;
  gboolean    optional;   /* may be left out of the file */
  gboolean    whole;      /* whole numbers only */
} SwDesignFieldInfo;

const SwDesignFieldInfo *sw_design_field_info (SwDesignField field);
/* "stages[1].isp_vac_s", "payload_kg", ... */
char     *sw_design_field_dup_path (SwDesignField field, guint stage);

/* The value in the design; FALSE (and *value 0) when an optional key is
 * left out. */
gboolean  sw_design_field_get (const SwDesign *design, SwDesignField field, guint stage,
                               double *value);
/* Sets the key to @value.  FALSE, the design unchanged and @error set when
 * @value is out of range, not whole where it must be, or conflicts with
 * another key. */
gboolean  sw_design_field_set (SwDesign *design, SwDesignField field, guint stage,
                               double value, GError **error);
/* Leaves an optional key out (the model's default applies).  FALSE with
 * @error for a required key or when leaving it out conflicts. */
gboolean  sw_design_field_unset (SwDesign *design, SwDesignField field, guint stage,
                                 GError **error);

/* Texts.  Name and stage name: at most SW_NAME_MAX - 1 bytes; notes: the
 * notes limit.  Text that is too long is an error, never cut. */
gboolean  sw_design_field_set_name (SwDesign *design, const char *name, GError **error);
gboolean  sw_design_field_set_stage_name (SwDesign *design, guint stage, const char *name,
                                    GError **error);
gboolean  sw_design_set_notes_checked (SwDesign *design, const char *notes, GError **error);

/* The stage's thrust as a total (thrust_vac_kn) or per engine
 * (engine_thrust_vac_kn, with engine_count given), replacing the other
 * form: the two are one quantity.  NAN leaves the thrust out. */
gboolean  sw_design_set_thrust (SwDesign *design, guint stage, gboolean per_engine,
                                double thrust_kn, GError **error);
/* The fairing's jettison rule: an altitude (km) or, with @by_pressure, a
 * dynamic pressure (Pa), replacing the other rule.  NAN leaves both out
 * (refused while the fairing has mass). */
gboolean  sw_design_set_fairing_rule (SwDesign *design, gboolean by_pressure, double value,
                                      GError **error);

/* "stages[i].propellant": a catalogue propellant, one of the user's own
 * (starting from the densities and mixture ratio of the one it replaces) or
 * none.  Refused when the stage's mixture ratio cannot go with it (a solid). */
gboolean  sw_design_set_propellant (SwDesign *design, guint stage, SwPropellantKind kind,
                                    GError **error);

/* The boosters' keys that are not one number.  Each needs boosters
 * (boosters.count above 0); setting the count from 0 gives the other keys
 * starting values (sw_boosters_init_default) when they hold none. */
gboolean  sw_design_set_booster_name (SwDesign *design, const char *name, GError **error);
gboolean  sw_design_set_booster_crossfeed (SwDesign *design, gboolean crossfeed, GError **error);
gboolean  sw_design_set_booster_propellant (SwDesign *design, SwPropellantKind kind,
                                            GError **error);

/* "mission.loss_model": simulate needs an orbit mission. */
gboolean  sw_design_set_loss_model (SwDesign *design, SwLossModel model, GError **error);

/* A stage's drag table as text: "mach:cd" pairs separated by ';' or line
 * breaks, a '.' or ',' as the decimal mark ("0:0.30; 1.1:0.55").  Empty
 * text leaves the key out (the generic table). */
gboolean  sw_design_set_drag_text (SwDesign *design, guint stage, const char *text,
                                   GError **error);
/* The table as such text with @decimal_mark ('.' or ','); "" for none. */
char     *sw_design_dup_drag_text (const SwDesign *design, guint stage, char decimal_mark);

/* One spread of the "uncertainty" object: @which 0 Isp, 1 structural
 * coefficient, 2 losses.  Kind none takes width 0. */
gboolean  sw_design_set_spread (SwDesign *design, guint which, SwSpreadKind kind,
                                double width, GError **error);

/* "stages[i].propellant.name" of a propellant of the user's own: 1 to 63
 * bytes of UTF-8, not blank.  Refused for a catalogue propellant. */
gboolean  sw_design_set_propellant_name (SwDesign *design, guint stage, const char *name,
                                         GError **error);
/* "boosters.propellant.name": the same for the boosters (which they need). */
gboolean  sw_design_set_booster_propellant_name (SwDesign *design, const char *name,
                                                 GError **error);

/* The "economics" object's lists.  Each refuses (FALSE, design unchanged,
 * @error naming the key) an index out of range; none changes another key. */
#define SW_ENGINE_TYPE_DEFAULT_DRY_MASS_KG 1000.0
/* Appends an engine type "Engine N" (a name no other type has) of
 * SW_ENGINE_TYPE_DEFAULT_DRY_MASS_KG, on no stage, not developed. */
gboolean  sw_design_add_engine_type (SwDesign *design, GError **error);
gboolean  sw_design_remove_engine_type (SwDesign *design, guint index, GError **error);
/* Not blank, at most SW_NAME_MAX - 1 bytes, not another type's name. */
gboolean  sw_design_rename_engine_type (SwDesign *design, guint index, const char *name,
                                        GError **error);
gboolean  sw_design_set_engine_type_dry_mass (SwDesign *design, guint index, double kg,
                                              GError **error);
/* Puts the type on stage @stage or takes it off.  A stage already using
 * another type is a conflict (refused), never moved over silently. */
gboolean  sw_design_set_engine_type_on_stage (SwDesign *design, guint index, guint stage,
                                              gboolean on, GError **error);
gboolean  sw_design_set_engine_type_developed (SwDesign *design, guint index,
                                               gboolean developed, GError **error);
/* "economics.developed_stages": stage @stage already developed or not. */
/* "economics.developed_boosters": the boosters and their engine already
 * developed (refused without boosters). */
gboolean  sw_design_set_boosters_developed (SwDesign *design, gboolean developed,
                                            GError **error);
gboolean  sw_design_set_stage_developed (SwDesign *design, guint stage, gboolean developed,
                                         GError **error);

G_END_DECLS
