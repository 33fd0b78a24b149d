/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "sw-application"

#include "config.h"

#include "sw-application.h"

#include "sw-format.h"
#include "sw-install-paths.h"
#include "sw-settings.h"
#include "sw-window-private.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* A screenshot that has not been drawn by then has failed. */
#define SCREENSHOT_TIMEOUT_S 60
/* The same for the hidden test options (slow under sanitizers). */
#define TEST_SCRIPT_TIMEOUT_S 120

struct _SwApplication {
  GtkApplication parent_instance;
  char          *screenshot;       /* --screenshot=FILE */
  char          *page;             /* --page=NAME */
  char          *carpet;           /* --carpet=X,Y[,OUTPUT] */
  int            shot_width;       /* --screenshot-size=WxH */
  int            shot_height;
  int            exit_status;
  guint          screenshot_timeout;
  guint          screenshot_frames; /* frames left before the picture is taken */
  /* Hidden options for the end-to-end tests (tests/test-recovery-kill.c). */
  char         **test_edits;       /* --test-edit=FIELD=VALUE, in order */
  gboolean       test_edits_done;
  gboolean       test_restore;     /* --test-restore: accept a recovery offer */
  char          *test_dump;        /* --test-dump=FILE */
  guint          test_timeout;
};

G_DEFINE_FINAL_TYPE (SwApplication, sw_application, GTK_TYPE_APPLICATION)

gboolean
sw_application_check_settings (GError **error)
{
  return sw_settings_check (error);
}

GSettings *
sw_application_settings_new (void)
{
  return sw_settings_new ();
}

char *
sw_application_find_design (const char *basename)
{
  return sw_install_find_design (basename);
}

gboolean
sw_application_write_png (GtkWidget *widget, const char *filename, GError **error)
{
  g_autoptr (GdkPaintable) paintable = gtk_widget_paintable_new (widget);
  /* At the paintable's own size: any other size would scale the picture. */
  int width = gdk_paintable_get_intrinsic_width (paintable);
  int height = gdk_paintable_get_intrinsic_height (paintable);
  g_autoptr (GskRenderer) renderer = gsk_cairo_renderer_new ();
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  GtkSnapshot *snapshot = gtk_snapshot_new ();

  gdk_paintable_snapshot (paintable, snapshot, width, height);
  node = gtk_snapshot_free_to_node (snapshot);
  if (node == NULL || width <= 0 || height <= 0)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("%s: the window has not been drawn"),
                   filename);
      return FALSE;
    }
  /* The cairo renderer needs no surface and no GPU. */
  if (!gsk_renderer_realize (renderer, NULL, error))
    return FALSE;
  texture = gsk_renderer_render_texture (renderer, node,
                                         &GRAPHENE_RECT_INIT (0, 0, width, height));
  gsk_renderer_unrealize (renderer);
  if (!gdk_texture_save_to_png (texture, filename))
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("%s: could not write the PNG file"),
                   filename);
      return FALSE;
    }
  return TRUE;
}

/* ---- windows ----------------------------------------------------------- */

static SwWindow *
replaceable_window (SwApplication *self)
{
  GtkWindow *active = gtk_application_get_active_window (GTK_APPLICATION (self));

  if (SW_IS_WINDOW (active) && sw_window_is_replaceable (SW_WINDOW (active)))
    return SW_WINDOW (active);
  return sw_window_new (GTK_APPLICATION (self));
}

/* The design of the last session, or on the first start the demonstration
 * design, opened as an untitled copy so it is never overwritten. */
static void
open_first_design (SwApplication *self, SwWindow *window)
{
  g_autoptr (GSettings) settings = sw_application_settings_new ();
  g_autofree char *last = g_settings_get_string (settings, "last-design");
  g_autofree char *demo = NULL;
  g_autoptr (GFile) file = NULL;

  if (last[0] != '\0' && g_file_test (last, G_FILE_TEST_IS_REGULAR))
    {
      file = g_file_new_for_path (last);
      if (sw_window_load (window, file))
        return;
    }
  demo = sw_application_find_design ("medium-cargo.stagewright");
  g_set_object (&file, g_file_new_for_path (demo));
  sw_window_load_template (window, file);
}

