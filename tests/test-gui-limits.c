/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Limits everywhere: every number field of the main window takes its range
 * from the core's one table (src/core/design/sw-limits.c), every key of the
 * table has a field in the window, and no value the widgets accept (each
 * field at its lowest and highest, typed text out of range, stage counts at
 * both ends, long names) gives a design that the loader's validation
 * rejects or a NaN on screen; text they refuse is an error on the field and
 * leaves the design as it was.  Suite 'gui' (Xvfb). */
#include "config.h"

#include "sw-application.h"
#include "sw-design-edit.h"
#include "sw-design-fields.h"
#include "sw-engine-types-editor.h"
#include "sw-number-field.h"
#include "sw-limits.h"
#include "sw-sizing.h"
#include "sw-staging-page.h"
#include "sw-trade-page.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

static char *tmp_dir;

/* ---- helpers ----------------------------------------------------------- */

static void
wait_shown (SwWindow *w)
{
  /* Every phase (the Monte Carlo, the ascent): their pages show numbers too. */
  sw_test_wait_until (sw_test_result_complete, w, 60000, "the newest result to be drawn");
}

static SwWindow *
window_with_demo (const char *name)
{
  SwWindow *w = sw_window_new (NULL);
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, name, NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);

  gtk_window_present (GTK_WINDOW (w));
  g_assert_true (sw_window_load (w, file));
  wait_shown (w);
  return w;
}

static GtkWidget *
widget (SwWindow *w, SwInspectorField f)
{
  return sw_inspector_get_field (sw_window_get_inspector (w), f);
}

static SwNumberField *
spin (SwWindow *w, SwInspectorField f)
{
  return SW_NUMBER_FIELD (widget (w, f));
}

static const SwDesign *
doc_design (SwWindow *w)
{
  return sw_document_get_design (sw_window_get_document (w));
}

/* Number fields of ours and spin buttons (other pages) alike. */
static void
field_range (GtkWidget *f, double *lower, double *upper, guint *digits)
{
  if (SW_IS_NUMBER_FIELD (f))
    {
      sw_number_field_get_range (SW_NUMBER_FIELD (f), lower, upper);
      *digits = sw_number_field_get_digits (SW_NUMBER_FIELD (f));
    }
  else
    {
      gtk_spin_button_get_range (GTK_SPIN_BUTTON (f), lower, upper);
      *digits = gtk_spin_button_get_digits (GTK_SPIN_BUTTON (f));
    }
}

