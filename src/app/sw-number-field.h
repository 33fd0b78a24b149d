/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-number-field.h: a validated number entry.  Text is read when the user
 * commits it (Enter, leaving the field, Up/Down, the wheel while the field
 * has focus); text that does not parse, is out of range or not whole shows
 * an error on the field (the "error" style and a message with the accepted
 * range) and nothing is committed.  The locale's decimal mark is accepted,
 * and '.' too where it is not the locale's grouping mark.  The wheel over a
 * field without focus scrolls the panel instead.  Ctrl+Z in a field with
 * uncommitted text reverts the text; with none it goes on to the window's
 * undo.  Each committed value is one "value-committed" emission. */
#pragma once

#include <gtk/gtk.h>

#include "sw-limits.h"

G_BEGIN_DECLS

#define SW_TYPE_NUMBER_FIELD (sw_number_field_get_type ())
G_DECLARE_FINAL_TYPE (SwNumberField, sw_number_field, SW, NUMBER_FIELD, GtkWidget)

GtkWidget  *sw_number_field_new (void);

/* The accepted range from the limits table, times @scale (100 for a
 * fraction shown in percent); @digits decimals shown; @step for Up/Down
 * and the wheel. */
void        sw_number_field_set_limit (SwNumberField *self, SwLimitId id, double scale,
                                       guint digits, double step);
/* Any range (the structural coefficient in another form). */
void        sw_number_field_set_range (SwNumberField *self, double min, double max,
                                       gboolean min_exclusive, const char *unit, guint digits,
                                       double step);
void        sw_number_field_get_range (SwNumberField *self, double *min, double *max);
guint       sw_number_field_get_digits (SwNumberField *self);
SwLimitId   sw_number_field_get_limit (SwNumberField *self);  /* SW_N_LIMITS for none */
void        sw_number_field_set_whole (SwNumberField *self, gboolean whole);
/* Empty text commits "left out" (value NAN); @placeholder says what then
 * applies ("generic table", "direct insertion"). */
void        sw_number_field_set_optional (SwNumberField *self, gboolean optional,
                                          const char *placeholder);

/* Shows @value (NAN: empty) without emitting; keeps text being edited
 * when the value is the one already shown. */
void        sw_number_field_set_value (SwNumberField *self, double value);
/* Shows @value whatever is being edited, and clears any error (another
 * stage selected, a new design). */
void        sw_number_field_reset (SwNumberField *self, double value);
/* The value last shown or committed (NAN when empty). */
double      sw_number_field_get_value (SwNumberField *self);

/* Reads the text now, as Enter does; TRUE when it was valid. */
gboolean    sw_number_field_commit (SwNumberField *self);
/* For tests and scripts: the text of @value (the locale's mark, all its
 * digits) committed as if typed and entered. */
gboolean    sw_number_field_commit_value (SwNumberField *self, double value);
/* For tests and scripts: replaces the text and commits it. */
gboolean    sw_number_field_enter (SwNumberField *self, const char *text);

/* An error from outside (a rule between fields): shown until the next
 * valid commit or sw_number_field_set_value() with another value; NULL
 * clears it. */
void        sw_number_field_set_error (SwNumberField *self, const char *message);
/* The message shown, NULL when the field is valid. */
const char *sw_number_field_get_error (SwNumberField *self);
const char *sw_number_field_get_text (SwNumberField *self);
GtkWidget  *sw_number_field_get_entry (SwNumberField *self);

/* Parses @text as a user's number: the locale's decimal mark @mark (and
 * '.' unless @grouping is '.'), an optional sign ('-' or U+2212), an
 * optional exponent; no grouping marks, nothing else.  Public for tests. */
gboolean    sw_number_parse (const char *text, const char *mark, const char *grouping,
                             double *value);

/* For a GtkSpinButton still in use elsewhere: the wheel changes its value
 * only while it has the keyboard focus (without focus the wheel is
 * swallowed, never applied), and Ctrl+Page Up/Down (the window's stage
 * keys) never jump it to its maximum or minimum. */
void sw_number_field_guard_wheel (GtkWidget *widget);

G_END_DECLS
