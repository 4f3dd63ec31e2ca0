#!/usr/bin/env bash
# End to end: the demo with through-thickness linearization at every station (meshes/demo/frame_rail_linearized.toml)
# writes the linearization columns, finite for every station that has a line; the JSON validates; the summary has
# one linearization line per toe. The plain demo plan writes no such columns.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/demo/frame_rail_linearized.toml" "$out" "0 1"
for f in stations.vtp readout.vtp model.vtu results.pvd stations.csv results.json report.html; do
  [ -s "$out/$f" ] || fail "missing output $f"
done
python3 "$here/report_schema_check.py" "$out/results.json" "$src/docs/results-schema.md" || fail "schema"
for toe in "south toe" "north toe"; do
  grep -q "toe '$toe': largest ratio linearized / surface range" "$work/summary.txt" ||
    fail "summary lacks the linearization line of '$toe'"
done
grep -q "Through-thickness linearization (ASME BPVC VIII-2 Annex 5-A)" "$out/report.html" ||
  fail "report lacks the linearization table"
/usr/bin/python3 - "$out/stations.csv" <<'PY' || fail "stations.csv linearization columns"
import csv, math, sys
rows = list(csv.DictReader(open(sys.argv[1], newline='')))
names = ('linearized structural stress range [MPa]', 'stress range 1 mm below surface [MPa]',
         'ratio linearized to surface range [-]')
for column in names + ('linearization problem',):
    if column not in rows[0]:
        sys.exit('stations.csv has no column %r' % column)
if 'shell layer' in rows[0]:
    sys.exit('stations.csv has shell columns on a solid model')
lined = [r for r in rows if not r['linearization problem']]
if not lined:
    sys.exit('no station has a linearized value')
for r in lined:
    for column in names:
        if not math.isfinite(float(r[column])):
            sys.exit('station %s of %s: %s is %r' % (r['station id'], r['toe name'], column, r[column]))
for r in rows:
    if r['linearization problem'] and r['linearized structural stress range [MPa]']:
        sys.exit('station %s has a problem and a value' % r['station id'])
ratios = [float(r['ratio linearized to surface range [-]']) for r in lined]
print('%d of %d stations linearized; ratio linearized / surface range %.3f ... %.3f'
      % (len(lined), len(rows), min(ratios), max(ratios)))
PY
plain=$work/plain
"$bin" run "$src/meshes/demo/frame_rail.toml" --output "$plain" --quiet > "$work/plain.txt" 2>&1
code=$?
[ "$code" = 0 ] || [ "$code" = 1 ] || { cat "$work/plain.txt"; fail "plain demo: exit code $code"; }
head -1 "$plain/stations.csv" | grep -q -e "lineariz" -e "1 mm below" -e "shell layer" &&
  fail "the plain demo's stations.csv has linearization or shell columns"
grep -q "linearization" "$work/plain.txt" && fail "the plain demo's summary mentions linearization"
echo "linearized run ok"
