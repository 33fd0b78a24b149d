/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-carpet.h: a carpet plot's grid.  Two numeric inputs of the design (an
 * axis each: parameter, range, point count) are varied over a grid: the
 * payload, the mission (delta-v, or the orbit's inclination, the site's
 * latitude and the loss allowance), each stage's vacuum Isp and structural
 * coefficient, the boosters' count, vacuum Isp, structural coefficient,
 * thrust and fixed load (designs with boosters), and for the cost outputs
 * the cost model's numeric keys (production run, learning rate,
 * coefficients, engine share).  The orbit's altitude moves the loss
 * allowance with it: the budget's ideal delta-v is the circular speed at
 * the altitude and the climb is in the allowance, so at another altitude
 * the allowance changes by the climb's energy (sw_payload_climb_m_s(), as
 * the payload curves do); without that a higher orbit would look cheaper.
 * A design with boosters is sized as sw_size_design() sizes it (the
 * parallel vehicle, sw-booster-sizing.h).  At every
 * point the vehicle is sized with the design's split and one output taken:
 * liftoff mass, the payload of a vehicle of the design's own liftoff mass,
 * development effort or cost per flight (work-years, expendable; in money
 * too when the design gives a cost per work-year).  A point
 * whose vehicle does not close is infeasible (value NAN, flag cleared).
 * The design's fixed propellant loads (propellant_kg) are honoured at every
 * point; the payload output then solves for the mass by the secant method.
 * Synchronous; cancellable between rows, with a progress callback per row. */
#pragma once

#include <gio/gio.h>

#include "sw-design.h"
#include "sw-economics.h"
#include "sw-limits.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_CARPET_MAX_POINTS 500

typedef enum {
  SW_CARPET_PARAM_PAYLOAD,            /* payload_kg */
  SW_CARPET_PARAM_DELTA_V,            /* mission.delta_v_m_s (delta-v missions) */
  SW_CARPET_PARAM_LOSSES,             /* mission.losses_m_s */
  SW_CARPET_PARAM_ISP_VAC,            /* stages[i].isp_vac_s */
  SW_CARPET_PARAM_STRUCTURAL_COEFFICIENT, /* stages[i].structural_coefficient */
  SW_CARPET_PARAM_INCLINATION,        /* mission.orbit.inclination_deg (orbit missions) */
  SW_CARPET_PARAM_SITE_LATITUDE,      /* mission.orbit.site_latitude_deg */
  SW_CARPET_PARAM_ECONOMICS,          /* economics.<key> (cost outputs only) */
  SW_CARPET_PARAM_PROPELLANT_LOAD,    /* stages[i].propellant_kg (a stage with a fixed load) */
  SW_CARPET_PARAM_ALTITUDE,           /* mission.orbit.altitude_km (orbit missions); the
                                       * loss allowance moves with the climb's energy */
  SW_CARPET_PARAM_BOOSTER_COUNT,      /* boosters.count (designs with boosters) */
  SW_CARPET_PARAM_BOOSTER_ISP_VAC,    /* boosters.isp_vac_s */
  SW_CARPET_PARAM_BOOSTER_STRUCTURAL_COEFFICIENT, /* boosters.structural_coefficient */
  SW_CARPET_PARAM_BOOSTER_THRUST,     /* boosters.thrust_vac_kn */
  SW_CARPET_PARAM_BOOSTER_PROPELLANT_LOAD, /* boosters.propellant_kg (a fixed load) */
} SwCarpetParamKind;

typedef struct {
  SwCarpetParamKind kind;
  guint  stage;                       /* for the stage parameters */
  SwEconNumber econ;                  /* for SW_CARPET_PARAM_ECONOMICS */
  double min;
  double max;
  guint  n;                           /* points, 2..SW_CARPET_MAX_POINTS */
} SwCarpetAxis;

typedef enum {
  SW_CARPET_LIFTOFF_MASS,
  SW_CARPET_PAYLOAD,
  SW_CARPET_DEVELOPMENT,
  SW_CARPET_COST_PER_FLIGHT,
} SwCarpetOutput;

typedef void (*SwCarpetProgress) (double fraction, gpointer user_data);

typedef struct {
  SwCarpetAxis   x;
  SwCarpetAxis   y;
  SwCarpetOutput output;
  GCancellable  *cancellable;         /* may be NULL */
  SwCarpetProgress progress;          /* may be NULL; called after each row */
  gpointer       progress_data;
} SwCarpetOptions;

