/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-recovery.h: the recovery copy of one window's document.  A second
 * after the last change the design is written to a file in the user's state
 * folder (with the URI of the file it belongs to beside it); a clean close
 * removes it; a copy found at start, left by a session that ended without a
 * clean close, is offered back.  Each window of the process takes its own
 * slot (recovery.stagewright, recovery-2.stagewright, ...).  No GTK. */
#pragma once

#include "sw-design.h"
#include "sw-document.h"

G_BEGIN_DECLS

#define SW_TYPE_RECOVERY (sw_recovery_get_type ())
G_DECLARE_FINAL_TYPE (SwRecovery, sw_recovery, SW, RECOVERY, GObject)

/* Claims a slot; follows @document's changes. */
SwRecovery     *sw_recovery_new (SwDocument *document);
/* NULL when there is no slot (disabled). */
char           *sw_recovery_dup_path (SwRecovery *self);
/* Stops writing for good and releases the slot (an offered copy is left on
 * disk for the next real session). */
void            sw_recovery_disable (SwRecovery *self);
/* Writes a pending copy now. */
void            sw_recovery_flush (SwRecovery *self);
/* A clean close: the copy is not needed any more. */
void            sw_recovery_remove (SwRecovery *self);

/* Looks for a copy left by an earlier session.  TRUE when one is offered
 * (see the getters); FALSE with @error when it could not be read (it is
 * moved aside to *@kept_path), FALSE without an error when there is none. */
gboolean        sw_recovery_check (SwRecovery *self, char **kept_path, GError **error);
gboolean        sw_recovery_get_offered (SwRecovery *self);
const SwDesign *sw_recovery_get_offered_design (SwRecovery *self);
/* Local time of the offered copy; NULL when unknown. */
GDateTime      *sw_recovery_dup_offered_time (SwRecovery *self);
/* The answer to the offer: with @restore the design and the file it belongs
 * to (may be NULL) are handed over, else the copy is deleted.  FALSE when
 * nothing was offered. */
gboolean        sw_recovery_answer (SwRecovery *self, gboolean restore, SwDesign **design,
                                    GFile **origin);

G_END_DECLS
