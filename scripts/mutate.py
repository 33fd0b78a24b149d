#!/usr/bin/env python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""Mutation testing for Stagewright (a developer tool; not run in CI).

Applies single-line faults of the kinds people make, one at a time, to the
sources under src/, rebuilds, runs the test suites that cover the folder, and
reports how many faults the tests caught, per folder.

  scripts/mutate.py list   [--seed N] [--per-folder core=30,cli=6,...] > mutants.json
  scripts/mutate.py run    --build BUILDDIR mutants.json [--timeout S] [--report out.json]
  scripts/mutate.py report out.json [out2.json]   # per-folder score, side by side

The tree must be a scratch copy or a clean worktree: every mutant is applied to
the file in place and undone afterwards (also on Ctrl-C).  The mutant list
names each fault by file, line number and the original line's text, so the
same list can be run on a later tree where line numbers have moved.

Kinds of fault:
  cmp-flip      a comparison reversed (< to >=, == to !=, ...)
  off-by-one    a bound moved by one (< to <=, +1 dropped, n - 1 to n)
  swap-args     the first two arguments of a call exchanged
  const-factor  a numeric constant multiplied by 2 (or halved)
  unit-1000     a factor of 1000 dropped or applied (kg/t, m/km)
  pct-swap      percentile names or fractions swapped (p05/p95, 0.05/0.95)
  drop-line     a statement deleted
  sign-flip     + to - in an expression, or a negation dropped

