package org.linewright.ingest.testsupport;

import org.linewright.ingest.source.IsotopologueLookup;

/**
 * An isotopologue lookup that knows only the isotopologues present in the reference samples (README of
 * {@code hitran2020-samples}): CO (5) 1–6, CO2 (2) 1–8, N2O (4) 1–5, PH3 (28) 1. Abundances and Q(296 K) are those
 * listed in that README (HITRAN isotopologue metadata, TIPS-2021, recalled there from memory and confirmed by the
 * samples to 2×10⁻³); NaN where the README has none. Masses of the CO isotopologues (g/mol): sums of atomic masses
 * of the AME 2016 evaluation, from memory; NaN for the others.
 *
 * <p>Two ways to answer Q(T) away from 296 K:
 * <ul>
 *   <li>{@link #SampleIsotopologues()}: Q only at 296 K (NaN elsewhere), published values only — for checks of the
 *       samples themselves (the README's N2O 4/1 value was derived from the samples, so it is left out);</li>
 *   <li>{@link #withLinearRotorQ()}: Q(T) = Q(296)·T/296, the high-temperature rotational limit of a linear rotor,
 *       and the README's derived N2O 4/1 value included — for tests where the same Q(T) enters both sides of a
 *       comparison (it cancels).</li>
 * </ul>
 */
public final class SampleIsotopologues implements IsotopologueLookup {
    private static final double NAN = Double.NaN;
    /** N2O 4/1: Q(296) ≈ 5002 "derived from the samples" (README), abundance 0.990333. */
    private static final double[] N2O_1_DERIVED = {4, 1, 0.990333, 5002, NAN};
    /** {molecule, isotopologue, abundance, Q(296 K), mass g/mol} from the README table. */
    private static final double[][] TABLE = {
        {5, 1, 0.986544, 107.42, 27.994915}, {5, 2, 0.011083, 224.69, 28.998270},
        {5, 3, 1.97822e-3, 112.77, 29.999161}, {5, 4, 3.67867e-4, 661.17, 28.999130},
        {5, 5, 2.22250e-5, 236.44, 31.002516}, {5, 6, 4.13292e-6, 1384.66, 30.003485},
        {2, 1, 0.984204, 286.09, NAN}, {2, 2, 0.011057, 576.64, NAN}, {2, 3, 3.94707e-3, 607.81, NAN},
        {2, 4, 7.33989e-4, 3542.6, NAN}, {2, 5, 4.43446e-5, 1225.4, NAN}, {2, 6, 8.24623e-6, 7141.3, NAN},
        {2, 7, 3.95734e-6, 323.42, NAN},
        {4, 2, 3.64093e-3, 3362.0, NAN}, {4, 3, 3.64093e-3, 3458.6, NAN}, {4, 4, 1.98582e-3, 5314.7, NAN},
        {4, 5, 3.69280e-4, 30971, NAN},
        {28, 1, 0.999533, 3249.44, NAN},
    };

    private final boolean linearRotorQ;

    /** Published values only; Q at 296 K only. */
    public SampleIsotopologues() {
        this(false);
    }

    private SampleIsotopologues(boolean linearRotorQ) {
        this.linearRotorQ = linearRotorQ;
    }

    /** Q(T) = Q(296)·T/296, with the README's sample-derived N2O 4/1 value. */
    public static SampleIsotopologues withLinearRotorQ() {
        return new SampleIsotopologues(true);
    }

    @Override
    public Id byIsotopeFormula(String isotopeFormula) {
        return null;
    }

    @Override
    public Id byCatalogTag(int speciesTag) {
        return null;
    }

    @Override
    public boolean isKnown(int moleculeId, int isotopologue) {
        switch (moleculeId) {
            case 5: return isotopologue >= 1 && isotopologue <= 6;
            case 2: return isotopologue >= 1 && isotopologue <= 8;
            case 4: return isotopologue >= 1 && isotopologue <= 5;
            case 28: return isotopologue == 1;
            default: return false;
        }
    }

    @Override
    public double massGPerMol(int moleculeId, int isotopologue) {
        double[] r = row(moleculeId, isotopologue);
        return r == null ? NAN : r[4];
    }

    @Override
    public double naturalAbundance(int moleculeId, int isotopologue) {
        double[] r = row(moleculeId, isotopologue);
        return r == null ? NAN : r[2];
    }

    @Override
    public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        double[] r = row(moleculeId, isotopologue);
        if (r == null) {
            return NAN;
        }
        if (linearRotorQ) {
            return r[3] * temperatureK / 296.0;
        }
        return temperatureK == 296.0 ? r[3] : NAN;
    }

    private double[] row(int m, int i) {
        if (linearRotorQ && m == N2O_1_DERIVED[0] && i == N2O_1_DERIVED[1]) {
            return N2O_1_DERIVED;
        }
        for (double[] r : TABLE) {
            if (r[0] == m && r[1] == i) {
                return r;
            }
        }
        return null;
    }
}
