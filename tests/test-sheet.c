/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the briefing sheet and the CSV exports: the PDF's text holds the
 * liftoff mass as the core computes it and the cautions, the PNG has the
 * page's size, the SVG is well-formed XML, the CSV tables are complete. */
#include "config.h"

#include "sw-csv.h"
#include "sw-limits.h"
#include "sw-sheet.h"
#include "sw-sheet-private.h"
#include "sw-staging.h"
#include "sw-text-fit.h"

#include <cairo.h>
#include <pango/pangocairo.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <locale.h>
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

/* Every statement whole: no text the page draws is cut ("…"), the title
 * (the design's name) is drawn whole, and so is the staging panel's
 * weighting statement (as the staging decision states it). */
static void
check_whole (SwAnalysis *a)
{
  g_autoptr (GArray) boxes = g_array_new (FALSE, FALSE, sizeof (SwSheetTextBox));
  cairo_surface_t *surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, NULL);
  cairo_t *cr = cairo_create (surface);
  gboolean title = FALSE, weighting = FALSE;
  SwStaging st;
  double w, h;

  g_array_set_clear_func (boxes, box_clear);
  sw_sheet_paper_size (SW_PAPER_A4, &w, &h);
  sw_sheet_private_record_text (cr, boxes);
  sw_sheet_draw_page (cr, a, w, h);
  sw_sheet_private_record_text (cr, NULL);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  g_assert_true (sw_analysis_staging (a, SW_STAGING_MAX_STAGES, &st, NULL));
  g_assert_cmpuint (strlen (st.weighting), >, 20);
  for (guint i = 0; i < boxes->len; i++)
    {
      const char *t = g_array_index (boxes, SwSheetTextBox, i).text;

      if (strstr (t, "\342\200\246") != NULL)  /* U+2026 */
        g_error ("%s: \"%s\" is cut", a->design->name, t);
      if (strcmp (t, a->design->name) == 0)
        title = TRUE;
      if (strstr (t, st.weighting) != NULL)
        weighting = TRUE;
    }
  if (!title)
    g_error ("%s: the title is not drawn whole", a->design->name);
  if (!weighting)
    g_error ("%s: the weighting \"%s\" is not drawn whole", a->design->name, st.weighting);
}

static const char *const demos[] = {
  "all-solid-concept.stagewright", "skelloway-upgrade-study.stagewright",
  "medium-cargo.stagewright", "small-sat-launcher.stagewright",
  "three-stage-simulated.stagewright", "sallowmere-kestrune-upper-stage.stagewright",
  "sallowmere-as-built.stagewright", "four-booster-cargo.stagewright",
};

static SwAnalysis *
demo_briefing (const char *basename)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            basename, NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  SwAnalysisOptions o;

  g_assert_nonnull (d);
  sw_analysis_options_init (&o);
  o.band_samples = 500;
  return sw_analysis_run (d, &o, NULL);
}

/* In English and, where the machine has the locale, in German (the longer
 * words): every demo's sheet says everything whole, overprinting nothing. */
static void
test_whole_text (void)
{
  g_autofree char *old = g_strdup (setlocale (LC_ALL, NULL));
  g_autofree char *old_language = g_strdup (g_getenv ("LANGUAGE"));

  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autoptr (SwAnalysis) a = demo_briefing (demos[i]);
      check_whole (a);
    }
  g_assert_nonnull (g_getenv ("SW_LOCALE_DIR"));
  if (setlocale (LC_ALL, "de_DE.UTF-8") == NULL)
    {
      setlocale (LC_ALL, old);
      g_test_skip ("no de_DE.UTF-8 locale on this machine: German not checked");
      return;
    }
  g_setenv ("LANGUAGE", "de", TRUE);
  bindtextdomain (GETTEXT_PACKAGE, g_getenv ("SW_LOCALE_DIR"));
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  /* The catalogue is there: a sheet string comes out in German. */
  g_assert_cmpstr (g_dgettext (GETTEXT_PACKAGE, "Stages, in firing order"), !=,
                   "Stages, in firing order");
  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autoptr (SwAnalysis) a = demo_briefing (demos[i]);
      check_whole (a);
      check_no_overlap (a);
    }
  setlocale (LC_ALL, old);
  if (old_language != NULL)
    g_setenv ("LANGUAGE", old_language, TRUE);
}

static void
test_no_overlap (void)
{
  g_autoptr (SwAnalysis) trade = briefing (WITH_MONTECARLO | WITH_BAND);

  check_no_overlap (trade);
  for (guint i = 0; i < G_N_ELEMENTS (demos); i++)
    {
      g_autoptr (SwAnalysis) a = demo_briefing (demos[i]);
      check_no_overlap (a);
    }
}

