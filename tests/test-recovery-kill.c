/* SPDX-License-Identifier: GPL-3.0-or-later */
/* End to end: the real stagewright binary is started under the test's X
 * display with private home and XDG folders, makes edits through its
 * inspector (hidden --test-edit option), is killed with SIGKILL once its
 * recovery copy holds them, and is started again: it must offer and restore
 * exactly the last edit.  Suite 'gui' (runs under xvfb-run). */
#include "config.h"

#include "sw-design.h"

#define SW_GUI_TEST_ENV_GLIB_ONLY
#include "gui-test-env.h"

#include <glib/gstdio.h>
#include <errno.h>
#include <signal.h>
#include <string.h>
#include <sys/types.h>
#include <sys/wait.h>

/* Generous: the sanitizer build starts the GTK application slowly. */
#define START_TIMEOUT_MS 120000

static char *tmp_dir;

typedef struct {
  GPid pid;
  gboolean exited;
  int wait_status;
} Child;

static char **
child_environment (void)
{
  char **env = g_get_environ ();

  env = g_environ_setenv (env, "HOME", tmp_dir, TRUE);
  for (guint i = 0; i < G_N_ELEMENTS (sw_test_xdg_vars); i++)
    {
      g_autofree char *dir = g_build_filename (tmp_dir, sw_test_xdg_vars[i], NULL);
      g_assert_cmpint (g_mkdir_with_parents (dir, 0700), ==, 0);
      env = g_environ_setenv (env, sw_test_xdg_vars[i], dir, TRUE);
    }
  env = g_environ_setenv (env, "GSETTINGS_BACKEND", "memory", TRUE);
  env = g_environ_setenv (env, "GSK_RENDERER", "cairo", TRUE);
  env = g_environ_unsetenv (env, "STAGEWRIGHT_RECOVERY_DIR");
  return env;
}

/* Starts the application with @args (NULL-terminated). */
static void
child_start (Child *child, const char *const *args)
{
  const char *app = g_getenv ("SW_APP");
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_auto (GStrv) env = child_environment ();
  g_autoptr (GError) error = NULL;

  g_assert_nonnull (app);
  g_ptr_array_add (argv, (gpointer) app);
  for (guint i = 0; args[i] != NULL; i++)
    g_ptr_array_add (argv, (gpointer) args[i]);
  g_ptr_array_add (argv, NULL);
  memset (child, 0, sizeof *child);
  /* Its stdout would mix into the TAP stream; stderr is kept for the log. */
  g_spawn_async (tmp_dir, (char **) argv->pdata, env,
                 G_SPAWN_DO_NOT_REAP_CHILD | G_SPAWN_STDOUT_TO_DEV_NULL, NULL, NULL,
                 &child->pid, &error);
  g_assert_no_error (error);
}

static gboolean
child_poll (Child *child)
{
  if (!child->exited)
    {
      pid_t r = waitpid (child->pid, &child->wait_status, WNOHANG);
      g_assert_cmpint (r, !=, -1);
      child->exited = r == child->pid;
    }
  return child->exited;
}

static void
child_kill (Child *child)
{
  g_assert_false (child_poll (child));
  g_assert_cmpint (kill (child->pid, SIGKILL), ==, 0);
  g_assert_cmpint (waitpid (child->pid, &child->wait_status, 0), ==, child->pid);
  child->exited = TRUE;
  g_assert_true (WIFSIGNALED (child->wait_status));
  g_assert_cmpint (WTERMSIG (child->wait_status), ==, SIGKILL);
  g_spawn_close_pid (child->pid);
}

/* Waits for a normal exit and returns its status. */
static int
child_wait_exit (Child *child)
{
  gint64 end = g_get_monotonic_time () + START_TIMEOUT_MS * G_TIME_SPAN_MILLISECOND;

  while (!child_poll (child))
    {
      if (g_get_monotonic_time () > end)
        {
          kill (child->pid, SIGKILL);
          g_error ("stagewright did not exit within %d ms", START_TIMEOUT_MS);
        }
      g_usleep (20000);
    }
  g_spawn_close_pid (child->pid);
  g_assert_true (WIFEXITED (child->wait_status));
  return WEXITSTATUS (child->wait_status);
}

/* Polls @path until it holds @expected, while the application runs. */
static void
wait_for_copy (Child *child, const char *path, const SwDesign *expected)
{
  gint64 end = g_get_monotonic_time () + START_TIMEOUT_MS * G_TIME_SPAN_MILLISECOND;

  for (;;)
    {
      g_autoptr (SwDesign) copy = NULL;

      /* Saves are atomic (temporary file, rename): a copy is whole or absent. */
      if (g_file_test (path, G_FILE_TEST_IS_REGULAR))
        {
          g_autoptr (GError) error = NULL;
          copy = sw_design_load (path, NULL, &error);
          g_assert_no_error (error);
          if (sw_design_equal (copy, expected))
            return;
        }
      if (child_poll (child))
        g_error ("stagewright ended (wait status %d) before its recovery copy held the edits",
                 child->wait_status);
      if (g_get_monotonic_time () > end)
        {
          kill (child->pid, SIGKILL);
          g_error ("the recovery copy %s did not hold the edits within %d ms", path,
                   START_TIMEOUT_MS);
        }
      g_usleep (50000);
    }
}

