package org.linewright.ingest.exomol;

import org.linewright.ingest.source.IsotopologueLookup;

/**
 * A registry of one isotopologue, ¹²C¹⁶O, for the reader tests; every number is from outside the project:
 * <ul>
 *   <li>ids 5/1, abundance 0.986544 and Q(296 K) = 107.42: isotopologue metadata of the 160-character line
 *       list (I.E. Gordon et al., HITRAN2020, JQSRT 277 (2022) 107949; from memory, confirmed by the samples'
 *       intensities as recorded in the reference-data README);</li>
 *   <li>catalog species tag 28001 (mass number 28, first species; from memory);</li>
 *   <li>Q(T) by direct summation over the rotational levels of the ground vibrational state,
 *       E(J) = B·J(J+1) − D·J²(J+1)², B = 1.92252896 cm⁻¹, D = 6.1214×10⁻⁶ cm⁻¹ (CO X¹Σ⁺ v = 0, from memory),
 *       times the harmonic vibrational factor 1/(1 − exp(−c₂ω/T)), ω = 2143.27 cm⁻¹ (the fundamental band
 *       origin, from memory) — the textbook rigid-rotor-with-distortion sum (common practice). It reproduces
 *       Q(296 K) = 107.42 to 5×10⁻⁶.</li>
 * </ul>
 */
public final class CarbonMonoxideLookup implements IsotopologueLookup {
    public static final int MOLECULE = 5;
    public static final int ISOTOPOLOGUE = 1;
    public static final double ABUNDANCE = 0.986544;
    public static final double Q296 = 107.42;
    /** c2 = hc/k in cm·K, CODATA 2018 (written out here so the test does not use the code under test). */
    public static final double C2_CM_K = 1.438776877;
    private static final double B_CM1 = 1.92252896;
    private static final double D_CM1 = 6.1214e-6;
    private static final double VIBRATION_CM1 = 2143.27;

    @Override
    public Id byIsotopeFormula(String isotopeFormula) {
        return "12C-16O".equals(isotopeFormula) ? new Id(MOLECULE, ISOTOPOLOGUE) : null;
    }

    @Override
    public Id byCatalogTag(int speciesTag) {
        return speciesTag == 28001 ? new Id(MOLECULE, ISOTOPOLOGUE) : null;
    }

    @Override
    public boolean isKnown(int moleculeId, int isotopologue) {
        return moleculeId == MOLECULE && isotopologue == ISOTOPOLOGUE;
    }

    @Override
    public double massGPerMol(int moleculeId, int isotopologue) {
        return isKnown(moleculeId, isotopologue) ? 27.994915 : Double.NaN;
    }

    @Override
    public double naturalAbundance(int moleculeId, int isotopologue) {
        return isKnown(moleculeId, isotopologue) ? ABUNDANCE : Double.NaN;
    }

    @Override
    public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        if (!isKnown(moleculeId, isotopologue)) {
            return Double.NaN;
        }
        return directSum(temperatureK);
    }

    /** Σ (2J+1)·exp(−c₂E(J)/T) / (1 − exp(−c₂ω/T)), J = 0..199 (terms beyond are below 10⁻³⁰⁰ at 300 K). */
    public static double directSum(double temperatureK) {
        double sum = 0;
        for (int j = 0; j < 200; j++) {
            double jj = j * (j + 1.0);
            sum += (2 * j + 1) * Math.exp(-C2_CM_K * (B_CM1 * jj - D_CM1 * jj * jj) / temperatureK);
        }
        return sum / (1 - Math.exp(-C2_CM_K * VIBRATION_CM1 / temperatureK));
    }
}
