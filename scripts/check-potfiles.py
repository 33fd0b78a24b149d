#!/usr/bin/env python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""po/POTFILES against the tree: every listed file exists, and every source
file with a translatable string is listed (C files calling _(), N_(),
C_(), NC_() or a g_d*gettext; .ui files with translatable="yes"; the data
files the i18n merge reads).  `--write` rewrites the list.
  scripts/check-potfiles.py SOURCE_ROOT [--write]"""
import os
import re
import sys

MARK_C = re.compile(r'(?<![\w])(_|N_|C_|NC_|ngettext|g_dngettext|g_dpgettext2|g_dcgettext)\s*\(')
MARK_UI = re.compile(r'translatable="yes"')
DATA = ["data/org.stagewright.Stagewright.desktop.in",
        "data/org.stagewright.Stagewright.gschema.xml",
        "data/org.stagewright.Stagewright.metainfo.xml.in",
        "data/org.stagewright.Stagewright.mime.xml.in"]


def wanted(root):
    files = [f for f in DATA if os.path.exists(os.path.join(root, f))]
    for top, pattern in (("src", MARK_C), ("ui", MARK_UI)):
        for base, _, names in os.walk(os.path.join(root, top)):
            for n in sorted(names):
                if not n.endswith(".c" if top == "src" else ".ui"):
                    continue
                path = os.path.join(base, n)
                with open(path, encoding="utf-8") as fh:
                    if pattern.search(fh.read()):
                        files.append(os.path.relpath(path, root))
    return sorted(files)


def main():
    root = sys.argv[1]
    potfiles = os.path.join(root, "po", "POTFILES")
    with open(potfiles, encoding="utf-8") as fh:
        lines = fh.read().splitlines()
    head = [l for l in lines if l.startswith("#")]
    listed = sorted(l.strip() for l in lines if l.strip() and not l.startswith("#"))
    want = wanted(root)
    if "--write" in sys.argv:
        with open(potfiles, "w", encoding="utf-8") as fh:
            fh.write("\n".join(head + want) + "\n")
        return 0
    ok = True
    for f in listed:
        if not os.path.exists(os.path.join(root, f)):
            print(f"po/POTFILES lists {f}, which does not exist")
            ok = False
    for f in sorted(set(want) - set(listed)):
        print(f"{f} has translatable strings but is not in po/POTFILES")
        ok = False
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
