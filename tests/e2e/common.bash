# Sourced by the end-to-end scripts after `bin=$1; src=$2` (not a test itself: ctest runs tests/e2e/*.sh only).
# Sets $here (this folder) and $work (a temporary folder, removed on exit) and defines
#   fail MESSAGE             prints "FAIL: MESSAGE" and exits 1;
#   run_plan PLAN OUT CODES  runs `toehold run PLAN --output OUT --quiet` with the console text in
#                            $work/summary.txt (also printed) and the exit code in $code, and fails unless the
#                            code is one of CODES (e.g. "0 1": passing or exceeding, both complete runs).
here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
fail() { echo "FAIL: $*"; exit 1; }
run_plan() {
  "$bin" run "$1" --output "$2" --quiet > "$work/summary.txt" 2>&1
  code=$?
  cat "$work/summary.txt"
  case " $3 " in
    *" $code "*) ;;
    *) fail "$(basename "$1"): exit code $code, expected one of $3" ;;
  esac
}
