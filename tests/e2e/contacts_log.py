#!/usr/bin/env python3
"""`sweepcert contacts` against a derivation written here from schema/README.md alone.

Listed mode, on three bundled cases and on random scenarios (fixed seeds): frame times are
START + k*DT below END, every waypoint time strictly inside the horizon, and END (sorted, no
repeats); a pair is present iff |c_i - c_j|^2 <= (r_i + r_j)^2; a triple iff its three closed
disks share a point, decided by `disks_share_point` below (exact, Fractions only).
Pairs-only mode: pairs iff |c_i - c_j|^2 <= R^2, no triples, and the metadata
{"from-pairs": {"contact-range": R, "sensing-radius": smallest radius}}. Every exported log is
also proved by `sweepcert prove` and the certificate checked by `sweepcheck`.
Refusals: a range with 3 r^2 < R^2 for some sensor, a range shorter than a fence edge, and the
two options without each other.

Usage: contacts_log.py SWEEPCERT SWEEPCHECK CASES_DIR WORKDIR
"""
import itertools
import json
import os
import random
import sys
from fractions import Fraction as F

from exact_scenario import claim_of, disks, exact, fresh, load_json, load_scenario, position, run

failures = 0


def check(label, ok, detail=""):
    global failures
    print(("ok   " if ok else "FAIL ") + label + ("" if ok else ": " + detail))
    failures += 0 if ok else 1


# --- Exact test: do three closed disks share a point? ------------------------------------------
#
# Argument. Let D1, D2, D3 be closed disks and L = D1 ∩ D2 (convex, compact). If L is empty the
# answer is no. Otherwise let q be the point of L nearest c3; D1 ∩ D2 ∩ D3 is non-empty iff
# |q - c3| <= r3 (any common point p has |p - c3| <= r3 and |q - c3| <= |p - c3|). Where is q?
#  (a) c3 ∈ L: q = c3. Otherwise q lies on the boundary of L, so on the circle of D1 or of D2:
#  (b) q on the circle of D1 and inside the open disk D2: near q, L coincides with D1, so q is a
#      local, hence (convexity) global, nearest point of D1 to c3: q = c1 + r1 (c3 - c1)/|c3 - c1|.
#  (c) the same with D1 and D2 exchanged.
#  (d) q on both circles: q is one of the (at most two) circle intersection points.
# So the disks share a point iff one of these candidates — the centres, the point of each disk
# nearest each other centre, and the pairwise circle intersection points — lies in all three
# (the converse is trivial: a candidate in all three is a common point). Candidates involve one
# square root; each is written a + b*sqrt(s) with rational vectors a, b and rational s >= 0,
# and membership |a + b sqrt(s) - c|^2 <= r^2 becomes u + v sqrt(s) <= 0 with rational u, v,
# decided by sign analysis (squaring only when u and v have opposite signs).

def le_zero(u, v, s):
    """u + v*sqrt(s) <= 0, exactly, for rationals u, v and s >= 0."""
    if v == 0 or s == 0:
        return u <= 0
    if v < 0:
        return u <= 0 or v * v * s >= u * u   # u > 0: need |v| sqrt(s) >= u
    return u < 0 and v * v * s <= u * u       # v > 0: need u < 0 and v sqrt(s) <= -u


def in_disk(cand, c, r):
    (ax, ay), (bx, by), s = cand
    dx, dy = ax - c[0], ay - c[1]
    u = dx * dx + dy * dy + (bx * bx + by * by) * s - r * r
    v = 2 * (dx * bx + dy * by)
    return le_zero(u, v, s)


