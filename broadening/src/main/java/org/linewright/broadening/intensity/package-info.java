/**
 * Line intensities at temperature: S(T) from S(296 K) or from Einstein A coefficients
 * ({@link org.linewright.broadening.intensity.LineIntensity}) and the intensity cut with its report of the
 * dropped share ({@link org.linewright.broadening.intensity.IntensityCut}). Equations and sources:
 * {@code docs/physics.md}, section "Intensity".
 */
package org.linewright.broadening.intensity;
