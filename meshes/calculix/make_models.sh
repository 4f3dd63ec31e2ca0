#!/bin/sh
# Regenerate the CalculiX test models: write the decks, solve them with ccx, keep deck and .frd here.
# Needs Debian's calculix-ccx (2.20) and /usr/bin/python3. Usage: sh make_models.sh [work-dir]
set -eu
HERE=$(cd "$(dirname "$0")" && pwd)
WORK=${1:-$(mktemp -d /tmp/toehold-ccx.XXXXXX)}
mkdir -p "$WORK"
cd "$WORK"
/usr/bin/python3 "$HERE/make_decks.py" .
for model in bar20 block_tet10 block_wedge15 steps_hex8; do
  OMP_NUM_THREADS=1 ccx -i "$model" > "$model.log" 2>&1 || { tail -20 "$model.log"; exit 1; }
  grep -q "Job finished" "$model.log"
  cp "$model.inp" "$model.frd" "$HERE/"
done
echo "models written to $HERE (work dir $WORK)"
