#!/usr/bin/env bash
# Quick start: installs what is missing, builds Rackreach, and assesses the bundled sample.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$(nproc)" --target rackreach
./build/app/cli/rackreach assess sample_tasks/kitting-store.rackreach.json
