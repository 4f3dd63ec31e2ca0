#!/usr/bin/env bash
# End to end: the demo run writes report.html, results.json and view_results.py; the JSON validates against the
# schema in docs/results-schema.md; the report shows every toe and station with the JSON's numbers; the provenance
# hashes equal sha256sum's of the inputs.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"
out=$work/results
run_plan "$src/meshes/demo/frame_rail.toml" "$out" "0 1"
for f in report.html results.json view_results.py; do
  [ -s "$out/$f" ] || fail "missing output $f"
  grep -q "$out/$f" "$work/summary.txt" || fail "the summary does not list $out/$f"
done
python3 "$here/report_schema_check.py" "$out/results.json" "$src/docs/results-schema.md" || fail "schema"
python3 "$here/report_check.py" "$out" "$src/meshes/demo/frame_rail.toml" || fail "report against JSON"
python3 -c "import ast, sys; ast.parse(open(sys.argv[1]).read())" "$out/view_results.py" ||
  fail "view_results.py is not valid Python"
echo "report outputs ok"
