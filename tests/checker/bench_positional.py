#!/usr/bin/env python3
"""Writes a large chamber certificate and a large route certificate for timing sweepcheck.

    tests/checker/bench_positional.py OUTDIR
    time build/release/checker/sweepcheck OUTDIR/wall.json OUTDIR/wall-chambers.json   # ACCEPTED
    time build/release/checker/sweepcheck OUTDIR/wall.json OUTDIR/wall-fine-chambers.json   # ACCEPTED
    time build/release/checker/sweepcheck OUTDIR/quiet.json OUTDIR/quiet-route.json    # ACCEPTED

wall.json: P = [0,128]^2 fenced every 2 units (256 fence sensors, radius 3/2); a wall of two
columns of 128 sensors each (radius 3/2, at y = j + 1/2) sweeps from x = 0 to x = 128 over
t = 0..127 (column A at x = t, column B at x = t + 1); 88 idle sensors far away: 600 sensors.
In slab [k, k+1] the unit cell [k, k+1] x [j, j+1] stays within 1.118 of A_j and
[k+1, k+2] x [j, j+1] within 1.118 of B_j. The certificate: Q = [0,256]^2, 127 slabs, P in
unit cells (depth 8), the quadrant east of P in outside cells of side 2, the rest one outside
cell each: 20482 cells a slab, 2.6 million in all. The live set is the region ahead of the wall
and dies in the last slab. wall-fine-chambers.json proves the same with the wall's two columns
in cells of side 1/8 (16384 covered cells a slab) and cells of side up to 8 elsewhere: 2.2
million cells, nearly all covered, so rule 4.5.1 does the work.

quiet.json: the same fence and 344 idle sensors far away; quiet-route.json stands near the
centre with 2001 rows, so rule 4.6.2 tests 600 sensors on 2000 pieces each (most pass the
integer box filter). tight.json puts the 344 sensors at (66, 64) with radius 1.7499, 1.75 from
the route's box: too close for the filter, so 688,000 pieces get the exact rational test
(tight-route.json is the same route).
"""
import hashlib
import json
import os
import sys

N = 128          # side of P
SLABS = N - 1    # wall positions t = 0 .. 127


def fence():
    pts = [(x, 0) for x in range(0, N, 2)] + [(N, y) for y in range(0, N, 2)] + \
          [(x, N) for x in range(N, 0, -2)] + [(0, y) for y in range(N, 0, -2)]
    return [{"id": "F%03d" % i, "at": [str(x), str(y)], "radius": "1.5"} for i, (x, y) in enumerate(pts)]


def idle(count, prefix):
    return [{"id": "%s%03d" % (prefix, i), "radius": "1", "track": [["0", str(1000 + 3 * i), "1000"]]}
            for i in range(count)]


def wall_scenario():
    sensors = []
    for j in range(N):
        y = "%d.5" % j
        sensors.append({"id": "A%03d" % j, "radius": "1.5", "track": [["0", "0", y], [str(SLABS), str(SLABS), y]]})
        sensors.append({"id": "B%03d" % j, "radius": "1.5", "track": [["0", "1", y], [str(SLABS), str(SLABS + 1), y]]})
    sensors += idle(600 - 2 * N - 2 * N, "Z")
    return {"format": "sweepcert-scenario-1", "title": "bench: a wall sweeps a 128 x 128 hall",
            "horizon": ["0", str(SLABS)], "fence": fence(), "sensors": sensors}


def uniform(depth, leaf):
    """Preorder tokens of a complete tree of `depth` levels over a box; leaf(i, j) at the bottom
    (i, j: column and row of the cell in that box's grid)."""
    out = []
    def rec(d, i, j):
        if d == depth:
            out.append(leaf(i, j))
            return
        out.append(-1)
        for di, dj in ((0, 0), (1, 0), (0, 1), (1, 1)):
            rec(d + 1, 2 * i + di, 2 * j + dj)
    rec(0, 0, 0)
    return out


def wall_certificate(sha):
    index = {}
    for j in range(N):
        index[("A", j)] = len(index)
        index[("B", j)] = len(index)
    table = ["%s%03d" % (c, j) for (c, j) in index]
    slabs = []
    for k in range(SLABS):
        def leaf(i, j, k=k):
            if i == k:
                return index[("A", j)]
            if i == k + 1:
                return index[("B", j)]
            return -2
        tree = [-1] + uniform(7, leaf) + uniform(6, lambda i, j: -3) + [-3, -3]
        slabs.append({"t": [str(k), str(k + 1)], "tree": tree})
    return {"format": "sweepcert-certificate-1", "claim": "no-evasion", "method": "chambers",
            "input_sha256": sha, "input_format": "sweepcert-scenario-1",
            "square": {"origin": ["0", "0"], "side": str(2 * N)}, "sensors": table, "slabs": slabs}


def fine_tree(k, index):
    """Slab [k, k+1]: P in units of 1/8 (P = [0, 1024]); the band x in [8k, 8k+16] (the wall's
    columns) in cells of side 1, the rest in open cells of side at most 64 (8 units)."""
    out = []
    def rec(x, y, s):
        band = x < 8 * k + 16 and x + s > 8 * k
        if s > 64 or (band and s > 1):
            out.append(-1)
            h = s // 2
            for dx, dy in ((0, 0), (h, 0), (0, h), (h, h)):
                rec(x + dx, y + dy, h)
        elif band:
            out.append(index[("A" if x // 8 == k else "B", y // 8)])
        else:
            out.append(-2)
    rec(0, 0, 8 * N)
    return out


def wall_fine_certificate(sha):
    cert = wall_certificate(sha)
    index = {}
    for j in range(N):
        index[("A", j)] = len(index)
        index[("B", j)] = len(index)
    for k, slab in enumerate(cert["slabs"]):
        slab["tree"] = [-1] + fine_tree(k, index) + uniform(6, lambda i, j: -3) + [-3, -3]
    return cert


def quiet_scenario(tight=False):
    sensors = idle(600 - 2 * N, "Z")
    if tight:
        for s in sensors:
            s["radius"] = "1.7499"
            s["track"] = [["0", "66", "64"]]
    return {"format": "sweepcert-scenario-1", "title": "bench: a quiet hall",
            "horizon": ["0", "2000"], "fence": fence(), "sensors": sensors}


def route_certificate(sha):
    rows = [[str(t), "64" if t % 2 == 0 else "64.25", "64" if t % 4 < 2 else "63.5"] for t in range(2001)]
    return {"format": "sweepcert-certificate-1", "claim": "evasion", "method": "route",
            "input_sha256": sha, "input_format": "sweepcert-scenario-1", "route": rows}


def write(path, doc):
    data = json.dumps(doc, separators=(",", ":")).encode()
    with open(path, "wb") as f:
        f.write(data)
    return hashlib.sha256(data).hexdigest()


def main():
    out = sys.argv[1] if len(sys.argv) > 1 else "."
    os.makedirs(out, exist_ok=True)
    sha = write(os.path.join(out, "wall.json"), wall_scenario())
    write(os.path.join(out, "wall-chambers.json"), wall_certificate(sha))
    write(os.path.join(out, "wall-fine-chambers.json"), wall_fine_certificate(sha))
    sha = write(os.path.join(out, "quiet.json"), quiet_scenario())
    write(os.path.join(out, "quiet-route.json"), route_certificate(sha))
    sha = write(os.path.join(out, "tight.json"), quiet_scenario(tight=True))
    write(os.path.join(out, "tight-route.json"), route_certificate(sha))


if __name__ == "__main__":
    main()
