#!/usr/bin/env python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The layering rule of DEVELOPERS.md, checked on the #include lines.

  src/core folders, in order: design, sizing, ascent, trade, analysis.  A
  file may include headers of its own folder and of the folders before it,
  never of a later one; the core includes no header of src/sheet, src/cli or
  src/app, and no GTK, GDK, cairo or pango header.
  Inside the core, no two modules (a .c/.h pair; NAME-private.h belongs to
  NAME) include each other, directly or round a longer loop.
  src/sheet includes only the core and itself (no GTK); src/cli only the
  core, the sheet and itself.

Usage: check-layering.py SRC_DIR      (exit 1 and one line per fault)
       check-layering.py --self-test  (checks that faults are found)
"""
import os
import re
import sys
import tempfile

CORE_ORDER = ["design", "sizing", "ascent", "trade", "analysis"]
FORBIDDEN_SYSTEM = re.compile(r"^(gtk|gdk|gsk|cairo|pango|adwaita)")
INCLUDE = re.compile(r'^\s*#\s*include\s*([<"])([^>"]+)[>"]', re.M)


def strip_comments(text):
    return re.sub(r"/\*.*?\*/", "", re.sub(r"//[^\n]*", "", text), flags=re.S)


def scan(src):
    """Maps (area, folder) -> {file name: [(kind, header)]}."""
    files = {}
    for area in ("core", "sheet", "cli", "app"):
        top = os.path.join(src, area)
        for dirpath, _, names in os.walk(top):
            folder = os.path.relpath(dirpath, top)
            for name in names:
                if not name.endswith((".c", ".h")):
                    continue
                with open(os.path.join(dirpath, name), encoding="utf-8") as f:
                    text = strip_comments(f.read())
                files[(area, folder, name)] = INCLUDE.findall(text)
    return files


def module_of(name):
    base = name[:-2]
    return base[: -len("-private")] if base.endswith("-private") else base


def check(src):
    files = scan(src)
    where = {}  # header name -> (area, folder)
    for (area, folder, name) in files:
        if name.endswith(".h"):
            where.setdefault(name, (area, folder))
    faults = []
    core_edges = {}
    for (area, folder, name), includes in sorted(files.items()):
        here = "src/%s/%s" % (area, name if folder == "." else folder + "/" + name)
        for kind, header in includes:
            if kind == "<":
                if area in ("core", "sheet") and FORBIDDEN_SYSTEM.match(header) and not (
                        area == "sheet" and header.startswith(("cairo", "pango"))):
                    faults.append("%s includes <%s>" % (here, header))
                continue
            if header == "config.h":
                continue
            target = where.get(os.path.basename(header))
            if target is None:
                continue  # generated headers (resources, enums)
            t_area, t_folder = target
            if area == "core":
                if t_area != "core":
                    faults.append("%s includes %s from src/%s" % (here, header, t_area))
                    continue
                if folder not in CORE_ORDER or t_folder not in CORE_ORDER:
                    faults.append("%s: folder not in the core's order %s" % (here, CORE_ORDER))
                    continue
                if CORE_ORDER.index(t_folder) > CORE_ORDER.index(folder):
                    faults.append("%s (%s/) includes %s from the later folder %s/"
                                  % (here, folder, header, t_folder))
                a, b = module_of(name), module_of(os.path.basename(header))
                if a != b:
                    core_edges.setdefault(a, set()).add(b)
            elif area == "sheet" and t_area not in ("core", "sheet"):
                faults.append("%s includes %s from src/%s" % (here, header, t_area))
            elif area == "cli" and t_area not in ("core", "sheet", "cli"):
                faults.append("%s includes %s from src/%s" % (here, header, t_area))
    faults.extend(find_cycles(core_edges))
    return faults


def find_cycles(edges):
    faults, state, stack = [], {}, []

    def visit(node):
        state[node] = 1
        stack.append(node)
        for nxt in sorted(edges.get(node, ())):
            if state.get(nxt) == 1:
                loop = stack[stack.index(nxt):] + [nxt]
                faults.append("include cycle between core modules: " + " -> ".join(loop))
            elif nxt not in state:
                visit(nxt)
        stack.pop()
        state[node] = 2

    for node in sorted(edges):
        if node not in state:
            visit(node)
    return faults


def write(root, path, text):
    full = os.path.join(root, path)
    os.makedirs(os.path.dirname(full), exist_ok=True)
    with open(full, "w", encoding="utf-8") as f:
        f.write(text)


def self_test():
    """Small trees with one fault each; the clean tree must pass."""
    clean = {
        "core/design/sw-a.h": '#include "sw-types.h"\n',
        "core/design/sw-types.h": "",
        "core/design/sw-a.c": '#include "config.h"\n#include "sw-a.h"\n',
        "core/sizing/sw-b.h": '#include "sw-a.h"\n',
        "core/sizing/sw-b.c": '#include "sw-b.h"\n/* #include "sw-c.h" in a comment */\n',
        "core/trade/sw-c.h": '#include "sw-b.h"\n#include <gsl/gsl_rng.h>\n',
        "core/trade/sw-c-private.h": '#include "sw-c.h"\n',
        "core/trade/sw-c.c": '#include "sw-c-private.h"\n',
        "sheet/sw-s.c": '#include "sw-c.h"\n#include <cairo.h>\n',
        "cli/sw-m.c": '#include "sw-s.h"\n',
        "sheet/sw-s.h": "",
        "app/sw-w.h": "",
    }
    broken = [
        ("core/design/sw-a.c", '#include "sw-b.h"\n', "later folder sizing/"),
        ("core/sizing/sw-b.c", '#include <gtk/gtk.h>\n', "<gtk/gtk.h>"),
        ("core/design/sw-a.h", '#include "sw-s.h"\n', "from src/sheet"),
        ("core/design/sw-types.h", '#include "sw-a.h"\n', "include cycle"),
        ("sheet/sw-s.c", '#include "sw-w.h"\n', "from src/app"),
        ("cli/sw-m.c", '#include "sw-w.h"\n', "from src/app"),
    ]
    with tempfile.TemporaryDirectory() as root:
        for path, text in clean.items():
            write(root, path, text)
        faults = check(root)
        if faults:
            print("self-test: the clean tree was rejected:", *faults, sep="\n  ")
            return 1
    for path, extra, expected in broken:
        with tempfile.TemporaryDirectory() as root:
            for p, text in clean.items():
                write(root, p, text + (extra if p == path else ""))
            faults = check(root)
            if not any(expected in f for f in faults):
                print("self-test: %s + %r was not reported as %r (got %r)"
                      % (path, extra, expected, faults))
                return 1
    print("self-test: %d faults found, clean tree accepted" % len(broken))
    return 0


def main():
    if len(sys.argv) == 2 and sys.argv[1] == "--self-test":
        return self_test()
    if len(sys.argv) != 2:
        print(__doc__)
        return 2
    faults = check(sys.argv[1])
    for f in faults:
        print(f)
    if not faults:
        print("layering: no back-edge, no cycle")
    return 1 if faults else 0


if __name__ == "__main__":
    sys.exit(main())
