/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The command line under a German locale: machine output (JSON, CSV) is the
 * same bytes as in the C locale; the text output groups digits and marks
 * decimals the German way ("124.086,9 kg") and is translated.
 * Runs the built program (env SW_CLI, translations from SW_LOCALE_DIR). */
#include "config.h"

#include <glib.h>
#include <glib/gstdio.h>
#include <locale.h>
#include <string.h>
#include <sys/wait.h>

#define CLI_TIMEOUT_S 60
#define GERMAN "de_DE.UTF-8"

static char *tmpdir;

/* Runs `timeout N stagewright-cli ARGS` with LC_ALL=@locale, or with
 * LANG=@locale and LC_MESSAGES=C when @messages_c (German numbers, English
 * words); returns stdout. */
static char *
run_cli_full (const char *locale, gboolean messages_c, const char *const *args)
{
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  g_autofree char *secs = g_strdup_printf ("%d", CLI_TIMEOUT_S);
  g_auto (GStrv) envp = g_get_environ ();
  char *out = NULL;
  int status = 0;

  envp = g_environ_unsetenv (envp, "LANGUAGE");
  envp = g_environ_unsetenv (envp, "LC_ALL");
  if (messages_c)
    {
      envp = g_environ_setenv (envp, "LANG", locale, TRUE);
      envp = g_environ_setenv (envp, "LC_MESSAGES", "C", TRUE);
    }
  else
    envp = g_environ_setenv (envp, "LC_ALL", locale, TRUE);
  g_ptr_array_add (argv, (gpointer) "timeout");
  g_ptr_array_add (argv, secs);
  g_ptr_array_add (argv, (gpointer) g_getenv ("SW_CLI"));
  for (guint i = 0; args[i] != NULL; i++)
    g_ptr_array_add (argv, (gpointer) args[i]);
  g_ptr_array_add (argv, NULL);
  g_assert_nonnull (g_getenv ("SW_CLI"));
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, envp, G_SPAWN_SEARCH_PATH, NULL,
                               NULL, &out, NULL, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  if (WEXITSTATUS (status) == 124)
    g_error ("stagewright-cli %s did not finish within %d s", args[0], CLI_TIMEOUT_S);
  g_assert_cmpint (WEXITSTATUS (status), ==, 0);
  return out;
}

static char *
run_cli (const char *locale, const char *const *args)
{
  return run_cli_full (locale, FALSE, args);
}

/* @json with every string blanked: the numbers, keys' order, nulls and
 * booleans stay. */
static char *
numbers_only (const char *json)
{
  g_autoptr (GRegex) re = g_regex_new ("\"([^\"\\\\]|\\\\.)*\"", 0, 0, NULL);
  return g_regex_replace_literal (re, json, -1, 0, "\"\"", 0, NULL);
}

static char *
demo (const char *basename)
{
  return g_build_filename (g_getenv ("SW_DESIGNS_DIR"), basename, NULL);
}

static gboolean
have_german (void)
{
  g_autofree char *old = g_strdup (setlocale (LC_ALL, NULL));
  gboolean ok = setlocale (LC_ALL, GERMAN) != NULL;

  setlocale (LC_ALL, old);
  if (!ok)
    g_test_skip ("no " GERMAN " locale on this machine (Debian: locales, locale-gen)");
  return ok;
}

static void
test_json_same_bytes (void)
{
  g_autofree char *path = demo ("medium-cargo.stagewright");
  const char *size[] = { "size", "--json", path, NULL };
  const char *ascent[] = { "ascent", "--json", path, NULL };
  g_autofree char *c = NULL, *de = NULL, *ac = NULL, *ade = NULL;

  if (!have_german ())
    return;
  /* German numbers, English words: the same bytes. */
  c = run_cli ("C", size);
  de = run_cli_full (GERMAN, TRUE, size);
  g_assert_nonnull (strstr (c, "\"liftoff_mass_kg\" : 129000.8"));
  g_assert_cmpstr (de, ==, c);
  ac = run_cli ("C", ascent);
  ade = run_cli_full (GERMAN, TRUE, ascent);
  g_assert_cmpstr (ade, ==, ac);
  /* All German: JSON is for machines, the same bytes too (its reason and
   * caution in English, their numbers in the C form). */
  {
    g_autofree char *de_all = run_cli (GERMAN, size);
    g_autofree char *a = numbers_only (c), *b = numbers_only (de_all);
    g_assert_cmpstr (b, ==, a);
    g_assert_cmpstr (de_all, ==, c);
  }
}

