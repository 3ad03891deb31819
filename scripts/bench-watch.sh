#!/usr/bin/env bash
# Warm re-check benchmark: starts `plumb check --watch` on a copy of a derivation, saves it N times
# (each save adds a comment line, so the text really changes), and reports the time of each check
# as the watch prints it ("checked in S s": from the save being noticed to the results printed),
# the first (cold) one apart, with the median and the range of the warm ones, and the CPU time the
# whole process used for each warm check (all its threads: the JIT compilers and the garbage
# collector too), which a busy machine changes far less than the wall time. The load average is
# printed beside them: on a shared machine the wall times are only as quiet as the machine was.
#
#   scripts/bench-watch.sh [FILE] [SAVES]     (defaults: derivations/uniform-sphere.plumb, 20)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
file="${1:-$here/derivations/uniform-sphere.plumb}"
saves="${2:-20}"
work="$(mktemp -d)"
trap 'kill "$pid" 2>/dev/null || true; wait "$pid" 2>/dev/null || true; rm -rf "$work"' EXIT
copy="$work/$(basename "$file")"
cp "$file" "$copy"

"$here/plumb" check --watch --no-color "$copy" >"$work/out" 2>"$work/err" &
pid=$!

checks() { grep -c '^--- checked in' "$work/out" || true; }
wait_for() {  # wait until the watch has printed $1 checks (at most 10 minutes)
  for _ in $(seq 1 6000); do
    [ "$(checks)" -ge "$1" ] && return 0
    kill -0 "$pid" 2>/dev/null || { echo "the watch ended early:" >&2; cat "$work/err" >&2; exit 1; }
    sleep 0.1
  done
  echo "no check $1 after 10 minutes" >&2; exit 1
}

cpu() { awk '{print $14 + $15}' "/proc/$pid/stat"; }   # user + system clock ticks of the process
ticks="$(getconf CLK_TCK)"
wait_for 1
: >"$work/cpu"
for i in $(seq 1 "$saves"); do
  sleep 0.3   # apart from the debounce, so each save is its own check
  before="$(cpu)"
  echo "# save $i" >>"$copy"
  wait_for $((i + 1))
  echo "$(( $(cpu) - before ))" >>"$work/cpu"
done

sed -n 's/^--- checked in \([0-9.]*\) s.*/\1/p' "$work/out" | python3 -c '
import sys, statistics
t = [float(x) for x in sys.stdin.read().split()]
warm = sorted(t[1:])
print(f"file: '"$(basename "$file")"'")
print(f"first (cold) check: {t[0]:.3f} s")
print(f"warm re-checks ({len(warm)}): median {statistics.median(warm):.3f} s, min {warm[0]:.3f} s, max {warm[-1]:.3f} s")
cpu = sorted(int(x) / '"$ticks"' for x in open("'"$work/cpu"'").read().split())
print(f"CPU time of the process per warm re-check: median {statistics.median(cpu):.2f} s, min {cpu[0]:.2f} s, max {cpu[-1]:.2f} s")
'
echo "load average: $(cut -d" " -f1-3 /proc/loadavg) on $(nproc) cores"
