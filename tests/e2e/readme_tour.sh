#!/usr/bin/env bash
# Runs the README's five-minute tour exactly as written (the first ```sh block under
# "## A five-minute tour"), with `bin` pointing at this build, in a scratch copy of cases/.
# Every command must succeed; the certificates it writes must carry the claims the tour states.
# Usage: readme_tour.sh REPO_ROOT BUILD_DIR WORKDIR
set -euo pipefail
root=$1 build=$2 work=$3
rm -rf "$work" && mkdir -p "$work" && cp -r "$root/cases" "$work/cases"
script=$(awk '/^## A five-minute tour/{t=1} t&&/^```sh/{f=1;next} f&&/^```/{exit} f{print}' "$root/README.md")
[[ -n $script ]] || { echo "FAIL: no tour block found in README.md"; exit 1; }
script=${script//bin=build\/release/bin=$build}
cd "$work"
bash -euo pipefail -c "$script" > tour.out 2>&1 || { cat tour.out; echo "FAIL: the tour stopped"; exit 1; }
claim() { python3 -c 'import json,sys; print(json.load(open(sys.argv[1]))["claim"])' "$1"; }
expect() {
  local got; got=$(claim "$1")
  [[ $got == "$2" ]] || { echo "FAIL: $1 claims $got, the tour says $2"; exit 1; }
}
expect tour/yard.cert.json no-evasion
expect tour/yard.m.cert.json no-evasion
expect tour/aisle.cert.json evasion
expect tour/pocket.cert.json no-evasion
expect tour/yard.log.cert.json no-evasion
expect tour/hall.pairs.cert.json no-evasion
expect tour/yard-from-csv.cert.json no-evasion
grep -q '"margin": "1/4"' tour/yard.m.cert.json || { echo "FAIL: margin not recorded"; exit 1; }
[[ $(grep -c '^ACCEPTED' tour.out) -eq 7 ]] || { cat tour.out; echo "FAIL: expected 7 ACCEPTED lines (one per sweepcheck run)"; exit 1; }
for f in tour/yard.html tour/aisle.html tour/pocket.html tour/aisle-15.svg; do
  [[ -s $f ]] || { echo "FAIL: $f missing"; exit 1; }
done
echo "ok: the README tour runs as written ($(grep -c . <<<"$script") lines)"
