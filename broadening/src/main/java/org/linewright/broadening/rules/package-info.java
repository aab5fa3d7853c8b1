/**
 * Published quantum-number broadening rules (γ and n as functions of |m|, J'' and K'a), kept as rule files of
 * linewright's own format under {@code resources/org/linewright/broadening/rules}; each file names its source.
 * Built in: Tan et al. 2022, ApJS 262, 40 (H2, He, CO2 for CO, CO2, N2O, PH3).
 */
package org.linewright.broadening.rules;
