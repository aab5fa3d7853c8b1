#!/usr/bin/env python3
"""Reference Q(T) of 12C16O and 13C16O by direct summation over rovibrational levels (run once; the values
are committed in ingest/src/test/resources/org/linewright/ingest/partition/co-level-sum-reference.tsv).

Written independently of the Java code: a numpy evaluation of the Dunham expansion on a (v, J) grid,

    E(v, J) = sum_kl Y_kl (v + 1/2)^k [J(J+1)]^l,      Q(T) = g_ns sum_{v,J} (2J+1) exp(-c2 (E(v,J) - E(0,0)) / T)

over the bound levels: v while G(v) increases and G(v) - G(0) < D0, J while E(v, J) increases with J and
E(v, J) - E(0, 0) < D0. Isotopologue: Y_kl scaled by (mu_ref / mu)^((k + 2l) / 2) (Dunham 1932, Phys. Rev.
41, 721; mass scaling of the coefficients, Born-Oppenheimer breakdown neglected).

Constants of 12C16O (cm-1): Dunham coefficients as in the Java model (Guelachvili et al. 1983,
J. Mol. Spectrosc. 98, 64; Huber & Herzberg 1979; from memory), D0 = 11.09 eV (Huber & Herzberg 1979,
from memory), nuclide masses AME2020 (Wang et al. 2021, Chinese Phys. C 45, 030003), c2 CODATA 2018.

Command:  python3 tools/partition/co_level_sum.py > ingest/src/test/resources/org/linewright/ingest/partition/co-level-sum-reference.tsv
"""
import sys
import numpy as np

C2 = 1.438776877  # cm K, CODATA 2018
Y = {  # (k, l): Y_kl in cm-1, 12C16O
    (1, 0): 2169.81358, (2, 0): -13.28831, (3, 0): 1.0511e-2, (4, 0): 5.74e-5,
    (0, 1): 1.93128087, (1, 1): -1.7504391e-2, (2, 1): 5.487e-7,
    (0, 2): -6.12147e-6, (1, 2): 1.0e-9,
    (0, 3): 5.7e-12,
}
D0_CM1 = 11.09 * 8065.543937  # eV -> cm-1 (CODATA 2018 factor)
MASS = {"12C": 12.0, "13C": 13.00335483507, "16O": 15.99491461957}
ISOTOPOLOGUES = [("12C16O", "12C", "16O", 1), ("13C16O", "13C", "16O", 2)]
TEMPERATURES = [50, 100, 200, 296, 500, 1000, 1500, 2000, 2500, 3000, 4000]


def mu(a, b):
    return MASS[a] * MASS[b] / (MASS[a] + MASS[b])


def q_of(atom1, atom2, g_ns):
    rho = np.sqrt(mu("12C", "16O") / mu(atom1, atom2))
    v = np.arange(0, 200)[:, None] + 0.5
    j = np.arange(0, 600)[None, :].astype(float)
    x = j * (j + 1)
    e = np.zeros((v.shape[0], j.shape[1]))
    for (k, l), y in Y.items():
        e = e + y * rho ** (k + 2 * l) * v ** k * x ** l
    e = e - e[0, 0]
    g = e[:, 0]
    vmax = 0
    while vmax + 1 < len(g) and g[vmax + 1] > g[vmax] and g[vmax + 1] < D0_CM1:
        vmax += 1
    mask = np.zeros_like(e, dtype=bool)
    for iv in range(vmax + 1):
        row = e[iv]
        jmax = 0
        while jmax + 1 < len(row) and row[jmax + 1] > row[jmax] and row[jmax + 1] < D0_CM1:
            jmax += 1
        mask[iv, : jmax + 1] = True
    weights = (2 * j + 1) * np.ones_like(e)
    out = []
    for t in TEMPERATURES:
        terms = np.where(mask, weights * np.exp(-C2 * np.where(mask, e, 0.0) / t), 0.0)
        out.append(g_ns * terms.sum())
    return out


def main():
    print("# Q(T) by direct summation over 12C16O/13C16O levels: tools/partition/co_level_sum.py")
    print("# python " + sys.version.split()[0] + ", numpy " + np.__version__)
    print("isotopologue\t" + "\t".join(str(t) for t in TEMPERATURES))
    for name, a, b, g in ISOTOPOLOGUES:
        print(name + "\t" + "\t".join("%.6f" % q for q in q_of(a, b, g)))


if __name__ == "__main__":
    main()