/* Every text the page draws, one per line. */
static char *
page_text (SwAnalysis *a)
{
  g_autoptr (GArray) boxes = g_array_new (FALSE, FALSE, sizeof (SwSheetTextBox));
  cairo_surface_t *surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, NULL);
  cairo_t *cr = cairo_create (surface);
  GString *s = g_string_new (NULL);
  double w, h;

  g_array_set_clear_func (boxes, box_clear);
  sw_sheet_paper_size (SW_PAPER_A4, &w, &h);
  sw_sheet_private_record_text (cr, boxes);
  sw_sheet_draw_page (cr, a, w, h);
  sw_sheet_private_record_text (cr, NULL);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  for (guint i = 0; i < boxes->len; i++)
    g_string_append_printf (s, "%s\n", g_array_index (boxes, SwSheetTextBox, i).text);
  return g_string_free (s, FALSE);
}

/* A vehicle that exists, with spreads wide enough that some samples fall
 * short even with no payload: its capability histogram runs below 0, and
 * the axis says what that means on a line of its own, overprinting
 * nothing; without such samples the line is not there. */
static void
test_negative_capability_axis (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "sallowmere-as-built.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (SwAnalysis) a = NULL, b = NULL;
  g_autofree char *text = NULL;
  SwAnalysisOptions o;

  g_assert_nonnull (d);
  d->uncertainty.present = TRUE;
  d->uncertainty.losses.kind = SW_SPREAD_NORMAL;
  d->uncertainty.losses.width = 1000.0;
  d->uncertainty.has_samples = TRUE;
  d->uncertainty.samples = 4000;
  sw_analysis_options_init (&o);
  o.ascent = FALSE;
  o.band_samples = 500;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_true (a->has_montecarlo && a->montecarlo.all_fixed);
  g_assert_cmpfloat (a->montecarlo.payload.min, <, 0.0);
  check_no_overlap (a);
  text = page_text (a);
  g_assert_nonnull (strstr (text, "below 0: short even when empty"));

  d->uncertainty.losses.width = 50.0;
  b = sw_analysis_run (d, &o, NULL);
  g_assert_cmpfloat (b->montecarlo.payload.min, >, 0.0);
  g_clear_pointer (&text, g_free);
  text = page_text (b);
  g_assert_null (strstr (text, "below 0"));
}


/* medium-cargo.stagewright at its 1,500 m/s loss allowance (see test_numbers). */
#define LIFTOFF_KG 129000.81
#define LIFTOFF_GROUPED "129,001"
#define LIFTOFF_T "129.0 t"
#define REQUIRED_DV "8,885 m/s"
#define STAGE1_DV "3,542"
#define STAGE1_SHARE "39.9 %"
#define STAGE1_RATIO "2.911"
#define STAGE1_PROP "84.7"
#define STAGE1_STRUCT "4.9"
#define STAGE1_IGN "129.0"
#define STAGE2_DV "5,343"
#define STAGE2_SHARE "60.1 %"
#define STAGE2_RATIO "3.356"
#define STAGE2_PROP "26.6"
#define STAGE2_STRUCT "3.3"
#define STAGE2_IGN "39.4"
/* ---- the numbers on the page -------------------------------------------- */

/* Every text of the page with its ink box (device space = points). */
static GArray *
page_boxes (SwAnalysis *a)
{
  GArray *boxes = g_array_new (FALSE, FALSE, sizeof (SwSheetTextBox));
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
  return boxes;
}

static const SwSheetTextBox *
find_box (GArray *boxes, const char *text)
{
  for (guint i = 0; i < boxes->len; i++)
    if (strcmp (g_array_index (boxes, SwSheetTextBox, i).text, text) == 0)
      return &g_array_index (boxes, SwSheetTextBox, i);
  return NULL;
}

static const SwSheetTextBox *
need_box (GArray *boxes, const char *text)
{
  const SwSheetTextBox *b = find_box (boxes, text);

  if (b == NULL)
    {
      GString *all = g_string_new (NULL);
      for (guint i = 0; i < boxes->len; i++)
        g_string_append_printf (all, "  \"%s\"\n", g_array_index (boxes, SwSheetTextBox, i).text);
      g_error ("\"%s\" is not on the sheet; the texts are:\n%s", text, all->str);
    }
  return b;
}

static int
by_x (gconstpointer p, gconstpointer q)
{
  const SwSheetTextBox *a = *(SwSheetTextBox *const *) p, *b = *(SwSheetTextBox *const *) q;
  return a->x < b->x ? -1 : a->x > b->x ? 1 : 0;
}

/* The texts whose vertical centre is within 2.5 pt of @row's, left to right. */
static GPtrArray *
same_row (GArray *boxes, const SwSheetTextBox *row)
{
  GPtrArray *out = g_ptr_array_new ();
  double cy = row->y + row->h / 2.0;

  for (guint i = 0; i < boxes->len; i++)
    {
      SwSheetTextBox *b = &g_array_index (boxes, SwSheetTextBox, i);
      if (fabs (b->y + b->h / 2.0 - cy) < 2.5)
        g_ptr_array_add (out, b);
    }
  g_ptr_array_sort (out, by_x);
  return out;
}

