#!/usr/bin/env python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""Counts the test cases in meson's test logs (TAP lines inside each test
program's output; a program without TAP counts as one case) and prints
'N passed, N failed'."""
import json
import re
import sys

passed = failed = skipped = 0
args = sys.argv[1:]
if args[:1] == ["--extra"]:
    passed += int(args[1])
    failed += int(args[2])
    args = args[3:]
for path in args:
    try:
        lines = open(path, encoding="utf-8").read().splitlines()
    except OSError:
        failed += 1
        print(f"missing test log {path}", file=sys.stderr)
        continue
    for line in lines:
        if not line.strip():
            continue
        entry = json.loads(line)
        out = entry.get("stdout") or entry.get("stdo") or ""
        oks = len(re.findall(r"^ok \d+(?! # skip)", out, re.M | re.I))
        skips = len(re.findall(r"^ok \d+.*# skip", out, re.M | re.I))
        bad = len(re.findall(r"^not ok \d+", out, re.M))
        result = entry.get("result")
        if oks + bad + skips == 0:
            if result in ("OK", "EXPECTEDFAIL"):
                passed += 1
            elif result == "SKIP":
                skipped += 1
            else:
                failed += 1
            continue
        passed += oks
        skipped += skips
        failed += bad
        # A crash after some cases passed, or a missing plan, still fails.
        if result not in ("OK", "EXPECTEDFAIL", "SKIP") and bad == 0:
            failed += 1
line = f"{passed} passed, {failed} failed"
if skipped:
    line += f", {skipped} skipped"
print(line)
