package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Sub-Lorentzian χ factor for the far wings of CO2 lines broadened by CO2, the empirical piecewise-exponential
 * form of M.Y. Perrin and J.M. Hartmann, "Temperature-dependent measurements and modeling of absorption by
 * CO2-N2 mixtures in the far line-wings of the 4.3 μm CO2 band", JQSRT 42 (1989) 311:
 * <pre>
 *   χ(Δν, T) = 1                                                      |Δν| ≤ σ1
 *            = exp(−B1(|Δν| − σ1))                                    σ1 &lt; |Δν| ≤ σ2
 *            = exp(−B1(σ2 − σ1) − B2(|Δν| − σ2))                      σ2 &lt; |Δν| ≤ σ3
 *            = exp(−B1(σ2 − σ1) − B2(σ3 − σ2) − B3(|Δν| − σ3))        |Δν| &gt; σ3
 *   B_i(T) = α_i + β_i·exp(−ε_i·T)
 * </pre>
 * with σ1 = 3, σ2 = 30, σ3 = 120 cm⁻¹ and (α, β, ε) = (0.0888, −0.160, 0.0041), (0, 0.0526, 0.00152),
 * (0.0232, 0, 0) — B in cm⁻¹, ε in K⁻¹. <b>These coefficients are transcribed from memory</b>, not from the
 * paper at hand; they should be checked against the published table before scientific use. The fit was made
 * to measurements at roughly 200–300 K (from memory); outside that range the factor is an extrapolation.
 * χ is continuous, equals 1 near the line and decreases monotonically in the wing.
 *
 * <p>An instance holds the B coefficients for one temperature; it is immutable and thread-safe.
 */
public final class PerrinHartmannChi {

    /** σ1: start of the sub-Lorentzian region, cm⁻¹. */
    public static final double SIGMA1_CM1 = 3.0;
    /** σ2: start of the second exponential region, cm⁻¹. */
    public static final double SIGMA2_CM1 = 30.0;
    /** σ3: start of the third exponential region, cm⁻¹. */
    public static final double SIGMA3_CM1 = 120.0;

    // B_i(T) = α_i + β_i·exp(−ε_i·T); α, β in cm⁻¹, ε in K⁻¹ (from memory, see class comment)
    private static final double ALPHA1_CM1 = 0.0888;
    private static final double BETA1_CM1 = -0.160;
    private static final double EPSILON1_PER_K = 0.0041;
    private static final double ALPHA2_CM1 = 0.0;
    private static final double BETA2_CM1 = 0.0526;
    private static final double EPSILON2_PER_K = 0.00152;
    private static final double ALPHA3_CM1 = 0.0232;
    private static final double BETA3_CM1 = 0.0;
    private static final double EPSILON3_PER_K = 0.0;

    /**
     * Temperatures of the measurements the coefficients were fitted to, K (about 200–300 K, from memory, see the
     * class comment): the cross-section calculator applies χ only inside [{@value #VALID_MIN_TEMPERATURE_K},
     * {@value #VALID_MAX_TEMPERATURE_K}] and warns outside.
     */
    public static final double VALID_MIN_TEMPERATURE_K = 200.0;
    /** Upper end of the temperature range of validity, K (see {@link #VALID_MIN_TEMPERATURE_K}). */
    public static final double VALID_MAX_TEMPERATURE_K = 300.0;
    /**
     * Line centres of the 4.3 μm band (ν3 at 2349 cm⁻¹, from memory) whose far wing the fit describes, cm⁻¹:
     * χ is applied only to CO2 lines centred in [{@value #VALID_MIN_CENTRE_CM1}, {@value #VALID_MAX_CENTRE_CM1}].
     */
    public static final double VALID_MIN_CENTRE_CM1 = 2200.0;
    /** Upper end of the line-centre range of validity, cm⁻¹ (see {@link #VALID_MIN_CENTRE_CM1}). */
    public static final double VALID_MAX_CENTRE_CM1 = 2450.0;