static void
screenshot_failed (SwApplication *self, const char *message)
{
  g_printerr ("stagewright: %s\n", message);
  self->exit_status = 1;
  g_application_quit (G_APPLICATION (self));
}

static gboolean
screenshot_timeout_cb (gpointer data)
{
  SwApplication *self = data;

  self->screenshot_timeout = 0;
  screenshot_failed (self, _("the screenshot timed out before the first sizing was drawn"));
  return G_SOURCE_REMOVE;
}

static void screenshot_after_frames (SwApplication *self, SwWindow *window);
static void screenshot_staging_ready_cb (SwStagingPage *page, SwApplication *self);

static void
screenshot_drawn_cb (SwWindow *window, guint64 serial, SwApplication *self)
{
  /* The first result of the design as loaded, not of the placeholder. */
  if (serial < sw_solver_get_posted_serial (sw_window_get_solver (window)))
    return;
  /* With an ascent or a Monte Carlo on the way, the picture waits for it. */
  if (sw_window_get_shown_result (window) != NULL
      && (sw_window_get_shown_result (window)->ascent_pending
          || sw_window_get_shown_result (window)->montecarlo_pending))
    return;
  g_signal_handlers_disconnect_by_func (window, screenshot_drawn_cb, self);
  /* The staging page computes on its own worker once shown: the picture
   * waits for its figures, then for a frame laid out with them. */
  if (g_strcmp0 (self->page, "staging") == 0 || g_strcmp0 (self->page, "carpet") == 0)
    {
      SwStagingPage *page = sw_window_get_staging_page (window);
      if (!sw_staging_page_is_ready (page) || sw_staging_page_is_busy (page))
        {
          g_signal_connect_object (page, "ready", G_CALLBACK (screenshot_staging_ready_cb), self,
                                   0);
          return;
        }
    }
  screenshot_after_frames (self, window);
}

static void
screenshot_staging_ready_cb (SwStagingPage *page, SwApplication *self)
{
  GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (page));

  if (sw_staging_page_is_busy (page) || !SW_IS_WINDOW (root))
    return;
  g_signal_handlers_disconnect_by_func (page, screenshot_staging_ready_cb, self);
  screenshot_after_frames (self, SW_WINDOW (root));
}

static void
screenshot_write (SwApplication *self, SwWindow *window)
{
  g_autoptr (GError) error = NULL;

  g_clear_handle_id (&self->screenshot_timeout, g_source_remove);
  if (!sw_application_write_png (GTK_WIDGET (window), self->screenshot, &error))
    {
      screenshot_failed (self, error->message);
      return;
    }
  gtk_window_destroy (GTK_WINDOW (window));
}

/* After a frame's paint, when everything is laid out: two frames after the
 * last change, every view is drawn with it. */
static void
screenshot_after_paint_cb (GdkFrameClock *clock, SwWindow *window)
{
  SwApplication *self = SW_APPLICATION (gtk_window_get_application (GTK_WINDOW (window)));

  if (self->screenshot_frames > 0)
    {
      /* Scrolled once the page is laid out with its figures (the progress
       * bar gone), then drawn again. */
      if (self->screenshot_frames == 2 && g_strcmp0 (self->page, "carpet") == 0)
        sw_staging_page_scroll_to_carpet (sw_window_get_staging_page (window));
      self->screenshot_frames--;
      gtk_widget_queue_draw (GTK_WIDGET (window));
      return;
    }
  g_signal_handlers_disconnect_by_func (clock, screenshot_after_paint_cb, window);
  screenshot_write (self, window);
}

static void
screenshot_after_frames (SwApplication *self, SwWindow *window)
{
  GdkFrameClock *clock = gtk_widget_get_frame_clock (GTK_WIDGET (window));

  self->screenshot_frames = 3;
  g_signal_connect_object (clock, "after-paint", G_CALLBACK (screenshot_after_paint_cb), window,
                           0);
  gtk_widget_queue_draw (GTK_WIDGET (window));
}

/* --carpet=X,Y[,OUTPUT]: each axis PARAM:MIN:MAX:N as the CLI's carpet
 * command reads it, for the design just loaded. */
