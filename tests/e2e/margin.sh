#!/usr/bin/env bash
# Margins (schema §4.1.1) on the loading hall, end to end.
# Usage: margin.sh SWEEPCERT SWEEPCHECK CASES WORKDIR prover|checker
#   prover:  claims, exit codes and messages of `prove --margin`; every certificate is checked by
#            applying the margin by hand (a scenario file with the adjusted radii) and running
#            sweepcheck on a margin-free copy of the certificate against it.
#   checker: sweepcheck accepts the margin certificates against the original input, and rejects
#            a margin that is too large or on a cocycle.
#
# Geometry (cases/make_cases.py): fence disks of radius 3/2 every 2 units around the 20 x 10
# hall, consecutive centres exactly 2 apart; robots of radius 3/2 at heights 1, 3, 5, 7, 9 cross
# it on the line x = t during [0, 20]; column-gap lacks the robot at height 5.
# - Reduced by M, fence disks (and robots) 2 apart meet iff 2 <= 2 (3/2 - M): M <= 1/2. At
#   M = 1/4 (radius 5/4) the column still meets the fence: the lens of two fence disks at (2k, 0)
#   and (2k+2, 0) reaches height sqrt(25/16 - 1) = 3/4 at x = 2k+1, within 5/4 of the robot at
#   (t, 1) for |t - 2k - 1| <= 1. So column-sweep is safe at margin 1/4. At M = 3/5 the fence
#   opens (2 > 9/5); at M = 3/2 radii are 0.
# - column-gap reduced by any M has the gap between heights 3 and 7 (4 > 2 (3/2 - M)): never
#   safe. Enlarged by M, height 5 is 2 from the robots at 3 and 7 and 5 from the fence: clear iff
#   3/2 + M < 2, i.e. M < 1/2. So margin 1/4 gives a route (clearance 1/4), and at M = 1/2 the
#   enlarged disks touch at (t, 5): no route either way, undecided.
set -uo pipefail
prover=$1 checker=$2 cases=$3 work=$4/margin-$5 part=$5
mkdir -p "$work"
fail=0
ok() { echo "ok   $*"; }
bad() { echo "FAIL $*"; fail=1; }

# json_edit IN OUT PYTHON-STATEMENTS: edit the JSON document `d` (fractions via F).
json_edit() {
  python3 - "$1" "$2" "$3" <<'EOF'
import hashlib, json, sys
from fractions import Fraction as F
d = json.load(open(sys.argv[1]))
def sha(path): return hashlib.sha256(open(path, 'rb').read()).hexdigest()
def radii(delta):
    for s in d['fence'] + d['sensors']:
        q = F(s['radius']) + F(delta)
        s['radius'] = f"{q.numerator}/{q.denominator}"
exec(sys.argv[3])
json.dump(d, open(sys.argv[2], 'w'), indent=1)
EOF
}
# Prints the value of KEY in a certificate.
key_of() { python3 -c "import json,sys; print(json.load(open(sys.argv[1])).get(sys.argv[2], ''))" "$1" "$2"; }

