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

# A depot yard at night, 24 x 12: four guards with radius-2 lamps walk abreast at heights 1.5,
# 4.5, 7.5 and 10.5 from the west fence to the east fence, stopping at x = 12 for a two-second
# vehicle check. A floodlight stands at the gate side, (22, 6). Neighbouring guards are 3 apart
# (< 2 + 2) and the outer guards are 1.5 from the fence line (< 2 + 3/2), so the line of lamps
# always joins the south fence to the north fence: nothing crosses it, and it ends on the east
# fence. Expected: no evasion, by a sheet.
guards = [{"id": f"G{k}", "radius": "2",
           "track": [["0", "0", y], ["12", "12", y], ["14", "12", y], ["26", "24", y]]}
          for k, y in enumerate(("3/2", "9/2", "15/2", "21/2"), start=1)]
write("depot-yard-night.json", "Depot yard at night, four guards walking abreast (invented)",
      ["0", "26"], rectangle_fence(24, 12, 2, "3/2"),
      guards + [{"id": "L1", "radius": "2", "track": [["0", "22", "6"]]}])

# A warehouse aisle, 30 x 4: one floor robot with a radius-3 scanner drives down the middle
# (y = 2) to x = 15 and turns back. The far end is never scanned: the point (27, 2) is at
# distance sqrt(1 + 4) > 3/2 from the nearest fence sensors (26, 0) and (28, 0) and at least
# 12 > 3 from the robot. Expected: evasion (standing still there is a route); no sheet.
write("warehouse-aisle-patrol.json", "Warehouse aisle, robot turns back halfway (invented)",
      ["0", "30"], rectangle_fence(30, 4, 2, "3/2"),
      [{"id": "A1", "radius": "3", "track": [["0", "0", "2"], ["15", "15", "2"], ["30", "0", "2"]]}])

# A border corridor, 40 x 8: two drones with radius 5/2 fly east along y = 2 and y = 6, the
# northern one two seconds behind. Their centres are sqrt(2^2 + 4^2) = sqrt(20) < 5 apart, and
# each is 2 from its fence line (< 5/2 + 3/2), so the pair always spans the corridor.
# Expected: no evasion, by a sheet.
def drone(id_, y, start):
    return {"id": id_, "radius": "5/2",
            "track": [[str(start), "0", y], [str(start + 40), "40", y]]}


write("border-corridor.json", "Border corridor, two drones flying staggered (invented)",
      ["0", "42"], rectangle_fence(40, 8, 2, "3/2"), [drone("D1", "2", 0), drone("D2", "6", 2)])
# The same corridor with the northern drone six seconds behind: centres sqrt(6^2 + 4^2) = sqrt(52)
# > 5 apart, so a gap opens between the two disks and an intruder slips through it.
# Expected: evasion.
write("border-corridor-late.json", "Border corridor, second drone six seconds late (invented)",
      ["0", "46"], rectangle_fence(40, 8, 2, "3/2"), [drone("D1", "2", 0), drone("D2", "6", 6)])


# The depot yard again as the CSV tables a fleet tool might export (rows of a sensor in any
# order), for `sweepcert import`; the imported scenario equals depot-yard-night.json.
def write_csv(name, header, rows):
    os.makedirs(os.path.join(HERE, "csv"), exist_ok=True)
    with open(os.path.join(HERE, "csv", name), "w", newline="") as f:
        f.write(",".join(header) + "\n")
        for row in rows:
            f.write(",".join(row) + "\n")


write_csv("depot-yard-night.tracks.csv", ["sensor", "t", "x", "y", "radius"],
          [[s["id"], t, x, y, s["radius"]] for s in guards for (t, x, y) in reversed(s["track"])]
          + [["L1", "0", "22", "6", "2"]])
write_csv("depot-yard-night.fence.csv", ["sensor", "x", "y", "radius"],
          [[f["id"], f["at"][0], f["at"][1], f["radius"]] for f in rectangle_fence(24, 12, 2, "3/2")])