    /**
     * Whether the fit applies at this temperature and line centre (the ranges above).
     *
     * @param temperatureK T in K
     * @param centreCm1    line centre in cm⁻¹
     * @return whether χ may be applied
     */
    public static boolean validFor(double temperatureK, double centreCm1) {
        return temperatureK >= VALID_MIN_TEMPERATURE_K && temperatureK <= VALID_MAX_TEMPERATURE_K
                && centreCm1 >= VALID_MIN_CENTRE_CM1 && centreCm1 <= VALID_MAX_CENTRE_CM1;
    }

    private final double temperatureK;
    private final double b1PerCm1;
    private final double b2PerCm1;
    private final double b3PerCm1;
    /** Exponent accumulated over [σ1, σ2]. */
    private final double exponentAtSigma2;
    /** Exponent accumulated over [σ1, σ3]. */
    private final double exponentAtSigma3;

    /**
     * @param temperatureK gas temperature in K, positive and finite
     */
    public PerrinHartmannChi(double temperatureK) {
        Checks.positiveFinite(temperatureK, "temperature (K)");
        this.temperatureK = temperatureK;
        this.b1PerCm1 = ALPHA1_CM1 + BETA1_CM1 * Math.exp(-EPSILON1_PER_K * temperatureK);
        this.b2PerCm1 = ALPHA2_CM1 + BETA2_CM1 * Math.exp(-EPSILON2_PER_K * temperatureK);
        this.b3PerCm1 = ALPHA3_CM1 + BETA3_CM1 * Math.exp(-EPSILON3_PER_K * temperatureK);
        this.exponentAtSigma2 = b1PerCm1 * (SIGMA2_CM1 - SIGMA1_CM1);
        this.exponentAtSigma3 = exponentAtSigma2 + b2PerCm1 * (SIGMA3_CM1 - SIGMA2_CM1);
    }

    /**
     * χ at a detuning (symmetric in Δν).
     *
     * @param detuningCm1 ν − ν₀ in cm⁻¹
     * @return χ in (0, 1]
     */
    public double factor(double detuningCm1) {
        double d = Math.abs(detuningCm1);
        if (d <= SIGMA1_CM1) {
            return 1.0;
        }
        if (d <= SIGMA2_CM1) {
            return Math.exp(-b1PerCm1 * (d - SIGMA1_CM1));
        }
        if (d <= SIGMA3_CM1) {
            return Math.exp(-exponentAtSigma2 - b2PerCm1 * (d - SIGMA2_CM1));
        }
        return Math.exp(-exponentAtSigma3 - b3PerCm1 * (d - SIGMA3_CM1));
    }

    /** @return the temperature in K */
    public double temperatureK() {
        return temperatureK;
    }

    /** @return B1(T) in cm⁻¹ */
    public double b1PerCm1() {
        return b1PerCm1;
    }

    /** @return B2(T) in cm⁻¹ */
    public double b2PerCm1() {
        return b2PerCm1;
    }

    /** @return B3(T) in cm⁻¹ */
    public double b3PerCm1() {
        return b3PerCm1;
    }

    /** @return metadata for output files */
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("wing.chi.form", "Perrin-Hartmann 1989 (JQSRT 42, 311), CO2-CO2");
        m.put("wing.chi.temperature_K", Double.toString(temperatureK));
        m.put("wing.chi.sigma_cm1", SIGMA1_CM1 + "," + SIGMA2_CM1 + "," + SIGMA3_CM1);
        m.put("wing.chi.B_per_cm1", b1PerCm1 + "," + b2PerCm1 + "," + b3PerCm1);
        m.put("wing.chi.weighting", "applied to the CO2-broadened share w of each CO2 line's Lorentz width: "
                + "phi = (1-w) phi_Lorentz-wing + w chi phi (binary-collision additivity)");
        m.put("wing.chi.validity", "T " + VALID_MIN_TEMPERATURE_K + ".." + VALID_MAX_TEMPERATURE_K
                + " K, line centres " + VALID_MIN_CENTRE_CM1 + ".." + VALID_MAX_CENTRE_CM1
                + " cm-1 (from memory); not applied outside");
        return m;
    }
}
