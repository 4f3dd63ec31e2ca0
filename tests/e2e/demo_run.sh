#!/usr/bin/env bash
# End to end: the real binary on the shipped demo model writes every output and a summary with the caution.
set -uo pipefail
bin=$1; src=$2
out=$(mktemp -d)/results
trap 'rm -rf "$(dirname "$out")"' EXIT
"$bin" run "$src/meshes/demo/frame_rail.toml" --output "$out" --quiet > "$out.txt" 2>&1
code=$?
cat "$out.txt"
fail() { echo "FAIL: $*"; exit 1; }
[ "$code" = 0 ] || [ "$code" = 1 ] || fail "exit code $code, expected 0 or 1"
for f in stations.vtp readout.vtp model.vtu results.pvd stations.csv; do
  [ -s "$out/$f" ] || fail "missing output $f"
done
grep -q "checked by a qualified engineer under the governing code and local regulations" "$out.txt" ||
  fail "summary lacks the caution"
grep -q "south toe" "$out.txt" && grep -q "north toe" "$out.txt" || fail "summary lacks a toe"
# 81 stations per toe (the demo's toe lines have 81 nodes each), plus the header row.
rows=$(($(wc -l < "$out/stations.csv") - 1))
[ "$rows" = 162 ] || fail "stations.csv has $rows rows, expected 162"
echo "demo run ok"
