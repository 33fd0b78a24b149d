/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-types.h"

#include <string.h>

G_DEFINE_QUARK (sw-error-quark, sw_error)

const char *
sw_split_mode_to_string (SwSplitMode mode)
{
  switch (mode)
    {
    case SW_SPLIT_EQUAL:
      return "equal";
    case SW_SPLIT_MANUAL:
      return "manual";
    case SW_SPLIT_OPTIMAL:
    default:
      return "optimal";
    }
}

gboolean
sw_split_mode_from_string (const char *text, SwSplitMode *mode)
{
  static const struct { const char *name; SwSplitMode mode; } table[] = {
    { "equal", SW_SPLIT_EQUAL },
    { "optimal", SW_SPLIT_OPTIMAL },
    { "manual", SW_SPLIT_MANUAL },
  };

  for (guint i = 0; text != NULL && i < G_N_ELEMENTS (table); i++)
    if (strcmp (text, table[i].name) == 0)
      {
        *mode = table[i].mode;
        return TRUE;
      }
  return FALSE;
}
