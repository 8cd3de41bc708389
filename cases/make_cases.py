#!/usr/bin/env python3
"""Writes the invented example sweeps in this folder (run from anywhere; idempotent).

Every scenario is made up: rooms, halls and yards of invented size. Expected claims are in
cases/README.md and are asserted by tests/e2e.
"""
import json
import os

HERE = os.path.dirname(os.path.abspath(__file__))


def rectangle_fence(width, height, spacing, radius, prefix="F"):
    """Fence sensors every `spacing` units around [0,width]x[0,height], counter-clockwise."""
    pts = []
    for x in range(0, width, spacing):
        pts.append((x, 0))
    for y in range(0, height, spacing):
        pts.append((width, y))
    for x in range(width, 0, -spacing):
        pts.append((x, height))
    for y in range(height, 0, -spacing):
        pts.append((0, y))
    return [{"id": f"{prefix}{i}", "at": [str(x), str(y)], "radius": radius}
            for i, (x, y) in enumerate(pts)]


def write(name, title, horizon, fence, sensors):
    doc = {"format": "sweepcert-scenario-1", "title": title, "horizon": horizon,
           "fence": fence, "sensors": sensors}
    with open(os.path.join(HERE, name), "w") as f:
        json.dump(doc, f, indent=1)
        f.write("\n")


def static(id_, x, y, r="3/2"):
    return {"id": id_, "radius": r, "track": [["0", str(x), str(y)]]}


# A pump room, 8 x 8, with nine fixed sensors on a 2-unit grid inside: fully covered.
grid = [static(f"P{x}{y}", x, y) for x in (2, 4, 6) for y in (2, 4, 6)]
write("static-cover.json", "Pump room, fixed sensors (invented)", ["0", "60"],
      rectangle_fence(8, 8, 2, "3/2"), grid)
# The same room with the centre sensor offline: a hole around (4, 4).
write("static-hole.json", "Pump room, centre sensor offline (invented)", ["0", "60"],
      rectangle_fence(8, 8, 2, "3/2"), [s for s in grid if s["id"] != "P44"])

# A loading hall, 20 x 10: a column of five robots crosses from x = 0 to x = 20 in 20 s.
column = [{"id": f"R{y}", "radius": "3/2", "track": [["0", "0", str(y)], ["20", "20", str(y)]]}
          for y in (1, 3, 5, 7, 9)]
write("column-sweep.json", "Loading hall, robot column sweep (invented)", ["0", "20"],
      rectangle_fence(20, 10, 2, "3/2"), column)
# The same sweep with the middle robot missing: a gap at height 5.
write("column-gap.json", "Loading hall, middle robot missing (invented)", ["0", "20"],
      rectangle_fence(20, 10, 2, "3/2"), [s for s in column if s["id"] != "R5"])
