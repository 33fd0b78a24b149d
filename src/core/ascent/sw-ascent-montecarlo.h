/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-ascent-montecarlo.h: a Monte Carlo of the built vehicle with a
 * simulated ascent per sample.
 *
 * The vehicle is the design's, sized once with its losses (the closed loop's
 * for "loss_model": "simulate"): propellant loads and thrust are fixed.  Each
 * sample draws every stage's Isp and structural coefficient from the
 * design's spreads (the "uncertainty" object; the losses spread is not used:
 * the losses are flown), rebuilds the stage masses (structure = propellant
 * eps / (1 - eps); with strap-on boosters their Isp and structural
 * coefficient are drawn too, and the phases rebuilt as the parallel sizing
 * of the all-fixed vehicle gives them) and flies the ascent: the pitch kick
 * held at the nominal
 * vehicle's optimum, the upper-stage steering solved for the orbit.  Its
 * delta-v margin is the sample's rocket-equation delta-v less the ideal
 * delta-v and the losses it flew (sw-ascent.h).
 *
 * The payload reserve for 95 %: the payload to hold back so that 95 % of the
 * samples reach the orbit, from the 5th percentile of the margin and the
 * nominal vehicle's delta-v per kg of payload (linearised; a negative value
 * is payload the vehicle could add).
 *
 * Every sample has its own random stream (seed and sample index) and starts
 * from the nominal solution, so the answer does not depend on the number of
 * threads. */
#pragma once

#include <gio/gio.h>

#include "sw-ascent.h"
#include "sw-design.h"

G_BEGIN_DECLS

typedef struct {
  guint    samples;
  guint    flown;                 /* samples with an answer (reached or short) */
  guint    reached;               /* samples with margin >= 0 */
  guint    threads;
  double   nominal_margin_m_s;
  double   nominal_losses_m_s;
  double   sized_losses_m_s;      /* the allowance the vehicle was sized with */
  double   mean_margin_m_s;
  double   sd_margin_m_s;
  double   p05_margin_m_s;        /* percentiles of the margin over the flown samples */
  double   p50_margin_m_s;
  double   p95_margin_m_s;
  double   min_margin_m_s;
  double   max_margin_m_s;
  double   mean_losses_m_s;
  double   probability_reached;   /* reached / samples */
  double   dv_per_kg_payload;     /* m/s lost per kg of payload added (> 0) */
  double   payload_reserve_95_kg;
  double  *margins_m_s;           /* per sample, NAN when not flown; owned */
} SwAscentMonteCarlo;

typedef void (*SwAscentMcProgress) (guint done, guint total, gpointer user_data);

/* @threads 0: every core.  @progress (may be NULL) is called from the
 * worker threads after each sample.  NULL with an error for bad input or
 * when cancelled. */
SwAscentMonteCarlo *sw_ascent_montecarlo_run (const SwDesign *design, guint samples,
                                              guint32 seed, guint threads,
                                              SwAscentMcProgress progress, gpointer user_data,
                                              GCancellable *cancellable, GError **error);
void                sw_ascent_montecarlo_free (SwAscentMonteCarlo *mc);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (SwAscentMonteCarlo, sw_ascent_montecarlo_free)

G_END_DECLS
