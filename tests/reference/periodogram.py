"""Reference spectrum for SpectrumReferenceTests: scipy.signal.periodogram of the samples in argv[1].

Rectangular window, no detrending (the DC residual current must stay), scaling='spectrum': each one-sided bin holds
the mean square of its component (A^2), the same quantity as WaveCheck's RealSpectrum.Power.
Usage: /usr/bin/python3 periodogram.py samples.txt sample_rate_hz  -> one "frequency power" line per bin.
"""
import sys

import numpy as np
from scipy import signal

x = np.loadtxt(sys.argv[1])
fs = float(sys.argv[2])
f, p = signal.periodogram(x, fs=fs, window="boxcar", detrend=False, scaling="spectrum", return_onesided=True)
for fk, pk in zip(f, p):
    print(f"{fk:.17g} {pk:.17g}")
