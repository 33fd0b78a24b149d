/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-csv.h: CSV of the stage table and of every curve of an analysis.  Each
 * file opens with one "#" line carrying the cautions; numbers use the C
 * locale, a value that does not exist is an empty field (never NaN). */
#pragma once

#include "sw-analysis.h"

G_BEGIN_DECLS

char    *sw_csv_stage_table (const SwAnalysis *b);
char    *sw_csv_stage_curve (const SwAnalysis *b);      /* with band and baseline columns */
char    *sw_csv_sweep (const SwAnalysis *b);            /* liftoff mass against delta-v */
char    *sw_csv_reliability (const SwAnalysis *b);      /* NULL when not given */
char    *sw_csv_tornado (const SwAnalysis *b);          /* NULL when infeasible */
char    *sw_csv_histogram (const SwAnalysis *b);        /* NULL without Monte Carlo */
/* Payload against altitude and inclination; NULL unless every stage is fixed. */
char    *sw_csv_payload_curves (const SwAnalysis *b);

/* Writes every table that exists into the folder @dir (created when
 * missing): stages.csv, stage-count.csv, delta-v-sweep.csv, sensitivity.csv,
 * reliability.csv, uncertainty-histogram.csv, stage-decision.csv, carpet.csv,
 * payload-curves.csv.  @written (may be NULL)
 * receives the paths written (owned strings). */
gboolean sw_csv_export (const SwAnalysis *b, const char *dir, GPtrArray *written,
                        GError **error);

G_END_DECLS
