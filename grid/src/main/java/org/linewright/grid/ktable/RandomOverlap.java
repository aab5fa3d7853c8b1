package org.linewright.grid.ktable;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.linewright.ingest.InputException;

/**
 * The k-table of a gas mixture from per-species k-tables by random overlap with resorting and rebinning (Lacis &amp;
 * Oinas 1991, JGR 96, 9027, §4; Amundsen et al. 2017, A&amp;A 598, A97, the "RORR" method): in each (p, T, bin), the
 * species' k-distributions are assumed uncorrelated in wavenumber, so the mixture's distribution is that of all the
 * sums k = x_A k_{A,i} + x_B k_{B,j} with weights w_i w_j; the N² sums are sorted and rebinned into the N g-intervals
 * of the quadrature (interval means, as {@link KDistribution}); a third species is added to the result the same way.
 *
 * <p>An approximation: exact when the species' spectra are uncorrelated within the bin, wrong where their lines
 * coincide (or where one species' lines sit in the other's windows systematically). k is per molecule of the whole
 * gas (σ_mix = Σ_m x_m σ_m), as the VMR-weighted σ sum. All tables must share axes, bins, quadrature and unit.
 */
public final class RandomOverlap {
    /** N² ≤ 65536 pairs: the pair index fits the 16 low bits of the sort key. */
    private static final int MAX_PAIRS = 1 << 16;

    private RandomOverlap() {
    }

    /**
     * @param tables per-species k-tables (same axes, bins, quadrature, unit)
     * @param vmr    the volume mixing ratio of each
     * @param names  the species names (metadata)
     */
    public static KTableContent combine(List<KTableContent> tables, double[] vmr, List<String> names) {
        if (tables.size() < 2 || tables.size() != vmr.length || names.size() != vmr.length) {
            throw new InputException("random overlap: " + tables.size() + " tables, " + vmr.length
                    + " mixing ratios, " + names.size() + " names (expected two or more of each, as many of each)");
        }
        KTableContent first = tables.get(0);
        for (int m = 0; m < tables.size(); m++) {
            KTableContent c = tables.get(m);
            if (!(vmr[m] >= 0 && Double.isFinite(vmr[m]))) {
                throw new InputException("random overlap: mixing ratio of " + names.get(m) + " " + vmr[m]
                        + " (expected a non-negative number)");
            }
            if (!Arrays.equals(c.pressureBar(), first.pressureBar()) || !Arrays.equals(c.temperatureK(), first.temperatureK())
                    || !Arrays.equals(c.binLowerCm1(), first.binLowerCm1()) || !Arrays.equals(c.binUpperCm1(), first.binUpperCm1())
                    || !Arrays.equals(c.g(), first.g()) || !Arrays.equals(c.gWeight(), first.gWeight())
                    || c.perGram() != first.perGram()) {
                throw new InputException("random overlap: the k-table of " + names.get(m) + " differs from that of "
                        + names.get(0) + " in axes, bins, g quadrature or unit");
            }
        }
        if (first.perGram()) {
            throw new InputException("random overlap: combine k-tables per molecule (cm2/molecule), not per unit mass");
        }
        int ng = first.gPoints();
        if ((long) ng * ng > MAX_PAIRS) {
            throw new InputException("random overlap: " + ng + " g points (at most 256)");
        }
        // the quadrature of the tables, rebuilt from their nodes and weights for the interval edges
        GQuadrature q = GQuadrature.fromNodes(first.g(), first.gWeight());
        int cellsBins = first.pressureBar().length * first.temperatureK().length * first.bins();
        double[] out = new double[first.k().length];
        double[] acc = new double[ng];
        double[] pairs = new double[ng * ng];
        double[] shares = new double[ng * ng];
        double[] sortedValues = new double[ng * ng];
        long[] keys = new long[ng * ng];
        double[] w = first.gWeight();
        for (int cb = 0; cb < cellsBins; cb++) {
            int o = cb * ng;
            for (int i = 0; i < ng; i++) {
                acc[i] = vmr[0] * tables.get(0).k()[o + i];
            }
            for (int m = 1; m < tables.size(); m++) {
                double[] km = tables.get(m).k();
                for (int i = 0; i < ng; i++) {
                    for (int j = 0; j < ng; j++) {
                        pairs[i * ng + j] = acc[i] + vmr[m] * km[o + j];
                    }
                }
                // primitive sort: key = the value's bits (monotone for non-negative doubles) with the low 16 bits
                // replaced by the pair index; values within 2^-36 relative may swap, which moves an interval mean by
                // no more than that
                for (int p = 0; p < pairs.length; p++) {
                    if (!(pairs[p] >= 0)) {
                        throw new InputException("random overlap: k " + pairs[p] + " in the table of " + names.get(m)
                                + " or before it (expected non-negative k)");
                    }
                    keys[p] = (Double.doubleToRawLongBits(pairs[p]) & ~0xFFFFL) | p;
                }
                Arrays.sort(keys);
                for (int p = 0; p < keys.length; p++) {
                    int idx = (int) (keys[p] & 0xFFFF);
                    sortedValues[p] = pairs[idx];
                    shares[p] = w[idx / ng] * w[idx % ng];
                }
                KDistribution.ofSortedWeighted(sortedValues, shares, pairs.length, q, KSampling.INTERVAL_MEAN, acc, 0);
            }
            System.arraycopy(acc, 0, out, o, ng);
        }
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("ktable_format", KTableLayout.FORMAT_VERSION);
        meta.put("mixture_method", "random overlap with resorting and rebinning (Lacis & Oinas 1991; Amundsen et al. "
                + "2017): assumes the species' spectra uncorrelated within each bin");
        StringBuilder species = new StringBuilder();
        for (int m = 0; m < names.size(); m++) {
            species.append(m == 0 ? "" : ",").append(names.get(m)).append('=')
                    .append(String.format(Locale.ROOT, "%.6g", vmr[m]));
        }
        meta.put("mixture_vmr", species.toString());
        for (int m = 0; m < names.size(); m++) {
            String sha = tables.get(m).metadata().get("source_table_sha256");
            if (sha != null) {
                meta.put("mixture_source_table_sha256." + names.get(m), sha);
            }
        }
        for (String key : new String[] {"g_points", "g_quadrature_kind", "g_quadrature_source", "bin_spacing_kind",
            "bins", "k_unit"}) {
            String v = first.metadata().get(key);
            if (v != null) {
                meta.put(key, v);
            }
        }
        meta.put("k_sampling_kind", KSampling.INTERVAL_MEAN.id());
        return new KTableContent(first.pressureBar(), first.temperatureK(), first.binLowerCm1(), first.binUpperCm1(),
                first.g(), first.gWeight(), out, first.pointsPerBin(), null, null, false, meta);
    }
}
