#!/bin/sh
# Regenerate the toehold demo model from scratch: gmsh geometry/mesh -> CalculiX deck ->
# ccx (two static steps) -> frame_rail_000.vtu, frame_rail_001.vtu, frame_rail.pvd here.
# Needs Debian's gmsh, python3-gmsh, calculix-ccx, python3-vtk9, numpy (run by /usr/bin/python3).
# Usage: sh make_demo.sh [work-dir]   (work dir keeps the .inp and .frd; default: a new temp dir)
set -eu
HERE=$(cd "$(dirname "$0")" && pwd)
WORK=${1:-$(mktemp -d /tmp/toehold-demo.XXXXXX)}
PY=/usr/bin/python3
mkdir -p "$WORK"
cd "$WORK"
echo "work dir: $WORK"
rm -f frame_rail.inp frame_rail.frd
"$PY" "$HERE/build_model.py" frame_rail.inp | grep -v '^Info' || true
test -s frame_rail.inp
ccx -v | grep -i version || true
OMP_NUM_THREADS=${OMP_NUM_THREADS:-2} ccx -i frame_rail > ccx.log 2>&1 || { tail -30 ccx.log; exit 1; }
grep -q "Job finished" ccx.log
"$PY" "$HERE/frd_to_vtu.py" frame_rail.frd --out-dir "$HERE" --stem frame_rail
"$PY" "$HERE/check_demo.py" "$HERE/frame_rail.pvd"