static void
test_kill_and_restore (void)
{
  g_autofree char *demo = g_build_filename (SOURCE_DESIGNS_DIR, "medium-cargo.stagewright",
                                            NULL);
  g_autofree char *design_path = g_build_filename (tmp_dir, "cargo.stagewright", NULL);
  g_autofree char *state = g_build_filename (tmp_dir, "XDG_STATE_HOME", NULL);
  g_autofree char *copy_path = g_build_filename (state, "stagewright", "recovery.stagewright",
                                                 NULL);
  g_autofree char *origin_path = g_strconcat (copy_path, ".origin", NULL);
  g_autofree char *dump_path = g_build_filename (tmp_dir, "restored.stagewright", NULL);
  g_autofree char *design_uri = NULL, *origin = NULL;
  g_autoptr (GFile) design_file = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) original = NULL, first = NULL, second = NULL, dumped = NULL;
  g_autoptr (SwDesign) on_disk = NULL;
  Child child;

  /* A copy of a demo design, so nothing in the source tree can change. */
  original = sw_design_load (demo, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (original->n_stages, >=, 2);
  g_assert_true (sw_design_save (original, design_path, &error));
  g_assert_no_error (error);
  design_file = g_file_new_for_path (design_path);
  design_uri = g_file_get_uri (design_file);

  /* 1. Open the file, edit the payload and the upper stage's Isp; once the
   *    copy holds both edits, kill the process. */
  first = sw_design_copy (original);
  first->payload_kg = 1234.5;
  first->stages[1].isp_vac_s = 351.2;
  g_assert_false (sw_design_equal (first, original));
  child_start (&child, (const char *[]) { "--test-edit=payload_kg=1234.5", "--test-edit=stage=1",
                                          "--test-edit=isp_vac_s=351.2", design_path, NULL });
  wait_for_copy (&child, copy_path, first);
  child_kill (&child);
  /* The copy survives the kill and names the file it belongs to; the file
   * itself was never written. */
  g_assert_true (g_file_get_contents (origin_path, &origin, NULL, &error));
  g_assert_no_error (error);
  g_assert_cmpstr (g_strstrip (origin), ==, design_uri);
  on_disk = sw_design_load (design_path, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (on_disk, original));

  /* 2. Start again (no file: the start-up path), accept the offer, edit the
   *    orbit; kill again once the copy holds the restored design plus the
   *    new edits. */
  second = sw_design_copy (first);
  second->mission.altitude_km = 550.0;
  second->mission.losses_m_s = 1650.0;
  g_assert_true (second->mission.kind == SW_MISSION_ORBIT && second->mission.has_losses);
  child_start (&child, (const char *[]) { "--test-restore", "--test-edit=altitude_km=550",
                                          "--test-edit=losses_m_s=1650", NULL });
  wait_for_copy (&child, copy_path, second);
  child_kill (&child);

  /* 3. Start again and restore: the application shows exactly the last
   *    edit, solved (it writes the design once the result of exactly that
   *    design is drawn), and a clean close removes the copy. */
  child_start (&child, (const char *[]) { "--test-restore", "--test-dump", dump_path, NULL });
  g_assert_cmpint (child_wait_exit (&child), ==, 0);
  dumped = sw_design_load (dump_path, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (dumped, second));
  g_assert_false (g_file_test (copy_path, G_FILE_TEST_EXISTS));
  g_assert_false (g_file_test (origin_path, G_FILE_TEST_EXISTS));
  g_clear_pointer (&on_disk, sw_design_free);
  on_disk = sw_design_load (design_path, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (on_disk, original));
}

/* Without the restore, a fresh start shows the demonstration design and
 * leaves the copy alone for a later answer: the test above therefore
 * depends on the restore, not on some other path to the same design. */
static void
test_no_restore_keeps_copy (void)
{
  g_autofree char *state = g_build_filename (tmp_dir, "XDG_STATE_HOME", NULL);
  g_autofree char *copy_path = g_build_filename (state, "stagewright", "recovery.stagewright",
                                                 NULL);
  g_autofree char *dump_path = g_build_filename (tmp_dir, "not-restored.stagewright", NULL);
  g_autofree char *dir = g_path_get_dirname (copy_path);
  g_autoptr (SwDesign) crashed = sw_design_new_default ();
  g_autoptr (SwDesign) dumped = NULL, still = NULL;
  g_autoptr (GError) error = NULL;
  Child child;

  g_strlcpy (crashed->name, "Left by a crash", sizeof crashed->name);
  crashed->payload_kg = 4321.0;
  g_assert_cmpint (g_mkdir_with_parents (dir, 0700), ==, 0);
  g_assert_true (sw_design_save (crashed, copy_path, &error));
  g_assert_no_error (error);

  child_start (&child, (const char *[]) { "--test-dump", dump_path, NULL });
  g_assert_cmpint (child_wait_exit (&child), ==, 0);
  dumped = sw_design_load (dump_path, NULL, &error);
  g_assert_no_error (error);
  g_assert_false (sw_design_equal (dumped, crashed));
  still = sw_design_load (copy_path, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (sw_design_equal (still, crashed));
  g_remove (copy_path);
}

int
main (int argc, char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  tmp_dir = g_dir_make_tmp ("stagewright-kill-XXXXXX", NULL);
  g_assert_nonnull (tmp_dir);

  g_test_add_func ("/gui/recovery/kill-and-restore", test_kill_and_restore);
  g_test_add_func ("/gui/recovery/no-restore-keeps-copy", test_no_restore_keeps_copy);

  status = g_test_run ();
  sw_test_remove_tree (tmp_dir);
  g_free (tmp_dir);
  return status;
}
