#!/usr/bin/env bash
# SPDX-License-Identifier: GPL-3.0-or-later
# Sets up, builds and runs Stagewright on a bundled demo design.
set -euo pipefail
cd "$(dirname "$0")/.."

bash scripts/deps.sh
[ -d _build ] || meson setup _build
ninja -C _build

# The programs run from the build tree through `meson devenv`, which points
# them at the tree's demo designs, translations and compiled settings schema.
run () { meson devenv -C _build --workdir "$PWD" "$@"; }
demo=$PWD/data/designs/medium-cargo.stagewright
echo
run _build/src/cli/stagewright-cli size "$demo"
echo
if [ -n "${DISPLAY:-}${WAYLAND_DISPLAY:-}" ] && [ -x _build/src/app/stagewright ]; then
  run _build/src/app/stagewright "$demo"
elif [ -x _build/src/app/stagewright ]; then
  echo "No display: writing a screenshot of the window to _build/demo.png instead."
  GSK_RENDERER=cairo run xvfb-run -a _build/src/app/stagewright --screenshot=_build/demo.png "$demo"
  echo "Wrote _build/demo.png"
fi
