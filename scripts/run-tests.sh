#!/usr/bin/env bash
# Installs the Debian 12 packages (scripts/install-deps.sh), builds everything in Release
# (build/release: GUI, CLI, tests, benchmarks) and runs every test with ctest.
# Exits non-zero on any build or test failure. Usage: scripts/run-tests.sh
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
if [[ "${FINESTRA_SKIP_DEPS:-0}" != 1 ]]; then scripts/install-deps.sh; fi
# FINESTRA_WERROR=ON in the environment (CI) turns compiler warnings into errors.
cmake --preset release ${FINESTRA_WERROR:+-DFINESTRA_WERROR=$FINESTRA_WERROR}
cmake --build --preset release -j"$(nproc)"
QT_QPA_PLATFORM=offscreen ctest --preset release -j"$(nproc)" --timeout 900
