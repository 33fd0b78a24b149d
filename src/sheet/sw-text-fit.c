/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-text-fit"

#include "config.h"

#include "sw-text-fit.h"

#include <string.h>

static gboolean
fits (PangoLayout *layout, int width, int max_lines)
{
  PangoRectangle ink, logical;

  pango_layout_get_extents (layout, &ink, &logical);
  return logical.width <= width && pango_layout_get_line_count (layout) <= max_lines;
}

gboolean
sw_text_fit_words (PangoLayout *layout, const char *text, int width, int max_lines)
{
  g_auto (GStrv) words = NULL;
  guint n;

  g_return_val_if_fail (PANGO_IS_LAYOUT (layout) && text != NULL, FALSE);

  max_lines = MAX (max_lines, 1);
  pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_NONE);
  pango_layout_set_height (layout, -1);
  pango_layout_set_width (layout, MAX (width, 1));
  /* A word wider than the width must not be broken inside: it overflows,
   * and the check below sees it. */
  pango_layout_set_wrap (layout, PANGO_WRAP_WORD);
  pango_layout_set_text (layout, text, -1);
  if (fits (layout, width, max_lines))
    return TRUE;

  words = g_strsplit (text, " ", -1);
  n = g_strv_length (words);
  for (guint keep = n; keep-- > 1;)
    {
      g_autofree char *head = NULL;
      g_autofree char *shown = NULL;
      char *saved = words[keep];
      gsize len;

      words[keep] = NULL;
      head = g_strjoinv (" ", words);
      words[keep] = saved;
      /* No ellipsis after a separator left hanging ("stage 2 ·…"). */
      len = strlen (head);
      while (len > 0 && (head[len - 1] == ' ' || head[len - 1] == ',' || head[len - 1] == ';'
                         || head[len - 1] == ':'))
        head[--len] = '\0';
      if (len >= 2 && strcmp (head + len - 2, "\302\267") == 0)  /* U+00B7 middle dot */
        {
          head[len - 2] = '\0';
          g_strchomp (head);
        }
      if (head[0] == '\0')
        continue;
      shown = g_strconcat (head, "\342\200\246", NULL);  /* U+2026 */
      pango_layout_set_text (layout, shown, -1);
      if (fits (layout, width, max_lines))
        return TRUE;
    }
  pango_layout_set_text (layout, "", -1);
  return FALSE;
}

gboolean
sw_text_fit_shrink (PangoLayout *layout, const char *text, int width, int max_lines,
                    double min_size)
{
  const PangoFontDescription *orig;
  PangoFontDescription *fd;
  int size, floor_size, step = PANGO_SCALE / 4;

  g_return_val_if_fail (PANGO_IS_LAYOUT (layout) && text != NULL, FALSE);

  orig = pango_layout_get_font_description (layout);
  if (orig == NULL)
    return sw_text_fit_words (layout, text, width, max_lines);
  fd = pango_font_description_copy (orig);
  size = pango_font_description_get_size (fd);
  floor_size = (int) (min_size * PANGO_SCALE);
  /* Whole first, at the given size or a little smaller... */
  for (int s = size; s >= floor_size && s > 0; s -= step)
    {
      pango_font_description_set_absolute_size (fd, s);
      pango_layout_set_font_description (layout, fd);
      if (sw_text_fit_words (layout, text, width, max_lines)
          && strcmp (pango_layout_get_text (layout), text) == 0)
        {
          pango_font_description_free (fd);
          return TRUE;
        }
    }
  /* ...else at the given size, cut between words. */
  pango_font_description_set_absolute_size (fd, size);
  pango_layout_set_font_description (layout, fd);
  pango_font_description_free (fd);
  return sw_text_fit_words (layout, text, width, max_lines);
}
