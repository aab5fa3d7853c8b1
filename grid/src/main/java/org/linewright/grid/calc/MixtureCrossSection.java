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
 * (an absorption coefficient is then κ = n · Σ x_m · σ_mix with n the total number density). It is computed as one
 * sum over the lines of every declared molecule, each line's S(T) multiplied by its molecule's share
 * ({@link org.linewright.broadening.intensity.IntensityScaling#withMoleculeShares}), so that the engine's error
 * estimate and the intensity threshold apply to σ_mix itself. This class names the convention in the output.
 */
public final class MixtureCrossSection {
    private MixtureCrossSection() {
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
