package org.linewright.broadening.voigt;

/**
 * The Faddeeva function w(z) = e^(−z²)·erfc(−iz) for z = x + iy, with its real part, the Voigt function
 * K(x, y) = Re w, and its imaginary part L(x, y) = Im w; also the scaled complementary error function
 * erfcx(y) = e^(y²)·erfc(y).
 *
 * <p>For y ≥ 0, w(z) = (i/π)·∫ e^(−t²)/(z − t) dt over the real line, so that K(x, y) = (y/π)·∫ e^(−t²)/((x − t)² + y²) dt
 * is the convolution of a Gaussian and a Lorentzian. K is even in x and L is odd in x. For y &lt; 0 the
 * reflection w(z) = 2·e^(−z²) − w(−z) is used.
 *
 * <p>Three regions, chosen by |z| for y ≥ 0:
 * <ul>
 *   <li>|z| &lt; 8: the series of M.R. Zaghloul and A.N. Ali, "Algorithm 916: computing the Faddeyeva and Voigt
 *       functions", ACM Trans. Math. Softw. 38 (2011) 15, with the step a = π/√(−ln(ε/2)) for double precision,
 *       the Gaussian sums taken only over the window of significant terms (e^(−u²) &gt; e^(−42)), their
 *       exponentials by a table-driven two-term recurrence (two calls of exp per sum), and erfcx(y) from this
 *       class.
 *       The series keeps its relative accuracy in K even where K is tiny (small y, moderate x), because the
 *       terms that carry y are all positive.</li>
 *   <li>8 ≤ |z| &lt; 4000: the Laplace continued fraction w(z) = (i/√π)/(z − ½/(z − 1/(z − (3/2)/(z − …)))),
 *       truncated after 2 to 12 levels depending on |z| (fewer far out), plus the exponentially small term
 *       e^(−z²) near the real axis (y &lt; 1), which the truncated fraction cannot represent. Evaluated from the
 *       tail, the imaginary parts of all partial denominators add with the same sign, so K keeps its relative
 *       accuracy for arbitrarily small y.</li>
 *   <li>|z| ≥ 4000: the one-level fraction w ≈ (i/√π)·z/(z² − ½) (the first region of J. Humlíček, "Optimized
 *       computation of the Voigt and complex probability functions", JQSRT 27 (1982) 437), written in closed
 *       real form K = y(s + ½)/(√π·D), L = x(s − ½)/(√π·D), s = x² + y², D = s² − x² + y² + ¼; its relative
 *       error in K is about 2.5/|z|⁴.</li>
 * </ul>
 *
 * <p>Accuracy (checked against an independent arbitrary-precision evaluation and SciPy's {@code wofz}, see the
 * tests): relative error in K below 1×10⁻¹³ over x ∈ [−10⁶, 10⁶], y ∈ [0, 10⁴]; the error in L is below
 * 1×10⁻¹³ relative to |w|. All methods are static, allocation-free and thread-safe.
 */
public final class Faddeeva {

    /** √π. */
    static final double SQRT_PI = 1.7724538509055160273;
    /** 1/√π. */
    static final double INV_SQRT_PI = 0.56418958354775628695;
    /** 2/√π. */
    private static final double TWO_OVER_SQRT_PI = 1.1283791670955125739;

    /** Step a = π/√(−ln(ε/2)) of the Zaghloul–Ali series for double precision (ε = 2⁻⁵²). */
    private static final double ZA_STEP = 0.518321480430085929872;
    /** a². */
    private static final double ZA_STEP_SQUARED = ZA_STEP * ZA_STEP;
    /** c = 2a/π, the common factor of the Zaghloul–Ali sums. */
    private static final double ZA_FACTOR = 2.0 * ZA_STEP / Math.PI;
    /** Gaussian terms e^(−u²) with u² above this (e^(−42) ≈ 6e-19) are below double resolution of the sums. */
    private static final double NEGLIGIBLE_EXPONENT = 42.0;
    /** √NEGLIGIBLE_EXPONENT: half-width, in units of x, of the window of significant Gaussian terms. */
    private static final double NEGLIGIBLE_DISTANCE = Math.sqrt(NEGLIGIBLE_EXPONENT);

