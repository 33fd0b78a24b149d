/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-working-view"

#include "config.h"

#include "sw-working-view.h"

#include "sw-format.h"
#include "sw-limits.h"

#include <glib/gi18n.h>
#include <math.h>

struct _SwWorkingView {
  GtkWidget    parent_instance;
  GtkWidget   *box;
  SwAnalysis    *result;
  int          selected;
  GtkLabel    *title_label;
  GtkTextView *text_view;
};

G_DEFINE_FINAL_TYPE (SwWorkingView, sw_working_view, GTK_TYPE_WIDGET)

/* Numbers as typed into a calculator, through the one formatter: grouping
 * for masses and speeds, four decimals for ratios, the em dash for anything
 * not finite. */
#define KG(v) sw_format_number ((v), 1)
#define MS(v) sw_format_number ((v), 1)
#define RATIO(v) sw_format_ratio ((v), 4)

/* A heading line, then the formula lines indented under it: narrow enough
 * for the side panel and for pasting into notes. */
static void
head (GString *s, const char *label)
{
  g_string_append (s, label);
  g_string_append_c (s, '\n');
}

static void G_GNUC_PRINTF (2, 3)
formula (GString *s, const char *format, ...)
{
  va_list args;

  va_start (args, format);
  g_string_append (s, "  ");
  g_string_append_vprintf (s, format, args);
  g_string_append_c (s, '\n');
  va_end (args);
}

#define M(v) sw_format_number ((v), 2)
#define M3(v) sw_format_number ((v), 2)

/* The stage's tanks and length from its propellant and diameter
 * (sw-propellant.h, sw-vehicle-shape.h), or what is missing. */
static void
append_shape (GString *s, const SwAnalysis *r, guint i)
{
  const SwStageGeometry *g;
  const SwStageShape *sh;

  if (!r->sizing.feasible || i >= r->shape.n_stages)
    return;
  g = &r->shape.stages[i];
  sh = &g->shape;
  g_string_append_c (s, '\n');
  head (s, _("Tanks and length"));
  if (!sh->valid)
    {
      formula (s, "%s", _("no propellant given: choose one in the inspector to see the tank "
                          "volumes and lengths"));
      return;
    }
  {
    g_autofree char *rho = sw_format_number (sh->bulk_density_kg_m3, 1);
    g_autofree char *vp = M3 (sh->propellant_volume_m3);
    g_autofree char *vt = M3 (sh->tank_volume_m3);
    g_autofree char *ox = M3 (sh->oxidizer_tank_m3);
    g_autofree char *fu = M3 (sh->fuel_tank_m3);
    g_autofree char *ull = sw_format_percent (sh->propellant_volume_m3 > 0.0
                                              ? sh->tank_volume_m3 / sh->propellant_volume_m3
                                                - 1.0 : NAN, 1);

    if (sh->solid)
      formula (s, _("grain density %s kg/m³; propellant volume %s m³"), rho, vp);
    else
      {
        formula (s, _("bulk density ρ = ρo·ρf·(1 + r)/(ρf·r + ρo) = %s kg/m³"), rho);
        formula (s, _("propellant volume = m_o/ρo + m_f/ρf = %s m³"), vp);
      }
    formula (s, _("tank volume = propellant volume × (1 + ullage %s) = %s m³"), ull, vt);
    if (!sh->solid)
      formula (s, _("oxidizer tank %s m³, fuel tank %s m³"), ox, fu);
  }
  if (!sh->has_length)
    {
      formula (s, "%s", _("no diameter given (nor below): no lengths"));
      return;
    }
  {
    g_autofree char *d = M (g->diameter_m);
    g_autofree char *lo = M (sh->oxidizer_tank_length_m);
    g_autofree char *lf = M (sh->fuel_tank_length_m);
    g_autofree char *it = M (sh->intertank_length_m);
    g_autofree char *en = M (sh->engine_section_length_m);
    g_autofree char *len = M (sh->length_m);

    formula (s, _("diameter D = %s m%s"), d, g->diameter_inherited ? _(" (the stage below's)")
                                                                   : "");
    formula (s, "%s", _("tank = cylinder + two domes of height R/√2: L = (V − 2·(2/3)πR³/√2)/(πR²) "
                        "+ 2R/√2"));
    if (sh->solid)
      formula (s, _("motor case %s m + nozzle skirt 0.2·D %s m = %s m"), lo, en, len);
    else
      formula (s, _("oxidizer tank %s + intertank D/4 %s + fuel tank %s + engine section 0.6·D "
                    "%s = %s m"), lo, it, lf, en, len);
    if (r->shape.complete && i + 1 < r->shape.n_stages)
      {
        g_autofree char *is = M (g->interstage_length_m);
        formula (s, _("interstage above: 0.3 × the larger diameter = %s m"), is);
      }
    if (r->shape.complete)
      {
        g_autofree char *fl = M (r->shape.fairing_length_m);
        g_autofree char *h = M (r->shape.height_m);
        formula (s, _("vehicle: fairing 2.5·D = %s m; height %s m"), fl, h);
      }
  }
}

