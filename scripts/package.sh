#!/usr/bin/env bash
# Builds the Debian package (cpack -G DEB) and checks it: its control fields and contents (dpkg-deb -I, -c), then
# extracts it into a temporary folder and runs the extracted CLI on an extracted sample with nothing set, so the
# population tables must be found relative to the program. Leaves the .deb in the build folder.
#   bash scripts/package.sh [BUILD_DIR]   (default build-package: Release, no tests, no benchmarks)
set -euo pipefail
cd "$(dirname "$0")/.."
build=${1:-build-package}
if [ ! -f "$build/CMakeCache.txt" ]; then
  cmake -S . -B "$build" -DCMAKE_BUILD_TYPE=Release -DRACKREACH_TESTS=OFF -DRACKREACH_BENCH=OFF
fi
cmake --build "$build" -j"$(nproc)"
rm -f "$build"/rackreach_*.deb
(cd "$build" && cpack -G DEB)
deb=$(ls "$build"/rackreach_*.deb)
dpkg-deb -I "$deb"
dpkg-deb -c "$deb"
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
dpkg-deb -x "$deb" "$tmp"
version=$(env -u RACKREACH_DATA_DIR "$tmp/usr/bin/rackreach" --version)
echo "$version"
grep -qxF "data folder: $tmp/usr/share/rackreach/population (installed, relative to the program $tmp/usr/bin/rackreach)" \
  <<<"$version" || { echo "package: the extracted CLI does not use the extracted tables" >&2; exit 1; }
env -u RACKREACH_DATA_DIR "$tmp/usr/bin/rackreach" assess "$tmp/usr/share/rackreach/samples/kitting-store.rackreach.json" \
  --format json >"$tmp/review.json"
grep -q '"workforce": *"ansur2' "$tmp/review.json" || { echo "package: the review has no workforce" >&2; exit 1; }
echo "package: $deb ($(stat -c %s "$deb") bytes): control fields, contents and the extracted CLI checked"
