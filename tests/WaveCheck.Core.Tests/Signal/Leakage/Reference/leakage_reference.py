#!/usr/bin/python3
"""Outside reference for LeakageSplitTests, with numpy (Debian /usr/bin/python3).

usage: leakage_reference.py bin FILE K      -> the RMS phasor sqrt(2)/L * numpy.fft.fft(x)[K] of the samples in FILE
       leakage_reference.py fit FILE F      -> G, C and the relative residual of the least-squares fit
                                               I_n = V_n (G + j n 2 pi F C), solved by numpy.linalg.lstsq on the
                                               stacked real and imaginary equations; FILE holds one line per order:
                                               n Re(V) Im(V) Re(I) Im(I)
"""
import sys
import numpy as np

mode, path, arg = sys.argv[1], sys.argv[2], float(sys.argv[3])
if mode == "bin":
    x = np.loadtxt(path)
    X = np.fft.fft(x)[int(arg)] * np.sqrt(2) / len(x)
    print(repr(X.real), repr(X.imag))
elif mode == "fit":
    rows = np.atleast_2d(np.loadtxt(path))
    n = rows[:, 0]
    v = rows[:, 1] + 1j * rows[:, 2]
    i = rows[:, 3] + 1j * rows[:, 4]
    w = 2 * np.pi * arg
    a = np.column_stack([v, 1j * n * w * v])           # complex design matrix for (G, C)
    real = np.vstack([a.real, a.imag])
    rhs = np.concatenate([i.real, i.imag])
    (g, c), *_ = np.linalg.lstsq(real, rhs, rcond=None)
    misfit = i - v * (g + 1j * n * w * c)
    residual = np.sqrt(np.sum(np.abs(misfit) ** 2) / np.sum(np.abs(i) ** 2))
    print(repr(g), repr(c), repr(residual))
else:
    raise SystemExit("unknown mode " + mode)
