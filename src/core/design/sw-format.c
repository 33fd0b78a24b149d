/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-format"

#include "config.h"

#include "sw-format.h"

#include <glib/gi18n-lib.h>
#include <locale.h>
#include <math.h>
#include <string.h>

#define MINUS "\342\210\222"   /* U+2212 */

/* @value rounded to @decimals is zero: no sign. */
static gboolean
rounds_to_zero (double value, int decimals)
{
  return fabs (value) < 0.5 * pow (10.0, -decimals);
}

/* Digits grouped by threes with the locale's separators; where the locale
 * has none (the C locale), "," and "." so that a big number stays readable. */
static char *
grouped (double magnitude, int decimals)
{
  const struct lconv *lc = localeconv ();
  const char *sep = lc->thousands_sep != NULL ? lc->thousands_sep : "";
  const char *point = lc->decimal_point != NULL && *lc->decimal_point ? lc->decimal_point : ".";
  g_autofree char *raw = g_strdup_printf ("%.*f", decimals, magnitude);
  GString *s = g_string_new (NULL);
  const char *dot, *p;
  int int_len;

  if (*sep == '\0' && strcmp (point, ".") == 0)
    sep = ",";
  /* raw was printed in the current locale: find its decimal point */
  dot = strstr (raw, point);
  int_len = dot != NULL ? (int) (dot - raw) : (int) strlen (raw);
  for (p = raw; p < raw + int_len; p++)
    {
      int pos = (int) (p - raw);
      if (pos > 0 && (int_len - pos) % 3 == 0)
        g_string_append (s, sep);
      g_string_append_c (s, *p);
    }
  if (dot != NULL)
    g_string_append (s, dot);
  return g_string_free (s, FALSE);
}

char *
sw_format_number (double value, int decimals)
{
  g_autofree char *n = NULL;

  if (!isfinite (value))
    return g_strdup (SW_NO_VALUE);
  decimals = CLAMP (decimals, 0, 9);
  n = grouped (fabs (value), decimals);
  if (value < 0.0 && !rounds_to_zero (value, decimals))
    return g_strconcat (MINUS, n, NULL);
  return g_steal_pointer (&n);
}

char *
sw_format_money (double value)
{
  double scale;

  if (!isfinite (value) || value == 0.0)
    return sw_format_number (value, 0);
  /* Three significant figures; below 100 the decimals that keep them. */
  scale = pow (10.0, floor (log10 (fabs (value))) - 2.0);
  if (scale >= 1.0)
    return sw_format_number (round (value / scale) * scale, 0);
  return sw_format_number (value, (int) CLAMP (-floor (log10 (scale) + 0.5), 0, 9));
}

char *
sw_format_signed (double value, int decimals)
{
  g_autofree char *n = NULL;

  if (!isfinite (value))
    return g_strdup (SW_NO_VALUE);
  decimals = CLAMP (decimals, 0, 9);
  n = grouped (fabs (value), decimals);
  if (rounds_to_zero (value, decimals))
    return g_steal_pointer (&n);
  return g_strconcat (value > 0.0 ? "+" : MINUS, n, NULL);
}

/* The number part and unit of a mass by the one rule (see the header). */
static const char *
mass_unit (double kg, double *scaled, int *decimals)
{
  double a = fabs (kg);

  if (a < 9999.5)
    {
      *scaled = kg;
      *decimals = 0;
      /* Translators: the unit of a mass in kilograms */
      return C_("unit", "kg");
    }
  *scaled = kg / 1000.0;
  *decimals = a < 999950.0 ? 1 : 0;
  /* Translators: the unit of a mass in tonnes (1 t = 1000 kg) */
  return C_("unit", "t");
}

static char *
with_unit (double value, int decimals, const char *unit, gboolean sign)
{
  g_autofree char *n = NULL;

  if (!isfinite (value))
    return g_strdup (SW_NO_VALUE);
  n = sign ? sw_format_signed (value, decimals) : sw_format_number (value, decimals);
  return g_strdup_printf ("%s %s", n, unit);
}

static char *
mass (double kg, gboolean sign)
{
  const char *unit;
  double scaled;
  int decimals;

  if (!isfinite (kg))
    return g_strdup (SW_NO_VALUE);
  unit = mass_unit (kg, &scaled, &decimals);
  /* A mass of a few kilograms (a 100 g payload, its stages) is not "0 kg":
   * one decimal below 10 kg, two below 1 kg.  Changes keep whole kilograms,
   * so rounding noise never shows as a change. */
  if (!sign && fabs (kg) < 9.95 && fabs (kg) >= 0.005)
    decimals = fabs (kg) < 0.995 ? 2 : 1;
  return with_unit (scaled, decimals, unit, sign);
}

