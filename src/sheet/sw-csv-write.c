/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-csv-write.h"

#include "sw-format.h"

#include <math.h>

GString *
sw_csv_begin (const char *header)
{
  GString *s = g_string_new ("# ");

  g_string_append (s, sw_format_cautions ());
  g_string_append_c (s, '\n');
  if (header != NULL)
    {
      g_string_append (s, header);
      g_string_append_c (s, '\n');
    }
  return s;
}

void
sw_csv_append_number (GString *s, double v, int digits, gboolean last)
{
  if (isfinite (v))
    {
      char format[8], buf[G_ASCII_DTOSTR_BUF_SIZE];

      g_snprintf (format, sizeof format, "%%.%dg", CLAMP (digits, 1, 17));
      g_ascii_formatd (buf, sizeof buf, format, v);
      g_string_append (s, buf);
    }
  g_string_append_c (s, last ? '\n' : ',');
}