def candidates(cs, rs):
    zero = (F(0), F(0))
    for c in cs:                                       # (a) the centres
        yield (c, zero, F(0))
    for i, k in itertools.permutations(range(3), 2):   # (b), (c) nearest point of disk i to c_k
        dx, dy = cs[k][0] - cs[i][0], cs[k][1] - cs[i][1]
        s = dx * dx + dy * dy
        if s:  # c_i + r_i (d / sqrt(s)) = c_i + (r_i / s) d sqrt(s)
            yield (cs[i], (rs[i] * dx / s, rs[i] * dy / s), s)
    for i, j in itertools.combinations(range(3), 2):   # (d) circle intersection points
        dx, dy = cs[j][0] - cs[i][0], cs[j][1] - cs[i][1]
        s = dx * dx + dy * dy
        if not s:
            continue
        along = (s + rs[i] ** 2 - rs[j] ** 2) / (2 * s)   # foot m = c_i + along * d
        h2 = rs[i] ** 2 - along * along * s               # squared half-chord
        if h2 < 0:
            continue
        m = (cs[i][0] + along * dx, cs[i][1] + along * dy)
        for sign in (1, -1):  # m ± (h / sqrt(s)) * perp(d), h / sqrt(s) = sqrt(h2 / s)
            yield (m, (-sign * dy, sign * dx), h2 / s)


def disks_share_point(cs, rs):
    return any(all(in_disk(cand, cs[n], rs[n]) for n in range(3)) for cand in candidates(cs, rs))


def self_test():
    """Hand-derived triples for the three-disk test."""
    one = F(1)
    # Unit disks at the corners of an equilateral triangle of side 2 would need radius 2/sqrt(3)
    # > 1 to share a point: side 2, radius 1 gives pairwise touching but no common point.
    h = [(F(0), F(0)), (F(2), F(0)), (F(1), F(0))]
    assert disks_share_point(h, [one, one, one])          # collinear: (1, 0) is common
    tri = [(F(0), F(0)), (F(2), F(0)), (F(1), F(17, 10))]  # height 1.7 < sqrt(3)
    assert not disks_share_point(tri, [one, one, one])    # pairs meet (distance 2, sqrt(3.89))
    # Radius 7/6 > 2/sqrt(3) ~ 1.1547: the circumcentre (1, 1/sqrt(3)) is common.
    eq = [(F(0), F(0)), (F(2), F(0)), (F(1), F(1732051, 1000000))]
    r = F(7, 6)
    assert disks_share_point(eq, [r, r, r])
    assert not disks_share_point(eq, [F(115, 100)] * 3)   # 1.15 < 2/sqrt(3)
    # The lens corner case: a small disk touching exactly the intersection point (0, 3) of the
    # circles of radius 5 around (-4, 0) and (4, 0).
    corner = [(F(-4), F(0)), (F(4), F(0)), (F(0), F(4))]
    assert disks_share_point(corner, [F(5), F(5), F(1)])
    assert not disks_share_point(corner, [F(5), F(5), F(99, 100)])


# --- Expected logs -----------------------------------------------------------------------------

def frame_times(sc, dt):
    t0, t1 = sc["horizon"]
    times = set()
    t = t0
    while t < t1:
        times.add(t)
        t += dt
    for _, _, track in sc["sensors"]:
        times.update(row[0] for row in track if t0 < row[0] < t1)
    times.add(t1)
    return sorted(times)


def pairwise_triples(ids, pairs):
    """Every three ids (in list order) whose three pairs are all in `pairs`."""
    near = {i: {j for p in pairs if i in p for j in p if j != i} for i in ids}
    pos = {i: n for n, i in enumerate(ids)}
    for a in ids:
        later = sorted((j for j in near[a] if pos[j] > pos[a]), key=pos.get)
        for b, e in itertools.combinations(later, 2):
            if e in near[b]:
                yield (a, b, e)


def expected_frames(sc, dt, contact_range=None):
    ds = disks(sc)
    frames = []
    for t in frame_times(sc, dt):
        c = {i: position(track, t) for i, _, track in ds}
        r = {i: rad for i, rad, _ in ds}

        def d2(a, b):
            return (c[a][0] - c[b][0]) ** 2 + (c[a][1] - c[b][1]) ** 2
        ids = [i for i, _, _ in ds]
        if contact_range is None:
            pairs = {frozenset((a, b)) for a, b in itertools.combinations(ids, 2) if d2(a, b) <= (r[a] + r[b]) ** 2}
        else:
            pairs = {frozenset((a, b)) for a, b in itertools.combinations(ids, 2) if d2(a, b) <= contact_range ** 2}
        triples = None
        if contact_range is None:
            triples = {frozenset(x) for x in pairwise_triples(ids, pairs)
                       if disks_share_point([c[i] for i in x], [r[i] for i in x])}
        frames.append((t, pairs, triples))
    return frames


