#!/usr/bin/env bash
# `sweepcert report --svg T`: standalone snapshots parse as XML and draw what they should
# (report_check.py svg: sensors at T, fence, intruder at the route's position at T, live cells in
# the first chambers slab and none in the last, caption with T and the claim) for a sheet, a
# route and a chambers certificate; and bad input exits 2, says what is wrong, writes nothing.
# Usage: report_svg.sh SWEEPCERT CASES_DIR WORKDIR
set -uo pipefail
prover=$1 cases=$2 work=$3
here=$(cd "$(dirname "$0")" && pwd)
mkdir -p "$work"
fail=0

for name in column-sweep column-gap pocket-wall; do
  "$prover" prove "$cases/$name.json" -o "$work/$name.cert.json" --quiet || { echo "FAIL prove $name"; exit 1; }
done
snap() {  # snap NAME T [--live some|none]
  local name=$1 t=$2
  shift 2
  local out="$work/$name.t${t//\//_}.svg"
  if ! "$prover" report "$cases/$name.json" "$work/$name.cert.json" --svg "$t" -o "$out" > /dev/null; then
    echo "FAIL report --svg $t on $name"; fail=1; return
  fi
  python3 "$here/report_check.py" svg "$out" "$cases/$name.json" "$work/$name.cert.json" "$t" "$@" || fail=1
}
snap column-sweep 7
snap column-gap 23/4
snap column-gap 20
snap pocket-wall "$(python3 "$here/report_check.py" slab-middle "$work/pocket-wall.cert.json" first exact)" --live some
snap pocket-wall "$(python3 "$here/report_check.py" slab-middle "$work/pocket-wall.cert.json" last exact)" --live none

refused() {  # refused LABEL EXPECTED-TEXT ARGS...: exit 2, the message names the problem, no file
  local label=$1 text=$2
  shift 2
  local out="$work/refused.html" err
  rm -f "$out"
  err=$("$prover" report "$@" -o "$out" 2>&1 >/dev/null)
  local code=$?
  if [[ $code -ne 2 ]]; then echo "FAIL $label: exit $code, expected 2"; fail=1
  elif [[ $err != *"$text"* ]]; then echo "FAIL $label: message '$err' lacks '$text'"; fail=1
  elif compgen -G "$work/refused.html*" > /dev/null; then echo "FAIL $label: wrote a file"; fail=1
  else echo "ok   $label: $err"; fi
}
"$prover" contacts "$cases/column-gap.json" --every 1 -o "$work/column-gap.log.json" --quiet
refused "certificate of another input" "/input_sha256: does not match the SHA-256 of" \
  "$cases/pocket-wall.json" "$work/column-gap.cert.json"
refused "contact log input" "has no positions to draw" "$work/column-gap.log.json" "$work/column-gap.cert.json"
refused "T after the horizon" "lies outside the horizon [0, 20]" \
  "$cases/column-gap.json" "$work/column-gap.cert.json" --svg 41/2
refused "T not a number" "--svg T needs an exact number" \
  "$cases/column-gap.json" "$work/column-gap.cert.json" --svg soon
refused "missing certificate" "cannot open file" "$cases/column-gap.json" "$work/none.cert.json"
exit $fail
