#!/usr/bin/env python3
"""Writes the over-limit files of tests/limits (schema/README.md §1.5) into a directory.

Each file breaks exactly one limit and is as small as that allows; the 1 GiB file is made
sparse by limits.sh with truncate, so it costs no disk.
"""
import json
import sys
from pathlib import Path

out = Path(sys.argv[1])
out.mkdir(parents=True, exist_ok=True)
case = json.loads(Path(sys.argv[2]).read_text())  # a valid scenario to put fields into
digits = "7" * 2_000_000


def scenario_with_radius(raw):
    """The case with the first fence radius replaced by the raw JSON text `raw`."""
    doc = dict(case)
    doc["fence"] = [dict(f) for f in case["fence"]]
    doc["fence"][0]["radius"] = "@@"
    return json.dumps(doc).replace('"@@"', raw)


cert_head = '{"format": "sweepcert-certificate-1", "claim": "no-evasion", "method": "sheet", '
files = {
    # 200,000 open brackets and nothing else: the depth limit must stop the reader at 65.
    "bomb.json": "[" * 200_000,
    "scenario-long-number.json": scenario_with_radius(digits),
    "scenario-long-string.json": scenario_with_radius('"' + digits + '"'),
    "cert-long-number.json": cert_head + '"frames": [' + digits + "]}",
    "cert-long-string.json": cert_head + '"frames": ["' + digits + '"]}',
    # 3 fence ids and 1,000,000 mobile ids: one more than the sensor limit.
    "log-sensors.json": json.dumps({
        "format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"],
        "sensors": ["s%d" % i for i in range(1_000_000)], "triangles": "listed",
        "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]], "triples": []}]}),
    # 1,000,001 frames; their contents do not matter, the count is checked first.
    "log-frames.json": '{"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], '
                       '"triangles": "listed", "frames": [' + ",".join(["0"] * 1_000_001) + "]}",
    "cert-frames.json": cert_head + '"frames": [' + ",".join(["0"] * 1_000_001) + "]}",
}
for name, text in files.items():
    (out / name).write_text(text)
