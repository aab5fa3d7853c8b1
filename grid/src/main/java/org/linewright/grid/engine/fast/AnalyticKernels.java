package org.linewright.grid.engine.fast;

/**
 * Closed-form pieces of the fast engine's analytic kernel path: the discrete Fourier transform of a sampled,
 * periodised Voigt profile, and the real-space correction kernels that turn it into the truncated profile.
 *
 * <p><b>Transform.</b> With F(f) = ∫V(x)·e^(−2πifx) dx = exp(−π²f²αD²/ln2 − 2πγL|f|) (product of the Gaussian and
 * Lorentzian transforms; Bracewell, "The Fourier Transform and Its Applications", 3rd ed., 2000, ch. 6), the
 * Poisson summation formula gives the DFT of the samples V(n·h) of the profile periodised over P = L·h as
 * K_k = Σ_n V_P(n·h)·e^(−2πikn/L) = (1/h)·Σ_j F((k + j·L)/(L·h)), j ∈ ℤ — a sum of aliases that converges like a
 * Gaussian because αD &gt; 0.
 *
 * <p><b>Wing correction.</b> The exact engine cuts a line at |x| ≤ R (optionally minus the pedestal V(R)); the
 * transform above is that of the untruncated profile plus its images around the ring. For R ≫ αD the Voigt profile
 * beyond R is V = L + (s²/2)·L'' + O(s⁴·L⁗), s² = αD²/(2 ln 2) the Gaussian's variance: the expansion of the
 * convolution L ⊗ G in the Gaussian's moments, which is the large-argument asymptotic series of the Faddeeva
 * function (Abramowitz &amp; Stegun, Handbook of Mathematical Functions, 1964, §7.1, the asymptotic expansion of the
 * complementary error function). So the difference between the
 * untruncated-periodised and the truncated kernel is c_γ + (s²/2)·d_γ with kernels that depend on γL only:
 * c_γ(x) = Σ_m L(x + mP) − [|x| ≤ R]·(L(x) − p·L(R)) and d_γ the same with L'' (p = 1 with pedestal removal).
 * The periodic image sum has the closed form (the partial-fraction expansion of the cotangent, Σ_m 1/(z + mP) =
 * (π/P)·cot(πz/P), Abramowitz &amp; Stegun §4.3, taken at z = x − iγ) S_P(x) = (1/P)·sinh ε / (cosh ε − cos θ), ε = 2πγ/P, θ = 2πx/P,
 * evaluated as sinh ε / (P·(2 sinh²(ε/2) + 2 sin²(θ/2))) to avoid the cancellation of cosh ε − cos θ when both
 * are near 1; S_P'' is its second derivative in x (below). The neglected remainder, the s⁴ term, is bounded by
 * {@link #wingModelError}.
 */
final class AnalyticKernels {

    /** ln 2, for the Gaussian's HWHM-to-variance conversion s² = αD²/(2 ln 2). */
    private static final double LN2 = Math.log(2.0);
    /** Run length between exact re-seeds of the power W^i: its relative error grows about as i·2⁻⁵³. */
    private static final int RESEED = 256;
    /** Alias sum stopped once its remaining tail, relative to F(0) = 1, is below this bound. */
    static final double ALIAS_TAIL = 1e-18;
    /** Most periods of aliases summed before the closed form is given up for the sampled kernel. */
    static final int MAX_PERIODS = 16;

    private AnalyticKernels() {
    }

