#!/usr/bin/env bash
# Runs the benchmarks: ns per task evaluation, and the end-to-end time and peak memory of
# `rackreach assess --format json` on a generated file of 100,000 single-task jobs.
set -euo pipefail
cd "$(dirname "$0")/.."
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$(nproc)" --target rackreach bench_rnle make_bench_project make_bench_store
./build/bench/bench_rnle --benchmark_counters_tabular=true
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
./build/bench/make_bench_project "$work/jobs-100k.rackreach.json" 100000
ls -l "$work/jobs-100k.rackreach.json" | awk '{print "input bytes:", $5}'
for i in 1 2 3; do
  /usr/bin/time -f "assess --format json: %e s wall, %M KB peak" \
    ./build/app/cli/rackreach assess "$work/jobs-100k.rackreach.json" --format json --out "$work/out.json"
done
ls -l "$work/out.json" | awk '{print "output bytes:", $5}'
./build/bench/make_bench_store "$work/store-100k.rackreach.json" 100000
ls -l "$work/store-100k.rackreach.json" | awk '{print "store input bytes:", $5}'
/usr/bin/time -f "parse check (rackreach check): %e s wall, %M KB peak" \
  ./build/app/cli/rackreach check "$work/store-100k.rackreach.json"
/usr/bin/time -f "store review (assess --format json): %e s wall, %M KB peak" \
  ./build/app/cli/rackreach assess "$work/store-100k.rackreach.json" --format json --out "$work/store-out.json"
# The audit report of the demo store, end to end (load, assess, self-check, drawings, layout, write).
for format in pdf html; do
  /usr/bin/time -f "report --out .$format (demo store): %e s wall, %M KB peak" \
    ./build/app/cli/rackreach report sample_tasks/kitting-store.rackreach.json --out "$work/report.$format" --date 2026-12-01
done