char *
sw_format_mass (double kg)
{
  return mass (kg, FALSE);
}

char *
sw_format_mass_delta (double kg)
{
  return mass (kg, TRUE);
}

char *
sw_format_speed (double m_s)
{
  /* Translators: the unit of a speed in metres per second */
  return with_unit (m_s, 0, C_("unit", "m/s"), FALSE);
}

const char *
sw_format_speed_into (char *buf, gsize size, double m_s)
{
  g_autofree char *text = sw_format_speed (m_s);

  g_strlcpy (buf, text, size);
  return buf;
}

char *
sw_format_length_m (double m)
{
  int decimals = fabs (m) < 10.0 ? 2 : fabs (m) < 100.0 ? 1 : 0;

  if (isfinite (m) && m == round (m))
    decimals = 0;
  /* Translators: the unit of a length in metres */
  return with_unit (m, decimals, C_("unit", "m"), FALSE);
}

char *
sw_format_volume_m3 (double m3)
{
  /* Translators: the unit of a volume in cubic metres */
  return with_unit (m3, fabs (m3) < 100.0 ? 1 : 0, C_("unit", "m³"), FALSE);
}

char *
sw_format_speed_delta (double m_s)
{
  return with_unit (m_s, 0, C_("unit", "m/s"), TRUE);
}

char *
sw_format_percent (double fraction, int decimals)
{
  return with_unit (fraction * 100.0, decimals, "%", FALSE);
}

char *
sw_format_probability (double p)
{
  int decimals = isfinite (p) && p > 0.99 && p < 1.0 ? 2 : 1;

  return sw_format_percent (p, decimals);
}

char *
sw_format_duration (double s)
{
  /* Translators: the unit of a duration in seconds */
  return with_unit (s, 1, C_("unit", "s"), FALSE);
}

char *
sw_format_distance_km (double m)
{
  /* Translators: the unit of a distance or altitude in kilometres */
  return with_unit (m / 1000.0, 1, C_("unit", "km"), FALSE);
}

const char *
sw_format_distance_km_into (char *buf, gsize size, double m)
{
  g_autofree char *text = sw_format_distance_km (m);

  g_strlcpy (buf, text, size);
  return buf;
}

char *
sw_format_pressure_kpa (double pa)
{
  /* Translators: the unit of a pressure in kilopascals */
  return with_unit (pa / 1000.0, 1, C_("unit", "kPa"), FALSE);
}

char *
sw_format_accel_g (double g)
{
  /* Translators: acceleration in units of standard gravity */
  return with_unit (g, 2, C_("unit", "g"), FALSE);
}

char *
sw_format_ratio (double ratio, int decimals)
{
  return sw_format_number (ratio, decimals);
}

char *
sw_format_isp (double s)
{
  return with_unit (s, 0, C_("unit", "s"), FALSE);
}

char *
sw_format_value (const char *format, double value)
{
  if (!isfinite (value))
    return g_strdup (SW_NO_VALUE);
#pragma GCC diagnostic push
#pragma GCC diagnostic ignored "-Wformat-nonliteral"
  return g_strdup_printf (format, value);
#pragma GCC diagnostic pop
}

char *
sw_format_clause (const char *sentence)
{
  const char *second;
  gunichar first, next;
  GString *s;

  if (sentence == NULL)
    return g_strdup ("");
  /* Translators: "yes" if a sentence joined after a colon starts with a
   * small letter in your language ("…: no ascent"); anything else keeps
   * the sentence's first letter as it is (German: nouns keep capitals, so
   * translate this as "no"). */
  if (g_strcmp0 (C_("clause-lowercase", "yes"), "yes") != 0)
    return g_strdup (sentence);
  if (!g_utf8_validate (sentence, -1, NULL) || *sentence == '\0')
    return g_strdup (sentence);
  first = g_utf8_get_char (sentence);
  second = g_utf8_next_char (sentence);
  next = *second != '\0' ? g_utf8_get_char (second) : 0;
  /* "T/W", "Isp"?  Only a plain capitalised word is lowered: the next
   * character a small letter or a space. */
  if (!g_unichar_isupper (first) || !(g_unichar_islower (next) || next == ' '))
    return g_strdup (sentence);
  /* "Isp": a known abbreviation written with one capital. */
  if (g_str_has_prefix (sentence, "Isp"))
    return g_strdup (sentence);
  s = g_string_new (NULL);
  g_string_append_unichar (s, g_unichar_tolower (first));
  g_string_append (s, second);
  return g_string_free (s, FALSE);
}

const char *
sw_format_cautions (void)
{
  return _("Conceptual sizing only: not for flight hardware or safety decisions. Defer to "
           "licensed engineering practice, range safety and local regulations.");
}
