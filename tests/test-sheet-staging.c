/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The briefing sheet's staging panel: the page draws its heading, the six
 * stage counts with this design's marked, and the weighting statement, and
 * the liftoff mass of the design's own row is the sizing's (13.4 t for the
 * demo study, as its totals show). */
#include "config.h"

#include "sw-analysis.h"
#include "sw-economics.h"
#include "sw-sheet.h"
#include "sw-sheet-private.h"

#include <string.h>

static void
box_clear (gpointer p)
{
  g_free (((SwSheetTextBox *) p)->text);
}

static gboolean
has_text (GArray *boxes, const char *text)
{
  for (guint i = 0; i < boxes->len; i++)
    if (strcmp (g_array_index (boxes, SwSheetTextBox, i).text, text) == 0)
      return TRUE;
  return FALSE;
}

static gboolean
has_prefix (GArray *boxes, const char *prefix)
{
  for (guint i = 0; i < boxes->len; i++)
    if (g_str_has_prefix (g_array_index (boxes, SwSheetTextBox, i).text, prefix))
      return TRUE;
  return FALSE;
}

static guint
count_text (GArray *boxes, const char *text)
{
  guint n = 0;
  for (guint i = 0; i < boxes->len; i++)
    n += strcmp (g_array_index (boxes, SwSheetTextBox, i).text, text) == 0;
  return n;
}

static void
test_panel_on_page (void)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR,
                                            "skelloway-upgrade-study.stagewright", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  g_autoptr (GArray) boxes = g_array_new (FALSE, FALSE, sizeof (SwSheetTextBox));
  SwAnalysisOptions o;
  SwAnalysis *a;
  cairo_surface_t *surface;
  cairo_t *cr;
  double w, h;

  g_assert_no_error (error);
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  o.ascent = FALSE;
  a = sw_analysis_run (d, &o, NULL);
  g_array_set_clear_func (boxes, box_clear);
  surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, NULL);
  cr = cairo_create (surface);
  sw_sheet_paper_size (SW_PAPER_A4, &w, &h);
  sw_sheet_private_record_text (cr, boxes);
  sw_sheet_draw_page (cr, a, w, h);
  sw_sheet_private_record_text (cr, NULL);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);

  g_assert_true (has_text (boxes, "Staging decision (serial stages; effort in work-years: an "
                                  "estimate, never a quote)"));
  g_assert_true (has_text (boxes, "per flight, rec."));
  g_assert_true (has_text (boxes, "\342\226\270 3"));
  g_assert_true (has_text (boxes, "6"));
  /* In the totals and again in the panel's row of three stages. */
  g_assert_cmpuint (count_text (boxes, "13.4 t"), >=, 2);
  g_assert_true (has_prefix (boxes, "\342\226\270 this design; shaded: the best count; "
                                    "recovered: the first stage lands downrange. Weights: "
                                    "liftoff mass 1"));
  /* The demo gives no cost of a work-year: no money, said so. */
  g_assert_true (has_text (boxes, "No cost of a work-year given: effort in work-years only."));
  sw_analysis_unref (a);

  /* With one and a currency: the best count's money in that currency. */
  g_assert_true (sw_economics_set_number (&d->economics, SW_ECON_WORK_YEAR_COST, 250000.0));
  g_assert_true (sw_economics_set_currency (&d->economics, "kr", NULL));
  a = sw_analysis_run (d, &o, NULL);
  g_array_set_size (boxes, 0);
  surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, NULL);
  cr = cairo_create (surface);
  sw_sheet_private_record_text (cr, boxes);
  sw_sheet_draw_page (cr, a, w, h);
  sw_sheet_private_record_text (cr, NULL);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  g_assert_true (has_prefix (boxes, "At 250,000 kr per work-year, the best count: development "));
  {
    gboolean found = FALSE;
    for (guint i = 0; i < boxes->len; i++)
      {
        const char *t = g_array_index (boxes, SwSheetTextBox, i).text;
        found |= g_str_has_prefix (t, "At 250,000 kr") && g_str_has_suffix (t, " kr. Never a quote.");
      }
    g_assert_true (found);
  }
  sw_analysis_unref (a);
}

/* A design with strap-on boosters: the panel has the serial rows and the
 * rows with the boosters, the design's row (2 + boosters) marked with the
 * sizing's liftoff mass, the weighting whole (not cut), the boosters'
 * assumptions stated; no text of the panel leaves the page or overlaps
 * another. */
