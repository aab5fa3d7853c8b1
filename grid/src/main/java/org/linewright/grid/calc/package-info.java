/**
 * The cross-section calculator: turns the lines of one or more line stores into engine input for one
 * (p, T) — S(T), Doppler and Lorentz widths, pressure shifts, intensity threshold, χ flags — streaming them in
 * wavenumber order chunk by chunk, and returns σ with its statistics ({@link
 * org.linewright.grid.calc.CrossSectionCalculator}, {@link org.linewright.grid.calc.CrossSectionRequest},
 * {@link org.linewright.grid.calc.CrossSectionResult}).
 */
package org.linewright.grid.calc;
