#!/bin/sh
# Regenerate the T-joint models: write the decks, solve them with ccx, convert the shell result to .vtu.
# Needs Debian's calculix-ccx (2.20) and /usr/bin/python3 with python3-vtk9. Usage: sh make_models.sh [work-dir]
set -eu
HERE=$(cd "$(dirname "$0")" && pwd)
WORK=${1:-$(mktemp -d /tmp/toehold-shell-ccx.XXXXXX)}
mkdir -p "$WORK"
cd "$WORK"
/usr/bin/python3 "$HERE/make_decks.py" .
for model in shell_tjoint solid_tjoint; do
  OMP_NUM_THREADS=1 ccx -i "$model" > "$model.log" 2>&1 || { tail -20 "$model.log"; exit 1; }
  grep -q "Job finished" "$model.log"
done
/usr/bin/python3 "$HERE/frd_to_shell_vtu.py" shell_tjoint.inp shell_tjoint.frd shell_tjoint.vtu \
  --region EBASE=1 --region EGUSSET=2 --excerpt shell_tjoint_frd_x10.txt --excerpt-line x=10
cp shell_tjoint.inp solid_tjoint.inp solid_tjoint.frd shell_tjoint.vtu shell_tjoint_frd_x10.txt "$HERE/"
echo "models written to $HERE (work dir $WORK)"
