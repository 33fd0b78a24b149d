/* SPDX-License-Identifier: GPL-3.0-or-later */
/* sw-settings.h: the application's settings object.  The window makes one
 * and hands it to its views (sw_*_set_settings); no view makes its own. */
#pragma once

#include <gio/gio.h>

G_BEGIN_DECLS

/* FALSE with a message naming where the schema was looked for. */
gboolean   sw_settings_check (GError **error);
/* Exits with that message when the schema is missing (main() checks first). */
GSettings *sw_settings_new (void);

G_END_DECLS