/* An estimate's items, each with its source, and the coefficient they give
 * against the design's. */
static void
append_estimate_total (GString *s, const SwStageEstimate *e)
{
  g_autofree char *ms = KG (e->structural_mass_kg);
  g_autofree char *mp = KG (e->propellant_mass_kg);
  g_autofree char *eps = RATIO (e->structural_coefficient);
  g_autofree char *was = RATIO (e->design_coefficient);

  for (guint k = 0; k < SW_N_MER; k++)
    {
      g_autofree char *kg = NULL;
      if (e->item_kg[k] == 0.0)
        continue;
      kg = KG (e->item_kg[k]);
      formula (s, "%-17s %12s kg   %s", sw_mer_item_label (k), kg, sw_mer_item_source (k));
    }
  formula (s, _("m_s = %s kg with m_p = %s kg: ε = %s (the design says %s)"), ms, mp, eps,
           was);
}

/* An estimate the design could not take, rounded as accepting it rounds. */
static void
append_estimate_range (GString *s, const SwStageEstimate *e)
{
  if (!sw_limit_contains (SW_LIMIT_STRUCTURAL_COEFFICIENT,
                          round (e->structural_coefficient * 1e4) / 1e4))
    formula (s, "%s", _("outside the accepted range of the structural coefficient: it "
                        "cannot be used"));
}

/* The stage's structure from the mass-estimating relationships at their
 * fixed point with the sizing (sw-mass-estimate.h), each with its source. */
static void
append_mass_estimate (GString *s, const SwAnalysis *r, guint i)
{
  const SwMassEstimate *m = &r->mass_estimate;
  const SwStageEstimate *e;

  if (i >= m->n_stages)
    return;
  e = &m->stages[i];
  g_string_append_c (s, '\n');
  head (s, _("Structural coefficient estimated (mass-estimating relationships)"));
  if (!m->ok)
    {
      formula (s, "%s", m->reason);
      return;
    }
  if (!e->estimated)
    {
      formula (s, _("not estimated: %s"), e->reason);
      return;
    }
  {
    g_autofree char *t = sw_format_number (e->thrust_n / 1000.0, 1);
    g_autofree char *ar = sw_format_number (e->area_ratio, 0);
    formula (s, _("thrust %s kN%s, %u engine(s), area ratio %s (assumed)"), t,
             e->thrust_assumed ? _(" (from the default thrust-to-weight: no thrust given)") : "",
             e->engine_count, ar);
  }
  append_estimate_total (s, e);
  {
    g_autofree char *lift = sw_format_mass (m->liftoff_mass_kg);
    formula (s, _("fixed point after %u rounds with the split held; liftoff then %s"),
             m->iterations, lift);
  }
  append_estimate_range (s, e);
  /* What "Use estimated ε" does to every stage (and the boosters). */
  formula (s, "%s", m->has_boosters ? _("every stage and the boosters (design → estimate):")
                                    : _("every stage (design → estimate):"));
  for (guint k = 0; k < m->n_stages && k < r->design->n_stages; k++)
    {
      const SwStageEstimate *o = &m->stages[k];
      g_autofree char *was = RATIO (o->design_coefficient);
      g_autofree char *est = o->estimated ? RATIO (o->structural_coefficient) : NULL;
      if (o->estimated)
        formula (s, "  %u %s: %s → %s", k + 1, r->design->stages[k].name, was, est);
      else
        formula (s, _("  %u %s: %s (kept: %s)"), k + 1, r->design->stages[k].name, was,
                 o->reason);
    }
  if (m->has_boosters)
    {
      const SwStageEstimate *o = &m->boosters;
      g_autofree char *was = RATIO (o->design_coefficient);
      g_autofree char *est = o->estimated ? RATIO (o->structural_coefficient) : NULL;
      if (o->estimated)
        formula (s, "  B %s: %s → %s", r->design->boosters.name, was, est);
      else
        formula (s, _("  B %s: %s (kept: %s)"), r->design->boosters.name, was, o->reason);
    }
}

