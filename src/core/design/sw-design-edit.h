/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-design-edit.h: the edits the GUI makes to a design that are more than
 * one key: shares, split mode, the stage list, names, the mission kind, the
 * baseline.  One key's number is set through sw-design-fields.h.  The
 * window, the inspector and the trade page copy the document's design, call
 * one of these, and commit the copy; nothing else writes into a design.
 *
 * Shares.  Under the manual split the stages' delta_v_share values add up to
 * 1; every operation here keeps that sum (to rounding, 1e-12) and keeps each
 * share in [0, 1].  Under the equal and optimal splits the stored shares are
 * not used; the operations that change the stage list leave them alone.
 *
 * Refusals.  An operation that cannot be done (a ninth stage, removing the
 * last stage, an index out of range) returns FALSE and leaves the design as
 * it was.  Moving more share than a stage has is clamped, not refused: the
 * giver ends at 0 (a border dragged past its neighbour stops there). */
#pragma once

#include "sw-design.h"
#include "sw-types.h"

G_BEGIN_DECLS

/* ---- shares ------------------------------------------------------------ */

/* Switches @design to the manual split with @shares (@n_shares values, one
 * per stage, from the split on screen), scaled to add up to 1.  Used when
 * the user takes hold of a share in the equal or optimal split.  When the
 * shares do not fit (count differs from the stage count, a value negative or
 * not finite, a sum not above 0) every stage gets 1/n instead and FALSE is
 * returned; the design is in the manual split either way. */
gboolean sw_design_take_manual_shares (SwDesign *design, const double *shares, guint n_shares);

/* Manual shares: set stage @index to @share (clamped to [0, 1]; a single
 * stage always has 1) and scale the others so the sum stays 1; they keep
 * their proportions, or share the rest equally when they were all 0.
 * FALSE for an index out of range. */
gboolean sw_design_set_share_rebalanced (SwDesign *design, guint index, double share);

/* Move @amount of share from stage @from to stage @to (negative: the other
 * way), clamped so that neither goes below 0: at most the giver's share.
 * The other stages do not change.  FALSE for an index out of range; moving
 * within one stage changes nothing and returns TRUE. */
gboolean sw_design_move_share (SwDesign *design, guint from, guint to, double amount);

/* Changes the split mode.  Into the manual split from another, the stages
 * take @shares (see sw_design_take_manual_shares; may be NULL, then equal
 * shares).  FALSE when the design already had @mode. */
gboolean sw_design_set_split (SwDesign *design, SwSplitMode mode, const double *shares,
                              guint n_shares);

/* ---- the stage list ---------------------------------------------------- */

/* The economics object's stage indices (the stages an engine type is on,
 * the developed stages) follow their stages through every change of the
 * list: a removed stage leaves them, a duplicate uses the original's engine
 * type but is not developed. */

/* Appends a stage with plausible defaults (sw_stage_init_default).  In the
 * manual split it gets 1/(n+1) of the delta-v and the others are scaled by
 * n/(n+1).  FALSE at SW_MAX_STAGES stages. */
gboolean sw_design_add_stage (SwDesign *design);

/* Inserts a copy of stage @index right after it, named "NAME (copy)"; in the
 * manual split the two halves share the original's share.  FALSE at
 * SW_MAX_STAGES stages or for an index out of range. */
gboolean sw_design_duplicate_stage (SwDesign *design, guint index);

/* Removes stage @index; in the manual split the other shares are scaled up
 * to add up to 1 again (equal shares if they were all 0).  FALSE for the last
 * remaining stage or an index out of range. */
gboolean sw_design_remove_stage (SwDesign *design, guint index);

/* Moves stage @from to position @to, the stages between shifting by one;
 * each stage keeps all its values, its share included.  FALSE for an index
 * out of range; @from == @to changes nothing and returns TRUE. */
gboolean sw_design_move_stage (SwDesign *design, guint from, guint to);

/* ---- fields ------------------------------------------------------------ */

/* The numeric keys are edited through sw-design-fields.h (range-checked,
 * one key each); these are the edits that are not one number. */

/* Names are cut to whole UTF-8 characters that fit the buffer (127 bytes);
 * text that is not UTF-8 is refused (FALSE, name unchanged). */
gboolean sw_design_set_name (SwDesign *design, const char *name);
gboolean sw_design_set_stage_name (SwDesign *design, guint index, const char *name);

/* Switches between a delta-v mission and an orbit mission.  A field the new
 * kind needs that holds no accepted value gets a starting value: the delta-v
 * @current_delta_v_m_s (rounded to 1 m/s; 9400 m/s when it is not finite or
 * out of range), or an orbit of 400 km at 30 deg from latitude 28 deg with
 * 1500 m/s of losses (common practice for a first look).  FALSE when the
 * mission already had @kind. */
gboolean sw_design_set_mission_kind (SwDesign *design, SwMissionKind kind,
                                     double current_delta_v_m_s);

/* Gives or takes away the stage's sea-level Isp; given without an accepted
 * value (in (0, vacuum]) it starts at 0.9 of the vacuum Isp, rounded. */
gboolean sw_design_set_stage_has_isp_sl (SwDesign *design, guint index, gboolean has_isp_sl);

/* Takes estimated structural coefficients (@n values, one per stage; NAN
 * keeps that stage's), each rounded to 4 decimals, the precision the window
 * shows.  All or nothing: a count that differs from the stage count, or a
 * value outside the limits table's range after rounding, returns FALSE with
 * @error naming the key and the range, and the design is unchanged.  *changed
 * (may be NULL) tells whether any coefficient moved. */
gboolean sw_design_accept_structural_coefficients (SwDesign *design, const double *eps,
                                                   guint n, gboolean *changed,
                                                   GError **error);
/* The same with the boosters' estimated coefficient @booster_eps too (NAN
 * keeps the design's; a number for a design without boosters is an error
 * naming boosters.structural_coefficient), rounded and checked alike, all or
 * nothing with the stages' (one edit, one undo step in the window). */
gboolean sw_design_accept_estimated_coefficients (SwDesign *design, const double *eps, guint n,
                                                  double booster_eps, gboolean *changed,
                                                  GError **error);

/* ---- the baseline ------------------------------------------------------ */

/* The design as it is now becomes its own baseline (replacing any). */
void     sw_design_pin_baseline (SwDesign *design);
/* FALSE when there was no baseline. */
gboolean sw_design_clear_baseline (SwDesign *design);

G_END_DECLS