static void
collect_spins (GtkWidget *root, GPtrArray *out)
{
  if (GTK_IS_SPIN_BUTTON (root) || SW_IS_NUMBER_FIELD (root))
    g_ptr_array_add (out, root);
  for (GtkWidget *c = gtk_widget_get_first_child (root); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    collect_spins (c, out);
}

static const char *
spin_name (GtkWidget *spin_button)
{
  const char *id = gtk_buildable_get_buildable_id (GTK_BUILDABLE (spin_button));
  const char *tip = gtk_widget_get_tooltip_text (spin_button);

  return id != NULL ? id : tip != NULL ? tip : "(a spin button without an id)";
}

/* The range a field shows for @l: the same maximum, the same minimum, or
 * for an exclusive minimum the first value the field can show above it
 * (one step of its last digit). */
static gboolean
range_matches (double lower, double upper, guint digits, double scale, const SwLimit *l)
{
  double min = l->min * scale, max = l->max * scale;
  double tol = 1e-12 * MAX (1.0, fabs (max));

  if (fabs (upper - max) > tol)
    return FALSE;
  if (!l->min_exclusive)
    return fabs (lower - min) <= tol;
  /* A number field keeps the open end itself and refuses it. */
  return lower >= min && lower <= min + pow (10.0, -(double) digits) + tol;
}

static void
assert_range (SwNumberField *s, SwLimitId id, double scale)
{
  double lower, upper;

  sw_number_field_get_range (s, &lower, &upper);
  if (!range_matches (lower, upper, sw_number_field_get_digits (s), scale, sw_limit_get (id)))
    g_error ("%s: range %g to %g is not the table's %s%g to %g for %s",
             spin_name (GTK_WIDGET (s)), lower, upper,
             sw_limit_get (id)->min_exclusive ? "above " : "", sw_limit_get (id)->min * scale,
             sw_limit_get (id)->max * scale, sw_limit_get (id)->key);
}

static void
collect_labels (GtkWidget *root, GPtrArray *out)
{
  if (GTK_IS_LABEL (root))
    g_ptr_array_add (out, root);
  for (GtkWidget *c = gtk_widget_get_first_child (root); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    collect_labels (c, out);
}

/* No "nan" or "inf" in any label of the window (every page, shown or not)
 * nor in the totals. */
static void
assert_totals_finite (SwWindow *w)
{
  static GRegex *non_finite;
  g_autoptr (GPtrArray) labels = g_ptr_array_new ();

  if (non_finite == NULL)
    {
      non_finite = g_regex_new ("\\b(nan|inf|infinity)\\b", G_REGEX_CASELESS, 0, NULL);
      g_assert_true (g_regex_match (non_finite, "-nan kg", 0, NULL));
      g_assert_true (g_regex_match (non_finite, "Inf m/s", 0, NULL));
      g_assert_false (g_regex_match (non_finite, "Infeasible: no finite mass", 0, NULL));
    }
  collect_labels (GTK_WIDGET (w), labels);
  g_assert_cmpuint (labels->len, >=, 20);
  for (guint k = 0; k < labels->len; k++)
    {
      const char *text = gtk_label_get_text (labels->pdata[k]);
      if (text != NULL && g_regex_match (non_finite, text, 0, NULL))
        g_error ("a label shows \"%s\"", text);
    }

  for (SwTotalsField f = SW_TOTALS_LIFTOFF; f <= SW_TOTALS_STATUS; f++)
    {
      const char *text = sw_totals_get_text (sw_window_get_totals (w), f);
      g_autofree char *lower = g_ascii_strdown (text != NULL ? text : "", -1);

      if (strstr (lower, "nan") != NULL || strstr (lower, "inf") != NULL)
        g_error ("the totals show \"%s\"", text);
    }
}

/* The design as edited is one the loader accepts, after a save and a load
 * too, and the solver's answer shown for it has no NaN. */
static void
assert_design_valid (SwWindow *w, const char *what)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (tmp_dir, "edited.stagewright", NULL);
  g_autoptr (SwDesign) back = NULL;

  if (!sw_design_validate (doc_design (w), NULL, &error))
    g_error ("after %s the design is invalid: %s", what, error->message);
  if (!sw_design_save (doc_design (w), path, &error))
    g_error ("after %s the design cannot be saved: %s", what, error->message);
  back = sw_design_load (path, NULL, &error);
  if (back == NULL)
    g_error ("after %s the saved design does not load: %s", what, error->message);
  g_assert_true (sw_design_equal (back, doc_design (w)));
  wait_shown (w);
  g_assert_true (sw_design_equal (sw_window_get_shown_result (w)->design, doc_design (w)));
  assert_totals_finite (w);
}

/* Sets @s to its lowest and highest value, then types out-of-range and
 * non-numeric text into it, each as its own edit.  Text the field refuses
 * is an error on the field and leaves the design as it was.  With
 * @may_conflict an end may be refused by a rule between keys (a sea-level
 * Isp above the vacuum Isp): an error, the design unchanged. */
static void
sweep_field (SwWindow *w, SwNumberField *s, const char *what, gboolean may_conflict)
{
  static const char *const typed[] = { "-1e30", "1e30", "nan", "inf", "-inf", "", "abc",
                                       "1,2,3", "0x10", "12 kg" };
  double lower, upper;

  sw_number_field_get_range (s, &lower, &upper);
  /* An open lower end: the first value the field shows above it. */
  if (sw_number_field_get_limit (s) != SW_N_LIMITS
      && sw_limit_get (sw_number_field_get_limit (s))->min_exclusive)
    lower += pow (10.0, -(double) sw_number_field_get_digits (s));
  for (int k = 0; k < 2; k++)
    {
      g_autofree char *label = g_strdup_printf ("%s at %s (%g)", what, k ? "its highest" :
                                                "its lowest", k ? upper : lower);
      g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));

      if (sw_number_field_commit_value (s, k ? upper : lower))
        /* A form of eps goes through the core's conversion and back. */
        g_assert_cmpfloat_with_epsilon (sw_number_field_get_value (s), k ? upper : lower,
                                        1e-12 * MAX (1.0, upper));
      else
        {
          if (!may_conflict)
            g_error ("%s: refused: %s", label, sw_number_field_get_error (s));
          g_assert_nonnull (sw_number_field_get_error (s));
          g_assert_true (sw_design_equal (doc_design (w), before));
          sw_number_field_reset (s, sw_number_field_get_value (s));
        }
      assert_design_valid (w, label);
    }
  for (guint k = 0; k < G_N_ELEMENTS (typed); k++)
    {
      g_autofree char *label = g_strdup_printf ("%s typed \"%s\"", what, typed[k]);
      g_autoptr (SwDesign) before = sw_design_copy (doc_design (w));
      double v;

      if (!sw_number_field_enter (s, typed[k]))
        {
          g_assert_nonnull (sw_number_field_get_error (s));
          g_assert_true (sw_design_equal (doc_design (w), before));
          sw_number_field_reset (s, sw_number_field_get_value (s));
        }
      else
        {
          /* Only the empty text of an optional key is taken: left out. */
          g_assert_cmpstr (typed[k], ==, "");
          v = sw_number_field_get_value (s);
          g_assert_true (isnan (v));
        }
      assert_design_valid (w, label);
    }
}

/* ---- tests ------------------------------------------------------------- */

typedef struct {
  SwInspectorField field;
  SwLimitId        limit;
} FieldLimit;

static const FieldLimit field_limits[] = {
  { SW_INSPECTOR_PAYLOAD, SW_LIMIT_PAYLOAD },
  { SW_INSPECTOR_DELTA_V, SW_LIMIT_DELTA_V },
  { SW_INSPECTOR_ALTITUDE, SW_LIMIT_ALTITUDE },
  { SW_INSPECTOR_INCLINATION, SW_LIMIT_INCLINATION },
  { SW_INSPECTOR_LATITUDE, SW_LIMIT_SITE_LATITUDE },
  { SW_INSPECTOR_LOSSES, SW_LIMIT_LOSSES },
  { SW_INSPECTOR_ISP_VAC, SW_LIMIT_ISP_VAC },
};

static gboolean
matches_some_limit (GtkWidget *s)
{
  double lower, upper;
  guint digits;

  field_range (s, &lower, &upper, &digits);
  for (guint i = 0; i < SW_N_LIMITS; i++)
    {
      const SwLimit *l = sw_limit_get (i);
      /* Fractions may be shown in percent. */
      if (range_matches (lower, upper, digits, 1.0, l)
          || (l->max <= 1.0 && range_matches (lower, upper, digits, 100.0, l)))
        return TRUE;
    }
  return FALSE;
}

/* A preference (a view setting, not part of the design) may take its range
 * from the settings schema instead, where it is documented the same way. */