/* One strap-on booster's structure from the mass-estimating relationships
 * (sw-mass-estimate.h: a nose cone and the attachment in place of an
 * interstage), each with its source; shown with the core's working. */
static void
append_booster_estimate (GString *s, const SwAnalysis *r)
{
  const SwMassEstimate *m = &r->mass_estimate;
  const SwStageEstimate *e = &m->boosters;

  if (!m->ok || !m->has_boosters)
    return;
  g_string_append_c (s, '\n');
  /* Translators: %s is the boosters' name */
  g_string_append_printf (s, _("%s: structural coefficient estimated, per booster\n"),
                          r->design->boosters.name);
  if (!e->estimated)
    {
      formula (s, _("not estimated: %s"), e->reason);
      return;
    }
  {
    g_autofree char *t = sw_format_number (e->thrust_n / 1000.0, 1);
    g_autofree char *ar = sw_format_number (e->area_ratio, 0);
    g_autofree char *d = M (e->diameter_m);
    g_autofree char *a = M (e->nose_area_m2);
    g_autofree char *l = M (e->length_m);

    if (e->item_kg[SW_MER_MOTOR_CASE] > 0.0)
      formula (s, _("thrust %s kN per booster (solid: the motor case in place of tanks and "
                    "engine)"), t);
    else
      formula (s, _("thrust %s kN per booster, one engine, area ratio %s (assumed)"), t, ar);
    formula (s, _("diameter D = %s m%s, length %s m; nose cone 1.2·D long, side area %s m²"), d,
             r->design->boosters.has_diameter ? "" : _(" (half the core's)"), l, a);
  }
  append_estimate_total (s, e);
  if (m->boosters_load_held)
    formula (s, "%s", _("their load held at the design's own sizing, as the split is; "
                        "accepting the estimate lets the sizing choose it again"));
  append_estimate_range (s, e);
}

/* The stages' delta-v limit with no payload and the headroom to it, as the
 * sizing has them (sw-sizing.h); with a fixed stage, what the vehicle gives
 * with its payload too. */
static void
append_vehicle_limit (GString *s, const SwSizing *sz)
{
  g_autofree char *lim = MS (sz->delta_v_limit_m_s);
  g_autofree char *margin = MS (sz->margin_m_s);

  if (sz->n_fixed == 0 && !sz->boosters.present)
    formula (s, _("delta-v limit Σ c_i·ln(1/ε_i) = %s m/s"), lim);
  else if (sz->n_fixed == 0)
    formula (s, _("stages' delta-v limit with no payload (Σ c_i·ln(1/ε_i),\n"
                  "  the boosters not counted) = %s m/s"), lim);
  else
    formula (s, _("stages' delta-v limit with no payload (sized stages\n"
                  "  c·ln(1/ε), fixed ones the rocket equation on their\n"
                  "  loads) = %s m/s"), lim);
  formula (s, _("headroom to the limit = %s m/s"), margin);
  /* Only a vehicle with nothing sized gives more than the requirement. */
  if (sz->n_fixed == sz->n_stages && (!sz->boosters.present || sz->boosters.fixed)
      && isfinite (sz->delta_v_given_m_s))
    {
      g_autofree char *given = MS (sz->delta_v_given_m_s);
      formula (s, _("delta-v with this payload = %s m/s"), given);
    }
}

/* The vehicle's totals: liftoff mass, payload fraction, the limit and the
 * sizing's reason when it gives one. */
static void
append_vehicle (GString *s, const SwSizing *sz)
{
  g_autofree char *lift = KG (sz->liftoff_mass_kg);
  g_autofree char *pl = KG (sz->payload_kg);
  g_autofree char *frac = sw_format_percent (sz->payload_fraction, 3);

  head (s, _("Vehicle"));
  formula (s, _("liftoff mass (m0 of stage 1) = %s kg"), lift);
  formula (s, _("payload fraction = %s / %s = %s"), pl, lift, frac);
  append_vehicle_limit (s, sz);
  if (sz->reason[0] != '\0')
    g_string_append_printf (s, "\n%s\n", sz->reason);
}