static void
assert_row (GPtrArray *row, const char *const *want, guint n)
{
  GString *got = g_string_new (NULL);

  for (guint i = 0; i < row->len; i++)
    g_string_append_printf (got, "\"%s\" ", ((SwSheetTextBox *) row->pdata[i])->text);
  if (row->len != n)
    g_error ("a row of %u texts expected, got %u: %s", n, row->len, got->str);
  for (guint i = 0; i < n; i++)
    if (strcmp (((SwSheetTextBox *) row->pdata[i])->text, want[i]) != 0)
      g_error ("column %u: \"%s\" expected; the row reads %s", i, want[i], got->str);
  g_string_free (got, TRUE);
}

/* A number as printed on the sheet in the C locale ("1,234.5", "10⁷",
 * "−3"); NAN when @text is not a number. */
static double
parse_number (const char *text)
{
  static const char *const sup[] = { "\342\201\260", "\302\271", "\302\262", "\302\263",
                                     "\342\201\264", "\342\201\265", "\342\201\266",
                                     "\342\201\267", "\342\201\270", "\342\201\271" };
  GString *plain = g_string_new (NULL);
  const char *p = text;
  double v;
  char *end;

  if (g_str_has_prefix (p, "10") && p[2] != '\0' && !g_ascii_isdigit (p[2]) && p[2] != '.'
      && p[2] != ',')
    {
      int k = 0;
      p += 2;
      while (*p != '\0')
        {
          guint d;
          for (d = 0; d < 10; d++)
            if (g_str_has_prefix (p, sup[d]))
              break;
          if (d == 10)
            {
              g_string_free (plain, TRUE);
              return NAN;
            }
          k = 10 * k + (int) d;
          p += strlen (sup[d]);
        }
      g_string_free (plain, TRUE);
      return pow (10.0, k);
    }
  if (g_str_has_prefix (p, "\342\210\222"))
    {
      g_string_append_c (plain, '-');
      p += 3;
    }
  for (; *p != '\0'; p++)
    if (*p != ',')
      g_string_append_c (plain, *p);
  v = g_ascii_strtod (plain->str, &end);
  if (end == plain->str || *end != '\0')
    v = NAN;
  g_string_free (plain, TRUE);
  return v;
}

/* The stage table and totals of a demo, as literal text.  The figures are
 * the demo's sizing at its 1,500 m/s loss allowance, checked against
 * `stagewright-cli size --json data/designs/medium-cargo.stagewright`;
 * the Tsiolkovsky relation ties each printed mass ratio to the printed
 * delta-v and Isp (computed here, not by the sheet). */
