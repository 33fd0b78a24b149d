/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-csv-write.h: the pieces every CSV table of the sheet library is
 * written with: the cautions as a comment line, locale-free numbers, an
 * empty cell for a value that is not finite. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* A new table: "# " and the cautions, then @header (NULL: none) and a newline. */
GString *sw_csv_begin (const char *header);
/* @v with @digits significant digits (C locale), then ',' or, when @last, '\n'. */
void     sw_csv_append_number (GString *s, double v, int digits, gboolean last);

G_END_DECLS
