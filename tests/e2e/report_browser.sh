#!/usr/bin/env bash
# Browser test of `sweepcert report` pages: headless chromium (Debian package chromium) renders
# each page at two times given in the URL fragment and dumps the DOM; report_check.py checks the
# ready flag, that no script error was recorded, the sensors' and intruder's drawn positions and
# the live cells. (a) a route certificate (column-gap: evasion), (b) a chambers certificate
# (pocket-wall: no-evasion): live cells in the first slab, none in the last (its live set is
# empty, schema §4.5 rule 4).
# Usage: report_browser.sh SWEEPCERT CASES_DIR WORKDIR   (exit 77: skipped, no chromium)
set -euo pipefail
prover=$1 cases=$2 work=$3
here=$(cd "$(dirname "$0")" && pwd)
browser=${CHROMIUM-$(command -v chromium || true)}  # CHROMIUM= (empty) forces the skip path
if [[ -z $browser ]]; then
  echo "SKIP: chromium is not installed (scripts/install-deps.sh installs the Debian package chromium)"
  exit 77
fi
mkdir -p "$work"
work=$(cd "$work" && pwd)
profile=$(mktemp -d "$work/chromium-profile.XXXXXX")
trap 'rm -rf "$profile"' EXIT
fail=0

render() {  # render NAME T [--live some|none]: dump the DOM of NAME.html at #t=T and check it
  local name=$1 t=$2
  shift 2
  local dom="$work/$name.t$t.dom.html"
  timeout 120 "$browser" --headless --no-sandbox --disable-gpu --user-data-dir="$profile" \
    --dump-dom "file://$work/$name.html#t=$t" > "$dom" 2> "$dom.log" || true
  [[ -s $dom ]] || { echo "chromium wrote no DOM for $name at t = $t; its log ends:"; tail -5 "$dom.log"; }
  python3 "$here/report_check.py" dom "$dom" "$cases/$name.json" "$work/$name.cert.json" "$t" "$@" || fail=1
}

for name in column-gap pocket-wall; do
  "$prover" prove "$cases/$name.json" -o "$work/$name.cert.json" --quiet
  "$prover" report "$cases/$name.json" "$work/$name.cert.json" -o "$work/$name.html"
done
render column-gap 2.5
render column-gap 11.25
render pocket-wall "$(python3 "$here/report_check.py" slab-middle "$work/pocket-wall.cert.json" first decimal)" --live some
render pocket-wall "$(python3 "$here/report_check.py" slab-middle "$work/pocket-wall.cert.json" last decimal)" --live none
exit $fail