static void
test_numbers (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "medium-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (SwAnalysis) a = NULL;
  g_autoptr (GArray) boxes = NULL;
  g_autoptr (GPtrArray) head = NULL, row1 = NULL, row2 = NULL;
  const SwSheetTextBox *big;
  SwAnalysisOptions o;
  static const char *const heads[] = {
    "#", "Stage", "Isp, s", "\316\265", "\316\224v, m/s", "Share", "Mass ratio", "Prop., t",
    "Struct., t", "Ignition, t",
  };
  static const char *const stage1[] = {
    "1", "Dunmarrow core", "338.0", "0.0550", STAGE1_DV, STAGE1_SHARE, STAGE1_RATIO,
    STAGE1_PROP, STAGE1_STRUCT, STAGE1_IGN,
  };
  static const char *const stage2[] = {
    "2", "Dunmarrow upper", "450.0", "0.1100", STAGE2_DV, STAGE2_SHARE, STAGE2_RATIO,
    STAGE2_PROP, STAGE2_STRUCT, STAGE2_IGN,
  };

  g_assert_nonnull (d);
  sw_analysis_options_init (&o);
  o.band_samples = 500;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_true (a->ok);
  g_assert_false (a->sized_by_ascent);
  /* The core's value, to the kilogram of the literal. */
  g_assert_cmpfloat_with_epsilon (a->sizing.liftoff_mass_kg, LIFTOFF_KG, 0.5);

  boxes = page_boxes (a);
  big = need_box (boxes, LIFTOFF_T);
  need_box (boxes, "Liftoff mass " LIFTOFF_GROUPED " kg");
  need_box (boxes, "Required \316\224v");
  need_box (boxes, REQUIRED_DV);
  need_box (boxes, "Payload");
  need_box (boxes, "8,000 kg");
  /* The headline mass is the largest figure of the totals panel. */
  g_assert_cmpfloat (big->h, >, 12.0);

  /* Columns in order, left to right, each under its own heading: a
   * right-aligned cell ends where its heading ends. */
  head = same_row (boxes, need_box (boxes, "Mass ratio"));
  assert_row (head, heads, G_N_ELEMENTS (heads));
  row1 = same_row (boxes, need_box (boxes, "Dunmarrow core"));
  assert_row (row1, stage1, G_N_ELEMENTS (stage1));
  row2 = same_row (boxes, need_box (boxes, "Dunmarrow upper"));
  assert_row (row2, stage2, G_N_ELEMENTS (stage2));
  for (guint c = 2; c < G_N_ELEMENTS (heads); c++)
    {
      const SwSheetTextBox *h = head->pdata[c], *r1 = row1->pdata[c], *r2 = row2->pdata[c];
      /* 1.5 pt: the ink of the last glyph sits up to a point inside its
       * advance (bold headings, regular cells; 1.02 pt measured); a column
       * moved by a cell is some 30 pt off. */
      g_assert_cmpfloat (fabs ((h->x + h->w) - (r1->x + r1->w)), <, 1.5);
      g_assert_cmpfloat (fabs ((r1->x + r1->w) - (r2->x + r2->w)), <, 1.5);
    }
  /* The rocket equation on the printed figures: ratio = exp (dv / (g0 Isp)),
   * g0 = 9.80665 m/s² (ISO 80000-3); the printed delta-v is rounded to
   * 0.5 m/s and the ratio to 0.0005. */
  for (guint i = 0; i < 2; i++)
    {
      GPtrArray *row = i == 0 ? row1 : row2;
      double isp = parse_number (((SwSheetTextBox *) row->pdata[2])->text);
      double dv = parse_number (((SwSheetTextBox *) row->pdata[4])->text);
      double ratio = parse_number (((SwSheetTextBox *) row->pdata[6])->text);
      double prop = parse_number (((SwSheetTextBox *) row->pdata[7])->text);
      double st = parse_number (((SwSheetTextBox *) row->pdata[8])->text);
      double ign = parse_number (((SwSheetTextBox *) row->pdata[9])->text);
      double want = exp (dv / (9.80665 * isp));
      g_assert_cmpfloat (fabs (ratio - want), <, 0.0005 + want * 0.5 / (9.80665 * isp) + 1e-9);
      /* Mass ratio = ignition / (ignition - propellant), to the 0.05 t of
       * the printed masses; the second stage's ignition mass carries the
       * 1.5 t fairing, which the sizing drops at its ignition (the default
       * jettison point, sw-sizing.h), so its ratio leaves it out. */
      if (i == 1)
        {
          g_assert_cmpfloat (a->sizing.fairing.mass_kg, ==, 1500.0);
          g_assert_cmpuint (a->sizing.fairing.stage, ==, 1);
          g_assert_cmpfloat (a->sizing.fairing.fraction, ==, 0.0);
          ign -= 1.5;
        }
      g_assert_cmpfloat (fabs (ign / (ign - prop) - ratio), <,
                         ratio * 0.1 / (ign - prop) + 0.0005);
      /* eps = structure / (structure + propellant) */
      g_assert_cmpfloat (fabs (st / (st + prop) - (i == 0 ? 0.055 : 0.11)), <,
                         0.1 / (st + prop));
    }
}

/* Font sizes as designed, read from the SVG export (its <text> elements
 * carry them): the title 18 pt, the headline mass 22 pt, nothing else above
 * the verdict's 11 pt, and nothing below 6 pt (the smallest size that
 * stays readable in print, common practice; the tornado's labels are the
 * smallest at 6.3 pt). */
typedef struct {
  GPtrArray *texts;   /* "size|text" */
  double size;
  gboolean in_text;
} SvgTexts;

static void
svgt_start (GMarkupParseContext *ctx, const char *name, const char **names, const char **values,
            gpointer data, GError **error)
{
  SvgTexts *t = data;

  t->in_text = strcmp (name, "text") == 0;
  t->size = NAN;
  if (t->in_text)
    for (guint i = 0; names[i] != NULL; i++)
      if (strcmp (names[i], "font-size") == 0)
        t->size = g_ascii_strtod (values[i], NULL);
}

static void
svgt_text (GMarkupParseContext *ctx, const char *text, gsize len, gpointer data, GError **error)
{
  SvgTexts *t = data;

  if (t->in_text)
    {
      g_assert_true (isfinite (t->size));
      g_ptr_array_add (t->texts, g_strdup_printf ("%.2f|%.*s", t->size, (int) len, text));
      t->in_text = FALSE;
    }
}