static gboolean
choose_carpet (SwApplication *self, SwWindow *window)
{
  const SwDesign *d = sw_document_get_design (sw_window_get_document (window));
  g_auto (GStrv) parts = g_strsplit (self->carpet, ",", -1);
  g_autoptr (GError) error = NULL;
  SwCarpetAxis x = { 0 }, y = { 0 };
  SwCarpetOutput output = SW_CARPET_LIFTOFF_MASS;
  guint n = g_strv_length (parts);

  if ((n != 2 && n != 3)
      || (n == 3 && !sw_carpet_output_from_string (parts[2], &output)))
    {
      g_autofree char *m = g_strdup_printf (_("--carpet=%s: expected X,Y or X,Y,OUTPUT, each "
                                              "axis PARAM:MIN:MAX:N, OUTPUT liftoff_mass, "
                                              "payload, development or cost_per_flight"),
                                            self->carpet);
      screenshot_failed (self, m);
      return FALSE;
    }
  if (!sw_carpet_axis_parse ("--carpet", parts[0], d, &x, &error)
      || !sw_carpet_axis_parse ("--carpet", parts[1], d, &y, &error)
      || !sw_carpet_axis_check (&x, d, &error) || !sw_carpet_axis_check (&y, d, &error))
    {
      screenshot_failed (self, error->message);
      return FALSE;
    }
  sw_staging_page_choose_carpet (sw_window_get_staging_page (window), &x, &y, output);
  return TRUE;
}

static void
start_screenshot (SwApplication *self, GFile *file)
{
  SwWindow *window = sw_window_new (GTK_APPLICATION (self));
  g_autoptr (GFile) demo = NULL;
  gboolean ok;

  sw_window_set_ephemeral (window);
  gtk_window_unmaximize (GTK_WINDOW (window));
  gtk_window_set_default_size (GTK_WINDOW (window), self->shot_width, self->shot_height);
  if (file != NULL)
    ok = sw_window_load (window, file);
  else
    {
      g_autofree char *path = sw_application_find_design ("medium-cargo.stagewright");
      demo = g_file_new_for_path (path);
      ok = sw_window_load_template (window, demo);
    }
  if (!ok)
    {
      const char *message = sw_window_get_message (window, NULL);
      screenshot_failed (self, message != NULL ? message : _("the design could not be opened"));
      gtk_window_destroy (GTK_WINDOW (window));
      return;
    }
  if (self->carpet != NULL && !choose_carpet (self, window))
    {
      gtk_window_destroy (GTK_WINDOW (window));
      return;
    }
  if (self->page != NULL && !sw_window_show_page (window, self->page))
    {
      g_autofree char *message = g_strdup_printf (_("--page=%s: no such page (curves, working, "
                                                    "ascent, trade, staging, carpet)"),
                                                  self->page);
      screenshot_failed (self, message);
      gtk_window_destroy (GTK_WINDOW (window));
      return;
    }
  g_signal_connect (window, "result-drawn", G_CALLBACK (screenshot_drawn_cb), self);
  self->screenshot_timeout = g_timeout_add_seconds (SCREENSHOT_TIMEOUT_S, screenshot_timeout_cb,
                                                    self);
  gtk_window_present (GTK_WINDOW (window));
}

/* ---- hidden test options ----------------------------------------------- */

/* These drive the real binary from tests/test-recovery-kill.c: accept the
 * recovery offer, make edits through the inspector's own fields once the
 * design is shown, write the design out once their result is drawn. */

static gboolean
test_script_active (SwApplication *self)
{
  return self->test_edits != NULL || self->test_restore || self->test_dump != NULL;
}

static void
test_script_failed (SwApplication *self, SwWindow *window, const char *message)
{
  g_printerr ("stagewright: %s\n", message);
  self->exit_status = 1;
  g_clear_handle_id (&self->test_timeout, g_source_remove);
  if (window != NULL)
    sw_window_close_discarding (window);
  g_application_quit (G_APPLICATION (self));
}

static gboolean
test_timeout_cb (gpointer data)
{
  SwApplication *self = data;

  self->test_timeout = 0;
  test_script_failed (self, NULL, "the test options timed out");
  return G_SOURCE_REMOVE;
}

/* FIELD=VALUE: a number field of the inspector set as a user would, or
 * stage=N to select a stage first. */
