#!/usr/bin/env python3
"""Writes an invented positional sweep for the chamber benchmark.

A W x H hall, fence every 2 units (radius 1.5); a column of sensors (radius 1.5, y = 1, 3, ...)
crossing from x = 0 to x = W in W seconds with a waypoint every second; plus P patrollers on
random waypoint tracks (a waypoint every 5 s, steps of up to 5 units, seeded).
Usage: make_hall.py W H P SEED OUT.json [--no-column]
With --no-column only the patrollers move (a random patrol of a yard).
"""
import json
import random
import sys

W, H, P, SEED, OUT = int(sys.argv[1]), int(sys.argv[2]), int(sys.argv[3]), int(sys.argv[4]), sys.argv[5]
rng = random.Random(SEED)
pts = [(x, 0) for x in range(0, W, 2)] + [(W, y) for y in range(0, H, 2)] + \
      [(x, H) for x in range(W, 0, -2)] + [(0, y) for y in range(H, 0, -2)]
fence = [{"id": f"F{i}", "at": [str(x), str(y)], "radius": "1.5"} for i, (x, y) in enumerate(pts)]
column = "--no-column" not in sys.argv[6:]
sensors = [{"id": f"C{y}", "radius": "1.5", "track": [[str(t), str(t), str(y)] for t in range(W + 1)]}
           for y in range(1, H, 2)] if column else []
for p in range(P):
    x, y = rng.uniform(5, W - 5), rng.uniform(5, H - 5)
    track = []
    for t in range(0, W + 1, 5):
        track.append([str(t), f"{x:.2f}", f"{y:.2f}"])
        x = min(W - 1, max(1, x + rng.uniform(-5, 5)))
        y = min(H - 1, max(1, y + rng.uniform(-5, 5)))
    sensors.append({"id": f"P{p}", "radius": "1.5", "track": track})
json.dump({"format": "sweepcert-scenario-1", "title": f"Benchmark hall {W} x {H} (invented)",
           "horizon": ["0", str(W)], "fence": fence, "sensors": sensors}, open(OUT, "w"))
