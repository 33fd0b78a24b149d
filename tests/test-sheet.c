/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the briefing sheet and the CSV exports: the PDF's text holds the
 * liftoff mass as the core computes it and the cautions, the PNG has the
 * page's size, the SVG is well-formed XML, the CSV tables are complete. */
#include "config.h"

#include "sw-csv.h"
#include "sw-sheet.h"
#include "sw-sheet-private.h"

#include <cairo.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

static char *tmpdir;

static SwDesign *
load_trade_study (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "trade", "trade-study.stagewright",
                                                 NULL);
  SwDesign *d = sw_design_load (path, NULL, &error);

  g_assert_no_error (error);
  return d;
}

enum { WITH_MONTECARLO = 1, WITH_BAND = 2 };

static SwAnalysis *
briefing (guint flags)
{
  g_autoptr (SwDesign) d = load_trade_study ();
  SwAnalysisOptions o;
  SwAnalysis *a;

  sw_analysis_options_init (&o);
  o.montecarlo = (flags & WITH_MONTECARLO) != 0;
  o.band = (flags & WITH_BAND) != 0;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_true (a->ok);
  return a;
}

/* The test's own thousands grouping, independent of the sheet's. */
static char *
grouped (double v)
{
  g_autofree char *digits = g_strdup_printf ("%.0f", v);
  GString *s = g_string_new (NULL);
  gsize n = strlen (digits);

  for (gsize i = 0; i < n; i++)
    {
      if (i > 0 && (n - i) % 3 == 0)
        g_string_append_c (s, ',');
      g_string_append_c (s, digits[i]);
    }
  return g_string_free (s, FALSE);
}

static char *
run_tool (const char *const *argv)
{
  g_autoptr (GError) error = NULL;
  char *out = NULL;
  int status = 0;

  if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &out, NULL,
                     &status, &error))
    g_error ("%s could not run (Debian package poppler-utils, see scripts/deps.sh): %s",
             argv[0], error->message);
  g_assert_true (g_spawn_check_wait_status (status, NULL));
  return out;
}

static void
test_pdf_text (void)
{
  g_autoptr (SwAnalysis) b = briefing (WITH_MONTECARLO | WITH_BAND);
  g_autofree char *pdf = g_build_filename (tmpdir, "sheet.pdf", NULL);
  g_autoptr (GError) error = NULL;
  g_autofree char *text = NULL, *info = NULL, *mass = NULL, *expect = NULL;
  g_autofree char *part = g_strconcat (pdf, ".part", NULL);
  SwSizing s;

  g_assert_true (sw_sheet_export (b, SW_SHEET_PDF, SW_PAPER_A4, pdf, &error));
  g_assert_no_error (error);
  g_assert_false (g_file_test (part, G_FILE_TEST_EXISTS));

  /* The liftoff mass as the core computes it, straight from the sizing. */
  g_assert_true (sw_size_design (b->design, &s, NULL));
  mass = grouped (s.liftoff_mass_kg);
  expect = g_strdup_printf ("Liftoff mass %s kg", mass);
  text = run_tool ((const char *[]) { "pdftotext", "-layout", pdf, "-", NULL });
  if (strstr (text, expect) == NULL)
    g_error ("\"%s\" not in the PDF's text:\n%s", expect, text);
  g_assert_nonnull (strstr (text, "Wren 3 trade study"));
  /* The verdict is the first thing under the title: this study's vehicle
   * falls short of its orbit in simulation (its own ascent). */
  g_assert_cmpint (b->verdict.state, ==, SW_VERDICT_SHORT_OF_ORBIT);
  {
    const char *verdict = strstr (text, "Does not reach the orbit");
    const char *totals = strstr (text, "Totals");
    g_assert_nonnull (verdict);
    g_assert_nonnull (totals);
    g_assert_cmpint (verdict - text, <, totals - text);
    g_assert_nonnull (strstr (text, "short of the orbit"));
  }
  /* No JSON key or internal phrase on the page. */
  g_assert_null (strstr (text, "_kn"));
  g_assert_null (strstr (text, "_m_s"));
  g_assert_null (strstr (text, "min(k"));
  g_assert_nonnull (strstr (text, "Wren sustainer"));
  /* The cautions. */
  g_assert_nonnull (strstr (text, "Conceptual sizing only"));
  g_assert_nonnull (strstr (text, "not for flight hardware or safety decisions"));
  g_assert_nonnull (strstr (text, "range safety and local regulations"));
  g_assert_null (strstr (text, "nan"));
  g_assert_null (strstr (text, "inf "));

  /* A4 is 210 x 297 mm (ISO 216) = 595.28 x 841.89 pt. */
  info = run_tool ((const char *[]) { "pdfinfo", pdf, NULL });
  g_assert_nonnull (strstr (info, "Pages:"));
  g_assert_nonnull (strstr (info, "595.276 x 841.89"));
}

