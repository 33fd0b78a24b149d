/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The sheet's text and panel helpers. */
#define G_LOG_DOMAIN "sw-sheet"

#include "config.h"

#include "sw-sheet-private.h"
#include "sw-text-fit.h"

#include <math.h>
#include <string.h>

#define FONT_FAMILY "DejaVu Sans, Sans"

/* Per drawing context, so exports on several threads never meet. */
static cairo_user_data_key_t record_key;
static cairo_user_data_key_t svg_key;

void
sw_sheet_private_record_text (cairo_t *cr, GArray *boxes)
{
  cairo_set_user_data (cr, &record_key, boxes, NULL);
}

void
sw_sheet_svg_text_begin (cairo_t *cr, GString *elements)
{
  cairo_set_user_data (cr, &svg_key, elements, NULL);
}

static void
record (cairo_t *cr, GArray *boxes, PangoLayout *layout, double x, double y)
{
  PangoRectangle ink;
  SwSheetTextBox box;

  pango_layout_get_extents (layout, &ink, NULL);
  if (ink.width <= 0 || ink.height <= 0)
    return;
  box.x = x + (double) ink.x / PANGO_SCALE;
  box.y = y + (double) ink.y / PANGO_SCALE;
  box.w = (double) ink.width / PANGO_SCALE;
  box.h = (double) ink.height / PANGO_SCALE;
  cairo_user_to_device (cr, &box.x, &box.y);
  cairo_user_to_device_distance (cr, &box.w, &box.h);
  box.text = g_strdup (pango_layout_get_text (layout));
  g_array_append_val (boxes, box);
}

/* One SVG <text> per line of @layout, in the source colour of @cr: the
 * SVG keeps its text as text, so it can be searched and edited. */
static void
svg_text (cairo_t *cr, GString *out, PangoLayout *layout, double x, double y)
{
  const PangoFontDescription *fd = pango_layout_get_font_description (layout);
  const char *text = pango_layout_get_text (layout);
  double size = (double) pango_font_description_get_size (fd) / PANGO_SCALE;
  gboolean bold = pango_font_description_get_weight (fd) >= PANGO_WEIGHT_BOLD;
  gboolean cut = pango_layout_is_ellipsized (layout);
  double r = 0, g = 0, b = 0, a = 1;
  char color[8], buf[5][G_ASCII_DTOSTR_BUF_SIZE];
  PangoLayoutIter *it;

  cairo_pattern_get_rgba (cairo_get_source (cr), &r, &g, &b, &a);
  g_snprintf (color, sizeof color, "#%02x%02x%02x", (int) lround (r * 255),
              (int) lround (g * 255), (int) lround (b * 255));
  it = pango_layout_get_iter (layout);
  do
    {
      PangoLayoutLine *line = pango_layout_iter_get_line_readonly (it);
      PangoRectangle logical;
      double lx, ly, lw;
      g_autofree char *chunk = NULL, *escaped = NULL;

      if (line->length <= 0)
        continue;
      pango_layout_iter_get_line_extents (it, NULL, &logical);
      lx = x + (double) logical.x / PANGO_SCALE;
      ly = y + (double) pango_layout_iter_get_baseline (it) / PANGO_SCALE;
      lw = (double) logical.width / PANGO_SCALE;
      cairo_user_to_device (cr, &lx, &ly);
      chunk = g_strndup (text + line->start_index, line->length);
      g_strchomp (chunk);
      escaped = g_markup_escape_text (chunk, -1);
      g_string_append_printf (out, "<text xml:space=\"preserve\" x=\"%s\" y=\"%s\" "
                                   "font-family=\"DejaVu Sans, sans-serif\" font-size=\"%s\"%s "
                                   "fill=\"%s\"",
                              g_ascii_formatd (buf[0], sizeof buf[0], "%.2f", lx),
                              g_ascii_formatd (buf[1], sizeof buf[1], "%.2f", ly),
                              g_ascii_formatd (buf[2], sizeof buf[2], "%.2f", size),
                              bold ? " font-weight=\"bold\"" : "", color);
      if (a < 1.0)
        g_string_append_printf (out, " fill-opacity=\"%s\"",
                                g_ascii_formatd (buf[3], sizeof buf[3], "%.2f", a));
      /* An ellipsized line keeps its whole text, fitted to the room it had. */
      if (cut)
        g_string_append_printf (out, " textLength=\"%s\" lengthAdjust=\"spacingAndGlyphs\"",
                                g_ascii_formatd (buf[4], sizeof buf[4], "%.2f", lw));
      g_string_append_printf (out, ">%s</text>\n", escaped);
    }
  while (pango_layout_iter_next_line (it));
  pango_layout_iter_free (it);
}

/* Every text of the sheet goes through here. */
void
sw_sheet_show_layout (cairo_t *cr, PangoLayout *layout, double x, double y)
{
  GArray *boxes = cairo_get_user_data (cr, &record_key);
  GString *svg = cairo_get_user_data (cr, &svg_key);

  if (boxes != NULL)
    record (cr, boxes, layout, x, y);
  if (svg != NULL)
    {
      svg_text (cr, svg, layout, x, y);
      return;
    }
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
}

