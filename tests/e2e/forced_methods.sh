#!/usr/bin/env bash
# Forced methods and the undecided exit code.
set -uo pipefail
prover=$1 checker=$2 cases=$3 work=$4
mkdir -p "$work"
fail=0
expect() {  # expect NAME EXIT_CODE CLAIM METHOD-ARGS...
  local name=$1 code=$2 claim=$3
  shift 3
  local cert="$work/forced.$name.$*.json"
  cert=${cert// /_}
  rm -f "$cert"
  "$prover" prove "$cases/$name.json" -o "$cert" --quiet "$@" 2> "$cert.err"
  local got=$?
  if [[ $got != "$code" ]]; then echo "FAIL $name $*: exit $got, expected $code"; cat "$cert.err"; fail=1; return; fi
  if [[ $code != 0 ]]; then
    if [[ -e $cert ]]; then echo "FAIL $name $*: a certificate was written"; fail=1; return; fi
    echo "ok   $name $*: exit $code, $(head -2 "$cert.err" | tail -1)"
    return
  fi
  local got_claim
  got_claim=$(grep -o '"claim": "[a-z-]*"' "$cert" | cut -d'"' -f4)
  if [[ $got_claim != "$claim" ]]; then echo "FAIL $name $*: claim $got_claim"; fail=1; return; fi
  if "$checker" "$cases/$name.json" "$cert" > "$cert.check"; then
    echo "ok   $name $*: $claim; $(tail -1 "$cert.check")"
  else
    echo "FAIL $name $*: $(tail -1 "$cert.check")"; fail=1
  fi
}
expect column-sweep 0 no-evasion --method chambers
expect static-cover 0 no-evasion --method chambers
expect pocket-wall 0 no-evasion --method chambers
expect column-gap 0 evasion --method route
expect static-hole 0 evasion --method route
# A hole cannot be proved safe, and a full cover offers no route: undecided, exit 3, no file.
expect static-hole 3 - --method chambers --rounds 1
expect static-cover 3 - --method route --rounds 1
exit $fail