static char *
build_text (SwWorkingView *self, gboolean for_copy)
{
  SwAnalysis *r = self->result;
  const SwDesign *d;
  const SwStage *st;
  const SwStageResult *sr;
  const SwSizing *sz;
  g_autofree char *c = NULL, *eps = NULL, *n = NULL, *dv = NULL;
  GString *s;
  guint i;

  if (r == NULL)
    return g_strdup (_("Waiting for the first sizing…"));
  if (!r->ok)
    return g_strdup_printf (_("This design cannot be sized yet:\n%s"), r->error_message);
  d = r->design;
  sz = &r->sizing;
  if (self->selected < 0 || (guint) self->selected >= d->n_stages || sz->n_stages != d->n_stages)
    return g_strdup (_("Select a stage to see its working."));

  i = (guint) self->selected;
  st = &d->stages[i];
  sr = &sz->stages[i];
  c = MS (sr->exhaust_velocity_m_s);
  eps = RATIO (st->structural_coefficient);
  n = RATIO (sr->mass_ratio);
  dv = MS (sr->delta_v_m_s);
  s = g_string_new (NULL);

  {
    g_autofree char *total = MS (sz->delta_v_m_s);
    const char *split = sz->split == SW_SPLIT_OPTIMAL
                        ? (sz->boosters.present ? _("optimal (numerical minimum, with boosters)")
                                                : _("optimal (Lagrange multiplier)"))
                        : sz->split == SW_SPLIT_EQUAL ? _("equal") : _("manual");
    gboolean nothing_sized = sz->n_fixed == sz->n_stages
                             && (!sz->boosters.present || sz->boosters.fixed);
    /* Translators: header of the working; stage number, count, name */
    g_string_append_printf (s, _("Stage %u of %u: %s\n"), i + 1, d->n_stages, st->name);
    if (sz->n_fixed == 0)
      g_string_append_printf (s, _("Split: %s\n"), split);
    else
      {
        GString *fixed = g_string_new (NULL), *sized = g_string_new (NULL);

        for (guint k = 0; k < sz->n_stages; k++)
          {
            GString *to = sz->stages[k].fixed ? fixed : sized;
            if (to->len > 0)
              g_string_append (to, ", ");
            g_string_append_printf (to, "%u", k + 1);
          }
        if (sz->boosters.present && !sz->boosters.fixed)
          {
            if (sized->len > 0)
              g_string_append (sized, ", ");
            g_string_append (sized, _("the boosters"));
          }
        else if (sz->boosters.present)
          g_string_append (fixed, _(", the boosters"));
        if (nothing_sized)
          /* Translators: %s is a list of stage numbers ("1, 2") */
          g_string_append_printf (s, _("Split: none; every load is fixed (stages %s):\n"
                                       "each stage gives the rocket equation on its load\n"),
                                  fixed->str);
        else
          /* Translators: the split of the sized stages (%s: "optimal (Lagrange
           * multiplier)"), the sized stages' numbers ("1, 3"), the fixed ones' */
          g_string_append_printf (s, _("Split: %s among the sized stages: %s\n"
                                       "Fixed load (not sized): %s\n"),
                                  split, sized->str, fixed->str);
        g_string_free (fixed, TRUE);
        g_string_free (sized, TRUE);
      }
    g_string_append_printf (s, _("Required delta-v Δv = %s m/s; g0 = 9.80665 m/s² (exact)\n"),
                            total);
    if (r->has_budget && isfinite (r->budget.ideal_delta_v_m_s))
      {
        g_autofree char *ideal = MS (r->budget.ideal_delta_v_m_s);
        g_autofree char *losses = MS (r->delta_v_m_s - r->budget.ideal_delta_v_m_s);
        if (r->sized_by_ascent)
          /* Translators: the parts of the required delta-v; two speeds in m/s */
          g_string_append_printf (s, _("  = ideal %s m/s + losses %s m/s from the simulated "
                                       "ascent (closed loop)\n"), ideal, losses);
        else
          g_string_append_printf (s, _("  = ideal %s m/s + the design's loss allowance %s m/s\n"),
                                  ideal, losses);
      }
    if (r->trade_losses_note[0] != '\0')
      g_string_append_printf (s, "%s\n", r->trade_losses_note);
    g_string_append_c (s, '\n');
  }

  {
    g_autofree char *isp = sw_format_number (st->isp_vac_s, 1);
    head (s, _("Exhaust velocity"));
    formula (s, "c = Isp·g0 = %s s × 9.80665 m/s² = %s m/s", isp, c);
    head (s, _("Structural coefficient"));
    formula (s, "ε = m_s/(m_s + m_p) = %s", eps);
  }

  /* The core with strap-on boosters: phase 0 and its own phase, the
   * formulas of parallel staging (the serial mass-ratio formula does not
   * hold for this stage). */
  if (i == 0 && sz->boosters.present && sz->feasible)
    {
      const SwBoosterResult *b = &sz->boosters;
      double f1 = b->core_thrust_vac_n;
      double mdot1 = b->core_mass_flow_kg_s;
      double mdotb = b->mass_flow_kg_s;
      g_autofree char *cb = MS (b->exhaust_velocity_m_s);
      g_autofree char *epsb = RATIO (d->boosters.structural_coefficient);
      g_autofree char *fb = sw_format_number (b->thrust_vac_n / 1000.0, 1);
      g_autofree char *fc = sw_format_number (f1 / 1000.0, 1);
      g_autofree char *md1 = sw_format_number (mdot1, 1);
      g_autofree char *mdb = sw_format_number (mdotb, 1);
      g_autofree char *pb = KG (b->propellant_mass_kg);
      g_autofree char *sb = KG (b->structural_mass_kg);
      g_autofree char *tb = sw_format_number (b->phase_duration_s, 1);
      g_autofree char *cmix = MS (b->mixed_exhaust_velocity_m_s);
      g_autofree char *q = KG (b->core_propellant_in_phase_kg);
      g_autofree char *m0 = KG (b->phase_initial_mass_kg);
      g_autofree char *m0e = KG (b->phase_final_mass_kg);
      g_autofree char *dv0 = MS (b->phase_delta_v_m_s);
      g_autofree char *m1 = KG (b->core_phase_initial_mass_kg);
      g_autofree char *mp = KG (sr->propellant_mass_kg);
      g_autofree char *ms = KG (sr->structural_mass_kg);
      g_autofree char *mb = KG (sr->burnout_mass_kg);
      g_autofree char *dv1 = MS (b->core_phase_delta_v_m_s);
      g_autofree char *above = KG (sr->payload_mass_kg);
      g_autofree char *lift = KG (sz->liftoff_mass_kg);
      g_autofree char *pl = KG (sz->payload_kg);
      g_autofree char *frac = sw_format_percent (sz->payload_fraction, 3);
      g_autofree char *share = sw_format_percent (sr->delta_v_share, 1);

      g_string_append_c (s, '\n');
      /* Translators: %u boosters named %s */
      g_string_append_printf (s, _("With %u strap-on boosters (%s) beside this stage\n"
                                   "(parallel staging)\n"), b->count, d->boosters.name);
      if (sr->fixed && b->fixed)
        g_string_append (s, _("The core's and the boosters' loads are fixed: this\n"
                              "stage gives the rocket equation on them.\n"));
      else if (sr->fixed)
        g_string_append (s, _("The core's load is fixed; the boosters' load is the\n"
                              "minimum of the liftoff mass found numerically (GSL).\n"));
      else
        g_string_append (s, b->fixed ? _("The boosters' load is fixed; the core's load gives\n"
                                         "the required delta-v.\n")
                                     : _("The boosters' load and the split are the minimum of\n"
                                         "the liftoff mass found numerically (GSL), not the\n"
                                         "Lagrange formula.\n"));
      head (s, _("Boosters"));
      formula (s, "c_b = %s m/s, ε_b = %s, F_b = %s kN", cb, epsb, fb);
      formula (s, "m_p,b = %s kg, m_s,b = %s kg", pb, sb);
      head (s, _("Mass flows"));
      formula (s, "ṁ_core = F/c = %s kN / %s m/s = %s kg/s", fc, c, md1);
      formula (s, "ṁ_b = F_b/c_b = %s kg/s", mdb);
      head (s, _("Phase 0: boosters and core together"));
      if (b->crossfeed)
        formula (s, _("crossfeed: t = %u·m_p,b/(%u·ṁ_b + ṁ_core) = %s s; the core burns none "
                      "of its own"), b->count, b->count, tb);
      else
        {
          formula (s, "t_b = m_p,b·c_b/F_b = %s s", tb);
          formula (s, "q = ṁ_core·t_b = %s kg %s", q, _("(core propellant burnt)"));
        }
      formula (s, "c_mix = (F + k·F_b)/(ṁ_core + k·ṁ_b) = %s m/s", cmix);
      if (b->fairing_phase == 0)
        formula (s, "M0 = m_above + m_p + m_s + k·(m_p,b + m_s,b) = %s kg", m0);
      else
        {
          g_autofree char *ff = KG (b->fairing_mass_kg);
          /* Translators: the fairing's mass and the phase it is dropped in */
          formula (s, _("fairing m_f = %s kg, dropped in %s"), ff,
                   b->fairing_phase == 1 ? _("this phase") : _("the core's own phase"));
          formula (s, "M0 = m_above + m_p + m_s + k·(m_p,b + m_s,b) + m_f = %s kg", m0);
        }
      if (b->fairing_phase == 1)
        {
          g_autofree char *mj = KG (b->fairing_drop_mass_kg);
          g_autofree char *mj2 = KG (b->fairing_drop_mass_kg - b->fairing_mass_kg);
          formula (s, _("M_f = the mass when the fairing drops = %s kg"), mj);
          formula (s, "Δv_0 = c_mix·(ln(M0/M_f) + ln((M_f − m_f)/(M0 − m_f − k·m_p,b − q)))");
          formula (s, "     = %s × (ln(%s / %s) + ln(%s / %s)) = %s m/s", cmix, m0, mj, mj2,
                   m0e, dv0);
        }
      else
        {
          formula (s, "Δv_0 = c_mix·ln(M0/(M0 − k·m_p,b − q))");
          formula (s, "     = %s × ln(%s / %s) = %s m/s", cmix, m0, m0e, dv0);
        }
      head (s, _("The core alone, after the boosters drop"));
      formula (s, "M1 = M0 − k·m_p,b − q − k·m_s,b = %s kg", m1);
      if (b->fairing_phase == 2)
        {
          g_autofree char *mj = KG (b->fairing_drop_mass_kg);
          g_autofree char *mj2 = KG (b->fairing_drop_mass_kg - b->fairing_mass_kg);
          formula (s, _("M_f = the mass when the fairing drops = %s kg"), mj);
          formula (s, "Δv_1 = c·(ln(M1/M_f) + ln((M_f − m_f)/(m_above + m_s)))");
          formula (s, "     = %s × (ln(%s / %s) + ln(%s / %s)) = %s m/s", c, m1, mj, mj2, mb,
                   dv1);
        }
      else
        {
          formula (s, "Δv_1 = c·ln(M1/(m_above + m_s))");
          formula (s, "     = %s × ln(%s / %s) = %s m/s", c, m1, mb, dv1);
        }
      head (s, _("Stage delta-v"));
      formula (s, "Δv = Δv_0 + Δv_1 = %s m/s", dv);
      formula (s, _("(%s of the required delta-v)"), share);
      g_string_append_c (s, '\n');
      head (s, _("Masses"));
      formula (s, "m_above = %s kg, m_p = %s kg", above, mp);
      formula (s, "m_s = m_p·ε/(1 − ε) = %s kg", ms);
      head (s, _("Vehicle"));
      formula (s, _("liftoff mass (M0, boosters included) = %s kg"), lift);
      formula (s, _("payload fraction = %s / %s = %s"), pl, lift, frac);
      append_vehicle_limit (s, sz);
      append_shape (s, r, i);
      append_mass_estimate (s, r, i);
      append_booster_estimate (s, r);
      if (for_copy)
        {
          g_string_append_c (s, '\n');
          g_string_append (s, sw_format_cautions ());
          g_string_append_c (s, '\n');
        }
      return g_string_free (s, FALSE);
    }

  if (sr->fixed)
    {
      g_autofree char *load = KG (st->propellant.propellant_kg);

      g_string_append_c (s, '\n');
      head (s, _("Fixed propellant load (this stage is not sized)"));
      formula (s, "m_p = %s kg %s", load, _("(given)"));
      if (sz->feasible)
        {
          g_autofree char *above = KG (sr->payload_mass_kg);
          g_autofree char *ms = KG (sr->structural_mass_kg);
          g_autofree char *m0 = KG (sr->initial_mass_kg);
          g_autofree char *mb = KG (sr->burnout_mass_kg);

          formula (s, "m_s = m_p·ε/(1 − ε) = %s kg", ms);
          formula (s, "m_above = %s kg %s", above, _("(everything above this stage)"));
          if (sz->fairing.mass_kg > 0.0 && sz->fairing.stage == i)
            {
              g_autofree char *mf = KG (sz->fairing.mass_kg);
              g_autofree char *phi = sw_format_percent (sz->fairing.fraction, 0);

              if (sz->fairing.fraction > 0.0)
                /* Translators: the fairing's mass, and the share of this stage's
                 * propellant burnt before it drops */
                formula (s, _("the fairing m_f = %s kg drops after φ = %s of m_p"), mf, phi);
              else
                /* Translators: the fairing's mass */
                formula (s, _("the fairing m_f = %s kg drops at ignition (φ = 0)"), mf);
              formula (s, "m0 = m_above + m_p + m_s + m_f = %s kg", m0);
              formula (s, "m_b = m_above + m_s = %s kg", mb);
              head (s, _("Stage delta-v (rocket equation on the load, in two parts\n"
                         "around the fairing's drop)"));
              formula (s, "Δv = c·ln((m0)/(m0 − φ·m_p)) + c·ln((m0 − φ·m_p − m_f)/m_b)");
              formula (s, "   = %s m/s", dv);
            }
          else
            {
              formula (s, "m0 = m_above + m_p + m_s = %s kg", m0);
              formula (s, "m_b = m0 − m_p = %s kg", mb);
              head (s, _("Stage delta-v (rocket equation on the load)"));
              formula (s, "Δv = c·ln(m0/m_b) = %s m/s × ln(%s / %s)", c, m0, mb);
              formula (s, "   = %s m/s", dv);
            }
          {
            g_autofree char *share = sw_format_percent (sr->delta_v_share, 1);
            formula (s, _("(%s of the required delta-v)"), share);
          }
        }
      {
        g_autofree char *limit = MS (sr->delta_v_limit_m_s);
        head (s, _("Stage limit with no payload"));
        formula (s, _("the rocket equation on its load with only the fixed\n"
                      "  stages above it (and the fairing while on) = %s m/s"), limit);
      }
      g_string_append_c (s, '\n');
      if (!sz->feasible)
        g_string_append_printf (s, _("No masses: the vehicle does not close.\n%s\n"),
                                sz->reason);
      else
        append_vehicle (s, sz);
      append_shape (s, r, i);
      append_mass_estimate (s, r, i);
      if (for_copy)
        {
          g_string_append_c (s, '\n');
          g_string_append (s, sw_format_cautions ());
          g_string_append_c (s, '\n');
        }
      return g_string_free (s, FALSE);
    }

  if (sz->split == SW_SPLIT_OPTIMAL && isfinite (sz->multiplier_s_m))
    {
      g_autofree char *eta = sw_format_value ("%.5e", sz->multiplier_s_m);

      head (s, sz->n_fixed > 0 ? _("Lagrange multiplier (the same for every sized stage)")
                               : _("Lagrange multiplier (the same for every stage)"));
      formula (s, "η = %s s/m", eta);
      head (s, _("Mass ratio at the optimum"));
      formula (s, "n = (c·η − 1)/(c·ε·η)");
      if (sr->unused)
        formula (s, "%s", _("would be below 1: this stage gets no delta-v, n = 1"));
      else
        {
          formula (s, "  = (%s × %s − 1)/(%s × %s × %s)", c, eta, c, eps, eta);
          formula (s, "  = %s", n);
        }
      head (s, _("Stage delta-v"));
      formula (s, "Δv = c·ln n = %s m/s × ln %s = %s m/s", c, n, dv);
    }
  else
    {
      head (s, _("Stage delta-v"));
      formula (s, "Δv = %s m/s", dv);
      head (s, _("Mass ratio"));
      formula (s, "n = exp(Δv/c) = exp(%s / %s) = %s", dv, c, n);
    }
  {
    g_autofree char *share = sw_format_percent (sr->delta_v_share, 1);
    /* Translators: %s is a percentage */
    formula (s, _("(%s of the required delta-v)"), share);
  }
  {
    g_autofree char *limit = MS (sr->delta_v_limit_m_s);
    head (s, _("Stage limit, where n would reach 1/ε"));
    formula (s, "c·ln(1/ε) = %s × ln(1/%s) = %s m/s", c, eps, limit);
  }
  g_string_append_c (s, '\n');

  if (!sz->feasible)
    g_string_append_printf (s, _("No masses: the vehicle does not close.\n%s\n"), sz->reason);
  else
    {
      g_autofree char *above = KG (sr->payload_mass_kg);
      g_autofree char *m0 = KG (sr->initial_mass_kg);
      g_autofree char *mb = KG (sr->burnout_mass_kg);
      g_autofree char *mp = KG (sr->propellant_mass_kg);
      g_autofree char *ms = KG (sr->structural_mass_kg);
      g_autofree char *mst = KG (sr->stage_mass_kg);

      head (s, _("Mass above this stage (payload and upper stages)"));
      formula (s, "m_above = %s kg", above);
      head (s, _("Initial mass"));
      formula (s, "m0 = m_above·n·(1 − ε)/(1 − n·ε)");
      formula (s, "   = %s × %s × (1 − %s)/(1 − %s × %s)", above, n, eps, n, eps);
      formula (s, "   = %s kg", m0);
      head (s, _("Burnout mass"));
      formula (s, "m_b = m0/n = %s / %s = %s kg", m0, n, mb);
      head (s, _("Propellant"));
      formula (s, "m_p = m0 − m_b = %s − %s = %s kg", m0, mb, mp);
      head (s, _("Structure"));
      formula (s, "m_s = m_b − m_above = %s − %s = %s kg", mb, above, ms);
      head (s, _("Stage mass"));
      formula (s, "m_p + m_s = %s kg", mst);
      g_string_append_c (s, '\n');

      append_vehicle (s, sz);
    }

  append_shape (s, r, i);
  append_mass_estimate (s, r, i);

  if (for_copy)
    {
      g_string_append_c (s, '\n');
      g_string_append (s, sw_format_cautions ());
      g_string_append_c (s, '\n');
    }
  return g_string_free (s, FALSE);
}

