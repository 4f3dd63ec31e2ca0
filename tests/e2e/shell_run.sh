#!/usr/bin/env bash
# End to end: the real binary on the CalculiX-solved shell T-joint (meshes/shell_ccx/shell_tjoint.toml). Every
# output is written, the JSON validates, stations.csv carries the shell columns, and the hot-spot stress at the
# mid-width station (x = 10 mm) is beam theory's 0.9 (100 - 0) = 90 MPa within 1 % (derived [D], as in
# tests/shell/ccx_shell_test.cpp), the range to rest the same.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/shell_ccx/shell_tjoint.toml" "$out" "0"  # 90 MPa against FAT 100 at 2e6 cycles passes
for f in stations.vtp readout.vtp model.vtu results.pvd stations.csv results.json report.html view_results.py; do
  [ -s "$out/$f" ] || fail "missing output $f"
done
python3 "$here/report_schema_check.py" "$out/results.json" "$src/docs/results-schema.md" || fail "schema"
python3 -c "import json, sys; sys.exit(json.load(open(sys.argv[1]))['model']['cell_kind'] != 'shell')" \
  "$out/results.json" || fail "results.json does not say the model is a shell model"
grep -q "Shell model: the toe reads the <b>top</b> layer" "$out/report.html" || fail "report lacks the shell sentence"
/usr/bin/python3 - "$out/stations.csv" <<'PY' || fail "stations.csv values"
import csv, math, sys
rows = list(csv.DictReader(open(sys.argv[1], newline='')))
for column in ('shell layer', 'read-out origin', 'offset from intersection line [mm]', 'hot-spot location x [mm]'):
    if column not in rows[0]:
        sys.exit('stations.csv has no column %r' % column)
if 'linearization problem' in rows[0]:
    sys.exit('stations.csv has linearization columns on a plan without through_thickness')
mid = [r for r in rows if abs(float(r['x [mm]']) - 10.0) < 1e-6]
if len(mid) != 1:
    sys.exit('%d stations at x = 10 mm, expected 1' % len(mid))
r = mid[0]
hot, rng = float(r['hot-spot stress loaded [MPa]']), float(r['hot-spot stress range [MPa]'])
expected = 0.9 * (100.0 - 0.0)  # beam theory at the intersection line, 6 M / (b t^2) [D]
for name, value in (('hot-spot stress', hot), ('range', rng)):
    if abs(value - expected) > 0.01 * expected:
        sys.exit('%s at x = 10 mm is %g MPa, expected %g MPa within 1 %%' % (name, value, expected))
if float(r['hot-spot stress rest [MPa]']) != 0.0:
    sys.exit('the unloaded step has a hot-spot stress of %s MPa' % r['hot-spot stress rest [MPa]'])
if r['shell layer'] != 'top' or r['read-out origin'] != 'intersection' or float(r['offset from intersection line [mm]']) != 0.0:
    sys.exit('shell columns %r %r %r' % (r['shell layer'], r['read-out origin'], r['offset from intersection line [mm]']))
if abs(float(r['hot-spot location y [mm]'])) > 1e-9:
    sys.exit('hot-spot location off the intersection line: y = %s' % r['hot-spot location y [mm]'])
print('shell hot-spot stress at x = 10 mm: %.2f MPa (beam theory 90 MPa)' % hot)
PY
echo "shell run ok"
