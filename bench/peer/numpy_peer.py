#!/usr/bin/python3
"""The numpy peer of `wavecheck analyze` for bench/compare.sh: a plain vectorised script doing a subset of the
tool's work on a mono WAV capture (IEEE float32 or PCM16), so the tool's speed can be compared with what a
competent script achieves.

What it computes, per 10-cycle window (IEC 61000-4-7 window of about 200 ms) at the nominal mains frequency:
RMS, mean, positive and negative peaks, the rectangular-window one-sided spectrum by numpy.fft.rfft over all
windows of a chunk at once, the harmonic groups of orders 1..50 (IEC 61000-4-7 §5.6: the bin of the harmonic, its
four neighbours on each side and half of the bins midway to the next harmonics) and the 200 Hz bands centred
2100 ... 8900 Hz (IEC 61000-4-7 Annex B, edges as in src/WaveCheck.Core/Signal/Groups/FrequencyBands.cs); over the
capture: RMS of each group and band, worst-window RMS, mean, peaks. What it leaves out (the tool does it): mains
frequency tracking (windows here have the nominal length), touch-current filters, waveform shape, events,
the assessment.

Memory: windows are taken in chunks of CHUNK_S seconds (default 600: a 10-minute capture in one go, "all windows at
once"; longer captures chunk by chunk, else a 24-hour capture would need tens of GB).

usage: numpy_peer.py CAPTURE.wav [MAINS_HZ] > summary.json
"""
import json
import os
import struct
import sys

import numpy as np


def read_header(path):
    """Returns (sample rate, numpy dtype, scale to amperes, data offset, sample count) of a mono RIFF/WAVE file."""
    with open(path, "rb") as f:
        riff = f.read(12)
        if riff[:4] != b"RIFF" or riff[8:12] != b"WAVE":
            raise SystemExit(f"numpy_peer: {path}: not a RIFF/WAVE file")
        fmt = None
        while True:
            head = f.read(8)
            if len(head) < 8:
                raise SystemExit(f"numpy_peer: {path}: no data chunk")
            cid, size = head[:4], struct.unpack("<I", head[4:])[0]
            if cid == b"fmt ":
                fmt = struct.unpack("<HHIIHH", f.read(16))
                f.seek(size - 16 + (size & 1), 1)
            elif cid == b"data":
                if fmt is None:
                    raise SystemExit(f"numpy_peer: {path}: data before fmt")
                tag, channels, rate, _, _, bits = fmt
                if channels != 1:
                    raise SystemExit(f"numpy_peer: {path}: {channels} channels, mono expected")
                if tag == 3 and bits == 32:
                    dtype, scale = np.dtype("<f4"), 1.0
                elif tag == 1 and bits == 16:
                    dtype, scale = np.dtype("<i2"), 1.0 / 32768.0  # full scale = 1 A, as --scale 1A
                else:
                    raise SystemExit(f"numpy_peer: {path}: format {tag}/{bits} bits not handled")
                if size == 0xFFFFFFFF:  # written as a stream, or more than 4 GiB: the samples run to the end
                    size = os.path.getsize(path) - f.tell()
                return rate, dtype, scale, f.tell(), size // dtype.itemsize
            else:
                f.seek(size + (size & 1), 1)


def main():
    path = sys.argv[1]
    mains = float(sys.argv[2]) if len(sys.argv) > 2 else 50.0
    chunk_s = float(os.environ.get("CHUNK_S", "600"))
    rate, dtype, scale, offset, count = read_header(path)
    cycles = 10
    n = int(round(cycles * rate / mains))
    resolution = rate / n
    bins = n // 2 + 1

    # Harmonic groups 1..50 as a weight matrix over the bins (half weight on the bins midway between harmonics).
    orders = np.arange(1, 51)
    group_weights = np.zeros((bins, len(orders)))
    for j, h in enumerate(orders):
        centre = h * cycles
        for i in range(-cycles // 2, cycles // 2 + 1):
            k = centre + i
            if 0 <= k < bins:
                group_weights[k, j] = 0.5 if abs(i) == cycles // 2 else 1.0
    centres = np.arange(2100.0, 8901.0, 200.0)
    centres = centres[centres - 100 < rate / 2]
    band_weights = np.zeros((bins, len(centres)))
    for j, c in enumerate(centres):
        lo = int(round((c - 100) / resolution)) + 1
        hi = min(int(round((c + 100) / resolution)), bins - 1)
        band_weights[lo:hi + 1, j] = 1.0

    data = np.memmap(path, dtype=dtype, mode="r", offset=offset, shape=(count,))
    windows_total = count // n
    per_chunk = max(1, int(chunk_s * rate) // n)
    sum_sq = 0.0
    total = 0.0
    peak_pos = -np.inf
    peak_neg = np.inf
    worst_rms = 0.0
    group_ms = np.zeros(len(orders))
    band_ms = np.zeros(len(centres))
    for first in range(0, windows_total, per_chunk):
        w = min(per_chunk, windows_total - first)
        x = np.asarray(data[first * n:(first + w) * n], dtype=np.float64).reshape(w, n) * scale
        ms = np.mean(x * x, axis=1)
        sum_sq += ms.sum()
        total += x.sum()
        peak_pos = max(peak_pos, x.max())
        peak_neg = min(peak_neg, x.min())
        worst_rms = max(worst_rms, float(np.sqrt(ms.max())))
        spectrum = np.fft.rfft(x, axis=1)
        power = (spectrum.real ** 2 + spectrum.imag ** 2) * (2.0 / (n * n))
        power[:, 0] *= 0.5
        if n % 2 == 0:
            power[:, -1] *= 0.5
        group_ms += (power @ group_weights).sum(axis=0)
        band_ms += (power @ band_weights).sum(axis=0)
        del x, spectrum, power

    windows = max(windows_total, 1)
    summary = {
        "samples": int(count),
        "windows": int(windows_total),
        "windowSamples": n,
        "rmsA": float(np.sqrt(sum_sq / windows)),
        "meanA": float(total / (windows * n)),
        "peakA": float(peak_pos),
        "troughA": float(peak_neg),
        "worstWindowRmsA": worst_rms,
        "harmonicsRmsA": [float(v) for v in np.sqrt(group_ms / windows)],
        "bands": [{"centreHz": float(c), "rmsA": float(v)} for c, v in zip(centres, np.sqrt(band_ms / windows))],
    }
    json.dump(summary, sys.stdout, indent=1)
    print()


if __name__ == "__main__":
    main()