static void
check_png (SwPaper paper, int want_w, int want_h)
{
  g_autoptr (SwAnalysis) b = briefing (0);
  g_autofree char *png = g_build_filename (tmpdir, "sheet.png", NULL);
  g_autoptr (GError) error = NULL;
  cairo_surface_t *img;
  int w, h;

  g_assert_true (sw_sheet_export (b, SW_SHEET_PNG, paper, png, &error));
  g_assert_no_error (error);
  img = cairo_image_surface_create_from_png (png);
  g_assert_cmpint (cairo_surface_status (img), ==, CAIRO_STATUS_SUCCESS);
  w = cairo_image_surface_get_width (img);
  h = cairo_image_surface_get_height (img);
  cairo_surface_destroy (img);
  g_assert_cmpint (w, ==, want_w);
  g_assert_cmpint (h, ==, want_h);
  sw_sheet_png_size (paper, &w, &h);
  g_assert_cmpint (w, ==, want_w);
  g_assert_cmpint (h, ==, want_h);
}

/* The page's size at 150 dots per inch: A4 210 x 297 mm (ISO 216, from
 * memory) gives 1240 x 1754 px; US Letter 8.5 x 11 in (from memory) gives
 * 1275 x 1650. */
static void
test_png_size (void)
{
  check_png (SW_PAPER_A4, 1240, 1754);
  check_png (SW_PAPER_LETTER, 1275, 1650);
}

typedef struct {
  guint elements;
  gboolean root_svg;
  char *width;
} SvgCheck;

static void
svg_start (GMarkupParseContext *ctx, const char *name, const char **names, const char **values,
           gpointer data, GError **error)
{
  SvgCheck *c = data;

  if (c->elements++ == 0)
    {
      c->root_svg = strcmp (name, "svg") == 0;
      for (guint i = 0; names[i] != NULL; i++)
        if (strcmp (names[i], "width") == 0)
          c->width = g_strdup (values[i]);
    }
}

/* Well-formed XML (GLib's GMarkup parser rejects anything that is not), an
 * <svg> root, and the Letter page width 612 pt. */