    /**
     * The DFT of the samples of the Voigt profile periodised over L·h, K_k = (1/h)·Σ_j F((k + jL)/(L·h)),
     * k = 0 … L/2 (the transform is real and even), F(f) = exp(−π²f²αD²/ln2 − 2πγL|f|). The terms are summed in
     * order of n = |k + jL| in runs of {@value #RESEED}: with E(n) = e^(−a·n² − b·n), term n₀ + i is
     * E(n₀)·e^(−a·i²)·W^i, W = e^(−2a·n₀ − b) (one table of e^(−a·i²) per call, two {@link Math#exp} per run),
     * until the geometric bound E(n)/(1 − E(n+1)/E(n)) of the rest is below {@link #ALIAS_TAIL}. Relative accuracy about 10⁻¹³ per term.
     *
     * @param dopplerCm1 αD &gt; 0
     * @param lorentzCm1 γL ≥ 0
     * @param stepCm1    sample step h
     * @param length     L, even
     * @param out        receives K_0 … K_{L/2} at indices 0 … L/2
     * @return the bound of the neglected alias tail relative to F(0), or −1 when the sum did not converge within
     *         {@value #MAX_PERIODS} periods (then {@code out} is not valid)
     */
    static double voigtTransform(double dopplerCm1, double lorentzCm1, double stepCm1, int length, double[] out) {
        int half = length / 2;
        java.util.Arrays.fill(out, 0, half + 1, 0.0);
        double df = 1.0 / (length * stepCm1);
        // exponent of term n (frequency n·Δf): −a·n² − b·n
        double a = Math.PI * Math.PI * dopplerCm1 * dopplerCm1 * df * df / LN2;
        double b = 2 * Math.PI * lorentzCm1 * df;
        // term n0 + i = E(n0)·e^(−a·i²)·W^i, W = e^(−2a·n0 − b): the table and W^i keep the rounding error
        // growing only linearly in i (a plain two-term recurrence grows it as i²)
        double[] square = new double[RESEED];
        for (int i = 0; i < RESEED; i++) {
            square[i] = Math.exp(-a * i * (double) i);
        }
        long limit = (long) MAX_PERIODS * length;
        int r = 0;
        double tail = -1;
        for (long n0 = 0; n0 < limit; n0 += RESEED) {
            double x = (double) n0;
            double e = Math.exp(-a * x * x - b * x);
            double ratio = Math.exp(-a * (2 * x + 1) - b);
            // the terms decrease, each ratio smaller than the one before: the rest is below e/(1 − ratio)
            double rest = ratio < 1 ? e / (1 - ratio) : Double.POSITIVE_INFINITY;
            if (rest <= ALIAS_TAIL) {
                tail = rest;
                break;
            }
            double w = Math.exp(-2 * a * x - b);
            double power = e;
            for (int i = 0; i < RESEED; i++) {
                // fold frequency index n onto 0 … L/2: aliases at n = k + jL and n = jL − k; for k = 0 and
                // k = L/2 both families meet at the same n, which therefore counts twice (n = 0 is fixed below)
                double term = power * square[i];
                if (r == 0 || r == half) {
                    out[r] += 2 * term;
                } else {
                    out[r < half ? r : length - r] += term;
                }
                power *= w;
                if (++r == length) {
                    r = 0;
                }
            }
        }
        if (tail < 0) {
            return -1;
        }
        // n = 0 (the term E(0) = 1) is its own only alias
        out[0] -= 1.0;
        double scale = 1.0 / stepCm1;
        for (int k = 0; k <= half; k++) {
            out[k] *= scale;
        }
        return tail;
    }

    /**
     * sin²(π·n/L) for n = 0 … L/2: the table behind the periodic sums at the sample points x = n·h.
     *
     * @param length L
     * @return the table, length L/2 + 1
     */
    static double[] sinSquaredTable(int length) {
        double[] t = new double[length / 2 + 1];
        for (int n = 0; n < t.length; n++) {
            double s = Math.sin(Math.PI * n / length);
            t[n] = s * s;
        }
        return t;
    }

    /**
     * The periodic Lorentz sum S_P(x) = Σ_m L(x + m·P; γ) = (1/P)·sinh ε / (cosh ε − cos θ), ε = 2πγ/P, θ = 2πx/P,
     * L(x; γ) = γ/(π(x² + γ²)).
     *
     * @param sinSquaredHalfTheta sin²(θ/2) = sin²(πx/P)
     * @param lorentzCm1          γ &gt; 0
     * @param periodCm1           P
     * @return S_P(x) in cm (per cm⁻¹)
     */
    static double periodicLorentz(double sinSquaredHalfTheta, double lorentzCm1, double periodCm1) {
        double eps = 2 * Math.PI * lorentzCm1 / periodCm1;
        double sh = Math.sinh(0.5 * eps);
        // cosh ε − cos θ = 2 sinh²(ε/2) + 2 sin²(θ/2), free of cancellation near ε = θ = 0
        return Math.sinh(eps) / (periodCm1 * (2 * sh * sh + 2 * sinSquaredHalfTheta));
    }

    /**
     * The second derivative in x of {@link #periodicLorentz}, Σ_m L''(x + m·P; γ):
     * S_P'' = −(2π/P)²·(sinh ε / P)·(cos θ·D − 2 sin²θ)/D³, D = cosh ε − cos θ.
     *
     * @param sinSquaredHalfTheta sin²(θ/2)
     * @param lorentzCm1          γ &gt; 0
     * @param periodCm1           P
     * @return S_P''(x) in cm³
     */
    static double periodicLorentzSecondDerivative(double sinSquaredHalfTheta, double lorentzCm1, double periodCm1) {
        double eps = 2 * Math.PI * lorentzCm1 / periodCm1;
        double sh = Math.sinh(0.5 * eps);
        double d = 2 * sh * sh + 2 * sinSquaredHalfTheta;
        double cos = 1 - 2 * sinSquaredHalfTheta;
        double sin2 = 4 * sinSquaredHalfTheta * (1 - sinSquaredHalfTheta);
        double w = 2 * Math.PI / periodCm1;
        return -w * w * Math.sinh(eps) / periodCm1 * (cos * d - 2 * sin2) / (d * d * d);
    }

