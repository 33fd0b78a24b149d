/* SPDX-License-Identifier: GPL-3.0-or-later */
/* GUI test of the window in German (the project's full translation, from
 * the build folder's po/ through SW_LOCALE_DIR): the minimum width stays
 * inside a 1,280 px screen on every page with every demo, so the longer
 * German labels, tabs and buttons wrap or ellipsize instead of widening the
 * window.  test-window checks the same in English.  Skipped when the
 * de_DE.UTF-8 locale is not generated on the machine.  Suite 'gui'. */
#include "config.h"

#include "sw-application.h"
#include "sw-install-paths.h"
#include "sw-window-private.h"

#include "gui-test-env.h"

#include <glib/gi18n.h>
#include <locale.h>
#include <string.h>

#define GERMAN "de_DE.UTF-8"

static char *tmp_dir;
static gboolean german;
/* Scrolled windows too narrow for their content, over the whole test. */
static int total_faults;

static void
wait_shown (SwWindow *w)
{
  sw_test_wait_until (sw_test_result_drawn, w, 20000, "the newest result to be drawn");
}

static int
min_width (GtkWidget *widget)
{
  int min = 0;

  gtk_widget_measure (widget, GTK_ORIENTATION_HORIZONTAL, -1, &min, NULL, NULL, NULL);
  return min;
}

/* On failure: the visible widgets below @widget with no child at least
 * @limit px wide, so the message names what forces the width. */
static void
report_wide (GtkWidget *widget, int limit, int depth)
{
  int min;

  if (!gtk_widget_get_visible (widget))
    return;
  min = min_width (widget);
  if (min < limit)
    return;
  g_test_message ("  %*s%s (%s) %d px%s%s", depth, "", G_OBJECT_TYPE_NAME (widget),
                  gtk_widget_get_name (widget), min, GTK_IS_LABEL (widget) ? ": " : "",
                  GTK_IS_LABEL (widget) ? gtk_label_get_text (GTK_LABEL (widget)) : "");
  {
    GtkWidget *widest = NULL;
    int widest_min = 0;

    for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
         c = gtk_widget_get_next_sibling (c))
      if (gtk_widget_get_visible (c) && min_width (c) > widest_min)
        {
          widest = c;
          widest_min = min_width (c);
        }
    if (widest != NULL)
      report_wide (widest, limit, depth + 1);
  }
}

/* Every leaf of @widget at least @limit px wide, for the failure message. */
static void
report_wide_leaves (GtkWidget *widget, int limit)
{
  if (!gtk_widget_get_visible (widget))
    return;
  if (GTK_IS_LABEL (widget) || GTK_IS_BUTTON (widget) || GTK_IS_DROP_DOWN (widget))
    {
      int min = min_width (widget);
      if (min >= limit)
        g_test_message ("  wide %s %d px: %s", G_OBJECT_TYPE_NAME (widget), min,
                        GTK_IS_LABEL (widget) ? gtk_label_get_text (GTK_LABEL (widget)) : "");
      return;
    }
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    report_wide_leaves (c, limit);
}

/* Every scrolled window of @widget that scrolls sideways has room for its
 * content: nothing is pushed out to the right of a 1,280 px window. */
static int
check_scrolled (GtkWidget *widget, const char *what)
{
  int faults = 0;

  if (!gtk_widget_get_mapped (widget))
    return 0;
  if (GTK_IS_SCROLLED_WINDOW (widget))
    {
      GtkWidget *child = gtk_scrolled_window_get_child (GTK_SCROLLED_WINDOW (widget));
      GtkPolicyType h;
      int need, have = gtk_widget_get_width (widget);

      gtk_scrolled_window_get_policy (GTK_SCROLLED_WINDOW (widget), &h, NULL);
      /* (not yet allocated: nothing to check) */
      if (child != NULL && h != GTK_POLICY_NEVER && have > 0)
        {
          need = min_width (child);
          g_test_message ("%s: %s needs %d px, has %d px", what, G_OBJECT_TYPE_NAME (child), need,
                          have);
          if (need > have)
            {
              report_wide (child, 1, 0);
              report_wide_leaves (child, 150);
              faults++;
            }
        }
    }
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    faults += check_scrolled (c, what);
  return faults;
}

