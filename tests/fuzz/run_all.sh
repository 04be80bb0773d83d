#!/bin/sh
# Builds every libFuzzer target of tests/fuzz with clang and runs each for
# SECONDS seconds on a copy of its seed corpus (tests/fuzz/corpus/NAME, NAME
# being the target without "_fuzz"). Exits non-zero on the first finding;
# the crashing input is left in the build folder (crash-*, see the log).
#
# usage: tests/fuzz/run_all.sh SECONDS [BUILD_DIR]     (from the repository root)
# e.g. in CI: tests/fuzz/run_all.sh 120
set -eu

seconds=${1:?usage: tests/fuzz/run_all.sh SECONDS [BUILD_DIR]}
build=${2:-build-fuzz}
case $seconds in
  ''|*[!0-9]*) echo "run_all.sh: SECONDS must be a whole number, found '$seconds'" >&2; exit 2 ;;
esac

root=$(cd "$(dirname "$0")/../.." && pwd)
cd "$root"
targets=$(for f in tests/fuzz/*_fuzz.cpp; do basename "$f" .cpp; done)

CXX=${CXX:-clang++} cmake -S . -B "$build" -DAPOGRAPH_FUZZ=ON -DAPOGRAPH_TESTS=OFF \
  -DCMAKE_BUILD_TYPE=RelWithDebInfo > /dev/null
# shellcheck disable=SC2086 # one word per target
cmake --build "$build" -j2 --target $targets

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT INT TERM
for t in $targets; do
  corpus="$work/${t%_fuzz}"
  mkdir -p "$corpus"
  cp -R "tests/fuzz/corpus/${t%_fuzz}/." "$corpus/"
  echo "== $t: $seconds s"
  status=0
  (cd "$build" && "./$t" -max_total_time="$seconds" -max_len=4096 -print_final_stats=1 \
    "$corpus") > "$work/$t.log" 2>&1 || status=$?
  tail -n 25 "$work/$t.log"
  if [ "$status" -ne 0 ]; then
    cp "$work/$t.log" "$build/$t.log"
    echo "run_all.sh: $t found something (exit $status); log in $build/$t.log" >&2
    exit 1
  fi
done