    /** Number of entries of the per-line table of {@link #zaghloulAliReciprocals}: n = 0 .. the largest n used. */
    static final int ZA_TABLE_LENGTH = (int) Math.ceil((8.0 + NEGLIGIBLE_DISTANCE) / ZA_STEP) + 2;
    /** e^(−a²n²) for n = 0.. while a²n² is below the negligible exponent. */
    private static final double[] EXP_MINUS_A2N2;
    /** e^(−2a²k) for k = 0 .. (largest number of terms in a Zaghloul–Ali window). */
    private static final double[] EXP_MINUS_2A2K;

    static {
        int n1 = (int) Math.ceil(NEGLIGIBLE_DISTANCE / ZA_STEP);
        EXP_MINUS_A2N2 = new double[n1];
        for (int n = 0; n < n1; n++) {
            EXP_MINUS_A2N2[n] = Math.exp(-ZA_STEP_SQUARED * n * n);
        }
        // window of Σ₃ spans 2·√42/a + 2 terms; |z| < 8 adds nothing to its length
        int window = (int) Math.ceil(2 * NEGLIGIBLE_DISTANCE / ZA_STEP) + 3;
        EXP_MINUS_2A2K = new double[window];
        for (int k = 0; k < window; k++) {
            EXP_MINUS_2A2K[k] = Math.exp(-2.0 * ZA_STEP_SQUARED * k);
        }
    }

    /** Anchor point of erfcx below which the erf series or the anchored series is used. */
    private static final double ANCHOR_Y = 2.0;
    /** From here up to the anchor, the anchored Taylor series replaces the erf series. */
    private static final double SERIES_TO_ANCHOR_Y = 1.25;
    /** erfcx(2), from the 60-level continued fraction (relative error ~1e-16). */
    private static final double ERFCX_AT_ANCHOR = erfcxNonNegative(ANCHOR_Y);

    /** |z|² below which the Zaghloul–Ali series is used (|z| &lt; 8). */
    static final double SERIES_RADIUS_SQUARED = 64.0;
    /** |z|² from which the one-level closed form is used (|z| ≥ 4000; relative error ≤ 1e-14). */
    static final double ONE_LEVEL_RADIUS_SQUARED = 4000.0 * 4000.0;
    /** |z|² above which even the one-level form is replaced by its leading term to avoid overflow of s². */
    private static final double LEADING_TERM_RADIUS_SQUARED = 1e16;
    /**
     * x² − y² above which e^(−z²) underflows (e^(−745) is the smallest subnormal), so it need not be added in the
     * continued-fraction region.
     */
    private static final double EXP_UNDERFLOW_ARGUMENT = 745.0;

    private Faddeeva() {
    }

    /**
     * The Voigt function K(x, y) = Re w(x + iy) = (y/π)·∫ e^(−t²)/((x − t)² + y²) dt for y ≥ 0; for y &lt; 0 the real
     * part of the analytic continuation w(z) = 2e^(−z²) − w(−z).
     * K(x, 0) = e^(−x²) (Gaussian limit); K(x, y) → y/(√π·(x² + y²)) for |z| → ∞ (Lorentzian limit).
     * Methods and accuracy as in the class description (relative error below 1×10⁻¹³ for y ≥ 0).
     *
     * @param x real part of z (any sign)
     * @param y imaginary part of z
     * @return K(x, y)
     */
    public static double voigtK(double x, double y) {
        if (y < 0) {
            return reflectedRe(x, y);
        }
        double ax = Math.abs(x);
        double s = ax * ax + y * y;
        if (s >= ONE_LEVEL_RADIUS_SQUARED) {
            return farWingK(ax, y);
        }
        if (s >= SERIES_RADIUS_SQUARED) {
            double re = continuedFraction(ax, y, s, true);
            return y < 1.0 ? re + realAxisExponentialRe(ax, y) : re;
        }
        return zaghloulAli(ax, y, true);
    }

    /**
     * The imaginary part L(x, y) = Im w(x + iy) = (1/π)·∫ e^(−t²)·(x − t)/((x − t)² + y²) dt for y ≥ 0 (odd in x);
     * L(x, 0) = (2/√π)·F(x) with F Dawson's integral; L → x/(√π·(x² + y²)) for |z| → ∞. For y &lt; 0 the
     * imaginary part of the analytic continuation. Error below 1×10⁻¹³ relative to |w| for y ≥ 0.
     *
     * @param x real part of z
     * @param y imaginary part of z
     * @return L(x, y)
     */
    public static double voigtL(double x, double y) {
        if (y < 0) {
            return reflectedIm(x, y);
        }
        double ax = Math.abs(x);
        double s = ax * ax + y * y;
        double im;
        if (s >= ONE_LEVEL_RADIUS_SQUARED) {
            im = farWingL(ax, y);
        } else if (s >= SERIES_RADIUS_SQUARED) {
            im = continuedFraction(ax, y, s, false);
            if (y < 1.0) {
                im += realAxisExponentialIm(ax, y);
            }
        } else {
            im = zaghloulAli(ax, y, false);
        }
        return x < 0 ? -im : im;
    }

