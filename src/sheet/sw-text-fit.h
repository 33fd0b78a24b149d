/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-text-fit.h: short labels that never end cut inside a word or a number.
 * Pango's own ellipsis cuts at a character ("T/W 68749.44 at ig…"); here
 * whole words are dropped from the end instead, and a label whose first word
 * does not fit is not drawn at all. */
#pragma once

#include <pango/pango.h>

G_BEGIN_DECLS

/* Puts @text (plain text) on @layout so that it fits @width (Pango units,
 * the layout's width is set to it) in at most @max_lines lines, wrapped
 * between words.  When it does not fit, the longest run of whole words from
 * the start that fits with "…" after it is shown.  Words are separated by
 * spaces; a number glued to its unit by a no-break space is one word.
 * Returns FALSE, with the layout's text empty, when not even the first word
 * and "…" fit. */
gboolean sw_text_fit_words (PangoLayout *layout, const char *text, int width, int max_lines);

/* As sw_text_fit_words(), but a text that does not fit whole is first tried
 * at smaller font sizes (the layout's font description must have an
 * absolute size), in steps of a quarter point down to @min_size points; only
 * when it does not fit whole even then is it cut, at the original size. */
gboolean sw_text_fit_shrink (PangoLayout *layout, const char *text, int width, int max_lines,
                             double min_size);

G_END_DECLS
