package org.linewright.broadening.testsupport;

import java.util.HashMap;
import java.util.Map;

import org.linewright.ingest.source.IsotopologueLookup;

/**
 * A small isotopologue table for tests. Abundances and Q(296 K): the table of
 * {@code reference-data/hitran2020-samples/README.md} ("HITRAN isotopologue metadata, TIPS-2021, from memory,
 * confirmed by the samples"). Masses of the CO isotopologues (g/mol): sums of atomic masses of the AME 2016
 * evaluation, from memory. Q(T) at other temperatures: Q(296)·T/296 — the high-temperature rotational limit of
 * a linear rotor, good enough for tests where the same Q(T) enters both sides of a comparison (it cancels).
 */
public final class SampleIsotopologues implements IsotopologueLookup {
    private record Entry(double abundance, double q296, double mass) { }

    private final Map<Long, Entry> entries = new HashMap<>();

    public SampleIsotopologues() {
        put(5, 1, 0.986544, 107.42, 27.994915);
        put(5, 2, 0.011083, 224.69, 28.998270);
        put(5, 3, 1.97822e-3, 112.77, 29.999161);
        put(5, 4, 3.67867e-4, 661.17, 28.999130);
        put(5, 5, 2.22250e-5, 236.44, 31.002516);
        put(5, 6, 4.13292e-6, 1384.66, 30.003485);
        put(2, 1, 0.984204, 286.09, Double.NaN);
        put(2, 2, 0.011057, 576.64, Double.NaN);
        put(2, 3, 3.94707e-3, 607.81, Double.NaN);
        put(2, 4, 7.33989e-4, 3542.6, Double.NaN);
        put(2, 5, 4.43446e-5, 1225.4, Double.NaN);
        put(2, 6, 8.24623e-6, 7141.3, Double.NaN);
        put(2, 7, 3.95734e-6, 323.42, Double.NaN);
        put(2, 8, Double.NaN, Double.NaN, Double.NaN); // in sample_CO2.par, not in the README table
        put(4, 1, 0.990333, 5002, Double.NaN); // README: Q(296) ≈ 5002, derived from the samples
        put(4, 2, 3.64093e-3, 3362.0, Double.NaN);
        put(4, 3, 3.64093e-3, 3458.6, Double.NaN);
        put(4, 4, 1.98582e-3, 5314.7, Double.NaN);
        put(4, 5, 3.69280e-4, 30971, Double.NaN);
        put(28, 1, 0.999533, 3249.44, Double.NaN);
    }

    private void put(int mol, int iso, double abundance, double q296, double mass) {
        entries.put(key(mol, iso), new Entry(abundance, q296, mass));
    }

    private static long key(int mol, int iso) {
        return ((long) mol << 32) | iso;
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
        return entries.containsKey(key(moleculeId, isotopologue));
    }

    @Override
    public double massGPerMol(int moleculeId, int isotopologue) {
        Entry e = entries.get(key(moleculeId, isotopologue));
        return e == null ? Double.NaN : e.mass;
    }

    @Override
    public double naturalAbundance(int moleculeId, int isotopologue) {
        Entry e = entries.get(key(moleculeId, isotopologue));
        return e == null ? Double.NaN : e.abundance;
    }

    @Override
    public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        Entry e = entries.get(key(moleculeId, isotopologue));
        return e == null ? Double.NaN : e.q296 * temperatureK / 296.0;
    }
}
