#!/usr/bin/python3
"""The median network of several Touchstone files, computed with scikit-rf and numpy, against a
merged file: reads each unit with skrf.Network, takes at each frequency and S(i, j) the median of
|S| in dB (Network.s_db) and of the phase unwrapped along frequency (numpy.unwrap of Network.s_rad,
each unit moved by whole turns to start within pi of the first unit), wrapped to (-180, 180] degrees,
and compares it with the merged file as scikit-rf reads it. Prints JSON: the frequencies, the largest
differences in dB and in degrees, and the merged file's port count.

Run with Debian's python3-scikit-rf:
  /usr/bin/python3 scripts/reference/skrf-median-network.py merged.sNp unit1.sNp unit2.sNp ...
"""
import json
import sys
import warnings

import numpy as np
import skrf

warnings.filterwarnings("ignore")


def main():
    merged = skrf.Network(sys.argv[1])
    units = [skrf.Network(name) for name in sys.argv[2:]]
    grid = merged.f
    db = np.array([[[np.interp(grid, u.f, u.s_db[:, i, j]) for j in range(u.nports)] for i in range(u.nports)] for u in units])
    rad = np.array([[[np.interp(grid, u.f, np.unwrap(u.s_rad[:, i, j])) for j in range(u.nports)] for i in range(u.nports)] for u in units])
    turns = 2 * np.pi * np.round((rad[0:1, :, :, 0:1] - rad[:, :, :, 0:1]) / (2 * np.pi))
    median_db = np.median(db, axis=0)
    median_deg = np.degrees(np.median(rad + turns, axis=0))
    median_deg = median_deg - 360 * np.ceil((median_deg - 180) / 360)
    merged_db = np.transpose(merged.s_db, (1, 2, 0))
    merged_deg = np.transpose(merged.s_deg, (1, 2, 0))
    phase_diff = np.abs((merged_deg - median_deg + 180) % 360 - 180)
    print(json.dumps({
        "generator": "scikit-rf " + skrf.__version__ + ", numpy " + np.__version__,
        "ports": int(merged.nports),
        "frequencyHz": grid.tolist(),
        "maxDbDifference": float(np.max(np.abs(merged_db - median_db))),
        "maxDegDifference": float(np.max(phase_diff)),
    }))


if __name__ == "__main__":
    main()
