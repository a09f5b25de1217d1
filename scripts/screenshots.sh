#!/usr/bin/env bash
# Screenshots of every view of the desktop application under Xvfb, with the example project alone
# and with the invented demo measurements imported, into docs/screenshots/*.png. Also writes
# headless figure exports (finestra --export-view) next to them.
# Usage: scripts/screenshots.sh [path/to/finestra]   (default: build/release/app/gui/finestra)
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
app="${1:-$root/build/release/app/gui/finestra}"
out="$root/docs/screenshots"
project="$root/examples/membrane-vector-magnet.json"
peaks="$root/examples/membrane-invented-peaks.csv"
spectrum="$root/examples/membrane-invented-spectrum.csv"
mkdir -p "$out"
recovery="$(mktemp -d)"
export XDG_CONFIG_HOME="$(mktemp -d)"   # fresh preferences: default units and palette
trap 'rm -rf "$recovery" "$XDG_CONFIG_HOME"' EXIT

shot() {  # view, output name, extra args...
  local view="$1" name="$2"; shift 2
  xvfb-run -a -s "-screen 0 1700x1100x24" \
    "$app" "$project" --screenshot "$view" --out "$out/$name.png" --size 1600x1000 \
    --recovery-folder "$recovery" "$@" 2>/dev/null
  echo "wrote $out/$name.png"
}

for view in levels lines spectrum table; do
  shot "$view" "window-$view"
  shot "$view" "window-$view-measured" --import-peaks "$peaks" --import-spectrum "$spectrum"
done
project="$root/examples/fit-demo.json" shot fit window-fit-before
# The same view after a fit: the project with the fitted values applied (finestra-cli fit --write-project).
fitted="$recovery/fit-demo-fitted.json"
"$(dirname "$app")/../cli/finestra-cli" fit "$root/examples/fit-demo.json" --write-project "$fitted" >/dev/null
project="$fitted" shot fit window-fit
shot planner window-planner --screenshot-delay 4000
project="$root/examples/siv29-microwave.json" shot microwave window-microwave
project="$root/examples/siv29-microwave.json" shot lambda window-lambda
"$app" --project "$project" --export-view lines --out "$out/figure-lines.png" --import-peaks "$peaks"
"$app" --project "$project" --export-view levels --out "$out/figure-levels.png"
"$app" --project "$project" --export-view spectrum --out "$out/figure-spectrum.png" --import-spectrum "$spectrum"
echo "wrote headless figures to $out"
