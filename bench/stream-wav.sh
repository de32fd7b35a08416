#!/usr/bin/env bash
# Streams a 1 GB float32 WAV through `wavecheck info` and reports throughput and peak memory.
# Target: memory must not grow with the file (peak RSS far below the file size).
# usage: bench/stream-wav.sh [MEGABYTES]   (default 1024)
set -euo pipefail
cd "$(dirname "$0")/.."
megabytes="${1:-1024}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
dotnet build bench/WaveCheck.Bench -c Release -o "$tmp/gen" -v q -nologo >/dev/null
dotnet build src/WaveCheck.Cli -c Release -v q -nologo >/dev/null
cli="src/WaveCheck.Cli/bin/Release/net10.0/wavecheck.dll"

wav="$tmp/big.wav"
dotnet "$tmp/gen/WaveCheck.Bench.dll" "$wav" "$megabytes"
bytes="$(stat -c %s "$wav")"

# Drop nothing from the page cache (not ours to do); the file was just written, so this measures parsing, not the disk.
/usr/bin/time -v dotnet "$cli" info "$wav" --json "$tmp/info.json" >"$tmp/info.txt" 2>"$tmp/time.txt"
frames="$(grep -m1 '"sampleCount"' "$tmp/info.json" | tr -dc '0-9')"

wall="$(grep 'Elapsed (wall clock)' "$tmp/time.txt" | awk '{print $NF}')"
rss_kb="$(grep 'Maximum resident set size' "$tmp/time.txt" | awk '{print $NF}')"
seconds="$(echo "$wall" | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')"
awk -v b="$bytes" -v f="$frames" -v s="$seconds" -v r="$rss_kb" 'BEGIN {
  printf "file            %.0f MB (%d frames, float32 mono)\n", b/1048576, f
  printf "wall time       %.2f s\n", s
  printf "throughput      %.0f MB/s, %.3g samples/s\n", b/1048576/s, f/s
  printf "peak RSS        %.0f MB\n", r/1024
}'