A timed-out test run counts as caught (listed separately): a fault that makes
a test hang is found, if slowly.  A mutant that does not compile is replaced
by the next candidate of the same folder.
"""

import argparse
import json
import os
import random
import re
import shutil
import signal
import subprocess
import sys
import time

FOLDERS = {
    # folder: (source globs, meson test suites to run)
    "core": (["src/core"], ["core", "cli"]),
    "sheet": (["src/sheet"], ["core", "cli"]),
    "cli": (["src/cli"], ["cli"]),
    "app": (["src/app"], ["gui"]),
}

SKIP_LINE = re.compile(
    r"^\s*(#|//|/\*|\*|$)"              # preprocessor, comments, blank
    r"|g_return_|g_assert|g_debug|g_warning|g_critical|g_message|g_printerr"
    r"|g_set_error|_\s*\(\"|N_\s*\(\"|g_autoptr|g_autofree|G_DEFINE|g_free|g_clear_"
    r"|_unref|g_object_class|widget_class|gtk_widget_class_|g_signal_|PROP_"
    r"|^\s*(static\s+)?(const\s+)?(struct\s+)?\w+\s*\**\s*\w+\s*(\[[^\]]*\])?\s*;\s*$"  # bare declarations
)
NUM = r"(?<![\w.])(\d+\.\d*(?:[eE][-+]?\d+)?|\d+[eE][-+]?\d+|\d+\.?\d*)(?![\w.])"


def candidates(line):
    """Yields (kind, mutated line) for one source line."""
    code = line.split("//")[0]
    if SKIP_LINE.search(code):
        return
    # Blank out string literals so that nothing is mutated inside them.
    code = re.sub(r'"(\\.|[^"\\])*"', lambda m: '"' + " " * (len(m.group(0)) - 2) + '"', code)
    if code.strip() == '"' * 2 or re.match(r'^\s*"\s*"\s*[,;)]*\s*$', code):
        return
    # Percentile swaps (only where the line is about percentiles).
    if not re.search(r"p\d\d|quantile|percentile", code, re.I):
        code_pct = ""
    else:
        code_pct = code
    for a, b in (("p05", "p95"), ("p10", "p90"), ("0.05", "0.95"), ("0.1,", "0.9,"),
                 ("p50", "p95"), ("P05", "P95")):
        if a in code_pct and b not in code_pct:
            yield "pct-swap", line.replace(a, b, 1)
        elif b in code_pct and a not in code_pct:
            yield "pct-swap", line.replace(b, a, 1)
    # Unit factors of 1000.
    for m in re.finditer(r"(\*|/)\s*(1000\.0|1000|1e3|1\.0e3)\b", code):
        yield "unit-1000", line[:m.start()] + "* 1.0" + line[m.end():]
    for m in re.finditer(r"(\*|/)\s*(1e-3|0\.001|1\.0e-3)\b", code):
        yield "unit-1000", line[:m.start()] + "* 1.0" + line[m.end():]
    # Comparisons.
    flips = {"<=": ">", ">=": "<", "==": "!=", "!=": "==", "<": ">=", ">": "<="}
    for m in re.finditer(r"(?<![<>=!-])(<=|>=|==|!=|<|>)(?![<>=])", code):
        op = m.group(1)
        if op in ("<", ">") and re.search(r"#include|->", code[max(0, m.start() - 1):m.end() + 1]):
            continue
        yield "cmp-flip", line[:m.start()] + flips[op] + line[m.end():]
        if op in ("<", ">", "<=", ">="):
            obo = {"<": "<=", "<=": "<", ">": ">=", ">=": ">"}[op]
            yield "off-by-one", line[:m.start()] + obo + line[m.end():]
    for m in re.finditer(r"([-+])\s*1(?![\w.])", code):
        yield "off-by-one", line[:m.start()] + line[m.end():]
    # Constants by a factor.
    for m in re.finditer(NUM, code):
        text = m.group(1)
        try:
            value = float(text)
        except ValueError:
            continue
        if value in (0.0, 1.0) or text in ("1000", "1000.0", "1e3"):
            continue
        if re.match(r"\s*for\s*\(", code) or re.search(r"iter|max_steps|tries", code):
            continue  # iteration caps: mostly equivalent mutants
        if re.match(r"\s*\]", code[m.end():]) or re.search(r"\[\s*$", code[:m.start()]):
            continue  # array sizes and indices: compile errors or out-of-bounds, not faults
        new = repr(value * 2.0) if "." in text or "e" in text.lower() else str(int(value) * 2)
        yield "const-factor", line[:m.start()] + new + line[m.end():]
    # Swapped arguments: the first two arguments of a call with plain arguments.
    for m in re.finditer(r"(\w+)\s*\(\s*([^(),]+?)\s*,\s*([^(),]+?)\s*([,)])", code):
        fn, a, b = m.group(1), m.group(2), m.group(3)
        if fn in ("if", "while", "for", "switch", "sizeof", "return") or a == b:
            continue
        if re.match(r"^[\"']", a) or re.match(r"^[\"']", b):
            continue
        start, end = m.start(2), m.end(3)
        yield "swap-args", line[:start] + b + line[m.end(2):m.start(3)] + a + line[end:]
    # Sign flips.
    for m in re.finditer(r"(?<=[\w)\]])\s+([-+])\s+(?=[\w(])", code):
        new = "-" if m.group(1) == "+" else "+"
        yield "sign-flip", line[:m.start(1)] + new + line[m.end(1):]
    # Dropped statements (assignments, compound assignments, plain calls).
    stripped = code.strip()
    if (stripped.endswith(";") and not stripped.startswith(("return", "break", "continue",
                                                            "goto", "case", "default"))
            and ("=" in stripped or stripped.endswith(");"))
            and not re.match(r"^(const\s+)?(unsigned\s+)?(int|double|guint|gsize|gboolean|char|"
                             r"float|long|gint|size_t|Sw\w+|Gsl\w+|gsl_\w+)\b", stripped)
            and stripped.count("(") == stripped.count(")")):
        indent = line[:len(line) - len(line.lstrip())]
        yield "drop-line", indent + "/* mutant: line dropped */\n"


def source_files(root, dirs):
    out = []
    for d in dirs:
        for base, _, names in os.walk(os.path.join(root, d)):
            for n in sorted(names):
                if n.endswith(".c"):
                    out.append(os.path.relpath(os.path.join(base, n), root))
    return sorted(out)


def in_function_body(lines):
    """Marks the lines inside function bodies (brace depth > 0 after a
    top-level function header), so the mutants hit code, not tables."""
    depth = 0
    inside = []
    func = False
    prev = ""
    for ln in lines:
        s = ln.split("//")[0]
        if depth == 0 and s.startswith("{") and not prev.rstrip().endswith("="):
            func = True
        inside.append(depth > 0 and func)
        depth += s.count("{") - s.count("}")
        if depth <= 0:
            depth = 0
            func = False
        if s.strip():
            prev = s
    return inside


def cmd_list(args):
    rng = random.Random(args.seed)
    want = dict(kv.split("=") for kv in args.per_folder.split(","))
    mutants = []
    for folder, count in want.items():
        dirs, _ = FOLDERS[folder]
        pool = []
        for path in source_files(args.root, dirs):
            if path.endswith("-bench.c"):
                continue  # benchmarks: timing only, no behaviour to test
            with open(os.path.join(args.root, path), encoding="utf-8") as fh:
                lines = fh.readlines()
            body = in_function_body(lines)
            for i, ln in enumerate(lines):
                if not body[i]:
                    continue
                for kind, new in candidates(ln):
                    if new != ln:
                        pool.append({"folder": folder, "file": path, "line": i + 1,
                                     "kind": kind, "old": ln, "new": new})
        # Spread over kinds: sample each kind in turn so that a folder's sample
        # is not all comparisons.
        by_kind = {}
        for m in pool:
            by_kind.setdefault(m["kind"], []).append(m)
        for v in by_kind.values():
            rng.shuffle(v)
        kinds = sorted(by_kind)
        rng.shuffle(kinds)
        picked = []
        # Keep extra candidates (3x) as replacements for mutants that do not compile.
        k = 0
        while len(picked) < 3 * int(count) and any(by_kind.values()):
            kind = kinds[k % len(kinds)]
            if by_kind[kind]:
                picked.append(by_kind[kind].pop())
            k += 1
        for j, m in enumerate(picked):
            m["rank"] = j
        mutants.extend(picked)
        print(f"{folder}: {len(pool)} candidate faults, {count} wanted", file=sys.stderr)
    json.dump({"seed": args.seed, "want": want, "mutants": mutants}, sys.stdout, indent=1)


def locate(lines, m):
    """Finds the mutant's line in the current file: by number, else by text."""
    i = m["line"] - 1
    if 0 <= i < len(lines) and lines[i] == m["old"]:
        return i
    hits = [j for j, ln in enumerate(lines) if ln == m["old"]]
    if not hits:
        return None
    return min(hits, key=lambda j: abs(j - i))


