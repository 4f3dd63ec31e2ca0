#!/usr/bin/env bash
# End to end: the real binary on the shipped demo model writes every output and a summary with the caution.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/demo/frame_rail.toml" "$out" "0 1"
for f in stations.vtp readout.vtp model.vtu results.pvd stations.csv; do
  [ -s "$out/$f" ] || fail "missing output $f"
done
grep -q "checked by a qualified engineer under the governing code and local regulations" "$work/summary.txt" ||
  fail "summary lacks the caution"
grep -q "south toe" "$work/summary.txt" && grep -q "north toe" "$work/summary.txt" || fail "summary lacks a toe"
# 81 stations per toe (the demo's toe lines have 81 nodes each), plus the header row.
rows=$(($(wc -l < "$out/stations.csv") - 1))
[ "$rows" = 162 ] || fail "stations.csv has $rows rows, expected 162"
echo "demo run ok"