static void
test_panel_with_boosters (void)
{
  g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, "four-booster-cargo.stagewright",
                                            NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) d = sw_design_load (path, NULL, &error);
  g_autoptr (GArray) boxes = g_array_new (FALSE, FALSE, sizeof (SwSheetTextBox));
  g_autofree char *mass = NULL;
  SwAnalysisOptions o;
  SwAnalysis *a;
  cairo_surface_t *surface;
  cairo_t *cr;
  double w, h, top = -1.0, bottom = -1.0;

  g_assert_no_error (error);
  sw_analysis_options_init (&o);
  o.montecarlo = FALSE;
  o.ascent = FALSE;
  a = sw_analysis_run (d, &o, NULL);
  g_array_set_clear_func (boxes, box_clear);
  surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, NULL);
  cr = cairo_create (surface);
  sw_sheet_paper_size (SW_PAPER_A4, &w, &h);
  sw_sheet_private_record_text (cr, boxes);
  sw_sheet_draw_page (cr, a, w, h);
  sw_sheet_private_record_text (cr, NULL);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);

  g_assert_true (has_text (boxes, "Staging decision, serial and with boosters (work-years: an "
                                  "estimate, never a quote)"));
  g_assert_true (has_text (boxes, "\342\226\270 2 + boosters"));
  g_assert_true (has_text (boxes, "6 + boosters"));
  g_assert_true (has_text (boxes, "1 + boosters"));
  g_assert_false (has_text (boxes, "\342\226\270 2"));
  /* The design's row shows the sizing's liftoff mass, as the totals do. */
  mass = g_strdup_printf ("%.1f t", a->sizing.liftoff_mass_kg / 1000.0);
  g_assert_cmpuint (count_text (boxes, mass), >=, 2);
  g_assert_true (has_text (boxes, "\342\226\270 this design; shaded: the best row; recovered: "
                                  "the first stage lands downrange."));
  g_assert_true (has_text (boxes, "Weights: liftoff mass 1, development effort 1, cost per flight "
                                  "(expendable) 1; each criterion divided by its best row, serial "
                                  "and with boosters alike, the lowest sum wins; rows the design's "
                                  "liftoff thrust cannot lift (vacuum thrust below their weight) "
                                  "are not candidates."));
  g_assert_true (has_prefix (boxes, "\342\200\234+ boosters\342\200\235: the same stages with "
                                    "this design's 4 boosters beside the core; success counts "
                                    "the boosters as perfect"));
  g_assert_false (has_prefix (boxes, "Every row is a serial vehicle"));
  g_assert_true (has_prefix (boxes, "The core alone lifts none of the serial rows (at most 0."));
  g_assert_true (has_prefix (boxes, "Every row is sized with the loss allowance of 2,500 m/s"));

  /* The panel's texts: on the page, and no two overlapping. */
  for (guint i = 0; i < boxes->len; i++)
    {
      const SwSheetTextBox *b = &g_array_index (boxes, SwSheetTextBox, i);
      if (g_str_has_prefix (b->text, "Staging decision"))
        top = b->y;
      if (g_str_has_prefix (b->text, "No cost of a work-year given"))
        bottom = b->y + b->h;
    }
  g_assert_cmpfloat (top, >, 0.0);
  g_assert_cmpfloat (bottom, >, top);
  for (guint i = 0; i < boxes->len; i++)
    {
      const SwSheetTextBox *b = &g_array_index (boxes, SwSheetTextBox, i);
      if (b->y < top || b->y + b->h > bottom + 0.01)
        continue;
      g_assert_cmpfloat (b->x, >=, 0.0);
      g_assert_cmpfloat (b->x + b->w, <=, w);
      for (guint k = i + 1; k < boxes->len; k++)
        {
          const SwSheetTextBox *c = &g_array_index (boxes, SwSheetTextBox, k);
          gboolean overlap = b->x < c->x + c->w && c->x < b->x + b->w
                             && b->y < c->y + c->h && c->y < b->y + b->h;
          if (c->y < top || c->y + c->h > bottom + 0.01)
            continue;
          if (overlap)
            g_error ("\"%s\" overlaps \"%s\"", b->text, c->text);
        }
    }
  sw_analysis_unref (a);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/sheet/staging/panel-on-page", test_panel_on_page);
  g_test_add_func ("/sheet/staging/panel-with-boosters", test_panel_with_boosters);
  return g_test_run ();
}
