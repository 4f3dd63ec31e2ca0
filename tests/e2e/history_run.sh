#!/usr/bin/env bash
# End to end: the demo model with its invented duty cycle as unit cases times a load history (a damage run), a
# bad history, and the curve look-up subcommand.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"
demo="$src/meshes/demo"

run_plan "$demo/frame_rail_history.toml" "$work/out" "0 1"
grep -q "counting: ASTM E1049-85 sec. 5.4.5" "$work/summary.txt" || fail "summary lacks the counting rule"
grep -q "checked by a qualified engineer" "$work/summary.txt" || fail "summary lacks the caution"
head -1 "$work/out/stations.csv" | grep -q "damage \[-\]" || fail "stations.csv lacks the damage column"
head -1 "$work/out/stations.csv" | grep -q "life \[years\]" || fail "stations.csv lacks the life in years"

# A history with a non-numeric field: exit 2, the message names the file and the line.
sed -e "s|\"frame_rail.pvd\"|\"$demo/frame_rail.pvd\"|" -e "s|\"frame_rail_history.csv\"|\"$work/bad.csv\"|" \
  "$demo/frame_rail_history.toml" > "$work/bad.toml"
printf 'time,drive running,drive braking\n0,0,0\n1,x,0\n' > "$work/bad.csv"
"$bin" run "$work/bad.toml" --output "$work/bad-out" > /dev/null 2> "$work/stderr"
code=$?
[ "$code" = 2 ] || { cat "$work/stderr"; fail "bad history: exit code $code, expected 2"; }
grep -qF "bad.csv' line 3, column 'drive running': 'x' is not a finite number" "$work/stderr" ||
  { cat "$work/stderr"; fail "bad history: message"; }

# Curve look-up: IIW FAT 90 at 1e7 cycles is 90 (2e6/1e7)^(1/3) = 52.63 MPa (IIW 2016 sec. 3.7, from memory).
"$bin" curve "IIW FAT 90" --cycles 1e7 --range 90 > "$work/curve.txt" || fail "curve: exit code $?"
cat "$work/curve.txt"
grep -q "source: IIW 2016" "$work/curve.txt" || fail "curve: no source"
grep -q "allowable stress range at N = 1e+07: 52.63 MPa (variable amplitude)" "$work/curve.txt" || fail "curve: allowable"
grep -q "cycles to failure at 90 MPa: 2e+06 (variable amplitude)" "$work/curve.txt" || fail "curve: life"
"$bin" curve "IIW FAT" > /dev/null 2>&1
[ "$?" = 2 ] || fail "curve: an unknown name must exit with 2"
echo "history run ok"
