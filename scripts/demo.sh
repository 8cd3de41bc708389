#!/usr/bin/env bash
# Install, build, then prove a bundled sweep and re-check the certificate independently.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
bash scripts/build.sh release sweepcert sweepcheck
bin=build/release
mkdir -p build/demo
echo
echo "== sweepcert prove cases/column-sweep.json (a robot column crossing a 20 x 10 hall)"
"$bin/prover/sweepcert" prove cases/column-sweep.json -o build/demo/column-sweep.cert.json
echo
echo "== sweepcheck cases/column-sweep.json build/demo/column-sweep.cert.json"
"$bin/checker/sweepcheck" cases/column-sweep.json build/demo/column-sweep.cert.json
