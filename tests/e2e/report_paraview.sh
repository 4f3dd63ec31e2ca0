#!/usr/bin/env bash
# End to end: ParaView's pvbatch runs the view_results.py of the demo's results under xvfb and saves a picture in
# which the flagged stations (utilization > 1, drawn in magenta) must show. Skipped, with a visible message, where
# pvbatch or xvfb-run is missing: Debian's python3-paraview cannot be installed beside libvtk9-dev, so .ci/test
# installs ParaView after the build and runs this script on its own, with TOEHOLD_REQUIRE_PARAVIEW=1 (no skipping).
set -uo pipefail
bin=$1; src=$2
if ! command -v pvbatch > /dev/null || ! command -v xvfb-run > /dev/null; then
  if [ "${TOEHOLD_REQUIRE_PARAVIEW:-0}" = 1 ]; then echo "FAIL: pvbatch or xvfb-run is missing"; exit 1; fi
  echo "SKIP: report_paraview: pvbatch or xvfb-run is not installed (apt-get install paraview python3-paraview xvfb," \
       "which removes libvtk9-dev); view_results.py was not run"
  exit 0
fi
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/demo/frame_rail.toml" "$out" "0 1"
flagged=$(python3 -c "import json, sys; print(json.load(open(sys.argv[1]))['counts']['exceed'])" "$out/results.json")
[ "$flagged" -gt 0 ] || fail "the demo has no station with utilization > 1 to look for"
png=${TOEHOLD_PARAVIEW_PNG:-$work/view.png}
# An X server that another test has just stopped can leave its display number looking free for a moment; when
# pvbatch then finds no X server it aborts, so try again on a fresh display a few times.
for attempt in 1 2 3; do
  (cd "$out" && timeout 300 xvfb-run -a -n $((99 + 7 * attempt)) -s "-screen 0 1280x1024x24" \
    pvbatch view_results.py "$png") > "$work/pvbatch.txt" 2>&1
  status=$?
  grep -q "bad X server connection" "$work/pvbatch.txt" || break
  sleep 2
done
cat "$work/pvbatch.txt"
[ "$status" = 0 ] || fail "pvbatch view_results.py exited with $status"
[ -s "$png" ] || fail "view_results.py saved no picture"
grep -q "view_results.py: 162 stations, $flagged with utilization > 1" "$work/pvbatch.txt" ||
  fail "view_results.py did not find the $flagged flagged stations of results.json"
python3 "$here/report_png_check.py" "$png" blank-test || fail "the ParaView picture is blank"
# Flagged stations are flat 24-pixel squares in magenta; ask for at least 10 such pixels per flagged station
# (they overlap along the toe, so far fewer than 24 x 24 each).
python3 "$here/report_png_check.py" "$png" count 255 0 255 60 $((10 * flagged)) ||
  fail "the flagged stations do not show in magenta"
echo "ParaView shows the flagged stations"
