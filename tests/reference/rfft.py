"""Reference for RealFftTests: numpy.fft.rfft of the samples in argv[1] (one per line).

Prints one "re im" line per bin k = 0 .. n//2 (unscaled, e^{-i} convention, the same as WaveCheck's RealFft).
Usage: /usr/bin/python3 rfft.py samples.txt
"""
import sys

import numpy as np

x = np.loadtxt(sys.argv[1])
for z in np.fft.rfft(x):
    print(f"{z.real:.17g} {z.imag:.17g}")