static gboolean
apply_test_edit (SwWindow *window, const char *edit, GError **error)
{
  static const struct { const char *key; SwInspectorField field; } fields[] = {
    { "payload_kg", SW_INSPECTOR_PAYLOAD }, { "delta_v_m_s", SW_INSPECTOR_DELTA_V },
    { "altitude_km", SW_INSPECTOR_ALTITUDE }, { "inclination_deg", SW_INSPECTOR_INCLINATION },
    { "site_latitude_deg", SW_INSPECTOR_LATITUDE }, { "losses_m_s", SW_INSPECTOR_LOSSES },
    { "isp_vac_s", SW_INSPECTOR_ISP_VAC }, { "isp_sl_s", SW_INSPECTOR_ISP_SL },
  };
  SwInspector *inspector = sw_window_get_inspector (window);
  g_auto (GStrv) kv = g_strsplit (edit, "=", 2);
  char *end = NULL;
  double value = kv[0] != NULL && kv[1] != NULL ? g_ascii_strtod (kv[1], &end) : NAN;

  if (end != NULL && end != kv[1] && *end == '\0' && isfinite (value))
    {
      if (strcmp (kv[0], "stage") == 0)
        {
          sw_inspector_set_selected (inspector, (int) value);
          return TRUE;
        }
      for (guint i = 0; i < G_N_ELEMENTS (fields); i++)
        if (strcmp (kv[0], fields[i].key) == 0)
          {
            SwNumberField *f = SW_NUMBER_FIELD (sw_inspector_get_field (inspector,
                                                                       fields[i].field));
            if (sw_number_field_commit_value (f, value))
              return TRUE;
            g_set_error (error, G_OPTION_ERROR, G_OPTION_ERROR_BAD_VALUE, "--test-edit=%s: %s",
                         edit, sw_number_field_get_error (f));
            return FALSE;
          }
    }
  g_set_error (error, G_OPTION_ERROR, G_OPTION_ERROR_BAD_VALUE,
               "--test-edit=%s: expected FIELD=NUMBER (payload_kg, delta_v_m_s, altitude_km, "
               "inclination_deg, site_latitude_deg, losses_m_s, isp_vac_s, isp_sl_s, stage)",
               edit);
  return FALSE;
}

static void
test_script_drawn_cb (SwWindow *window, guint64 serial, SwApplication *self)
{
  SwSolver *solver = sw_window_get_solver (window);
  const SwDesign *design;
  SwAnalysis *shown;
  g_autoptr (GError) error = NULL;

  if (serial < sw_solver_get_posted_serial (solver))
    return;
  if (!self->test_edits_done)
    {
      self->test_edits_done = TRUE;
      for (guint i = 0; self->test_edits != NULL && self->test_edits[i] != NULL; i++)
        if (!apply_test_edit (window, self->test_edits[i], &error))
          {
            test_script_failed (self, window, error->message);
            return;
          }
      if (serial < sw_solver_get_posted_serial (solver))
        return;  /* wait for the result of the edits */
    }
  g_signal_handlers_disconnect_by_func (window, test_script_drawn_cb, self);
  g_clear_handle_id (&self->test_timeout, g_source_remove);
  if (self->test_dump == NULL)
    return;  /* keep running: the test kills the process */
  design = sw_document_get_design (sw_window_get_document (window));
  shown = sw_window_get_shown_result (window);
  if (shown == NULL || !sw_design_equal (shown->design, design))
    test_script_failed (self, window, "the result shown is not of the design being edited");
  else if (!sw_design_save (design, self->test_dump, &error))
    test_script_failed (self, window, error->message);
  else
    sw_window_close_discarding (window);
}

static void
start_test_script (SwApplication *self, SwWindow *window)
{
  if (self->test_restore && sw_window_get_recovery_offered (window))
    sw_window_answer_recovery (window, TRUE);
  g_signal_connect (window, "result-drawn", G_CALLBACK (test_script_drawn_cb), self);
  self->test_timeout = g_timeout_add_seconds (TEST_SCRIPT_TIMEOUT_S, test_timeout_cb, self);
}

/* ---- app actions ------------------------------------------------------- */

static void
quit_action (GSimpleAction *action, GVariant *param, gpointer data)
{
  g_autoptr (GList) windows = g_list_copy (gtk_application_get_windows (GTK_APPLICATION (data)));

  /* Each window asks about its own unsaved changes. */
  for (GList *l = windows; l != NULL; l = l->next)
    gtk_window_close (GTK_WINDOW (l->data));
}