static gboolean
matches_some_setting (GtkWidget *s)
{
  g_autoptr (GSettings) settings = sw_application_settings_new ();
  g_autoptr (GSettingsSchema) schema = NULL;
  g_auto (GStrv) keys = NULL;
  double lower, upper;
  guint digits;

  field_range (s, &lower, &upper, &digits);
  g_object_get (settings, "settings-schema", &schema, NULL);
  keys = g_settings_schema_list_keys (schema);
  for (guint k = 0; keys[k] != NULL; k++)
    {
      g_autoptr (GSettingsSchemaKey) key = g_settings_schema_get_key (schema, keys[k]);
      g_autoptr (GVariant) range = g_settings_schema_key_get_range (key);
      const char *kind;
      g_autoptr (GVariant) bounds = NULL;
      g_autoptr (GVariant) lo = NULL, hi = NULL;
      double min, max;

      g_variant_get (range, "(&sv)", &kind, &bounds);
      if (strcmp (kind, "range") != 0)
        continue;
      lo = g_variant_get_child_value (bounds, 0);
      hi = g_variant_get_child_value (bounds, 1);
      if (g_variant_is_of_type (lo, G_VARIANT_TYPE_DOUBLE))
        min = g_variant_get_double (lo), max = g_variant_get_double (hi);
      else if (g_variant_is_of_type (lo, G_VARIANT_TYPE_INT32))
        min = g_variant_get_int32 (lo), max = g_variant_get_int32 (hi);
      else if (g_variant_is_of_type (lo, G_VARIANT_TYPE_UINT32))
        min = g_variant_get_uint32 (lo), max = g_variant_get_uint32 (hi);
      else
        continue;
      if (lower == min && upper == max)
        return TRUE;
    }
  return FALSE;
}

static void
test_spin_ranges (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  const SwLimit *eps = sw_limit_get (SW_LIMIT_STRUCTURAL_COEFFICIENT);
  const SwLimit *isp_sl = sw_limit_get (SW_LIMIT_ISP_SL);
  g_autoptr (GPtrArray) spins = g_ptr_array_new ();
  GtkDropDown *forms = GTK_DROP_DOWN (widget (w, SW_INSPECTOR_EPS_FORM));
  guint inspector_spins;

  /* The fields whose limit is known by name. */
  for (guint k = 0; k < G_N_ELEMENTS (field_limits); k++)
    assert_range (spin (w, field_limits[k].field), field_limits[k].limit, 1.0);
  /* The share is shown in percent. */
  assert_range (spin (w, SW_INSPECTOR_SHARE), SW_LIMIT_DELTA_V_SHARE, 100.0);
  /* The sea-level Isp: the table's range; a value above the stage's vacuum
   * Isp is a conflict the core refuses (test_extremes_valid). */
  for (guint i = 0; i < doc_design (w)->n_stages; i++)
    {
      double lower, upper;

      sw_inspector_set_selected (sw_window_get_inspector (w), (int) i);
      sw_number_field_get_range (spin (w, SW_INSPECTOR_ISP_SL), &lower, &upper);
      g_assert_cmpfloat (lower, ==, isp_sl->min);
      g_assert_cmpfloat (upper, ==, isp_sl->max);
    }
  /* The structural coefficient in each of its forms: the table's range
   * converted by the core (sw_eps_form_range). */
  g_assert_cmpuint (g_list_model_get_n_items (gtk_drop_down_get_model (forms)), ==,
                    SW_EPS_PROPELLANT_FRACTION + 1);
  for (SwEpsForm f = SW_EPS_COEFFICIENT; f <= SW_EPS_PROPELLANT_FRACTION; f++)
    {
      double lo, hi, lower, upper;

      gtk_drop_down_set_selected (forms, f);
      sw_eps_form_range (f, eps->min, eps->max, &lo, &hi);
      sw_number_field_get_range (spin (w, SW_INSPECTOR_EPS), &lower, &upper);
      g_assert_cmpfloat_with_epsilon (lower, lo, 1e-12 * hi);
      g_assert_cmpfloat_with_epsilon (upper, hi, 1e-12 * hi);
      g_assert_true (lower < upper);
    }
  gtk_drop_down_set_selected (forms, SW_EPS_COEFFICIENT);
  assert_range (spin (w, SW_INSPECTOR_EPS), SW_LIMIT_STRUCTURAL_COEFFICIENT, 1.0);

  /* Every spin button of the inspector, including those added after this
   * test was written, shows one of the table's ranges; elsewhere in the
   * window a spin button may instead be a preference with the range of its
   * settings key. */
  collect_spins (GTK_WIDGET (w), spins);
  inspector_spins = 0;
  for (guint k = 0; k < spins->len; k++)
    {
      GtkWidget *s = spins->pdata[k];
      gboolean in_inspector = gtk_widget_is_ancestor (s, GTK_WIDGET (sw_window_get_inspector (w)));

      inspector_spins += in_inspector;

      if (s == widget (w, SW_INSPECTOR_ISP_SL) || s == widget (w, SW_INSPECTOR_EPS))
        continue;  /* checked above: their ranges depend on the stage or the form */
      if (s == widget (w, SW_INSPECTOR_TW))
        continue;  /* a thrust-to-weight that sets the thrust, not a key of the file */
      {
        /* The carpet's axes: a view setting, with the range of whichever key
         * the axis varies once a design is shown (test-staging-page). */
        SwStagingPage *sp = sw_window_get_staging_page (w);
        gboolean carpet = FALSE;
        for (guint a = 0; a < 2; a++)
          for (SwCarpetControl c = SW_CARPET_CONTROL_MIN; c <= SW_CARPET_CONTROL_POINTS; c++)
            carpet |= s == sw_staging_page_get_carpet_control (sp, c, a);
        if (carpet)
          continue;
      }
      if (!matches_some_limit (s) && (in_inspector || !matches_some_setting (s)))
        {
          double lower, upper;
          guint digits;
          field_range (s, &lower, &upper, &digits);
          g_error ("%s: range %g to %g is in no row of the limits table%s", spin_name (s),
                   lower, upper, in_inspector ? "" : " nor the range of a settings key");
        }
    }
  g_assert_cmpuint (inspector_spins, >=, G_N_ELEMENTS (field_limits) + 3);
  g_test_message ("%u number fields in the inspector, %u in the window, each with a range "
                  "from the limits table or the settings schema", inspector_spins,
                  spins->len - inspector_spins);
  sw_test_window_close (w);
}

/* Each field at both ends of what its widget allows, with the other fields
 * as the demo has them, except where the loader ties two fields together:
 * the inclination must lie between |latitude| and 180 - |latitude|, so the
 * inclination is swept from the equator and the latitude with a polar
 * orbit. */
