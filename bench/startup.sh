#!/usr/bin/env bash
# Cold-start timing of the launcher, side by side with `java -version` on the same machine at the same
# moment (the ratio is what holds on a noisy machine). Usage: bench/startup.sh [RUNS]   (default 7)
# Each run is a fresh JVM, as a user's check is; the medians are printed in seconds.
set -euo pipefail
cd "$(dirname "$0")/.."
runs="${1:-7}"
./plumb --version >/dev/null   # builds the jar and the start-up cache first, outside the timing

median() { sort -n | awk '{a[NR]=$1} END {print (NR%2) ? a[(NR+1)/2] : (a[NR/2]+a[NR/2+1])/2}'; }
time_of() {
  local start end
  start=$(date +%s%N)
  "$@" >/dev/null 2>&1 || true
  end=$(date +%s%N)
  echo "scale=3; ($end - $start)/1000000000" | bc
}

declare -A samples
cases=("java -version" "./plumb check derivations/uniform-sphere.plumb" "./plumb check derivations/polytrope.plumb"
       "./plumb check examples/broken-syntax.plumb" "./plumb check examples/wrong-units-balance.plumb")
for ((i = 0; i < runs; i++)); do
  for c in "${cases[@]}"; do
    # shellcheck disable=SC2086
    samples["$c"]+="$(time_of $c) "
  done
done
jv=$(echo ${samples["java -version"]} | tr ' ' '\n' | median)
printf '%-55s %8s %8s\n' "command ($runs runs each, interleaved)" "median s" "x java"
for c in "${cases[@]}"; do
  m=$(echo ${samples["$c"]} | tr ' ' '\n' | median)
  printf '%-55s %8.3f %8.1f\n' "$c" "$m" "$(echo "scale=2; $m / $jv" | bc)"
done
echo "load average: $(cut -d' ' -f1-3 /proc/loadavg); JVM used by the launcher: $(sed -n 's/^ *java_bin=//p' plumb | head -1) (see the launcher)"
