#!/usr/bin/env bash
# Sheet benchmark on a large contact log of lattice walkers (see bench/README.md).
#
#   bench/run_sheet_bench.sh [SWEEPCERT] [SWEEPCHECK] [GEN_CONTACTS]
#
# Defaults: build/release/prover/sweepcert, build/release/checker/sweepcheck, and
# build/release/tests/reference/gen_contacts (compiled here with g++ if missing).
# Environment: N (1200), BOX (240), FRAMES (240), RANGE (9.5), SEED (1),
#              WORK (build/bench): where the log, certificates and outputs go.
set -euo pipefail

root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
prover="${1:-$root/build/release/prover/sweepcert}"
checker="${2:-$root/build/release/checker/sweepcheck}"
gen="${3:-$root/build/release/tests/reference/gen_contacts}"
N="${N:-1200}"; BOX="${BOX:-240}"; FRAMES="${FRAMES:-240}"; RANGE="${RANGE:-9.5}"; SEED="${SEED:-1}"
WORK="${WORK:-$root/build/bench}"
mkdir -p "$WORK"

for b in "$prover" "$checker"; do
  [[ -x "$b" ]] || { echo "run_sheet_bench: not executable: $b" >&2; exit 2; }
done
[[ -x /usr/bin/time ]] || { echo "run_sheet_bench: /usr/bin/time missing (apt-get install time)" >&2; exit 2; }
if [[ ! -x "$gen" ]]; then
  gen="$WORK/gen_contacts"
  echo "compiling gen_contacts -> $gen"
  g++ -std=c++17 -O2 -o "$gen" "$root/tests/tools/gen_contacts.cpp"
fi

log="$WORK/walkers_n${N}_box${BOX}_f${FRAMES}_r${RANGE}_s${SEED}.json"
echo "== generating $log"
"$gen" walkers --n "$N" --box "$BOX" --frames "$FRAMES" --range "$RANGE" --seed "$SEED" \
  -o "$log" 2> "$WORK/gen.err"
cat "$WORK/gen.err"
echo "log size: $(stat -c %s "$log") bytes"

rows=()
# timed NAME OUTFILE CMD...: runs CMD under /usr/bin/time -v; sets rc, wall, rss.
timed() {
  local name="$1" out="$2"; shift 2
  set +e
  /usr/bin/time -v -o "$WORK/$name.time" "$@" > "$out" 2>&1
  rc=$?
  set -e
  wall="$(sed -n 's/^[[:space:]]*Elapsed (wall clock) time (h:mm:ss or m:ss): //p' "$WORK/$name.time")"
  rss="$(sed -n 's/^[[:space:]]*Maximum resident set size (kbytes): //p' "$WORK/$name.time")"
}

for ring in z2 z; do
  cert="$WORK/cert_$ring.json"
  rm -f "$cert"
  echo "== sweepcert prove --ring $ring"
  timed "prove_$ring" "$WORK/prove_$ring.out" "$prover" prove "$log" -o "$cert" --ring "$ring"
  tail -n 5 "$WORK/prove_$ring.out"
  size="-"; claim="-"
  if [[ -f "$cert" ]]; then
    size="$(stat -c %s "$cert")"
    claim="$(grep -o '"claim"[[:space:]]*:[[:space:]]*"[a-z-]*"' "$cert" | head -n 1 | sed 's/.*"\([a-z-]*\)"$/\1/')"
  fi
  rows+=("$(printf '%-22s %4s %12s %12s %14s  %s' "sweepcert prove ($ring)" "$rc" "$wall" "$rss" "$size" "$claim")")
  if [[ -f "$cert" ]]; then
    echo "== sweepcheck (ring $ring)"
    timed "check_$ring" "$WORK/check_$ring.out" "$checker" "$log" "$cert"
    tail -n 1 "$WORK/check_$ring.out"
    verdict="$(grep -o '^\(ACCEPTED\|REJECTED\)' "$WORK/check_$ring.out" | tail -n 1 || true)"
    rows+=("$(printf '%-22s %4s %12s %12s %14s  %s' "sweepcheck ($ring)" "$rc" "$wall" "$rss" "-" "${verdict:--}")")
  fi
done

echo
echo "log: $log ($(stat -c %s "$log") bytes); $(grep '2-cells' "$WORK/gen.err")"
printf '%-22s %4s %12s %12s %14s  %s\n' "step" "exit" "wall" "maxRSS(kB)" "cert(bytes)" "result"
printf '%s\n' "${rows[@]}"
