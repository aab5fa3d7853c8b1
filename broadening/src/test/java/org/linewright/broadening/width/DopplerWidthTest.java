package org.linewright.broadening.width;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.testsupport.SampleIsotopologues;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.MoleculeRegistry;

class DopplerWidthTest {

    /** Handbook form α_D = 3.581×10⁻⁷·ν·√(T/M) (common practice; the constant is given to 4 digits). */
    private static double handbook(double nu, double t, double m) {
        return 3.581e-7 * nu * Math.sqrt(t / m);
    }

    @Test
    void coFundamentalAt296KMatchesHandbookFormula() {
        // CO, 2143 cm-1, 296 K, M = 27.9949 g/mol (brief; handbook formula, common practice): 2.4954e-3 cm-1
        double alpha = DopplerWidth.hwhmCm1(2143.0, 296.0, 27.9949);
        // 3.581 is rounded to 4 digits: relative agreement within 0.5e-3/3.581 = 1.4e-4
        assertEquals(handbook(2143.0, 296.0, 27.9949), alpha, 1.5e-4 * alpha);
    }

    @Test
    void coWithTheBuiltInRegistryMass() {
        // the registry's 12C16O mass against the brief's M = 27.9949 g/mol in the handbook formula (common practice)
        LineBatch b = new LineBatch(1);
        b.size = 1;
        b.moleculeId[0] = 5;
        b.isotopologue[0] = 1;
        b.wavenumberCm1[0] = 2143.0;
        double[] out = new double[1];
        DopplerWidth.hwhmCm1(b, 296.0, MoleculeRegistry.builtIn(), out);
        assertEquals(handbook(2143.0, 296.0, 27.9949), out[0], 1.5e-4 * out[0]);
    }

    @Test
    void scalesAsSquareRootOfTemperatureOverMass() {
        // handbook formula at other states (common practice)
        assertEquals(handbook(1000.0, 1500.0, 18.0106), DopplerWidth.hwhmCm1(1000.0, 1500.0, 18.0106),
                1.5e-4 * handbook(1000.0, 1500.0, 18.0106));
        assertEquals(handbook(30.0, 70.0, 2.01565), DopplerWidth.hwhmCm1(30.0, 70.0, 2.01565),
                1.5e-4 * handbook(30.0, 70.0, 2.01565));
    }

    @Test
    void batchUsesEachIsotopologuesMass() {
        SampleIsotopologues lookup = SampleIsotopologues.withLinearRotorQ();
        LineBatch b = new LineBatch(3);
        b.size = 3;
        int[] iso = {1, 2, 1};
        double[] nu = {2143.0, 2096.0, 4260.0};
        double[] mass = {27.994915, 28.998270, 27.994915}; // CO isotopologue masses (AME 2016, from memory)
        for (int i = 0; i < 3; i++) {
            b.moleculeId[i] = 5;
            b.isotopologue[i] = iso[i];
            b.wavenumberCm1[i] = nu[i];
        }
        double[] out = new double[3];
        DopplerWidth.hwhmCm1(b, 296.0, lookup, out);
        for (int i = 0; i < 3; i++) {
            assertEquals(handbook(nu[i], 296.0, mass[i]), out[i], 1.5e-4 * out[i]);
        }
        b.isotopologue[1] = 9;
        assertThrows(InputException.class, () -> DopplerWidth.hwhmCm1(b, 296.0, lookup, out));
    }
}
