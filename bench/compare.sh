#!/usr/bin/env bash
# The side-by-side table of issue 16: `wavecheck analyze --json` against the numpy peer (bench/peer/numpy_peer.py,
# numpy's rfft over all windows at once, harmonic groups and 2-9 kHz bands) on the same 50 kS/s mono captures of
# 1 minute, 10 minutes and 1 hour (float32), and a 24-hour PCM16 capture (8.6 GB: generated, measured, deleted).
# Whole processes, start-up included: wall time, CPU time (user + system) and peak RSS from /usr/bin/time -v. Tool and
# peer runs alternate (tool, peer, tool, peer, ...) so a swing in the shared machine's speed hits both alike; the
# table gives the median and the best of RUNS each, and the ratio peer/tool of the medians and of the bests.
#
# TOOL: the command to time (default: the shipped build from bench/publish.sh in artifacts/publish/linux-x64 if it
#       exists, else `dotnet` on the Release build's wavecheck.dll). RUNS (default 5) runs of each on 1 and 10
#       minutes, LONG_RUNS (default 3) on 1 hour; DAY=0 skips the 24-hour capture, PEER_DAY=1 times the peer on it
#       too (some minutes); LENGTHS (default "1 10 60") picks the float32 captures, minutes (LENGTHS= DAY=0: start-up
#       only). Captures go to $BENCH_DIR (default /tmp/wavecheck-bench), the 24-hour one is deleted after.
# usage: bash bench/compare.sh
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/.." && pwd)"
out="${BENCH_DIR:-/tmp/wavecheck-bench}"
runs="${RUNS:-5}"
long_runs="${LONG_RUNS:-3}"
mkdir -p "$out"
py=/usr/bin/python3

if [[ -n "${TOOL:-}" ]]; then
  read -r -a tool <<< "$TOOL"
elif [[ -x "$root/artifacts/publish/linux-x64/wavecheck" ]]; then
  tool=("$root/artifacts/publish/linux-x64/wavecheck")
else
  dotnet build "$root/src/WaveCheck.Cli" -c Release -v q -nologo > /dev/null
  tool=(dotnet "$root/src/WaveCheck.Cli/bin/Release/net10.0/wavecheck.dll")
fi
echo "tool: ${tool[*]}"
echo "peer: $py bench/peer/numpy_peer.py (numpy $($py -c 'import numpy; print(numpy.__version__)'))"
echo "machine: $(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg) at start"

# capture NAME MINUTES KIND: the path of the capture, written unless it exists.
capture() {
  local path="$out/compare-$1.wav"
  if [[ ! -f "$path" ]]; then
    $py "$here/peer/make_capture.py" "$path.part" "$2" "$3"
    mv "$path.part" "$path"
  fi
  echo "$path"
}

# timed WHO CMD...: runs CMD under /usr/bin/time -v; prints "wall_s cpu_s rss_mb".
timed() {
  local who="$1" rc=0
  shift
  /usr/bin/time -v "$@" > "$out/compare.out" 2> "$out/compare.time" || rc=$?
  # `analyze` exits 1 when a verdict fails (a result, not an error); anything else is an error.
  if [[ $rc -gt 1 || ($who == peer && $rc -ne 0) ]]; then
    echo "$who failed (exit $rc): $*" >&2
    tail -n 5 "$out/compare.time" >&2
    exit 1
  fi
  awk '/Elapsed \(wall clock\)/ { n = split($NF, p, ":"); wall = (n == 3) ? p[1] * 3600 + p[2] * 60 + p[3] : p[1] * 60 + p[2] }
       /User time/ { user = $NF } /System time/ { sys = $NF } /Maximum resident set size/ { rss = $NF }
       END { printf "%.3f %.2f %.0f\n", wall, user + sys, rss / 1024 }' "$out/compare.time"
}

run_tool() { timed tool "${tool[@]}" analyze "$1" --scale 1A --sensor dc --json "$out/compare-tool.json"; }
run_peer() { timed peer $py "$here/peer/numpy_peer.py" "$1"; }

# stats LINES...: "median_wall best_wall median_cpu max_rss" over "wall cpu rss" lines.
stats() {
  printf '%s\n' "$@" | sort -n | awk '{ w[NR] = $1; c[NR] = $2; if ($3 > r) r = $3 }
    END { printf "%.3f %.3f %.2f %d\n", (NR % 2) ? w[(NR + 1) / 2] : (w[NR / 2] + w[NR / 2 + 1]) / 2, w[1], c[int((NR + 1) / 2)], r }'
}

