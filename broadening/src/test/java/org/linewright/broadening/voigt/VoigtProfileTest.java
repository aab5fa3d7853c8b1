package org.linewright.broadening.voigt;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

/** Area-normalised profiles: against SciPy's voigt_profile, normalisation, width, and the exact limits. */
class VoigtProfileTest {

    private static final double LN2 = Math.log(2);

    /**
     * Profile values (value() and the array kernel addProfile(), which uses closed forms for |z| ≥ 50) against
     * scipy.special.voigt_profile (SciPy 1.17.1), table made by {@code make_voigt_profile_reference.py}.
     */
    @Test
    void matchesScipyVoigtProfile() throws IOException {
        List<double[]> rows = new ArrayList<>();
        try (InputStream in = getClass().getResourceAsStream("voigt-profile-reference.csv");
             BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            while ((line = r.readLine()) != null) {
                if (line.startsWith("#") || line.startsWith("alphaD")) {
                    continue;
                }
                String[] f = line.split(",");
                rows.add(new double[] {Double.parseDouble(f[0]), Double.parseDouble(f[1]),
                        Double.parseDouble(f[2]), Double.parseDouble(f[3])});
            }
        }
        assertTrue(rows.size() > 900);
        double[] grid = new double[1];
        double[] out = new double[1];
        double center = 0.0; // exact detunings: a non-zero centre would round them
        double worstValue = 0;
        double worstArray = 0;
        double worstArrayCore = 0;
        for (double[] row : rows) {
            double expected = row[3];
            double v = VoigtProfile.value(row[2], row[0], row[1]);
            grid[0] = center + row[2];
            out[0] = 0;
            VoigtProfile.addProfile(grid, 0, 1, center, row[0], row[1], 2.0, out);
            if (expected < Double.MIN_NORMAL) {
                // underflowed or subnormal (no relative precision left): only require the same
                assertTrue(v < 1e-300 && out[0] < 1e-300, "underflow expected at " + row[2]);
                continue;
            }
            worstValue = Math.max(worstValue, Math.abs(v / expected - 1));
            double x = Math.sqrt(LN2) * row[2] / row[0];
            double y = Math.sqrt(LN2) * row[1] / row[0];
            double deviation = Math.abs(out[0] / (2 * expected) - 1);
            if (x * x + y * y < VoigtProfile.TWO_LEVEL_RADIUS_SQUARED) {
                worstArrayCore = Math.max(worstArrayCore, deviation);
            } else {
                worstArray = Math.max(worstArray, deviation);
            }
        }
        assertTrue(worstValue < 1e-12, "value(): worst relative deviation " + worstValue);
        assertTrue(worstArray < 1e-9, "addProfile(), far wing: worst relative deviation " + worstArray);
        assertTrue(worstArrayCore < 1e-12, "addProfile(), |z| < 50: worst relative deviation " + worstArrayCore);
    }

    /**
     * ∫V dΔν = 1 to 1e-6 without cutoff: Hipparchus' iterative Gauss–Legendre integrator on [0, X] split into
     * log-spaced panels, plus the analytic Lorentz tail 2/π·atan(γ/X) beyond X = 10⁴·HWHM (the Voigt and Lorentz
     * tails differ there by a relative (αD/X)² ≈ 1e-8 of a 1e-4 tail).
     */
    @Test
    void voigtProfileIsNormalised() {
        double alphaD = 0.005;
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(8, 1e-12, 1e-15);
        for (double y : new double[] {1e-3, 1e-2, 0.1, 1, 10, 100, 1000}) {
            double gammaL = y * alphaD / Math.sqrt(LN2);
            double hwhm = VoigtWidth.hwhmCm1(alphaD, gammaL);
            double end = 1e4 * hwhm;
            double sum = 0;
            double lo = 0;
            for (double hi = hwhm / 64; lo < end; hi *= 2) {
                double top = Math.min(hi, end);
                sum += integrator.integrate(Integer.MAX_VALUE, d -> VoigtProfile.value(d, alphaD, gammaL), lo, top);
                lo = top;
            }
            double total = 2 * sum + 2 / Math.PI * Math.atan(gammaL / end);
            assertEquals(1.0, total, 1e-6, "y=" + y);
        }
    }

