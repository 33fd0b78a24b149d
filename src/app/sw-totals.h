/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-totals.h: the vehicle's totals and whether it closes, from an SwResult. */
#pragma once

#include <gtk/gtk.h>

#include "sw-result.h"

G_BEGIN_DECLS

#define SW_TYPE_TOTALS (sw_totals_get_type ())
G_DECLARE_FINAL_TYPE (SwTotals, sw_totals, SW, TOTALS, GtkWidget)

GtkWidget  *sw_totals_new (void);
void        sw_totals_set_result (SwTotals *self, SwResult *result);

/* For tests: the texts shown. */
typedef enum {
  SW_TOTALS_LIFTOFF,
  SW_TOTALS_FRACTION,
  SW_TOTALS_MARGIN,
  SW_TOTALS_REQUIRED,
  SW_TOTALS_LIMIT,
  SW_TOTALS_STATUS,
} SwTotalsField;

const char *sw_totals_get_text (SwTotals *self, SwTotalsField field);

G_END_DECLS
