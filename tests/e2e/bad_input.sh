#!/usr/bin/env bash
# End to end: bad input gives a one-line error naming the problem, exit code 2, and no output folder.
set -uo pipefail
bin=$1; src=$2
source "$(dirname "$0")/common.bash"

expect_error() {  # expect_error <plan> <text the message must contain>
  local plan=$1 text=$2
  "$bin" run "$plan" --output "$work/out" > "$work/stdout" 2> "$work/stderr"
  local code=$?
  [ "$code" = 2 ] || { cat "$work/stderr"; fail "$plan: exit code $code, expected 2"; }
  grep -qF -- "$text" "$work/stderr" || { cat "$work/stderr"; fail "$plan: message lacks '$text'"; }
  [ ! -e "$work/out" ] || fail "$plan: an output folder was written"
  head -c 300 "$work/stderr"; echo
}

expect_error "$work/none.toml" "none.toml"

demo="$src/meshes/demo"
make_plan() {  # make_plan <name> <sed expression applied to the demo plan>
  sed -e "s|\"frame_rail.pvd\"|\"$demo/frame_rail.pvd\"|" -e "$2" "$demo/frame_rail.toml" > "$work/$1.toml"
}
make_plan missing_model 's|frame_rail.pvd|no_such_model.pvd|'
expect_error "$work/missing_model.toml" "no_such_model.pvd"
make_plan no_array 's|stress = "stress"|stress = "sigma"|'
expect_error "$work/no_array.toml" "'sigma'"
make_plan no_units 's|^length_unit = "mm"||'
expect_error "$work/no_units.toml" "length_unit"
make_plan bad_fat 's|IIW FAT 100|IIW FAT hundred|'
expect_error "$work/bad_fat.toml" "FAT hundred"
make_plan zero_t 's|^thickness = 12.0|thickness = 0.0|'
expect_error "$work/zero_t.toml" "thickness"
make_plan no_toe_nodes 's|marker_value = 2|marker_value = 7|'
expect_error "$work/no_toe_nodes.toml" "no node has value 7"

printf 'not a vtk file\n' > "$work/junk.vtu"
make_plan junk "s|$demo/frame_rail.pvd|$work/junk.vtu|; s|^pvd_step = .*||"
expect_error "$work/junk.toml" "junk.vtu"

"$bin" inspect "$work/junk.vtu" > /dev/null 2> "$work/stderr"
[ $? = 2 ] || fail "inspect of a junk file should exit 2"
echo "bad input ok"