void
sw_sheet_set_color (cairo_t *cr, guint32 hex, double alpha)
{
  cairo_set_source_rgba (cr, ((hex >> 16) & 0xff) / 255.0, ((hex >> 8) & 0xff) / 255.0,
                         (hex & 0xff) / 255.0, alpha);
}



PangoLayout *
sw_sheet_layout (cairo_t *cr, const char *text, const TextStyle *st)
{
  PangoLayout *layout = pango_cairo_create_layout (cr);
  PangoFontDescription *fd = pango_font_description_from_string (FONT_FAMILY);
  cairo_font_options_t *fo = cairo_font_options_create ();

  /* The same metrics whatever the surface, so PDF, SVG and PNG lay out alike. */
  cairo_font_options_set_hint_metrics (fo, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (fo, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (pango_layout_get_context (layout), fo);
  pango_layout_context_changed (layout);
  cairo_font_options_destroy (fo);

  pango_font_description_set_absolute_size (fd, st->size * PANGO_SCALE);
  pango_font_description_set_weight (fd, st->bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_font_description_free (fd);
  if (st->width > 0 && st->ellipsize)
    {
      pango_layout_set_alignment (layout, st->align);
      /* Whole, a little smaller if need be; only when even that does not
       * fit it loses whole words, never half of one. */
      double min_size = st->min_size > 0 ? st->min_size
                                         : MIN (st->size, MAX (6.0, st->size * 0.8));
      sw_text_fit_shrink (layout, text, (int) (st->width * PANGO_SCALE), MAX (st->max_lines, 1),
                          min_size);
      return layout;
    }
  if (st->width > 0)
    {
      pango_layout_set_width (layout, (int) (st->width * PANGO_SCALE));
      pango_layout_set_alignment (layout, st->align);
      pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
    }
  pango_layout_set_text (layout, text, -1);
  return layout;
}

/* Whether @text would be drawn whole (not cut) in @st. */
gboolean
sw_sheet_fits (cairo_t *cr, const char *text, const TextStyle *st)
{
  PangoLayout *layout = sw_sheet_layout (cr, text, st);
  gboolean whole = strcmp (pango_layout_get_text (layout), text) == 0;

  g_object_unref (layout);
  return whole;
}

/* Draws @text with its top at @y; returns its height. */
double
sw_sheet_text_at (cairo_t *cr, const char *text, double x, double y, const TextStyle *st)
{
  PangoLayout *layout = sw_sheet_layout (cr, text, st);
  int w, h;

  pango_layout_get_size (layout, &w, &h);
  sw_sheet_set_color (cr, st->color, 1.0);
  sw_sheet_show_layout (cr, layout, x, y);
  g_object_unref (layout);
  return (double) h / PANGO_SCALE;
}

/* Text whose vertical centre is at @cy. */
void
sw_sheet_text_centered_v (cairo_t *cr, const char *text, double x, double cy, const TextStyle *st)
{
  PangoLayout *layout = sw_sheet_layout (cr, text, st);
  int w, h;

  pango_layout_get_size (layout, &w, &h);
  sw_sheet_set_color (cr, st->color, 1.0);
  sw_sheet_show_layout (cr, layout, x, cy - (double) h / PANGO_SCALE / 2.0);
  g_object_unref (layout);
}

TextStyle
sw_sheet_style (double size, gboolean bold, guint32 color)
{
  TextStyle st = { size, bold, color, PANGO_ALIGN_LEFT, 0, FALSE, 0, 0.0 };
  return st;
}

TextStyle
sw_sheet_style_w (double size, gboolean bold, guint32 color, PangoAlignment align, double width)
{
  TextStyle st = { size, bold, color, align, width, TRUE, 0, 0.0 };
  return st;
}


void
sw_sheet_rule (cairo_t *cr, double x0, double x1, double y, guint32 color, double width)
{
  sw_sheet_set_color (cr, color, 1.0);
  cairo_set_line_width (cr, width);
  cairo_move_to (cr, x0, y);
  cairo_line_to (cr, x1, y);
  cairo_stroke (cr);
}

/* A panel heading with a rule under it; returns the height used. */
double
sw_sheet_heading (cairo_t *cr, const char *title, double x, double y, double w)
{
  TextStyle st = sw_sheet_style (9.5, TRUE, ACCENT);
  double h = sw_sheet_text_at (cr, title, x, y, &st);

  sw_sheet_rule (cr, x, x + w, y + h + 2.0, RULE, 0.6);
  return h + 6.0;
}

void
sw_sheet_note_in_box (cairo_t *cr, const char *text, double x, double y, double w, double h)
{
  TextStyle st = { 8.0, FALSE, MUTED, PANGO_ALIGN_CENTER, w - 16, FALSE, 0, 0.0 };
  PangoLayout *layout;
  int lw, lh;

  sw_sheet_set_color (cr, PANEL, 1.0);
  cairo_rectangle (cr, x, y, w, h);
  cairo_fill (cr);
  layout = sw_sheet_layout (cr, text, &st);
  pango_layout_get_size (layout, &lw, &lh);
  sw_sheet_set_color (cr, MUTED, 1.0);
  sw_sheet_show_layout (cr, layout, x + 8, y + (h - (double) lh / PANGO_SCALE) / 2.0);
  g_object_unref (layout);
}
