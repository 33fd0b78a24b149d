/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-limits.h: the one table of accepted input ranges, read by the loader,
 * the GUI's fields and the README generator alike. */
#pragma once

#include "sw-types.h"

G_BEGIN_DECLS

typedef enum {
  SW_LIMIT_PAYLOAD,
  SW_LIMIT_DELTA_V,
  SW_LIMIT_ALTITUDE,
  SW_LIMIT_INCLINATION,
  SW_LIMIT_SITE_LATITUDE,
  SW_LIMIT_LOSSES,
  SW_LIMIT_ISP_VAC,
  SW_LIMIT_ISP_SL,
  SW_LIMIT_STRUCTURAL_COEFFICIENT,
  SW_LIMIT_DELTA_V_SHARE,
  SW_LIMIT_STAGE_COUNT,
  SW_LIMIT_NAME_LENGTH,
  SW_LIMIT_NOTES_LENGTH,
  SW_N_LIMITS
} SwLimitId;

struct _SwLimit {
  const char *key;     /* JSON key (last path component) */
  const char *unit;    /* unit as shown to users, "" when dimensionless */
  double      min;
  double      max;
  gboolean    min_exclusive;
  const char *why;     /* one line: why this range */
};

const SwLimit *sw_limit_get (SwLimitId id);
gboolean       sw_limit_contains (SwLimitId id, double value);
/* Markdown table of every limit, for the README. */
char          *sw_limits_dup_markdown (void);

G_END_DECLS
