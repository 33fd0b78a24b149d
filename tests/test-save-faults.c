/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Saving under faults: a full disk, a file-size limit and a read-only
 * folder.  The original file must stay intact, no temporary file may be left
 * behind and the error must say what went wrong. */
#define _GNU_SOURCE
#include "config.h"

#include "sw-design.h"

#include <errno.h>
#include <glib/gstdio.h>
#include <sched.h>
#include <signal.h>
#include <string.h>
#include <sys/mount.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

static char *
demo_path (void)
{
  const char *root = g_getenv ("SW_SOURCE_ROOT");
  return g_build_filename (root != NULL ? root : SOURCE_DESIGNS_DIR "/../..", "data", "designs",
                           "medium-cargo.stagewright", NULL);
}

static guint
count_entries (const char *dir)
{
  g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
  guint n = 0;

  while (d != NULL && g_dir_read_name (d) != NULL)
    n++;
  return n;
}

/* Exit codes of the child: 0 the save failed cleanly as it should, 10 it
 * succeeded, 11 the message is empty, 12 the original changed, 13 a
 * temporary file was left, 77 the fault could not be set up. */
static int
try_save_over (const char *dir, const char *original_text, SwDesign *bigger)
{
  g_autofree char *target = g_build_filename (dir, "design.stagewright", NULL);
  g_autofree char *after = NULL;
  g_autoptr (GError) error = NULL;

  if (sw_design_save (bigger, target, &error))
    return 10;
  if (error == NULL || strstr (error->message, target) == NULL)
    return 11;
  g_printerr ("# message: %s\n", error->message);
  if (!g_file_get_contents (target, &after, NULL, NULL) || strcmp (after, original_text) != 0)
    return 12;
  if (count_entries (dir) != 1)
    return 13;
  return 0;
}

typedef enum { FAULT_FSIZE, FAULT_FULL, FAULT_READ_ONLY } Fault;

static int
child_main (Fault fault, const char *dir, const char *original_text, SwDesign *bigger)
{
  g_autofree char *target = g_build_filename (dir, "design.stagewright", NULL);

  switch (fault)
    {
    case FAULT_FSIZE:
      {
        /* Like `ulimit -f`: the file may not grow past the original's size. */
        struct rlimit rl = { strlen (original_text) + 16, strlen (original_text) + 16 };
        if (!g_file_set_contents (target, original_text, -1, NULL))
          return 77;
        signal (SIGXFSZ, SIG_IGN);
        if (setrlimit (RLIMIT_FSIZE, &rl) != 0)
          return 77;
        break;
      }
    case FAULT_FULL:
    case FAULT_READ_ONLY:
      /* A private mount namespace with a tiny tmpfs: needs root, as in CI. */
      if (unshare (CLONE_NEWNS) != 0
          || mount ("none", "/", NULL, MS_REC | MS_PRIVATE, NULL) != 0
          || mount ("tmpfs", dir, "tmpfs", 0, fault == FAULT_FULL ? "size=8k" : "size=64k") != 0)
        return 77;
      if (!g_file_set_contents (target, original_text, -1, NULL))
        return 77;
      if (fault == FAULT_READ_ONLY
          && mount ("tmpfs", dir, "tmpfs", MS_REMOUNT | MS_RDONLY, NULL) != 0)
        return 77;
      break;
    }
  return try_save_over (dir, original_text, bigger);
}

static void
run_fault (Fault fault)
{
  g_autofree char *path = demo_path ();
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) design = sw_design_load (path, NULL, &error);
  g_autoptr (SwDesign) bigger = NULL;
  g_autofree char *original_text = NULL;
  g_autofree char *dir = g_dir_make_tmp ("sw-faults-XXXXXX", NULL);
  g_autofree char *notes = NULL;
  int status;
  pid_t pid;

  g_assert_no_error (error);
  g_assert_nonnull (dir);
  original_text = sw_design_to_data (design, NULL);

  /* The new version is larger than the old (notes of 40 kB), so it cannot fit. */
  bigger = sw_design_copy (design);
  notes = g_strnfill (40000, 'x');
  sw_design_set_notes (bigger, notes);

  pid = fork ();
  g_assert_cmpint (pid, >=, 0);
  if (pid == 0)
    _exit (child_main (fault, dir, original_text, bigger));
  g_assert_cmpint (waitpid (pid, &status, 0), ==, pid);
  g_assert_true (WIFEXITED (status));
  if (WEXITSTATUS (status) == 77)
    {
      g_test_skip ("this fault needs root (a private mount namespace) to set up");
      g_rmdir (dir);
      return;
    }
  g_assert_cmpint (WEXITSTATUS (status), ==, 0);

  if (fault == FAULT_FSIZE)
    {
      g_autofree char *target = g_build_filename (dir, "design.stagewright", NULL);
      g_autofree char *after = NULL;
      g_assert_true (g_file_get_contents (target, &after, NULL, NULL));
      g_assert_cmpstr (after, ==, original_text);
      g_unlink (target);
    }
  g_rmdir (dir);
}

static void
test_file_size_limit (void)
{
  run_fault (FAULT_FSIZE);
}

static void
test_disk_full (void)
{
  run_fault (FAULT_FULL);
}

static void
test_read_only (void)
{
  run_fault (FAULT_READ_ONLY);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/save-faults/file-size-limit", test_file_size_limit);
  g_test_add_func ("/core/save-faults/disk-full", test_disk_full);
  g_test_add_func ("/core/save-faults/read-only", test_read_only);
  return g_test_run ();
}
