/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-format.h: numbers as the views show them.  Anything not finite is
 * shown as an em dash, never as "nan" or "inf". */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define SW_NO_VALUE "\u2014"

char *sw_format_mass (double kg);                 /* "8,000 kg", "312.4 t" */
char *sw_format_speed (double m_s);               /* "9,400 m/s" */
char *sw_format_fraction (double value, int digits);  /* 0.0123 -> "1.23 %" */
/* printf-style with one double; the em dash when @value is not finite. */
char *sw_format_value (const char *format, double value);

/* The cautions every export and the About dialog carry (translated). */
const char *sw_format_cautions (void);

G_END_DECLS
