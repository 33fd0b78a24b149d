/* SPDX-License-Identifier: GPL-3.0-or-later */
/* stagewright-cli: the command-line front end over the core. */
#define G_LOG_DOMAIN "stagewright-cli"

#include "config.h"

#include "sw-cli.h"
#include "sw-install-paths.h"

#include "sw-format.h"

#include <glib/gi18n.h>
#include <gsl/gsl_errno.h>
#include <locale.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

static const SwCliCommand commands[] = {
  { "size", "FILE", N_("Size a design: masses, delta-v split, feasibility"), sw_cli_size },
  { "performance", "FILE",
    N_("Payload capability of a vehicle whose stages all have fixed propellant loads, "
       "and its payload against orbit altitude and inclination"),
    sw_cli_performance },
  { "curve", "FILE", N_("Liftoff mass against stage count (optimal split)"), sw_cli_curve },
  { "budget", "FILE", N_("Delta-v budget of an orbit mission"), sw_cli_budget },
  { "limits", "", N_("The accepted range of every input field"), sw_cli_limits },
  { "sensitivity", "FILE", N_("What moves the liftoff mass: derivatives, tornado, exchange ratios"),
    sw_cli_sensitivity },
  { "montecarlo", "FILE", N_("Uncertainty: liftoff mass and payload margin over sampled inputs"),
    sw_cli_montecarlo },
  { "reliability", "FILE", N_("Mission success probability and its curve against stage count"),
    sw_cli_reliability },
  { "export", "FILE", N_("The one-page briefing sheet (PDF, SVG, PNG) and CSV tables"),
    sw_cli_export },
  { "ascent", "FILE",
    N_("Ascent simulation: orbit reached, losses, max-Q, staging; closes the loss loop"),
    sw_cli_ascent },
  { "atmosphere", "ALTITUDE_M", N_("1976 U.S. Standard Atmosphere at a geometric altitude"),
    sw_cli_atmosphere },
  { "stages", "FILE", N_("The staging decision: mass, cost, reliability and reuse for 1 to 6 stages"),
    sw_cli_stages },
  { "carpet", "FILE", N_("A carpet grid of liftoff mass, payload or cost over two inputs"),
    sw_cli_carpet },
  { "bench", "[FILE]", N_("Benchmark the sizing and a full live update"), sw_cli_bench },
};

static const SwCliCommand *
find_command (const char *name)
{
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    if (strcmp (name, commands[i].name) == 0)
      return &commands[i];
  return NULL;
}

gboolean
sw_cli_parse (const char *name, GOptionEntry *entries, int *argc, char ***argv,
              int n_positional, int *exit_code)
{
  const SwCliCommand *cmd = find_command (name);
  g_autofree char *prgname = g_strdup_printf ("stagewright-cli %s", cmd->name);
  g_autoptr (GOptionContext) ctx = g_option_context_new (cmd->args);
  g_autoptr (GError) error = NULL;

  /* --help's usage line: "stagewright-cli size [OPTION…] FILE" (GOption
   * puts the program's name before the options, the arguments after). */
  if (g_get_prgname () == NULL)
    g_set_prgname (prgname);

  g_option_context_set_summary (ctx, _(cmd->summary));
  g_option_context_set_description (ctx, sw_format_cautions ());
  if (entries != NULL)
    g_option_context_add_main_entries (ctx, entries, GETTEXT_PACKAGE);
  if (!g_option_context_parse (ctx, argc, argv, &error))
    {
      g_printerr ("stagewright-cli %s: %s\n", cmd->name, error->message);
      *exit_code = SW_EXIT_USAGE;
      return FALSE;
    }
  /* (*argv)[0] is the subcommand; then the positional arguments. */
  if (n_positional >= 0 && *argc - 1 != n_positional)
    {
      /* Translators: a command name, then its arguments such as "FILE" */
      g_printerr (_("stagewright-cli %s: expected %s (see --help)\n"), cmd->name,
                  cmd->args[0] ? cmd->args : _("no arguments"));
      *exit_code = SW_EXIT_USAGE;
      return FALSE;
    }
  return TRUE;
}

SwDesign *
sw_cli_load (const char *filename)
{
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  SwDesign *design = sw_design_load (filename, warnings, &error);

  for (guint i = 0; i < warnings->len; i++)
    g_printerr (_("warning: %s\n"), (const char *) warnings->pdata[i]);
  if (design == NULL)
    g_printerr (_("error: %s\n"), error->message);
  return design;
}

void
sw_cli_print_json (JsonNode *node)
{
  g_autoptr (JsonGenerator) gen = json_generator_new ();
  g_autofree char *text = NULL;

  json_generator_set_pretty (gen, TRUE);
  json_generator_set_root (gen, node);
  text = json_generator_to_data (gen, NULL);
  g_print ("%s\n", text);
}

int
sw_cli_input_error (const char *filename, const GError *error)
{
  g_printerr (_("error: %s: %s\n"), filename, error->message);
  return SW_EXIT_USAGE;
}

void
sw_cli_finish_json (JsonBuilder *builder)
{
  g_autoptr (JsonNode) node = NULL;

  json_builder_set_member_name (builder, "caution");
  json_builder_add_string_value (builder, sw_format_cautions ());
  json_builder_end_object (builder);
  node = json_builder_get_root (builder);
  sw_cli_print_json (node);
}

