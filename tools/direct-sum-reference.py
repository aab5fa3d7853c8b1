#!/usr/bin/env python3
"""Independent direct summation of a 160-character line list with NumPy and scipy.special.wofz, for timing
comparisons with `linewright sigma` and as an outside check of its exact engine (benchmark tool, never a
dependency of the project).

    python3 tools/direct-sum-reference.py LIST.par --between 500 900 --step 0.002 --cutoff 5 \
        --pressure-atm 1 [--lines N] [--out sigma.csv]

At 296 K only: S is the record's S(296 K), the Lorentz HWHM gamma_air * p (air-broadening column), the centre shifted
by delta_air * p, the Doppler HWHM nu/c * sqrt(2 ln2 k T / m). The Voigt profile is Re w(z) / (sigma sqrt(2 pi)) with
z = (x + i gamma) / (sigma sqrt 2), sigma = alphaD / sqrt(2 ln 2) (common practice); each line is summed on the grid
points within the cutoff, |nu - nu0| <= cutoff, pedestal kept. Vectorised over batches of lines (a 2-D array of
lines x points per batch), accumulated with numpy.bincount.

Masses: molar masses of the isotopologues of the samples in g/mol (rounded isotope masses, from memory); other
isotopologues fall back to the molecule's main one. Prints the line count, the time of the summation alone and
the time per line.
"""
import argparse
import sys
import time

import numpy as np
from scipy.special import wofz

# molar masses in g/mol by (molecule id, isotopologue number), from memory (sum of rounded isotope masses)
MASSES = {
    (2, 1): 43.98983, (2, 2): 44.99319, (2, 3): 45.99408, (2, 4): 44.99404, (2, 5): 46.99744, (2, 6): 45.99740,
    (2, 7): 47.99832, (2, 8): 46.99826,
    (4, 1): 44.00106, (4, 2): 44.99810, (4, 3): 44.99810, (4, 4): 46.00533, (4, 5): 45.00528,
    (5, 1): 27.99491, (5, 2): 28.99827, (5, 3): 29.99916, (5, 4): 28.99913, (5, 5): 31.00252, (5, 6): 30.00249,
    (28, 1): 33.99724,
}
C_CM_PER_S = 2.99792458e10          # CODATA 2018 (exact)
K_ERG_PER_K = 1.380649e-16          # CODATA 2018 (exact)
AMU_G = 1.66053906660e-24           # CODATA 2018


def read(path, limit):
    nu, s, gamma, delta, mol, iso = [], [], [], [], [], []
    with open(path, encoding='latin-1') as f:
        for line in f:
            if len(line) < 160:
                continue
            mol.append(int(line[0:2]))
            iso_char = line[2]
            iso.append(10 if iso_char == '0' else (ord(iso_char) - ord('A') + 11 if iso_char.isalpha() else int(iso_char)))
            nu.append(float(line[3:15]))
            s.append(float(line[15:25]))
            gamma.append(float(line[35:40]))
            delta.append(float(line[59:67]))
            if limit and len(nu) >= limit:
                break
    return (np.array(nu), np.array(s), np.array(gamma), np.array(delta), np.array(mol), np.array(iso))


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument('list')
    ap.add_argument('--between', nargs=2, type=float, required=True)
    ap.add_argument('--step', type=float, required=True)
    ap.add_argument('--cutoff', type=float, required=True)
    ap.add_argument('--pressure-atm', type=float, default=1.0)
    ap.add_argument('--lines', type=int, default=0, help='only the first N records')
    ap.add_argument('--batch', type=int, default=64)
    ap.add_argument('--out')
    a = ap.parse_args()
    t_k = 296.0
    nu0, s, g_air, d_air, mol, iso = read(a.list, a.lines)
    lo, hi = a.between
    n = int(round((hi - lo) / a.step)) + 1
    grid = lo + a.step * np.arange(n)
    centre = nu0 + d_air * a.pressure_atm
    gamma = g_air * a.pressure_atm
    mass = np.array([MASSES.get((m, i), MASSES.get((m, 1), 44.0)) for m, i in zip(mol, iso)]) * AMU_G
    alpha = centre / C_CM_PER_S * np.sqrt(2 * np.log(2) * K_ERG_PER_K * t_k / mass)
    sig = alpha / np.sqrt(2 * np.log(2))
    half = int(np.ceil(a.cutoff / a.step)) + 1
    offsets = np.arange(-half, half + 1)
    sigma = np.zeros(n)
    start = time.perf_counter()
    for b in range(0, len(centre), a.batch):
        c = centre[b:b + a.batch, None]
        k = np.rint((c - lo) / a.step).astype(np.int64) + offsets[None, :]
        inside = (k >= 0) & (k < n)
        kk = np.clip(k, 0, n - 1)
        x = grid[kk] - c
        inside &= np.abs(x) <= a.cutoff
        sg = sig[b:b + a.batch, None]
        z = (x + 1j * gamma[b:b + a.batch, None]) / (sg * np.sqrt(2))
        v = wofz(z).real / (sg * np.sqrt(2 * np.pi)) * s[b:b + a.batch, None]
        sigma += np.bincount(kk[inside], weights=v[inside], minlength=n)
    seconds = time.perf_counter() - start
    print(f'{len(centre)} lines, {n} points, cutoff {a.cutoff} cm-1: summation {seconds:.2f} s '
          f'({seconds / len(centre) * 1e6:.1f} us per line); numpy {np.__version__}, scipy '
          f'{__import__("scipy").__version__}')
    if a.out:
        np.savetxt(a.out, np.column_stack([grid, sigma]), delimiter=',',
                   header='wavenumber_cm1,cross_section_cm2_per_molecule', comments='', fmt='%.17g')


if __name__ == '__main__':
    sys.exit(main())
