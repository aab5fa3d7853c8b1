#!/usr/bin/env python3
"""Generate the Faddeeva reference table faddeeva-reference.csv used by FaddeevaReferenceTest.

Reference: scipy.special.wofz (S.G. Johnson's Faddeeva package inside SciPy), w(z) = exp(-z^2) erfc(-iz).
Run once from this directory:   python3 make_faddeeva_reference.py > faddeeva-reference.csv
The header records the Python, NumPy, SciPy (and mpmath, if present) versions. If mpmath is installed, the
table is cross-checked against mpmath at 60 digits on every point with |z| <= 1e4 and the largest relative
deviations (real part; imaginary part relative to |w|) are written to the header.
Points: x in {0} U +/-logspace(-4, 6) (negatives on a subset), y in logspace(-8, 4), plus a dense block in the
hard region 2 <= x <= 40, 1e-8 <= y <= 1e-1 (Re w tiny: exp(-x^2) and y/(sqrt(pi) x^2) compete) and the
region boundaries |z| = 8 and |z| = 4000 approached from both sides.
"""
import sys
import platform
import numpy as np
import scipy
from scipy.special import wofz

xs = [0.0] + list(np.logspace(-4, 6, 61))
ys = list(np.logspace(-8, 4, 49))
points = []
for x in xs:
    for y in ys:
        points.append((x, y))
for x in np.logspace(-4, 6, 11):          # negative x on a subset
    for y in np.logspace(-8, 4, 13):
        points.append((-x, y))
for x in np.linspace(2.0, 40.0, 77):      # hard region
    for y in np.logspace(-8, -1, 15):
        points.append((x, y))
for r in (8.0, 4000.0):                    # region boundaries
    for f in (1 - 1e-9, 1 + 1e-9):
        for ang in (1e-9, 1e-4, 0.3, 0.785, 1.2, 1.5707):
            points.append((r * f * np.cos(ang), max(r * f * np.sin(ang), 1e-8)))

z = np.array([complex(x, y) for x, y in points])
w = wofz(z)

header = [
    "# Faddeeva reference values w(x+iy) from scipy.special.wofz",
    "# command: python3 make_faddeeva_reference.py > faddeeva-reference.csv",
    "# python %s, numpy %s, scipy %s" % (platform.python_version(), np.__version__, scipy.__version__),
]
try:
    import mpmath as mp
    mp.mp.dps = 60
    worst_re = 0.0
    worst_im = 0.0
    for (x, y), v in zip(points, w):
        if abs(complex(x, y)) > 1e4:
            continue
        zz = mp.mpc(x, y)
        ref = mp.exp(-zz * zz) * mp.erfc(-1j * zz)
        worst_re = max(worst_re, float(abs(v.real - ref.real) / abs(ref.real)))
        worst_im = max(worst_im, float(abs(v.imag - ref.imag) / abs(ref)))
    header.append("# cross-check mpmath %s at 60 digits, |z| <= 1e4: max rel dev Re %.2e, Im (rel |w|) %.2e"
                  % (mp.__version__, worst_re, worst_im))
except ImportError:
    header.append("# mpmath not available: no cross-check")
header.append("x,y,re_w,im_w")
out = sys.stdout
out.write("\n".join(header) + "\n")
for (x, y), v in zip(points, w):
    out.write("%.17g,%.17g,%.17g,%.17g\n" % (x, y, v.real, v.imag))