    /**
     * HWHM found numerically (bisection on V(Δν) = V(0)/2) against Olivero and Longbothum 1977 (JQSRT 17, 233),
     * for y = √ln2·γL/αD from 10⁻³ to 10³. The paper quotes 0.02 %; the fit's true largest error is 0.0237 %
     * (at y ≈ 0.24, found with scipy.special.voigt_profile and scipy.optimize.brentq, SciPy 1.17.1), so the
     * tolerance is 0.024 %. The bisection itself is checked against SciPy's half width at y = 10^−0.75:
     * 1.1188633192347774 αD (same SciPy computation).
     */
    @Test
    void halfWidthAgreesWithOliveroLongbothum() {
        double alphaD = 1.0;
        for (double logY = -3; logY <= 3.0001; logY += 0.25) {
            double gammaL = Math.pow(10, logY) * alphaD / Math.sqrt(LN2);
            double half = VoigtProfile.value(0, alphaD, gammaL) / 2;
            double lo = 0;
            double hi = alphaD + gammaL;
            for (int i = 0; i < 200; i++) {
                double mid = 0.5 * (lo + hi);
                if (VoigtProfile.value(mid, alphaD, gammaL) > half) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            double numeric = 0.5 * (lo + hi);
            double fit = VoigtWidth.hwhmCm1(alphaD, gammaL);
            assertEquals(numeric, fit, 2.4e-4 * numeric, "y=10^" + logY);
            if (Math.abs(logY + 0.75) < 1e-9) {
                assertEquals(1.1188633192347774, numeric, 1e-12);
            }
            assertEquals(2 * fit, VoigtWidth.fwhmCm1(2 * gammaL, 2 * alphaD), 1e-15 * fit);
        }
    }

    /** Gaussian: peak √(ln2/π)/αD and value 1/2 of it at Δν = αD (definition of HWHM; common practice). */
    @Test
    void dopplerProfileLimits() {
        double alphaD = 0.0123;
        double peak = Math.sqrt(LN2 / Math.PI) / alphaD;
        assertEquals(peak, DopplerProfile.value(0, alphaD), 1e-15 * peak);
        assertEquals(peak / 2, DopplerProfile.value(alphaD, alphaD), 1e-15 * peak);
        assertEquals(peak / 2, DopplerProfile.value(-alphaD, alphaD), 1e-15 * peak);
        // Voigt with γL = 0 is the Gaussian; with γL tiny it converges to it
        for (double d : new double[] {0, 0.004, 0.02, 0.05}) {
            double g = DopplerProfile.value(d, alphaD);
            assertEquals(g, VoigtProfile.value(d, alphaD, 0), 1e-15 * g);
            assertEquals(g, VoigtProfile.value(d, alphaD, 1e-15), 1e-8 * g);
        }
    }

    /** Lorentzian: peak 1/(πγ) and half of it at Δν = γ (definition; common practice); αD → 0 Voigt limit. */
    @Test
    void lorentzProfileLimits() {
        double gamma = 0.07;
        double peak = 1 / (Math.PI * gamma);
        assertEquals(peak, LorentzProfile.value(0, gamma), 1e-15 * peak);
        assertEquals(peak / 2, LorentzProfile.value(gamma, gamma), 1e-15 * peak);
        for (double d : new double[] {0, 0.01, 0.07, 3, 25}) {
            double l = LorentzProfile.value(d, gamma);
            assertEquals(l, VoigtProfile.value(d, 0, gamma), 1e-15 * l);
            // αD/γL = 1e-6: relative difference of order (αD/γL)²
            assertEquals(l, VoigtProfile.value(d, 7e-8, gamma), 1e-10 * l);
        }
    }

    @Test
    void arrayKernelsHonourRangeAndStrength() {
        double[] grid = new double[11];
        for (int i = 0; i < grid.length; i++) {
            grid[i] = 100 + 0.01 * (i - 5);
        }
        for (LineShapeKind kind : LineShapeKind.values()) {
            if (kind == LineShapeKind.VAN_VLECK_WEISSKOPF) {
                // its array kernel depends on the centre, not the detuning only: VanVleckWeisskopfProfileTest
                continue;
            }
            double[] out = new double[11];
            kind.addProfile(grid, 2, 9, 100.0, 0.004, 0.003, 3.0, out);
            assertEquals(0.0, out[0]);
            assertEquals(0.0, out[1]);
            assertEquals(0.0, out[9]);
            for (int i = 2; i < 9; i++) {
                double expected = 3.0 * kind.value(grid[i] - 100.0, 0.004, 0.003);
                assertEquals(expected, out[i], 1e-12 * expected, kind + " at " + i);
            }
        }
    }

    @Test
    void rejectsInvalidWidths() {
        assertThrows(IllegalArgumentException.class, () -> VoigtProfile.value(0, 0, 0));
        assertThrows(IllegalArgumentException.class, () -> VoigtProfile.value(0, -1, 0.1));
        assertThrows(IllegalArgumentException.class, () -> VoigtProfile.value(0, 0.1, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> DopplerProfile.value(0, 0));
        assertThrows(IllegalArgumentException.class, () -> LorentzProfile.value(0, 0));
        assertThrows(IllegalArgumentException.class, () -> LineShapeKind.parse("humpty"));
        assertEquals(LineShapeKind.DOPPLER, LineShapeKind.parse(" Gaussian "));
    }
}
