#!/usr/bin/env bash
# End-to-end: prove a bundled case (positional, and as a contact log exported every 1/4 s) over
# both rings, check every certificate with the independent checker, and compare claims.
# Usage: run_case.sh SWEEPCERT SWEEPCHECK CASE.json EXPECTED_CLAIM WORKDIR
set -euo pipefail
prover=$1 checker=$2 case=$3 expected=$4 work=$5
name=$(basename "$case" .json)
mkdir -p "$work"
fail=0

claim_of() { grep -o '"claim": "[a-z-]*"' "$1" | head -1 | cut -d'"' -f4; }

"$prover" contacts "$case" --every 1/4 -o "$work/$name.log.json" --quiet
for input in "$case" "$work/$name.log.json"; do
  kind=positional
  [[ $input == *.log.json ]] && kind=log
  for ring in z z2; do
    cert="$work/$name.$kind.$ring.cert.json"
    "$prover" prove "$input" -o "$cert" --ring "$ring" --method sheet --quiet
    got=$(claim_of "$cert")
    if [[ $got != "$expected" ]]; then
      echo "FAIL $name $kind $ring: claim $got, expected $expected"; fail=1; continue
    fi
    if out=$("$checker" "$input" "$cert"); then
      echo "ok   $name $kind $ring: $got; $(echo "$out" | tail -1)"
    else
      echo "FAIL $name $kind $ring: checker said: $(echo "$out" | tail -1)"; fail=1
    fi
  done
done
exit $fail
