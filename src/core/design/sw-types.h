/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-types.h: shared enums, constants and forward declarations of the core. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Standard acceleration of gravity, exact by definition (3rd CGPM, 1901). */
#define SW_G0 9.80665
/* WGS 84 defining constants. */
#define SW_WGS84_MU 3.986004418e14      /* m^3/s^2, atmosphere included */
#define SW_WGS84_A 6378137.0            /* m, equatorial radius */
#define SW_WGS84_OMEGA 7.292115e-5      /* rad/s, rotation rate */
/* Sea-level pressure of the 1976 U.S. Standard Atmosphere, Pa (the same
 * value as SW_ATMOSPHERE_P0; the design folder may not include ascent/). */
#define SW_SEA_LEVEL_PRESSURE_PA 101325.0

#define SW_MAX_STAGES 8
/* Bytes of a design or stage name, the terminating NUL included. */
#define SW_NAME_MAX 128
#define SW_SWEEP_CURVES 5
#define SW_SWEEP_POINTS 200

#define SW_DESIGN_FORMAT "stagewright-design"
/* The newest format version this build reads; it writes 1 unless a key of
 * version 2 (sw-propellant.h) is used. */
#define SW_DESIGN_VERSION 2
#define SW_DESIGN_MAX_BYTES (1024 * 1024)
#define SW_DESIGN_MAX_DEPTH 32

typedef enum {
  SW_SPLIT_EQUAL,
  SW_SPLIT_OPTIMAL,
  SW_SPLIT_MANUAL,
} SwSplitMode;

typedef enum {
  SW_MISSION_DELTA_V,
  SW_MISSION_ORBIT,
} SwMissionKind;

/* The ways practitioners state the structural coefficient. */
typedef enum {
  SW_EPS_COEFFICIENT,          /* eps = ms / (ms + mp) */
  SW_EPS_STRUCTURE_RATIO,      /* ms / mp */
  SW_EPS_WET_DRY_RATIO,        /* (ms + mp) / ms */
  SW_EPS_PROPELLANT_FRACTION,  /* mp / (ms + mp) */
} SwEpsForm;

typedef enum {
  SW_ERROR_IO,
  SW_ERROR_TOO_LARGE,
  SW_ERROR_SYNTAX,
  SW_ERROR_NESTING,
  SW_ERROR_FORMAT,
  SW_ERROR_VERSION,
  SW_ERROR_MISSING,
  SW_ERROR_TYPE,
  SW_ERROR_NOT_FINITE,
  SW_ERROR_RANGE,
  SW_ERROR_VALUE,
  SW_ERROR_USAGE,
} SwError;

#define SW_ERROR (sw_error_quark ())
GQuark sw_error_quark (void);

typedef struct _SwDesign SwDesign;
typedef struct _SwStage SwStage;
typedef struct _SwMission SwMission;
typedef struct _SwSizing SwSizing;
typedef struct _SwStageResult SwStageResult;
typedef struct _SwBudget SwBudget;
typedef struct _SwStageCurve SwStageCurve;
typedef struct _SwSweep SwSweep;
typedef struct _SwLimit SwLimit;

const char *sw_split_mode_to_string (SwSplitMode mode);
gboolean    sw_split_mode_from_string (const char *text, SwSplitMode *mode);

G_END_DECLS
