/* SPDX-License-Identifier: GPL-3.0-or-later */
/* gui-test-env.h: what the GUI test programs share.  Each test runs in a
 * private temporary folder with its own XDG state, data, config and cache
 * folders, settings in memory, the cairo renderer and no recovery folder
 * from the caller's environment; the folder is removed at the end.  With
 * GTK (every program except test-recovery-kill, which defines
 * SW_GUI_TEST_ENV_GLIB_ONLY before including this) there are also helpers
 * to run the main loop until a condition holds and to close a main window.
 * Static inline: each program uses what it needs. */
#pragma once

#include <glib.h>
#include <glib/gstdio.h>

/* The four XDG variables the tests point into their private folder. */
static const char *const sw_test_xdg_vars[] = {
  "XDG_STATE_HOME", "XDG_DATA_HOME", "XDG_CONFIG_HOME", "XDG_CACHE_HOME",
};

/* Removes @path and everything below it. */
static inline void
sw_test_remove_tree (const char *path)
{
  GDir *dir = g_dir_open (path, 0, NULL);
  const char *name;

  if (dir != NULL)
    {
      while ((name = g_dir_read_name (dir)) != NULL)
        {
          g_autofree char *child = g_build_filename (path, name, NULL);
          sw_test_remove_tree (child);
        }
      g_dir_close (dir);
    }
  g_remove (path);
}

#ifndef SW_GUI_TEST_ENV_GLIB_ONLY

#include <gtk/gtk.h>

#include "sw-application.h"
#include "sw-window-private.h"

/* Makes a temporary folder from @tmpl (g_dir_make_tmp), points the XDG
 * folders of this process into it, keeps settings in memory, selects the
 * cairo renderer, unsets STAGEWRIGHT_RECOVERY_DIR and calls gtk_test_init.
 * Returns the folder; free it with sw_gui_test_env_finish(). */
static inline char *
sw_gui_test_env_init (int *argc, char ***argv, const char *tmpl)
{
  char *tmp_dir = g_dir_make_tmp (tmpl, NULL);

  g_assert_nonnull (tmp_dir);
  for (guint i = 0; i < G_N_ELEMENTS (sw_test_xdg_vars); i++)
    {
      g_autofree char *dir = g_build_filename (tmp_dir, sw_test_xdg_vars[i], NULL);
      g_mkdir_with_parents (dir, 0700);
      g_setenv (sw_test_xdg_vars[i], dir, TRUE);
    }
  g_setenv ("GSETTINGS_BACKEND", "memory", TRUE);
  g_setenv ("GSK_RENDERER", "cairo", TRUE);
  g_unsetenv ("STAGEWRIGHT_RECOVERY_DIR");

  gtk_test_init (argc, argv, NULL);
  return tmp_dir;
}

/* Removes the folder of sw_gui_test_env_init() and frees its name. */
static inline void
sw_gui_test_env_finish (char *tmp_dir)
{
  sw_test_remove_tree (tmp_dir);
  g_free (tmp_dir);
}

static inline gboolean
sw_test_flag_cb (gpointer data)
{
  *(gboolean *) data = TRUE;
  return G_SOURCE_REMOVE;
}

/* Runs the main loop for @ms. */
static inline void
sw_test_spin_ms (guint ms)
{
  gboolean done = FALSE;

  g_timeout_add (ms, sw_test_flag_cb, &done);
  while (!done)
    g_main_context_iteration (NULL, TRUE);
}

/* A handler that counts its calls in the guint at @n (a frame clock's
 * "layout", say). */
static inline void
sw_test_count_cb (gpointer instance, guint *n)
{
  (*n)++;
}

/* The application's style rules for one test (the faces' frames, the
 * rows that do not fade): added, and taken away again with
 * sw_test_remove_app_style. */
static inline GtkCssProvider *
sw_test_add_app_style (void)
{
  return sw_application_add_style (gdk_display_get_default ());
}

static inline void
sw_test_remove_app_style (GtkCssProvider *css)
{
  gtk_style_context_remove_provider_for_display (gdk_display_get_default (),
                                                 GTK_STYLE_PROVIDER (css));
  g_object_unref (css);
}

/* Runs the main loop until @cond holds; fails the test after @ms. */
static inline void
sw_test_wait_until (gboolean (*cond) (gpointer), gpointer data, guint ms, const char *what)
{
  gboolean timed_out = FALSE;
  guint id = g_timeout_add (ms, sw_test_flag_cb, &timed_out);

  while (!cond (data) && !timed_out)
    g_main_context_iteration (NULL, TRUE);
  if (timed_out)
    g_error ("timed out after %u ms waiting for %s", ms, what);
  g_source_remove (id);
}

/* The newest edit (of the window @data) has been solved, shown and painted;
 * later phases (the Monte Carlo, the ascent) may still be pending. */
static inline gboolean
sw_test_result_drawn (gpointer data)
{
  SwWindow *w = data;
  SwAnalysis *r = sw_window_get_shown_result (w);
  guint64 posted = sw_solver_get_posted_serial (sw_window_get_solver (w));

  return r != NULL && r->serial == posted && sw_window_get_drawn_serial (w) >= posted;
}

/* ... in every phase: the Monte Carlo and the ascent included. */
static inline gboolean
sw_test_result_complete (gpointer data)
{
  SwWindow *w = data;
  SwAnalysis *r = sw_window_get_shown_result (w);

  return sw_test_result_drawn (w) && !r->montecarlo_pending && !r->ascent_pending;
}

/* Closes @w without asking about unsaved edits and checks that it is
 * finalized. */
static inline void
sw_test_window_close (SwWindow *w)
{
  GtkWidget *weak = GTK_WIDGET (w);

  g_object_add_weak_pointer (G_OBJECT (w), (gpointer *) &weak);
  sw_window_close_discarding (w);
  for (int i = 0; i < 1000 && weak != NULL; i++)
    g_main_context_iteration (NULL, FALSE);
  g_assert_null (weak);
}

#endif /* SW_GUI_TEST_ENV_GLIB_ONLY */
