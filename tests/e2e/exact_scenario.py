"""Exact helpers for the import and contact-log tests, written for the tests alone.

They share no code with the prover: scenarios are read with Python's json module, numbers
become fractions.Fraction straight from their text (schema/README.md section 1.1), and
positions are interpolated with Fractions. Nothing here goes through a float.
"""
import json
import os
import re
import subprocess
from fractions import Fraction

NUMBER = re.compile(r"-?[0-9]+(\.[0-9]+)?([eE][+-]?[0-9]+)?|-?[0-9]+/[0-9]+")


def exact(text):
    """An exact rational from the text of schema 1.1 (a decimal or a fraction)."""
    text = str(text)
    assert NUMBER.fullmatch(text), f"not an exact number: {text!r}"
    return Fraction(text)


def load_json(path):
    """JSON with every number kept as its raw text, so nothing is rounded."""
    with open(path, "rb") as f:
        return json.loads(f.read(), parse_float=str, parse_int=str)


def load_scenario(path):
    """A scenario as plain data: horizon, fence rows, sensor rows, all numbers Fractions."""
    d = load_json(path)
    return {
        "title": d.get("title"),
        "horizon": [exact(v) for v in d["horizon"]],
        "fence": [(f["id"], exact(f["at"][0]), exact(f["at"][1]), exact(f["radius"]))
                  for f in d["fence"]],
        "sensors": [(s["id"], exact(s["radius"]), [tuple(exact(v) for v in row) for row in s["track"]])
                    for s in d["sensors"]],
    }


def disks(scenario):
    """(id, radius, track) for every sensor, fence first; a fence track is one still row."""
    out = [(i, r, [(Fraction(0), x, y)]) for i, x, y, r in scenario["fence"]]
    return out + list(scenario["sensors"])


def position(track, t):
    """Centre at time t: linear between rows, held before the first and after the last."""
    if t <= track[0][0]:
        return track[0][1], track[0][2]
    if t >= track[-1][0]:
        return track[-1][1], track[-1][2]
    for (t0, x0, y0), (t1, x1, y1) in zip(track, track[1:]):
        if t0 <= t <= t1:
            s = (t - t0) / (t1 - t0)
            return x0 + s * (x1 - x0), y0 + s * (y1 - y0)
    raise AssertionError("unreachable")


def run(cmd, expect_rc=None):
    """Runs a command; returns (rc, stdout, stderr). Checks the exit code when given."""
    p = subprocess.run([str(c) for c in cmd], capture_output=True, text=True)
    if expect_rc is not None and p.returncode != expect_rc:
        raise AssertionError(f"{' '.join(map(str, cmd))}: exit {p.returncode}, expected {expect_rc}\n"
                             f"stdout: {p.stdout}\nstderr: {p.stderr}")
    return p.returncode, p.stdout, p.stderr


def claim_of(cert_path):
    return load_json(cert_path)["claim"]


def fresh(path):
    """Removes a stale output so that 'nothing written' can be asserted afterwards."""
    for p in (path, str(path) + ".partial"):
        if os.path.exists(p):
            os.remove(p)
    return path
