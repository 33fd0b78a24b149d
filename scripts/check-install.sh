#!/usr/bin/env bash
# SPDX-License-Identifier: GPL-3.0-or-later
# check-install.sh MESON BUILDDIR SOURCEDIR cli|gui
# Installs the build with `meson install --destdir` into a fresh temporary
# folder, moves the installed tree to another folder (so the configured
# prefix does not exist either), and runs the installed programs there with
# a clean environment: no SW_* variables, no GSETTINGS_SCHEMA_DIR, the
# working folder outside the source tree.  Fails when an installed binary
# holds an absolute path of the source or build tree.
#   cli: stagewright-cli size on an installed demo design (same output as the
#        build tree's CLI), and a German error message from the installed
#        translations.
#   gui: the installed window's --screenshot of its default demo design (found
#        under the install prefix), then the same with the settings schema
#        removed: a clear message and exit status 1, not an abort.
set -uo pipefail

meson=$1 build=$(realpath "$2") src=$(realpath "$3") mode=$4
for tool in strings timeout; do
  command -v "$tool" > /dev/null || { echo "FAIL: $tool is not installed" >&2; exit 1; }
done
tmp=$(mktemp -d "${TMPDIR:-/tmp}/sw-install.XXXXXX")
trap 'rm -rf "$tmp"' EXIT
fail () { echo "FAIL: $*" >&2; exit 1; }

"$meson" install -C "$build" --no-rebuild --quiet --strip --destdir "$tmp/dest" \
  > "$tmp/install.log" 2>&1 || { cat "$tmp/install.log" >&2; fail "meson install"; }

# Move the installed tree: the programs must find their data next to them.
cli=$(find "$tmp/dest" -type f -path '*/bin/stagewright-cli' | head -1)
[ -n "$cli" ] || fail "no bin/stagewright-cli in the installed tree"
old_prefix=$(dirname "$(dirname "$cli")")
mkdir -p "$tmp/moved"
mv "$old_prefix" "$tmp/moved/prefix"
rm -rf "$tmp/dest"
prefix=$tmp/moved/prefix
bin=$prefix/bin
designs=$prefix/share/stagewright/designs
[ -f "$designs/medium-cargo.stagewright" ] || fail "demo designs not installed under share/stagewright/designs"

# No absolute path of the source or build tree in an installed binary.
for f in "$bin"/*; do
  for p in "$src" "$build" "$(realpath -s "$3")" "$(realpath -s "$2")"; do
    if strings -a "$f" | grep -F -q -- "$p"; then
      strings -a "$f" | grep -F -- "$p" | head -5 >&2
      fail "$(basename "$f") holds the path $p"
    fi
  done
done

# A clean environment: only what a desktop session gives, plus the test
# display and the sanitizer settings of a sanitizer build.
clean_env=(env -i PATH=/usr/local/bin:/usr/bin:/bin HOME="$tmp/home" TMPDIR="$tmp"
           XDG_RUNTIME_DIR="$tmp/run" XDG_CONFIG_HOME="$tmp/home/.config"
           XDG_DATA_HOME="$tmp/home/.local/share" XDG_CACHE_HOME="$tmp/home/.cache"
           XDG_STATE_HOME="$tmp/home/.local/state" LANG=C.UTF-8)
for v in DISPLAY XAUTHORITY DBUS_SESSION_BUS_ADDRESS ASAN_OPTIONS UBSAN_OPTIONS LSAN_OPTIONS \
         GSK_RENDERER GDK_BACKEND GTK_A11Y NO_AT_BRIDGE GSETTINGS_BACKEND; do
  [ -n "${!v:-}" ] && clean_env+=("$v=${!v}")
done
mkdir -p "$tmp/home" "$tmp/run" && chmod 700 "$tmp/run"
cd "$tmp" || fail "cd $tmp"

case $mode in
cli)
  design=$designs/medium-cargo.stagewright
  "${clean_env[@]}" "$bin/stagewright-cli" size "$design" > "$tmp/installed.txt" 2> "$tmp/err.txt" \
    || { cat "$tmp/err.txt" >&2; fail "installed stagewright-cli size exits $?"; }
  grep -q . "$tmp/installed.txt" || fail "installed stagewright-cli size printed nothing"
  # The same numbers as the build tree's CLI on the source tree's copy.
  "${clean_env[@]}" "$build/src/cli/stagewright-cli" size "$src/data/designs/medium-cargo.stagewright" \
    > "$tmp/built.txt" 2>/dev/null || fail "build-tree stagewright-cli size"
  diff -u "$tmp/built.txt" "$tmp/installed.txt" >&2 || fail "installed and built CLI disagree"
  # Translations found under the moved prefix (needs the de_DE.UTF-8 locale).
  if locale -a 2>/dev/null | grep -qi '^de_DE\.utf-\?8$'; then
    printf '{"format": "something-else", "version": 1}\n' > "$tmp/wrong.stagewright"
    "${clean_env[@]}" LANGUAGE=de LC_ALL=de_DE.UTF-8 "$bin/stagewright-cli" size "$tmp/wrong.stagewright" \
      > /dev/null 2> "$tmp/de.txt"
    rc=$?
    [ $rc -eq 2 ] || { cat "$tmp/de.txt" >&2; fail "a wrong format exits $rc, want 2"; }
    grep -q "ist kein Stagewright-Entwurf" "$tmp/de.txt" \
      || { cat "$tmp/de.txt" >&2; fail "no German message from the installed translations"; }
  else
    echo "de_DE.UTF-8 locale missing: translation check skipped" >&2
  fi
  ;;
gui)
  [ -n "${DISPLAY:-}" ] || { echo "no DISPLAY: run under xvfb-run" >&2; exit 77; }
  schemas=$prefix/share/glib-2.0/schemas
  [ -f "$schemas/org.stagewright.Stagewright.gschema.xml" ] || fail "schema not installed"
  # What the post-install step does outside a DESTDIR install.
  glib-compile-schemas "$schemas" || fail "glib-compile-schemas"
  "${clean_env[@]}" timeout 120 "$bin/stagewright" --screenshot="$tmp/shot.png" \
    > "$tmp/out.txt" 2>&1 || { cat "$tmp/out.txt" >&2; fail "installed stagewright --screenshot exits $?"; }
  [ "$(head -c 8 "$tmp/shot.png" | od -An -tx1 | tr -d ' \n')" = 89504e470d0a1a0a ] \
    || fail "the screenshot is not a PNG"
  [ "$(stat -c %s "$tmp/shot.png")" -gt 20000 ] || fail "the screenshot is nearly empty"
  # Without the schema: a clear message and exit status 1.
  rm -f "$schemas/gschemas.compiled"
  "${clean_env[@]}" timeout 60 "$bin/stagewright" --screenshot="$tmp/shot2.png" \
    > "$tmp/out2.txt" 2>&1
  rc=$?
  [ $rc -eq 1 ] || { cat "$tmp/out2.txt" >&2; fail "with no schema the window exits $rc, want 1"; }
  grep -q "settings schema org.stagewright.Stagewright is not installed" "$tmp/out2.txt" \
    || { cat "$tmp/out2.txt" >&2; fail "with no schema: no clear message"; }
  [ ! -e "$tmp/shot2.png" ] || fail "with no schema a screenshot was written"
  ;;
*)
  fail "mode must be cli or gui"
  ;;
esac
echo "ok: installed $mode works from $prefix"
