/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window's export hands over the analysis the solver gave the window:
 * no ascent is flown again.  And the window's analysis, the CLI's
 * `size --json`, the CSV and the sheet show the same numbers. */
#include "config.h"

#include "sw-ascent-private.h"
#include "sw-csv.h"
#include "sw-export-dialog.h"
#include "sw-solver.h"
#include "sw-totals.h"

#include <glib/gstdio.h>
#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>

static SwAnalysis *solved;

static void
solved_cb (SwSolver *solver, SwAnalysis *a, gpointer data)
{
  g_clear_pointer (&solved, sw_analysis_unref);
  solved = sw_analysis_ref (a);
}

static gboolean
timeout_cb (gpointer data)
{
  g_error ("timed out waiting for %s", (const char *) data);
  return G_SOURCE_REMOVE;
}

/* The analysis the window gets for @design: the solver's last phase. */
static SwAnalysis *
window_analysis (const SwDesign *design)
{
  g_autoptr (SwSolver) solver = sw_solver_new ();
  guint timeout = g_timeout_add_seconds (60, timeout_cb, (gpointer) "the solver");

  g_signal_connect (solver, "solved", G_CALLBACK (solved_cb), NULL);
  sw_solver_post (solver, design);
  while (solved == NULL || solved->ascent_pending || solved->montecarlo_pending)
    g_main_context_iteration (NULL, TRUE);
  g_source_remove (timeout);
  return g_steal_pointer (&solved);
}

static gboolean export_done;
static GPtrArray *export_written;

static void
export_cb (GObject *source, GAsyncResult *res, gpointer data)
{
  g_autoptr (GError) error = NULL;

  export_written = sw_export_run_finish (res, &error);
  g_assert_no_error (error);
  export_done = TRUE;
}

static SwDesign *
demo (const char *basename)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            basename, NULL);
  g_autoptr (GError) error = NULL;
  SwDesign *d = sw_design_load (path, NULL, &error);

  g_assert_no_error (error);
  return d;
}

/* Relative agreement of two printed numbers: JSON keeps 17 digits, the
 * CSV 10 ("%.10g"), so 1e-9 is what the coarser of the two justifies. */
static void
assert_close (double a, double b)
{
  if (!(fabs (a - b) <= 1e-9 * MAX (fabs (a), fabs (b))))
    g_error ("%.17g and %.17g differ", a, b);
}

static void
test_export_flies_nothing (void)
{
  g_autoptr (SwDesign) d = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwAnalysis) a = window_analysis (d);
  g_autofree char *dir = g_dir_make_tmp ("sw-export-XXXXXX", NULL);
  g_autofree char *pdf = g_build_filename (dir, "sheet.pdf", NULL);
  g_autofree char *csv = g_build_filename (dir, "tables", NULL);
  guint before, timeout;

  g_assert_nonnull (a->ascent);
  before = sw_ascent_private_design_runs ();
  timeout = g_timeout_add_seconds (60, timeout_cb, (gpointer) "the export");
  sw_export_run_async (a, SW_SHEET_PDF, SW_PAPER_A4, pdf, csv, NULL, export_cb, NULL);
  while (!export_done)
    g_main_context_iteration (NULL, TRUE);
  g_source_remove (timeout);
  /* The sheet and the tables written, and not one ascent flown. */
  g_assert_cmpuint (export_written->len, >=, 2);
  g_assert_cmpuint (sw_ascent_private_design_runs (), ==, before);
  g_clear_pointer (&export_written, g_ptr_array_unref);
  for (guint i = 0; i < 2; i++)
    {
      g_autoptr (GDir) dd = g_dir_open (i == 0 ? csv : dir, 0, NULL);
      const char *name;
      while (dd != NULL && (name = g_dir_read_name (dd)) != NULL)
        {
          g_autofree char *p = g_build_filename (i == 0 ? csv : dir, name, NULL);
          g_remove (p);
        }
    }
  g_rmdir (csv);
  g_rmdir (dir);
}

