/**
 * Line intensities at temperature: S(T) from S(296 K) or from Einstein A coefficients
 * ({@link org.linewright.broadening.intensity.LineIntensity}) and the compensated sum of line statistics
 * ({@link org.linewright.broadening.intensity.CompensatedSum}; the intensity threshold itself is applied where the
 * lines are prepared, in the grid module's calculator). Equations and sources:
 * {@code docs/physics.md}, section "Intensity".
 */
package org.linewright.broadening.intensity;
