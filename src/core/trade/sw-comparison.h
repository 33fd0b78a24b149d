/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-comparison.h: the current design against its pinned baseline: the
 * change of every total, absolute and in percent of the baseline's value. */
#pragma once

#include "sw-design.h"
#include "sw-sizing.h"
#include "sw-types.h"

G_BEGIN_DECLS

typedef struct {
  double current;
  double baseline;
  double delta;        /* current - baseline; NAN when either is not finite */
  double percent;      /* 100 x delta / |baseline|; NAN when the baseline is 0 or not finite */
} SwDelta;

typedef enum {
  SW_TOTAL_LIFTOFF_MASS,
  SW_TOTAL_PAYLOAD,
  SW_TOTAL_PAYLOAD_FRACTION,
  SW_TOTAL_DELTA_V,
  SW_TOTAL_DELTA_V_LIMIT,
  SW_TOTAL_PROPELLANT,
  SW_TOTAL_STRUCTURE,
  SW_TOTAL_STAGE_COUNT,
  SW_N_TOTALS
} SwTotal;

typedef struct {
  gboolean has_baseline;
  gboolean current_feasible;
  gboolean baseline_feasible;
  SwDelta  totals[SW_N_TOTALS];
} SwComparison;

void        sw_delta_set (SwDelta *delta, double current, double baseline);
/* The totals of one sizing (NAN where infeasible). */
double      sw_sizing_total (const SwSizing *sizing, SwTotal total);
void        sw_comparison_from_sizings (const SwSizing *current, const SwSizing *baseline,
                                        SwComparison *out);
/* Sizes @design and its baseline; has_baseline is FALSE when there is none. */
gboolean    sw_comparison_from_design (const SwDesign *design, SwComparison *out, GError **error);
const char *sw_total_label (SwTotal total);   /* translated, for tables */
const char *sw_total_key (SwTotal total);     /* JSON key, e.g. "liftoff_mass_kg" */

G_END_DECLS