static void
test_font_sizes (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("SW_SOURCE_ROOT"), "data", "designs",
                                            "medium-cargo.stagewright", NULL);
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, NULL);
  g_autoptr (SwAnalysis) a = NULL;
  g_autofree char *svg = g_build_filename (tmpdir, "sizes.svg", NULL);
  g_autofree char *data = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) texts = g_ptr_array_new_with_free_func (g_free);
  GMarkupParser parser = { svgt_start, NULL, svgt_text, NULL, NULL };
  GMarkupParseContext *ctx;
  SvgTexts t = { texts, NAN, FALSE };
  guint title = 0, headline = 0, cells = 0, totals = 0;
  SwAnalysisOptions o;

  g_assert_nonnull (d);
  sw_analysis_options_init (&o);
  o.band_samples = 500;
  a = sw_analysis_run (d, &o, NULL);
  g_assert_true (sw_sheet_export (a, SW_SHEET_SVG, SW_PAPER_A4, svg, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (svg, &data, NULL, NULL));
  ctx = g_markup_parse_context_new (&parser, 0, &t, NULL);
  g_assert_true (g_markup_parse_context_parse (ctx, data, -1, &error));
  g_assert_no_error (error);
  g_markup_parse_context_free (ctx);
  g_assert_cmpuint (texts->len, >, 40);
  for (guint i = 0; i < texts->len; i++)
    {
      const char *s = texts->pdata[i];
      double size = g_ascii_strtod (s, NULL);
      const char *text = strchr (s, '|') + 1;

      if (size < 6.0 - 1e-9)
        g_error ("\"%s\" is %.2f pt, below 6 pt", text, size);
      if (strcmp (text, "Dunmarrow Medium cargo vehicle") == 0)
        {
          g_assert_cmpfloat (size, ==, 18.0);
          title++;
        }
      else if (strcmp (text, LIFTOFF_T) == 0 && size > 11.0)
        {
          /* The headline (the mass may be printed small elsewhere too). */
          g_assert_cmpfloat (size, ==, 22.0);
          headline++;
        }
      else if (size > 11.0 + 1e-9)
        g_error ("\"%s\" is %.2f pt: only the title and the headline mass are above 11 pt",
                 text, size);
      /* The stage table's cells: one body size. */
      if (strcmp (text, STAGE1_DV) == 0 || strcmp (text, STAGE2_PROP) == 0
          || strcmp (text, "Dunmarrow upper") == 0)
        {
          g_assert_cmpfloat (size, ==, 7.6);
          cells++;
        }
      /* The totals' labels and values: between 7 and 8.5 pt (the same
       * words may be printed smaller in other panels). */
      if (size >= 7.0 && size <= 8.5)
        {
          if (strcmp (text, "Payload") == 0)
            totals |= 1;
          else if (strcmp (text, "8,000 kg") == 0)
            totals |= 2;
          else if (strcmp (text, "Required \316\224v") == 0)
            totals |= 4;
        }
    }
  g_assert_cmpuint (title, ==, 1);
  g_assert_cmpuint (headline, ==, 1);
  g_assert_cmpuint (cells, >=, 3);
  g_assert_cmpuint (totals, ==, 7);
}

/* Chart axes in one unit: the stage-count chart's log axis is titled in
 * tonnes; its tick labels are tonnes (the design's liftoff mass lies within
 * a decade of them), they rise up the page, and their positions are linear
 * in log10 of the printed value (so "10⁵" sits a decade above "10⁴").  The
 * histogram's two ends read the Monte Carlo's bin edges in the unit of its
 * title. */
