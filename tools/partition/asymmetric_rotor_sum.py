#!/usr/bin/env python3
"""Reference rotational Q(T) of rigid asymmetric tops (and of the spherical top CH4) by direct summation over
their levels, with the nuclear-spin weights of each level's symmetry (run once; values committed in
ingest/src/test/resources/org/linewright/ingest/partition/asymmetric-rotor-reference.tsv).

Written independently of the Java code. Levels: eigenvalues of H = A Ja^2 + B Jb^2 + C Jc^2 in the symmetric-top
basis |J, K> (I^r representation, z = a), block-diagonalised by K parity and by the combinations
|K> +/- |-K> (Wang 1929, Phys. Rev. 34, 243; King, Hainer and Cross 1943, J. Chem. Phys. 11, 27). Each level's
(Ka, Kc) parities: Ka ~ K, and (-1)^Kc = s (-1)^(J+K) from the C2 rotation about c acting on |J, K> as
(-1)^(J+K) |J, -K>. Nuclear-spin weights (common practice): H2O, H2S (C2 axis b, two protons): 3 for Ka+Kc odd,
1 for even; D2O: 6 for even, 3 for odd. CH4 (rigid spherical top, E = B J(J+1), B = 5.2410 cm-1 from memory):
levels of J classified by the rotation group T (characters of D^J: 2J+1, sin((2J+1)pi/3)/sin(pi/3) on the 8 C3,
(-1)^J on the 3 C2); the 16 proton-spin states are 5 A + E + 3 F, so a rotational A level has weight 5, each
state of an E pair 1 (2 per pair), each state of an F triplet 1 (3 per triplet) (common practice; e.g. Herzberg
II, 1945, ch. I); (2J+1) for M. C3v symmetric tops with three protons (PH3 oblate, CH3D and CH3Cl prolate):
E = B J(J+1) + (A or C - B) K^2, each |J, K> state weighted 4 for K = 0 mod 3 and 2 otherwise (the 8 proton-spin
states are 4 A + 2 E under C3), times (2I+1) of the other nuclei (2 for 31P, 3 for 2H, 4 for 35Cl) (common
practice); rotational constants PH3 B = 4.4524, C = 3.9190; CH3D A = 5.250, B = 3.880; CH3Cl A = 5.2053,
B = 0.443402 (from memory). Rotational constants (cm-1, ground state, from memory): H2O 27.8806,
14.5216, 9.2777; H2S 10.3601, 9.0181, 4.7307; D2O 15.42, 7.27, 4.85. Energies from the lowest level.

Command:  python3 tools/partition/asymmetric_rotor_sum.py > ingest/src/test/resources/org/linewright/ingest/partition/asymmetric-rotor-reference.tsv
"""
import math
import sys
import numpy as np

C2 = 1.438776877  # cm K, CODATA 2018
MOLECULES = [
    ("H2O", (27.8806, 14.5216, 9.2777), lambda ka, kc: 3 if (ka + kc) % 2 else 1),
    ("H2S", (10.3601, 9.0181, 4.7307), lambda ka, kc: 3 if (ka + kc) % 2 else 1),
    ("D2O", (15.42, 7.27, 4.85), lambda ka, kc: 3 if (ka + kc) % 2 else 6),
]
TEMPERATURES = [50, 75, 100, 150, 200, 296]
J_MAX = 70


def levels(a, b, c):
    out = []
    for j in range(J_MAX + 1):
        x = j * (j + 1)
        for kpar in (0, 1):
            for s in (1, -1):
                ks = [k for k in range(0, j + 1) if k % 2 == kpar and not (k == 0 and s == -1)]
                if not ks:
                    continue
                n = len(ks)
                h = np.zeros((n, n))
                for i, k in enumerate(ks):
                    h[i, i] = (b + c) / 2 * (x - k * k) + a * k * k
                for i in range(n - 1):
                    k = ks[i]
                    v = (b - c) / 4 * math.sqrt((x - k * (k + 1)) * (x - (k + 1) * (k + 2)))
                    if k == 0:
                        v *= math.sqrt(2)
                    h[i, i + 1] = h[i + 1, i] = v
                if kpar == 1:
                    # <J,1|H|J,-1> = (B-C)/4 J(J+1) couples K = 1 with its own mirror
                    h[0, 0] += s * (b - c) / 4 * x
                for e in np.linalg.eigvalsh(h):
                    kc = (j + kpar) % 2 if s == 1 else (j + kpar + 1) % 2
                    out.append((e, j, kpar, kc))
    return out


def methane(t, b=5.2410):
    q = 0.0
    for j in range(0, 200):
        chi_e = 2 * j + 1
        chi_c3 = math.sin((2 * j + 1) * math.pi / 3) / math.sin(math.pi / 3)
        chi_c2 = (-1) ** j
        n_a = (chi_e + 8 * chi_c3 + 3 * chi_c2) / 12
        n_e = (2 * chi_e - 8 * chi_c3 + 6 * chi_c2) / 12 / 2
        n_f = (3 * chi_e - 3 * chi_c2) / 12
        weight = 5 * round(n_a) + 2 * round(n_e) + 3 * round(n_f)
        q += (2 * j + 1) * weight * math.exp(-C2 * b * j * (j + 1) / t)
    return q


def symmetric_top(t, b, k_constant, other_spins):
    q = 0.0
    for j in range(0, 400):
        base = b * j * (j + 1)
        if C2 * base / t > 80:
            break
        for k in range(-j, j + 1):
            w = 4 if k % 3 == 0 else 2
            q += (2 * j + 1) * w * other_spins * math.exp(-C2 * (base + (k_constant - b) * k * k) / t)
    return q


SYMMETRIC_TOPS = [("PH3", 4.4524, 3.9190, 2), ("CH3D", 3.880, 5.250, 3), ("CH3Cl", 0.443402, 5.2053, 4)]


def main():
    print("# rigid asymmetric rotor Q(T) with nuclear-spin weights: tools/partition/asymmetric_rotor_sum.py")
    print("# python " + sys.version.split()[0] + ", numpy " + np.__version__ + ", J <= " + str(J_MAX))
    print("molecule\t" + "\t".join(str(t) for t in TEMPERATURES))
    for name, (a, b, c), weight in MOLECULES:
        lv = levels(a, b, c)
        e0 = min(l[0] for l in lv)
        row = []
        for t in TEMPERATURES:
            row.append(sum(weight(l[2], l[3]) * (2 * l[1] + 1) * math.exp(-C2 * (l[0] - e0) / t) for l in lv))
        print(name + "\t" + "\t".join("%.6f" % q for q in row))
    print("CH4\t" + "\t".join("%.6f" % methane(t) for t in TEMPERATURES))
    for name, b, k_constant, spins in SYMMETRIC_TOPS:
        print(name + "\t" + "\t".join("%.6f" % symmetric_top(t, b, k_constant, spins) for t in TEMPERATURES))


if __name__ == "__main__":
    main()
