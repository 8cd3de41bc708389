#!/usr/bin/env bash
# Builds the libFuzzer configuration (CMake preset `fuzz`: clang, checker library and fuzz/
# targets only, with address and undefined-behaviour sanitizers), makes the seed corpora from
# cases/ and runs every target for SECONDS (default 60) each. Fails on any crash, hang (over
# 10 s on one input), out-of-memory (over 2 GiB) or sanitizer report; the input that caused it
# is kept in build/fuzz/findings/ (copy it into tests/fuzz-regressions/ once fixed).
# Usage: fuzz.sh [SECONDS] [TARGET...]
# env: SWEEPCERT_FUZZ_JOBS   targets run at once (default 1)
#      SWEEPCERT_PROVER      a sweepcert binary for the seeds (default: built by the release preset)
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${1:-60}
shift || true
targets=("$@")
((${#targets[@]})) || targets=(fuzz_json fuzz_scenario fuzz_contacts fuzz_certificate fuzz_check)
jobs=${SWEEPCERT_FUZZ_JOBS:-1}

# The prover (for the seeds) from the release preset; the fuzz targets from the fuzz preset.
prover=${SWEEPCERT_PROVER:-}
if [[ -z $prover ]]; then
  bash scripts/build.sh release sweepcert
  prover=build/release/prover/sweepcert
fi
cmake --preset fuzz > /dev/null
cmake --build --preset fuzz -j "$(nproc)" --target "${targets[@]}"

work=build/fuzz/run
mkdir -p "$work" build/fuzz/findings
bash fuzz/make_seeds.sh "$prover" "$work/seeds"

corpus_of() {
  case $1 in
    fuzz_json) echo json ;;
    fuzz_scenario) echo scenario ;;
    fuzz_contacts) echo contacts ;;
    *) echo certificate ;;
  esac
}

run_one() {  # run_one TARGET: returns libFuzzer's exit status
  local target=$1 corpus
  corpus=$(corpus_of "$target")
  mkdir -p "$work/corpus/$target"
  # New inputs go to corpus/TARGET (kept between runs); the seeds are read only.
  ./build/fuzz/fuzz/"$target" "$work/corpus/$target" "$work/seeds/$corpus" \
    -dict=fuzz/sweepcert.dict -max_total_time="$seconds" -timeout=10 -rss_limit_mb=2048 \
    -max_len=65536 -print_final_stats=1 -artifact_prefix=build/fuzz/findings/"$target"- \
    > "$work/$target.log" 2>&1
}

report() {  # report TARGET STATUS
  if [[ $2 == 0 ]]; then
    echo "ok   $1: $(awk '/^stat::number_of_executed_units/ {print $2}' "$work/$1.log") executions in ${seconds}s"
  else
    echo "FAIL $1 (exit $2): see $work/$1.log and build/fuzz/findings/$1-*"
    grep -E 'ERROR|SUMMARY|runtime error|Test unit written' "$work/$1.log" | head -5 || true
    status=1
  fi
}

# Targets run in batches of $jobs; the machine's cores are shared.
status=0
for ((i = 0; i < ${#targets[@]}; i += jobs)); do
  batch=("${targets[@]:i:jobs}")
  pids=()
  for target in "${batch[@]}"; do
    echo "== fuzzing $target for ${seconds}s"
    run_one "$target" &
    pids+=($!)
  done
  for j in "${!batch[@]}"; do
    code=0
    wait "${pids[j]}" || code=$?
    report "${batch[j]}" "$code"
  done
done
exit $status