rows=()
# measure LABEL PATH SAMPLES COUNT PEER(0/1)
measure() {
  local label="$1" path="$2" samples="$3" count="$4" with_peer="$5" t=() p=() i
  for ((i = 1; i <= count; i++)); do
    t+=("$(run_tool "$path")")
    if [[ $with_peer == 1 ]]; then
      p+=("$(run_peer "$path")")
    fi
    echo "  $label run $i: tool ${t[-1]}${p:+; peer ${p[-1]}}  (wall s, CPU s, peak MB)"
  done
  local ts ps="- - - -"
  ts="$(stats "${t[@]}")"
  if [[ $with_peer == 1 ]]; then ps="$(stats "${p[@]}")"; fi
  rows+=("$label $samples $ts $ps")
}

# Start-up: `--version` and `analyze` of a 1-second capture, STARTUP_RUNS (default 9) each, interleaved with the
# JIT build (`dotnet wavecheck.dll`) when the timed tool is another build; target < 0.1 s wall.
jit=(dotnet "$root/src/WaveCheck.Cli/bin/Release/net10.0/wavecheck.dll")
one_second="$(capture 1s 0.016666666666666666 float32)"
startup_rows=()
startup() {
  local i a=() b=() c=() d=()
  for ((i = 1; i <= ${STARTUP_RUNS:-9}; i++)); do
    a+=("$(timed tool "${tool[@]}" --version)")
    b+=("$(run_tool "$one_second")")
    if [[ "${tool[*]}" != "${jit[*]}" && -f "${jit[1]}" ]]; then
      c+=("$(timed tool "${jit[@]}" --version)")
      d+=("$(timed tool "${jit[@]}" analyze "$one_second" --scale 1A --sensor dc --json "$out/compare-tool.json")")
    fi
  done
  startup_rows+=("tool --version: $(stats "${a[@]}")" "tool analyze 1 s: $(stats "${b[@]}")")
  if ((${#c[@]})); then
    startup_rows+=("JIT --version: $(stats "${c[@]}")" "JIT analyze 1 s: $(stats "${d[@]}")")
  fi
}
if [[ "${STARTUP:-1}" != 0 ]]; then
  echo "== start-up"
  startup
fi

echo "== interleaved runs (tool, then peer)"
for minutes in ${LENGTHS-1 10 60}; do
  case "$minutes" in
    1) measure "1 min" "$(capture 1min 1 float32)" 3000000 "$runs" 1 ;;
    10) measure "10 min" "$(capture 10min 10 float32)" 30000000 "$runs" 1 ;;
    60) measure "1 hour" "$(capture 60min 60 float32)" 180000000 "$long_runs" 1 ;;
  esac
done
if [[ "${DAY:-1}" != 0 ]]; then
  day="$(capture 24h-pcm16 1440 pcm16)"
  measure "24 hours" "$day" 4320000000 1 "${PEER_DAY:-0}"
  rm -f "$day"
fi

echo
echo "== wavecheck analyze --json vs numpy peer, 50 kS/s mono; whole process; median (best) of the runs above"
printf '%-9s | %-17s | %-8s | %-7s | %-17s | %-8s | %-7s | %-13s | %s\n' capture "tool wall s" "tool CPU" "tool MB" \
  "peer wall s" "peer CPU" "peer MB" "peer/tool" "tool Msamples/s"
for row in "${rows[@]}"; do
  # shellcheck disable=SC2086
  set -- $row
  label="$1 $2"
  shift 2
  awk -v l="$label" -v n="$1" -v tm="$2" -v tb="$3" -v tc="$4" -v tr="$5" -v pm="$6" -v pb="$7" -v pc="$8" -v pr="$9" 'BEGIN {
    peer = (pm == "-") ? "-" : sprintf("%.2f (%.2f)", pm, pb)
    ratio = (pm == "-") ? "-" : sprintf("%.1f (%.1f)", pm / tm, pb / tb)
    printf "%-9s | %-17s | %-8s | %-7s | %-17s | %-8s | %-7s | %-13s | %.0f (%.0f)\n", l, sprintf("%.2f (%.2f)", tm, tb),
      tc, tr, peer, pc, pr, ratio, n / tm / 1e6, n / tb / 1e6 }'
done
if ((${#startup_rows[@]})); then
  echo
  echo "== start-up (median wall, best wall, median CPU s, peak MB); target < 0.1 s wall"
  printf '%s\n' "${startup_rows[@]}"
fi
echo "machine: load average $(cut -d' ' -f1-3 /proc/loadavg) at the end (2 cores shared with other work: read ratios, not absolute times)"
