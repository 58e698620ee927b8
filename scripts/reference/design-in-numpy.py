#!/usr/bin/python3
"""Reference design-in readings from NumPy for tests/unit/sheet/design-in.test.ts.

Run with Debian's python3-numpy (the system interpreter):
    /usr/bin/python3 scripts/reference/design-in-numpy.py
It reads the frozen-model snapshots of the demo doubler KDX-2G4 and mixer KM-7H
(tests/unit/sheet/__snapshots__/demo-*.json), takes each unit's points straight from
the charts' inlined Vega-Lite data, and writes tests/unit/sheet/reference/design-in-numpy.json:
at each query point, the typical curve (numpy.median of the units at every measured x,
each unit read with numpy.interp) read with numpy.interp, and the units' spread
(numpy.mean, numpy.std with ddof=1, min, max). Rerun it when those snapshots change.
"""

import json
import os

import numpy as np

HERE = os.path.dirname(__file__)
ROOT = os.path.join(HERE, "..", "..")
OUTPUT = os.path.join(ROOT, "tests", "unit", "sheet", "reference", "design-in-numpy.json")

CASES = [
    # part, chart id, x factor (axis unit -> dBm or Hz), query x values in dBm or Hz
    ("KDX-2G4", "conversion-loss-vs-drive", 1.0, [-9.0103, -3.25, 0.4897, 3.3, 10.0, 10.75, 15.9897]),
    ("KDX-2G4", "harmonic-suppression-vs-drive", 1.0, [-9.0103, 3.3, 10.0, 15.9897]),
    ("KM-7H", "conversion-loss-vs-frequency", 1e9, [0.5e9, 0.55e9, 1.55e9, 2.999e9, 3.0e9]),
    ("KM-7H", "isolation-vs-frequency", 1e9, [0.5e9, 1.234e9, 3.0e9]),
]

# The draft snapshots hold units approved after the demo's releases (scripts/seed-demo-conformity.ts,
# models/seeders/demo-conformity.ts); the released revisions were frozen without them. Each case is
# computed twice: "draft" (every unit, the unit tests) and "released" (without these, the integration
# tests read the released revisions).
AFTER_RELEASE = {"KDX-2G4": {"BFD-0021"}, "KM-7H": {"BFD-0121"}}


def units_of(chart, factor):
    """series -> serial -> (x sorted, y) from the chart's data.values."""
    out = {}
    for row in chart["vegaLite"]["data"]["values"]:
        out.setdefault(row["series"], {}).setdefault(row["unit"], []).append((row["x"] * factor, row["y"]))
    return {s: {u: np.array(sorted(p)) for u, p in by_unit.items()} for s, by_unit in out.items()}


def main():
    results = {"numpyVersion": np.__version__, "cases": []}
    for part, chart_id, factor, queries in CASES:
        with open(os.path.join(ROOT, "tests", "unit", "sheet", "__snapshots__", f"demo-{part}.json")) as f:
            model = json.load(f)
        chart = next(c for c in model["charts"] if c["id"] == chart_id)
        for basis, series, by_unit in [
            (basis, series, {u: c for u, c in by_unit.items() if basis == "draft" or u not in AFTER_RELEASE.get(part, set())})
            for basis in ("draft", "released")
            for series, by_unit in units_of(chart, factor).items()
        ]:
            curves = list(by_unit.values())
            grid = np.unique(np.concatenate([c[:, 0] for c in curves]))
            typical = []
            for x in grid:
                inside = [np.interp(x, c[:, 0], c[:, 1]) for c in curves if c[0, 0] <= x <= c[-1, 0]]
                typical.append(np.median(inside))
            typical = np.array(typical)
            for x in queries:
                at_units = np.array([np.interp(x, c[:, 0], c[:, 1]) for c in curves])
                results["cases"].append({
                    "basis": basis,
                    "part": part,
                    "chartId": chart_id,
                    "series": series,
                    "x": x,
                    "typical": float(np.interp(x, grid, typical)),
                    "n": int(len(at_units)),
                    "mean": float(np.mean(at_units)),
                    "standardDeviation": float(np.std(at_units, ddof=1)),
                    "min": float(np.min(at_units)),
                    "max": float(np.max(at_units)),
                })
    with open(OUTPUT, "w") as f:
        json.dump(results, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