/* Export asked for while the window's ascent is still being simulated: the
 * dialog waits for the window's next analysis and flies nothing itself. */
static void
test_dialog_waits_for_ascent (void)
{
  g_autoptr (SwDesign) d = demo ("small-sat-launcher.stagewright");
  g_autoptr (SwAnalysis) fast = sw_analysis_new (d, 1, NULL, NULL);
  g_autoptr (SwAnalysis) flown = NULL;
  g_autofree char *dir = g_dir_make_tmp ("sw-wait-XXXXXX", NULL);
  g_autofree char *pdf = g_build_filename (dir, "sheet.pdf", NULL);
  g_autofree char *text = NULL;
  SwExportDialog *dialog;
  gboolean failed = TRUE;
  guint before, timeout;

  g_assert_true (fast->ascent_pending);
  dialog = sw_export_dialog_new (NULL, fast, NULL);
  sw_export_dialog_set_targets (dialog, SW_SHEET_PDF, SW_PAPER_A4, pdf, NULL);
  before = sw_ascent_private_design_runs ();
  sw_export_dialog_export (dialog);
  g_assert_true (sw_export_dialog_is_busy (dialog));
  g_assert_cmpstr (sw_export_dialog_get_status (dialog, NULL), ==,
                   "Waiting for the simulated ascent\u2026");
  g_assert_false (g_file_test (pdf, G_FILE_TEST_EXISTS));

  /* What the solver would deliver next (flown here, by the test). */
  flown = sw_analysis_add_ascent (fast, NULL);
  before += 1;
  g_assert_cmpuint (sw_ascent_private_design_runs (), ==, before);
  sw_export_dialog_set_result (dialog, flown);
  timeout = g_timeout_add_seconds (60, timeout_cb, (gpointer) "the waiting export");
  while (sw_export_dialog_is_busy (dialog))
    g_main_context_iteration (NULL, TRUE);
  g_source_remove (timeout);
  g_assert_nonnull (sw_export_dialog_get_status (dialog, &failed));
  g_assert_false (failed);
  g_assert_cmpuint (sw_ascent_private_design_runs (), ==, before);
  {
    const char *pt[] = { "pdftotext", pdf, "-", NULL };
    g_assert_true (g_spawn_sync (NULL, (char **) pt, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL,
                                 &text, NULL, NULL, NULL));
  }
  /* The sheet carries the flown verdict, never the pending one.  (The demo
   * reaches its orbit since its thrust and allowance were set to fly; a
   * short design would print "Does not reach the orbit".) */
  g_assert_cmpint (flown->verdict.state, ==, SW_VERDICT_REACHES_ORBIT);
  g_assert_nonnull (strstr (text, "Reaches the orbit"));
  g_assert_null (strstr (text, "Simulating the ascent"));
  gtk_window_destroy (GTK_WINDOW (dialog));
  g_remove (pdf);
  g_rmdir (dir);
}

/* The CSV's "total" row: liftoff mass is the 10th field. */
static double
csv_liftoff (const char *text)
{
  g_auto (GStrv) lines = g_strsplit (text, "\n", -1);

  for (guint i = 0; lines[i] != NULL; i++)
    if (g_str_has_prefix (lines[i], "total,"))
      {
        g_auto (GStrv) f = g_strsplit (lines[i], ",", -1);
        g_assert_cmpuint (g_strv_length (f), >=, 10);
        return g_ascii_strtod (f[9], NULL);
      }
  g_assert_not_reached ();
}

/* The propellant and structure columns of the stage table (the boosters'
 * row included) add up to the total row. */
