/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-uncertainty.h: the optional design-level "uncertainty" object: the
 * spreads of the Monte Carlo inputs, the sample count and the seed.
 *
 *   "uncertainty": {
 *     "samples": 10000, "seed": 1,
 *     "isp_vac": { "distribution": "normal", "sigma_percent": 1.0 },
 *     "structural_coefficient": { "distribution": "uniform", "half_range_percent": 8 },
 *     "losses": { "distribution": "normal", "sigma_m_s": 150 }
 *   }
 *
 * Isp and structural coefficient spreads are relative to each stage's nominal
 * value and are drawn independently for every stage; the losses spread is
 * absolute and moves the required delta-v (for a delta_v_m_s mission, which
 * includes its losses, it moves that delta-v).  A left-out spread is zero. */
#pragma once

#include <gsl/gsl_rng.h>
#include <json-glib/json-glib.h>

#include "sw-types.h"

G_BEGIN_DECLS

#define SW_UNCERTAINTY_DEFAULT_SAMPLES 10000
#define SW_UNCERTAINTY_DEFAULT_SEED 1

typedef enum {
  SW_SPREAD_NONE,
  SW_SPREAD_NORMAL,       /* width = standard deviation */
  SW_SPREAD_UNIFORM,      /* width = half range: nominal plus or minus width */
} SwSpreadKind;

typedef struct {
  SwSpreadKind kind;
  double       width;     /* percent of nominal (Isp, eps) or m/s (losses) */
} SwSpread;

typedef struct {
  gboolean present;       /* the object was given */
  gboolean has_samples;
  gboolean has_seed;
  guint    samples;
  guint32  seed;
  SwSpread isp;
  SwSpread structural_coefficient;
  SwSpread losses;
} SwUncertainty;

extern const char *const sw_uncertainty_design_keys[];

/* Fills in the defaults: no spread, 10,000 samples, seed 1. */
void     sw_uncertainty_init (SwUncertainty *unc);
guint    sw_uncertainty_samples (const SwUncertainty *unc);
guint32  sw_uncertainty_seed (const SwUncertainty *unc);
/* TRUE when some spread is not zero. */
gboolean sw_uncertainty_has_spread (const SwUncertainty *unc);

gboolean sw_uncertainty_load_design (JsonObject *root, const char *file, const char *prefix,
                                     SwUncertainty *unc, GPtrArray *warnings, GError **error);
void     sw_uncertainty_save_design (JsonBuilder *builder, const SwUncertainty *unc);
gboolean sw_uncertainty_validate (const SwUncertainty *unc, const char *file, const char *prefix,
                                  GError **error);

const char *sw_spread_kind_to_string (SwSpreadKind kind);

/* Drawing samples, shared by every Monte Carlo of the core. */
/* The SplitMix64 finaliser (a published 64-bit mixing function): an
 * unrelated 32-bit generator seed for each (seed, index) pair. */
unsigned long sw_uncertainty_stream_seed (guint32 seed, guint64 index);
/* A zero-mean deviate of the spread (percent or m/s). */
double        sw_spread_draw (gsl_rng *r, const SwSpread *s);
/* @nominal spread by @s (percent), drawn again until it lies in (lo, hi)
 * (a normal tail could cross zero); after 64 tries the nominal value. */
double        sw_spread_draw_scaled (gsl_rng *r, const SwSpread *s, double nominal, double lo,
                                     double hi);

G_END_DECLS
