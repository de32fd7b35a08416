"""Reference touch-current readings of sampled waveforms for TouchCurrentMeterMutantTests (run with /usr/bin/python3).

Each IEC 60990 network is modelled in state space straight from its circuit (current I injected at terminal T, RB
from T to ground; capacitor voltages as states, nodal equations written out below) -- not from the transfer
functions in TouchCurrentNetworks.cs nor from the impedance algebra of touch_networks_reference.py. The models are
discretised with scipy.signal.cont2discrete(method="bilinear") (Tustin, no prewarping) and run from rest with
scipy.signal.dlsim over the whole record; the first `settle` samples are then dropped, as the meter does.

Arguments: sample rate in Hz, number of settling samples, then one input file per waveform (one sample per line,
amperes). Prints one line per file:
  unweighted_rms unweighted_peak perception_peak perception_rms letgo_peak letgo_rms dc
(numpy: sqrt(mean(y**2)), max(abs(y)), mean(x) over the kept samples; reading = output voltage / 500 ohm).
"""
import sys

import numpy as np
from scipy import signal

RB = 500.0
R1P, C1P = 10e3, 0.022e-6                       # IEC 60990 Fig. 4
R1L, C1L, R2L, C2L = 10e3, 6.2e-9, 20e3, 9.1e-9  # IEC 60990 Fig. 5


def perception():
    # Node T: I = V_T/RB + (V_T - v1)/R1  =>  V_T = (RB R1 I + RB v1) / (R1 + RB)
    # C1 dv1/dt = (V_T - v1)/R1; reading = v1/500.
    k = RB / (R1P + RB)
    a = np.array([[(k - 1) / (R1P * C1P)]])
    b = np.array([[k * R1P / (R1P * C1P)]])
    return a, b, np.array([[1 / 500.0]]), np.array([[0.0]])


def letgo():
    # Node T as above with v1; node 1: C1 dv1/dt = (V_T - v1)/R1 - (v1 - v2)/R2; node 2: C2 dv2/dt = (v1 - v2)/R2;
    # reading = v2/500.
    k = RB / (R1L + RB)
    a = np.array([[((k - 1) / R1L - 1 / R2L) / C1L, 1 / (R2L * C1L)],
                  [1 / (R2L * C2L), -1 / (R2L * C2L)]])
    b = np.array([[k / C1L], [0.0]])
    return a, b, np.array([[0.0, 1 / 500.0]]), np.array([[0.0]])


fs = float(sys.argv[1])
settle = int(sys.argv[2])
for path in sys.argv[3:]:
    x = np.loadtxt(path, ndmin=1)
    out = []
    for model in (perception(), letgo()):
        ad, bd, cd, dd, _ = signal.cont2discrete(model, 1 / fs, method="bilinear")
        _, y, _ = signal.dlsim((ad, bd, cd, dd, 1 / fs), x)
        y = y[settle:, 0]
        out.append((np.max(np.abs(y)), np.sqrt(np.mean(y ** 2))))
    kept = x[settle:]
    u = (RB / 500.0) * kept  # Fig. 3: all of I through RB
    print(" ".join(f"{v:.17g}" for v in (np.sqrt(np.mean(u ** 2)), np.max(np.abs(u)), out[0][0], out[0][1],
                                          out[1][0], out[1][1], np.mean(kept))))
