#!/usr/bin/env bash
# A survey of N captures of M minutes at 50 kS/s (defaults 20 × 1 min), made with `wavecheck synth`, timed with
# /usr/bin/time -v: wall time, CPU share (about 200 % when both cores are used), peak RSS.
# Targets: both cores busy; memory bounded by the workers (one capture's analysis each), not by the captures.
# usage: bench/survey.sh [CAPTURES] [MINUTES]
set -euo pipefail
cd "$(dirname "$0")/.."
count="${1:-20}"
minutes="${2:-1}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
dotnet build src/WaveCheck.Cli -c Release -v q -nologo >/dev/null
cli="src/WaveCheck.Cli/bin/Release/net10.0/wavecheck.dll"

kinds=("composite:rms=12mA,motor=17Hz" "halfwave:peak=20mA,angle=90" "sixpulse:mean=9mA" "switching:rms=20mA,freq=8kHz,motor=40Hz")
for i in $(seq 1 "$count"); do
  kind="${kinds[$(( (i - 1) % ${#kinds[@]} ))]}"
  dotnet "$cli" synth "$kind" sine:rms=2mA noise:rms=0.05mA,seed="$i" --duration "${minutes}min" --rate 50kHz \
    --format pcm16 -o "$tmp/captures/c$(printf %02d "$i").wav" >/dev/null
done
bytes="$(du -sb "$tmp/captures" | cut -f1)"

/usr/bin/time -v dotnet "$cli" survey "$tmp/captures" --device A -o "$tmp/out" -q >"$tmp/survey.txt" 2>"$tmp/time.txt"
wall="$(grep 'Elapsed (wall clock)' "$tmp/time.txt" | awk '{print $NF}')"
seconds="$(echo "$wall" | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')"
cpu="$(grep 'Percent of CPU' "$tmp/time.txt" | awk '{print $NF}')"
rss_kb="$(grep 'Maximum resident set size' "$tmp/time.txt" | awk '{print $NF}')"
samples=$(( count * minutes * 60 * 50000 ))
awk -v n="$count" -v m="$minutes" -v b="$bytes" -v s="$seconds" -v c="$cpu" -v r="$rss_kb" -v k="$samples" 'BEGIN {
  printf "captures        %d × %g min at 50 kS/s (%.0f MB of PCM16 WAV)\n", n, m, b/1048576
  printf "wall time       %.2f s (%.3g samples/s over the survey)\n", s, k/s
  printf "CPU             %s (200 %% = both cores)\n", c
  printf "peak RSS        %.0f MB\n", r/1024
}'
