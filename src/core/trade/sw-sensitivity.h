/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-sensitivity.h: which input moves the liftoff mass most.  Partial
 * derivatives of the liftoff mass with respect to the payload, the required
 * delta-v and every stage's Isp and structural coefficient; the tornado data
 * (liftoff mass change for a plus-or-minus step, ranked); and the payload
 * exchange ratios of the vehicle as sized (fixed propellant loads).
 * A vehicle that exists (every load fixed, sw_design_all_fixed) has a
 * constant liftoff mass: its table is of the payload capability instead
 * (SwSensitivityTable.capability). */
#pragma once

#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

#define SW_SENSITIVITY_DEFAULT_STEP 0.05
#define SW_SENSITIVITY_MAX_ITEMS (4 + 2 * SW_MAX_STAGES)
/* Relative step of the central differences of a design with boosters. */
#define SW_SENSITIVITY_FD_STEP 1e-3

typedef enum {
  SW_SENS_PAYLOAD,
  SW_SENS_DELTA_V,
  SW_SENS_ISP,
  SW_SENS_STRUCTURAL_COEFFICIENT,
  SW_SENS_BOOSTER_ISP,                    /* the strap-on boosters' (stage -1) */
  SW_SENS_BOOSTER_STRUCTURAL_COEFFICIENT,
} SwSensParam;

typedef struct {
  SwSensParam param;
  int      stage;          /* firing-order index, or -1 for payload, delta-v and boosters */
  double   value;          /* nominal value (kg, m/s, s or dimensionless) */
  /* Of the liftoff mass; with SwSensitivityTable.capability of the payload
   * capability instead (kg of payload). */
  double   derivative;     /* d(liftoff mass)/d(value), kg per unit of value */
  double   elasticity;     /* (value / liftoff mass) x derivative: percent per percent */
  double   minus_kg;       /* liftoff mass change at value x (1 - step); NAN if infeasible */
  double   plus_kg;        /* ... at value x (1 + step) */
  gboolean minus_feasible;
  gboolean plus_feasible;
  double   effect_kg;      /* ranking key: the larger |change|; +inf when a side is infeasible */
} SwSensitivity;

typedef struct {
  gboolean feasible;       /* the nominal design; nothing else is filled when FALSE */
  /* A vehicle that exists (sw_design_all_fixed): every item is of the
   * payload capability (the payload at which the vehicle's delta-v equals
   * the required delta-v), feasible is "the capability is positive", and
   * the payload is no item (the capability does not depend on it). */
  gboolean capability;
  double   payload_capability_kg;   /* NAN unless capability */
  double   liftoff_mass_kg;
  double   payload_kg;
  double   delta_v_m_s;
  double   step;           /* relative, e.g. 0.05 */
  guint    n_items;
  SwSensitivity items[SW_SENSITIVITY_MAX_ITEMS];
  guint    ranked[SW_SENSITIVITY_MAX_ITEMS];   /* indices into items, largest effect first */
  guint    n_stages;
  /* Payload lost per kg of dry mass added to stage i, propellant loads fixed. */
  double   exchange_ratio[SW_MAX_STAGES];
} SwSensitivityTable;

/* Analytic partial derivatives at fixed split, which are the total
 * derivatives for the equal and manual splits and, by the envelope theorem,
 * for the optimal split too.  @sizing must be the feasible sizing of @set.
 * @d_isp and @d_eps (per stage) and the scalars may be NULL. */
void     sw_sensitivity_analytic (const SwStageSet *set, const SwSizing *sizing,
                                  double *d_payload, double *d_delta_v,
                                  double *d_isp, double *d_eps);

/* Central-difference derivative of the re-sized liftoff mass (the same split
 * rule, re-optimised for the optimal split); relative step @h.  NAN when a
 * side is infeasible.  For tests and as a fallback. */
double   sw_sensitivity_finite (const SwStageSet *set, double payload_kg, double delta_v_m_s,
                                SwSplitMode split, SwSensParam param, int stage, double h);

/* The full table of @design with a relative tornado @step (0.05 = 5 %).
 * A serial design with a fixed propellant load: every figure by re-sizing
 * the perturbed stages as sw_size_design does (sw_size_with_fixed: the fixed
 * stages keep their loads, the sized ones take the rest), the derivatives
 * by central differences of relative step SW_SENSITIVITY_FD_STEP.
 * Every load fixed: the payload capability of the perturbed vehicle
 * (sw_fixed_loads_payload), central differences the same way; a side whose
 * capability is not positive is infeasible.
 * With strap-on boosters every figure comes from re-sizing the phased vehicle
 * (sw_size_parallel: sized boosters re-optimised, fixed ones kept; the
 * core's and the boosters' thrust kept): the derivatives are central
 * differences of relative step SW_SENSITIVITY_FD_STEP, the boosters' Isp and
 * structural coefficient are two more items, and the exchange ratios come
 * from the payload of the vehicle with its loads fixed (sw_parallel_payload),
 * dry mass added by raising the stage's structural coefficient. */
gboolean sw_sensitivity_compute (const SwDesign *design, double step, SwSensitivityTable *out,
                                 GError **error);

/* "Payload", "Delta-v", "Isp, stage 2 (Name)", ... (translated). */
char    *sw_sensitivity_dup_label (const SwDesign *design, const SwSensitivity *item);
const char *sw_sens_param_to_string (SwSensParam param);   /* "payload", "delta_v", ... */

G_END_DECLS