static void
test_svg_well_formed (void)
{
  g_autoptr (SwAnalysis) b = briefing (0);
  g_autofree char *svg = g_build_filename (tmpdir, "sheet.svg", NULL);
  g_autoptr (GError) error = NULL;
  g_autofree char *data = NULL;
  GMarkupParser parser = { svg_start, NULL, NULL, NULL, NULL };
  GMarkupParseContext *ctx;
  SvgCheck check = { 0 };
  gsize len;

  g_assert_true (sw_sheet_export (b, SW_SHEET_SVG, SW_PAPER_LETTER, svg, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (svg, &data, &len, NULL));
  ctx = g_markup_parse_context_new (&parser, 0, &check, NULL);
  g_assert_true (g_markup_parse_context_parse (ctx, data, (gssize) len, &error));
  g_assert_true (g_markup_parse_context_end_parse (ctx, &error));
  g_assert_no_error (error);
  g_markup_parse_context_free (ctx);
  g_assert_true (check.root_svg);
  g_assert_cmpuint (check.elements, >, 100);
  g_assert_cmpstr (check.width, ==, "612pt");
  g_free (check.width);
  /* Text stays text: the words can be found in the file, and no glyph is
   * drawn as an outline. */
  g_assert_nonnull (strstr (data, ">Totals</text>"));
  g_assert_nonnull (strstr (data, ">Wren 3 trade study</text>"));
  g_assert_nonnull (strstr (data, "Conceptual sizing only"));
  g_assert_null (strstr (data, "glyph"));
}

static void
test_csv (void)
{
  g_autoptr (SwAnalysis) b = briefing (WITH_MONTECARLO);
  g_autofree char *dir = g_build_filename (tmpdir, "csv", NULL);
  g_autoptr (GPtrArray) written = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  g_autofree char *stages = NULL, *curve = NULL, *path = NULL;
  g_auto (GStrv) lines = NULL;

  g_assert_true (sw_csv_export (b, dir, written, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (written->len, ==, 8);  /* with stage-decision.csv and carpet.csv */

  path = g_build_filename (dir, "stages.csv", NULL);
  g_assert_true (g_file_get_contents (path, &stages, NULL, NULL));
  lines = g_strsplit (stages, "\n", -1);
  g_assert_true (g_str_has_prefix (lines[0], "# Conceptual sizing only"));
  g_assert_true (g_str_has_prefix (lines[1], "stage,name,isp_vac_s"));
  g_assert_true (g_str_has_prefix (lines[2], "1,Wren booster,320,"));
  g_assert_true (g_str_has_prefix (lines[5], "total,"));
  g_assert_cmpstr (lines[6], ==, "");
  g_assert_null (strstr (stages, "nan"));

  g_clear_pointer (&path, g_free);
  path = g_build_filename (dir, "stage-count.csv", NULL);
  g_assert_true (g_file_get_contents (path, &curve, NULL, NULL));
  /* One stage cannot fly this mission: an empty mass, never NaN. */
  g_assert_nonnull (strstr (curve, "\n1,false,,"));
  g_assert_null (strstr (curve, "nan"));
}

/* A first stage too weak to lift off: the sheet says so in the totals
 * (thrust 20 kN against a vehicle of some tonnes: T/W well below 1), and
 * without a flight the verdict stays "on paper only". */
static void
test_thrust_to_weight_warning (void)
{
  static const char design[] =
    "{ \"format\": \"stagewright-design\", \"version\": 1, \"name\": \"Weak\","
    "  \"payload_kg\": 150, \"mission\": { \"delta_v_m_s\": 9600 }, \"split\": \"optimal\","
    "  \"stages\": [ { \"name\": \"One\", \"isp_vac_s\": 275, \"isp_sl_s\": 245,"
    "                  \"structural_coefficient\": 0.10, \"thrust_vac_kn\": 20,"
    "                  \"diameter_m\": 1.2 },"
    "                { \"name\": \"Two\", \"isp_vac_s\": 290, \"structural_coefficient\": 0.12,"
    "                  \"thrust_vac_kn\": 12 } ] }";
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load_data (design, -1, "weak.stagewright", NULL, &error);
  g_autoptr (SwAnalysis) a = NULL;
  g_autofree char *pdf = g_build_filename (tmpdir, "weak.pdf", NULL);
  g_autofree char *text = NULL;

  g_assert_no_error (error);
  a = sw_analysis_run (d, NULL, NULL);
  g_assert_cmpint (a->verdict.state, ==, SW_VERDICT_PAPER_ONLY);
  g_assert_true (sw_sheet_export (a, SW_SHEET_PDF, SW_PAPER_A4, pdf, &error));
  g_assert_no_error (error);
  text = run_tool ((const char *[]) { "pdftotext", "-layout", pdf, "-", NULL });
  g_assert_nonnull (strstr (text, "Feasible on paper only"));
  g_assert_nonnull (strstr (text, "Thrust-to-weight at liftoff"));
  g_assert_nonnull (strstr (text, "below the limit of 1.20"));
  /* No performance margin without a simulation: the headroom is named. */
  g_assert_nonnull (strstr (text, "Headroom to the stages"));
  g_assert_null (strstr (text, "Simulated \316\224v margin"));
}

static void
box_clear (gpointer p)
{
  g_free (((SwSheetTextBox *) p)->text);
}

/* Nothing overprinted: every text the page draws is recorded with its ink
 * box, and no two boxes overlap (0.3 pt of slack for antialiased edges). */
static void
check_no_overlap (SwAnalysis *a)
{
  g_autoptr (GArray) boxes = g_array_new (FALSE, FALSE, sizeof (SwSheetTextBox));
  cairo_surface_t *surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, NULL);
  cairo_t *cr = cairo_create (surface);
  double w, h;

  g_array_set_clear_func (boxes, box_clear);
  sw_sheet_paper_size (SW_PAPER_A4, &w, &h);
  sw_sheet_private_record_text (cr, boxes);
  sw_sheet_draw_page (cr, a, w, h);
  sw_sheet_private_record_text (cr, NULL);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  g_assert_cmpuint (boxes->len, >, 40);
  for (guint i = 0; i < boxes->len; i++)
    for (guint j = i + 1; j < boxes->len; j++)
      {
        const SwSheetTextBox *p = &g_array_index (boxes, SwSheetTextBox, i);
        const SwSheetTextBox *q = &g_array_index (boxes, SwSheetTextBox, j);
        double ox = MIN (p->x + p->w, q->x + q->w) - MAX (p->x, q->x);
        double oy = MIN (p->y + p->h, q->y + q->h) - MAX (p->y, q->y);
        if (ox > 0.3 && oy > 0.3)
          g_error ("%s: \"%s\" and \"%s\" overlap", a->design->name, p->text, q->text);
      }
}

static void
test_no_overlap (void)
{
  static const char *const demos[] = {
    "all-solid-concept.stagewright", "skelloway-upgrade-study.stagewright",
    "medium-cargo.stagewright", "small-sat-launcher.stagewright",
    "three-stage-simulated.stagewright",
  };
  g_autoptr (SwAnalysis) trade = briefing (WITH_MONTECARLO | WITH_BAND);

  check_no_overlap (trade);
  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                                demos[i], NULL);
      g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
      g_autoptr (SwAnalysis) a = NULL;
      SwAnalysisOptions o;

      g_assert_nonnull (d);
      sw_analysis_options_init (&o);
      o.band_samples = 500;
      a = sw_analysis_run (d, &o, NULL);
      check_no_overlap (a);
    }
}

static void
remove_tree (const char *dir)
{
  g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d != NULL && (name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);
      if (g_file_test (path, G_FILE_TEST_IS_DIR))
        remove_tree (path);
      else
        g_remove (path);
    }
  g_rmdir (dir);
}

int
main (int argc, char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  tmpdir = g_dir_make_tmp ("sw-sheet-XXXXXX", NULL);
  g_assert_nonnull (tmpdir);
  g_test_add_func ("/sheet/pdf-text", test_pdf_text);
  g_test_add_func ("/sheet/png-size", test_png_size);
  g_test_add_func ("/sheet/svg-well-formed", test_svg_well_formed);
  g_test_add_func ("/sheet/csv", test_csv);
  g_test_add_func ("/sheet/no-overlap", test_no_overlap);
  g_test_add_func ("/sheet/thrust-to-weight-warning", test_thrust_to_weight_warning);
  status = g_test_run ();
  remove_tree (tmpdir);
  g_free (tmpdir);
  return status;
}
