#!/usr/bin/env bash
# Start-up benchmark (issue 15): a reference jar run the old way (java -jar REF) against the
# launcher bin/polebench on the jar built here, side by side and interleaved run by run on the
# same machine, timing CPU (user + system, from /usr/bin/time) and wall clock.
#
#   src/jmh/startup-benchmark.sh REF.jar [RUNS]
#
# Jobs: `--version`; `reconcile` on the bundled demo; with LARGE=1 also a 10-million-row sweep
# import (`inspect`, the file generated into a temporary folder, about 280 MB) and, when
# CASCADE_STAGE and CASCADE_SWEEP name a stage and its sweep, that reconcile (the issue's
# 33-capacitor cascade). Build first: mvn -q -DskipTests package (it makes target/polebench.jsa).
# Close other work first: on a loaded machine CPU times grow and scatter.
set -euo pipefail
ref=${1:?usage: startup-benchmark.sh REF.jar [RUNS]}
runs=${2:-10}
here=$(cd "$(dirname "$0")/../.." && pwd -P)
launcher="$here/bin/polebench"
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cd "$work"

jobs=("--version" "reconcile")
if [ "${LARGE:-0}" = 1 ]; then
  awk 'BEGIN { print "frequency_hz,gain_db,phase_deg"; n = 10000000
    for (i = 0; i < n; i++) { f = 0.5 * exp(i * log(2e4) / n); w = f / 3.0
      printf "%.9g,%.6f,%.4f\n", f, 20 * log(w / sqrt(1 + w * w)) / log(10) + 20, 90 - atan2(w, 1) * 57.29578 } }' \
    > "$work/rows-1e7.csv"
  jobs+=("inspect $work/rows-1e7.csv")
  if [ -n "${CASCADE_STAGE:-}" ] && [ -n "${CASCADE_SWEEP:-}" ]; then
    jobs+=("reconcile --stage $CASCADE_STAGE --sweep $CASCADE_SWEEP")
  fi
fi

# one timed run: prints "cpu_seconds wall_seconds" (the last line of time's file: a non-zero exit,
# such as the demo's failed verdict, adds a line before it)
timed() {
  /usr/bin/time -f "%U %S %e" -o "$work/t" "$@" > /dev/null 2>&1 || true
  tail -n 1 "$work/t" | awk '{ printf "%.3f %.3f\n", $1 + $2, $3 }'
}

printf '%-40s %-9s %8s %8s %8s %8s\n' job runner "cpu mean" "cpu med" "wall mean" "wall med"
for job in "${jobs[@]}"; do
  : > "$work/ref.txt"; : > "$work/new.txt"
  for ((i = 0; i < runs; i++)); do
    # shellcheck disable=SC2086  # the job is a command line meant to split into words
    timed java -jar "$ref" $job >> "$work/ref.txt"
    # shellcheck disable=SC2086
    timed "$launcher" $job >> "$work/new.txt"
  done
  for who in ref new; do
    cpu_med=$(sort -n -k1,1 "$work/$who.txt" | awk '{ v[NR] = $1 } END { print v[int((NR + 1) / 2)] }')
    wall_med=$(sort -n -k2,2 "$work/$who.txt" | awk '{ v[NR] = $2 } END { print v[int((NR + 1) / 2)] }')
    awk -v job="${job:0:40}" -v who="$who" -v cm="$cpu_med" -v wm="$wall_med" '
      { c += $1; w += $2 } END { printf "%-40s %-9s %8.3f %8.3f %8.3f %8.3f\n", job, who, c / NR, cm, w / NR, wm }' \
      "$work/$who.txt"
  done
  awk 'NR == FNR { r += $1; n++; next } { m += $1; k++ } END { printf "%-40s ratio of CPU means new/ref: %.2f\n", "", (m / k) / (r / n) }' \
    "$work/ref.txt" "$work/new.txt"
done