void
sw_cli_add_number (JsonBuilder *b, const char *key, double value)
{
  json_builder_set_member_name (b, key);
  if (isfinite (value))
    json_builder_add_double_value (b, value);
  else
    json_builder_add_null_value (b);
}

char *
sw_cli_format (double value, int decimals)
{
  return sw_format_number (value, decimals);
}

/* A few strings alive at once, so that one g_print() can take several. */
#define RING 16
static char *ring[RING];
static guint ring_next;

static const char *
ring_keep (char *text)
{
  guint i = ring_next++ % RING;

  g_free (ring[i]);
  ring[i] = text;
  return text;
}

const char *
sw_cli_num (double value, int decimals)
{
  return ring_keep (sw_format_number (value, decimals));
}

const char *
sw_cli_num_signed (double value, int decimals)
{
  return ring_keep (sw_format_signed (value, decimals));
}

SwAnalysis *
sw_cli_analyse (const char *filename, const SwAnalysisOptions *options, int *exit_code)
{
  g_autoptr (SwDesign) d = sw_cli_load (filename);
  SwAnalysis *a;

  if (d == NULL)
    {
      *exit_code = SW_EXIT_USAGE;
      return NULL;
    }
  a = sw_analysis_run (d, options, NULL);
  if (!a->ok)
    {
      g_printerr (_("error: %s: %s\n"), filename, a->error_message);
      sw_analysis_unref (a);
      *exit_code = SW_EXIT_USAGE;
      return NULL;
    }
  *exit_code = SW_EXIT_OK;
  return a;
}

void
sw_cli_add_verdict (JsonBuilder *b, const SwAnalysis *a)
{
  json_builder_set_member_name (b, "verdict");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "state");
  json_builder_add_string_value (b, sw_verdict_state_to_string (a->verdict.state));
  json_builder_set_member_name (b, "reason");
  json_builder_add_string_value (b, a->verdict.reason);
  json_builder_end_object (b);
}

void
sw_cli_print_verdict (const SwAnalysis *a)
{
  g_print ("%s: %s\n", sw_verdict_state_title (a->verdict.state), a->verdict.reason);
}

char *
sw_cli_cell (const char *text, guint width)
{
  GString *s = g_string_new (NULL);
  guint n = 0;

  /* Whole: a name cut short hides which stage a row is. */
  g_string_append (s, text);
  for (n = (guint) g_utf8_strlen (text, -1); n < width; n++)
    g_string_append_c (s, ' ');
  return g_string_free (s, FALSE);
}

guint
sw_cli_names_width (const SwDesign *d, guint min)
{
  guint w = min;

  for (guint i = 0; i < d->n_stages; i++)
    w = MAX (w, (guint) g_utf8_strlen (d->stages[i].name, -1));
  if (d->boosters.count > 0)
    w = MAX (w, (guint) g_utf8_strlen (d->boosters.name, -1));
  return w;
}

static void
usage (FILE *out)
{
  fprintf (out, "%s", _("Usage: stagewright-cli COMMAND [OPTIONS] ARGS\n\n"
                        "Sizes multistage launch vehicles at the concept stage.\n\nCommands:\n"));
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    fprintf (out, "  %-12s %-8s %s\n", commands[i].name, commands[i].args,
             _(commands[i].summary));
  fprintf (out, _("\nRun 'stagewright-cli COMMAND --help' for a command's options.\n"
                  "Exit codes: 0 success (an infeasible design is a result), 2 bad input or "
                  "usage, 1 anything else.\n\n%s\n"),
           sw_format_cautions ());
}

int
main (int argc, char **argv)
{
  g_autofree char *localedir = sw_install_locale_dir ();

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, localedir);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);
  /* Text output follows the user's locale (digit grouping, decimal mark)
   * through sw-format; JSON (json-glib) and CSV (g_ascii_formatd) write
   * their numbers in the C form whatever the locale.  JSON is for machines
   * as a whole: its plain-words strings (verdict reason, caution) hold
   * numbers too, so with --json the whole output is the C locale's, the
   * same bytes under any locale.  (LC_CTYPE stays the user's: names are
   * printed as UTF-8.) */
  for (int i = 1; i < argc; i++)
    if (strcmp (argv[i], "--json") == 0)
      {
        setlocale (LC_NUMERIC, "C");
        setlocale (LC_MESSAGES, "C");
        break;
      }
  /* GSL reports numerical trouble through status codes, never abort(). */
  gsl_set_error_handler_off ();

  if (argc < 2)
    {
      usage (stderr);
      return SW_EXIT_USAGE;
    }
  if (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0
      || strcmp (argv[1], "help") == 0)
    {
      usage (stdout);
      return SW_EXIT_OK;
    }
  if (strcmp (argv[1], "--version") == 0)
    {
      g_print ("stagewright-cli %s\n", PACKAGE_VERSION);
      return SW_EXIT_OK;
    }
  if (find_command (argv[1]) != NULL)
    return find_command (argv[1])->run (argc - 1, argv + 1);

  g_printerr (_("stagewright-cli: unknown command '%s'\n\n"), argv[1]);
  usage (stderr);
  return SW_EXIT_USAGE;
}
