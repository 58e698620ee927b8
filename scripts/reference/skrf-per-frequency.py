#!/usr/bin/python3
"""Every frequency of the example Touchstone files through scikit-rf, for
tests/unit/analysis/per-frequency-skrf.test.ts: |S| in dB (s_db), phase in degrees
(s_deg) and each port's mismatch loss −10·log10(1 − |Sii|²) from skrf's s_mag.

Run with Debian's python3-scikit-rf:  /usr/bin/python3 scripts/reference/skrf-per-frequency.py
It rewrites tests/unit/analysis/reference/per-frequency-skrf.json.
"""
import json
import os
import warnings

import numpy as np
import skrf

warnings.filterwarnings("ignore")

ROOT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..")
EXAMPLES = os.path.join(ROOT, "fixtures", "examples")
OUT = os.path.join(ROOT, "tests", "unit", "analysis", "reference", "per-frequency-skrf.json")
FILES = ["attenuator-2port.s2p", "splitter-3port.s3p", "hybrid-4port.s4p", "hybrid-4port-v2.s4p"]


def main():
    result = {"generator": "scikit-rf " + skrf.__version__, "files": {}}
    for name in FILES:
        net = skrf.Network(os.path.join(EXAMPLES, name))
        n = net.nports
        rows = []
        for k in range(len(net.f)):
            row = {"frequencyHz": float(net.f[k]), "sDb": net.s_db[k].tolist(), "sDeg": net.s_deg[k].tolist()}
            row["mismatchLossDb"] = [float(-10 * np.log10(1 - net.s_mag[k, i, i] ** 2)) for i in range(n)]
            rows.append(row)
        result["files"][name] = {"portCount": n, "referenceOhm": float(np.real(net.z0[0, 0])), "rows": rows}
    os.makedirs(os.path.dirname(OUT), exist_ok=True)
    with open(OUT, "w") as fh:
        json.dump(result, fh, indent=1)
        fh.write("\n")


if __name__ == "__main__":
    main()
