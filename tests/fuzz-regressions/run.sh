#!/usr/bin/env bash
# Replays every input kept in this directory (findings of scripts/fuzz.sh, once fixed) through
# the sweepcheck binary: it must end with exit 1 (rejected) or 2 (unreadable), never 0, a
# crash, a signal or a sanitizer report.
#   NAME.pair   a two-part input of fuzz_certificate / fuzz_check: INPUT, a NUL byte, CERT. The
#               CERT's input_sha256 is set to the INPUT's hash first, so the replay gets as far
#               as the fuzz target did.
#   NAME.json   a one-part input (fuzz_json, fuzz_scenario, fuzz_contacts): checked as INPUT
#               (with a valid certificate) and as CERT (with a valid input).
# Usage: run.sh SWEEPCHECK CASES_DIR WORK_DIR
set -uo pipefail
checker=$1 cases=$2 work=$3
here=$(cd "$(dirname "$0")" && pwd)
mkdir -p "$work"
valid_input=$cases/static-cover.json
fail=0 count=0
replay() {  # replay LABEL INPUT CERT
  local code
  "$checker" "$2" "$3" > "$work/out" 2> "$work/err"
  code=$?
  if [[ $code == 1 || $code == 2 ]] && ! grep -q 'runtime error\|Sanitizer' "$work/err"; then
    echo "ok   $1: exit $code: $(tail -n 1 "$work/out" "$work/err" | grep -v '^==>' | grep . | head -n 1 | head -c 160)"
  else
    echo "FAIL $1: exit $code"; head -c 2000 "$work/err"; fail=1
  fi
  count=$((count + 1))
}
shopt -s nullglob
for f in "$here"/*.pair; do
  name=$(basename "$f")
  python3 - "$f" "$work/$name.input" "$work/$name.cert" <<'PY'
import hashlib, re, sys
data = open(sys.argv[1], "rb").read()
cut = data.index(b"\0")
inp, cert = data[:cut], data[cut + 1:]
cert = re.sub(rb'("input_sha256"\s*:\s*")[0-9a-f]{64}(")',
              lambda m: m.group(1) + hashlib.sha256(inp).hexdigest().encode() + m.group(2), cert, count=1)
open(sys.argv[2], "wb").write(inp)
open(sys.argv[3], "wb").write(cert)
PY
  replay "$name" "$work/$name.input" "$work/$name.cert"
done
for f in "$here"/*.json; do
  name=$(basename "$f")
  replay "$name as INPUT" "$f" "$valid_input"
  replay "$name as CERT" "$valid_input" "$f"
done
echo "$count replays"
((count > 0)) || { echo "FAIL: no regression inputs found"; fail=1; }
exit $fail
