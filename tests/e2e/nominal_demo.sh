#!/usr/bin/env bash
# End to end: the nominal-stress demo plan (meshes/demo/frame_rail_nominal.toml) puts the nominal method beside the
# hot-spot method in every output: the console table, stations.csv columns, stations.vtp arrays, results.json
# (validated against docs/results-schema.md) and a section of report.html.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/demo/frame_rail_nominal.toml" "$out" "0 1"
grep -q "Nominal-stress method beside the hot-spot method" "$work/summary.txt" || fail "summary lacks the nominal table"
# The section 50 mm from the attachment carries the rail plate's membrane stress: 144000 N / (240 x 12 mm2) = 50 MPa
# running and -43200 / 2880 = -15 MPa braking (meshes/demo/README.md), a range of 65.0 MPa [D].
grep -Eq "^south toe +section +65\.0 " "$work/summary.txt" || fail "south toe nominal range is not 65.0 MPa"
grep -q "infinite-life weld check: factor of safety" "$work/summary.txt" || fail "summary lacks the infinite-life check"
grep -Eq "^north toe +surface-distance " "$work/summary.txt" || fail "north toe lacks its surface-distance row"
head -1 "$out/stations.csv" | grep -q "structural stress concentration factor \[-\]" || fail "CSV lacks the SCF column"
head -1 "$out/stations.csv" | grep -q "nominal utilization \[-\]" || fail "CSV lacks the nominal utilization column"
grep -q "nominal stress range \[MPa\]" "$out/stations.vtp" || fail "stations.vtp lacks the nominal range array"
grep -q "Nominal-stress method beside the hot-spot method" "$out/report.html" || fail "report lacks the nominal section"
grep -q "Textbook infinite-life weld check" "$out/report.html" || fail "report lacks the infinite-life table"
python3 "$here/report_schema_check.py" "$out/results.json" "$src/docs/results-schema.md" || fail "schema"
python3 "$here/report_check.py" "$out" "$src/meshes/demo/frame_rail_nominal.toml" || fail "report against JSON"
python3 - "$out/results.json" <<'PY' || fail "results.json nominal values"
import json, sys
doc = json.load(open(sys.argv[1]))
south, north = doc["toes"]
n = south["nominal"]
assert n["source"] == "section" and abs(n["check"]["range"] - 65.0) < 0.05, n["check"]
# membrane 50 and -15 MPa: alternating 32.5, mean 17.5 MPa before K_fs [D]
life = n["infinite_life"]
assert abs(life["nominal_alternating"] - 32.5) < 0.05 and abs(life["nominal_mean"] - 17.5) < 0.05, life
assert life["concentration_factor"] == 1.5  # transverse fillet toe, B&N 9th ed. Table 9-5 [S]
for s in south["stations"]:
    if s["result"] is not None:
        scf = s["nominal"]["concentration_factor"]
        assert abs(scf - s["result"]["range"] / n["check"]["range"]) < 1e-9 * scf, s["id"]
assert north["nominal"]["per_station"] and all(s["nominal"]["sample_position"] for s in north["stations"])
print("nominal values in results.json ok")
PY
echo "nominal demo ok"
