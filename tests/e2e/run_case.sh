#!/usr/bin/env bash
# End-to-end: prove a bundled case and check every certificate with the independent checker.
#  - positional, --method sheet, both rings: expect SHEET_CLAIM (no-evasion or no-sheet);
#  - positional, default method (auto: sheet, else chambers, else route): expect AUTO_CLAIM;
#  - the contact log exported every 1/4 s, both rings: expect SHEET_CLAIM.
# Usage: run_case.sh SWEEPCERT SWEEPCHECK CASE.json SHEET_CLAIM AUTO_CLAIM WORKDIR
set -euo pipefail
prover=$1 checker=$2 case=$3 sheet_claim=$4 auto_claim=$5 work=$6
name=$(basename "$case" .json)
mkdir -p "$work"
fail=0

claim_of() { grep -o '"claim": "[a-z-]*"' "$1" | head -1 | cut -d'"' -f4; }
method_of() { grep -o '"method": "[a-z-]*"' "$1" | head -1 | cut -d'"' -f4; }

run() {  # run LABEL INPUT EXPECTED [prove options...]
  local label=$1 input=$2 expected=$3
  shift 3
  local cert="$work/$name.$label.cert.json"
  "$prover" prove "$input" -o "$cert" --quiet "$@"
  local got
  got=$(claim_of "$cert")
  if [[ $got != "$expected" ]]; then
    echo "FAIL $name $label: claim $got, expected $expected"; fail=1; return
  fi
  local out
  if out=$("$checker" "$input" "$cert"); then
    echo "ok   $name $label: $got by $(method_of "$cert"); $(echo "$out" | tail -1)"
  else
    echo "FAIL $name $label: checker said: $(echo "$out" | tail -1)"; fail=1
  fi
}

"$prover" contacts "$case" --every 1/4 -o "$work/$name.log.json" --quiet
for ring in z z2; do
  run "positional-sheet-$ring" "$case" "$sheet_claim" --method sheet --ring "$ring"
  run "log-$ring" "$work/$name.log.json" "$sheet_claim" --ring "$ring"
done
run positional-auto "$case" "$auto_claim"
exit $fail