    /**
     * The Faddeeva function w(z) = e^(−z²)·erfc(−iz), written into {@code out[offset]} (real part K) and
     * {@code out[offset + 1]} (imaginary part L). Same methods and accuracy as {@link #voigtK} and {@link #voigtL};
     * for y &lt; 0 the reflection w(z) = 2e^(−z²) − w(−z), which may overflow for large |y|.
     *
     * @param x      real part of z
     * @param y      imaginary part of z
     * @param out    receives Re w and Im w
     * @param offset index of Re w in {@code out}
     */
    public static void w(double x, double y, double[] out, int offset) {
        out[offset] = voigtK(x, y);
        out[offset + 1] = voigtL(x, y);
    }

    /**
     * Scaled complementary error function erfcx(y) = e^(y²)·erfc(y) = w(iy) for real y.
     * For 0 ≤ y &lt; 1.25 it is e^(y²) − (2/√π)·Σ y(2y²)ⁿ/(2n+1)!! (the all-positive series of erf, Abramowitz
     * and Stegun 7.1.6); for 1.25 ≤ y &lt; 2 erfc(2) plus the Taylor series of ∫_y^2 e^(−t²) dt (see
     * erfcxBelowAnchor); for y ≥ 2 the Laplace continued fraction erfcx(y) = (1/√π)/(y + ½/(y + 1/(y + (3/2)/(y + …))))
     * (Abramowitz and Stegun 7.1.14) with 60 levels at y = 2 down to 1 level for y ≥ 10⁴; for y &lt; 0,
     * erfcx(y) = 2e^(y²) − erfcx(−y), which overflows below y ≈ −26.6. Relative error below 1×10⁻¹⁴ for y ≥ 0.
     *
     * @param y real argument
     * @return e^(y²)·erfc(y)
     */
    public static double erfcx(double y) {
        if (y < 0) {
            return 2.0 * Math.exp(y * y) - erfcxNonNegative(-y);
        }
        return erfcxNonNegative(y);
    }

    private static double erfcxNonNegative(double y) {
        if (y >= SERIES_TO_ANCHOR_Y && y < ANCHOR_Y) {
            return erfcxBelowAnchor(y);
        }
        if (y < ANCHOR_Y) {
            // erf(y)·e^(y²) = (2/√π)·Σ y(2y²)ⁿ/(2n+1)!!: positive terms, so the only cancellation is the final
            // difference, which costs at most two digits at y = 2.
            double twoY2 = 2.0 * y * y;
            double term = y;
            double sum = y;
            for (int n = 1; term > 1e-17 * sum; n++) {
                term *= twoY2 / (2 * n + 1);
                sum += term;
            }
            return Math.exp(y * y) - TWO_OVER_SQRT_PI * sum;
        }
        int levels;
        if (y < 2.5) {
            levels = 60;
        } else if (y < 3.0) {
            levels = 40;
        } else if (y < 4.0) {
            levels = 30;
        } else if (y < 8.0) {
            levels = 20;
        } else if (y < 40.0) {
            levels = 10;
        } else if (y < 1e4) {
            levels = 4;
        } else {
            levels = 1;
        }
        double tail = 0.0;
        for (int k = levels; k >= 1; k--) {
            tail = 0.5 * k / (y + tail);
        }
        return INV_SQRT_PI / (y + tail);
    }