static void
csv_columns_add_up (const char *text)
{
  g_auto (GStrv) lines = g_strsplit (text, "\n", -1);
  double sum[2] = { 0.0, 0.0 }, total[2] = { NAN, NAN };

  for (guint i = 0; lines[i] != NULL; i++)
    {
      g_auto (GStrv) f = NULL;
      if (lines[i][0] == '#' || g_str_has_prefix (lines[i], "stage,") || lines[i][0] == '\0')
        continue;
      f = g_strsplit (lines[i], ",", -1);
      g_assert_cmpuint (g_strv_length (f), >=, 10);
      for (guint k = 0; k < 2; k++)
        {
          double v = g_ascii_strtod (f[7 + k], NULL);
          if (g_str_has_prefix (lines[i], "total,"))
            total[k] = v;
          else
            sum[k] += v;
        }
    }
  for (guint k = 0; k < 2; k++)
    g_assert_cmpfloat (fabs (sum[k] - total[k]), <=, 1e-6 * total[k] + 1e-3);
}

/* The sheet's "Liftoff mass 44,916 kg": the figure rounded to the kilogram. */
static double
sheet_liftoff (const char *text)
{
  const char *p = strstr (text, "Liftoff mass ");
  GString *digits = g_string_new (NULL);
  double v;

  g_assert_nonnull (p);
  for (p += strlen ("Liftoff mass "); *p != '\0' && *p != ' '; p++)
    if (g_ascii_isdigit (*p))
      g_string_append_c (digits, *p);
  v = g_ascii_strtod (digits->str, NULL);
  g_string_free (digits, TRUE);
  return v;
}

static void
check_same_numbers (const char *basename)
{
  g_autoptr (SwDesign) d = demo (basename);
  g_autoptr (SwAnalysis) a = window_analysis (d);
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            basename, NULL);
  const char *argv[] = { g_getenv ("SW_CLI"), "size", "--json", path, NULL };
  g_autofree char *out = NULL, *csv = NULL, *text = NULL;
  g_autofree char *dir = g_dir_make_tmp ("sw-same-XXXXXX", NULL);
  g_autofree char *pdf = g_build_filename (dir, "sheet.pdf", NULL);
  g_autoptr (JsonParser) parser = json_parser_new ();
  g_autoptr (GError) error = NULL;
  JsonObject *o;
  JsonArray *stages;
  int status;

  g_assert_nonnull (argv[0]);
  g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL, &out,
                               NULL, &status, &error));
  g_assert_no_error (error);
  g_assert_true (json_parser_load_from_data (parser, out, -1, &error));
  o = json_node_get_object (json_parser_get_root (parser));

  /* CLI against the window. */
  g_assert_cmpstr (json_object_get_string_member (json_object_get_object_member (o, "verdict"),
                                                  "state"),
                   ==, sw_verdict_state_to_string (a->verdict.state));
  g_assert_cmpstr (json_object_get_string_member (json_object_get_object_member (o, "verdict"),
                                                  "reason"),
                   ==, a->verdict.reason);
  assert_close (json_object_get_double_member (o, "liftoff_mass_kg"), a->sizing.liftoff_mass_kg);
  assert_close (json_object_get_double_member (o, "delta_v_m_s"), a->sizing.delta_v_m_s);
  stages = json_object_get_array_member (o, "stages");
  for (guint i = 0; i < a->sizing.n_stages; i++)
    assert_close (json_object_get_double_member (json_array_get_object_element (stages, i),
                                                 "propellant_mass_kg"),
                  a->sizing.stages[i].propellant_mass_kg);
  if (isfinite (a->simulated_margin_m_s))
    assert_close (json_object_get_double_member (o, "simulated_margin_m_s"),
                  a->simulated_margin_m_s);

  /* CSV against the window. */
  csv = sw_csv_stage_table (a);
  assert_close (csv_liftoff (csv), a->sizing.liftoff_mass_kg);
  csv_columns_add_up (csv);

  /* The sheet against the window, to the kilogram it prints. */
  g_assert_true (sw_sheet_export (a, SW_SHEET_PDF, SW_PAPER_A4, pdf, &error));
  g_assert_no_error (error);
  {
    const char *pt[] = { "pdftotext", "-layout", pdf, "-", NULL };
    g_assert_true (g_spawn_sync (NULL, (char **) pt, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL,
                                 &text, NULL, &status, &error));
    g_assert_no_error (error);
  }
  g_assert_cmpfloat (fabs (sheet_liftoff (text) - a->sizing.liftoff_mass_kg), <=, 0.5);
  g_assert_nonnull (strstr (text, sw_verdict_state_title (a->verdict.state)));
  g_remove (pdf);
  g_rmdir (dir);
}

