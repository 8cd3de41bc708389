#!/usr/bin/env python3
"""Round trip of `sweepcert import` on every bundled case.

For each cases/*.json: write its tracks and fence as CSV tables (rows of each sensor shuffled,
numbers in varied exact spellings, some fields quoted, CRLF line ends on every other case),
import them, and compare the produced scenario with the original exactly (ids, order, Fractions).
Then `sweepcert prove` both files and expect the same claim.

Usage: import_roundtrip.py SWEEPCERT CASES_DIR WORKDIR
"""
import glob
import os
import random
import sys

from exact_scenario import claim_of, fresh, load_scenario, run


def spell(q, rng):
    """One of several exact spellings of q (schema 1.1): a fraction, or a decimal when finite."""
    den, twos, fives = q.denominator, 0, 0
    while den % 2 == 0:
        den, twos = den // 2, twos + 1
    while den % 5 == 0:
        den, fives = den // 5, fives + 1
    if den == 1 and rng.random() < 0.6:
        digits = max(twos, fives)
        scaled = abs(q) * 10 ** digits  # an integer
        text = str(scaled.numerator).rjust(digits + 1, "0")
        body = text[:-digits] + "." + text[-digits:] if digits else text
        if rng.random() < 0.3:
            body = str(scaled.numerator) + "e-" + str(digits)  # e.g. 15e-1 for 3/2
        return ("-" if q < 0 else "") + body
    return f"{q.numerator}/{q.denominator}"


def field(text, rng):
    """A CSV field, quoted some of the time (and always when it must be)."""
    if any(c in text for c in ',"\r\n') or rng.random() < 0.3:
        return '"' + text.replace('"', '""') + '"'
    return text


def write_tables(sc, tracks_path, fence_path, rng, eol):
    lines = ["sensor,x,y,radius"]
    for i, x, y, r in sc["fence"]:
        lines.append(",".join(field(v, rng) for v in (i, spell(x, rng), spell(y, rng), spell(r, rng))))
    with open(fence_path, "w", newline="") as f:
        f.write(eol.join(lines) + eol)
    lines = ["sensor,t,x,y,radius"]
    for i, r, track in sc["sensors"]:
        rows = list(track)
        rng.shuffle(rows)
        for t, x, y in rows:
            lines.append(",".join(field(v, rng) for v in
                                  (i, spell(t, rng), spell(x, rng), spell(y, rng), spell(r, rng))))
    with open(tracks_path, "w", newline="") as f:
        f.write(eol.join(lines) + ("" if rng.random() < 0.5 else eol))  # final newline optional


def main():
    prover, cases_dir, work = sys.argv[1:4]
    os.makedirs(work, exist_ok=True)
    rng = random.Random(20261201)
    cases = sorted(glob.glob(os.path.join(cases_dir, "*.json")))
    assert cases, "no bundled cases found"
    failures = 0
    for n, case in enumerate(cases):
        name = os.path.basename(case)[:-5]
        sc = load_scenario(case)
        tracks = os.path.join(work, name + ".tracks.csv")
        fence = os.path.join(work, name + ".fence.csv")
        write_tables(sc, tracks, fence, rng, "\r\n" if n % 2 else "\n")
        out = fresh(os.path.join(work, name + ".imported.json"))
        h0, h1 = sc["horizon"]
        cmd = [prover, "import", tracks, "--fence", fence, "--horizon", f"{h0}:{h1}", "-o", out, "--quiet"]
        if sc["title"] is not None:
            cmd += ["--title", sc["title"]]
        run(cmd, expect_rc=0)
        got = load_scenario(out)
        if got != sc:
            for key in sc:
                if got[key] != sc[key]:
                    print(f"FAIL {name}: {key} differs:\n  got      {got[key]}\n  expected {sc[key]}")
            failures += 1
            continue
        claims = []
        for path in (case, out):
            cert = fresh(os.path.join(work, name + (".orig" if path == case else ".imp") + ".cert.json"))
            run([prover, "prove", path, "-o", cert, "--quiet"], expect_rc=0)
            claims.append(claim_of(cert))
        if claims[0] != claims[1]:
            print(f"FAIL {name}: original proves {claims[0]}, imported proves {claims[1]}")
            failures += 1
            continue
        print(f"ok   {name}: {len(sc['fence'])} fence, {len(sc['sensors'])} mobile sensors, "
              f"equal after import; both prove {claims[0]}")
    sys.exit(1 if failures else 0)


if __name__ == "__main__":
    main()