static void
test_extremes_valid (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  SwInspector *inspector = sw_window_get_inspector (w);
  GtkDropDown *mission = GTK_DROP_DOWN (widget (w, SW_INSPECTOR_MISSION_KIND));
  GtkDropDown *forms = GTK_DROP_DOWN (widget (w, SW_INSPECTOR_EPS_FORM));

  g_assert_cmpint (doc_design (w)->mission.kind, ==, SW_MISSION_ORBIT);
  sweep_field (w, spin (w, SW_INSPECTOR_PAYLOAD), "payload", FALSE);
  sweep_field (w, spin (w, SW_INSPECTOR_ALTITUDE), "altitude", FALSE);
  sweep_field (w, spin (w, SW_INSPECTOR_LOSSES), "losses", FALSE);
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_LOSSES), 1500.0));
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_LATITUDE), 0.0));
  sweep_field (w, spin (w, SW_INSPECTOR_INCLINATION), "inclination", FALSE);
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_INCLINATION), 90.0));
  sweep_field (w, spin (w, SW_INSPECTOR_LATITUDE), "site latitude", FALSE);

  gtk_drop_down_set_selected (mission, 0);
  g_assert_cmpint (doc_design (w)->mission.kind, ==, SW_MISSION_DELTA_V);
  assert_design_valid (w, "the switch to a delta-v mission");
  sweep_field (w, spin (w, SW_INSPECTOR_DELTA_V), "delta-v", FALSE);
  gtk_drop_down_set_selected (mission, 1);
  assert_design_valid (w, "the switch back to an orbit");

  for (guint i = 0; i < doc_design (w)->n_stages; i++)
    {
      g_autofree char *vac = g_strdup_printf ("stage %u vacuum Isp", i + 1);
      g_autofree char *sl = g_strdup_printf ("stage %u sea-level Isp", i + 1);
      GtkCheckButton *check;

      sw_inspector_set_selected (inspector, (int) i);
      /* The check button beside the sea-level field turns it on and off. */
      check = GTK_CHECK_BUTTON (gtk_widget_get_prev_sibling (widget (w, SW_INSPECTOR_ISP_SL)));
      g_assert_true (GTK_IS_CHECK_BUTTON (check));
      gtk_check_button_set_active (check, FALSE);
      g_assert_false (doc_design (w)->stages[i].has_isp_sl);
      sweep_field (w, spin (w, SW_INSPECTOR_ISP_VAC), vac, FALSE);
      g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_ISP_VAC), 350.0));
      gtk_check_button_set_active (check, TRUE);
      g_assert_true (doc_design (w)->stages[i].has_isp_sl);
      /* Above 350 s the sea-level Isp is refused: a conflict, not a clamp. */
      sweep_field (w, spin (w, SW_INSPECTOR_ISP_SL), sl, TRUE);
      g_assert_cmpfloat (doc_design (w)->stages[i].isp_sl_s, <=, 350.0);
      /* Lowering the vacuum Isp below the sea-level one is refused on both
       * fields; neither value moves the other. */
      g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_ISP_SL), 340.0));
      g_assert_false (sw_number_field_commit_value (spin (w, SW_INSPECTOR_ISP_VAC), 200.0));
      g_assert_nonnull (sw_number_field_get_error (spin (w, SW_INSPECTOR_ISP_VAC)));
      g_assert_nonnull (sw_number_field_get_error (spin (w, SW_INSPECTOR_ISP_SL)));
      g_assert_cmpfloat (doc_design (w)->stages[i].isp_sl_s, ==, 340.0);
      g_assert_cmpfloat (doc_design (w)->stages[i].isp_vac_s, ==, 350.0);
      g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_ISP_VAC), 345.0));
      g_assert_null (sw_number_field_get_error (spin (w, SW_INSPECTOR_ISP_VAC)));
      g_assert_null (sw_number_field_get_error (spin (w, SW_INSPECTOR_ISP_SL)));
      assert_design_valid (w, "a vacuum Isp refused below the sea-level one");
      for (SwEpsForm f = SW_EPS_COEFFICIENT; f <= SW_EPS_PROPELLANT_FRACTION; f++)
        {
          g_autofree char *eps = g_strdup_printf ("stage %u structure in form %s", i + 1,
                                                  sw_eps_form_to_string (f));
          gtk_drop_down_set_selected (forms, f);
          sweep_field (w, spin (w, SW_INSPECTOR_EPS), eps, FALSE);
        }
      gtk_drop_down_set_selected (forms, SW_EPS_COEFFICIENT);
      g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_EPS), 0.1));
    }

  /* An orbit the site cannot reach: refused on the field, naming the key,
   * and the design keeps its last valid state. */
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_LATITUDE), 28.5));
  g_assert_false (sw_number_field_commit_value (spin (w, SW_INSPECTOR_INCLINATION), 10.0));
  g_assert_nonnull (strstr (sw_number_field_get_error (spin (w, SW_INSPECTOR_INCLINATION)),
                            "an orbit inclined 10 deg cannot be reached"));
  g_assert_cmpfloat (doc_design (w)->mission.inclination_deg, ==, 90.0);
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_INCLINATION), 51.6));
  assert_design_valid (w, "a reachable orbit again");

  /* Manual shares: one stage at 0 % and at 100 %; the others rebalance. */
  sw_inspector_set_selected (inspector, 0);
  g_assert_true (gtk_widget_is_sensitive (widget (w, SW_INSPECTOR_SHARE)));
  sweep_field (w, spin (w, SW_INSPECTOR_SHARE), "stage 1 share", FALSE);
  g_assert_cmpint (doc_design (w)->split, ==, SW_SPLIT_MANUAL);
  sw_test_window_close (w);
}

/* A design with every optional model (reliability, spreads for the Monte
 * Carlo, a baseline, the ascent): the trade pages at the ends of the main
 * fields show no NaN either. */
