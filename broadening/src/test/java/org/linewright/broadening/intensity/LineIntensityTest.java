package org.linewright.broadening.intensity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.testsupport.SampleIsotopologues;
import org.linewright.ingest.line.LineBatch;

/**
 * Reference values: the formulas of Šimečková et al. 2006 (JQSRT 98, 130, eqs. 11 and 20) evaluated at
 * 40 significant digits with mpmath 1.3.0 (Python 3, general-purpose arbitrary-precision library), generated
 * once with:
 * <pre>
 * from mpmath import mp, mpf, exp, pi; mp.dps = 40; c2 = mpf('1.438776877'); c = mpf('2.99792458e10')
 * scale = lambda S0,nu,E,qr,T: S0*qr*exp(-c2*E/T)/exp(-c2*E/296)*(1-exp(-c2*nu/T))/(1-exp(-c2*nu/296))
 * fromA = lambda A,g,nu,E,Ia,Q,T: Ia*A*g/(8*pi*c*nu**2)*exp(-c2*E/T)*(1-exp(-c2*nu/T))/Q
 * </pre>
 */
class LineIntensityTest {

    @Test
    void scalingMatchesHighPrecisionReference() {
        // scale(1e-20, 2143.271, 1000, 0.3, 1000) = 8.7682861120252782422e-20 (mpmath, see class comment)
        assertEquals(8.7682861120252782422e-20,
                LineIntensity.scaledFromReference(1e-20, 2143.271, 1000, 0.3, 1000), 1e-14 * 8.77e-20);
        // high E'' at high T: scale(3e-105, 5000, 40000, 0.01, 4000) = 3.8865790450398742403e-29
        assertEquals(3.8865790450398742403e-29,
                LineIntensity.scaledFromReference(3e-105, 5000, 40000, 0.01, 4000), 1e-12 * 3.89e-29);
    }

    @Test
    void tinyWavenumberKeepsFullPrecision() {
        // ν = 1e-4 cm-1: c2ν/T ~ 3e-6, where 1 − exp(−x) computed directly keeps only ~10 digits.
        // scale(1e-30, 1e-4, 0.5, 0.5, 50) = 2.9248133602087914745e-30 (mpmath, see class comment)
        assertEquals(2.9248133602087914745e-30,
                LineIntensity.scaledFromReference(1e-30, 1e-4, 0.5, 0.5, 50), 1e-14 * 2.92e-30);
    }

    @Test
    void einsteinARelationMatchesHighPrecisionReference() {
        // fromA(1e-2, 15, 1000, 500, 0.98, 1000, 500) = 4.3676782604343255088e-23 (mpmath)
        assertEquals(4.3676782604343255088e-23,
                LineIntensity.fromEinsteinA(1e-2, 15, 1000, 500, 0.98, 1000, 500), 1e-14 * 4.37e-23);
        // microwave line at 5 K: fromA(3e-9, 3, 0.02, 10, 1, 200, 5) = 4.8215933289675244021e-23 (mpmath)
        assertEquals(4.8215933289675244021e-23,
                LineIntensity.fromEinsteinA(3e-9, 3, 0.02, 10, 1, 200, 5), 1e-14 * 4.82e-23);
    }

    @Test
    void batchUsesIntensityOrEinsteinAAndPartitionSums() {
        SampleIsotopologues lookup = SampleIsotopologues.withLinearRotorQ();
        LineBatch b = new LineBatch(3);
        b.size = 3;
        for (int i = 0; i < 3; i++) {
            b.moleculeId[i] = 5;
            b.isotopologue[i] = 1;
            b.wavenumberCm1[i] = 2000 + i;
            b.lowerEnergyCm1[i] = 100 * i;
            b.upperDegeneracy[i] = 3;
            b.einsteinAS1[i] = 10.0;
            b.intensityCmPerMolecule[i] = 1e-20;
        }
        b.intensityCmPerMolecule[1] = Double.NaN; // a state-list line: from A
        b.einsteinAS1[2] = Double.NaN;
        b.intensityCmPerMolecule[2] = Double.NaN; // neither
        double[] out = new double[3];
        LineIntensity.atTemperature(b, 700.0, lookup, out);
        // the test lookup's Q(T) = Q(296)·T/296, so Q(296)/Q(700) = 296/700
        assertEquals(LineIntensity.scaledFromReference(1e-20, 2000, 0, 296.0 / 700.0, 700), out[0], 1e-30);
        assertEquals(LineIntensity.fromEinsteinA(10, 3, 2001, 100, 0.986544, 107.42 * 700 / 296.0, 700), out[1],
                1e-14 * out[1]);
        assertTrue(Double.isNaN(out[2]));
        assertThrows(IllegalArgumentException.class, () -> LineIntensity.atTemperature(b, 0, lookup, out));
    }

    @Test
    void referenceTemperatureIsIdentity() {
        // S(296 K) must be returned unchanged (definition of the reference intensity)
        assertEquals(4.2e-21, LineIntensity.scaledFromReference(4.2e-21, 1234.5, 3456.7, 1.0, 296.0), 1e-35);
    }
}
