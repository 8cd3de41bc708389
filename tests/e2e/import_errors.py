#!/usr/bin/env python3
"""`sweepcert import` on small hand-written tables of an invented depot (4 x 4, fence disks of
radius 5/2 at the corners, one patrol robot).

Each malformed table must give exit 2, a message naming the file, line and column (or the
produced scenario's JSON pointer) and what is wrong, and no output file. The accepted variants
(reordered header, RFC 4180 quoting, CRLF, trailing blank lines) must produce the scenario
written out by hand below.

Usage: import_errors.py SWEEPCERT WORKDIR
"""
import os
import sys
from fractions import Fraction as F

from exact_scenario import fresh, load_scenario, run

FENCE = "sensor,x,y,radius\nF0,0,0,5/2\nF1,4,0,5/2\nF2,4,4,5/2\nF3,0,4,5/2\n"
TRACKS = "sensor,t,x,y,radius\nR1,10,3,2,1\nR1,0,1,2,1\nR1,5,2,3.5,1\n"
# The depot by hand: rows of R1 sorted by time, numbers as Fractions.
EXPECTED = {
    "title": "Depot",
    "horizon": [F(0), F(10)],
    "fence": [("F0", F(0), F(0), F(5, 2)), ("F1", F(4), F(0), F(5, 2)),
              ("F2", F(4), F(4), F(5, 2)), ("F3", F(0), F(4), F(5, 2))],
    "sensors": [("R1", F(1), [(F(0), F(1), F(2)), (F(5), F(2), F(7, 2)), (F(10), F(3), F(2))])],
}

failures = 0


def check(label, ok, detail=""):
    global failures
    print(("ok   " if ok else "FAIL ") + label + ("" if ok else ": " + detail))
    failures += 0 if ok else 1


def attempt(work, label, tracks, fence=FENCE, horizon="0:10"):
    """Writes the tables, imports them; returns (rc, stderr, output path)."""
    tp, fp = os.path.join(work, label + ".tracks.csv"), os.path.join(work, label + ".fence.csv")
    for path, text in ((tp, tracks), (fp, fence)):
        with open(path, "w", newline="") as f:
            f.write(text)
    out = fresh(os.path.join(work, label + ".json"))
    rc, _, err = run([PROVER, "import", tp, "--fence", fp, "--horizon", horizon, "-o", out,
                      "--title", "Depot", "--quiet"])
    return rc, err, out, tp, fp


def refused(work, label, tracks, needles, **kw):
    rc, err, out, tp, fp = attempt(work, label, tracks, **kw)
    needles = [n.replace("TRACKS", tp).replace("FENCE", fp) for n in needles]
    missing = [n for n in needles if n not in err]
    written = os.path.exists(out) or os.path.exists(out + ".partial")
    check(f"{label}: exit 2, message, nothing written", rc == 2 and not missing and not written,
          f"rc={rc} written={written} missing {missing} in: {err.strip()}")


def accepted(work, label, tracks, expected=EXPECTED, **kw):
    rc, err, out, _, _ = attempt(work, label, tracks, **kw)
    got = load_scenario(out) if rc == 0 else None
    check(f"{label}: accepted, equal to the hand-written depot", rc == 0 and got == expected,
          f"rc={rc} {err.strip()} got {got}")


