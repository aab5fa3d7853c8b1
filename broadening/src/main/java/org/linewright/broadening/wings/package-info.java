/**
 * Line wings: where a line's profile is cut off ({@link org.linewright.broadening.wings.WingCutoff}), optional
 * removal of the pedestal left at the cutoff, the optional sub-Lorentzian χ factor for CO2-broadened CO2 lines
 * ({@link org.linewright.broadening.wings.PerrinHartmannChi}), and the fraction of a line's area that these
 * choices remove ({@link org.linewright.broadening.wings.WingLoss}). {@link org.linewright.broadening.wings.WingTreatment}
 * bundles the choices; {@link org.linewright.broadening.wings.WingKernel} applies them to one line on a grid.
 */
package org.linewright.broadening.wings;
