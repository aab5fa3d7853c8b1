package org.linewright.broadening.intensity;

import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;

/**
 * The per-isotopologue factor that turns the stored intensities (per molecule of the natural-abundance species,
 * S including the list's abundance a_list) into the requested convention:
 * <pre>
 *   natural-abundance:  S_out = S · a_user / a_list   (a_user = a_list where the user set none)
 *   isotopologue:       S_out = S / a_list
 * </pre>
 * S is linear in the abundance on both paths of {@link LineIntensity} (S(296 K) given, or from A with I_a;
 * Šimečková et al. 2006, JQSRT 98, 130, eq. 20), so one factor per isotopologue applied after S(T) is exact and
 * treats lines given by S(296 K) and by Einstein A alike. For σ per molecule of a mixture the factor also carries
 * the molecule's share x_m / Σ x ({@link #withMoleculeShares}): σ_mix = Σ_m x_m σ_m / Σ x is then one sum over the
 * lines of every declared molecule, computed (and its error estimated) in one pass. Immutable; {@link #apply}
 * allocates nothing once each isotopologue has been seen (factors kept in slots as in {@link IsotopologueCache}).
 */
public final class IntensityScaling {
    /** The stored intensities unchanged: natural abundances, no user values. */
    public static final IntensityScaling NATURAL = new IntensityScaling(IntensityConvention.NATURAL_ABUNDANCE,
            Map.of());

    private final IntensityConvention convention;
    private final Map<Long, Double> userAbundances;
    private final Map<String, Double> userAbundancesByName;
    /** Molecule id → x_m / Σ x; empty for one molecule (no mixture). */
    private final Map<Integer, Double> moleculeShares;

    /**
     * @param convention per natural-abundance molecule or per isotopologue molecule
     * @param userAbundances abundance per isotopologue named {@code MOL/ISO} (molecule id, local number), each in
     *        (0, 1]; only with {@link IntensityConvention#NATURAL_ABUNDANCE}
     * @throws InputException for an abundance outside (0, 1] or user abundances with the isotopologue convention
     */
    public IntensityScaling(IntensityConvention convention, Map<String, Double> userAbundances) {
        this.convention = convention;
        Map<Long, Double> byKey = new LinkedHashMap<>();
        for (Map.Entry<String, Double> e : userAbundances.entrySet()) {
            double a = e.getValue();
            if (!(a > 0 && a <= 1)) {
                throw new InputException("abundance of " + e.getKey() + ": " + a + " (expected a fraction in (0, 1])");
            }
            String[] parts = e.getKey().split("/");
            byKey.put(key(Integer.parseInt(parts[0]), Integer.parseInt(parts[1])), a);
        }
        if (convention == IntensityConvention.ISOTOPOLOGUE && !byKey.isEmpty()) {
            throw new InputException("abundances given with the isotopologue convention (per molecule of one "
                    + "isotopologue no abundance applies; expected the natural-abundance convention)");
        }
        this.userAbundances = byKey;
        this.userAbundancesByName = Collections.unmodifiableMap(new LinkedHashMap<>(userAbundances));
        this.moleculeShares = Map.of();
    }

    private IntensityScaling(IntensityScaling base, Map<Integer, Double> moleculeShares) {
        this.convention = base.convention;
        this.userAbundances = base.userAbundances;
        this.userAbundancesByName = base.userAbundancesByName;
        this.moleculeShares = moleculeShares;
    }

    /**
     * This scaling, each molecule's intensities also multiplied by its share of a declared mixture.
     *
     * @param volumeMixingRatios molecule id → x_m, each positive and finite
     * @return the scaling with factor x_m / Σ x on every isotopologue of molecule m; a molecule absent from the map
     *         gets factor 0 (its lines are not part of the mixture)
     * @throws InputException for a ratio that is not positive and finite, or an empty map
     */
    public IntensityScaling withMoleculeShares(Map<Integer, Double> volumeMixingRatios) {
        if (volumeMixingRatios.isEmpty()) {
            throw new InputException("a mixture without molecules (expected at least one mixing ratio)");
        }
        double total = 0;
        for (Map.Entry<Integer, Double> e : volumeMixingRatios.entrySet()) {
            double x = e.getValue();
            if (!(x > 0) || Double.isInfinite(x)) {
                throw new InputException("mixing ratio of molecule " + e.getKey() + ": " + x
                        + " (expected a positive number)");
            }
            total += x;
        }
        Map<Integer, Double> shares = new LinkedHashMap<>();
        for (Map.Entry<Integer, Double> e : volumeMixingRatios.entrySet()) {
            shares.put(e.getKey(), e.getValue() / total);
        }
        return new IntensityScaling(this, Collections.unmodifiableMap(shares));
    }