def descendants(pid):
    """The process ids below @pid (from /proc), deepest last."""
    children = {}
    for entry in os.listdir("/proc"):
        if not entry.isdigit():
            continue
        try:
            with open(f"/proc/{entry}/stat", encoding="utf-8") as fh:
                ppid = int(fh.read().rsplit(")", 1)[1].split()[1])
        except (OSError, ValueError, IndexError):
            continue
        children.setdefault(ppid, []).append(int(entry))
    out, todo = [], [pid]
    while todo:
        for c in children.get(todo.pop(), []):
            out.append(c)
            todo.append(c)
    return out


def run(cmd, timeout, cwd=None, env=None):
    """Runs cmd in its own session; on timeout kills it and every process
    below it (meson test starts each test in a process group of its own, so
    killing the group alone would leave a hung test running)."""
    p = subprocess.Popen(cmd, cwd=cwd, env=env, stdout=subprocess.PIPE,
                         stderr=subprocess.STDOUT, start_new_session=True)
    try:
        out, _ = p.communicate(timeout=timeout)
        return p.returncode, out.decode("utf-8", "replace"), False
    except subprocess.TimeoutExpired:
        for pid in [p.pid] + descendants(p.pid):
            try:
                os.kill(pid, signal.SIGKILL)
            except ProcessLookupError:
                pass
        out, _ = p.communicate()
        return None, out.decode("utf-8", "replace"), True


def test_command(build, suites):
    cmd = ["meson", "test", "-C", build, "--no-rebuild", "--num-processes", "1",
           "--timeout-multiplier", "0.5"]
    for s in suites:
        cmd += ["--suite", s]
    if "gui" in suites:
        cmd = ["xvfb-run", "-a", "-s", "-screen 0 1600x1000x24", "dbus-run-session", "--"] + cmd
    return cmd