static void
test_trade_extremes (void)
{
  SwWindow *w = window_with_demo ("skelloway-upgrade-study.stagewright");
  SwInspector *inspector = sw_window_get_inspector (w);

  g_assert_true (doc_design (w)->uncertainty.present);
  g_assert_nonnull (doc_design (w)->baseline);
  sweep_field (w, spin (w, SW_INSPECTOR_PAYLOAD), "payload", FALSE);
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_PAYLOAD), 300.0));
  sw_inspector_set_selected (inspector, 0);
  sweep_field (w, spin (w, SW_INSPECTOR_ISP_VAC), "stage 1 vacuum Isp", TRUE);
  g_assert_true (sw_number_field_commit_value (spin (w, SW_INSPECTOR_ISP_VAC), 311.0));
  sweep_field (w, spin (w, SW_INSPECTOR_EPS), "stage 1 structure", FALSE);
  sw_test_window_close (w);
}

/* The stage count stops at the table's ends whatever the user asks. */
static void
test_stage_count (void)
{
  SwWindow *w = window_with_demo ("small-sat-launcher.stagewright");
  GtkWidget *inspector = GTK_WIDGET (sw_window_get_inspector (w));
  const SwLimit *count = sw_limit_get (SW_LIMIT_STAGE_COUNT);

  for (int k = 0; k < 12; k++)
    gtk_widget_activate_action (inspector, "stage.add", NULL);
  g_assert_cmpuint (doc_design (w)->n_stages, ==, (guint) count->max);
  assert_design_valid (w, "adding stages up to the limit");
  for (int k = 0; k < 3; k++)
    gtk_widget_activate_action (inspector, "stage.duplicate", NULL);
  g_assert_cmpuint (doc_design (w)->n_stages, ==, (guint) count->max);
  gtk_widget_activate_action (GTK_WIDGET (w), "design.split", "s", "manual");
  assert_design_valid (w, "a manual split of the largest vehicle");
  for (int k = 0; k < 12; k++)
    gtk_widget_activate_action (inspector, "stage.remove", NULL);
  g_assert_cmpuint (doc_design (w)->n_stages, ==, (guint) count->min);
  assert_design_valid (w, "removing stages down to the limit");
  sw_test_window_close (w);
}

/* Names longer than the format's limit are cut, never in the middle of a
 * character: the file must stay UTF-8 or the loader rejects it. */
static void
test_long_names (void)
{
  SwWindow *w = window_with_demo ("medium-cargo.stagewright");
  GtkWidget *stage_name = widget (w, SW_INSPECTOR_STAGE_NAME);
  const SwLimit *len = sw_limit_get (SW_LIMIT_NAME_LENGTH);
  g_autoptr (GString) text = g_string_new (NULL);
  g_autoptr (GPtrArray) entries = g_ptr_array_new ();

  /* "é" is two bytes and "€" three: any cut at a byte count can split one. */
  for (int k = 0; k < 200; k++)
    g_string_append (text, k % 3 == 0 ? "€" : "é");
  /* The design's name entry is the first entry of the inspector. */
  {
    g_autoptr (GPtrArray) all = g_ptr_array_new ();
    GtkWidget *root = GTK_WIDGET (sw_window_get_inspector (w));
    GPtrArray *stack = g_ptr_array_new ();
    g_ptr_array_add (stack, root);
    while (stack->len > 0)
      {
        GtkWidget *x = g_ptr_array_steal_index (stack, stack->len - 1);
        if (GTK_IS_ENTRY (x))
          g_ptr_array_add (entries, x);
        for (GtkWidget *c = gtk_widget_get_last_child (x); c != NULL;
             c = gtk_widget_get_prev_sibling (c))
          g_ptr_array_add (stack, c);
      }
    g_ptr_array_free (stack, TRUE);
  }
  g_assert_cmpuint (entries->len, >=, 2);
  for (guint k = 0; k < entries->len; k++)
    {
      GtkWidget *entry = entries->pdata[k];
      const SwDesign *d;

      gtk_editable_set_text (GTK_EDITABLE (entry), text->str);
      d = doc_design (w);
      g_assert_true (g_utf8_validate (d->name, -1, NULL));
      g_assert_true (g_utf8_validate (d->stages[0].name, -1, NULL));
      g_assert_cmpuint (strlen (entry == stage_name ? d->stages[0].name : d->name), <=,
                        (gsize) len->max);
      assert_design_valid (w, entry == stage_name ? "a long stage name" : "a long name");
    }
  sw_test_window_close (w);
}

/* Every key of the file has a field in the window: walk the limits table
 * and find, for each row, the field that edits it (a number field with that
 * row's range, or the one widget for a text, a list or a table). */