    /**
     * erfcx(y) for 1.25 ≤ y &lt; 2 from the anchor erfcx(2) without cancellation:
     * erfcx(y) = e^(y²−4)·(erfcx(2) + (2/√π)·I), I = ∫_y^2 e^(4−t²) dt = Σ_k H_k(2)·|h|^(k+1)/(k+1)!, h = y − 2,
     * the Taylor series of e^(4−t²) = e^(−4s−s²) about t = 2 (derivatives (−1)^k H_k(2), Hermite polynomials by
     * their three-term recurrence). Both parts are positive, so no digits are lost (the erf series loses up to
     * two near y = 2).
     */
    private static double erfcxBelowAnchor(double y) {
        double h = ANCHOR_Y - y;
        double hermitePrevious = 1.0;              // H_0(2)
        double hermite = 2.0 * ANCHOR_Y;           // H_1(2)
        double power = h;                          // |h|^(k+1)/(k+1)! for k = 0
        double integral = power;                   // k = 0 term, H_0 = 1
        // fixed length: for |h| ≤ 0.75 the terms fall below 1e-21 by k = 36 (H_k(2) may be near zero for some k,
        // so a size test on one term could stop early)
        for (int k = 1; k < 40; k++) {
            power *= h / (k + 1);
            integral += hermite * power;
            double next = 2.0 * ANCHOR_Y * hermite - 2.0 * k * hermitePrevious;
            hermitePrevious = hermite;
            hermite = next;
        }
        return Math.exp(y * y - ANCHOR_Y * ANCHOR_Y) * (ERFCX_AT_ANCHOR + TWO_OVER_SQRT_PI * integral);
    }

    /**
     * One-level continued fraction in closed form, K part (see class description); x ≥ 0, y ≥ 0, used for large |z|.
     * Relative error about 2.5/|z|⁴.
     */
    static double farWingK(double x, double y) {
        double x2 = x * x;
        double y2 = y * y;
        double s = x2 + y2;
        if (s > LEADING_TERM_RADIUS_SQUARED) {
            // s² would overflow for |z| ≳ 1e154; the correction terms are below 1e-16 here anyway.
            double r = Math.hypot(x, y);
            return r == Double.POSITIVE_INFINITY ? 0.0 : (y / r) * (INV_SQRT_PI / r);
        }
        return y * (s + 0.5) * INV_SQRT_PI / (s * s - x2 + y2 + 0.25);
    }

    /**
     * Two-level continued fraction w ≈ (i/√π)·(z² − 1)/(z·(z² − 3/2)) in closed real form, K part, for x ≥ 0,
     * y ≥ 0 and moderate |z| (s² must not overflow):
     * K = y·(s² − 1.5x² + 2.5y² + 1.5)/(√π·s·(s² − 3x² + 3y² + 2.25)), s = x² + y².
     * The numerator is y times a sum dominated by s², so K keeps its relative accuracy for tiny y. Relative error
     * below 4×10⁻¹⁰ for |z| ≥ 50 (it falls as |z|⁻⁶).
     */
    static double twoLevelK(double x, double y) {
        double x2 = x * x;
        double y2 = y * y;
        double s = x2 + y2;
        return y * (s * s - 1.5 * x2 + 2.5 * y2 + 1.5) * INV_SQRT_PI / (s * (s * s - 3.0 * x2 + 3.0 * y2 + 2.25));
    }

    /** One-level continued fraction in closed form, L part for x ≥ 0, y ≥ 0. */
    static double farWingL(double x, double y) {
        double x2 = x * x;
        double y2 = y * y;
        double s = x2 + y2;
        if (s > LEADING_TERM_RADIUS_SQUARED) {
            double r = Math.hypot(x, y);
            return r == Double.POSITIVE_INFINITY ? 0.0 : (x / r) * (INV_SQRT_PI / r);
        }
        return x * (s - 0.5) * INV_SQRT_PI / (s * s - x2 + y2 + 0.25);
    }

    /** Levels of the continued fraction for 8 ≤ |z| &lt; 4000 giving ~1e-15 relative accuracy. */
    private static int continuedFractionLevels(double s) {
        if (s < 100.0) {
            return 12;
        } else if (s < 144.0) {
            return 10;
        } else if (s < 256.0) {
            return 8;
        } else if (s < 400.0) {
            return 7;
        } else if (s < 900.0) {
            return 6;
        } else if (s < 1600.0) {
            return 5;
        } else if (s < 6400.0) {
            return 4;
        } else if (s < 1e6) {
            return 3;
        }
        return 2;
    }

