package org.linewright.ingest.line;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.linewright.ingest.testsupport.ReferenceSamples;

class EinsteinCoefficientsTest {

    /**
     * ¹²C¹⁶O pure-rotation R(0) line, record of HITRAN2020 (Gordon et al. 2022, in
     * reference-data/hitran2020-samples/sample_CO.par, line 26): ν = 3.845033 cm⁻¹, S = 3.300×10⁻²⁴,
     * A = 7.207×10⁻⁸ s⁻¹, E″ = 0, g′ = 3; Iₐ = 0.986544 and Q(296 K) = 107.42 (HITRAN metadata, from memory).
     * Rounding of S and A (4 digits each) allows 7×10⁻⁴ relative here.
     */
    @Test
    void carbonMonoxideRotationalLineOfThePublishedList() {
        double s = EinsteinCoefficients.intensityFromEinsteinA(7.207e-8, 3.845033, 3, 0.0, 296.0, 107.42, 0.986544);
        assertEquals(3.300e-24, s, 3.300e-24 * 7e-4);
        double a = EinsteinCoefficients.einsteinAFromIntensity(3.300e-24, 3.845033, 3, 0.0, 296.0, 107.42, 0.986544);
        assertEquals(7.207e-8, a, 7.207e-8 * 7e-4);
    }

    /** The formula written out independently with CODATA 2018 constants (c = 2.99792458e10 cm/s, c2 = 1.438776877 cm K). */
    @Test
    void agreesWithTheFormulaWrittenOut() {
        double a = 12.5;
        double nu = 2350.1;
        double g = 7;
        double e = 1234.5;
        double t = 1500;
        double q = 3456.7;
        double ia = 0.5;
        double expected = ia * a * g / (8 * Math.PI * 2.99792458e10 * nu * nu) * Math.exp(-1.438776877 * e / t)
                * (1 - Math.exp(-1.438776877 * nu / t)) / q;
        assertEquals(expected, EinsteinCoefficients.intensityFromEinsteinA(a, nu, g, e, t, q, ia), expected * 1e-13);
    }

    @Test
    void roundTripAToSToA() {
        double[] nus = {0.01, 3.845033, 1000.0, 25000.0};
        for (double nu : nus) {
            double s = EinsteinCoefficients.intensityFromEinsteinA(3.3e-3, nu, 11, 500.0, 296.0, 1e4, 0.9);
            double a = EinsteinCoefficients.einsteinAFromIntensity(s, nu, 11, 500.0, 296.0, 1e4, 0.9);
            assertEquals(3.3e-3, a, 3.3e-3 * 1e-14, "nu=" + nu);
        }
    }

    /** Ratio of two evaluations of the written-out formula at two temperatures. */
    @Test
    void intensityRatioMatchesTheQuotientOfTheFormula() {
        double nu = 3.845033;
        double e = 11.5;
        double s300 = Math.exp(-1.438776877 * e / 300) * (1 - Math.exp(-1.438776877 * nu / 300)) / 108.869;
        double s296 = Math.exp(-1.438776877 * e / 296) * (1 - Math.exp(-1.438776877 * nu / 296)) / 107.42;
        assertEquals(s296 / s300, EinsteinCoefficients.intensityRatio(nu, e, 300, 108.869, 296, 107.42), 1e-12);
    }

    /**
     * Every ¹²C¹⁶O record of the HITRAN2020 sample satisfies the relation at 296 K within the rounding of S and A
     * (each given to 4 significant digits; reference-data README for the relation; fields at columns 4–15 ν, 16–25 S, 26–35 A, 46–55 E″, 147–153 g′).
     */
    @Test
    void everyCarbonMonoxideRecordOfThePublishedSample() throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        int checked = 0;
        try (BufferedReader r = Files.newBufferedReader(sample, StandardCharsets.ISO_8859_1)) {
            String line;
            while ((line = r.readLine()) != null) {
                if (!line.startsWith(" 51")) {
                    continue;
                }
                double nu = Double.parseDouble(line.substring(3, 15).trim());
                double s = Double.parseDouble(line.substring(15, 25).trim());
                double a = Double.parseDouble(line.substring(25, 35).trim());
                double e = Double.parseDouble(line.substring(45, 55).trim());
                double g = Double.parseDouble(line.substring(146, 153).trim());
                double computed = EinsteinCoefficients.intensityFromEinsteinA(a, nu, g, e, 296.0, 107.42, 0.986544);
                // S and A have 4 significant digits: half a unit of each, relative, plus 5e-4 for Q(296 K) (the README confirms 107.42 to 2e-3)
                double mantissaS = Double.parseDouble(line.substring(15, 20));
                double mantissaA = Double.parseDouble(line.substring(25, 30));
                double relative = 5e-4 / mantissaS + 5e-4 / mantissaA + 5e-4;
                assertEquals(s, computed, s * relative, line.substring(0, 60));
                checked++;
            }
        }
        assertTrue(checked > 1000, "records checked: " + checked);
    }

}