static void
test_same_numbers (void)
{
  /* A closed-loop design (the CLI must size as the window does) and one
   * that falls short of its orbit. */
  check_same_numbers ("three-stage-simulated.stagewright");
  check_same_numbers ("medium-cargo.stagewright");
  /* Strap-on boosters: their row in the CSV, the mass picture and the
   * sheet's liftoff mass with them. */
  check_same_numbers ("four-booster-cargo.stagewright");
}

/* The totals show the verdict: literal words, and the icon and style by
 * state (green only for reaches-orbit). */
static void
check_totals (const SwDesign *d, const SwAnalysisOptions *o, const char *page, const char *prefix)
{
  g_autoptr (SwAnalysis) a = sw_analysis_run (d, o, NULL);
  GtkWidget *totals = g_object_ref_sink (sw_totals_new ());
  const char *status;

  sw_totals_set_result (SW_TOTALS (totals), a);
  status = sw_totals_get_text (SW_TOTALS (totals), SW_TOTALS_STATUS);
  if (!g_str_has_prefix (status, prefix))
    g_error ("totals: \"%s\" does not start with \"%s\"", status, prefix);
  g_assert_cmpstr (sw_totals_get_text (SW_TOTALS (totals), SW_TOTALS_STATUS_PAGE), ==, page);
  g_object_unref (totals);
}

static void
test_totals_verdict (void)
{
  g_autoptr (SwDesign) paper = demo ("all-solid-concept.stagewright");
  g_autoptr (SwDesign) shortfall = demo ("medium-cargo.stagewright");
  g_autoptr (SwDesign) reaches = demo ("three-stage-simulated.stagewright");
  g_autoptr (SwDesign) far = sw_design_copy (paper);
  g_autoptr (SwAnalysis) sim = NULL;
  g_autoptr (GtkWidget) totals = NULL;
  SwAnalysisOptions o;

  far->mission.delta_v_m_s = 25000.0;
  check_totals (far, NULL, "bad", "Not feasible. ");
  check_totals (shortfall, NULL, "bad", "Does not reach the orbit. In the simulated ascent the "
                                        "vehicle falls ");
  check_totals (paper, NULL, "note", "Feasible on paper only. The stages give the required "
                                     "delta-v by the rocket equation");
  check_totals (reaches, NULL, "ok", "Reaches the orbit. The simulated ascent reaches the "
                                     "250.0 km orbit with ");
  sw_analysis_options_init (&o);
  o.max_q_pa = 1000.0;
  check_totals (reaches, &o, "warn", "Reaches the orbit, but breaks a limit. The simulated "
                                     "ascent reaches the orbit, but: Max-Q is ");

  /* Without a simulation the headline margin is a dash, and the headroom
   * is named as such below it. */
  sim = sw_analysis_run (paper, NULL, NULL);
  totals = g_object_ref_sink (sw_totals_new ());
  sw_totals_set_result (SW_TOTALS (totals), sim);
  g_assert_cmpstr (sw_totals_get_text (SW_TOTALS (totals), SW_TOTALS_MARGIN), ==, "\u2014");
  g_assert_nonnull (strstr (sw_totals_get_text (SW_TOTALS (totals), SW_TOTALS_LIMIT),
                            ", headroom "));
}

int
main (int argc, char **argv)
{
  gtk_test_init (&argc, &argv, NULL);
  g_test_add_func ("/export/totals-verdict", test_totals_verdict);
  g_test_add_func ("/export/flies-nothing", test_export_flies_nothing);
  g_test_add_func ("/export/dialog-waits-for-ascent", test_dialog_waits_for_ascent);
  g_test_add_func ("/export/same-numbers", test_same_numbers);
  return g_test_run ();
}