    /**
     * Truncated Laplace continued fraction, real or imaginary part, for x ≥ 0, y ≥ 0. Evaluated from the tail:
     * t ← (k/2)/(z − t), then w = (i/√π)/(z − t).
     */
    private static double continuedFraction(double x, double y, double s, boolean realPart) {
        int levels = continuedFractionLevels(s);
        double tRe = 0.0;
        double tIm = 0.0;
        for (int k = levels; k >= 1; k--) {
            double dRe = x - tRe;
            double dIm = y - tIm;
            double scale = 0.5 * k / (dRe * dRe + dIm * dIm);
            tRe = dRe * scale;
            tIm = -dIm * scale;
        }
        double dRe = x - tRe;
        double dIm = y - tIm;
        double inv = INV_SQRT_PI / (dRe * dRe + dIm * dIm);
        // (i/√π)/(dRe + i·dIm) = (dIm + i·dRe)/(√π·|d|²)
        return realPart ? dIm * inv : dRe * inv;
    }

    /** Re e^(−z²) for x ≥ 0, 0 ≤ y &lt; 1 (zero when it underflows). */
    private static double realAxisExponentialRe(double x, double y) {
        double e = x * x - y * y;
        return e > EXP_UNDERFLOW_ARGUMENT ? 0.0 : Math.exp(-e) * Math.cos(2.0 * x * y);
    }

    /** Im e^(−z²) for x ≥ 0, 0 ≤ y &lt; 1 (zero when it underflows). */
    private static double realAxisExponentialIm(double x, double y) {
        double e = x * x - y * y;
        return e > EXP_UNDERFLOW_ARGUMENT ? 0.0 : -Math.exp(-e) * Math.sin(2.0 * x * y);
    }

    /**
     * Zaghloul–Ali series for x ≥ 0, y ≥ 0, |z| &lt; 8:
     * Re w = (e^(−x²)erfcx(y) − c·y·Σ₁)·cos 2xy + c·x·e^(−x²)·sin(xy)·sinc(xy) + (c/2)·y·(Σ₂ + Σ₃),
     * Im w = c·x·e^(−x²)·sinc(2xy) − (e^(−x²)erfcx(y) − c·y·Σ₁)·sin 2xy + (c/2)·(Σ₅ − Σ₄), with c = 2a/π and
     * Σ₁ = Σ e^(−a²n²−x²)/(a²n²+y²), Σ₂,₃ = Σ e^(−(an±x)²)/(a²n²+y²), Σ₄,₅ = Σ an·e^(−(an±x)²)/(a²n²+y²), n ≥ 1.
     */
    private static double zaghloulAli(double x, double y, boolean realPart) {
        return zaghloulAli(x, y, erfcxNonNegative(y), zaghloulAliSum1(y), null, realPart);
    }

    /**
     * The y-only part of Σ₁ of the Zaghloul–Ali series, Σ_{n≥1} e^(−a²n²)/(a²n² + y²).
     *
     * @param y imaginary part, ≥ 0
     * @return the sum
     */
    static double zaghloulAliSum1(double y) {
        double y2 = y * y;
        double sum1 = 0.0;
        for (int n = 1; n < EXP_MINUS_A2N2.length; n++) {
            sum1 += EXP_MINUS_A2N2[n] / (ZA_STEP_SQUARED * n * n + y2);
        }
        return sum1;
    }

    /**
     * Fills {@code reciprocals[n] = 1/(a²n² + y²)} for n = 0 .. {@link #ZA_TABLE_LENGTH} − 1, the denominators of
     * the Zaghloul–Ali sums, which depend on y only.
     *
     * @param y           imaginary part, ≥ 0
     * @param reciprocals array of at least {@link #ZA_TABLE_LENGTH} entries
     */
    static void zaghloulAliReciprocals(double y, double[] reciprocals) {
        double y2 = y * y;
        for (int n = 0; n < ZA_TABLE_LENGTH; n++) {
            reciprocals[n] = 1.0 / (ZA_STEP_SQUARED * n * n + y2);
        }
    }

    /**
     * K(x, y) for x ≥ 0, y ≥ 0 and x² + y² &lt; 64 with the y-only quantities supplied by the caller, so that a
     * caller holding y fixed over many x (a line on a grid) computes them once.
     *
     * @param x           real part, ≥ 0
     * @param y           imaginary part, ≥ 0
     * @param erfcxOfY    {@link #erfcx}(y)
     * @param sum1OfY     {@link #zaghloulAliSum1}(y)
     * @param reciprocals table from {@link #zaghloulAliReciprocals}(y)
     * @return K(x, y)
     */
    static double zaghloulAliK(double x, double y, double erfcxOfY, double sum1OfY, double[] reciprocals) {
        return zaghloulAli(x, y, erfcxOfY, sum1OfY, reciprocals, true);
    }