static void
about_action (GSimpleAction *action, GVariant *param, gpointer data)
{
  GtkWindow *parent = gtk_application_get_active_window (GTK_APPLICATION (data));
  g_autofree char *comments = g_strdup_printf ("%s\n\n%s",
                                               _("Size multistage launch vehicles at the "
                                                 "concept stage."),
                                               sw_format_cautions ());
  const char *authors[] = { _("The Stagewright developers"), NULL };

  gtk_show_about_dialog (parent,
                         "program-name", "Stagewright",
                         "logo-icon-name", APP_ID,
                         "version", PACKAGE_VERSION,
                         "comments", comments,
                         "license-type", GTK_LICENSE_GPL_3_0,
                         "copyright", _("© 2026 The Stagewright developers"),
                         "authors", authors,
                         /* Translators: your name(s), one per line */
                         "translator-credits", _("translator-credits"),
                         NULL);
}

static const GActionEntry app_actions[] = {
  { "quit", quit_action, NULL, NULL, NULL, { 0 } },
  { "about", about_action, NULL, NULL, NULL, { 0 } },
};

/* ---- GApplication ------------------------------------------------------ */

static int
sw_application_handle_local_options (GApplication *app, GVariantDict *options)
{
  SwApplication *self = SW_APPLICATION (app);

  if (g_variant_dict_contains (options, "version"))
    {
      g_print ("stagewright %s\n", PACKAGE_VERSION);
      return 0;
    }
  g_variant_dict_lookup (options, "screenshot", "^ay", &self->screenshot);
  g_variant_dict_lookup (options, "page", "s", &self->page);
  g_variant_dict_lookup (options, "carpet", "s", &self->carpet);
  if (g_variant_dict_contains (options, "screenshot-size"))
    {
      g_autofree char *size = NULL;
      g_variant_dict_lookup (options, "screenshot-size", "s", &size);
      /* A projector's 1920x1080 or a small laptop's 1024x640. */
      if (sscanf (size, "%dx%d", &self->shot_width, &self->shot_height) != 2
          || self->shot_width < 800 || self->shot_width > 3840
          || self->shot_height < 600 || self->shot_height > 2160)
        {
          g_printerr (_("stagewright: --screenshot-size=%s: expected WIDTHxHEIGHT, 800x600 to "
                        "3840x2160\n"), size);
          return 2;
        }
    }
  g_variant_dict_lookup (options, "test-edit", "^as", &self->test_edits);
  g_variant_dict_lookup (options, "test-restore", "b", &self->test_restore);
  g_variant_dict_lookup (options, "test-dump", "^ay", &self->test_dump);
  if (self->screenshot != NULL || test_script_active (self))
    /* A screenshot or a test runs on its own, never in an instance already
     * running. */
    g_application_set_flags (app, g_application_get_flags (app) | G_APPLICATION_NON_UNIQUE);
  return -1;
}

GtkCssProvider *
sw_application_add_style (GdkDisplay *display)
{
  GtkCssProvider *css = gtk_css_provider_new ();

  g_return_val_if_fail (GDK_IS_DISPLAY (display), css);

  gtk_css_provider_load_from_resource (css, "/org/stagewright/Stagewright/style.css");
  gtk_style_context_add_provider_for_display (display, GTK_STYLE_PROVIDER (css),
                                              GTK_STYLE_PROVIDER_PRIORITY_APPLICATION);
  return css;
}

static void
sw_application_startup (GApplication *app)
{
  G_APPLICATION_CLASS (sw_application_parent_class)->startup (app);

  g_object_unref (sw_application_add_style (gdk_display_get_default ()));
  gtk_window_set_default_icon_name (APP_ID);

  g_action_map_add_action_entries (G_ACTION_MAP (app), app_actions, G_N_ELEMENTS (app_actions),
                                   app);
  gtk_application_set_accels_for_action (GTK_APPLICATION (app), "app.quit",
                                         (const char *[]) { "<Control>q", NULL });
}

