/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-inspector.h: the panel where the mission, the split and the stages are
 * edited.  Every edit goes to the document as one undoable step; the
 * computed values it shows come from the last SwAnalysis. */
#pragma once

#include <gtk/gtk.h>

#include "sw-document.h"
#include "sw-number-field.h"
#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_TYPE_INSPECTOR (sw_inspector_get_type ())
G_DECLARE_FINAL_TYPE (SwInspector, sw_inspector, SW, INSPECTOR, GtkWidget)

GtkWidget *sw_inspector_new (void);
void       sw_inspector_set_document (SwInspector *self, SwDocument *document);
void       sw_inspector_set_result (SwInspector *self, SwAnalysis *result);
void       sw_inspector_set_settings (SwInspector *self, GSettings *settings);
/* Property "selected-stage": -1 for none. */
void       sw_inspector_set_selected (SwInspector *self, int stage);
int        sw_inspector_get_selected (SwInspector *self);
/* The first-start note: the design shown is an unsaved demonstration copy,
 * with a New button. */
void       sw_inspector_set_intro (SwInspector *self, gboolean shown);

/* Widget actions: stage.add, stage.duplicate, stage.remove, stage.move-up,
 * stage.move-down. */

/* For tests: the input widgets. */
typedef enum {
  SW_INSPECTOR_PAYLOAD,        /* SwNumberField, kg */
  SW_INSPECTOR_MISSION_KIND,   /* GtkDropDown: 0 delta-v, 1 orbit */
  SW_INSPECTOR_DELTA_V,        /* SwNumberField, m/s */
  SW_INSPECTOR_ALTITUDE,
  SW_INSPECTOR_INCLINATION,
  SW_INSPECTOR_LATITUDE,
  SW_INSPECTOR_LOSSES,
  SW_INSPECTOR_IDEAL_LABEL,    /* GtkLabel */
  SW_INSPECTOR_STAGE_LIST,     /* GtkListBox */
  SW_INSPECTOR_STAGE_NAME,     /* GtkEntry */
  SW_INSPECTOR_ISP_VAC,        /* SwNumberField, s */
  SW_INSPECTOR_ISP_SL,
  SW_INSPECTOR_EPS_FORM,       /* GtkDropDown, SwEpsForm order */
  SW_INSPECTOR_EPS,            /* SwNumberField, in the chosen form */
  SW_INSPECTOR_SHARE,          /* SwNumberField, percent */
  SW_INSPECTOR_SHARE_SCALE,    /* GtkScale, percent */
  SW_INSPECTOR_NOTES,          /* GtkTextView */
  SW_INSPECTOR_INTRO,          /* GtkBox: what a first start opened, and New */
  SW_INSPECTOR_LOSS_MODEL,     /* GtkDropDown: 0 allowance, 1 simulate */
  SW_INSPECTOR_THRUST,         /* SwNumberField, kN, total */
  SW_INSPECTOR_ENGINE_THRUST,  /* SwNumberField, kN, per engine */
  SW_INSPECTOR_ENGINE_COUNT,
  SW_INSPECTOR_TW,             /* SwNumberField: T/W at ignition, sets the thrust */
  SW_INSPECTOR_DIAMETER,
  SW_INSPECTOR_COAST,
  SW_INSPECTOR_DRAG,           /* GtkEntry: mach:cd pairs */
  SW_INSPECTOR_ENGINE_RELIABILITY,
  SW_INSPECTOR_FAILURES_TOLERATED,
  SW_INSPECTOR_IGNITION_RELIABILITY,
  SW_INSPECTOR_SEPARATION_RELIABILITY,
  SW_INSPECTOR_FAIRING_MASS,
  SW_INSPECTOR_FAIRING_ALTITUDE,
  SW_INSPECTOR_FAIRING_PRESSURE,
  SW_INSPECTOR_PITCH_OVER_SPEED,
  SW_INSPECTOR_PITCH_KICK,
  SW_INSPECTOR_INSERTION_ALTITUDE,
  SW_INSPECTOR_MAX_Q_ALPHA,
  SW_INSPECTOR_PROPELLANT,     /* GtkDropDown, SwPropellantKind order */
  SW_INSPECTOR_PROPELLANT_LOAD,
  SW_INSPECTOR_MIXTURE_RATIO,
  SW_INSPECTOR_ULLAGE,
  SW_INSPECTOR_OXIDIZER_DENSITY,
  SW_INSPECTOR_FUEL_DENSITY,
  SW_INSPECTOR_TANKS_LABEL,    /* GtkLabel: the selected stage's tanks and length */
  SW_INSPECTOR_PROPELLANT_NAME,  /* GtkEntry: a propellant of the user's own */
  /* the strap-on boosters (design level) */
  SW_INSPECTOR_BOOSTER_COUNT,          /* SwNumberField, whole; 0: none */
  SW_INSPECTOR_BOOSTER_NAME,           /* GtkEntry */
  SW_INSPECTOR_BOOSTER_ISP_VAC,
  SW_INSPECTOR_BOOSTER_ISP_SL,
  SW_INSPECTOR_BOOSTER_EPS,            /* structural coefficient */
  SW_INSPECTOR_BOOSTER_THRUST,         /* kN per booster */
  SW_INSPECTOR_BOOSTER_PROPELLANT_LOAD,
  SW_INSPECTOR_BOOSTER_DIAMETER,
  SW_INSPECTOR_BOOSTER_CROSSFEED,      /* GtkCheckButton */
  SW_INSPECTOR_BOOSTER_PROPELLANT,     /* GtkDropDown, SwPropellantKind order */
  SW_INSPECTOR_BOOSTER_PROPELLANT_NAME, /* GtkEntry: the boosters' own propellant */
  SW_INSPECTOR_BOOSTER_MIXTURE_RATIO,
  SW_INSPECTOR_BOOSTER_ULLAGE,
  SW_INSPECTOR_BOOSTER_OXIDIZER_DENSITY,
  SW_INSPECTOR_BOOSTER_FUEL_DENSITY,
  SW_INSPECTOR_N_FIELDS
} SwInspectorField;

GtkWidget *sw_inspector_get_field (SwInspector *self, SwInspectorField field);

G_END_DECLS
