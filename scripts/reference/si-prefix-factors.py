#!/usr/bin/python3
"""Reference factors between SI-prefixed units, from scipy.constants (Debian python3-scipy), for
tests/unit/catalog/compare-table.test.ts: the compare table converts a figure stated with another
SI prefix (0.00095 ns beside 1.20 ps) by the ratio of the prefixes. Regenerate with
`/usr/bin/python3 scripts/reference/si-prefix-factors.py`."""
import json
import os

import scipy
import scipy.constants as c

PREFIX = {"f": c.femto, "p": c.pico, "n": c.nano, "u": c.micro, "µ": c.micro, "m": c.milli, "": 1.0, "k": c.kilo, "M": c.mega, "G": c.giga}
PAIRS = [("ns", "ps"), ("µs", "ns"), ("MHz", "GHz"), ("GHz", "MHz"), ("kHz", "Hz"), ("mV", "V"), ("mW", "W"), ("W", "mW")]


def split(unit):
    for base in ("Hz", "s", "V", "W"):
        if unit.endswith(base):
            return unit[: -len(base)], base
    raise ValueError(unit)


out = []
for a, b in PAIRS:
    (pa, base_a), (pb, base_b) = split(a), split(b)
    assert base_a == base_b
    out.append({"from": a, "to": b, "factor": PREFIX[pa] / PREFIX[pb]})

path = os.path.join(os.path.dirname(__file__), "../../tests/unit/catalog/reference/si-prefix-factors.json")
with open(path, "w", encoding="utf-8") as f:
    json.dump({"source": "scipy.constants " + scipy.__version__, "pairs": out}, f, ensure_ascii=False, indent=2)
    f.write("\n")