static void
update (SwWorkingView *self)
{
  g_autofree char *text = build_text (self, FALSE);
  g_autofree char *title = NULL;
  const SwDesign *d = self->result != NULL ? self->result->design : NULL;

  if (d != NULL && self->selected >= 0 && (guint) self->selected < d->n_stages)
    /* Translators: %d is the stage number, %s its name */
    title = g_strdup_printf (_("The working for stage %d, %s"), self->selected + 1,
                             d->stages[self->selected].name);
  gtk_label_set_text (self->title_label, title != NULL ? title : _("The working"));
  gtk_text_buffer_set_text (gtk_text_view_get_buffer (self->text_view), text, -1);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "working.copy",
                                 self->result != NULL && self->result->ok);
}

char *
sw_working_view_dup_text (SwWorkingView *self)
{
  g_return_val_if_fail (SW_IS_WORKING_VIEW (self), NULL);
  return build_text (self, TRUE);
}

static void
copy_action (GtkWidget *widget, const char *name, GVariant *param)
{
  SwWorkingView *self = SW_WORKING_VIEW (widget);
  g_autofree char *text = sw_working_view_dup_text (self);

  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), text);
}

GtkWidget *
sw_working_view_new (void)
{
  return g_object_new (SW_TYPE_WORKING_VIEW, NULL);
}

