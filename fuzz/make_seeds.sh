#!/usr/bin/env bash
# Makes the seed corpora of the fuzz targets from cases/ (nothing here is committed):
#   scenario/     the bundled scenarios, and each cut to its first second (short seeds run fast)
#   contacts/     contact logs exported from them every 1/4 s
#   certificate/  INPUT, a NUL byte, CERT: every certificate `sweepcert prove` writes for them
#                 (auto, forced methods, both rings; scenario and log inputs)
#   json/         every file above, alone
# plus the small hand-written seeds of fuzz/seeds/<target>/. Seeds over MAX_BYTES (default
# 65536, the fuzzers' -max_len) are left out, and so are INPUT+CERT pairs over 24 KiB: under
# the sanitizers they take seconds per run (the full pocket-wall cocycles over 10 s, the
# fuzzers' hang limit). Identical seeds are kept once.
# Usage: make_seeds.sh SWEEPCERT_BINARY OUT_DIR [MAX_BYTES]
set -euo pipefail
prover=$1 out=$2 max_bytes=${3:-65536}
here=$(cd "$(dirname "$0")" && pwd)
cases=$here/../cases
rm -rf "$out"
mkdir -p "$out"/{scenario,contacts,certificate,json} "$out/work"
pair() {  # pair INPUT CERT NAME: INPUT NUL CERT into certificate/NAME
  { cat "$1"; printf '\0'; cat "$2"; } > "$out/certificate/$3"
}
for case in "$cases"/*.json; do
  name=$(basename "$case" .json)
  cp "$case" "$out/scenario/$name.json"
  # The same sweep on [t0, t0 + 1] (track rows may lie outside the horizon): few log frames.
  python3 - "$case" "$out/scenario/$name-short.json" <<'PY'
import json, sys
from fractions import Fraction
doc = json.load(open(sys.argv[1]))
doc["horizon"] = [doc["horizon"][0], str(Fraction(doc["horizon"][0]) + 1)]
json.dump(doc, open(sys.argv[2], "w"), indent=1)
PY
done
for case in "$out"/scenario/*.json; do
  name=$(basename "$case" .json)
  log=$out/contacts/$name.log.json
  "$prover" contacts "$case" --every 1/4 -o "$log" --quiet
  for input in "$case" "$log"; do
    # Its pairs would be over the size cut anyway.
    (($(stat -c %s "$input") <= max_bytes)) || continue
    tag=$(basename "$input" .json)
    for args in "" "--ring z2" "--method sheet" "--method chambers" "--method route"; do
      cert=$out/work/$tag.${args// /_}.cert.json
      # A forced method may be undecided (exit 3) or refuse a log input; that writes nothing.
      if "$prover" prove "$input" -o "$cert" --quiet --rounds 2 $args 2> /dev/null && [[ -s $cert ]]; then
        pair "$input" "$cert" "$tag.${args// /_}"
        cp "$cert" "$out/json/"
      fi
    done
  done
done
cp "$out"/scenario/* "$out"/contacts/* "$out/json/"
for target in scenario contacts certificate json; do
  if [[ -d $here/seeds/$target ]]; then cp "$here/seeds/$target"/* "$out/$target/"; fi
done
rm -rf "$out/work"
skipped=$(find "$out" -type f -size +"$max_bytes"c | wc -l)
find "$out" -type f -size +"$max_bytes"c -delete
skipped=$((skipped + $(find "$out/certificate" -type f -size +24576c | wc -l)))
find "$out/certificate" -type f -size +24576c -delete
for target in scenario contacts certificate json; do
  # Keep the first of identical files.
  (cd "$out/$target" && md5sum -- * | sort | awk 'seen[$1]++ {print $2}' | xargs -r rm --)
done
echo "seeds over $max_bytes bytes left out: $skipped"
for target in scenario contacts certificate json; do
  echo "seeds $target: $(ls "$out/$target" | wc -l) files, $(du -sk "$out/$target" | cut -f1) KiB"
done
