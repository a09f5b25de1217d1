#!/usr/bin/env bash
# Installs the Debian 12 packages, builds Finestra (build/release) and runs the main job on the
# bundled example: prints the optical lines of all four orientation classes at the example's field,
# then opens the desktop application on the example project. Without a display (no $DISPLAY and
# no $WAYLAND_DISPLAY) it writes the Lines view to build/example-lines.png instead of opening a window.
# Usage: scripts/run-example.sh [project.json, default examples/membrane-vector-magnet.json]
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
project="${1:-examples/membrane-vector-magnet.json}"
if [[ "${FINESTRA_SKIP_DEPS:-0}" != 1 ]]; then scripts/install-deps.sh; fi
cmake --preset release >/dev/null
cmake --build --preset release -j"$(nproc)" --target finestra finestra-cli
build/release/app/cli/finestra-cli lines "$project"
if [[ -n "${DISPLAY:-}${WAYLAND_DISPLAY:-}" ]]; then
  exec build/release/app/gui/finestra "$project"
fi
build/release/app/gui/finestra --project "$project" --export-view lines --out build/example-lines.png \
  --import-peaks examples/membrane-invented-peaks.csv
echo "No display found: wrote the Lines view to build/example-lines.png (run with a display to open the window)."
