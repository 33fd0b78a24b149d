/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Where the installed data lives: the demo designs, the compiled settings
 * schema and the translations.  No path of the source or build tree is
 * compiled in: an installed program looks under its own install prefix
 * (found from the program's location, so a relocated or DESTDIR install
 * works too), then under the configured prefix.  In the build tree, set
 * SW_DESIGNS_DIR, SW_LOCALE_DIR and GSETTINGS_SCHEMA_DIR (meson test and
 * `meson devenv` do). */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

char *sw_install_data_dir (void);
char *sw_install_designs_dir (void);
char *sw_install_find_design (const char *basename);
char *sw_install_schemas_dir (void);
char *sw_install_locale_dir (void);

G_END_DECLS