static void
test_axis_units (void)
{
  g_autoptr (SwAnalysis) a = briefing (WITH_MONTECARLO | WITH_BAND);
  g_autoptr (GArray) boxes = page_boxes (a);
  const SwSheetTextBox *title = need_box (boxes, "liftoff mass, t (log)");
  g_autoptr (GPtrArray) ticks = g_ptr_array_new ();
  double liftoff_t = a->sizing.liftoff_mass_kg / 1000.0;
  double right = NAN;
  guint best = 0;

  /* The y ticks: numbers right-aligned on one edge, left of the plot,
   * under the axis title. */
  for (guint i = 0; i < boxes->len; i++)
    {
      SwSheetTextBox *b = &g_array_index (boxes, SwSheetTextBox, i);
      guint same = 0;
      if (!isfinite (parse_number (b->text)) || b->x < title->x - 2.0
          || b->x > title->x + 40.0 || b->y < title->y || b->y > title->y + 260.0)
        continue;
      for (guint j = 0; j < boxes->len; j++)
        {
          SwSheetTextBox *c = &g_array_index (boxes, SwSheetTextBox, j);
          if (isfinite (parse_number (c->text)) && fabs (c->x + c->w - b->x - b->w) < 0.8
              && c->y > title->y && c->y < title->y + 260.0)
            same++;
        }
      if (same > best)
        {
          best = same;
          right = b->x + b->w;
        }
    }
  for (guint i = 0; i < boxes->len; i++)
    {
      SwSheetTextBox *b = &g_array_index (boxes, SwSheetTextBox, i);
      if (isfinite (parse_number (b->text)) && fabs (b->x + b->w - right) < 0.8
          && b->y > title->y && b->y < title->y + 260.0)
        g_ptr_array_add (ticks, b);
    }
  g_assert_cmpuint (ticks->len, >=, 3);
  {
    const SwSheetTextBox *t0 = ticks->pdata[0], *tn = ticks->pdata[ticks->len - 1];
    double l0 = log10 (parse_number (t0->text)), ln = log10 (parse_number (tn->text));
    double y0 = t0->y + t0->h / 2.0, yn = tn->y + tn->h / 2.0;
    double lo = INFINITY, hi = -INFINITY;

    g_assert_cmpfloat (fabs (ln - l0), >, 0.1);
    for (guint i = 0; i < ticks->len; i++)
      {
        const SwSheetTextBox *t = ticks->pdata[i];
        double v = parse_number (t->text), l = log10 (v);
        double want_y = y0 + (yn - y0) * (l - l0) / (ln - l0);
        /* 1.5 pt: the ink centre of digits against the tick line (text
         * centred on its logical box); a wrong decade is tens of points. */
        if (fabs (t->y + t->h / 2.0 - want_y) > 1.5)
          g_error ("tick \"%s\" at y %.1f, a log axis puts it at %.1f", t->text,
                   t->y + t->h / 2.0, want_y);
        lo = MIN (lo, v);
        hi = MAX (hi, v);
      }
    /* Higher values higher on the page. */
    g_assert_cmpfloat ((yn - y0) * (ln - l0), <, 0.0);
    g_assert_cmpfloat (liftoff_t, >=, lo / 10.0);
    g_assert_cmpfloat (liftoff_t, <=, hi * 10.0);
  }

  /* The histogram: this study's liftoff masses are tonnes (above 10 t). */
  g_assert_true (a->has_montecarlo);
  g_assert_cmpfloat (a->montecarlo.liftoff.bin_hi, >=, 10000.0);
  need_box (boxes, "liftoff mass, t (dashed: as designed)");
  g_assert_null (find_box (boxes, "liftoff mass, kg (dashed: as designed)"));
  {
    g_autofree char *lo = g_strdup_printf ("%.1f", a->montecarlo.liftoff.bin_lo / 1000.0);
    g_autofree char *hi = g_strdup_printf ("%.1f", a->montecarlo.liftoff.bin_hi / 1000.0);
    /* Below 1,000 t: no grouping needed in the test's own formatting. */
    g_assert_cmpfloat (a->montecarlo.liftoff.bin_hi, <, 999000.0);
    need_box (boxes, lo);
    need_box (boxes, hi);
  }
}

/* The legends' markers, from the pixels: each marker is drawn 7 pt left of
 * its words (the layout's rule: marker centred 4 pt into a 12 pt slot, words
 * 11 pt in), in the colour the plot uses, and whole: the band's box spans
 * 8 pt, the cross has both strokes. */
#define LEGEND_SCALE 4.0

static void
marker_pixels (cairo_surface_t *img, double cx, double cy, guint32 hex, double alpha,
               double *n, double *sx, double *sy, double *x0, double *x1, guint quad[4])
{
  const guchar *data = cairo_image_surface_get_data (img);
  int stride = cairo_image_surface_get_stride (img);
  double want[3];

  for (int k = 0; k < 3; k++)
    {
      double c = ((hex >> (16 - 8 * k)) & 0xff) / 255.0;
      want[k] = 255.0 * (1.0 - alpha + alpha * c);
    }
  *n = *sx = *sy = 0.0;
  *x0 = INFINITY;
  *x1 = -INFINITY;
  memset (quad, 0, 4 * sizeof (guint));
  for (int py = (int) ((cy - 6.0) * LEGEND_SCALE); py <= (int) ((cy + 6.0) * LEGEND_SCALE); py++)
    for (int px = (int) ((cx - 7.0) * LEGEND_SCALE); px <= (int) ((cx + 7.0) * LEGEND_SCALE);
         px++)
      {
        guint32 v = *(const guint32 *) (data + py * stride + 4 * px);
        double rgb[3] = { (v >> 16) & 0xff, (v >> 8) & 0xff, v & 0xff };
        double d = 0.0, x = (px + 0.5) / LEGEND_SCALE, y = (py + 0.5) / LEGEND_SCALE;
        for (int k = 0; k < 3; k++)
          d = MAX (d, fabs (rgb[k] - want[k]));
        if (d > 3.0)
          continue;
        *n += 1.0;
        *sx += x;
        *sy += y;
        *x0 = MIN (*x0, x);
        *x1 = MAX (*x1, x);
        /* Away from the centre, where the strokes of a cross meet. */
        if (fabs (x - cx) > 1.5 && fabs (y - cy) > 1.5)
          quad[(x > cx ? 1 : 0) + (y > cy ? 2 : 0)]++;
      }
}

