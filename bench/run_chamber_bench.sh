#!/usr/bin/env bash
# Chamber/route benchmark: a 200 x 50 hall swept by a 25-sensor column with 60 patrollers
# (decide no-evasion by chambers), and two random patrols of a 100 x 60 yard (40 and 120
# patrollers). Times `prove --method chambers` / `prove`, `sweepcheck` and `report` (the hall's
# page); prints a table.
# Usage: bench/run_chamber_bench.sh [SWEEPCERT] [SWEEPCHECK]
set -uo pipefail
cd "$(dirname "$0")/.."
prover=${1:-build/release/prover/sweepcert}
checker=${2:-build/release/checker/sweepcheck}
work=${WORK:-build/bench}
mkdir -p "$work"
python3 bench/make_hall.py 200 50 60 1 "$work/hall.json"
python3 bench/make_hall.py 100 60 40 2 "$work/patrol40.json" --no-column
python3 bench/make_hall.py 100 60 120 3 "$work/patrol120.json" --no-column
printf '%-34s %6s %9s %10s %10s  %s\n' step exit "wall s" "max RSS MB" "cert MB" result
row() {  # row LABEL OUT CERT CMD...
  local label=$1 out=$2 cert=$3
  shift 3
  /usr/bin/time -f "%e %M" -o "$out.time" "$@" > "$out" 2>&1
  local code=$?
  read -r wall rss < "$out.time"
  local size=-
  [[ -f $cert ]] && size=$(awk -v b="$(stat -c %s "$cert")" 'BEGIN{printf "%.1f", b/1048576}')
  printf '%-34s %6s %9s %10.0f %10s  %s\n' "$label" "$code" "$wall" "$((rss / 1024))" "$size" \
    "$(grep -E '^claim:|^ACCEPTED|^REJECTED|undecided|^wrote' "$out" | head -1 | cut -c1-60)"
}
row "prove hall (chambers)" "$work/hall.prove.out" "$work/hall.cert.json" \
  "$prover" prove "$work/hall.json" -o "$work/hall.cert.json" --method chambers
row "check hall" "$work/hall.check.out" "" "$checker" "$work/hall.json" "$work/hall.cert.json"
row "report hall (HTML page)" "$work/hall.report.out" "$work/hall.html" \
  "$prover" report "$work/hall.json" "$work/hall.cert.json" -o "$work/hall.html"
row "prove hall (auto)" "$work/hall.auto.out" "$work/hall.auto.json" \
  "$prover" prove "$work/hall.json" -o "$work/hall.auto.json"
for p in patrol40 patrol120; do
  row "prove $p (auto)" "$work/$p.prove.out" "$work/$p.cert.json" \
    "$prover" prove "$work/$p.json" -o "$work/$p.cert.json"
  row "check $p" "$work/$p.check.out" "" "$checker" "$work/$p.json" "$work/$p.cert.json"
done
