package org.linewright.broadening.isotopologue;

import java.util.Arrays;

import org.linewright.ingest.InputException;
import org.linewright.ingest.source.IsotopologueLookup;

/**
 * The registry values the per-line loops need — mass, natural abundance, Q(296 K) and Q(T) — for one
 * temperature, looked up once per isotopologue and then read from primitive arrays. Line lists sorted by
 * wavenumber interleave isotopologues row by row; without the cache every row would ask the registry again.
 *
 * <p>Slots are indexed by molecule × {@value #ISOTOPOLOGUE_SLOTS} + isotopologue and grow (rarely) when a
 * larger molecule number appears; after the first sight of each isotopologue, reads allocate nothing. Not
 * thread-safe: one cache per thread.
 */
public final class IsotopologueCache {
    /** Isotopologue numbers per molecule held in slots (0–63); larger numbers are looked up every time. */
    public static final int ISOTOPOLOGUE_SLOTS = 64;

    private final IsotopologueLookup lookup;
    private final double temperatureK;
    private boolean[] filled = new boolean[0];
    private double[] mass = new double[0];
    private double[] abundance = new double[0];
    private double[] q296 = new double[0];
    private double[] qT = new double[0];

    /**
     * @param lookup the registry
     * @param temperatureK the temperature of {@link #partitionSum}, positive and finite
     */
    public IsotopologueCache(IsotopologueLookup lookup, double temperatureK) {
        if (!(temperatureK > 0) || Double.isInfinite(temperatureK)) {
            throw new IllegalArgumentException("temperature must be positive and finite: " + temperatureK + " K");
        }
        this.lookup = lookup;
        this.temperatureK = temperatureK;
    }

    /** The temperature of {@link #partitionSum}. */
    public double temperatureK() {
        return temperatureK;
    }

    /** The registry behind the cache. */
    public IsotopologueLookup lookup() {
        return lookup;
    }

    private int slot(int moleculeId, int isotopologue) {
        if (moleculeId < 0 || isotopologue < 0 || isotopologue >= ISOTOPOLOGUE_SLOTS) {
            return -1;
        }
        int s = moleculeId * ISOTOPOLOGUE_SLOTS + isotopologue;
        if (s >= filled.length) {
            int n = Math.max(s + 1, filled.length * 2);
            filled = Arrays.copyOf(filled, n);
            mass = Arrays.copyOf(mass, n);
            abundance = Arrays.copyOf(abundance, n);
            q296 = Arrays.copyOf(q296, n);
            qT = Arrays.copyOf(qT, n);
        }
        if (!filled[s]) {
            mass[s] = lookup.massGPerMol(moleculeId, isotopologue);
            abundance[s] = lookup.naturalAbundance(moleculeId, isotopologue);
            q296[s] = lookup.partitionSum(moleculeId, isotopologue, 296.0);
            qT[s] = lookup.partitionSum(moleculeId, isotopologue, temperatureK);
            filled[s] = true;
        }
        return s;
    }

    /** Mass in g/mol; NaN when unknown. */
    public double massGPerMol(int moleculeId, int isotopologue) {
        int s = slot(moleculeId, isotopologue);
        return s < 0 ? lookup.massGPerMol(moleculeId, isotopologue) : mass[s];
    }

    /** Natural abundance; NaN when unknown. */
    public double naturalAbundance(int moleculeId, int isotopologue) {
        int s = slot(moleculeId, isotopologue);
        return s < 0 ? lookup.naturalAbundance(moleculeId, isotopologue) : abundance[s];
    }

    /** Q(296 K); NaN when unknown. */
    public double partitionSum296(int moleculeId, int isotopologue) {
        int s = slot(moleculeId, isotopologue);
        return s < 0 ? lookup.partitionSum(moleculeId, isotopologue, 296.0) : q296[s];
    }

    /** Q at {@link #temperatureK()}; NaN when unknown. */
    public double partitionSum(int moleculeId, int isotopologue) {
        int s = slot(moleculeId, isotopologue);
        return s < 0 ? lookup.partitionSum(moleculeId, isotopologue, temperatureK) : qT[s];
    }

    /**
     * Q(296 K) and Q(T), checked.
     *
     * @throws InputException naming the isotopologue and the source line when either is unknown
     */
    public void requirePartitionSums(int moleculeId, int isotopologue, long sourceLine) {
        double a = partitionSum296(moleculeId, isotopologue);
        double b = partitionSum(moleculeId, isotopologue);
        if (!(a > 0) || !(b > 0)) {
            throw new InputException("no partition sum for molecule " + moleculeId + " isotopologue " + isotopologue
                    + " at " + (a > 0 ? temperatureK : 296.0) + " K (line " + sourceLine
                    + "; expected the isotopologue and its partition sums in the registry)");
        }
    }
}