static void
test_legend_markers (void)
{
  g_autoptr (SwAnalysis) a = briefing (WITH_MONTECARLO | WITH_BAND);
  g_autoptr (GArray) boxes = page_boxes (a);
  cairo_surface_t *img;
  cairo_t *cr;
  double w, h;
  static const struct {
    const char *text;
    guint32 color;
    double alpha;
    double half_width;   /* half the marker's drawn width, pt; 0: a dot */
    gboolean cross;
  } items[] = {
    { "optimal split", ACCENT, 1.0, 4.0, FALSE },
    { "5\342\200\22395 % band", ACCENT, 0.16, 4.0, FALSE },
    { "not feasible", BAD, 1.0, 3.0, TRUE },
    { "this design", SECOND, 1.0, 3.0, FALSE },
  };

  sw_sheet_paper_size (SW_PAPER_A4, &w, &h);
  img = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) ceil (w * LEGEND_SCALE),
                                    (int) ceil (h * LEGEND_SCALE));
  cr = cairo_create (img);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  cairo_scale (cr, LEGEND_SCALE, LEGEND_SCALE);
  sw_sheet_draw_page (cr, a, w, h);
  cairo_destroy (cr);
  cairo_surface_flush (img);

  for (guint i = 0; i < G_N_ELEMENTS (items); i++)
    {
      /* The stage-count chart's legend: the row of "optimal split" or the
       * one under it (a legend too wide for one row takes two), in the left
       * column (the reliability chart has a "this design" of its own). */
      const SwSheetTextBox *row = need_box (boxes, items[0].text), *b = NULL;
      /* The ink starts a fraction of a point right of the layout's origin. */
      double mx, cy;
      double n, sx, sy, x0, x1;
      guint quad[4];

      for (guint j = 0; j < boxes->len && b == NULL; j++)
        {
          const SwSheetTextBox *c = &g_array_index (boxes, SwSheetTextBox, j);
          double dy = c->y + c->h / 2.0 - (row->y + row->h / 2.0);
          if (strcmp (c->text, items[i].text) == 0 && dy > -2.0 && dy < 12.0 && c->x < w / 2.0)
            b = c;
        }
      if (b == NULL)
        g_error ("\"%s\" is not in the legend of the stage-count chart", items[i].text);

      mx = b->x - 7.0;
      cy = b->y + b->h / 2.0;
      marker_pixels (img, mx, cy, items[i].color, items[i].alpha, &n, &sx, &sy, &x0, &x1, quad);
      if (n < 8.0)
        g_error ("no marker in its colour left of \"%s\"", items[i].text);
      /* Centred on mx: 1 pt for the ink's offset and antialiasing; a marker
       * moved by half its width is 4 pt off. */
      if (fabs (sx / n - mx) > 1.0)
        g_error ("the marker of \"%s\" is centred at x %.2f, not %.2f", items[i].text, sx / n,
                 mx);
      /* Its width as drawn, to a point (stroke caps and edges). */
      if (fabs ((x1 - x0) - 2.0 * items[i].half_width) > 1.0)
        g_error ("the marker of \"%s\" is %.2f pt wide, not %.1f", items[i].text, x1 - x0,
                 2.0 * items[i].half_width);
      if (items[i].cross)
        for (guint q = 0; q < 4; q++)
          if (quad[q] < 3)
            g_error ("the cross left of \"%s\" misses a stroke (quadrant %u)", items[i].text, q);
    }
  cairo_surface_destroy (img);
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

/* Labels too long for their place lose whole words from the end, never
 * half a word or a number ("T/W 68749.44 at ig…" was seen), and a label
 * whose first word does not fit is not drawn. */
static void
test_text_fit_words (void)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 10, 10);
  cairo_t *cr = cairo_create (surface);
  PangoLayout *layout = pango_cairo_create_layout (cr);
  const char *text = "T/W 68749.44 at ignition";
  int full, head, word;

  pango_layout_set_text (layout, text, -1);
  pango_layout_get_size (layout, &full, NULL);
  pango_layout_set_text (layout, "T/W 68749.44 at\342\200\246", -1);
  pango_layout_get_size (layout, &head, NULL);
  pango_layout_set_text (layout, "T/W\342\200\246", -1);
  pango_layout_get_size (layout, &word, NULL);
  g_assert_cmpint (head, <, full);

  /* Room for all of it: unchanged. */
  g_assert_true (sw_text_fit_words (layout, text, full, 1));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, text);
  /* Room for all but the last word: that word goes, the rest stays whole. */
  g_assert_true (sw_text_fit_words (layout, text, head, 1));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, "T/W 68749.44 at\342\200\246");
  /* Between the two: the same, never "at ig…". */
  g_assert_true (sw_text_fit_words (layout, text, (head + full) / 2, 1));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, "T/W 68749.44 at\342\200\246");
  /* Just short of "T/W 68749.44…": the number is not cut, it goes whole. */
  g_assert_true (sw_text_fit_words (layout, text, word + 1, 1));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, "T/W\342\200\246");
  /* Not even the first word: nothing drawn. */
  g_assert_false (sw_text_fit_words (layout, text, word - 1, 1));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, "");
  /* Two lines of room: wrapped between words, all of it. */
  g_assert_true (sw_text_fit_words (layout, text, head, 2));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, text);
  g_assert_cmpint (pango_layout_get_line_count (layout), ==, 2);
  /* A middle dot left hanging is dropped with its word. */
  g_assert_true (sw_text_fit_words (layout, "29.9 t \302\267 unused", head / 2, 1));
  g_assert_false (g_str_has_suffix (pango_layout_get_text (layout), "\302\267\342\200\246"));

  g_object_unref (layout);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
}

