#!/usr/bin/env bash
# Install, build, and run the whole test suite: release build with every test (reference tests
# against GUDHI included), then the prover/checker tests again under address and
# undefined-behaviour sanitizers.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
bash scripts/build.sh release
ctest --preset release -j 2
if [[ ${SWEEPCERT_SKIP_SANITIZE:-0} != 1 ]]; then
  bash scripts/build.sh sanitize
  ctest --preset sanitize -j 2
fi
