#!/usr/bin/env bash
# SPDX-License-Identifier: GPL-3.0-or-later
# Sets up, builds (warnings are errors) and runs the whole test suite, GUI
# tests under Xvfb.  Exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."

bash scripts/deps.sh
builddir=${SW_BUILDDIR:-_build-test}
[ -d "$builddir" ] || meson setup "$builddir" --werror ${SW_MESON_ARGS:-}
ninja -C "$builddir"
GSK_RENDERER=cairo xvfb-run -a -s "-screen 0 1600x1000x24" \
  dbus-run-session -- meson test -C "$builddir" --print-errorlogs ${SW_TEST_ARGS:-}