def main():
    global PROVER
    PROVER, work = sys.argv[1], sys.argv[2]
    os.makedirs(work, exist_ok=True)
    accepted(work, "plain", TRACKS)
    # Columns in another order; the same scenario.
    accepted(work, "reordered-header", "radius,y,sensor,x,t\n1,2,R1,3,10\n1,2,R1,1,0\n1,3.5,R1,2,5\n")
    # Quoting: a quoted id with a comma, a doubled quote and a line break; CRLF; blank lines.
    odd_id = 'R,"1"\nb'
    quoted = ('sensor,t,x,y,radius\r\n"R,""1""\nb",10,3,2,1\r\n"R,""1""\nb","0",1,2,"1"\r\n'
              '"R,""1""\nb",5,2,"7/2",1\r\n\r\n\r\n')
    accepted(work, "quoting-crlf", quoted,
             dict(EXPECTED, sensors=[(odd_id,) + EXPECTED["sensors"][0][1:]]))
    accepted(work, "no-final-newline", TRACKS.rstrip("\n"))

    refused(work, "missing-column", "sensor,t,x,y\nR1,0,1,2\n",
            ['TRACKS:1:1', 'missing column "radius"'])
    refused(work, "duplicate-column", "sensor,t,x,x,radius\nR1,0,1,2,1\n",
            [f'TRACKS:1:{"sensor,t,x,x,radius".rindex("x") + 1}', 'column "x" appears twice'])
    refused(work, "unknown-column", "sensor,t,x,y,radius,speed\nR1,0,1,2,1,3\n",
            [f'TRACKS:1:{"sensor,t,x,y,radius,speed".index("speed") + 1}', 'unknown column "speed"'])
    refused(work, "empty-column-name", "sensor,t,,x,y,radius\nR1,0,,1,2,1\n",
            ['TRACKS:1:10', 'empty column name'])
    refused(work, "inconsistent-radius", "sensor,t,x,y,radius\nR1,0,1,2,1\nR1,5,2,3,1\nR1,10,3,2,6/5\n",
            ['TRACKS:4:', 'radius 6/5 here but 1 on line 2'])
    refused(work, "bad-number", "sensor,t,x,y,radius\nR1,0,1,2,1\nR1,5,2.5.1,3,1\n",
            ['TRACKS:3:6', 'column "x"', '"2.5.1"'])
    refused(work, "bad-fence-number", TRACKS, ['FENCE:3:6', 'column "y"', '"1/0"', 'zero denominator'],
            fence=FENCE.replace("F1,4,0", "F1,4,1/0"))
    refused(work, "unterminated-quote", 'sensor,t,x,y,radius\nR1,0,1,2,1\nR1,5,"2,3,1\nR1,10,3,2,1\n',
            ['TRACKS:3:6', 'unterminated quoted field'])
    refused(work, "text-after-quote", 'sensor,t,x,y,radius\nR1,0,"1"x,2,1\n',
            ['TRACKS:2:9', 'text after the closing quote'])
    refused(work, "wrong-field-count", "sensor,t,x,y,radius\nR1,0,1,2,1\nR1,5,2,3\n",
            ['TRACKS:3:1', 'row has 4 fields, the header has 5'])
    refused(work, "duplicate-time", "sensor,t,x,y,radius\nR1,5,1,2,1\nR1,0,1,2,1\nR1,10/2,2,3,1\n",
            ['TRACKS:4', 'two rows at t = 5 (lines 2 and 4)'])
    refused(work, "fence-gap", TRACKS, ['/fence/2 of the produced scenario (FENCE:4)', 'fence gap',
                                        'F1 and F2'],
            fence=FENCE.replace("F1,4,0,5/2", "F1,4,-2,5/2"))
    refused(work, "self-crossing-fence", TRACKS, ['of the produced scenario (FENCE:', 'not simple'],
            fence="sensor,x,y,radius\nF0,0,0,3\nF1,4,4,3\nF2,4,0,3\nF3,0,4,3\n")  # a bow tie
    refused(work, "nonpositive-radius", "sensor,t,x,y,radius\nR1,0,1,2,0\n",
            ['/sensors/0/radius of the produced scenario (TRACKS:2)', 'radius must be positive'])
    refused(work, "mobile-repeats-fence-id", "sensor,t,x,y,radius\nF2,0,1,2,1\n",
            ['TRACKS:2:1', '"F2" is also a fence id (FENCE line 4)'])
    refused(work, "empty-horizon", TRACKS, ['/horizon/1 of the produced scenario (--horizon)', 'after its start'],
            horizon="10:10")
    refused(work, "bad-horizon", TRACKS, ['--horizon must be START:END'], horizon="0-10")
    sys.exit(1 if failures else 0)


if __name__ == "__main__":
    main()
