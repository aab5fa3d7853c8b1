/**
 * Line-shape functions: the Faddeeva function w(z) and its real and imaginary parts (the Voigt functions
 * K and L), the area-normalised Voigt, Doppler (Gaussian) and Lorentz profiles with allocation-free array
 * kernels, and the Voigt width approximation of Olivero and Longbothum.
 *
 * <p>Units: detunings and widths in cm⁻¹, profile values in cm (that is, per cm⁻¹). All widths are half widths
 * at half maximum (HWHM) unless a name says otherwise.
 */
package org.linewright.broadening.voigt;
