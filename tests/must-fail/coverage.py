#!/usr/bin/env python3
"""Asserts that the must-fail cases reach every rejection site of the checker.

A rejection site is a source line of checker/*.cpp or checker/*.hpp containing `throw Rejected(`.
The test clears the counters of the gcov-instrumented checker (sweepcheck_cov), runs every
control and every must-fail case through it (with the checks of run_must_fail.py), runs gcov and
requires of every site that gcov saw its line run with no block of the line left unexecuted: on
a line such as `if (c) throw Rejected(...)` the line count alone only says that `c` was
evaluated, while the throw is a block of its own. Sites listed in unreachable.txt (matched by
file name and the line's text, with a reason each) are exempt; an entry that matches no site, or
whose site is reached after all, is an error, so the list stays short and true.

usage: coverage.py --checker SWEEPCHECK_COV --gcov GCOV --sources CHECKER_DIR --cases MUST_FAIL_DIR
                   --work DIR --objects OBJ...
"""
import argparse
import glob
import json
import os
import subprocess
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import run_must_fail  # noqa: E402

MARK = "throw Rejected("


def rejection_sites(source_dir):
    """[(file name, line number, stripped text)] of every `throw Rejected(` outside comments."""
    sites = []
    for path in sorted(glob.glob(os.path.join(source_dir, "*.cpp")) + glob.glob(os.path.join(source_dir, "*.hpp"))):
        with open(path, encoding="utf-8") as f:
            for number, line in enumerate(f, 1):
                code = line.split("//", 1)[0] if not line.lstrip().startswith("//") else ""
                if MARK in code:
                    sites.append((os.path.basename(path), number, line.strip()))
    return sites


def read_unreachable(path):
    """{(file, text): reason} from lines '<file>: <text>' each followed by a line 'why: <reason>'."""
    entries, pending, problems = {}, None, []
    if not os.path.exists(path):
        return entries, problems
    with open(path, encoding="utf-8") as f:
        for number, raw in enumerate(f, 1):
            line = raw.strip()
            if not line or line.startswith("#"):
                continue
            if line.startswith("why:"):
                if pending is None or not line[4:].strip():
                    problems.append(f"{path}:{number}: 'why:' must follow a site line and give a reason")
                else:
                    entries[pending] = line[4:].strip()
                pending = None
                continue
            if pending is not None:
                problems.append(f"{path}:{number}: the entry before this line has no 'why:' line")
            name, sep, text = line.partition(": ")
            if not sep or not name.endswith((".cpp", ".hpp")) or MARK not in text:
                problems.append(f"{path}:{number}: expected '<file>: <line text with {MARK}>'")
                pending = None
            else:
                pending = (name, text.strip())
    if pending is not None:
        problems.append(f"{path}: the last entry has no 'why:' line")
    return entries, problems


def gcov_lines(gcov, objects, work):
    """{(real path of source, line number): [(count, unexecuted_block)]}, one pair per function
    instance that gcov reports for the line, over every object file."""
    result = {}
    for obj in objects:
        proc = subprocess.run([gcov, "--json-format", "--stdout", "--branch-probabilities", obj],
                              capture_output=True, text=True, cwd=work)
        if proc.returncode != 0:
            raise RuntimeError(f"gcov failed on {obj}: {proc.stderr.strip()}")
        for text in proc.stdout.splitlines():
            if not text.strip():
                continue
            for f in json.loads(text).get("files", []):
                path = os.path.realpath(f["file"])
                for line in f["lines"]:
                    result.setdefault((path, line["line_number"]), []).append(
                        (line["count"], line.get("unexecuted_block", False)))
    return result


def main():
    parser = argparse.ArgumentParser(description=__doc__.strip().splitlines()[0])
    parser.add_argument("--checker", required=True)
    parser.add_argument("--gcov", required=True)
    parser.add_argument("--sources", required=True)
    parser.add_argument("--cases", required=True)
    parser.add_argument("--work", required=True)
    parser.add_argument("--objects", nargs="+", required=True)
    args = parser.parse_args()
    os.makedirs(args.work, exist_ok=True)

    # Fresh counters: gcc names the counter file of X.o as X.gcda, beside it.
    for obj in args.objects:
        gcda = os.path.splitext(obj)[0] + ".gcda"
        if os.path.exists(gcda):
            os.remove(gcda)

    failures, cases, controls = run_must_fail.run_all(os.path.abspath(args.checker), os.path.abspath(args.cases))
    for f in failures:
        print("FAIL " + f)
    print(f"coverage: ran {controls} controls and {cases} cases through {os.path.basename(args.checker)}")

    counts = gcov_lines(args.gcov, args.objects, args.work)
    sites = rejection_sites(args.sources)
    unreachable, problems = read_unreachable(os.path.join(args.cases, "unreachable.txt"))
    site_keys = {(name, text) for name, _, text in sites}
    for key in unreachable:
        if key not in site_keys:
            problems.append(f"unreachable.txt: no rejection site {key[0]}: {key[1]} (stale entry)")

    reached, exempt, missed = 0, 0, []
    for name, number, text in sites:
        seen = counts.get((os.path.realpath(os.path.join(args.sources, name)), number), [])
        hit = any(count > 0 and not unexecuted for count, unexecuted in seen)
        if (name, text) in unreachable:
            exempt += 1
            if hit:
                problems.append(f"{name}:{number}: listed in unreachable.txt but reached: {text}")
            continue
        if hit:
            reached += 1
        else:
            state = ("never run" if not any(c > 0 for c, _ in seen)
                     else "run, but a block of it never ran: the throw, or one side of a condition gcov puts on this line")
            missed.append(f"{name}:{number}: {text}   [{state}]")

    for m in missed:
        print("UNCOVERED " + m)
    for p in problems:
        print("ERROR " + p)
    total = len(sites)
    print(f"coverage: {reached} of {total} rejection sites reached by the must-fail cases, "
          f"{exempt} listed as unreachable, {len(missed)} missed")
    if total == 0:
        print("ERROR no rejection site found under " + args.sources)
        return 1
    return 1 if failures or missed or problems else 0


if __name__ == "__main__":
    sys.exit(main())
