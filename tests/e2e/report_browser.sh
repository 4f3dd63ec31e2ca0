#!/usr/bin/env bash
# End to end: headless Chromium renders the demo's report.html to a PNG, which must not be blank. Skipped, with a
# visible message, where Chromium is not installed (.ci/install-deps installs it, so CI runs it).
set -uo pipefail
bin=$1; src=$2
browser=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$browser" ]; then
  echo "SKIP: report_browser: Chromium is not installed (apt-get install chromium); report.html was not rendered"
  exit 0
fi
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/demo/frame_rail.toml" "$out" "0 1"
png=${TOEHOLD_REPORT_PNG:-$work/report.png}
timeout 120 "$browser" --headless --no-sandbox --disable-gpu --disable-quic --no-first-run \
  --disable-background-networking --disable-component-update --disable-sync --user-data-dir="$work/profile" \
  --hide-scrollbars --screenshot="$png" --window-size=1280,2000 "file://$out/report.html" > "$work/chromium.txt" 2>&1
[ -s "$png" ] || { cat "$work/chromium.txt"; fail "Chromium wrote no picture"; }
python3 "$here/report_png_check.py" "$png" blank-test || fail "the rendered report is blank"
echo "report renders in Chromium"
