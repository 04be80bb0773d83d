#!/bin/sh
# Whole jobs from the command line, side by side with the Python a scholar
# would otherwise write (tests/bench/python/: csv + sqlite3 to load, SciPy
# least_squares with the same Cauchy loss to fit). Run on demand, not in CI;
# needs Debian's python3-scipy.
#
# usage: tests/bench/whole_jobs.sh [TABLES] [ROWS] [RUNS] [BUILD_DIR]
#        (from the repository root; defaults 1000 360 3 build-bench)
#
# For each run, in turn (so that a drifting machine load hits both alike):
#   load:  apograph import --csv DIR/sheet_*.csv   vs  load_sheets.py DIR DB
#   fit:   apograph fit --all --model solar-eccentric --sign signed
#                                                   vs  fit_sheets.py DIR
#          (and apograph fit --all ... --cauchy-only: the same loss alone)
# and prints user+system CPU seconds and wall seconds of each whole process
# (start-up included), then the medians and the ratios of the medians. The
# estimates of both fits are compared sheet by sheet (largest difference).
set -eu
tables=${1:-1000}
rows=${2:-360}
runs=${3:-3}
build=${4:-build-bench}
root=$(cd "$(dirname "$0")/../.." && pwd)
apograph="$root/$build/apograph"
py="$root/tests/bench/python"
[ -x "$apograph" ] || { echo "whole_jobs.sh: no $apograph (build it first)" >&2; exit 2; }
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT INT TERM
/usr/bin/python3 "$py/make_sheets.py" --out "$work/sheets" --tables "$tables" --rows "$rows" --seed 1

# timed LABEL COMMAND...: appends "LABEL cpu wall" to $work/times
timed() {
  label=$1; shift
  /usr/bin/time -f "$label %U %S %e" -a -o "$work/raw" "$@" > "$work/out.$label" 2>/dev/null || true
}
i=0
while [ "$i" -lt "$runs" ]; do
  rm -f "$work/a.sqlite" "$work/p.sqlite"
  timed apograph-load "$apograph" import --csv "$work"/sheets/sheet_*.csv --witness K \
    --db "$work/a.sqlite" --format csv
  timed python-load /usr/bin/python3 "$py/load_sheets.py" "$work/sheets" "$work/p.sqlite"
  timed apograph-fit "$apograph" fit --all --model solar-eccentric --sign signed \
    --db "$work/a.sqlite" --format csv
  timed python-fit /usr/bin/python3 "$py/fit_sheets.py" "$work/sheets"
  timed apograph-cauchy "$apograph" fit --all --model solar-eccentric --sign signed \
    --cauchy-only --db "$work/a.sqlite" --format csv
  i=$((i + 1))
done
echo "$tables tables x $rows rows, $runs runs each, load average $(cut -d' ' -f1-3 /proc/loadavg)"
awk '$1 ~ /^(apograph|python)-/ { cpu[$1] = cpu[$1] " " ($2 + $3); wall[$1] = wall[$1] " " $4 }
  function median(list,   n, a, i, j, t) {
    n = split(list, a, " ")
    for (i = 1; i <= n; i++) for (j = i + 1; j <= n; j++) if (a[j] < a[i]) { t = a[i]; a[i] = a[j]; a[j] = t }
    return n % 2 ? a[(n + 1) / 2] : (a[n / 2] + a[n / 2 + 1]) / 2
  }
  END {
    for (k in cpu) { c[k] = median(cpu[k]); w[k] = median(wall[k])
      printf "%-14s cpu %6.2f s  wall %6.2f s   (cpu of each run:%s)\n", k, c[k], w[k], cpu[k] }
    printf "load: python / apograph = %.1fx cpu, %.1fx wall\n", c["python-load"] / c["apograph-load"], w["python-load"] / w["apograph-load"]
    printf "fit:  python / apograph = %.1fx cpu, %.1fx wall\n", c["python-fit"] / c["apograph-fit"], w["python-fit"] / w["apograph-fit"]
    printf "fit, the Cauchy loss alone (--cauchy-only): python / apograph = %.1fx cpu, %.1fx wall\n", c["python-fit"] / c["apograph-cauchy"], w["python-fit"] / w["apograph-cauchy"]
    printf "load + fit: python / apograph = %.1fx cpu, %.1fx wall\n", (c["python-load"] + c["python-fit"]) / (c["apograph-load"] + c["apograph-fit"]), (w["python-load"] + w["python-fit"]) / (w["apograph-load"] + w["apograph-fit"])
    printf "cells per second, whole import process: apograph %.0f (cpu), python %.0f (cpu)\n", '"$tables * $rows"' / c["apograph-load"], '"$tables * $rows"' / c["python-load"]
  }' "$work/raw"
# The fits' estimates, sheet by sheet: the Cauchy loss alone is the same
# loss as the script's; the default adds the least-squares refit on the
# inliers (fit.hpp), so it may differ by a little more.
compare() {
  awk -F, -v label="$1" 'NR == FNR { if ($1 ~ /^sheet_/) { sub(/\.csv$/, "", $1); p[$1] = $2 }; next }
    FNR > 1 { split($10, e, "[=+]"); d = e[2] - p[$1]; if (d < 0) d = -d; if (d > m) m = d; n++ }
    END { printf "estimates compared (%s): %d sheets, largest |apograph - python| = %.2g\n", label, n, m }' \
    "$work/out.python-fit" "$2"
}
compare "--cauchy-only, the same loss" "$work/out.apograph-cauchy"
compare "default, with the refit on the inliers" "$work/out.apograph-fit"
