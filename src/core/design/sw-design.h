/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-design.h: the design model and its file format (JSON, ".stagewright").
 *
 * A design is plain data (no GObject) so that the GUI can hand a copy to the
 * solver thread and keep copies for undo; only the notes and the baseline are
 * heap-allocated.  Stages are in firing order: stages[0] lifts off. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-boosters.h"
#include "sw-economics.h"
#include "sw-propellant.h"
#include "sw-propulsion.h"
#include "sw-stage-reliability.h"
#include "sw-uncertainty.h"
#include "sw-types.h"

G_BEGIN_DECLS

struct _SwStage {
  char     name[SW_NAME_MAX];
  double   isp_vac_s;
  double   isp_sl_s;               /* valid when has_isp_sl */
  gboolean has_isp_sl;
  double   structural_coefficient; /* eps = ms / (ms + mp) */
  double   delta_v_share;          /* valid when has_share; required for manual */
  gboolean has_share;
  SwStagePropulsion  propulsion;   /* optional keys of the ascent model */
  SwStageReliability reliability;  /* optional keys of the reliability model */
  SwStagePropellant  propellant;   /* optional keys of format version 2 */
};

typedef enum {
  SW_LOSS_ALLOWANCE,               /* losses_m_s as given */
  SW_LOSS_SIMULATE,                /* losses from the ascent simulation */
} SwLossModel;

struct _SwMission {
  SwMissionKind kind;
  SwLossModel loss_model;          /* orbit missions only */
  double delta_v_m_s;              /* SW_MISSION_DELTA_V */
  double altitude_km;              /* SW_MISSION_ORBIT ... */
  double inclination_deg;
  double site_latitude_deg;
  double losses_m_s;
  gboolean has_losses;
};

struct _SwDesign {
  char        name[SW_NAME_MAX];
  char       *notes;               /* owned, may be NULL */
  double      payload_kg;
  SwMission   mission;
  SwSplitMode split;
  guint       n_stages;
  SwStage     stages[SW_MAX_STAGES];
  SwDesignAscent ascent;           /* optional design-level ascent keys */
  SwUncertainty uncertainty;       /* optional Monte Carlo spreads */
  SwEconomics economics;           /* optional cost, reuse and decision keys */
  SwBoosters  boosters;            /* optional strap-on boosters (count 0: none) */
  SwDesign   *baseline;            /* owned, may be NULL: a pinned earlier design */
};

SwDesign *sw_design_new (void);
SwDesign *sw_design_new_default (void);
SwDesign *sw_design_copy (const SwDesign *design);
void      sw_design_free (SwDesign *design);
gboolean  sw_design_equal (const SwDesign *a, const SwDesign *b);
void      sw_design_set_notes (SwDesign *design, const char *notes);

/* A stage with plausible defaults, for "add stage" in the GUI. */
void      sw_stage_init_default (SwStage *stage, guint index);

/* Loading.  @filename is used in messages only for the _data variant.
 * @warnings (may be NULL) receives owned strings for unknown keys. */
SwDesign *sw_design_load (const char *filename, GPtrArray *warnings, GError **error);
SwDesign *sw_design_load_data (const char *data, gssize length, const char *filename,
                               GPtrArray *warnings, GError **error);
SwDesign *sw_design_from_json (JsonNode *root, const char *filename,
                               GPtrArray *warnings, GError **error);

/* Full validation of a design in memory (the loader calls this too). */
gboolean  sw_design_validate (const SwDesign *design, const char *filename, GError **error);

/* Saving: atomic (temporary file in the same folder, fsync, rename). */
char     *sw_design_to_data (const SwDesign *design, gsize *length);
JsonNode *sw_design_to_json (const SwDesign *design);
gboolean  sw_design_save (const SwDesign *design, const char *filename, GError **error);

/* The delta-v the vehicle must deliver: the mission's target, or for an orbit
 * mission the ideal delta-v from the budget plus the losses. */
gboolean  sw_design_required_delta_v (const SwDesign *design, double *delta_v_m_s, GError **error);

/* The delta-v budget of the design's orbit mission (an error for a
 * delta-v mission). */
gboolean  sw_design_budget (const SwDesign *design, SwBudget *out, GError **error);

/* The edits the GUI makes are in sw-design-edit.h. */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwDesign, sw_design_free)

G_END_DECLS