    /** Molecule id → share x_m / Σ x of the declared mixture, in declaration order; empty without a mixture. */
    public Map<Integer, Double> moleculeShares() {
        return moleculeShares;
    }

    private static long key(int moleculeId, int isotopologue) {
        return ((long) moleculeId << 32) | (isotopologue & 0xffffffffL);
    }

    public IntensityConvention convention() {
        return convention;
    }

    /** The user abundances by {@code MOL/ISO} name, in the order given. */
    public Map<String, Double> userAbundances() {
        return userAbundancesByName;
    }

    /** True when {@link #apply} changes nothing. */
    public boolean isIdentity() {
        return convention == IntensityConvention.NATURAL_ABUNDANCE && userAbundances.isEmpty()
                && moleculeShares.isEmpty();
    }

    /**
     * The factor for one isotopologue, given the list's abundance a_list.
     *
     * @throws InputException when the factor needs a_list and the registry has none
     */
    public double factor(int moleculeId, int isotopologue, double listAbundance) {
        return abundanceFactor(moleculeId, isotopologue, listAbundance) * shareOf(moleculeId);
    }

    private double shareOf(int moleculeId) {
        if (moleculeShares.isEmpty()) {
            return 1.0;
        }
        Double share = moleculeShares.get(moleculeId);
        return share == null ? 0.0 : share;
    }

    private double abundanceFactor(int moleculeId, int isotopologue, double listAbundance) {
        Double user = userAbundances.get(key(moleculeId, isotopologue));
        if (convention == IntensityConvention.NATURAL_ABUNDANCE && user == null) {
            return 1.0;
        }
        if (!(listAbundance > 0)) {
            throw new InputException("no natural abundance for molecule " + moleculeId + " isotopologue "
                    + isotopologue + " (needed to rescale its intensities; expected it in the registry)");
        }
        return convention == IntensityConvention.ISOTOPOLOGUE ? 1.0 / listAbundance : user / listAbundance;
    }

    /** Metadata for σ files and tables: the convention and the user abundances ({@code MOL/ISO=value;…}). */
    public Map<String, String> metadata() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("intensity_convention", convention.label());
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<String, Double> e : userAbundancesByName.entrySet()) {
            if (sb.length() > 0) {
                sb.append(';');
            }
            sb.append(e.getKey()).append('=').append(String.format(Locale.ROOT, "%.10g", e.getValue()));
        }
        m.put("isotopologue_abundances", sb.length() == 0 ? "natural (registry)" : sb.toString()
                + "; others natural (registry)");
        return m;
    }

    /** A per-thread view that keeps the factors in primitive slots. */
    public Applier newApplier() {
        return new Applier();
    }

    /** Multiplies S(T) of a batch by the factor of each row's isotopologue; one per thread. */
    public final class Applier {
        private double[] factors = new double[0];

        private Applier() {
        }

        /**
         * @param cache registry values (for a_list)
         * @param intensity S(T) of rows {@code 0 .. batch.size-1}, rescaled in place
         */
        public void apply(LineBatch batch, IsotopologueCache cache, double[] intensity) {
            if (isIdentity()) {
                return;
            }
            for (int i = 0; i < batch.size; i++) {
                int mol = batch.moleculeId[i];
                int iso = batch.isotopologue[i];
                intensity[i] *= factorOf(mol, iso, cache);
            }
        }

        private double factorOf(int mol, int iso, IsotopologueCache cache) {
            if (mol < 0 || iso < 0 || iso >= IsotopologueCache.ISOTOPOLOGUE_SLOTS) {
                return factor(mol, iso, cache.naturalAbundance(mol, iso));
            }
            int s = mol * IsotopologueCache.ISOTOPOLOGUE_SLOTS + iso;
            if (s >= factors.length) {
                int old = factors.length;
                factors = Arrays.copyOf(factors, Math.max(s + 1, old * 2));
                Arrays.fill(factors, old, factors.length, Double.NaN);
            }
            if (Double.isNaN(factors[s])) {
                factors[s] = factor(mol, iso, cache.naturalAbundance(mol, iso));
            }
            return factors[s];
        }
    }
}
