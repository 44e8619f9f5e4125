#!/usr/bin/env bash
# Builds everything from scratch and runs the whole test suite in three configurations, then the fuzz targets
# briefly over their corpora:
#   build-test/        Release, GCC, everything (the desktop app and the benchmarks included)
#   build-test-nogui/  -DRACKREACH_GUI=OFF, -O0: the engine and the CLI stand without Qt
#   build-test-asan/   clang, -O1 -gline-tables-only, AddressSanitizer + UndefinedBehaviorSanitizer (-fno-sanitize-recover), no
#                      benchmarks, RACKREACH_FUZZ=ON: the same compile also gives the libFuzzer targets
#   fuzz smoke         each fuzz target over its seed corpus and the regression fixtures, then 5 s of fuzzing
# Each phase prints its time. By default the first two run (what .ci/run runs, within CI's 15 minutes on 2 cores);
# the sanitizer and fuzz phases are CI's second step, .ci/sanitize (RACKREACH_TEST_PHASES="asan fuzz"), which has
# its own 15 minutes. RACKREACH_TEST_PHASES="default nogui asan fuzz" runs all four.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
jobs="$(nproc)"
phases="${RACKREACH_TEST_PHASES:-default nogui}"
want() { [[ " $phases " == *" $1 "* ]]; }
timed() {  # timed NAME COMMAND...: runs the command and reports its wall time
  local name=$1 start=$SECONDS
  shift
  "$@"
  echo "test.sh: phase ${name}: $((SECONDS - start)) s"
}

default_config() {
  rm -rf build-test
  cmake -S . -B build-test -DCMAKE_BUILD_TYPE=Release
  cmake --build build-test -j"$jobs"
  ctest --test-dir build-test --output-on-failure -j"$jobs"
}

nogui_config() {
  rm -rf build-test-nogui
  # -O0: this phase proves the build and the tests stand without Qt; the optimised build is the default phase's.
  cmake -S . -B build-test-nogui -DCMAKE_BUILD_TYPE=Debug -DCMAKE_CXX_FLAGS_DEBUG=-O0 -DRACKREACH_GUI=OFF \
    -DRACKREACH_BENCH=OFF
  cmake --build build-test-nogui -j"$jobs"
  ctest --test-dir build-test-nogui --output-on-failure -j"$jobs"
}

# Sanitizer reports fail the test that caused them. LeakSanitizer reads tests/lsan.supp: leaks inside system
# libraries the desktop app loads (fontconfig, Qt's platform plugins) only, never our code; see the file.
export ASAN_OPTIONS="detect_leaks=1:abort_on_error=0:detect_stack_use_after_return=1:strict_string_checks=1"
export UBSAN_OPTIONS="print_stacktrace=1:halt_on_error=1"
export LSAN_OPTIONS="suppressions=$PWD/tests/lsan.supp:print_suppressions=0"

asan_config() {
  rm -rf build-test-asan
  cmake -S . -B build-test-asan -DCMAKE_CXX_COMPILER=clang++ -DCMAKE_BUILD_TYPE=Sanitize \
    -DCMAKE_CXX_FLAGS_SANITIZE="-O1 -gline-tables-only" -DRACKREACH_FUZZ=ON -DRACKREACH_BENCH=OFF
  cmake --build build-test-asan -j"$jobs"
  ctest --test-dir build-test-asan --output-on-failure -j"$jobs"
}

fuzz_smoke() {
  local work
  work="$(mktemp -d)"
  for target in project_file csv_import population_table; do
    local bin="build-test-asan/fuzz/fuzz_${target}" dict="fuzz/project_file.dict" extra=()
    case $target in
      project_file) extra=(tests/data sample_tasks) ;;
      csv_import) dict="fuzz/csv_import.dict"; extra=(tests/data/csv) ;;
      population_table) extra=(tests/anthropometry/data) ;;
    esac
    mkdir -p "$work/$target"
    # New inputs go to the scratch folder first on the line, never into the repository's corpus.
    local status=0
    "$bin" -max_total_time=5 -timeout=10 -max_len=32768 -print_final_stats=1 -dict="$dict" \
      -artifact_prefix="$work/" "$work/$target" "fuzz/corpus/$target" "${extra[@]}" >"$work/$target.log" 2>&1 ||
      status=$?
    grep -E "stat::number_of_executed_units|ERROR|SUMMARY|Test unit written" "$work/$target.log" |
      sed "s/^/fuzz_${target}: /" || true
    if [ "$status" -ne 0 ] || compgen -G "$work/*-*[0-9a-f]" >/dev/null; then
      echo "test.sh: fuzz_${target} failed (exit $status); the log and the failing input are in $work" >&2
      return 1
    fi
  done
  rm -rf "$work"
}

want default && timed default default_config
want nogui && timed nogui nogui_config
want asan && timed asan asan_config
want fuzz && timed fuzz fuzz_smoke
echo "test.sh: all phases passed ($phases) in $SECONDS s"
