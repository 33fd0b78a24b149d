/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-format.h: the one way numbers are written for people.  The window, the
 * briefing sheet and the command line's text output all use it, so a mass
 * reads the same everywhere.  Machine output (JSON, CSV) never goes through
 * here: it writes plain numbers in SI units with g_ascii_dtostr.
 *
 * Rules:
 * - anything not finite is SW_NO_VALUE (an em dash), never "nan" or "inf";
 * - a value that rounds to zero is written without a sign ("0 kg", never
 *   "-0 kg" or "+0 kg");
 * - negative numbers use the minus sign U+2212; deltas carry "+" or "−";
 * - digit grouping and the decimal separator follow LC_NUMERIC (the "%'"
 *   flag of printf), so a German desktop reads "1.234,5 t";
 * - mass: below 10 kg with one decimal ("2.4 kg"; two below 1 kg, "0.10 kg"),
 *   below 10 t in kilograms without decimals ("8,000 kg"), from 10 t
 *   to below 1,000 t in tonnes with one decimal ("312.4 t"), from 1,000 t up
 *   in whole tonnes ("6,396 t"). */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define SW_NO_VALUE "\u2014"

/* A plain number with @decimals decimals and digit grouping: "1,234.5". */
char       *sw_format_number (double value, int decimals);
/* An estimate of money to three significant figures, grouped:
 * 2,582,952,134 -> "2,580,000,000"; never more digits than it is worth. */
char       *sw_format_money (double value);
/* The same with "+" or "−" in front (none for a value that rounds to 0). */
char       *sw_format_signed (double value, int decimals);

char       *sw_format_mass (double kg);                 /* "8,000 kg", "312.4 t" */
char       *sw_format_mass_delta (double kg);           /* "+3.2 t", "−850 kg" */
char       *sw_format_speed (double m_s);               /* "9,400 m/s" */
/* The same into @buf (for a message built with g_snprintf; the result is
 * @buf): sw_format_speed_into ((char[SW_SPEED_TEXT]) { 0 }, SW_SPEED_TEXT, v). */
#define SW_SPEED_TEXT 48
const char *sw_format_speed_into (char *buf, gsize size, double m_s);
#define SW_SPEED(v) sw_format_speed_into ((char[SW_SPEED_TEXT]) { 0 }, SW_SPEED_TEXT, (v))
char       *sw_format_speed_delta (double m_s);         /* "+1,811 m/s" */
char       *sw_format_percent (double fraction, int decimals);  /* 0.0123, 2 -> "1.23 %" */
char       *sw_format_probability (double p);           /* "95.1 %"; "99.91 %" near 1 */
char       *sw_format_duration (double s);              /* "152.3 s" */
char       *sw_format_distance_km (double m);           /* metres in, "185.0 km" */
/* The same into @buf, as SW_SPEED: SW_KM (altitude_m) in a g_snprintf
 * message ("0.0 km", never "-0.0 km"; a negative one with U+2212). */
#define SW_KM_TEXT 48
const char *sw_format_distance_km_into (char *buf, gsize size, double m);
#define SW_KM(m) sw_format_distance_km_into ((char[SW_KM_TEXT]) { 0 }, SW_KM_TEXT, (m))
char       *sw_format_pressure_kpa (double pa);         /* pascals in, "32.4 kPa" */
char       *sw_format_accel_g (double g);               /* "3.85 g" */
char       *sw_format_ratio (double ratio, int decimals);  /* "1.350" */
char       *sw_format_isp (double s);                   /* "311 s" */
/* Metres with 2 decimals below 10 m, 1 below 100 m, none above: "6.91 m",
 * "42.1 m"; a whole number of metres (a scale bar) without decimals. */
char       *sw_format_length_m (double m);
char       *sw_format_volume_m3 (double m3);            /* "64.9 m³", "1,250 m³" */
/* printf-style with one double; SW_NO_VALUE when @value is not finite. */
char       *sw_format_value (const char *format, double value) G_GNUC_FORMAT (1);

/* @sentence made a clause to follow a colon or a semicolon: its first
 * letter in lower case ("No ascent: …" -> "no ascent: …"), unless the first
 * word is an abbreviation or a symbol in capitals ("T/W", "Isp", "ΔV" stay).
 * German nouns keep their capital: the translation decides through the
 * "clause-lowercase" message (see the code). */
char       *sw_format_clause (const char *sentence);

/* The cautions every export, report and the About dialog carry (translated).
 * One sentence pair, written once. */
const char *sw_format_cautions (void);

G_END_DECLS
