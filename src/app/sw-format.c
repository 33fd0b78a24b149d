/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-format.h"

#include <glib/gi18n.h>
#include <math.h>

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
sw_format_mass (double kg)
{
  if (!isfinite (kg))
    return g_strdup (SW_NO_VALUE);
  /* Four significant figures or better: enough to check by hand. */
  if (fabs (kg) < 10000.0)
    /* Translators: a mass in kilograms; %'.0f is the number with digit grouping */
    return g_strdup_printf (_("%'.0f kg"), kg);
  if (fabs (kg) < 1.0e6)
    /* Translators: a mass in tonnes (1 t = 1000 kg) */
    return g_strdup_printf (_("%'.1f t"), kg / 1000.0);
  return g_strdup_printf (_("%'.0f t"), kg / 1000.0);
}

char *
sw_format_speed (double m_s)
{
  if (!isfinite (m_s))
    return g_strdup (SW_NO_VALUE);
  /* Translators: a speed in metres per second */
  return g_strdup_printf (_("%'.0f m/s"), m_s);
}

char *
sw_format_fraction (double value, int digits)
{
  if (!isfinite (value))
    return g_strdup (SW_NO_VALUE);
  /* Translators: a percentage; %.*f is the number */
  return g_strdup_printf (_("%.*f %%"), digits, value * 100.0);
}

const char *
sw_format_cautions (void)
{
  return _("Conceptual sizing only: not for flight hardware or safety decisions. Defer to "
           "licensed engineering practice, range safety and local regulations.");
}