static void
test_csv_same_bytes (void)
{
  g_autofree char *path = demo ("medium-cargo.stagewright");
  g_autofree char *fc = g_build_filename (tmpdir, "c.csv", NULL);
  g_autofree char *fde = g_build_filename (tmpdir, "de.csv", NULL);
  g_autofree char *oc = g_strconcat ("--csv=", fc, NULL), *ode = g_strconcat ("--csv=", fde, NULL);
  const char *argc_[] = { "ascent", oc, path, NULL };
  const char *argde[] = { "ascent", ode, path, NULL };
  g_autofree char *out1 = NULL, *out2 = NULL, *c = NULL, *de = NULL;

  if (!have_german ())
    return;
  /* German numbers, English words: the same bytes. */
  out1 = run_cli ("C", argc_);
  out2 = run_cli_full (GERMAN, TRUE, argde);
  g_assert_true (g_file_get_contents (fc, &c, NULL, NULL));
  g_assert_true (g_file_get_contents (fde, &de, NULL, NULL));
  /* A row of plain numbers: a decimal point, no grouping. */
  g_assert_nonnull (strstr (c, "\n0,"));
  g_assert_nonnull (strchr (c, '.'));
  g_assert_cmpstr (de, ==, c);
  /* All German: only the comment lines (the caution, for the reader) are
   * translated; the header and every row are the same. */
  g_free (out2);
  g_free (de);
  out2 = run_cli (GERMAN, argde);
  g_assert_true (g_file_get_contents (fde, &de, NULL, NULL));
  {
    g_auto (GStrv) lc = g_strsplit (c, "\n", -1), ld = g_strsplit (de, "\n", -1);
    g_assert_cmpuint (g_strv_length (lc), ==, g_strv_length (ld));
    g_assert_cmpuint (g_strv_length (lc), >, 50);
    for (guint i = 0; lc[i] != NULL; i++)
      if (lc[i][0] != '#')
        g_assert_cmpstr (ld[i], ==, lc[i]);
  }
  g_remove (fc);
  g_remove (fde);
}

/* The demo's liftoff mass is 129,000.8 kg (see test-sheet): German text
 * groups with "." and marks decimals with ",". */
static void
test_text_german (void)
{
  g_autofree char *path = demo ("medium-cargo.stagewright");
  const char *size[] = { "size", path, NULL };
  g_autofree char *c = NULL, *de = NULL;

  if (!have_german ())
    return;
  c = run_cli ("C", size);
  de = run_cli (GERMAN, size);
  g_assert_nonnull (strstr (c, "129,000.8 kg"));
  g_assert_nonnull (strstr (c, "Does not reach the orbit"));
  if (strstr (de, "129.000,8 kg") == NULL || strstr (de, "8.000 kg") == NULL)
    g_error ("German grouping missing:\n%s", de);
  /* The verdict line, translated. */
  g_assert_true (g_str_has_prefix (de, "Erreicht die Bahn nicht: "));
  g_assert_null (strstr (de, "129,000"));
}

int
main (int argc, char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  tmpdir = g_dir_make_tmp ("sw-cli-locale-XXXXXX", NULL);
  g_test_add_func ("/cli-locale/json-same-bytes", test_json_same_bytes);
  g_test_add_func ("/cli-locale/csv-same-bytes", test_csv_same_bytes);
  g_test_add_func ("/cli-locale/text-german", test_text_german);
  status = g_test_run ();
  g_rmdir (tmpdir);
  g_free (tmpdir);
  return status;
}
