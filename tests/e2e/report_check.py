#!/usr/bin/env python3
"""Checks pages and snapshots written by `sweepcert report` against the scenario and certificate.

  report_check.py dom DUMPED.html SCENARIO CERT T [--live some|none]
      A DOM dumped by headless chromium at #t=T: ready flag set, no script error recorded,
      one circle.sensor per mobile sensor at its position at T, one circle.fence per fence sensor,
      for a route certificate the intruder at the route's position at T, and (--live) live cells
      drawn or not.
  report_check.py svg SNAPSHOT.svg SCENARIO CERT T [--live some|none]
      The same checks on an SVG snapshot, parsed as XML (xml.etree), plus the caption naming T.
  report_check.py slab-middle CERT first|last exact|decimal
      Prints the middle time of the first or last slab of a chambers certificate, as a fraction
      (the text `sweepcert report --svg` echoes) or a decimal (for a #t= fragment).

Expected positions are computed here in exact fractions from the files (straight between
waypoints, held before the first and after the last; schema §2.1 and §4.6), independently of the
prover.
"""
import json
import sys
import xml.etree.ElementTree as ET
from fractions import Fraction
from html.parser import HTMLParser


def load(path):
    with open(path) as f:
        return json.load(f, parse_float=Fraction, parse_int=Fraction)


def num(v):
    return Fraction(v) if isinstance(v, str) else v


def along(rows, t):
    """rows: [[t, x, y], ...] in increasing t."""
    rows = [[num(c) for c in r] for r in rows]
    if t <= rows[0][0]:
        return rows[0][1], rows[0][2]
    for a, b in zip(rows, rows[1:]):
        if t <= b[0]:
            s = (t - a[0]) / (b[0] - a[0])
            return a[1] + s * (b[1] - a[1]), a[2] + s * (b[2] - a[2])
    return rows[-1][1], rows[-1][2]


class Elements(HTMLParser):
    def __init__(self):
        super().__init__()
        self.items, self.body, self.errors, self._in_errors = [], {}, "", False

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == "body":
            self.body = a
        if a.get("id") == "script-errors":
            self._in_errors = True
        self.items.append((tag, a))

    def handle_endtag(self, tag):
        if tag == "pre":
            self._in_errors = False

    def handle_data(self, data):
        if self._in_errors:
            self.errors += data


def check_scene(items, scen, cert, t, live, problems):
    """items: (tag, attributes) of every element drawn."""
    def of(tag, cls):
        # Legend swatches carry the class they explain plus "swatch"; they are not drawn items.
        return [a for g, a in items
                if g == tag and cls in a.get("class", "").split() and "swatch" not in a.get("class", "").split()]

    mobile, fence = scen["sensors"], scen["fence"]
    disks = of("circle", "sensor")
    if len(disks) != len(mobile):
        problems.append(f"{len(disks)} circle.sensor, expected {len(mobile)} mobile sensors")
    scale = max(abs(float(num(f["at"][k]))) for f in fence for k in (0, 1)) + 1
    for d, s in zip(disks, mobile):
        x, y = along(s["track"], t)
        if abs(float(d["cx"]) - float(x)) > 1e-5 * scale or abs(float(d["cy"]) - float(y)) > 1e-5 * scale:
            problems.append(f"sensor {s['id']} drawn at ({d['cx']}, {d['cy']}), expected ({float(x)}, {float(y)})")
    if len(of("circle", "fence")) != len(fence):
        problems.append(f"{len(of('circle', 'fence'))} circle.fence, expected {len(fence)}")
    marks = of("circle", "intruder")
    if cert["method"] == "route":
        if len(marks) != 1:
            problems.append(f"{len(marks)} intruder markers, expected 1")
        else:
            x, y = along(cert["route"], t)
            m = marks[0]
            if abs(float(m["cx"]) - float(x)) > 1e-5 * scale or abs(float(m["cy"]) - float(y)) > 1e-5 * scale:
                problems.append(f"intruder at ({m['cx']}, {m['cy']}), expected ({float(x)}, {float(y)})")
        if len(of("polyline", "route")) != 1:
            problems.append("no polyline.route")
    elif marks:
        problems.append("an intruder marker on a certificate without a route")
    cells = len(of("rect", "live"))
    if live == "some" and cells == 0:
        problems.append("no rect.live drawn, expected live cells")
    if live == "none" and cells:
        problems.append(f"{cells} rect.live drawn, expected none")
    return f"{len(disks)} sensors, {len(marks)} intruder, {cells} live rectangles"


def main(argv):
    mode = argv[1]
    if mode == "slab-middle":
        slabs = load(argv[2])["slabs"]
        a, b = (num(x) for x in slabs[0 if argv[3] == "first" else -1]["t"])
        print((a + b) / 2 if argv[4] == "exact" else float((a + b) / 2))
        return 0
    path, scen, cert, t = argv[2], load(argv[3]), load(argv[4]), Fraction(argv[5])
    live = argv[7] if len(argv) > 7 and argv[6] == "--live" else None
    problems = []
    if mode == "dom":
        p = Elements()
        with open(path) as f:
            p.feed(f.read())
        if p.body.get("data-ready") != "1":
            problems.append("body has no data-ready=\"1\": the page did not finish its first render")
        if p.errors.strip():
            problems.append("script errors recorded: " + p.errors.strip())
        summary = check_scene(p.items, scen, cert, t, live, problems)
    else:
        root = ET.parse(path).getroot()  # raises on malformed XML
        ns = "{http://www.w3.org/2000/svg}"
        items = [(e.tag.replace(ns, ""), e.attrib) for e in root.iter()]
        summary = check_scene(items, scen, cert, t, live, problems)
        captions = " ".join("".join(e.itertext()) for e in root.iter(ns + "text"))
        if f"t = {argv[5]}" not in captions:
            problems.append(f"no caption naming t = {argv[5]}")
        if cert["claim"] == "evasion" and "Evasion possible" not in captions:
            problems.append("the caption does not state the claim")
        if cert["claim"] == "no-evasion" and "No evasion path" not in captions:
            problems.append("the caption does not state the claim")
    for q in problems:
        print(f"FAIL {path} at t = {argv[5]}: {q}")
    if not problems:
        print(f"ok   {path} at t = {argv[5]}: {summary}")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