/* A label a little too long is set smaller, whole, down to the given
 * smallest size; too long even then, it is cut between words at its own
 * size. */
static void
test_text_fit_shrink (void)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 10, 10);
  cairo_t *cr = cairo_create (surface);
  PangoLayout *layout = pango_cairo_create_layout (cr);
  PangoFontDescription *fd = pango_font_description_from_string ("DejaVu Sans");
  const char *text = "Headroom to the stages' limit";
  int full;

  pango_font_description_set_absolute_size (fd, 10.0 * PANGO_SCALE);
  pango_layout_set_font_description (layout, fd);
  pango_layout_set_text (layout, text, -1);
  pango_layout_get_size (layout, &full, NULL);

  /* Room for all of it: the same size. */
  pango_layout_set_font_description (layout, fd);
  g_assert_true (sw_text_fit_shrink (layout, text, full, 1, 8.0));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, text);
  g_assert_cmpint (pango_font_description_get_size (pango_layout_get_font_description (layout)),
                   ==, 10 * PANGO_SCALE);
  /* 10 % short: whole, at 9 pt or a little below (width goes with size). */
  pango_layout_set_font_description (layout, fd);
  g_assert_true (sw_text_fit_shrink (layout, text, full * 9 / 10, 1, 8.0));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, text);
  g_assert_cmpint (pango_font_description_get_size (pango_layout_get_font_description (layout)),
                   <=, 9 * PANGO_SCALE);
  g_assert_cmpint (pango_font_description_get_size (pango_layout_get_font_description (layout)),
                   >=, 8 * PANGO_SCALE);
  /* Half the room: not whole even at 8 pt, so cut between words at 10 pt. */
  pango_layout_set_font_description (layout, fd);
  g_assert_true (sw_text_fit_shrink (layout, text, full / 2, 1, 8.0));
  g_assert_true (g_str_has_suffix (pango_layout_get_text (layout), "\342\200\246"));
  g_assert_cmpint (pango_font_description_get_size (pango_layout_get_font_description (layout)),
                   ==, 10 * PANGO_SCALE);
  /* Two lines of room at half the width: whole, at its own size. */
  pango_layout_set_font_description (layout, fd);
  g_assert_true (sw_text_fit_shrink (layout, text, full * 6 / 10, 2, 8.0));
  g_assert_cmpstr (pango_layout_get_text (layout), ==, text);
  g_assert_cmpint (pango_layout_get_line_count (layout), ==, 2);

  pango_font_description_free (fd);
  g_object_unref (layout);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
}

/* A vehicle of some 155,000 t: the stage-count axis reads "7×10⁵", never
 * the C library's "7e+05" (seen on the sheet). */
static void
test_huge_ticks (void)
{
  g_autoptr (SwDesign) d = load_trade_study ();
  g_autoptr (SwAnalysis) a = NULL;
  g_autoptr (GArray) boxes = NULL;
  gboolean power = FALSE;

  d->payload_kg = sw_limit_get (SW_LIMIT_PAYLOAD)->max;
  a = sw_analysis_run (d, NULL, NULL);
  g_assert_true (a->ok && a->sizing.feasible);
  g_assert_cmpfloat (a->sizing.liftoff_mass_kg, >, 1e8);
  boxes = page_boxes (a);
  for (guint i = 0; i < boxes->len; i++)
    {
      const SwSheetTextBox *b = &g_array_index (boxes, SwSheetTextBox, i);
      if (strstr (b->text, "e+") != NULL || strstr (b->text, "e-0") != NULL)
        g_error ("a number in C notation on the sheet: \"%s\"", b->text);
      power = power || g_str_has_prefix (b->text, "10\342\201") || strstr (b->text, "\303\22710") != NULL;
    }
  g_assert_true (power);
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
  g_test_add_func ("/sheet/whole-text", test_whole_text);
  g_test_add_func ("/sheet/negative-capability-axis", test_negative_capability_axis);
  g_test_add_func ("/sheet/thrust-to-weight-warning", test_thrust_to_weight_warning);
  g_test_add_func ("/sheet/numbers", test_numbers);
  g_test_add_func ("/sheet/font-sizes", test_font_sizes);
  g_test_add_func ("/sheet/axis-units", test_axis_units);
  g_test_add_func ("/sheet/legend-markers", test_legend_markers);
  g_test_add_func ("/sheet/text-fit-words", test_text_fit_words);
  g_test_add_func ("/sheet/text-fit-shrink", test_text_fit_shrink);
  g_test_add_func ("/sheet/huge-ticks", test_huge_ticks);
  status = g_test_run ();
  remove_tree (tmpdir);
  g_free (tmpdir);
  return status;
}