static void
test_every_key_has_a_field (void)
{
  SwWindow *w = window_with_demo ("three-stage-simulated.stagewright");
  SwTradePage *trade = sw_window_get_trade_page (w);
  SwEngineTypesEditor *engines = SW_ENGINE_TYPES_EDITOR (
    sw_staging_page_get_engine_types (sw_window_get_staging_page (w)));
  g_autoptr (GPtrArray) fields = g_ptr_array_new ();

  g_signal_emit_by_name (sw_engine_types_editor_get_add_button (engines), "clicked");
  collect_spins (GTK_WIDGET (sw_window_get_inspector (w)), fields);
  for (SwLimitId id = 0; id < SW_N_LIMITS; id++)
    {
      const SwLimit *l = sw_limit_get (id);
      GtkWidget *found = NULL;

      for (guint k = 0; k < fields->len && found == NULL; k++)
        if (SW_IS_NUMBER_FIELD (fields->pdata[k])
            && sw_number_field_get_limit (fields->pdata[k]) == id)
          found = fields->pdata[k];
      switch (id)
        {
        case SW_LIMIT_STAGE_COUNT:
          found = widget (w, SW_INSPECTOR_STAGE_LIST);
          g_assert_true (gtk_widget_activate_action (GTK_WIDGET (sw_window_get_inspector (w)),
                                                     "stage.add", NULL));
          break;
        case SW_LIMIT_NAME_LENGTH:
          found = widget (w, SW_INSPECTOR_STAGE_NAME);
          break;
        case SW_LIMIT_NOTES_LENGTH:
          found = widget (w, SW_INSPECTOR_NOTES);
          break;
        case SW_LIMIT_DRAG_POINTS:
        case SW_LIMIT_DRAG_MACH:
        case SW_LIMIT_DRAG_CD:
          found = widget (w, SW_INSPECTOR_DRAG);
          break;
        /* The uncertainty object is edited beside the Monte Carlo it drives. */
        case SW_LIMIT_MC_SAMPLES:
          found = sw_trade_page_get_field (trade, SW_TRADE_FIELD_SAMPLES);
          break;
        case SW_LIMIT_MC_SEED:
          found = sw_trade_page_get_field (trade, SW_TRADE_FIELD_SEED);
          break;
        case SW_LIMIT_SPREAD_SIGMA_PERCENT:
        case SW_LIMIT_SPREAD_HALF_RANGE_PERCENT:
          found = sw_trade_page_get_field (trade, SW_TRADE_FIELD_ISP_WIDTH);
          g_assert_nonnull (sw_trade_page_get_field (trade, SW_TRADE_FIELD_EPS_WIDTH));
          g_assert_nonnull (sw_trade_page_get_field (trade, SW_TRADE_FIELD_ISP_KIND));
          break;
        case SW_LIMIT_LOSSES_SIGMA:
        case SW_LIMIT_LOSSES_HALF_RANGE:
          found = sw_trade_page_get_field (trade, SW_TRADE_FIELD_LOSSES_WIDTH);
          break;
        /* The economics keys are edited on the staging-decision tab, the
         * lists in its engine-types editor (one type added for the test). */
        case SW_LIMIT_ENGINE_TYPES:
          found = sw_engine_types_editor_get_add_button (engines);
          break;
        case SW_LIMIT_ENGINE_DRY_MASS:
          found = sw_engine_types_editor_get_widget (engines, 0, SW_ENGINE_TYPE_DRY_MASS);
          g_assert_true (SW_IS_NUMBER_FIELD (found));
          g_assert_cmpint (sw_number_field_get_limit (SW_NUMBER_FIELD (found)), ==, id);
          break;
        case SW_LIMIT_ECON_STAGE_INDEX:
          found = sw_engine_types_editor_get_stage_check (engines, 0, 0);
          g_assert_nonnull (sw_engine_types_editor_get_developed_stage (engines, 0));
          break;
        case SW_LIMIT_PROPELLANT_NAME_LENGTH:
          found = widget (w, SW_INSPECTOR_PROPELLANT_NAME);
          g_assert_nonnull (widget (w, SW_INSPECTOR_BOOSTER_PROPELLANT_NAME));
          break;
        case SW_LIMIT_CURRENCY_LENGTH:
          found = sw_staging_page_get_carpet_control (sw_window_get_staging_page (w),
                                                      SW_CARPET_CONTROL_CURRENCY, 0);
          break;
        /* Not a key of the file: the tornado's step, a preference. */
        case SW_LIMIT_SENSITIVITY_STEP:
          found = sw_trade_page_get_field (trade, SW_TRADE_FIELD_STEP);
          break;
        default:
          for (guint k = 0; k < SW_N_ECON_NUMBERS && found == NULL; k++)
            if (sw_economics_number_limit (k) == id)
              found = sw_staging_page_get_field (sw_window_get_staging_page (w), k);
          break;
        }
      if (found == NULL)
        g_error ("%s: no field in the window edits this key", l->key);
      g_assert_true (gtk_widget_get_root (found) == GTK_ROOT (w));
    }
  /* The loss model and the thrust, in both its forms. */
  g_assert_true (GTK_IS_DROP_DOWN (widget (w, SW_INSPECTOR_LOSS_MODEL)));
  g_assert_true (SW_IS_NUMBER_FIELD (widget (w, SW_INSPECTOR_THRUST)));
  g_assert_true (SW_IS_NUMBER_FIELD (widget (w, SW_INSPECTOR_ENGINE_THRUST)));
  sw_test_window_close (w);
}


/* ---- every text, choice and list key ------------------------------------ */

