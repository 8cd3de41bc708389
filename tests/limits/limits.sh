#!/usr/bin/env bash
# The §1.5 limits of schema/README.md, end to end: each over-limit file must make the program
# exit with code 2 within seconds (no crash, no signal, no unbounded memory) and a message
# naming the limit.
# Usage: limits.sh PROVER CHECKER CASES_DIR WORK_DIR TEST
#   TEST is one of the names below; `measure` runs them all under /usr/bin/time -v and prints
#   wall time and peak memory (the table in tests/limits/README.md).
set -uo pipefail
prover=$1 checker=$2 cases=$3 work=$4 test=$5
valid=$cases/static-cover.json
mkdir -p "$work"
if [[ ! -e $work/.made ]]; then
  python3 "$(dirname "$0")/make_limit_files.py" "$work" "$valid" && touch "$work/.made" || exit 1
fi
# The size limit: a sparse file of 1025 MiB (costs no disk; the programs must stat it, not read it).
[[ -e $work/huge.json ]] || truncate -s 1025M "$work/huge.json"

# expect NAME PATTERN HOW FILE: exit 2, stderr matching PATTERN, within 60 s; HOW is one of
# prove, check_input, check_cert below.
fail=0
expect() {
  local name=$1 pattern=$2
  local err=$work/$name.err code
  timeout 60 $($3 "$4") > /dev/null 2> "$err"
  code=$?
  if [[ $code != 2 ]]; then
    echo "FAIL $name: exit $code, expected 2 ($(head -c 300 "$err"))"; fail=1
  elif ! grep -qE "$pattern" "$err"; then
    echo "FAIL $name: message does not name the limit /$pattern/: $(head -c 300 "$err")"; fail=1
  else
    echo "ok   $name: $(head -c 200 "$err")"
  fi
}
# The over-limit file as sweepcert's input, as sweepcheck's INPUT, and as its CERT.
prove() { echo "$prover" prove "$1" -o "$work/unwritten.cert.json" --quiet; }
check_input() { echo "$checker" "$1" "$valid"; }
check_cert() { echo "$checker" "$valid" "$1"; }

run() {
  case $1 in
    depth) expect prover-depth 'depth limit' prove "$work/bomb.json"
           expect checker-input-depth 'depth limit' check_input "$work/bomb.json"
           expect checker-cert-depth 'depth limit' check_cert "$work/bomb.json" ;;
    length) expect prover-number 'length limit' prove "$work/scenario-long-number.json"
            expect prover-string 'length limit' prove "$work/scenario-long-string.json"
            expect checker-input-number 'length limit' check_input "$work/scenario-long-number.json"
            expect checker-input-string 'length limit' check_input "$work/scenario-long-string.json"
            expect checker-cert-number 'length limit' check_cert "$work/cert-long-number.json"
            expect checker-cert-string 'length limit' check_cert "$work/cert-long-string.json" ;;
    size) expect prover-size 'file size limit' prove "$work/huge.json"
          expect checker-input-size 'file size limit' check_input "$work/huge.json"
          expect checker-cert-size 'file size limit' check_cert "$work/huge.json" ;;
    counts) expect prover-sensors 'sensor limit' prove "$work/log-sensors.json"
            expect prover-frames 'frame limit' prove "$work/log-frames.json"
            expect checker-input-sensors 'sensor limit' check_input "$work/log-sensors.json"
            expect checker-input-frames 'frame limit' check_input "$work/log-frames.json"
            expect checker-cert-frames 'frame limit' check_cert "$work/cert-frames.json" ;;
    *) echo "unknown test $1"; exit 2 ;;
  esac
}

if [[ $test == measure ]]; then
  # Every command of every test again, timed: "name | wall s | peak RSS MiB".
  expect() {
    local name=$1
    /usr/bin/time -v $($3 "$4") > /dev/null 2> "$work/$name.time"
    awk -v n="$name" '/Elapsed \(wall clock\)/ {w=$NF} /Maximum resident set size/ {m=$NF}
      END {printf "| %s | %s | %.1f |\n", n, w, m/1024}' "$work/$name.time"
  }
  echo "| command | wall (m:ss) | peak RSS (MiB) |"
  echo "|---|---|---|"
  for t in depth length size counts; do run "$t"; done
  exit 0
fi
run "$test"
exit $fail
