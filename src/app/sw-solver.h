/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-solver.h: the one solver thread.  Every edit posts a copy of the whole
 * design; the worker always solves the newest request and drops superseded
 * ones; results come back on the main loop as the "solved" signal. */
#pragma once

#include <gio/gio.h>

#include "sw-design.h"
#include "sw-analysis.h"

G_BEGIN_DECLS

#define SW_TYPE_SOLVER (sw_solver_get_type ())
G_DECLARE_FINAL_TYPE (SwSolver, sw_solver, SW, SOLVER, GObject)

SwSolver *sw_solver_new (void);
/* Copies @design and queues it, replacing any request not yet started and
 * cancelling the one being solved.  Returns the serial of the request. */
guint64   sw_solver_post (SwSolver *self, const SwDesign *design);
guint64   sw_solver_get_posted_serial (SwSolver *self);
/* The newest result emitted, or NULL. */
SwAnalysis *sw_solver_get_result (SwSolver *self);
/* Settings that are not part of the design (the sensitivity step): they
 * apply from the next post on. */
void      sw_solver_set_options (SwSolver *self, const SwAnalysisOptions *options);
void      sw_solver_get_options (SwSolver *self, SwAnalysisOptions *options);
/* Requests replaced before the worker started them, for tests and benchmarks. */
guint64   sw_solver_get_dropped (SwSolver *self);
/* Ascents the worker began, and those a newer request cancelled part way
 * (for tests). */
void      sw_solver_get_ascent_counts (SwSolver *self, guint64 *started, guint64 *cancelled);

/* Signal "solved" (SwAnalysis *result): emitted on the main loop of the thread
 * that created the solver, with serials never decreasing.  When a design can
 * be flown, one serial is emitted twice: the fast phase with ascent_pending,
 * then a new result with the simulated ascent (unless a newer edit cancelled
 * it).  A design with spreads gets a result with the Monte Carlo in between
 * (montecarlo_pending in the fast one); result->phase orders them. */

G_END_DECLS