def cmd_run(args):
    with open(args.mutants, encoding="utf-8") as fh:
        spec = json.load(fh)
    root = os.path.abspath(args.root)
    build = os.path.abspath(args.build)
    env = dict(os.environ, GSK_RENDERER="cairo")
    results = []
    done = {}
    want = {f: int(n) for f, n in spec["want"].items()}
    folders = [f for f in want if not args.folders or f in args.folders.split(",")]

    # The unmutated tree must build and pass first.
    rc, out, _ = run(["ninja", "-C", build, "-j1"], 1800)
    if rc != 0:
        sys.exit("the unmutated tree does not build:\n" + out[-3000:])
    for f in folders:
        rc, out, to = run(test_command(build, FOLDERS[f][1]), args.timeout * 4, env=env)
        if rc != 0:
            sys.exit(f"the unmutated tree fails suite(s) {FOLDERS[f][1]}:\n" + out[-3000:])

    current = None
    original = None

    def restore():
        if current is not None:
            with open(current, "w", encoding="utf-8") as fh:
                fh.writelines(original)

    def on_signal(signum, frame):
        restore()
        sys.exit(130)

    signal.signal(signal.SIGINT, on_signal)
    signal.signal(signal.SIGTERM, on_signal)

    try:
        for m in spec["mutants"]:
            f = m["folder"]
            if f not in folders or done.get(f, 0) >= want[f]:
                continue
            path = os.path.join(root, m["file"])
            if not os.path.exists(path):
                continue
            with open(path, encoding="utf-8") as fh:
                lines = fh.readlines()
            i = locate(lines, m)
            if i is None:
                results.append(dict(m, status="gone"))
                continue
            current, original = path, list(lines)
            mutated = list(lines)
            mutated[i] = m["new"]
            with open(path, "w", encoding="utf-8") as fh:
                fh.writelines(mutated)
            t0 = time.time()
            rc, out, to = run(["ninja", "-C", build, "-j1"], 900)
            if rc != 0:
                status = "no-compile"
            else:
                rc, out, to = run(test_command(build, FOLDERS[f][1]), args.timeout, env=env)
                if to:
                    status = "caught-timeout"
                elif rc == 0:
                    status = "missed"
                else:
                    status = "caught"
                    failed = re.findall(r"\d+/\d+ (\S+)\s+(?:FAIL|TIMEOUT|ERROR)", out)
                    m = dict(m, failed=sorted(set(failed)))
            restore()
            current = None
            if status != "no-compile":
                done[f] = done.get(f, 0) + 1
            r = dict(m, status=status, seconds=round(time.time() - t0, 1))
            results.append(r)
            print(f"[{f} {done.get(f, 0)}/{want[f]}] {status:14s} {m['kind']:12s} "
                  f"{m['file']}:{i + 1}: {m['old'].strip()}  ->  {m['new'].strip()}",
                  flush=True)
            if args.report:
                with open(args.report, "w", encoding="utf-8") as fh:
                    json.dump(results, fh, indent=1)
    finally:
        restore()
        # Leave the build matching the restored sources.
        run(["ninja", "-C", build, "-j1"], 1800)
    summarise([results])


def summarise(runs, names=None):
    names = names or [f"run {i + 1}" for i in range(len(runs))]
    folders = []
    for r in runs:
        for m in r:
            if m["folder"] not in folders:
                folders.append(m["folder"])
    head = "folder  " + "".join(f"{n:>24s}" for n in names)
    print(head)
    for f in folders:
        row = f"{f:8s}"
        for r in runs:
            ms = [m for m in r if m["folder"] == f and m["status"] not in ("no-compile", "gone")]
            caught = sum(1 for m in ms if m["status"].startswith("caught"))
            pct = 100.0 * caught / len(ms) if ms else 0.0
            row += f"{caught:>10d}/{len(ms):<3d} ({pct:5.1f} %)"
        print(row)
    for name, r in zip(names, runs):
        missed = [m for m in r if m["status"] == "missed"]
        if missed:
            print(f"\nmissed in {name}:")
            for m in missed:
                print(f"  {m['kind']:12s} {m['file']}:{m['line']}: {m['old'].strip()}  ->  "
                      f"{m['new'].strip()}")


def cmd_report(args):
    runs = []
    for p in args.reports:
        with open(p, encoding="utf-8") as fh:
            runs.append(json.load(fh))
    summarise(runs, [os.path.basename(p) for p in args.reports])


def main():
    ap = argparse.ArgumentParser(description=__doc__,
                                 formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--root", default=os.path.join(os.path.dirname(__file__), ".."))
    sub = ap.add_subparsers(dest="cmd", required=True)
    a = sub.add_parser("list")
    a.add_argument("--seed", type=int, default=9)
    a.add_argument("--per-folder", default="core=30,cli=6,sheet=6,app=6")
    a = sub.add_parser("run")
    a.add_argument("mutants")
    a.add_argument("--build", required=True)
    a.add_argument("--timeout", type=float, default=240,
                   help="seconds for one mutant's test run (a hang counts as caught)")
    a.add_argument("--folders", default="", help="comma-separated subset, e.g. core,cli")
    a.add_argument("--report", help="write the per-mutant results here as JSON")
    a = sub.add_parser("report")
    a.add_argument("reports", nargs="+")
    args = ap.parse_args()
    {"list": cmd_list, "run": cmd_run, "report": cmd_report}[args.cmd](args)


if __name__ == "__main__":
    main()
