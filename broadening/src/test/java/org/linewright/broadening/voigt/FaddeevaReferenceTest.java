package org.linewright.broadening.voigt;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Checks K(x, y) and L(x, y) against a reference table of w(z) generated once with scipy.special.wofz
 * (S.G. Johnson's Faddeeva package in SciPy 1.17.1), cross-checked with mpmath 1.3.0 at 60 digits (agreement
 * 1.4e-14); see {@code make_faddeeva_reference.py} beside the table for the command and versions.
 */
class FaddeevaReferenceTest {

    /** Required accuracy of the part (relative error of K). */
    private static final double REQUIRED_RELATIVE_ERROR = 1e-6;
    /** Accuracy claimed in the Javadoc of {@link Faddeeva}. */
    private static final double CLAIMED_RELATIVE_ERROR = 1e-13;

    private static final List<double[]> ROWS = new ArrayList<>();

    @BeforeAll
    static void load() throws IOException {
        try (InputStream in = FaddeevaReferenceTest.class.getResourceAsStream("faddeeva-reference.csv");
             BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            while ((line = reader.readLine()) != null) {
                if (line.startsWith("#") || line.startsWith("x,")) {
                    continue;
                }
                String[] f = line.split(",");
                ROWS.add(new double[] {Double.parseDouble(f[0]), Double.parseDouble(f[1]),
                        Double.parseDouble(f[2]), Double.parseDouble(f[3])});
            }
        }
        assertTrue(ROWS.size() > 4000, "reference table incomplete: " + ROWS.size());
    }

    @Test
    void realPartMatchesWofzToRequiredRelativeAccuracy() {
        double worst = 0;
        double[] worstRow = null;
        for (double[] r : ROWS) {
            double k = Faddeeva.voigtK(r[0], r[1]);
            double err = Math.abs(k - r[2]) / Math.abs(r[2]);
            if (err > worst) {
                worst = err;
                worstRow = r;
            }
        }
        String where = worstRow == null ? "" : " at x=" + worstRow[0] + " y=" + worstRow[1];
        assertTrue(worst <= REQUIRED_RELATIVE_ERROR, "max relative error of K " + worst + where);
        assertTrue(worst <= CLAIMED_RELATIVE_ERROR, "max relative error of K " + worst + where);
    }

    /**
     * The closed forms used by the profile kernel in the far wing against the same table: one level for
     * |z| ≥ 250 (bound 2.5/|z|⁴ = 6.4e-10) and two levels for |z| ≥ 50 (bound 4e-10).
     */
    @Test
    void farWingClosedFormsMatchWofz() {
        int checked = 0;
        for (double[] r : ROWS) {
            double x = Math.abs(r[0]);
            double y = r[1];
            double s = x * x + y * y;
            if (s >= VoigtProfile.FAST_FAR_WING_RADIUS_SQUARED) {
                assertEquals(r[2], Faddeeva.farWingK(x, y), 6.5e-10 * r[2], "one level at x=" + x + " y=" + y);
                checked++;
            }
            if (s >= VoigtProfile.TWO_LEVEL_RADIUS_SQUARED && s < 1e100) {
                assertEquals(r[2], Faddeeva.twoLevelK(x, y), 4e-10 * r[2], "two levels at x=" + x + " y=" + y);
                checked++;
            }
        }
        assertTrue(checked > 2000, "rows checked: " + checked);
    }

    @Test
    void imaginaryPartMatchesWofzRelativeToModulus() {
        double worst = 0;
        double[] worstRow = null;
        double[] w = new double[2];
        for (double[] r : ROWS) {
            Faddeeva.w(r[0], r[1], w, 0);
            double err = Math.abs(w[1] - r[3]) / Math.hypot(r[2], r[3]);
            if (err > worst) {
                worst = err;
                worstRow = r;
            }
            assertEquals(Faddeeva.voigtK(r[0], r[1]), w[0], 0.0, "w() and voigtK() must agree");
        }
        String where = worstRow == null ? "" : " at x=" + worstRow[0] + " y=" + worstRow[1];
        assertTrue(worst <= CLAIMED_RELATIVE_ERROR, "max error of L relative to |w| " + worst + where);
    }
}
