package org.linewright.grid.engine.exact;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.FixedCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * A millimetre line (8.9 cm⁻¹, 1.123 mm) broadened by CO2 at 5 atm (a hypothetical 0.1 cm⁻¹/atm, γL = 0.5 cm⁻¹,
 * γL/ν₀ = 5.6 %) with the Van Vleck–Weisskopf shape, from the exact engine, against a direct numpy/SciPy evaluation
 * of (ν/ν₀)²·[V(ν − ν₀) + V(ν + ν₀)] (Van Vleck & Weisskopf, Rev. Mod. Phys. 17 (1945) 227) at every grid point.
 * Reference values: {@code vvw-8.9cm1-5atm.txt}, generated once with numpy 2.4.6 and SciPy 1.17.1 by
 * <pre>
 * import numpy as np, scipy
 * from scipy.special import voigt_profile
 * nu0, S, gL = 8.9, 1e-20, 0.5
 * aD = 9.40e-6
 * sig = aD / np.sqrt(2 * np.log(2))
 * d = 25.03
 * nu = np.round(np.arange(1, 401) * 0.1, 10)
 * V = lambda x: voigt_profile(x, sig, gL)
 * phi = (nu / nu0) ** 2 * (V(nu - nu0) + V(nu + nu0))
 * sigma = np.where(np.abs(nu - nu0) &lt;= d, S * phi, 0.0)
 * for a, b in zip(nu, sigma): print("%.1f %.17g" % (a, b))
 * </pre>
 * (αD = 9.40×10⁻⁶ cm⁻¹ is PH3's Doppler HWHM at 296 K; the cutoff 25.03 cm⁻¹ keeps grid points off its edge.)
 */
class ExactEngineVanVleckWeisskopfTest {

    private static final double CENTRE_CM1 = 8.9;
    private static final double STRENGTH = 1e-20;
    private static final double DOPPLER_CM1 = 9.40e-6;
    private static final double LORENTZ_CM1 = 0.5;
    private static final WingTreatment WINGS = new WingTreatment(new FixedCutoff(25.03), false, ChiFactorKind.NONE);

    private static double[][] reference() throws IOException {
        List<double[]> rows = new ArrayList<>();
        try (BufferedReader r = new BufferedReader(new InputStreamReader(
                ExactEngineVanVleckWeisskopfTest.class.getResourceAsStream("vvw-8.9cm1-5atm.txt"),
                StandardCharsets.US_ASCII))) {
            for (String line = r.readLine(); line != null; line = r.readLine()) {
                if (!line.startsWith("#")) {
                    String[] f = line.trim().split("\\s+");
                    rows.add(new double[] {Double.parseDouble(f[0]), Double.parseDouble(f[1])});
                }
            }
        }
        return rows.toArray(new double[0][]);
    }

    private static double[] sigma(boolean vanVleckWeisskopf, int threads) {
        WavenumberGrid grid = WavenumberGrid.uniform(0.1, 40.0, 0.1);
        LineChunk c = new LineChunk(1);
        c.size = 1;
        c.centerCm1[0] = CENTRE_CM1;
        c.intensityCmPerMolecule[0] = STRENGTH;
        c.dopplerHwhmCm1[0] = DOPPLER_CM1;
        c.lorentzHwhmCm1[0] = LORENTZ_CM1;
        c.vanVleckWeisskopf[0] = vanVleckWeisskopf;
        double[] sigma = new double[grid.size()];
        try (ExactEngine engine = new ExactEngine(threads, WINGS)) {
            engine.begin(grid, 5.0, 296.0);
            engine.accumulate(c, sigma);
            engine.finish(sigma);
        }
        return sigma;
    }

    @Test
    void millimetreLineMatchesNumpyAtEveryPoint() throws IOException {
        double[][] ref = reference();
        double[] sigma = sigma(true, 2);
        assertEquals(400, ref.length);
        assertEquals(ref.length, sigma.length);
        for (int i = 0; i < ref.length; i++) {
            // the grid's points are the reference's wavenumbers
            assertEquals(ref[i][0], 0.1 * (i + 1), 1e-9);
            // numpy/SciPy direct evaluation; VoigtProfile's relative error is below 1e-9 in its far-wing forms
            assertEquals(ref[i][1], sigma[i], 1e-9 * ref[i][1] + 1e-300, "nu = " + ref[i][0] + " cm-1");
        }
    }

    @Test
    void theVoigtShapeMissesTheReferenceInTheWings() throws IOException {
        // the same line without the flag: a symmetric Voigt differs from the VVW values by far more than 1e-9
        double[][] ref = reference();
        double[] voigt = sigma(false, 1);
        double worst = 0;
        for (int i = 0; i < ref.length; i++) {
            if (ref[i][1] > 0) {
                worst = Math.max(worst, Math.abs(voigt[i] / ref[i][1] - 1));
            }
        }
        assertTrue(worst > 0.5, "largest Voigt/VVW difference " + worst);
    }
}
