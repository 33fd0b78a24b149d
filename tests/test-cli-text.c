/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The command line's text output as literal text (C locale): the figures of
 * a demo design as `size --json` gives them (129,000.81 kg at liftoff for
 * medium-cargo.stagewright with its 1,500 kg fairing, stage masses 84,693.1 /
 * 4,929.2 kg, ...), so a
 * figure printed in the wrong unit, column or place fails; and the lines
 * that appear only when they apply (a fairing).
 * Runs the built program (env SW_CLI). */
#include "config.h"

#include <glib.h>
#include <glib/gstdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#define CLI_TIMEOUT_S 60

static char *
run_cli (const char *const *args)
{
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  g_autofree char *secs = g_strdup_printf ("%d", CLI_TIMEOUT_S);
  g_auto (GStrv) envp = g_get_environ ();
  char *out = NULL;
  int status = 0;

  g_assert_nonnull (g_getenv ("SW_CLI"));
  envp = g_environ_setenv (envp, "LC_ALL", "C.UTF-8", TRUE);
  envp = g_environ_unsetenv (envp, "LANGUAGE");
  g_ptr_array_add (argv, (gpointer) "timeout");
  g_ptr_array_add (argv, secs);
  g_ptr_array_add (argv, (gpointer) g_getenv ("SW_CLI"));
  for (guint i = 0; args[i] != NULL; i++)
    g_ptr_array_add (argv, (gpointer) args[i]);
  g_ptr_array_add (argv, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, envp, G_SPAWN_SEARCH_PATH, NULL,
                               NULL, &out, NULL, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  if (WEXITSTATUS (status) == 124)
    g_error ("stagewright-cli %s did not finish within %d s", args[0], CLI_TIMEOUT_S);
  g_assert_cmpint (WEXITSTATUS (status), ==, 0);
  return out;
}

static void
assert_line (const char *out, const char *line)
{
  g_autofree char *with_nl = g_strconcat ("\n", line, "\n", NULL);

  if (strstr (out, with_nl) == NULL)
    g_error ("the line \"%s\" is not in the output:\n%s", line, out);
}

static char *
demo (const char *basename)
{
  return g_build_filename (g_getenv ("SW_DESIGNS_DIR"), basename, NULL);
}

static void
test_size_text (void)
{
  g_autofree char *path = demo ("medium-cargo.stagewright");
  const char *args[] = { "size", path, NULL };
  g_autofree char *out = run_cli (args);

  assert_line (out, "Split: optimal    Payload: 8,000 kg    Required delta-v: 8,885 m/s");
  assert_line (out, "1   Dunmarrow core        338.0 0.0550   3,542.2  0.399   2.9115     "
                    "84,693.1     4,929.2     129,000.8     44,307.7");
  assert_line (out, "2   Dunmarrow upper       450.0 0.1100   5,343.1  0.601   3.3560     "
                    "26,591.8     3,286.6      39,378.5     11,286.6");
  assert_line (out, "Liftoff mass: 129,000.8 kg (129.0 t)    Payload fraction: 6.202 %");
  assert_line (out, "Headroom to the stages' delta-v limit (no payload): 10,469 m/s");
}

/* Every load fixed (sallowmere-as-built): the headroom is to the stages'
 * limit with no payload, each stage on its own load.  By hand (rocket
 * equation, g0 = 9.80665 m/s^2, structure = load eps/(1 - eps)): stage 2,
 * nothing above it, 342 g0 ln(1/0.11) = 7,402.9 m/s; stage 1 carries stage 2
 * (16,000 / 0.89 = 17,977.5 kg) and the 400 kg fairing, its structure
 * 90,000 x 0.075 / 0.925 = 7,297.3 kg: 312 g0 ln(115,674.8 / 25,674.8) =
 * 4,605.6 m/s; the limit 12,008.6 m/s less the required 9,722.2 m/s (ideal
 * 7,342.2 + 2,380 allowance) = 2,286 m/s.  The notes of the trades name
 * both fixed stages. */
static void
test_fixed_text (void)
{
  g_autofree char *path = demo ("sallowmere-as-built.stagewright");
  const char *size[] = { "size", "--no-ascent", path, NULL };
  const char *stages[] = { "stages", path, NULL };
  const char *curve[] = { "curve", path, NULL };
  g_autofree char *out = run_cli (size);
  g_autofree char *st = run_cli (stages);
  g_autofree char *cv = run_cli (curve);

  assert_line (out, "Headroom to the stages' delta-v limit (no payload): 2,286 m/s");
  g_assert_nonnull (strstr (st, "the fixed propellant loads of stages 1 (Sallowmere first "
                                "stage) and 2 (Kestrune upper stage) are not applied"));
  g_assert_nonnull (strstr (cv, "the fixed propellant loads of stages 1 (Sallowmere first "
                                "stage) and 2 (Kestrune upper stage) are not applied"));
}

/* A vehicle for 10,000 t of payload (the limit): stage masses of nine and
 * more digits keep the stage table's columns aligned, every right edge of
 * the header at the same character as in each stage row. */
static void
test_size_huge (void)
{
  g_autofree char *src = demo ("medium-cargo.stagewright");
  g_autofree char *text = NULL;
  g_autofree char *path = NULL;
  g_autoptr (GRegex) re = g_regex_new ("\"payload_kg\": *[0-9.]+", 0, 0, NULL);
  g_autofree char *big = NULL;
  int fd;

  g_assert_true (g_file_get_contents (src, &text, NULL, NULL));
  big = g_regex_replace_literal (re, text, -1, 0, "\"payload_kg\": 10000000", 0, NULL);
  g_assert_cmpstr (big, !=, text);
  fd = g_file_open_tmp ("sw-huge-XXXXXX.stagewright", &path, NULL);
  g_assert_cmpint (fd, >=, 0);
  close (fd);
  g_assert_true (g_file_set_contents (path, big, -1, NULL));
  {
    const char *args[] = { "size", "--no-ascent", path, NULL };
    g_autofree char *out = run_cli (args);
    g_auto (GStrv) lines = g_strsplit (out, "\n", -1);
    char **header = NULL;
    guint rows = 0;

    /* About 160,000 t at liftoff (nine digits of kilograms and more): the
     * scale is what the test is about. */
    g_assert_true (g_regex_match_simple ("[0-9]{3},[0-9]{3},[0-9]{3}\\.[0-9] ", out, 0, 0));
    for (guint i = 0; lines[i] != NULL; i++)
      {
        /* Right edges of the columns: a character other than a space
         * followed by a space or the end. */
        g_autofree char *edges = NULL;
        const char *l = lines[i];
        GString *e = g_string_new (NULL);
        glong n = g_utf8_strlen (l, -1);

        for (glong c = 0; c < n; c++)
          {
            gunichar ch = g_utf8_get_char (g_utf8_offset_to_pointer (l, c));
            gunichar next = c + 1 < n ? g_utf8_get_char (g_utf8_offset_to_pointer (l, c + 1)) : ' ';
            if (ch != ' ' && next == ' ')
              g_string_append_printf (e, "%ld ", c);
          }
        edges = g_string_free (e, FALSE);
        if (g_str_has_prefix (l, "#   stage"))
          header = g_strsplit (edges, " ", -1);
        else if (header != NULL && (g_str_has_prefix (l, "1   ") || g_str_has_prefix (l, "2   ")))
          {
            g_auto (GStrv) row = g_strsplit (edges, " ", -1);
            guint nr = g_strv_length (row);
            /* The last nine columns (numbers, right-aligned) end where
             * their headings end (the list ends in an empty string). */
            g_assert_cmpuint (nr, >=, 11);
            for (guint k = 2; k <= 10; k++)
              if (!g_strv_contains ((const char *const *) header, row[nr - k]))
                g_error ("a column ends at character %s, no heading does:\n%s", row[nr - k],
                         out);
            rows++;
          }
      }
    g_assert_nonnull (header);
    g_strfreev (header);
    g_assert_cmpuint (rows, ==, 2);
  }
  g_unlink (path);
}

static void
test_sensitivity_text (void)
{
  g_autofree char *path = demo ("medium-cargo.stagewright");
  const char *args[] = { "sensitivity", path, NULL };
  g_autofree char *out = run_cli (args);

  assert_line (out, "Liftoff mass 129,000.8 kg; tornado step +-5 %, largest effect first");
}

/* The fairing line only with a fairing: the demo drops its 1,500 kg at
 * 110 km; the same vehicle without the "ascent" block carries none. */
static void
test_ascent_fairing (void)
{
  g_autofree char *path = demo ("medium-cargo.stagewright");
  const char *args[] = { "ascent", path, NULL };
  g_autofree char *out = run_cli (args);
  g_autofree char *text = NULL, *tmp = NULL, *bare = NULL, *out2 = NULL;
  g_autoptr (GRegex) re = g_regex_new (",\\s*\"ascent\"\\s*:\\s*\\{[^}]*\\}", 0, 0, NULL);
  const char *args2[] = { "ascent", NULL, NULL };

  g_assert_nonnull (strstr (out, "\nFairing: 1,500 kg dropped at T+"));
  g_assert_nonnull (strstr (out, ", 110.0 km, q = "));
  g_assert_true (g_file_get_contents (path, &text, NULL, NULL));
  bare = g_regex_replace_literal (re, text, -1, 0, "", 0, NULL);
  g_assert_null (strstr (bare, "fairing"));
  tmp = g_build_filename (g_get_tmp_dir (), "sw-cli-text-nofairing.stagewright", NULL);
  g_assert_true (g_file_set_contents (tmp, bare, -1, NULL));
  args2[1] = tmp;
  out2 = run_cli (args2);
  g_remove (tmp);
  /* Without the fairing the sizing is the one of the demo before fairings
   * entered the sizing (124,086.9 kg); with it, 129,000.8 kg (test_size_text). */
  g_assert_nonnull (strstr (out, "Liftoff mass: 129.001 t, the 1,500 kg fairing included"));
  g_assert_nonnull (strstr (out2, "Liftoff mass: 124.087 t    thrust-to-weight"));
  g_assert_null (strstr (out2, "\nFairing:"));
}

/* Names are printed whole, the columns as wide as the longest (seen cut:
 * "Sallowmere first sta", "Harrowmere strap-ons + Brind"); --help's usage
 * line names the program and the command once. */
static void
test_whole_names (void)
{
  g_autofree char *built = demo ("sallowmere-as-built.stagewright");
  g_autofree char *cargo = demo ("four-booster-cargo.stagewright");
  const char *size_built[] = { "size", built, NULL };
  const char *ascent_built[] = { "ascent", built, NULL };
  const char *size_cargo[] = { "size", cargo, NULL };
  const char *help[] = { "size", "--help", NULL };
  g_autofree char *out = run_cli (size_built);
  g_autofree char *asc = run_cli (ascent_built);
  g_autofree char *phases = run_cli (size_cargo);
  g_autofree char *usage = run_cli (help);

  g_assert_nonnull (strstr (out, "\n1   Sallowmere first stage  312.0 0.0750"));
  g_assert_nonnull (strstr (out, "\n2   Kestrune upper stage    342.0 0.1100"));
  g_assert_nonnull (strstr (asc, "\n1   Sallowmere first stage      1,600"));
  g_assert_nonnull (strstr (phases, "\nHarrowmere strap-ons + Brindlemark core   2,570.4"));
  /* The boosters' line lines up with the stage rows' names. */
  g_assert_nonnull (strstr (phases, "\nB   Harrowmere strap-ons  275.0 0.1100"));
  g_assert_nonnull (strstr (usage, "stagewright-cli size [OPTION"));
  g_assert_null (strstr (usage, "size size"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/cli-text/size", test_size_text);
  g_test_add_func ("/cli-text/whole-names", test_whole_names);
  g_test_add_func ("/cli-text/size-huge", test_size_huge);
  g_test_add_func ("/cli-text/fixed", test_fixed_text);
  g_test_add_func ("/cli-text/sensitivity", test_sensitivity_text);
  g_test_add_func ("/cli-text/ascent-fairing", test_ascent_fairing);
  return g_test_run ();
}