static GtkWidget *
find_widget (GtkWidget *root, const char *id, const char *action)
{
  if (id != NULL && GTK_IS_BUILDABLE (root)
      && g_strcmp0 (gtk_buildable_get_buildable_id (GTK_BUILDABLE (root)), id) == 0)
    return root;
  if (action != NULL && GTK_IS_ACTIONABLE (root)
      && g_strcmp0 (gtk_actionable_get_action_name (GTK_ACTIONABLE (root)), action) == 0)
    return root;
  for (GtkWidget *c = gtk_widget_get_first_child (root); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    {
      GtkWidget *found = find_widget (c, id, action);
      if (found != NULL)
        return found;
    }
  return NULL;
}

/* The leaves of a saved design that are not numbers (numbers are the limits
 * table's, checked above): texts, choices, true/false and lists of stage
 * indices, by path with "[]" for any index. */
static void
collect_leaves (JsonNode *node, const char *path, GHashTable *out)
{
  switch (json_node_get_node_type (node))
    {
    case JSON_NODE_OBJECT:
      {
        JsonObject *o = json_node_get_object (node);
        g_autoptr (GList) members = json_object_get_members (o);
        for (GList *m = members; m != NULL; m = m->next)
          {
            g_autofree char *sub = path[0] != '\0' ? g_strdup_printf ("%s.%s", path,
                                                                       (char *) m->data)
                                                   : g_strdup (m->data);
            collect_leaves (json_object_get_member (o, m->data), sub, out);
          }
        break;
      }
    case JSON_NODE_ARRAY:
      {
        JsonArray *a = json_node_get_array (node);
        g_autofree char *sub = g_strdup_printf ("%s[]", path);
        gboolean objects = FALSE;
        for (guint i = 0; i < json_array_get_length (a); i++)
          if (JSON_NODE_HOLDS_OBJECT (json_array_get_element (a, i)))
            {
              objects = TRUE;
              collect_leaves (json_array_get_element (a, i), sub, out);
            }
        if (!objects)
          g_hash_table_add (out, g_strdup (sub));
        break;
      }
    case JSON_NODE_VALUE:
      if (json_node_get_value_type (node) != G_TYPE_DOUBLE
          && json_node_get_value_type (node) != G_TYPE_INT64)
        g_hash_table_add (out, g_strdup (path));
      break;
    case JSON_NODE_NULL:
    default:
      g_hash_table_add (out, g_strdup (path));
      break;
    }
}

/* The widget that edits a text, choice or list key, NULL for none. */
static GtkWidget *
text_key_widget (SwWindow *w, const char *path)
{
  GtkWidget *inspector = GTK_WIDGET (sw_window_get_inspector (w));
  SwTradePage *trade = sw_window_get_trade_page (w);
  SwStagingPage *staging = sw_window_get_staging_page (w);
  SwEngineTypesEditor *engines = SW_ENGINE_TYPES_EDITOR (sw_staging_page_get_engine_types (staging));
  /* The design's name is the first entry of the panel. */
  static const char *const stage_keys[][2] = {
    { "stages[].name", "stage-name" },
    { "stages[].propellant", "propellant" },
    { "stages[].propellant.name", "propellant-name" },
  };

  static const struct { const char *path; SwInspectorField field; } booster_keys[] = {
    { "boosters.name", SW_INSPECTOR_BOOSTER_NAME },
    { "boosters.crossfeed", SW_INSPECTOR_BOOSTER_CROSSFEED },
    { "boosters.propellant", SW_INSPECTOR_BOOSTER_PROPELLANT },
    { "boosters.propellant.name", SW_INSPECTOR_BOOSTER_PROPELLANT_NAME },
  };

  for (guint k = 0; k < G_N_ELEMENTS (booster_keys); k++)
    if (g_strcmp0 (path, booster_keys[k].path) == 0)
      return widget (w, booster_keys[k].field);
  if (g_str_has_prefix (path, "baseline."))
    return find_widget (GTK_WIDGET (w), NULL, "design.pin-baseline");
  for (guint k = 0; k < G_N_ELEMENTS (stage_keys); k++)
    if (g_strcmp0 (path, stage_keys[k][0]) == 0)
      return widget (w, k == 0 ? SW_INSPECTOR_STAGE_NAME
                        : k == 1 ? SW_INSPECTOR_PROPELLANT : SW_INSPECTOR_PROPELLANT_NAME);
  if (g_strcmp0 (path, "format") == 0 || g_strcmp0 (path, "version") == 0)
    return GTK_WIDGET (w);  /* written by the program, not the user's */
  if (g_strcmp0 (path, "name") == 0)
    return find_widget (inspector, "name_entry", NULL);
  if (g_strcmp0 (path, "notes") == 0)
    return widget (w, SW_INSPECTOR_NOTES);
  if (g_strcmp0 (path, "split") == 0)
    return find_widget (inspector, "split_equal", NULL);
  if (g_strcmp0 (path, "mission.loss_model") == 0)
    return widget (w, SW_INSPECTOR_LOSS_MODEL);
  if (g_strcmp0 (path, "uncertainty.isp_vac.distribution") == 0)
    return sw_trade_page_get_field (trade, SW_TRADE_FIELD_ISP_KIND);
  if (g_strcmp0 (path, "uncertainty.structural_coefficient.distribution") == 0)
    return sw_trade_page_get_field (trade, SW_TRADE_FIELD_EPS_KIND);
  if (g_strcmp0 (path, "uncertainty.losses.distribution") == 0)
    return sw_trade_page_get_field (trade, SW_TRADE_FIELD_LOSSES_KIND);
  if (g_strcmp0 (path, "economics.recovery.mode") == 0)
    return sw_staging_page_get_mode (staging);
  if (g_strcmp0 (path, "economics.recovery.booster_mode") == 0)
    return sw_staging_page_get_booster_mode (staging);
  if (g_strcmp0 (path, "economics.currency") == 0)
    return sw_staging_page_get_carpet_control (staging, SW_CARPET_CONTROL_CURRENCY, 0);
  if (g_strcmp0 (path, "economics.engine_types[].name") == 0)
    return sw_engine_types_editor_get_widget (engines, 0, SW_ENGINE_TYPE_NAME);
  if (g_strcmp0 (path, "economics.engine_types[].developed") == 0)
    return sw_engine_types_editor_get_widget (engines, 0, SW_ENGINE_TYPE_DEVELOPED);
  if (g_strcmp0 (path, "economics.engine_types[].on_stages[]") == 0)
    return sw_engine_types_editor_get_stage_check (engines, 0, 0);
  if (g_strcmp0 (path, "economics.developed_boosters") == 0)
    return sw_engine_types_editor_get_boosters_developed (engines);
  if (g_strcmp0 (path, "economics.developed_stages[]") == 0)
    return sw_engine_types_editor_get_developed_stage (engines, 0);
  return NULL;
}

/* Every key of a file that uses every kind of key (texts, choices, lists,
 * true/false) has a widget in the window.  The design is saved and its
 * JSON walked, so a key added to the format without a widget fails here. */
static void
test_every_text_and_list_key_has_a_widget (void)
{
  SwWindow *w = window_with_demo ("three-stage-simulated.stagewright");
  SwDocument *doc = sw_window_get_document (w);
  g_autoptr (SwDesign) d = sw_document_dup_design (doc);
  g_autoptr (GHashTable) leaves = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autoptr (GString) missing = g_string_new (NULL);
  g_autofree char *data = NULL;
  g_autoptr (GList) keys = NULL;

  g_assert_true (sw_design_add_engine_type (d, NULL));
  g_assert_true (sw_design_set_engine_type_on_stage (d, 0, 1, TRUE, NULL));
  g_assert_true (sw_design_set_engine_type_developed (d, 0, TRUE, NULL));
  g_assert_true (sw_design_set_stage_developed (d, 0, TRUE, NULL));
  g_assert_true (sw_design_set_propellant (d, 0, SW_PROPELLANT_CUSTOM, NULL));
  g_assert_true (sw_design_set_propellant_name (d, 0, "Own mix", NULL));
  g_assert_true (sw_design_set_propellant (d, 1, SW_PROPELLANT_LOX_KEROSENE, NULL));
  /* Boosters burning a propellant of the user's own, fed from the core. */
  g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_COUNT, 0, 2.0, NULL));
  /* A fixed load: this test is about widgets, not a long booster sizing. */
  g_assert_true (sw_design_field_set (d, SW_FIELD_BOOSTER_PROPELLANT_LOAD, 0, 5000.0, NULL));
  g_assert_true (sw_design_set_booster_crossfeed (d, TRUE, NULL));
  g_assert_true (sw_design_set_booster_propellant (d, SW_PROPELLANT_CUSTOM, NULL));
  g_assert_true (sw_design_set_booster_propellant_name (d, "Booster mix", NULL));
  g_assert_true (sw_design_set_boosters_developed (d, TRUE, NULL));
  g_assert_true (sw_design_set_spread (d, 0, SW_SPREAD_NORMAL, 1.0, NULL));
  g_assert_true (sw_design_set_spread (d, 1, SW_SPREAD_UNIFORM, 5.0, NULL));
  g_assert_true (sw_design_set_spread (d, 2, SW_SPREAD_NORMAL, 100.0, NULL));
  sw_economics_set_recovery_mode (&d->economics, SW_RECOVERY_DOWNRANGE);
  g_assert_true (sw_economics_set_currency (&d->economics, "kEUR", NULL));
  sw_design_pin_baseline (d);
  data = sw_design_to_data (d, NULL);
  sw_document_commit (doc, g_steal_pointer (&d), NULL);
  wait_shown (w);
  g_assert_true (json_parser_load_from_data (parser, data, -1, NULL));
  collect_leaves (json_parser_get_root (parser), "", leaves);
  /* The walk sees the keys this test set up. */
  g_assert_true (g_hash_table_contains (leaves, "economics.engine_types[].on_stages[]"));
  g_assert_true (g_hash_table_contains (leaves, "stages[].propellant.name"));
  g_assert_true (g_hash_table_contains (leaves, "boosters.propellant.name"));
  g_assert_true (g_hash_table_contains (leaves, "economics.developed_boosters"));
  g_assert_true (g_hash_table_contains (leaves, "uncertainty.losses.distribution"));
  g_assert_true (g_hash_table_contains (leaves, "economics.currency"));

  keys = g_hash_table_get_keys (leaves);
  keys = g_list_sort (keys, (GCompareFunc) g_strcmp0);
  for (GList *k = keys; k != NULL; k = k->next)
    {
      GtkWidget *found = text_key_widget (w, k->data);
      if (found == NULL || gtk_widget_get_root (found) != GTK_ROOT (w))
        g_string_append_printf (missing, " %s", (char *) k->data);
    }
  if (missing->len > 0)
    g_error ("keys of the file with no widget in the window:%s", missing->str);
  sw_test_window_close (w);
}

