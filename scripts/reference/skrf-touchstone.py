#!/usr/bin/python3
"""Reads the Touchstone examples in fixtures/examples with scikit-rf and writes
tests/unit/ingest/reference/touchstone-skrf.json: frequencies in Hz and S in
real/imaginary at a few frequency indices, for cross-checking our parser.

Run with Debian's python3-scikit-rf:  /usr/bin/python3 scripts/reference/skrf-touchstone.py
"""
import json
import os
import warnings

import skrf

warnings.filterwarnings("ignore")

ROOT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..")
EXAMPLES = os.path.join(ROOT, "fixtures", "examples")
OUT = os.path.join(ROOT, "tests", "unit", "ingest", "reference", "touchstone-skrf.json")
FILES = ["attenuator-2port.s2p", "splitter-3port.s3p", "hybrid-4port.s4p", "hybrid-4port-v2.s4p"]


def main():
    result = {"generator": "scikit-rf " + skrf.__version__, "files": {}}
    for name in FILES:
        net = skrf.Network(os.path.join(EXAMPLES, name))
        count = len(net.f)
        indices = sorted({0, 1, count // 2, count - 1})
        points = []
        for k in indices:
            s = net.s[k]
            points.append({
                "index": k,
                "frequencyHz": float(net.f[k]),
                # s[i][j] is S(i+1, j+1) in scikit-rf's convention, as in ours.
                "re": [[float(s[i][j].real) for j in range(net.nports)] for i in range(net.nports)],
                "im": [[float(s[i][j].imag) for j in range(net.nports)] for i in range(net.nports)],
            })
        result["files"][name] = {
            "portCount": net.nports,
            "frequencyCount": count,
            "referenceOhm": [float(z.real) for z in net.z0[0]],
            "points": points,
        }
    with open(OUT, "w") as fh:
        json.dump(result, fh, indent=1)
        fh.write("\n")


if __name__ == "__main__":
    main()