void
sw_working_view_set_result (SwWorkingView *self, SwAnalysis *result)
{
  g_return_if_fail (SW_IS_WORKING_VIEW (self));

  if (self->result == result)
    return;
  g_clear_pointer (&self->result, sw_analysis_unref);
  self->result = result != NULL ? sw_analysis_ref (result) : NULL;
  /* The text is only rebuilt while visible; mapping rebuilds it. */
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    update (self);
}

void
sw_working_view_set_selected (SwWorkingView *self, int stage)
{
  g_return_if_fail (SW_IS_WORKING_VIEW (self));

  if (self->selected == stage)
    return;
  self->selected = stage;
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    update (self);
}

static void
sw_working_view_map (GtkWidget *widget)
{
  GTK_WIDGET_CLASS (sw_working_view_parent_class)->map (widget);
  update (SW_WORKING_VIEW (widget));
}

static void
sw_working_view_dispose (GObject *object)
{
  SwWorkingView *self = SW_WORKING_VIEW (object);

  g_clear_pointer (&self->result, sw_analysis_unref);
  gtk_widget_dispose_template (GTK_WIDGET (self), SW_TYPE_WORKING_VIEW);
  G_OBJECT_CLASS (sw_working_view_parent_class)->dispose (object);
}

static void
sw_working_view_class_init (SwWorkingViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = sw_working_view_dispose;
  widget_class->map = sw_working_view_map;

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/stagewright/Stagewright/sw-working-view.ui");
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sw-working-view");
  gtk_widget_class_bind_template_child (widget_class, SwWorkingView, box);
  gtk_widget_class_bind_template_child (widget_class, SwWorkingView, title_label);
  gtk_widget_class_bind_template_child (widget_class, SwWorkingView, text_view);
  gtk_widget_class_install_action (widget_class, "working.copy", NULL, copy_action);
}

static void
sw_working_view_init (SwWorkingView *self)
{
  self->selected = -1;
  gtk_widget_init_template (GTK_WIDGET (self));
  update (self);
}