/* The fields added for the ascent, reliability and guidance keys at both
 * ends of their ranges and with bad text, on each stage. */
static void
test_model_fields_extremes (void)
{
  static const SwInspectorField stage_fields[] = {
    SW_INSPECTOR_THRUST, SW_INSPECTOR_ENGINE_COUNT, SW_INSPECTOR_ENGINE_THRUST,
    SW_INSPECTOR_DIAMETER, SW_INSPECTOR_COAST, SW_INSPECTOR_ENGINE_RELIABILITY,
    SW_INSPECTOR_FAILURES_TOLERATED, SW_INSPECTOR_IGNITION_RELIABILITY,
    SW_INSPECTOR_SEPARATION_RELIABILITY,
  };
  static const SwInspectorField design_fields[] = {
    SW_INSPECTOR_FAIRING_ALTITUDE, SW_INSPECTOR_FAIRING_PRESSURE, SW_INSPECTOR_FAIRING_MASS,
    SW_INSPECTOR_PITCH_OVER_SPEED, SW_INSPECTOR_PITCH_KICK, SW_INSPECTOR_INSERTION_ALTITUDE,
    SW_INSPECTOR_MAX_Q_ALPHA,
  };
  SwWindow *w = window_with_demo ("three-stage-simulated.stagewright");
  SwInspector *inspector = sw_window_get_inspector (w);

  for (guint i = 0; i < doc_design (w)->n_stages; i++)
    {
      sw_inspector_set_selected (inspector, (int) i);
      for (guint k = 0; k < G_N_ELEMENTS (stage_fields); k++)
        {
          g_autofree char *what = g_strdup_printf ("stage %u field %d", i + 1, stage_fields[k]);
          /* The coast of the first stage, engine failures against the
           * engines, a thrust per engine without an engine count: rules
           * between keys may refuse an end. */
          sweep_field (w, spin (w, stage_fields[k]), what, TRUE);
        }
    }
  for (guint k = 0; k < G_N_ELEMENTS (design_fields); k++)
    {
      g_autofree char *what = g_strdup_printf ("design field %d", design_fields[k]);
      sweep_field (w, spin (w, design_fields[k]), what, TRUE);
    }
  sw_test_window_close (w);
}

/* ---- main -------------------------------------------------------------- */

int
main (int argc, char **argv)
{
  int status;

  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-limits-XXXXXX");

  g_test_add_func ("/gui/limits/spin-ranges", test_spin_ranges);
  g_test_add_func ("/gui/limits/extremes-valid", test_extremes_valid);
  g_test_add_func ("/gui/limits/trade-extremes", test_trade_extremes);
  g_test_add_func ("/gui/limits/stage-count", test_stage_count);
  g_test_add_func ("/gui/limits/long-names", test_long_names);
  g_test_add_func ("/gui/limits/every-key-has-a-field", test_every_key_has_a_field);
  g_test_add_func ("/gui/limits/every-text-and-list-key-has-a-widget",
                   test_every_text_and_list_key_has_a_widget);
  g_test_add_func ("/gui/limits/model-fields-extremes", test_model_fields_extremes);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
