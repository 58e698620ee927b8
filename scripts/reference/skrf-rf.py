#!/usr/bin/python3
"""Reference S-parameter figures from scikit-rf for tests/unit/rf/skrf-reference.test.ts.

Run with Debian's python3-scikit-rf (the system interpreter, not a pyenv one):
    /usr/bin/python3 scripts/reference/skrf-rf.py
It rewrites tests/unit/rf/reference/skrf-rf.json. The networks are invented
values plus a few points of the tee.s3p sample that ships with scikit-rf.
"""

import json
import os

import numpy as np
import skrf

OUTPUT = os.path.join(os.path.dirname(__file__), "..", "..", "tests", "unit", "rf", "reference", "skrf-rf.json")


def polar(magnitude, angle_deg):
    return magnitude * np.exp(1j * np.deg2rad(angle_deg))


def describe(name, network):
    """Raw S as re/im plus what skrf derives from it, per frequency."""
    s = network.s
    s_db = network.s_db
    s_deg = network.s_deg
    s_vswr = network.s_vswr
    s_mag = network.s_mag
    ports = network.nports
    points = []
    for k, frequency_hz in enumerate(network.f):
        diagonal = range(ports)
        points.append(
            {
                "frequencyHz": float(frequency_hz),
                "sRe": s[k].real.tolist(),
                "sIm": s[k].imag.tolist(),
                "sDb": s_db[k].tolist(),
                "sDeg": s_deg[k].tolist(),
                "vswr": [float(s_vswr[k, i, i]) for i in diagonal],
                # Return loss is −|S_ii| in dB; mismatch loss −10·log10(1 − |S_ii|²) from skrf's |S_ii|.
                "returnLossDb": [float(-s_db[k, i, i]) for i in diagonal],
                "mismatchLossDb": [float(-10 * np.log10(1 - s_mag[k, i, i] ** 2)) for i in diagonal],
            }
        )
    return {"name": name, "ports": ports, "z0Ohm": float(np.real(network.z0[0, 0])), "points": points}


def two_port_mixer_like():
    frequency = skrf.Frequency.from_f([0.5e9, 1.0e9, 2.0e9], unit="Hz")
    s = np.zeros((3, 2, 2), dtype=complex)
    for k, (s11, s21, s22) in enumerate(
        [
            (polar(0.2, 30), polar(0.45, -60), polar(0.33, -120)),
            (polar(0.12, -75), polar(0.42, -141.5), polar(0.25, 170)),
            (polar(0.31, 160), polar(0.38, 95), polar(0.18, -10)),
        ]
    ):
        s[k] = [[s11, s21], [s21, s22]]
    return skrf.Network(frequency=frequency, s=s, z0=50)


def quadrature_hybrid():
    """A near-ideal 90° hybrid: S21 ≈ −j/√2, S31 ≈ −1/√2, port 4 isolated, with invented errors."""
    frequency = skrf.Frequency.from_f([1.8e9, 2.0e9, 2.2e9], unit="Hz")
    s = np.zeros((3, 4, 4), dtype=complex)
    for k, (through, coupled, isolation, match) in enumerate(
        [
            (polar(0.700, -90.8), polar(0.690, 179.6), polar(0.030, 45), polar(0.05, 10)),
            (polar(0.707, -90.0), polar(0.705, -179.7), polar(0.012, -20), polar(0.03, -60)),
            (polar(0.715, -89.1), polar(0.680, -178.9), polar(0.041, 130), polar(0.08, 95)),
        ]
    ):
        row1 = [match, through, coupled, isolation]
        row2 = [through, match, isolation, coupled]
        row3 = [coupled, isolation, match, through]
        row4 = [isolation, coupled, through, match]
        s[k] = [row1, row2, row3, row4]
    return skrf.Network(frequency=frequency, s=s, z0=50)


def impedance_loads():
    loads = []
    for z_re, z_im in [(25, 0), (100, 0), (50, 50), (30, -20), (75, 0)]:
        gamma = complex(skrf.zl_2_Gamma0(50, complex(z_re, z_im)).squeeze())
        loads.append(
            {
                "loadRe": z_re,
                "loadIm": z_im,
                "z0Ohm": 50,
                "gammaRe": gamma.real,
                "gammaIm": gamma.imag,
                "vswr": float(skrf.Gamma0_2_swr(np.array([gamma])).squeeze()),
            }
        )
    return loads


def tee_sample():
    path = os.path.join(os.path.dirname(skrf.__file__), "data", "tee.s3p")
    network = skrf.Network(path)
    step = max(1, len(network.f) // 4)
    return describe("scikit-rf sample tee.s3p (every %dth point)" % step, network[::step])


def main():
    document = {
        "generator": "scripts/reference/skrf-rf.py",
        "skrfVersion": skrf.__version__,
        "networks": [
            describe("two-port, invented values", two_port_mixer_like()),
            describe("quadrature hybrid, invented values", quadrature_hybrid()),
            tee_sample(),
        ],
        "loads": impedance_loads(),
    }
    with open(OUTPUT, "w") as handle:
        json.dump(document, handle, indent=1)
        handle.write("\n")


if __name__ == "__main__":
    main()
