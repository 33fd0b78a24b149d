/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-cli.h: helpers shared by the subcommands of stagewright-cli. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-analysis.h"
#include "sw-design.h"

G_BEGIN_DECLS

enum {
  SW_EXIT_OK = 0,
  SW_EXIT_FAILURE = 1,
  SW_EXIT_USAGE = 2,
};

typedef struct {
  const char *name;
  const char *args;     /* e.g. "FILE" */
  const char *summary;
  int (*run) (int argc, char **argv);
} SwCliCommand;

/* Parses the options of a subcommand (with --help); returns FALSE and sets
 * *exit_code when the program should stop. */
gboolean  sw_cli_parse (const char *name, GOptionEntry *entries, int *argc, char ***argv,
                        int n_positional, int *exit_code);
/* Loads a design, printing warnings and the error on stderr. */
SwDesign *sw_cli_load (const char *filename);
/* Prints "error: FILE: message" on stderr; returns SW_EXIT_USAGE. */
int       sw_cli_input_error (const char *filename, const GError *error);
/* Adds the cautions, closes the builder's top object and prints it. */
void      sw_cli_finish_json (JsonBuilder *builder);
/* Prints a JSON node on stdout, pretty. */
void      sw_cli_print_json (JsonNode *node);
/* Adds a number member, or null when it is not finite. */
void      sw_cli_add_number (JsonBuilder *b, const char *key, double value);
/* A number for tables: the core formatter's (sw_format_number). */
char     *sw_cli_format (double value, int decimals);
/* The same for a printf argument: the string lives until 16 more are made. */
const char *sw_cli_num (double value, int decimals);
const char *sw_cli_num_signed (double value, int decimals);  /* "+12.5", "−3.0" */
/* Loads @filename and runs every phase of the analysis @options ask for;
 * prints the error and sets *exit_code when the design cannot be read or
 * sized. */
SwAnalysis *sw_cli_analyse (const char *filename, const SwAnalysisOptions *options,
                            int *exit_code);
/* "verdict": {"state": ..., "reason": ...} */
void      sw_cli_add_verdict (JsonBuilder *b, const SwAnalysis *a);
/* The verdict as the first line of a text report. */
void      sw_cli_print_verdict (const SwAnalysis *a);
/* A text cell of a table: @text whole, padded with spaces to @width
 * characters (not bytes); a longer text is never cut (size the column
 * with sw_cli_names_width()). */
char     *sw_cli_cell (const char *text, guint width);
/* A column for the stages' (and boosters') names: the longest name in
 * characters, at least @min. */
guint     sw_cli_names_width (const SwDesign *d, guint min);
/* The cautions printed under every report. */
extern const char *sw_cli_caution;
/* A bundled demo design, under the install prefix (SW_DESIGNS_DIR overrides). */
char     *sw_cli_find_demo (const char *basename);

int sw_cli_size (int argc, char **argv);
int sw_cli_performance (int argc, char **argv);
int sw_cli_curve (int argc, char **argv);
int sw_cli_budget (int argc, char **argv);
int sw_cli_bench (int argc, char **argv);
int sw_cli_limits (int argc, char **argv);
int sw_cli_sensitivity (int argc, char **argv);
int sw_cli_montecarlo (int argc, char **argv);
int sw_cli_reliability (int argc, char **argv);
int sw_cli_export (int argc, char **argv);
int sw_cli_ascent (int argc, char **argv);
int sw_cli_atmosphere (int argc, char **argv);
int sw_cli_stages (int argc, char **argv);
int sw_cli_carpet (int argc, char **argv);
/* Median time of a 50 x 50 carpet of optimal sizings, ms (sw-cli-staging.c). */
double sw_cli_bench_carpet_ms (const SwDesign *design);

G_END_DECLS
