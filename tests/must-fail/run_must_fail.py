#!/usr/bin/env python3
"""Runs the must-fail certificates (tests/must-fail/README.md) through a sweepcheck binary.

Every case directory holds cert.json and expect.txt; the checker must exit 1 with one REJECTED
line containing every `message:` fragment. Every control under valid/ must exit 0 with an
ACCEPTED line containing its `accepted:` fragment, so that no case passes merely because the
certificate it was derived from was broken already.

usage: run_must_fail.py SWEEPCHECK [CASES_DIR]
"""
import os
import subprocess
import sys

HERE = os.path.dirname(os.path.abspath(__file__))
SHARED = {"inputs", "valid"}  # directories that are not cases
KEYS = {"input", "base", "message", "accepted", "why"}


def read_expect(path):
    """expect.txt as {key: [values]}; unknown keys and lines without a key are errors."""
    fields = {}
    with open(path, encoding="utf-8") as f:
        for number, line in enumerate(f, 1):
            line = line.rstrip("\n")
            if not line.strip() or line.startswith("#"):
                continue
            key, sep, value = line.partition(": ")
            if not sep or key not in KEYS or not value.strip():
                raise ValueError(f"{path}:{number}: expected '<key>: <value>' with key in {sorted(KEYS)}")
            fields.setdefault(key, []).append(value)
    return fields


def one(fields, key, path):
    values = fields.get(key, [])
    if len(values) != 1:
        raise ValueError(f"{path}: needs exactly one '{key}:' line")
    return values[0]


def case_dirs(root):
    return sorted(d for d in os.listdir(root) if os.path.isdir(os.path.join(root, d)) and d not in SHARED)


def control_dirs(root):
    valid = os.path.join(root, "valid")
    return sorted(d for d in os.listdir(valid) if os.path.isdir(os.path.join(valid, d)))


def run(checker, root, input_rel, cert):
    proc = subprocess.run([checker, os.path.join(root, input_rel), cert], capture_output=True, text=True, timeout=120)
    return proc.returncode, proc.stdout, proc.stderr


def check_case(checker, root, name):
    """Returns a list of failure texts (empty when the case behaves)."""
    directory = os.path.join(root, name)
    expect = os.path.join(directory, "expect.txt")
    try:
        fields = read_expect(expect)
        input_rel = one(fields, "input", expect)
        one(fields, "why", expect)
        messages = fields.get("message", [])
        if not messages:
            raise ValueError(f"{expect}: needs at least one 'message:' line")
        if "accepted" in fields:
            raise ValueError(f"{expect}: 'accepted:' belongs to controls under valid/")
        bases = fields.get("base", [])
        for base in bases:
            if not os.path.isfile(os.path.join(root, base, "cert.json")) or not base.startswith("valid/"):
                raise ValueError(f"{expect}: base '{base}' is not a control under valid/")
    except (OSError, ValueError) as e:
        return [str(e)]
    rc, out, err = run(checker, root, input_rel, os.path.join(directory, "cert.json"))
    lines = out.splitlines()
    rejected = [l for l in lines if l.startswith("REJECTED")]
    problems = []
    if rc != 1:
        problems.append(f"exit code {rc}, expected 1")
    if len(rejected) != 1 or not lines or lines[-1] != rejected[0]:
        problems.append("expected exactly one REJECTED line, the last line of the output")
    if any(l.startswith("ACCEPTED") for l in lines):
        problems.append("the output has an ACCEPTED line")
    if err.strip():  # a rejection is reported on stdout alone; stderr would be a crash or sanitizer report
        problems.append("unexpected output on stderr")
    line = rejected[0] if rejected else ""
    for m in messages:
        if m not in line:
            problems.append(f"the REJECTED line lacks the fragment: {m}")
    if problems:
        problems.append("output: " + (out.strip().splitlines() or [""])[-1] + (" | stderr: " + err.strip() if err.strip() else ""))
    return [f"{name}: {p}" for p in problems]


def check_control(checker, root, name):
    directory = os.path.join(root, "valid", name)
    expect = os.path.join(directory, "expect.txt")
    try:
        fields = read_expect(expect)
        input_rel = one(fields, "input", expect)
        accepted = one(fields, "accepted", expect)
        one(fields, "why", expect)
    except (OSError, ValueError) as e:
        return [str(e)]
    rc, out, err = run(checker, root, input_rel, os.path.join(directory, "cert.json"))
    lines = out.splitlines()
    last = lines[-1] if lines else ""
    if rc == 0 and last.startswith("ACCEPTED") and accepted in last and not err.strip():
        return []
    return [f"valid/{name}: exit code {rc}, last line '{last}' (expected ACCEPTED with '{accepted}')"
            + (" | stderr: " + err.strip() if err.strip() else "")]


def run_all(checker, root=HERE):
    """Checks every control and every case; returns (failures, number of cases, number of controls)."""
    failures = []
    controls = control_dirs(root)
    for name in controls:
        failures += check_control(checker, root, name)
    cases = case_dirs(root)
    for name in cases:
        failures += check_case(checker, root, name)
    return failures, len(cases), len(controls)


def main(argv):
    if len(argv) not in (2, 3):
        print(__doc__.strip().splitlines()[-1], file=sys.stderr)
        return 2
    checker = os.path.abspath(argv[1])
    root = os.path.abspath(argv[2]) if len(argv) == 3 else HERE
    failures, cases, controls = run_all(checker, root)
    for f in failures:
        print("FAIL " + f)
    print(f"must-fail: {cases} cases rejected as expected and {controls} controls accepted"
          if not failures else f"must-fail: {len(failures)} failures ({cases} cases, {controls} controls)")
    if cases == 0 or controls == 0:
        print("must-fail: no cases or no controls found", file=sys.stderr)
        return 1
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
