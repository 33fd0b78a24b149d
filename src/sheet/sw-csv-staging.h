/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-csv-staging.h: CSV of the staging decision (one row per stage count)
 * and of the default carpet grid, for `export --csv`.  Plain SI numbers and
 * work-years, empty cells where there is no value, the cautions first. */
#pragma once

#include "sw-analysis.h"
#include "sw-carpet.h"

G_BEGIN_DECLS

/* stage-decision.csv; NULL when the mission has no delta-v. */
char    *sw_csv_staging_decision (const SwAnalysis *b);
/* The export's carpet: the first stage's structural coefficient (0.5 to 1.5
 * times the design's, within its limits) against the top stage's vacuum Isp
 * (0.85 to 1.15 times), 21 x 21 points, liftoff mass. */
void     sw_csv_carpet_default_axes (const SwDesign *design, SwCarpetOptions *options);
/* carpet.csv: one line per grid point; NULL when it cannot be computed. */
char    *sw_csv_carpet (const SwAnalysis *b);
/* The lines of a computed carpet (shared with the CLI's --csv). */
char    *sw_csv_carpet_text (const SwCarpet *carpet);

G_END_DECLS
