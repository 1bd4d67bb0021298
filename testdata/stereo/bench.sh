#!/usr/bin/env bash
# testdata/stereo/bench.sh: end-to-end timing of `walden stereo --json --file`
# on 200,000 small stereo molecules (the same file BenchmarkStereoFileProcess
# uses), with peak memory from /usr/bin/time -v. Run from anywhere:
#   testdata/stereo/bench.sh
# Prints molecules per second of wall time, CPU seconds and peak RSS.
set -euo pipefail
cd "$(dirname "$0")/../.."
dir=$(mktemp -d)
trap 'rm -rf "$dir"' EXIT
go build -o "$dir/walden" .
WALDEN_WRITE_STEREO_BENCH="$dir/in.smi" go test -run TestWriteStereoBenchInput -count=1 . >/dev/null
n=$(wc -l <"$dir/in.smi")
/usr/bin/time -v "$dir/walden" stereo --json --file "$dir/in.smi" >"$dir/out.json" 2>"$dir/time.txt"
out=$(wc -l <"$dir/out.json")
[[ $out -eq $n ]] || { echo "wrote $out lines for $n molecules" >&2; exit 1; }
wall=$(awk -F': ' '/Elapsed \(wall clock\)/ {print $2}' "$dir/time.txt")
user=$(awk -F': ' '/User time/ {print $2}' "$dir/time.txt")
sys=$(awk -F': ' '/System time/ {print $2}' "$dir/time.txt")
rss=$(awk -F': ' '/Maximum resident/ {print $2}' "$dir/time.txt")
secs=$(awk -v t="$wall" 'BEGIN { n = split(t, p, ":"); s = 0; for (i = 1; i <= n; i++) s = s * 60 + p[i]; print s }')
echo "molecules:        $n"
echo "wall clock:       $wall ($(awk -v n="$n" -v s="$secs" 'BEGIN { printf "%.0f", n / s }') molecules/s)"
echo "CPU (user+sys):   $(awk -v u="$user" -v s="$sys" 'BEGIN { printf "%.2f s", u + s }') ($(awk -v n="$n" -v u="$user" -v s="$sys" 'BEGIN { printf "%.0f", n / (u + s) }') molecules per CPU-second)"
echo "peak memory:      $rss kB"
echo "load average:     $(cut -d' ' -f1-3 /proc/loadavg) (other work on the machine slows the wall clock)"
