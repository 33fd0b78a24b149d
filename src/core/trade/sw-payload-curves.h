/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-payload-curves.h: what a vehicle that exists carries (every stage with a
 * fixed propellant load, sw_design_performance ()), against the altitude of
 * a circular orbit at the design's inclination, and against the inclination
 * at the design's altitude.  Each point is the design with only that number
 * of its orbit changed, through sw_design_performance (), so that whatever
 * the phases API flies (boosters later) the curves fly too.
 *
 * Losses: the design's loss allowance at every point; or, when asked to
 * simulate, the losses of a flown ascent at that point: fly the vehicle with
 * the payload it carries at the allowance, take the simulated losses, find
 * the payload at those losses, fly again, until the payload settles (a
 * closed loop on the payload, as sw_ascent_close_loop () is on the sizing). */
#pragma once

#include <gio/gio.h>

#include "sw-design.h"
#include "sw-phases.h"

G_BEGIN_DECLS

#define SW_PAYLOAD_CURVE_MAX 64
#define SW_PAYLOAD_NOTE_MAX 512
/* The losses a "loss_model": "simulate" design without losses_m_s starts
 * from (the closed loop's first guess, sw-ascent.h). */
#define SW_PAYLOAD_FIRST_GUESS_LOSSES_M_S 1500.0

typedef struct {
  double   x;                 /* altitude_km or inclination_deg */
  gboolean reachable;         /* carries a positive payload there */
  double   payload_kg;        /* NAN when not reachable */
  double   delta_v_m_s;       /* required at this point (ideal + losses) */
  double   losses_m_s;        /* the allowance, or the flown losses */
  gboolean simulated;         /* losses_m_s is a flown ascent's */
  char     reason[SW_REASON_MAX];  /* why not reachable, or why not flown; "" */
} SwPayloadPoint;

typedef struct {
  guint          n_points;
  SwPayloadPoint points[SW_PAYLOAD_CURVE_MAX];
} SwPayloadCurve;

typedef struct {
  gboolean       applies;     /* an orbit mission and every stage fixed */
  char           note[SW_PAYLOAD_NOTE_MAX];  /* why not, or what losses were used */
  double         altitude_km; /* the design's orbit: the other curve's fixed value */
  double         inclination_deg;
  SwPayloadCurve altitude;    /* payload against altitude_km */
  SwPayloadCurve inclination; /* payload against inclination_deg */
} SwPayloadCurves;

/* The default grids: circular orbits from 200 to 2,000 km (19 points) and
 * inclinations from the site's |latitude| to 180 - |latitude| (19 points).
 * Return the count. */
guint    sw_payload_default_altitudes (double *altitudes_km);
guint    sw_payload_default_inclinations (const SwDesign *design, double *inclinations_deg);

/* Checks one grid value against the limits table (altitude or inclination);
 * the error names @option. */
gboolean sw_payload_check_grid (gboolean altitude, const double *values, guint n,
                                const char *option, GError **error);

/* The two curves for @design at the given grids (NULL: the defaults).
 * A design that does not qualify (not every stage fixed, or a delta-v
 * mission) is an answer: applies FALSE and the note says why.  With
 * @simulate each point is flown (seconds); FALSE only when cancelled. */
gboolean sw_payload_curves_compute (const SwDesign *design, const double *altitudes_km,
                                    guint n_altitudes, const double *inclinations_deg,
                                    guint n_inclinations, gboolean simulate,
                                    GCancellable *cancellable, SwPayloadCurves *out);

/* One point: the payload of @design with its orbit at @altitude_km and
 * @inclination_deg (allowance losses, or flown when @simulate). */
double   sw_payload_climb_m_s     (double altitude_km);
void     sw_payload_point_compute (const SwDesign *design, double altitude_km,
                                   double inclination_deg, gboolean simulate,
                                   GCancellable *cancellable, SwPayloadPoint *out);

G_END_DECLS