# prove LABEL CASE EXIT [options...]: runs prove, checks the exit code and that a refusal
# writes nothing; leaves the certificate in $work/LABEL.json and messages in $work/LABEL.err.
prove() {
  local label=$1 input=$2 code=$3
  shift 3
  rm -f "$work/$label.json"
  "$prover" prove "$input" -o "$work/$label.json" --quiet "$@" 2> "$work/$label.err"
  local got=$?
  if [[ $got != "$code" ]]; then bad "$label: exit $got, expected $code: $(cat "$work/$label.err")"; return 1; fi
  if [[ $code != 0 && -e $work/$label.json ]]; then bad "$label: exit $code but a file was written"; return 1; fi
  return 0
}
# says LABEL TEXT: the error message of LABEL contains TEXT.
says() {
  if grep -qF -- "$2" "$work/$1.err"; then ok "$1: says '$2'"; else bad "$1: message lacks '$2': $(cat "$work/$1.err")"; fi
}
# holds_adjusted LABEL CASE DELTA: the certificate of LABEL, without its margin and bound to a
# scenario whose radii are changed by DELTA by hand, is accepted by sweepcheck.
holds_adjusted() {
  local label=$1 case=$2 delta=$3
  json_edit "$cases/$case.json" "$work/$label.adjusted.json" "radii('$delta')"
  json_edit "$work/$label.json" "$work/$label.plain.json" \
    "del d['margin']; d['input_sha256'] = sha('$work/$label.adjusted.json')"
  local out
  if out=$("$checker" "$work/$label.adjusted.json" "$work/$label.plain.json"); then
    ok "$label: holds with radii changed by $delta by hand; $(echo "$out" | tail -1)"
  else
    bad "$label: not valid with radii changed by $delta: $(echo "$out" | tail -1)"
  fi
}
# same_body A B: the two certificates agree on every key but the input binding, margin and notes.
same_body() {
  if python3 - "$work/$1.json" "$work/$2.json" <<'EOF'
import json, sys
a, b = (json.load(open(p)) for p in sys.argv[1:3])
for d in (a, b):
    for k in ('input_sha256', 'margin', 'notes'): d.pop(k, None)
sys.exit(a != b)
EOF
  then ok "$1 = $2 (proved on the adjusted file directly)"; else bad "$1 differs from $2"; fi
}

if [[ $part == prover ]]; then
  # Safe at margin 1/4 by sheet and by chambers; the certificate says so and carries the margin.
  if prove sweep-q "$cases/column-sweep.json" 0 --margin 1/4; then
    [[ $(key_of "$work/sweep-q.json" claim) == no-evasion && $(key_of "$work/sweep-q.json" method) == sheet ]] \
      && ok "sweep-q: no-evasion by sheet" || bad "sweep-q: not a sheet"
    [[ $(key_of "$work/sweep-q.json" margin) == 1/4 ]] && ok "sweep-q: margin 1/4 recorded" || bad "sweep-q: margin"
    grep -qF "up to 1/4 away from its stated position at every time" "$work/sweep-q.json" \
      && ok "sweep-q: summary states the margin" || bad "sweep-q: summary lacks the margin"
    holds_adjusted sweep-q column-sweep -1/4
    json_edit "$cases/column-sweep.json" "$work/sweep-reduced.json" "radii('-1/4')"
    prove sweep-reduced-direct "$work/sweep-reduced.json" 0 && same_body sweep-q sweep-reduced-direct
  fi
  if prove sweep-q-chambers "$cases/column-sweep.json" 0 --margin 1/4 --method chambers; then
    [[ $(key_of "$work/sweep-q-chambers.json" method) == chambers ]] && ok "sweep-q-chambers: chambers" \
      || bad "sweep-q-chambers: not chambers"
    holds_adjusted sweep-q-chambers column-sweep -1/4
  fi
  # The gap: a route at margin 1/4 that clears radii 7/4; the same as a route sought there directly.
  if prove gap-q "$cases/column-gap.json" 0 --margin 1/4; then
    [[ $(key_of "$work/gap-q.json" claim) == evasion && $(key_of "$work/gap-q.json" margin) == 1/4 ]] \
      && ok "gap-q: evasion with margin 1/4" || bad "gap-q: claim or margin"
    grep -qF "keeps clear of every disk even if each sensor is up to 1/4 away" "$work/gap-q.json" \
      && ok "gap-q: summary states the margin" || bad "gap-q: summary lacks the margin"
    holds_adjusted gap-q column-gap 1/4
    json_edit "$cases/column-gap.json" "$work/gap-grown.json" "radii('1/4')"
    prove gap-grown-direct "$work/gap-grown.json" 0 --method route && same_body gap-q gap-grown-direct
  fi
  # Undecided between the thresholds: exit 3, nothing written, both sides explained.
  prove gap-half "$cases/column-gap.json" 3 --margin 1/2 --rounds 1 &&
    says gap-half "no evasion is provable with radii reduced by 1/2, and no route keeps clear of radii increased by 1/2"
  # The reduced fence opens (M = 3/5) or vanishes (M = 3/2): no-evasion cannot be certified,
  # and the enlarged column leaves no route.
  prove sweep-open "$cases/column-sweep.json" 3 --margin 3/5 &&
    says sweep-open "fence gap: the disks of F0 and F1 do not meet"
  prove sweep-zero "$cases/column-sweep.json" 3 --margin 3/2 &&
    says sweep-zero "the radius of F0 is 0, not positive"
  # A failing sheet with a margin is no cocycle (cocycles carry no margin): undecided.
  prove gap-sheet "$cases/column-gap.json" 3 --margin 1/4 --method sheet && says gap-sheet "Only --method sheet"
  # Margin 0 writes exactly the certificate of old.
  if prove sweep-0 "$cases/column-sweep.json" 0 --margin 0 && prove sweep-none "$cases/column-sweep.json" 0; then
    cmp -s "$work/sweep-0.json" "$work/sweep-none.json" && ok "margin 0: same bytes as no margin" \
      || bad "margin 0 changed the certificate"
  fi
  # Usage errors: exit 2, nothing written.
  prove neg "$cases/column-sweep.json" 2 --margin -1/4 && says neg "--margin must be an exact number >= 0"
  prove word "$cases/column-sweep.json" 2 --margin wide && says word "--margin must be an exact number >= 0"
  prove zero-den "$cases/column-sweep.json" 2 --margin 1/0 && says zero-den "--margin must be an exact number >= 0"
  "$prover" contacts "$cases/column-sweep.json" --every 1/4 -o "$work/log.json" --quiet
  prove log-q "$work/log.json" 2 --margin 1/4 && says log-q "--margin needs positions"
  prove log-0 "$work/log.json" 0 --margin 0 && ok "log-0: margin 0 is allowed on a log"
  exit $fail
