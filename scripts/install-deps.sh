#!/usr/bin/env bash
# Installs every Debian 12 package Finestra needs to build, test, benchmark, fuzz and take
# screenshots. Runs apt-get as root, or through sudo when not root. Safe to run again.
# Usage: scripts/install-deps.sh
set -euo pipefail
packages=(
  cmake ninja-build g++ pkg-config
  libeigen3-dev nlohmann-json3-dev libcli11-dev libspdlog-dev libcerf-dev
  qt6-base-dev qt6-svg-dev libqcustomplot-dev libgl-dev
  libgtest-dev libgmock-dev libbenchmark-dev
  clang-14 libclang-rt-14-dev
  xvfb xauth python3 python3-numpy
  pybind11-dev python3-dev python3-pytest python3-matplotlib
  dpkg-dev appstream desktop-file-utils shared-mime-info libglib2.0-bin
)
if [[ $(id -u) -eq 0 ]]; then sudo=(); else sudo=(sudo); fi
export DEBIAN_FRONTEND=noninteractive
"${sudo[@]}" apt-get update
"${sudo[@]}" apt-get install -y --no-install-recommends "${packages[@]}"
