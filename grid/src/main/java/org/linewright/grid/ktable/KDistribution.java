package org.linewright.grid.ktable;

import java.util.Arrays;

/**
 * The k-distribution of one spectral bin: the σ values of the bin's points sorted ascending define
 * k(g), a step function with step j on [c_j, c_j + f_j) (f_j the point's share of the bin, 1/n for the n equally
 * weighted points of a σ table; c_j = Σ_{l<j} f_l), and the band-mean transmittance
 * T(u) = Σ_j f_j exp(−σ_j u) = ∫₀¹ exp(−k(g) u) dg exactly (Goody & Yung 1989, Atmospheric Radiation, §6.8;
 * Lacis & Oinas 1991, JGR 96, 9027). A quadrature (g_i, w_i) turns it into N values k_i with
 * T(u) ≈ Σ_i w_i exp(−k_i u); {@link KSampling} says how k_i is taken. Works in place on primitive arrays, no
 * allocation.
 */
public final class KDistribution {
    private KDistribution() {
    }

    /**
     * k_i of n equally weighted values.
     *
     * @param values   the bin's σ values; positions [from, to) are sorted in place
     * @param from     first position
     * @param to       end position (exclusive), {@code to > from}
     * @param q        the quadrature
     * @param sampling how k_i is taken
     * @param out      receives k_0 … k_{N−1} from {@code outOffset}
     */
    public static void ofEqualWeights(double[] values, int from, int to, GQuadrature q, KSampling sampling,
                                      double[] out, int outOffset) {
        Arrays.sort(values, from, to);
        int n = to - from;
        int nq = q.size();
        if (sampling == KSampling.NODE) {
            for (int i = 0; i < nq; i++) {
                // step j covers [j/n, (j+1)/n): the node g_i lies on step floor(g_i n)
                int j = Math.min(n - 1, (int) (q.node(i) * n));
                out[outOffset + i] = values[from + j];
            }
            return;
        }
        int j = 0;
        for (int i = 0; i < nq; i++) {
            double ga = q.intervalEdge(i);
            double gb = q.intervalEdge(i + 1);
            double sum = 0;
            // steps overlapping [ga, gb): from the one holding ga
            j = Math.max(j, Math.min(n - 1, (int) (ga * n)));
            while (j > 0 && (double) j / n > ga) {
                j--; // guard against rounding in ga·n
            }
            int l = j;
            while (l < n) {
                double lo = Math.max((double) l / n, ga);
                double hi = Math.min((double) (l + 1) / n, gb);
                if (hi > lo) {
                    sum += (hi - lo) * values[from + l];
                }
                if ((double) (l + 1) / n >= gb) {
                    break;
                }
                l++;
            }
            out[outOffset + i] = sum / (gb - ga);
        }
    }

    /**
     * k_i of weighted values (e.g. the N² pairs of a random-overlap mixture).
     *
     * @param values   values already sorted ascending
     * @param shares   their shares of the bin, summing to 1 (within rounding)
     * @param n        how many of the arrays' entries to use
     * @param q        the quadrature
     * @param sampling how k_i is taken
     * @param out      receives k_0 … k_{N−1} from {@code outOffset}
     */
    public static void ofSortedWeighted(double[] values, double[] shares, int n, GQuadrature q, KSampling sampling,
                                        double[] out, int outOffset) {
        double total = 0;
        for (int j = 0; j < n; j++) {
            total += shares[j];
        }
        int nq = q.size();
        int j = 0;
        double c = 0; // cumulative share below step j, normalised by total
        for (int i = 0; i < nq; i++) {
            double ga = q.intervalEdge(i);
            double gb = q.intervalEdge(i + 1);
            if (sampling == KSampling.NODE) {
                double g = q.node(i);
                while (j < n - 1 && c + shares[j] / total <= g) {
                    c += shares[j] / total;
                    j++;
                }
                out[outOffset + i] = values[j];
                continue;
            }
            double sum = 0;
            // advance to the step holding ga
            while (j < n - 1 && c + shares[j] / total <= ga) {
                c += shares[j] / total;
                j++;
            }
            int l = j;
            double cl = c;
            while (l < n) {
                double top = l == n - 1 ? 1.0 : cl + shares[l] / total;
                double lo = Math.max(cl, ga);
                double hi = Math.min(top, gb);
                if (hi > lo) {
                    sum += (hi - lo) * values[l];
                }
                if (top >= gb) {
                    break;
                }
                cl = top;
                l++;
            }
            out[outOffset + i] = sum / (gb - ga);
        }
    }

    /** The mean of values [from, to), summed in their (sorted) order: the band-mean σ, cm²/molecule. */
    public static double mean(double[] values, int from, int to) {
        double s = 0;
        for (int j = from; j < to; j++) {
            s += values[j];
        }
        return s / (to - from);
    }

    /**
     * The transmission-equivalent σ at column u: σ_u = −ln(mean_j exp(−σ_j u))/u, the constant σ with the bin's
     * band-mean transmittance at that column. Tends to the mean σ as u → 0 and to the minimum σ as u → ∞.
     */
    public static double transmissionEquivalent(double[] values, int from, int to, double columnCm2) {
        double s = 0;
        for (int j = from; j < to; j++) {
            s += Math.exp(-values[j] * columnCm2);
        }
        double t = s / (to - from);
        if (t == 0) {
            // every exp underflowed: fall back to the smallest σ, the u → ∞ limit
            double min = Double.POSITIVE_INFINITY;
            for (int j = from; j < to; j++) {
                min = Math.min(min, values[j]);
            }
            return min;
        }
        return -Math.log(t) / columnCm2;
    }
}
