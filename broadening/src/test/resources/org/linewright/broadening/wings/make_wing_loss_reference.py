#!/usr/bin/env python3
"""Generate wing-loss-reference.csv used by WingLossTest: the fraction of a Voigt line's area beyond a symmetric
cutoff, 2 * integral_d^inf voigt_profile(v) dv, by scipy.integrate.quad on scipy.special.voigt_profile, written as
1 - 2*integral_0^d (d small) or 2*integral_d^inf (substitution v = d/t), whichever keeps relative accuracy.
Run once from this directory:   python3 make_wing_loss_reference.py > wing-loss-reference.csv
"""
import platform
import numpy as np
import scipy
from scipy.special import voigt_profile
from scipy.integrate import quad

cases = [(0.005, 0.07, 25.0), (0.005, 0.07, 1.0), (0.005, 0.07, 0.05), (0.01, 0.001, 0.02),
         (0.01, 0.001, 5.0), (0.003, 0.5, 25.0), (0.008, 0.008, 0.01), (0.008, 0.008, 100.0)]
print("# Voigt area fraction beyond +-d from scipy.integrate.quad on scipy.special.voigt_profile")
print("# command: python3 make_wing_loss_reference.py > wing-loss-reference.csv")
print("# python %s, numpy %s, scipy %s" % (platform.python_version(), np.__version__, scipy.__version__))
print("alphaD_cm1,gammaL_cm1,cutoff_cm1,lost_fraction")
for aD, gL, d in cases:
    sigma = aD / np.sqrt(2 * np.log(2))
    f = lambda t: voigt_profile(d / t, sigma, gL) * d / (t * t)
    # geometric panels towards t = 0 so that the core at t ~ d/(width) is resolved at any scale
    edges = [0.0] + [2.0 ** -k for k in range(60, -1, -1)]
    tail = sum(quad(f, a, b, epsabs=0, epsrel=1e-13, limit=200)[0] for a, b in zip(edges[:-1], edges[1:]))
    print("%.17g,%.17g,%.17g,%.17g" % (aD, gL, d, 2 * tail))