def compare_log(label, log_path, sc, dt, contact_range=None):
    log = load_json(log_path)
    want = expected_frames(sc, dt, contact_range)
    problems = []
    if log["fence"] != [f[0] for f in sc["fence"]] or log["sensors"] != [s[0] for s in sc["sensors"]]:
        problems.append("fence or sensor lists differ")
    if contact_range is None:
        if log["triangles"] != "listed":
            problems.append(f"triangles {log['triangles']!r}, expected 'listed'")
    else:
        meta = log["triangles"].get("from-pairs", {})
        rs = min(r for _, r, _ in disks(sc))
        if set(log["triangles"]) != {"from-pairs"} or exact(meta.get("contact-range")) != contact_range \
                or exact(meta.get("sensing-radius")) != rs:
            problems.append(f"metadata {log['triangles']}, expected range {contact_range}, radius {rs}")
    got_t = [exact(fr["t"]) for fr in log["frames"]]
    if got_t != [w[0] for w in want]:
        problems.append(f"frame times {got_t[:5]}..., expected {[w[0] for w in want][:5]}...")
    else:
        for fr, (t, pairs, triples) in zip(log["frames"], want):
            if {frozenset(p) for p in fr["pairs"]} != pairs or len(fr["pairs"]) != len(pairs):
                problems.append(f"pairs differ at t = {t}")
            if triples is None and "triples" in fr:
                problems.append(f"pairs-only frame at t = {t} lists triples")
            if triples is not None and ({frozenset(x) for x in fr["triples"]} != triples
                                        or len(fr["triples"]) != len(triples)):
                problems.append(f"triples differ at t = {t}")
    check(f"{label}: log equals the independent derivation ({len(want)} frames)", not problems,
          "; ".join(problems[:5]))
    return want


def prove_and_check(label, log_path, work):
    cert = fresh(os.path.join(work, os.path.basename(log_path)[:-5] + ".cert.json"))
    rc, _, err = run([PROVER, "prove", log_path, "-o", cert, "--quiet"])
    if rc != 0:
        check(f"{label}: prove on the log", False, err.strip())
        return
    rc, out, _ = run([CHECKER, log_path, cert])
    check(f"{label}: prove on the log gives {claim_of(cert)}, checker accepts", rc == 0,
          out.strip().splitlines()[-1] if out.strip() else "")


def export(scenario_path, log_path, *extra, expect_rc=0):
    return run([PROVER, "contacts", scenario_path, "-o", fresh(log_path), "--quiet", *extra],
               expect_rc=expect_rc)


# --- Random scenarios --------------------------------------------------------------------------

def random_yard(seed):
    """A yard 12 x 8 with a fence every 2 units (radius 3/2) and seven robots of assorted
    radii (5/4 to 2, so that 3 r^2 >= 4 and a contact range of 2 is admissible) wandering on
    rational tracks; dense enough that some triples meet pairwise only."""
    rng = random.Random(seed)
    ring = [(x, 0) for x in range(0, 12, 2)] + [(12, y) for y in range(0, 8, 2)] + \
           [(x, 8) for x in range(12, 0, -2)] + [(0, y) for y in range(8, 0, -2)]
    fence = [{"id": f"W{k}", "at": [str(x), str(y)], "radius": "3/2"} for k, (x, y) in enumerate(ring)]

    def q(lo, hi, den):
        return str(F(rng.randint(lo * den, hi * den), den))
    sensors = []
    for k in range(7):
        times = sorted(set(F(rng.randint(0, 40), 4) for _ in range(rng.randint(1, 4))))
        sensors.append({"id": f"bot{k}", "radius": str(F(rng.randint(10, 16), 8)),
                        "track": [[str(t), q(1, 11, 3), q(1, 7, 3)] for t in times]})
    return {"format": "sweepcert-scenario-1", "title": f"Random yard {seed}",
            "horizon": ["0", "10"], "fence": fence, "sensors": sensors}


