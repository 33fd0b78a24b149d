/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-optional-keys.h: the readers of the design file's keys, shared by the
 * design loader and the reliability, uncertainty and ascent models that plug
 * into it.  Every reader checks the type and finiteness (and, when given a
 * limit, the range in sw-limits.c), and its errors name the file, the JSON
 * path, the value and the accepted range. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-limits.h"
#include "sw-types.h"

G_BEGIN_DECLS

/* Passed as the limit of sw_optional_read_number_full(): read the number
 * without a range check (the design loader checks ranges after loading). */
#define SW_OPTIONAL_NO_LIMIT SW_N_LIMITS

/* Reads the number @key of @obj, if present; checks it against @limit and,
 * when @whole, that it is a whole number. */
gboolean sw_optional_read_number (JsonObject *obj, const char *key, const char *file,
                                  const char *prefix, SwLimitId limit, gboolean whole,
                                  double *value, gboolean *present, GError **error);
/* As sw_optional_read_number(); when @required a missing key is an error,
 * @limit may be SW_OPTIONAL_NO_LIMIT and @present may be NULL. */
gboolean sw_optional_read_number_full (JsonObject *obj, const char *key, const char *file,
                                       const char *prefix, gboolean required,
                                       SwLimitId limit, gboolean whole, double *value,
                                       gboolean *present, GError **error);
/* Reads the text @key of @obj, if present (*value NULL otherwise). */
gboolean sw_optional_read_string (JsonObject *obj, const char *key, const char *file,
                                  const char *prefix, const char **value, GError **error);
/* As sw_optional_read_string(); when @required a missing key is an error. */
gboolean sw_optional_read_string_full (JsonObject *obj, const char *key, const char *file,
                                       const char *prefix, gboolean required,
                                       const char **value, GError **error);
/* Reads the object @key of @obj, if present (NULL otherwise; *ok FALSE on error). */
JsonObject *sw_optional_read_object (JsonObject *obj, const char *key, const char *file,
                                     const char *prefix, gboolean *ok, GError **error);
/* As sw_optional_read_object(); when @required a missing key is an error. */
JsonObject *sw_optional_read_object_full (JsonObject *obj, const char *key, const char *file,
                                          const char *prefix, gboolean required, gboolean *ok,
                                          GError **error);
/* Adds a warning for every member of @obj not in @known. */
void     sw_optional_warn_unknown (JsonObject *obj, const char *file, const char *prefix,
                                   const char *const *known, GPtrArray *warnings);
/* As sw_optional_warn_unknown(), for an object whose keys several modules
 * define: @known_lists is a NULL-terminated array of NULL-terminated key lists. */
void     sw_optional_warn_unknown_full (JsonObject *obj, const char *file, const char *prefix,
                                        const char *const *const *known_lists,
                                        GPtrArray *warnings);
/* Range check of a value in memory (the validation of a design the GUI edits). */
gboolean sw_optional_check (SwLimitId limit, double value, const char *file,
                            const char *prefix, GError **error);
/* "prefix.key", or "key" when @prefix is empty. */
char    *sw_optional_path (const char *prefix, const char *key);

/* The file name errors show: @file, or "(design)" for a design in memory. */
const char *sw_optional_display_file (const char *file);
/* Sets @error to "FILE: " followed by the formatted message. */
void     sw_optional_set_error (GError **error, SwError code, const char *file,
                                const char *format, ...) G_GNUC_PRINTF (4, 5);
/* "an object", "a string", ...: the "found ..." part of a type error. */
const char *sw_optional_node_type_name (JsonNode *node);
/* TRUE for a JSON number (integer or not). */
gboolean sw_optional_node_is_number (JsonNode *node);

/* Writes "key": value into the object being built. */
void     sw_optional_add_number (JsonBuilder *builder, const char *key, double value);

G_END_DECLS
