package org.linewright.grid.ktable;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A k-table in memory (what the writers write and the reader gives back). Arrays are flat, row-major:
 * k [p][T][bin][g], the band σ [p][T][bin].
 *
 * @param pressureBar              the pressure axis, bar
 * @param temperatureK             the temperature axis, K
 * @param binLowerCm1              lower bin edges, cm⁻¹
 * @param binUpperCm1              upper bin edges, cm⁻¹
 * @param g                        quadrature nodes
 * @param gWeight                  quadrature weights (sum 1)
 * @param k                        k [p][T][bin][g] in {@code unit}
 * @param pointsPerBin             σ-table points in each bin
 * @param bandMean                 band-mean σ [p][T][bin] in {@code unit}, or null when not asked for
 * @param transmissionEquivalent   transmission-equivalent σ [p][T][bin] in {@code unit}, or null
 * @param perGram                  true for cm²/g, false for cm²/molecule
 * @param metadata                 provenance and the k-table's own keys, in the order to write
 */
public record KTableContent(double[] pressureBar, double[] temperatureK, double[] binLowerCm1, double[] binUpperCm1,
                            double[] g, double[] gWeight, double[] k, int[] pointsPerBin, double[] bandMean,
                            double[] transmissionEquivalent, boolean perGram, Map<String, String> metadata) {
    public KTableContent {
        metadata = Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
    }

    public int bins() {
        return binLowerCm1.length;
    }

    public int gPoints() {
        return g.length;
    }

    /** Offset of k[p][t][b][0] in {@link #k()}. */
    public int kOffset(int p, int t, int b) {
        return ((p * temperatureK.length + t) * bins() + b) * gPoints();
    }

    /** Offset of [p][t][b] in the band arrays. */
    public int bandOffset(int p, int t, int b) {
        return (p * temperatureK.length + t) * bins() + b;
    }

    public double binCentreCm1(int b) {
        return 0.5 * (binLowerCm1[b] + binUpperCm1[b]);
    }

    /** The k dataset's name. */
    public String kName() {
        return perGram ? KTableLayout.K_PER_GRAM : KTableLayout.K_PER_MOLECULE;
    }

    public String bandMeanName() {
        return perGram ? KTableLayout.BAND_MEAN_PER_GRAM : KTableLayout.BAND_MEAN_PER_MOLECULE;
    }

    public String transmissionEquivalentName() {
        return perGram ? KTableLayout.TRANSMISSION_EQUIVALENT_PER_GRAM
                : KTableLayout.TRANSMISSION_EQUIVALENT_PER_MOLECULE;
    }

    /** The unit of k and the band σ. */
    public String unit() {
        return perGram ? KTableLayout.UNIT_PER_GRAM : KTableLayout.UNIT_PER_MOLECULE;
    }
}
