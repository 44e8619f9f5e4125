#!/usr/bin/env bash
# Builds everything from scratch in build-test/ and runs the whole test suite; then proves the engine and the CLI
# stand without Qt: a second configuration with -DRACKREACH_GUI=OFF in build-test-nogui/ builds and passes too.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
rm -rf build-test build-test-nogui
cmake -S . -B build-test -DCMAKE_BUILD_TYPE=Release
cmake --build build-test -j"$(nproc)"
ctest --test-dir build-test --output-on-failure -j"$(nproc)"
cmake -S . -B build-test-nogui -DCMAKE_BUILD_TYPE=Release -DRACKREACH_GUI=OFF -DRACKREACH_BENCH=OFF
cmake --build build-test-nogui -j"$(nproc)"
ctest --test-dir build-test-nogui --output-on-failure -j"$(nproc)"
