#!/usr/bin/env bash
# Install, build, and run the whole test suite: release build with every test (reference tests
# against GUDHI included), then the prover/checker tests again under address and
# undefined-behaviour sanitizers, then every fuzz target of the checker for a short while.
# Skip stages with SWEEPCERT_SKIP_SANITIZE=1 and SWEEPCERT_SKIP_FUZZ=1;
# SWEEPCERT_FUZZ_SECONDS sets the time per fuzz target (default 60).
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
bash scripts/build.sh release
ctest --preset release -j 2
if [[ ${SWEEPCERT_SKIP_SANITIZE:-0} != 1 ]]; then
  bash scripts/build.sh sanitize
  ctest --preset sanitize -j 2
fi
if [[ ${SWEEPCERT_SKIP_FUZZ:-0} != 1 ]]; then
  bash scripts/fuzz.sh "${SWEEPCERT_FUZZ_SECONDS:-60}"
fi
