#!/usr/bin/env python3
"""Generate voigt-profile-reference.csv used by VoigtProfileTest.

Reference: scipy.special.voigt_profile(x, sigma, gamma) (area-normalised Voigt, Gaussian standard deviation
sigma, Lorentz HWHM gamma). Doppler HWHM alphaD = sigma*sqrt(2 ln 2).
Run once from this directory:   python3 make_voigt_profile_reference.py > voigt-profile-reference.csv
Lines (alphaD, gammaL in cm-1) span Doppler-dominated to pressure-dominated; detunings are the 0.01 cm-1 grid
points up to 25 cm-1 taken at log-spaced indices (both signs) plus the centre.
"""
import platform
import numpy as np
import scipy
from scipy.special import voigt_profile

lines = [(0.003, 1e-4), (0.005, 0.002), (0.005, 0.07), (0.01, 0.5), (0.004, 0.0)]
idx = np.unique(np.round(np.logspace(0, np.log10(2500), 120)).astype(int))
print("# Voigt profile reference values from scipy.special.voigt_profile")
print("# command: python3 make_voigt_profile_reference.py > voigt-profile-reference.csv")
print("# python %s, numpy %s, scipy %s" % (platform.python_version(), np.__version__, scipy.__version__))
print("alphaD_cm1,gammaL_cm1,detuning_cm1,profile_cm")
for aD, gL in lines:
    sigma = aD / np.sqrt(2 * np.log(2))
    dets = [0.0] + [0.01 * i for i in idx] + [-0.01 * i for i in idx]
    for d in dets:
        v = voigt_profile(d, sigma, gL)
        print("%.17g,%.17g,%.17g,%.17g" % (aD, gL, d, v))
