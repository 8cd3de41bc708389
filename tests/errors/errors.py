#!/usr/bin/env python3
"""Exit-2 messages of both programs name the file and place and the rule (schema/README.md §5).

Bad JSON syntax must give the file, line and column; an invalid scenario or contact log must
give the JSON pointer of the offending value and what rule it breaks. Every case runs through
`sweepcert prove` and through `sweepcheck` (as INPUT, and for syntax errors also as CERT).
Usage: errors.py SWEEPCERT SWEEPCHECK CASES_DIR WORK_DIR
"""
import copy
import json
import re
import subprocess
import sys
from pathlib import Path

prover, checker, cases, work = sys.argv[1], sys.argv[2], Path(sys.argv[3]), Path(sys.argv[4])
work.mkdir(parents=True, exist_ok=True)
valid = cases / "static-cover.json"
scenario = json.loads(valid.read_text())
log = {"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], "sensors": ["A"],
       "triangles": "listed",
       "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"], ["A", "F0"]],
                   "triples": []}]}
failures = 0


def run(name, argv, patterns):
    """Runs argv; expects exit 2 and stderr matching every regular expression in `patterns`."""
    global failures
    done = subprocess.run(argv, capture_output=True, text=True, timeout=60)
    message = done.stderr.strip()
    missing = [p for p in patterns if not re.search(p, message)]
    if done.returncode != 2 or missing:
        failures += 1
        print(f"FAIL {name}: exit {done.returncode}, missing {missing}: {message[:300]}")
    else:
        print(f"ok   {name}: {message[:200]}")


def both(name, text, patterns, as_cert=False):
    """`text` as input of both programs (and as certificate of sweepcheck if `as_cert`, for
    syntax errors). sweepcert names the file in every message; sweepcheck names it with line
    and column for bad syntax, and otherwise says INPUT and the pointer (its INPUT is argv[1])."""
    path = work / (name + ".json")
    path.write_text(text)
    file_pattern = re.escape(str(path))
    run(f"sweepcert {name}", [prover, "prove", str(path), "-o", str(work / "unwritten.json"), "--quiet"],
        [file_pattern] + patterns)
    run(f"sweepcheck INPUT {name}", [checker, str(path), str(valid)],
        ["INPUT " + (file_pattern + ": line" if as_cert else "/")] + patterns)
    if as_cert:
        run(f"sweepcheck CERT {name}", [checker, str(valid), str(path)], ["CERT " + file_pattern] + patterns)


def edited(doc, edit):
    d = copy.deepcopy(doc)
    edit(d)
    return json.dumps(d, indent=1)


# Syntax: the place of the offending character as line and column.
both("missing-comma", '{"format": "sweepcert-scenario-1",\n "horizon":\n  [12 3],\n "fence": []}\n',
     [r"line 3, column 7", r"syntax error.*array"], as_cert=True)
both("bad-literal", '{\n "format": tru,\n "horizon": []}', [r"line 2, column 1[0-9]", r"literal"], as_cert=True)
both("unterminated", '{"format": "sweepcert-scenario-1",\n "horizon": [\n', [r"line 3, column 1", r"end of input"],
     as_cert=True)
both("trailing-text", '{}\n\n  x', [r"line 3, column 3", r"syntax error"], as_cert=True)
both("empty", "", [r"line 1, column 1", r"end of input"], as_cert=True)

# An invalid scenario: pointer and rule.
both("negative-radius", edited(scenario, lambda d: d["fence"][2].update(radius="-1")),
     [r"/fence/2/radius", r"radius", r"(> 0|positive)"])
both("duplicate-id", edited(scenario, lambda d: d["fence"][3].update(id="F0")),
     [r"/fence/3/id", r"duplicate sensor id"])
both("unknown-key", edited(scenario, lambda d: d["fence"][1].update(colour="red")),
     [r"/fence/1/colour", r"unknown key"])
both("missing-horizon", edited(scenario, lambda d: d.pop("horizon")), [r"horizon", r"missing"])
both("horizon-order", edited(scenario, lambda d: d.update(horizon=["5", "5"])), [r"/horizon/1", r"horizon end"])
both("bad-number", edited(scenario, lambda d: d["fence"][0]["at"].__setitem__(0, "1.")),
     [r"/fence/0/at/0", r"(number|decimal)"])
both("fence-gap", edited(scenario, lambda d: d["fence"][1].update(radius="1/100")),
     [r"/fence/[12]", r"fence gap"])
both("track-order", edited(scenario, lambda d: d["sensors"][0]["track"].append(copy.deepcopy(d["sensors"][0]["track"][0]))),
     [r"/sensors/0/track/[0-9]+/0", r"(increase|strictly)"])

# An invalid contact log: pointer and rule.
both("log-unknown-id", edited(log, lambda d: d["frames"][0]["pairs"].append(["B", "F1"])),
     [r"/frames/0/pairs/4/0", r"unknown"])
both("log-self-pair", edited(log, lambda d: d["frames"][0]["pairs"].append(["A", "A"])),
     [r"/frames/0/pairs(/4)?", r"(identical|two different)"])
both("log-fence-gap", edited(log, lambda d: d["frames"][0]["pairs"].pop(1)),
     [r"/frames/0/pairs", r"fence"])
both("log-triple-without-pair", edited(log, lambda d: d["frames"][0]["triples"].append(["A", "F0", "F1"])),
     [r"/frames/0/triples/0", r"pair"])
both("log-time-order", edited(log, lambda d: d["frames"].append(copy.deepcopy(d["frames"][0]))),
     [r"/frames/1/t", r"(increase|strictly)"])
both("log-duplicate-key", '{"format": "sweepcert-contacts-1", "fence": [], "fence": []}',
     [r"/fence", r"duplicate"])

print(f"{failures} failure(s)")
sys.exit(1 if failures else 0)