static void
check_pages (SwWindow *w, const char *what)
{
  static const char *const pages[] = { "curves", "working", "ascent", "trade", "staging" };

  for (guint i = 0; i < G_N_ELEMENTS (pages); i++)
    {
      g_autofree char *where = g_strdup_printf ("%s, page %s", what, pages[i]);
      int min, faults;


      g_assert_true (sw_window_show_page (w, pages[i]));
      wait_shown (w);
      /* Let the new page be laid out. */
      for (int k = 0; k < 20; k++)
        g_main_context_iteration (NULL, FALSE);
      min = min_width (GTK_WIDGET (w));
      g_test_message ("%s: minimum width %d px, width %d px", where, min,
                      gtk_widget_get_width (GTK_WIDGET (w)));
      g_assert_cmpint (min, <=, 1280);
      g_assert_cmpint (gtk_widget_get_width (GTK_WIDGET (w)), <=, 1280);
      faults = check_scrolled (GTK_WIDGET (w), where);
      total_faults += faults;
    }
}

static int
compare_names (gconstpointer a, gconstpointer b)
{
  return g_strcmp0 (*(char *const *) a, *(char *const *) b);
}

static void
test_german_min_width (void)
{
  g_autoptr (GDir) dir = NULL;
  g_autoptr (GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
  SwWindow *w;
  const char *name;

  if (!german)
    {
      g_test_skip ("the " GERMAN " locale is not generated on this machine");
      return;
    }
  /* The translation is loaded: a label of the window reads German. */
  g_assert_cmpstr (g_dgettext (GETTEXT_PACKAGE, "Payload"), !=, "Payload");

  w = sw_window_new (NULL);
  gtk_window_unmaximize (GTK_WINDOW (w));
  gtk_window_set_default_size (GTK_WINDOW (w), 1280, 800);
  gtk_window_present (GTK_WINDOW (w));
  wait_shown (w);

  dir = g_dir_open (SOURCE_DESIGNS_DIR, 0, NULL);
  g_assert_nonnull (dir);
  while ((name = g_dir_read_name (dir)) != NULL)
    if (g_str_has_suffix (name, ".stagewright"))
      g_ptr_array_add (names, g_strdup (name));
  g_ptr_array_sort (names, compare_names);
  g_assert_cmpuint (names->len, >=, 5);

  for (guint i = 0; i < names->len; i++)
    {
      g_autofree char *path = g_build_filename (SOURCE_DESIGNS_DIR, names->pdata[i], NULL);
      g_autoptr (GFile) file = g_file_new_for_path (path);

      g_assert_true (sw_window_load (w, file));
      wait_shown (w);
      check_pages (w, names->pdata[i]);
    }

  /* Numbers do not widen it either. */
  {
    SwDocument *doc = sw_window_get_document (w);
    SwDesign *d = sw_design_copy (sw_document_get_design (doc));

    d->payload_kg = 999999999999.0;
    sw_document_commit (doc, d, NULL);
    wait_shown (w);
    check_pages (w, "payload 999.999.999.999 kg");
  }
  sw_test_window_close (w);
  g_assert_cmpint (total_faults, ==, 0);
}

int
main (int argc, char **argv)
{
  g_autofree char *localedir = NULL;
  int status;

  /* German messages and numbers, translations from the build folder. */
  g_setenv ("LANGUAGE", "de", TRUE);
  g_setenv ("LC_ALL", GERMAN, TRUE);
  g_setenv ("LANG", GERMAN, TRUE);
  tmp_dir = sw_gui_test_env_init (&argc, &argv, "stagewright-german-XXXXXX");
  /* gtk_test_init set a locale of its own. */
  german = setlocale (LC_ALL, GERMAN) != NULL;
  localedir = sw_install_locale_dir ();
  bindtextdomain (GETTEXT_PACKAGE, localedir);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  g_test_add_func ("/gui/window-german/min-width", test_german_min_width);

  status = g_test_run ();
  sw_gui_test_env_finish (tmp_dir);
  return status;
}