    /** L(x; γ) = γ/(π(x² + γ²)). */
    static double lorentz(double xCm1, double lorentzCm1) {
        return lorentzCm1 / (Math.PI * (xCm1 * xCm1 + lorentzCm1 * lorentzCm1));
    }

    /** L''(x; γ) = (2γ/π)·(3x² − γ²)/(x² + γ²)³. */
    static double lorentzSecondDerivative(double xCm1, double lorentzCm1) {
        double r2 = xCm1 * xCm1 + lorentzCm1 * lorentzCm1;
        return 2 * lorentzCm1 / Math.PI * (3 * xCm1 * xCm1 - lorentzCm1 * lorentzCm1) / (r2 * r2 * r2);
    }

    /**
     * Fills one of the two correction kernels of Lorentz width γ on the ring of L samples h apart, laid out
     * circularly (n at index n, −n at L − n): c(x) = S_P(x) − [|x| ≤ R]·(L(x) − p·L(R)) and
     * d(x) = S_P''(x) − [|x| ≤ R]·(L''(x) − p·L''(R)), with |x| ≤ R decided on the offsets r·h exactly as the
     * sampled kernel decides it; inside R from {@link #imagesOnly}, free of cancellation.
     *
     * @param lorentzCm1     γ &gt; 0
     * @param offsetsCm1     r·h for r = 0 … at least the last offset within R
     * @param cutoffCm1      R, below P/2
     * @param removePedestal p
     * @param stepCm1        h
     * @param sinSquared     {@link #sinSquaredTable} for L
     * @param second         false for c, true for d
     * @param out            receives the kernel, length L
     */
    static void correctionKernel(double lorentzCm1, double[] offsetsCm1, double cutoffCm1, boolean removePedestal,
                                 double stepCm1, double[] sinSquared, boolean second, double[] out) {
        int length = out.length;
        int half = length / 2;
        double period = length * stepCm1;
        // the closed forms of periodicLorentz and its second derivative with their γ-only factors taken out of
        // the loop (two sinh per kernel, not per point)
        double eps = 2 * Math.PI * lorentzCm1 / period;
        double sh = Math.sinh(0.5 * eps);
        double floor = 2 * sh * sh;
        double numerator = Math.sinh(eps) / period;
        double w = 2 * Math.PI / period;
        double curvatureFactor = -w * w * numerator;
        for (int n = 0; n <= half; n++) {
            double q = sinSquared[n];
            double d = floor + 2 * q;
            double v;
            if (second) {
                v = curvatureFactor * ((1 - 2 * q) * d - 8 * q * (1 - q)) / (d * d * d);
            } else {
                v = numerator / d;
            }
            out[n] = v;
            if (n > 0 && n < half) {
                out[length - n] = v;
            }
        }
        double pedestal = !removePedestal ? 0.0
                : (second ? lorentzSecondDerivative(cutoffCm1, lorentzCm1) : lorentz(cutoffCm1, lorentzCm1));
        int terms = seriesTerms(cutoffCm1, lorentzCm1, period);
        for (int r = 0; r < offsetsCm1.length && offsetsCm1[r] <= cutoffCm1; r++) {
            // inside the cutoff the kernel is the images' sum alone (S_P − L, S_P'' − L''), taken from the Laurent
            // series so that it does not cancel against L (L''(0) = −2/(πγ³) is huge for small γ) ...
            double v = imagesOnly(offsetsCm1[r], lorentzCm1, period, sinSquared[r], second, terms) + pedestal;
            out[r] = v;
            if (r > 0) {
                out[length - r] = v;
            }
        }
    }

    /** ζ(2k), k = 1 … {@value #SERIES_TERMS}, for the Laurent series of cot w − 1/w. */
    private static final int SERIES_TERMS = 30;
    private static final double[] ZETA_EVEN = zetaEven();

    private static double[] zetaEven() {
        double[] z = new double[SERIES_TERMS + 1];
        z[1] = Math.PI * Math.PI / 6;
        for (int k = 2; k <= SERIES_TERMS; k++) {
            // Σ n^(−2k), n ≤ 1000, plus the integral of the rest (below 10⁻¹⁸ of the sum from k = 2 on)
            double sum = 0;
            for (int n = 1000; n >= 1; n--) {
                sum += Math.pow(n, -2.0 * k);
            }
            z[k] = sum + Math.pow(1000.5, 1 - 2.0 * k) / (2 * k - 1);
        }
        return z;
    }