static void
sw_application_activate (GApplication *app)
{
  SwApplication *self = SW_APPLICATION (app);
  GtkWindow *window;

  if (self->screenshot != NULL)
    {
      start_screenshot (self, NULL);
      return;
    }
  window = gtk_application_get_active_window (GTK_APPLICATION (app));
  if (window == NULL)
    {
      window = GTK_WINDOW (sw_window_new (GTK_APPLICATION (app)));
      open_first_design (self, SW_WINDOW (window));
      if (self->page != NULL)
        sw_window_show_page (SW_WINDOW (window), self->page);
      if (test_script_active (self))
        start_test_script (self, SW_WINDOW (window));
    }
  gtk_window_present (window);
}

static void
sw_application_open (GApplication *app, GFile **files, int n_files, const char *hint)
{
  SwApplication *self = SW_APPLICATION (app);

  if (self->screenshot != NULL)
    {
      start_screenshot (self, files[0]);
      return;
    }
  for (int i = 0; i < n_files; i++)
    {
      SwWindow *window = replaceable_window (self);
      sw_window_load (window, files[i]);
      if (self->page != NULL)
        sw_window_show_page (window, self->page);
      if (i == 0 && test_script_active (self))
        start_test_script (self, window);
      gtk_window_present (GTK_WINDOW (window));
    }
}

static void
sw_application_finalize (GObject *object)
{
  SwApplication *self = SW_APPLICATION (object);

  g_clear_handle_id (&self->screenshot_timeout, g_source_remove);
  g_clear_handle_id (&self->test_timeout, g_source_remove);
  g_free (self->screenshot);
  g_free (self->page);
  g_free (self->carpet);
  g_strfreev (self->test_edits);
  g_free (self->test_dump);
  G_OBJECT_CLASS (sw_application_parent_class)->finalize (object);
}

static void
sw_application_class_init (SwApplicationClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GApplicationClass *app_class = G_APPLICATION_CLASS (klass);

  object_class->finalize = sw_application_finalize;
  app_class->handle_local_options = sw_application_handle_local_options;
  app_class->startup = sw_application_startup;
  app_class->activate = sw_application_activate;
  app_class->open = sw_application_open;
}

static void
sw_application_init (SwApplication *self)
{
  self->shot_width = 1280;
  self->shot_height = 800;
  const GOptionEntry options[] = {
    { "screenshot", 0, 0, G_OPTION_ARG_FILENAME, NULL,
      N_("Draw the main window at 1280×800 once the design is sized, write it to FILE as "
         "PNG and quit"), N_("FILE") },
    { "screenshot-size", 0, 0, G_OPTION_ARG_STRING, NULL,
      N_("The window size for --screenshot instead of 1280×800"), N_("WIDTHxHEIGHT") },
    { "page", 0, 0, G_OPTION_ARG_STRING, NULL,
      N_("Show PAGE first: curves, working, ascent, trade, staging or carpet (the staging "
         "page scrolled to its carpet plot)"), N_("PAGE") },
    { "carpet", 0, 0, G_OPTION_ARG_STRING, NULL,
      N_("With --screenshot: the carpet plot's axes and output, as the CLI's carpet command "
         "takes them"), N_("X,Y[,OUTPUT]") },
    { "version", 0, 0, G_OPTION_ARG_NONE, NULL, N_("Print the version and quit"), NULL },
    /* For tests/test-recovery-kill.c only: not shown in --help. */
    { "test-edit", 0, G_OPTION_FLAG_HIDDEN, G_OPTION_ARG_STRING_ARRAY, NULL, NULL, NULL },
    { "test-restore", 0, G_OPTION_FLAG_HIDDEN, G_OPTION_ARG_NONE, NULL, NULL, NULL },
    { "test-dump", 0, G_OPTION_FLAG_HIDDEN, G_OPTION_ARG_FILENAME, NULL, NULL, NULL },
    { NULL }
  };

  g_application_add_main_option_entries (G_APPLICATION (self), options);
  g_application_set_option_context_parameter_string (G_APPLICATION (self), _("[DESIGN…]"));
}

SwApplication *
sw_application_new (void)
{
  return g_object_new (SW_TYPE_APPLICATION,
                       "application-id", APP_ID,
                       "flags", G_APPLICATION_HANDLES_OPEN,
                       "resource-base-path", "/org/stagewright/Stagewright",
                       NULL);
}

int
sw_application_get_exit_status (SwApplication *self)
{
  g_return_val_if_fail (SW_IS_APPLICATION (self), 1);
  return self->exit_status;
}
