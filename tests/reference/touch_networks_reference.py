"""Reference responses of the IEC 60990 networks for TouchCurrentNetworksTests (run with /usr/bin/python3).

Builds each network's transfer function reading/I (reading = output voltage / 500 ohm, current I injected at the
terminals) by rational arithmetic on the element impedances with numpy polynomials -- not from the closed forms in
TouchCurrentNetworks.cs -- then evaluates it with scipy.signal.freqs (analog) and, after scipy.signal.bilinear_zpk
(no prewarping) on the poles and zeros from scipy.signal.tf2zpk, scipy.signal.freqz_zpk (digital; the zpk route
stays well conditioned with the unreduced, badly scaled polynomials the impedance algebra yields). Prints: network kind f_hz sample_rate re im, one per line.
"""
import sys
import numpy as np
from scipy import signal

RB, R1P, C1P = 500.0, 10e3, 0.022e-6
R1L, C1L, R2L, C2L = 10e3, 6.2e-9, 20e3, 9.1e-9


def res(r):
    return (np.array([r]), np.array([1.0]))


def cap(c):  # 1/(sC)
    return (np.array([1.0]), np.array([c, 0.0]))


def add(a, b):
    return (np.polyadd(np.polymul(a[0], b[1]), np.polymul(b[0], a[1])), np.polymul(a[1], b[1]))


def mul(a, b):
    return (np.polymul(a[0], b[0]), np.polymul(a[1], b[1]))


def div(a, b):
    return (np.polymul(a[0], b[1]), np.polymul(a[1], b[0]))


def par(a, b):
    return div(mul(a, b), add(a, b))


def perception():
    branch = add(res(R1P), cap(C1P))
    vt = par(res(RB), branch)                      # V_T / I
    return mul(mul(vt, div(cap(C1P), branch)), res(1 / 500.0))


def letgo():
    zb = add(res(R2L), cap(C2L))
    zp = par(cap(C1L), zb)
    zl = add(res(R1L), zp)
    vt = par(res(RB), zl)
    h = mul(vt, div(zp, zl))                       # V1 / I
    h = mul(h, div(cap(C2L), zb))                  # U3 / I
    return mul(h, res(1 / 500.0))


def unweighted():
    return mul(res(RB), res(1 / 500.0))


freqs_hz = [float(x) for x in sys.argv[1].split(',')]
rates = [float(x) for x in sys.argv[2].split(',')]
for name, (b, a) in (("unweighted", unweighted()), ("perception", perception()), ("letgo", letgo())):
    w = 2 * np.pi * np.array(freqs_hz)
    _, h = signal.freqs(b, a, worN=w)
    for f, v in zip(freqs_hz, h):
        print(f"{name} analog {f} 0 {v.real!r} {v.imag!r}")
    for fs in rates:
        z, p, k = signal.tf2zpk(b, a)
        zd, pd, kd = signal.bilinear_zpk(z, p, k, fs)
        _, hz = signal.freqz_zpk(zd, pd, kd, worN=np.array(freqs_hz), fs=fs)
        for f, v in zip(freqs_hz, hz):
            print(f"{name} digital {f} {fs} {v.real!r} {v.imag!r}")