typedef struct {
  SwCarpetAxis   x;
  SwCarpetAxis   y;
  SwCarpetOutput output;
  double        *values;              /* y.n rows of x.n: values[j * x.n + i]; NAN infeasible */
  gboolean      *feasible;
  guint          n_infeasible;
  double         design_x;            /* the design's own values, to mark it */
  double         design_y;
  double         design_value;        /* NAN when the design does not close */
  /* What the grid leaves out, in plain words; "" none.  A design whose
   * losses come from the simulated ascent: which losses every point is
   * sized with (no ascent is flown at a point), the first-guess allowance
   * (sw_carpet_compute) or the closed loop's (sw_carpet_compute_looped). */
  char           note[512];
  /* A cost output (development, cost per flight) of a design whose
   * economics give a cost per work-year: the same grid in money, each
   * point's work-years times work_year_cost (an estimate, never a quote;
   * sw_economics_money_note), in the design's currency.  has_money FALSE:
   * money NULL, work_year_cost and design_money NAN, currency "". */
  gboolean       has_money;
  double         work_year_cost;
  char           currency[SW_ECONOMICS_CURRENCY_BYTES]; /* the design's label, "" none */
  double        *money;               /* as values; NAN where the vehicle does not close */
  double         design_money;
} SwCarpet;

/* "stages[1].isp_vac_s" and the like into @kind and @stage; an error names
 * the text and lists the parameters. */
gboolean    sw_carpet_param_parse (const char *text, const SwDesign *design, SwCarpetAxis *axis,
                                   GError **error);
/* "PARAM:MIN:MAX:N" into @axis (parameter, range, count; the range is
 * checked by sw_carpet_axis_check(), not here).  Errors start with
 * @option and the text ("--x stages[0].isp_vac_s:300: expected ..."). */
gboolean    sw_carpet_axis_parse (const char *option, const char *text, const SwDesign *design,
                                  SwCarpetAxis *axis, GError **error);
/* The parameter's name as sw_carpet_param_parse() reads it (owned). */
char       *sw_carpet_param_dup_name (const SwCarpetAxis *axis);
/* The same in plain words for people ("Vacuum Isp, stage 3"), translated. */
char       *sw_carpet_param_dup_label (const SwCarpetAxis *axis);
const char *sw_carpet_output_to_string (SwCarpetOutput output);
gboolean    sw_carpet_output_from_string (const char *text, SwCarpetOutput *output);
/* Checks the axis's range against the parameter's limit and its count. */
gboolean    sw_carpet_axis_check (const SwCarpetAxis *axis, const SwDesign *design,
                                  GError **error);
/* The limit of the parameter's key (its range and unit). */
SwLimitId   sw_carpet_param_limit (const SwCarpetAxis *axis);
/* The unit shown beside the parameter's values ("s", "kg", "" for none). */
const char *sw_carpet_param_unit (const SwCarpetAxis *axis);
/* TRUE for a whole-number parameter (the production run): its grid values
 * are rounded. */
gboolean    sw_carpet_param_is_whole (const SwCarpetAxis *axis);
/* TRUE when the two axes are the same parameter. */
gboolean    sw_carpet_param_equal (const SwCarpetAxis *a, const SwCarpetAxis *b);
/* Every parameter the carpet can vary for @design and @output, into @out
 * (up to @max, kind/stage/econ only); the count. */
guint       sw_carpet_list_params (const SwDesign *design, SwCarpetOutput output,
                                   SwCarpetAxis *out, guint max);
/* A range around the design's value: 0.5 to 1.5 times for a structural
 * coefficient and the economics keys, 0.85 to 1.15 times for an Isp, and
 * so on, always inside the key's limit; a whole-number key gets at most one
 * point per whole value. */
void        sw_carpet_axis_default_range (SwCarpetAxis *axis, const SwDesign *design);
/* The value of grid index @i on @axis. */
double      sw_carpet_axis_value (const SwCarpetAxis *axis, guint i);
/* The parameter's value in @design. */
double      sw_carpet_design_value (const SwCarpetAxis *axis, const SwDesign *design);
/* Sets the parameter in a design (the check of sampled points). */
void        sw_carpet_apply (const SwCarpetAxis *axis, SwDesign *design, double value);

/* The grid; NULL with G_IO_ERROR_CANCELLED when cancelled, or an SW_ERROR
 * for a bad axis or a mission without delta-v. */
SwCarpet   *sw_carpet_compute (const SwDesign *design, const SwCarpetOptions *options,
                               GError **error);
/* The same for a design made the closed loop's vehicle (a copy given the
 * loop's losses and fairing point by sw_ascent_apply_loop, as the analysis
 * does for its trade studies: sw_analysis_carpet): every point is sized with
 * the loop's losses as a fixed allowance and its fairing point; only the
 * note differs.  This design's value is then the closed loop's sizing. */
SwCarpet   *sw_carpet_compute_looped (const SwDesign *looped, const SwCarpetOptions *options,
                                      GError **error);
void        sw_carpet_free (SwCarpet *carpet);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwCarpet, sw_carpet_free)

G_END_DECLS
