/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-optional-keys.h: readers for the optional keys that the reliability and
 * uncertainty models plug into the design loader.  Every reader checks the
 * type, finiteness and the range in sw-limits.c, and its errors name the file,
 * the JSON path, the value and the accepted range, as the loader's do. */
#pragma once

#include <json-glib/json-glib.h>

#include "sw-limits.h"
#include "sw-types.h"

G_BEGIN_DECLS

/* Reads the number @key of @obj, if present; checks it against @limit and,
 * when @whole, that it is a whole number. */
gboolean sw_optional_read_number (JsonObject *obj, const char *key, const char *file,
                                  const char *prefix, SwLimitId limit, gboolean whole,
                                  double *value, gboolean *present, GError **error);
/* Reads the text @key of @obj, if present (*value NULL otherwise). */
gboolean sw_optional_read_string (JsonObject *obj, const char *key, const char *file,
                                  const char *prefix, const char **value, GError **error);
/* Reads the object @key of @obj, if present (NULL otherwise; *ok FALSE on error). */
JsonObject *sw_optional_read_object (JsonObject *obj, const char *key, const char *file,
                                     const char *prefix, gboolean *ok, GError **error);
/* Adds a warning for every member of @obj not in @known. */
void     sw_optional_warn_unknown (JsonObject *obj, const char *file, const char *prefix,
                                   const char *const *known, GPtrArray *warnings);
/* Range check of a value in memory (the validation of a design the GUI edits). */
gboolean sw_optional_check (SwLimitId limit, double value, const char *file,
                            const char *prefix, GError **error);
/* "prefix.key", or "key" when @prefix is empty. */
char    *sw_optional_path (const char *prefix, const char *key);

G_END_DECLS
