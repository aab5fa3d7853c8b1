package org.linewright.grid.calc;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

import org.linewright.ingest.InputException;

/**
 * σ per molecule of an absorbing mixture from the single-molecule cross sections and declared volume mixing
 * ratios (docs/physics.md, "Per molecule of what"):
 * <pre>
 *   σ_mix(ν) = Σ_m x_m σ_m(ν) / Σ_m x_m
 * </pre>
 * normalised by the sum of the declared ratios, so σ_mix is per molecule of the absorbing molecules declared
 * (an absorption coefficient is then κ = n · Σ x_m · σ_mix with n the total number density). The sum runs in the
 * order the molecules were declared, point by point (same bits for the same inputs).
 */
public final class MixtureCrossSection {
    private MixtureCrossSection() {
    }

    /**
     * @param sigmas σ_m per molecule, in the order of {@code vmr}, all of one length
     * @param vmr x_m per molecule (formula → ratio), each positive and finite
     * @return σ_mix
     */
    public static double[] combine(double[][] sigmas, double[] vmr) {
        if (sigmas.length != vmr.length || sigmas.length == 0) {
            throw new IllegalArgumentException("one mixing ratio per cross section expected");
        }
        double total = 0;
        for (double x : vmr) {
            total += x;
        }
        double[] out = new double[sigmas[0].length];
        for (int m = 0; m < sigmas.length; m++) {
            double share = vmr[m] / total;
            double[] s = sigmas[m];
            for (int i = 0; i < out.length; i++) {
                out[i] += share * s[i];
            }
        }
        return out;
    }

    /**
     * Metadata: the normalisation and each species' share x_m / Σ x.
     *
     * @param vmrByFormula declared ratios in declaration order
     */
    public static Map<String, String> metadata(Map<String, Double> vmrByFormula) {
        double total = 0;
        for (double x : vmrByFormula.values()) {
            if (!(x > 0) || Double.isInfinite(x)) {
                throw new InputException("mixing ratio " + x + " (expected a positive number)");
            }
            total += x;
        }
        Map<String, String> m = new LinkedHashMap<>();
        m.put("mixture_normalisation", "sigma per molecule of the declared absorbers: sum_m x_m sigma_m / sum_m x_m");
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<String, Double> e : vmrByFormula.entrySet()) {
            if (sb.length() > 0) {
                sb.append(';');
            }
            sb.append(e.getKey()).append('=').append(String.format(Locale.ROOT, "%.10g", e.getValue() / total));
        }
        m.put("mixture_shares", sb.toString());
        m.put("mixture_vmr_sum", String.format(Locale.ROOT, "%.10g", total));
        return m;
    }
}
