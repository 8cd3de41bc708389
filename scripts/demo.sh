#!/usr/bin/env bash
# Install, build, then prove a bundled sweep, re-check the certificate independently, and draw it.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
bash scripts/build.sh release sweepcert sweepcheck
bin=build/release
mkdir -p build/demo
echo
echo "== sweepcert prove cases/depot-yard-night.json (four guards walk abreast across a 24 x 12 depot yard)"
"$bin/prover/sweepcert" prove cases/depot-yard-night.json -o build/demo/depot-yard-night.cert.json
echo
echo "== sweepcheck --explain cases/depot-yard-night.json build/demo/depot-yard-night.cert.json"
"$bin/checker/sweepcheck" --explain cases/depot-yard-night.json build/demo/depot-yard-night.cert.json
echo
echo "== sweepcert report cases/depot-yard-night.json build/demo/depot-yard-night.cert.json"
"$bin/prover/sweepcert" report cases/depot-yard-night.json build/demo/depot-yard-night.cert.json \
  -o build/demo/depot-yard-night.html
echo "Open build/demo/depot-yard-night.html in a browser to watch the sweep."
