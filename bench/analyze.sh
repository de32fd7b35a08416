#!/usr/bin/env bash
# Times `wavecheck analyze` on a generated 10-minute, 50 kS/s float32 WAV (wall time, peak RSS, samples/s), then the
# engine alone (bench/AnalyzeBench: synthetic capture, no file reading).
# Targets: >= 50 million samples/s through the whole analysis (a 10-minute 50 kS/s capture in < 1 s after start-up),
# peak memory < 200 MB. Generated data goes to $BENCH_DIR (default /tmp/wavecheck-bench) and is not committed.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/.." && pwd)"
out="${BENCH_DIR:-/tmp/wavecheck-bench}"
minutes="${MINUTES:-10}"
rate=50000
mkdir -p "$out"
wav="$out/analyze-${minutes}min-50k.wav"

if [[ ! -f "$wav" ]]; then
  # Invented scenario: a workshop dimmer (phase-controlled half-wave at 49.97 Hz) on 4 mA smooth DC, a 16 kHz drive
  # switching tone and noise; float32 mono, values in amperes (full scale 1.0 = 1 A).
  /usr/bin/python3 - "$wav" "$minutes" "$rate" <<'PY'
import struct
import sys
import numpy as np
path, minutes, rate = sys.argv[1], float(sys.argv[2]), int(sys.argv[3])
n = int(minutes * 60 * rate)
rng = np.random.default_rng(1)
with open(path, "wb") as f:
    # RIFF/WAVE, format 3 (IEEE float), mono, 32-bit; written in 10 s chunks to keep memory small.
    data = n * 4
    f.write(b"RIFF" + struct.pack("<I", 36 + data) + b"WAVE")
    f.write(b"fmt " + struct.pack("<IHHIIHH", 16, 3, 1, rate, rate * 4, 4, 32))
    f.write(b"data" + struct.pack("<I", data))
    for start in range(0, n, 10 * rate):
        i = np.arange(start, min(n, start + 10 * rate), dtype=np.float64)
        t = i / rate
        theta = np.mod(2 * np.pi * 49.97 * t, 2 * np.pi)
        x = 0.004 + np.where((theta >= 1.2) & (theta < np.pi), 0.03 * np.sin(theta), 0.0)
        x += 0.002 * np.sin(2 * np.pi * 16000 * t) + 0.0002 * rng.standard_normal(len(i))
        f.write(x.astype("<f4").tobytes())
print(f"wrote {path}: {n} samples")
PY
fi

dotnet build "$root/src/WaveCheck.Cli" -c Release -v q -nologo > /dev/null
dotnet build "$here/AnalyzeBench" -c Release -v q -nologo > /dev/null
cli="$root/src/WaveCheck.Cli/bin/Release/net10.0/wavecheck"
samples=$(( ${minutes%.*} * 60 * rate ))

echo "== wavecheck analyze (whole pipeline, includes process start-up)"
if /usr/bin/time -v "$cli" analyze "$wav" --scale 1A --sensor dc --json "$out/analysis.json" > "$out/analyze.out" 2> "$out/time.txt"; then
  wall=$(grep "Elapsed (wall clock)" "$out/time.txt" | awk '{print $NF}')
  rss=$(grep "Maximum resident set size" "$out/time.txt" | awk '{print $NF}')
  secs=$(echo "$wall" | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')
  echo "wall ${wall} (${secs} s), peak RSS $((rss / 1024)) MB, $(awk -v n="$samples" -v s="$secs" 'BEGIN { printf "%.1f", n / s / 1e6 }') Msamples/s"
else
  echo "wavecheck analyze failed (is the WAV reader merged?):"
  grep "^wavecheck:" "$out/time.txt" || tail -n 3 "$out/time.txt"
fi

echo "== engine only (bench/AnalyzeBench, synthetic capture, after warm-up)"
dotnet "$here/AnalyzeBench/bin/Release/net10.0/AnalyzeBench.dll" "$minutes" "$rate"
dotnet "$here/AnalyzeBench/bin/Release/net10.0/AnalyzeBench.dll" stages "$rate"
