package org.linewright.ingest.testsupport;

import org.linewright.ingest.source.IsotopologueLookup;

/**
 * An isotopologue lookup that knows only the isotopologues present in the reference samples (README of
 * {@code hitran2020-samples}): CO (5) 1–6, CO2 (2) 1–8, N2O (4) 1–5, PH3 (28) 1. Abundances and partition
 * sums are those listed in that README (HITRAN isotopologue metadata, TIPS-2021, recalled there from
 * memory and confirmed by the samples to 2×10⁻³); NaN elsewhere.
 */
public final class SampleIsotopologues implements IsotopologueLookup {
    /** {molecule, isotopologue, abundance, Q(296 K)} from the README table. */
    private static final double[][] TABLE = {
        {5, 1, 0.986544, 107.42}, {5, 2, 0.011083, 224.69}, {5, 3, 1.97822e-3, 112.77},
        {5, 4, 3.67867e-4, 661.17}, {5, 5, 2.22250e-5, 236.44}, {5, 6, 4.13292e-6, 1384.66},
        {2, 1, 0.984204, 286.09}, {2, 2, 0.011057, 576.64}, {2, 3, 3.94707e-3, 607.81},
        {2, 4, 7.33989e-4, 3542.6}, {2, 5, 4.43446e-5, 1225.4}, {2, 6, 8.24623e-6, 7141.3},
        {2, 7, 3.95734e-6, 323.42},
        {4, 2, 3.64093e-3, 3362.0}, {4, 3, 3.64093e-3, 3458.6}, {4, 4, 1.98582e-3, 5314.7},
        {4, 5, 3.69280e-4, 30971},
        {28, 1, 0.999533, 3249.44},
    };

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
        return Double.NaN;
    }

    @Override
    public double naturalAbundance(int moleculeId, int isotopologue) {
        double[] r = row(moleculeId, isotopologue);
        return r == null ? Double.NaN : r[2];
    }

    @Override
    public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        double[] r = row(moleculeId, isotopologue);
        return r == null || temperatureK != 296.0 ? Double.NaN : r[3];
    }

    private static double[] row(int m, int i) {
        for (double[] r : TABLE) {
            if (r[0] == m && r[1] == i) {
                return r;
            }
        }
        return null;
    }
}