fi

# part == checker: the checker applies the margin itself (§4.1.1).
accepts() {
  local out
  if out=$("$checker" "$cases/$2.json" "$work/$1.json"); then ok "$1: $(echo "$out" | tail -1)"
  else bad "$1: sweepcheck said: $(echo "$out" | tail -1)"; fi
}
rejects() {  # rejects LABEL CASE TEXT...: exit 1, and the REJECTED line holds every TEXT
  local label=$1 case=$2 out code text
  shift 2
  out=$("$checker" "$cases/$case.json" "$work/$label.json" | grep '^REJECTED')
  code=${PIPESTATUS[0]}
  for text in "$@"; do
    if [[ $code != 1 ]] || ! grep -qF -- "$text" <<< "$out"; then
      bad "$label: exit $code, expected a rejection naming '$text': $out"; return
    fi
  done
  ok "$label: $out"
}
prove sweep-q "$cases/column-sweep.json" 0 --margin 1/4 && accepts sweep-q column-sweep
prove sweep-q-chambers "$cases/column-sweep.json" 0 --margin 1/4 --method chambers &&
  accepts sweep-q-chambers column-sweep
prove gap-q "$cases/column-gap.json" 0 --margin 1/4 && accepts gap-q column-gap
# Margin 3/5 opens the fence between F0 and F1 (2 > 2 * 9/10): the sheet proves nothing there.
json_edit "$work/sweep-q.json" "$work/sweep-wide.json" "d['margin'] = '3/5'"
rejects sweep-wide column-sweep F0 F1
# Margin 1/2 closes the gap (radius 2 at heights 3 and 7 touch at height 5): every route crossing
# the column's line meets a disk.
json_edit "$work/gap-q.json" "$work/gap-wide.json" "d['margin'] = '1/2'"
rejects gap-wide column-gap /route "rule 4.6.2"
# Cocycles may not carry a margin.
prove gap-cocycle "$cases/column-gap.json" 0 --method sheet
json_edit "$work/gap-cocycle.json" "$work/gap-cocycle-m.json" "d['margin'] = '1/4'"
rejects gap-cocycle-m column-gap /margin
exit $fail
