/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Limits everywhere: every spin button of the main window takes its range
 * from the core's one table (src/core/sw-limits.c), and no value the
 * widgets accept (each field at its lowest and highest, typed text out of
 * range, stage counts at both ends, long names) gives a design that the
 * loader's validation rejects or a NaN on screen.  Suite 'gui' (Xvfb). */
#include "config.h"

#include "sw-application.h"
#include "sw-limits.h"
#include "sw-sizing.h"
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

static GtkSpinButton *
spin (SwWindow *w, SwInspectorField f)
{
  return GTK_SPIN_BUTTON (widget (w, f));
}

static const SwDesign *
doc_design (SwWindow *w)
{
  return sw_document_get_design (sw_window_get_document (w));
}

static void
collect_spins (GtkWidget *root, GPtrArray *out)
{
  if (GTK_IS_SPIN_BUTTON (root))
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
  return lower > min && lower <= min + pow (10.0, -(double) digits) + tol;
}

static void
assert_range (GtkSpinButton *s, SwLimitId id, double scale)
{
  double lower, upper;

  gtk_spin_button_get_range (s, &lower, &upper);
  if (!range_matches (lower, upper, gtk_spin_button_get_digits (s), scale, sw_limit_get (id)))
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
 * non-numeric text into it, each as its own edit. */
static void
sweep_field (SwWindow *w, GtkSpinButton *s, const char *what)
{
  static const char *const typed[] = { "-1e30", "1e30", "nan", "inf", "-inf", "", "abc" };
  double lower, upper;

  gtk_spin_button_get_range (s, &lower, &upper);
  for (int k = 0; k < 2; k++)
    {
      g_autofree char *label = g_strdup_printf ("%s at %s (%g)", what, k ? "its highest" :
                                                "its lowest", k ? upper : lower);
      gtk_spin_button_set_value (s, k ? upper : lower);
      g_assert_cmpfloat (gtk_spin_button_get_value (s), ==, k ? upper : lower);
      assert_design_valid (w, label);
    }
  for (guint k = 0; k < G_N_ELEMENTS (typed); k++)
    {
      g_autofree char *label = g_strdup_printf ("%s typed \"%s\"", what, typed[k]);
      double v;

      gtk_editable_set_text (GTK_EDITABLE (s), typed[k]);
      gtk_spin_button_update (s);
      v = gtk_spin_button_get_value (s);
      g_assert_true (isfinite (v) && v >= lower && v <= upper);
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
matches_some_limit (GtkSpinButton *s)
{
  double lower, upper;
  guint digits = gtk_spin_button_get_digits (s);

  gtk_spin_button_get_range (s, &lower, &upper);
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
matches_some_setting (GtkSpinButton *s)
{
  g_autoptr (GSettings) settings = sw_application_settings_new ();
  g_autoptr (GSettingsSchema) schema = NULL;
  g_auto (GStrv) keys = NULL;
  double lower, upper;

  gtk_spin_button_get_range (s, &lower, &upper);
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
  /* The sea-level Isp: the table's range, capped by the stage's vacuum Isp. */
  for (guint i = 0; i < doc_design (w)->n_stages; i++)
    {
      double lower, upper;

      sw_inspector_set_selected (sw_window_get_inspector (w), (int) i);
      gtk_spin_button_get_range (spin (w, SW_INSPECTOR_ISP_SL), &lower, &upper);
      g_assert_cmpfloat (lower, ==, isp_sl->min);
      g_assert_cmpfloat (upper, ==, MIN (isp_sl->max, doc_design (w)->stages[i].isp_vac_s));
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
      gtk_spin_button_get_range (spin (w, SW_INSPECTOR_EPS), &lower, &upper);
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
      if (!matches_some_limit (GTK_SPIN_BUTTON (s))
          && (in_inspector || !matches_some_setting (GTK_SPIN_BUTTON (s))))
        {
          double lower, upper;
          gtk_spin_button_get_range (GTK_SPIN_BUTTON (s), &lower, &upper);
          g_error ("%s: range %g to %g is in no row of the limits table%s", spin_name (s),
                   lower, upper, in_inspector ? "" : " nor the range of a settings key");
        }
    }
  g_assert_cmpuint (inspector_spins, >=, G_N_ELEMENTS (field_limits) + 3);
  g_test_message ("%u spin buttons in the inspector, %u in the window, each with a range "
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
  sweep_field (w, spin (w, SW_INSPECTOR_PAYLOAD), "payload");
  sweep_field (w, spin (w, SW_INSPECTOR_ALTITUDE), "altitude");
  sweep_field (w, spin (w, SW_INSPECTOR_LOSSES), "losses");
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_LATITUDE), 0.0);
  sweep_field (w, spin (w, SW_INSPECTOR_INCLINATION), "inclination");
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_INCLINATION), 90.0);
  sweep_field (w, spin (w, SW_INSPECTOR_LATITUDE), "site latitude");

  gtk_drop_down_set_selected (mission, 0);
  g_assert_cmpint (doc_design (w)->mission.kind, ==, SW_MISSION_DELTA_V);
  assert_design_valid (w, "the switch to a delta-v mission");
  sweep_field (w, spin (w, SW_INSPECTOR_DELTA_V), "delta-v");
  gtk_drop_down_set_selected (mission, 1);
  assert_design_valid (w, "the switch back to an orbit");

  for (guint i = 0; i < doc_design (w)->n_stages; i++)
    {
      g_autofree char *vac = g_strdup_printf ("stage %u vacuum Isp", i + 1);
      g_autofree char *sl = g_strdup_printf ("stage %u sea-level Isp", i + 1);
      GtkCheckButton *check;

      sw_inspector_set_selected (inspector, (int) i);
      sweep_field (w, spin (w, SW_INSPECTOR_ISP_VAC), vac);
      gtk_spin_button_set_value (spin (w, SW_INSPECTOR_ISP_VAC), 350.0);
      /* The check button beside the sea-level field turns it on. */
      check = GTK_CHECK_BUTTON (gtk_widget_get_prev_sibling (widget (w, SW_INSPECTOR_ISP_SL)));
      g_assert_true (GTK_IS_CHECK_BUTTON (check));
      gtk_check_button_set_active (check, TRUE);
      g_assert_true (doc_design (w)->stages[i].has_isp_sl);
      sweep_field (w, spin (w, SW_INSPECTOR_ISP_SL), sl);
      /* Lowering the vacuum Isp pulls the sea-level Isp down with it. */
      gtk_spin_button_set_value (spin (w, SW_INSPECTOR_ISP_SL), 350.0);
      gtk_spin_button_set_value (spin (w, SW_INSPECTOR_ISP_VAC), 200.0);
      g_assert_cmpfloat (doc_design (w)->stages[i].isp_sl_s, <=, 200.0);
      assert_design_valid (w, "a vacuum Isp below the sea-level one");
      for (SwEpsForm f = SW_EPS_COEFFICIENT; f <= SW_EPS_PROPELLANT_FRACTION; f++)
        {
          g_autofree char *eps = g_strdup_printf ("stage %u structure in form %s", i + 1,
                                                  sw_eps_form_to_string (f));
          gtk_drop_down_set_selected (forms, f);
          sweep_field (w, spin (w, SW_INSPECTOR_EPS), eps);
        }
      gtk_drop_down_set_selected (forms, SW_EPS_COEFFICIENT);
      gtk_spin_button_set_value (spin (w, SW_INSPECTOR_EPS), 0.1);
    }

  /* The one pair the widgets cannot keep consistent on their own: an orbit
   * the site cannot reach is shown as a clear error naming the field, with
   * no number on screen, and it is not a file the GUI can write. */
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_LATITUDE), 28.5);
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_INCLINATION), 10.0);
  wait_shown (w);
  g_assert_false (sw_window_get_shown_result (w)->ok);
  g_assert_nonnull (strstr (sw_window_get_shown_result (w)->error_message, "inclination_deg"));
  assert_totals_finite (w);
  {
    g_autofree char *path = g_build_filename (tmp_dir, "unreachable.stagewright", NULL);
    g_autoptr (GFile) file = g_file_new_for_path (path);
    g_autoptr (GError) error = NULL;
    g_assert_false (sw_window_save_to (w, file, &error));
    g_assert_nonnull (error);
    g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
  }
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_INCLINATION), 51.6);
  assert_design_valid (w, "a reachable orbit again");

  /* Manual shares: one stage at 0 % and at 100 %; the others rebalance. */
  sw_inspector_set_selected (inspector, 0);
  g_assert_true (gtk_widget_is_sensitive (widget (w, SW_INSPECTOR_SHARE)));
  sweep_field (w, spin (w, SW_INSPECTOR_SHARE), "stage 1 share");
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
  sweep_field (w, spin (w, SW_INSPECTOR_PAYLOAD), "payload");
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_PAYLOAD), 300.0);
  sw_inspector_set_selected (inspector, 0);
  sweep_field (w, spin (w, SW_INSPECTOR_ISP_VAC), "stage 1 vacuum Isp");
  gtk_spin_button_set_value (spin (w, SW_INSPECTOR_ISP_VAC), 311.0);
  sweep_field (w, spin (w, SW_INSPECTOR_EPS), "stage 1 structure");
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

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