    /**
     * The images' part of the periodic sums at x ∈ [0, P/2): Σ_{m≠0} L(x + mP) = S_P − L, or the same of L''. With
     * w = π(x − iγ)/P, Σ_m 1/(z + mP) = (π/P)·cot(πz/P) (the partial-fraction expansion of the cotangent), so
     * S_P − L = (1/P)·Im g(w) and S_P'' − L'' = (1/P)(π/P)²·Im g''(w), g(w) = cot w − 1/w =
     * −(2/π)·Σ_k ζ(2k)·(w/π)^(2k−1) (the cotangent's power series, Abramowitz &amp; Stegun §4.3, with its Bernoulli
     * numbers written as ζ(2k), §23.2), summed for |w| ≤ 1 (terms falling by
     * |w/π|² ≤ 0.1); for larger |w| the closed forms minus L lose at most a few bits.
     */
    static double imagesOnly(double xCm1, double lorentzCm1, double periodCm1, double sinSquaredHalfTheta,
                             boolean second) {
        return imagesOnly(xCm1, lorentzCm1, periodCm1, sinSquaredHalfTheta, second, SERIES_TERMS);
    }

    /**
     * Terms of the series in {@link #imagesOnly} enough for every |x| ≤ R: the k-th term is below |t|^(2k)·ζ(2k)·4k²
     * with |t|² ≤ (R² + γ²)/P², so terms stop once |t|^(2k) ≤ 10⁻²⁰.
     */
    static int seriesTerms(double cutoffCm1, double lorentzCm1, double periodCm1) {
        double t2 = (cutoffCm1 * cutoffCm1 + lorentzCm1 * lorentzCm1) / (periodCm1 * periodCm1);
        if (!(t2 > 0) || Math.PI * Math.PI * t2 > 1) {
            return SERIES_TERMS;
        }
        int k = (int) Math.ceil(-20 / Math.log10(t2)) + 2;
        return Math.max(3, Math.min(SERIES_TERMS, k));
    }

    /** {@link #imagesOnly} with the series cut after {@code terms} terms. */
    private static double imagesOnly(double xCm1, double lorentzCm1, double periodCm1, double sinSquaredHalfTheta,
                                     boolean second, int terms) {
        double tr = xCm1 / periodCm1;
        double ti = -lorentzCm1 / periodCm1;
        // t = w/π = (x − iγ)/P
        if (Math.PI * Math.hypot(tr, ti) > 1) {
            return second ? periodicLorentzSecondDerivative(sinSquaredHalfTheta, lorentzCm1, periodCm1)
                    - lorentzSecondDerivative(xCm1, lorentzCm1)
                    : periodicLorentz(sinSquaredHalfTheta, lorentzCm1, periodCm1) - lorentz(xCm1, lorentzCm1);
        }
        double t2r = tr * tr - ti * ti;
        double t2i = 2 * tr * ti;
        // Horner in t²: Σ a_k (t²)^j with a = ζ(2k) (g) or ζ(2k)(2k−1)(2k−2) from k = 2 (g'')
        double sr = 0;
        double si = 0;
        for (int k = terms; k >= (second ? 2 : 1); k--) {
            double a = second ? ZETA_EVEN[k] * (2 * k - 1) * (2 * k - 2) : ZETA_EVEN[k];
            double nr = sr * t2r - si * t2i + a;
            si = sr * t2i + si * t2r;
            sr = nr;
        }
        // multiply by t, take the imaginary part
        double im = sr * ti + si * tr;
        if (second) {
            // g''(w) = −(2/π³)·t·Σ ζ(2k)(2k−1)(2k−2)·(t²)^(k−2); times (1/P)(π/P)²
            return -2 / Math.PI * im / (periodCm1 * periodCm1 * periodCm1);
        }
        // g(w) = −(2/π)·t·Σ ζ(2k)·(t²)^(k−1); times 1/P
        return -2 / Math.PI * im / periodCm1;
    }

    /** @return the Gaussian variance s² = αD²/(2 ln 2) of a Doppler HWHM, cm⁻² */
    static double dopplerVariance(double dopplerCm1) {
        return dopplerCm1 * dopplerCm1 / (2 * LN2);
    }

    /**
     * Bound of the relative error of the wing model V ≈ L + (s²/2)·L'' for |x| ≥ R: the next term of the series,
     * (s⁴/8)·L⁗, with |L⁗|/L ≤ 120/(x² + γ²)², i.e. 15·s⁴/R⁴, doubled as a margin for the terms after it (each
     * smaller by about 7s²/R²). It is relative to the line's own profile inside the cutoff (where the pedestal and
     * the images are modelled) and to its value at R outside (the remnant of the removed wings).
     *
     * @param dopplerCm1 the largest αD of the lines on the analytic path
     * @param cutoffCm1  R
     * @return the bound, dimensionless
     */
    static double wingModelError(double dopplerCm1, double cutoffCm1) {
        double s2 = dopplerVariance(dopplerCm1);
        double ratio = s2 / (cutoffCm1 * cutoffCm1);
        return 2 * 15 * ratio * ratio;
    }
}