def main():
    global PROVER, CHECKER
    PROVER, CHECKER, cases, work = sys.argv[1:5]
    os.makedirs(work, exist_ok=True)
    self_test()
    print("ok   three-disk test agrees with the hand-derived examples")

    # Listed mode on bundled cases.
    for name, dt in (("static-hole", F(5)), ("column-sweep", F(1, 4)), ("pocket-wall", F(1, 2))):
        path = os.path.join(cases, name + ".json")
        log = os.path.join(work, f"{name}.listed.json")
        export(path, log, "--every", str(dt))
        compare_log(f"{name} listed every {dt}", log, load_scenario(path), dt)

    # Listed mode on random yards; the derivation must have met both kinds of triple.
    pairwise_only = true_triples = 0
    for seed in (1, 2, 3):
        path = os.path.join(work, f"yard-{seed}.json")
        with open(path, "w") as f:
            json.dump(random_yard(seed), f, indent=1)
        log = os.path.join(work, f"yard-{seed}.listed.json")
        dt = F(1, 3)
        export(path, log, "--every", str(dt))
        want = compare_log(f"random yard {seed} listed every {dt}", log, load_scenario(path), dt)
        prove_and_check(f"random yard {seed} listed", log, work)
        for _, pairs, triples in want:
            true_triples += len(triples)
            ids = sorted({i for p in pairs for i in p})
            pairwise_only += sum(1 for x in pairwise_triples(ids, pairs) if frozenset(x) not in triples)
    check(f"random yards exercise both outcomes ({true_triples} triples, {pairwise_only} "
          f"pairwise-only)", true_triples > 0 and pairwise_only > 0)

    # Pairs-only mode.
    for name, path, rng_, dt in (("column-sweep", os.path.join(cases, "column-sweep.json"), F(5, 2), F(1, 4)),
                                 ("random yard 1", os.path.join(work, "yard-1.json"), F(2), F(1, 3))):
        log = os.path.join(work, name.replace(" ", "-") + ".pairs.json")
        export(path, log, "--every", str(dt), "--pairs-only", "--contact-range", str(rng_))
        compare_log(f"{name} pairs-only within {rng_}", log, load_scenario(path), dt, rng_)
        prove_and_check(f"{name} pairs-only", log, work)

    # Refusals: nothing written, exit 2, the message names the sensor or pair and the numbers.
    static = os.path.join(cases, "static-hole.json")
    log = os.path.join(work, "refused.json")
    # Every disk there has radius 3/2: 3 r^2 = 27/4 < 9 = 3^2; the first sensor is F0.
    for extra, needles in (
            (["--pairs-only", "--contact-range", "3"],
             ["sensor F0 of radius 3/2", "3*r^2 = 27/4 < R^2 = 9", "Jung"]),
            (["--pairs-only", "--contact-range", "3/2"],  # fence every 2 units: 4 > 9/4
             ["consecutive fence sensors F0 and F1", "squared distance 4 > R^2 = 9/4", "fence gap"]),
            (["--pairs-only"], ["--pairs-only and --contact-range R go together"]),
            (["--contact-range", "2"], ["--pairs-only and --contact-range R go together"])):
        rc, _, err = export(static, log, "--every", "1", *extra, expect_rc=None)
        missing = [n for n in needles if n not in err]
        written = os.path.exists(log) or os.path.exists(log + ".partial")
        check(f"refuses {' '.join(extra)}", rc == 2 and not missing and not written,
              f"rc={rc} written={written} missing {missing} in {err.strip()}")
    # Radii differ in a random yard: the first sensor with 3 r^2 < R^2 is named.
    yard = load_scenario(os.path.join(work, "yard-2.json"))
    rmin_id, rmin = min(((i, r) for i, r, _ in disks(yard)), key=lambda p: p[1])
    too_long = F(rmin.numerator * 2, rmin.denominator)  # R = 2 r_min: 3 r_min^2 < 4 r_min^2
    first = next(i for i, r, _ in disks(yard) if 3 * r * r < too_long ** 2)
    rc, _, err = export(os.path.join(work, "yard-2.json"), log, "--every", "1", "--pairs-only",
                        "--contact-range", str(too_long), expect_rc=None)
    check(f"refuses range {too_long} in random yard 2 naming {first}",
          rc == 2 and f"sensor {first} of radius" in err and not os.path.exists(log), err.strip())
    sys.exit(1 if failures else 0)


if __name__ == "__main__":
    main()
