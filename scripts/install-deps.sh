#!/usr/bin/env bash
# Installs everything sweepcert needs to build and test, from Debian 12 packages (run as root).
set -euo pipefail
packages=(g++ cmake make python3 time libgmp-dev libboost-dev nlohmann-json3-dev catch2 libssl-dev
          libgudhi-dev libcgal-dev libeigen3-dev
          clang libclang-rt-14-dev)  # libFuzzer and the sanitizer runtimes for scripts/fuzz.sh
missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if ((${#missing[@]})); then
  echo "== installing: ${missing[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq --no-install-recommends "${missing[@]}"
else
  echo "== all build dependencies are installed"
fi
# Headless browser for the report's page test (tests/e2e/report_browser.sh). Optional: without it
# that test reports SKIP, so a failure here does not stop the build dependencies above.
if ! dpkg-query -W -f='${Status}' chromium 2>/dev/null | grep -q "install ok installed"; then
  echo "== installing: chromium (optional, for the report's browser test)"
  export DEBIAN_FRONTEND=noninteractive
  { apt-get update -qq && apt-get install -y -qq --no-install-recommends chromium; } ||
    echo "== chromium could not be installed; the report's browser test will be skipped"
fi