    /** The series; {@code reciprocals} may be null, then the denominators are divided out term by term. */
    private static double zaghloulAli(double x, double y, double erfcxOfY, double sum1OfY, double[] reciprocals,
                                      boolean realPart) {
        double y2 = y * y;
        double expMinusX2 = Math.exp(-x * x);
        double sum1 = sum1OfY * expMinusX2;

        // Consecutive Gaussian terms differ by e^(−(a(n+1)±x)²)/e^(−(an±x)²) = e^(−2a·u_n − a²)·e^(−2a²k) with
        // u_n = an ± x at the first term and k terms further on: two exponentials per sum instead of one per term;
        // the factors e^(−2a²k) come from a table, so rounding grows only linearly with the term count.

        // Σ₂, Σ₄: terms e^(−(an+x)²), significant only while (a + x)² is below the negligible exponent.
        double sum2 = 0.0;
        double sum4 = 0.0;
        double u = ZA_STEP + x;
        if (u * u < NEGLIGIBLE_EXPONENT) {
            double term = Math.exp(-u * u);
            double step = Math.exp(-2.0 * ZA_STEP * u - ZA_STEP_SQUARED);
            for (int n = 1, k = 0; u * u < NEGLIGIBLE_EXPONENT; n++, k++) {
                double weighted = reciprocals != null ? term * reciprocals[n]
                        : term / (ZA_STEP_SQUARED * n * n + y2);
                sum2 += weighted;
                sum4 += weighted * (ZA_STEP * n);
                term *= step * EXP_MINUS_2A2K[k];
                u += ZA_STEP;
            }
        }

        // Σ₃, Σ₅: terms e^(−(an−x)²), summed over the window where the Gaussian is significant.
        double sum3 = 0.0;
        double sum5 = 0.0;
        int nFirst = Math.max(1, (int) Math.floor((x - NEGLIGIBLE_DISTANCE) / ZA_STEP));
        int nLast = (int) Math.ceil((x + NEGLIGIBLE_DISTANCE) / ZA_STEP);
        double u0 = ZA_STEP * nFirst - x;
        double term = Math.exp(-u0 * u0);
        double step = Math.exp(-2.0 * ZA_STEP * u0 - ZA_STEP_SQUARED);
        for (int n = nFirst, k = 0; n <= nLast; n++, k++) {
            double weighted = reciprocals != null ? term * reciprocals[n] : term / (ZA_STEP_SQUARED * n * n + y2);
            sum3 += weighted;
            sum5 += weighted * (ZA_STEP * n);
            term *= step * EXP_MINUS_2A2K[k];
        }

        double coefficient1 = expMinusX2 * erfcxOfY - ZA_FACTOR * y * sum1;
        double xy = x * y;
        if (realPart) {
            double sinXy = Math.sin(xy);
            return coefficient1 * Math.cos(2.0 * xy)
                    + ZA_FACTOR * x * expMinusX2 * sinXy * sinc(xy, sinXy)
                    + 0.5 * ZA_FACTOR * y * (sum2 + sum3);
        }
        double sin2Xy = Math.sin(2.0 * xy);
        return ZA_FACTOR * x * expMinusX2 * sinc(2.0 * xy, sin2Xy)
                - coefficient1 * sin2Xy
                + 0.5 * ZA_FACTOR * (sum5 - sum4);
    }

    /** sin(u)/u given sin(u); the Taylor form near 0 avoids 0/0 and keeps full precision. */
    private static double sinc(double u, double sinU) {
        return Math.abs(u) < 1e-4 ? 1.0 - u * u / 6.0 : sinU / u;
    }

    /** Re w for y &lt; 0 via w(z) = 2e^(−z²) − w(−z). */
    private static double reflectedRe(double x, double y) {
        double e = y * y - x * x;
        return 2.0 * Math.exp(e) * Math.cos(2.0 * x * y) - voigtK(-x, -y);
    }

    /** Im w for y &lt; 0 via w(z) = 2e^(−z²) − w(−z). */
    private static double reflectedIm(double x, double y) {
        double e = y * y - x * x;
        return -2.0 * Math.exp(e) * Math.sin(2.0 * x * y) - voigtL(-x, -y);
    }
}
