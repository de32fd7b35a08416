#!/usr/bin/python3
"""Writes a bench capture of MINUTES minutes at RATE S/s as mono WAV, float32 or PCM16, in 10 s chunks (memory stays
small at any length). Invented scenario, the same as bench/analyze.sh: a workshop dimmer (phase-controlled
half-wave at 49.97 Hz) on 4 mA smooth DC, a 16 kHz drive switching tone and noise; full scale 1.0 = 1 A (analyse
with --scale 1A). A PCM16 file over 4 GB cannot carry its sizes in the RIFF header (32-bit fields): it is written
with RIFF and data sizes of 0xFFFFFFFF, the usual marker of a stream of unknown length.

usage: make_capture.py PATH MINUTES [float32|pcm16] [RATE]
"""
import struct
import sys

import numpy as np


def main():
    path, minutes = sys.argv[1], float(sys.argv[2])
    kind = sys.argv[3] if len(sys.argv) > 3 else "float32"
    rate = int(sys.argv[4]) if len(sys.argv) > 4 else 50000
    n = int(minutes * 60 * rate)
    tag, width = (3, 4) if kind == "float32" else (1, 2)
    data = n * width
    riff = 36 + data if 36 + data < 2**32 else 0xFFFFFFFF
    rng = np.random.default_rng(1)
    with open(path, "wb") as f:
        f.write(b"RIFF" + struct.pack("<I", riff) + b"WAVE")
        f.write(b"fmt " + struct.pack("<IHHIIHH", 16, tag, 1, rate, rate * width, width, 8 * width))
        f.write(b"data" + struct.pack("<I", data if data < 2**32 else 0xFFFFFFFF))
        step = 10 * rate
        # After 10 minutes the first 10 are written again: 49.97 Hz and 16 kHz both complete whole cycles in 600 s,
        # so the waveform runs on without a jump (only the noise repeats), and a day is written in seconds.
        period = 600 * rate
        chunks = []
        for start in range(0, n, step):
            if start >= period:
                f.write(chunks[(start % period) // step][: width * min(step, n - start)])
                continue
            i = np.arange(start, min(n, start + step), dtype=np.float64)
            t = i / rate
            theta = np.mod(2 * np.pi * 49.97 * t, 2 * np.pi)
            x = 0.004 + np.where((theta >= 1.2) & (theta < np.pi), 0.03 * np.sin(theta), 0.0)
            x += 0.002 * np.sin(2 * np.pi * 16000 * t) + 0.0002 * rng.standard_normal(len(i))
            if kind == "float32":
                chunk = x.astype("<f4").tobytes()
            else:
                chunk = np.clip(np.round(x * 32768), -32768, 32767).astype("<i2").tobytes()
            f.write(chunk)
            if n > period:
                chunks.append(chunk)
    print(f"wrote {path}: {n} samples, {kind}", file=sys.stderr)


if __name__ == "__main__":
    main()
