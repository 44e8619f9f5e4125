#!/usr/bin/env bash
# Installs the Debian 12 packages Rackreach builds and tests with, only those that are missing.
set -euo pipefail
packages=(build-essential cmake pkg-config qt6-base-dev libeigen3-dev nlohmann-json3-dev catch2 libcli11-dev
          liblemon-dev libcsv-dev libbenchmark-dev poppler-utils time
          python3 python3-jsonschema desktop-file-utils dpkg-dev
          clang libclang-rt-14-dev)  # clang 14 with its sanitizer and libFuzzer runtimes: the sanitizer config
missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -eq 0 ]; then
  echo "install-deps: all packages present"
  exit 0
fi
echo "install-deps: installing ${missing[*]}"
SUDO=""
[ "$(id -u)" -eq 0 ] || SUDO="sudo"
$SUDO apt-get update -qq
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${missing[@]}"
