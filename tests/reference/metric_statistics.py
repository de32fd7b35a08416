"""Reference window statistics for MetricAccumulatorTests, with numpy (run with /usr/bin/python3).

Input file (argv[1]): one "value start_s" line per window, value "nan" where the window has no value. argv[2]:
"signed" or "unsigned". Prints one line "mean p95 max time_of_max" (all "nan" when no value is present):
- mean: numpy.nanmean of the values (signed values keep their sign);
- p95: numpy.percentile(..., 95) with numpy's default linear interpolation, of the values (unsigned) or of their
  magnitudes (signed), then given the sign of the maximum below (signed);
- max: the value of largest magnitude (signed) or the largest value (unsigned), the first one where several tie
  (numpy.argmax returns the first occurrence); time_of_max: that window's start.
"""
import sys

import numpy as np

data = np.loadtxt(sys.argv[1], ndmin=2)
signed = sys.argv[2] == "signed"
values, starts = data[:, 0], data[:, 1]
keep = ~np.isnan(values)
values, starts = values[keep], starts[keep]
if values.size == 0:
    print("nan nan nan nan")
    sys.exit(0)

key = np.abs(values) if signed else values
i = int(np.argmax(key))
p95 = float(np.percentile(key, 95))
if signed and values[i] < 0:
    p95 = -p95
print(f"{np.mean(values):.17g} {p95:.17g} {values[i]:.17g} {starts[i]:.17g}")
