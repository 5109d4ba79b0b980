#!/usr/bin/env python3
"""Reference for the robustness benchmark: the same peak-acceleration map as `calc robustness`, computed the
straightforward vectorised way with numpy: for every structure-frequency factor (row), the complex receptance of
the structure + damper system on a dense uniform frequency grid for all damper-damping factors at once
(broadcast columns x frequencies), times the load's modal force, and the largest sample per cell.

Usage: python3 tests/bench/robustness-numpy.py request.json [answer.json] [grid-points]
Supports the `harmonic` and `crowd` load cases (Setra 2006 / HiVoSS 2008 psi curves, n' from the structure's
damping ratio), vertical/lateral/longitudinal, any number of dampers.
"""
import json
import sys
import time

import numpy as np

PSI = {
    "setra": {"vertical": (1.0, 1.7, 2.1, 2.6), "longitudinal": (1.0, 1.7, 2.1, 2.6), "lateral": (0.3, 0.5, 1.1, 1.3)},
    "hivoss": {"vertical": (1.25, 1.7, 2.1, 2.3), "longitudinal": (1.25, 1.7, 2.1, 2.3), "lateral": (0.5, 0.7, 1.0, 1.2)},
}
FORCE = {"vertical": 280.0, "longitudinal": 140.0, "lateral": 35.0}
CLASSES = {
    "setra": {"III": 0.5, "II": 0.8, "I": 1.0},
    "hivoss": {"TC2": 0.2, "TC3": 0.5, "TC4": 1.0, "TC5": 1.5},
}


def load_band(structure, load):
    direction = structure.get("direction", "vertical")
    if load["kind"] == "harmonic":
        lo, hi = load["pacingRangeHz"]
        return lo, hi, lambda f: np.full_like(f, load["modalForceAmplitudeN"])
    if load["kind"] in ("crowd", "lateral"):
        guide = load["guide"]
        a, b, c, d = PSI[guide][direction]
        if "trafficClass" in load:
            if load["trafficClass"] == "TC1":
                n, density = 15.0, 15.0 / load["deckAreaM2"]
            else:
                density = CLASSES[guide][load["trafficClass"]]
                n = density * load["deckAreaM2"]
        else:
            density = load["densityPerM2"]
            n = density * load["deckAreaM2"]
        zeta = structure["dampingRatio"]
        n_eq = 10.8 * np.sqrt(zeta * n) if density < 1 else 1.85 * np.sqrt(n)
        mean = load.get("modeShapeMean", 2 / np.pi)
        amplitude = FORCE[direction] * n_eq * mean

        def force(f):
            psi = np.interp(f, [a, b, c, d], [0.0, 1.0, 1.0, 0.0], left=0.0, right=0.0)
            return amplitude * psi

        return a, d, force
    raise SystemExit(f"load case kind {load['kind']} is not covered by this reference script")


def main():
    request = json.load(open(sys.argv[1]))
    out_path = sys.argv[2] if len(sys.argv) > 2 else None
    points = int(sys.argv[3]) if len(sys.argv) > 3 else 20001
    start = time.perf_counter()
    s = request["structure"]
    tmds = request["tmds"]
    lo, hi, force = load_band(s, request["loadCase"])
    f = np.linspace(lo, hi, points)
    w = 2 * np.pi * f
    w2 = w * w
    weight = force(f)
    M = s["modalMassKg"]
    m = np.array([t["massKg"] for t in tmds])[:, None, None]
    wa = 2 * np.pi * np.array([t["frequencyHz"] for t in tmds])[:, None, None]
    za = np.array([t["dampingRatio"] for t in tmds])[:, None, None]
    k = m * wa**2
    damping_factors = np.array(request["tmdDampingFactors"])[None, :, None]
    c = 2 * za * damping_factors * m * wa  # dampers x columns x 1
    rows = []
    for factor in request["structureFrequencyFactors"]:
        ws = 2 * np.pi * s["frequencyHz"] * factor
        K = M * ws * ws
        C = 2 * s["dampingRatio"] * M * ws
        kc = k + 1j * w * c  # dampers x columns x freq
        z = -w2 * m * kc / (kc - w2 * m)
        dyn = K - w2 * M + 1j * w * C + z.sum(axis=0)  # columns x freq
        acc = w2 / np.abs(dyn) * weight
        rows.append(acc.max(axis=1).tolist())
    elapsed = time.perf_counter() - start
    answer = {"peakAccelerationMPerS2": rows, "gridPoints": points, "computeSeconds": elapsed}
    if out_path:
        json.dump(answer, open(out_path, "w"))
    else:
        print(json.dumps(answer))


if __name__ == "__main__":
    main()
