package org.linewright.broadening.intensity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.testsupport.HitranSamples;
import org.linewright.ingest.testsupport.SampleIsotopologues;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.MoleculeRegistry;

/**
 * S(1000 K) of every CO record of {@code reference-data/hitran2020-samples/sample_CO.par} (HITRAN2020, Gordon et
 * al. 2022, JQSRT 277, 107949) two ways: scaled from the record's S(296 K), and from its Einstein A, g' and
 * E'' (Šimečková et al. 2006, JQSRT 98, 130). Both use the same Q(1000 K) (it cancels), Q(296 K) and
 * abundances from the samples' README table (HITRAN isotopologue metadata, TIPS-2021, from memory, confirmed by
 * the samples). The two agree to the precision of the record: S and A are printed with 4 significant digits
 * (E10.3), each rounded by at most 0.5e-3 relative, so the two differ by at most 1.0e-3 relative. (The README
 * states ±7×10⁻⁴; 52 of the 5381 records exceed that, the largest by 9.93×10⁻⁴, all within the 1.0e-3 bound
 * of the printed digits; checked once with Python 3.)
 */
class SampleIntensityTest {
    private static final double PRINTED_DIGITS_BOUND = 1.0e-3;

    @Test
    void coIntensityAt1000KFromS296AgreesWithEinsteinA() throws IOException {
        LineBatch b = HitranSamples.records("CO");
        SampleIsotopologues lookup = SampleIsotopologues.withLinearRotorQ();
        double[] fromS = new double[b.size];
        LineIntensity.atTemperature(b, 1000.0, lookup, fromS);
        // the same lines without S(296 K): the Einstein-A path
        for (int i = 0; i < b.size; i++) {
            b.intensityCmPerMolecule[i] = Double.NaN;
        }
        double[] fromA = new double[b.size];
        LineIntensity.atTemperature(b, 1000.0, lookup, fromA);
        for (int i = 0; i < b.size; i++) {
            double rel = fromA[i] / fromS[i] - 1.0;
            assertTrue(Math.abs(rel) <= PRINTED_DIGITS_BOUND + 1e-9,
                    "line " + b.sourceLine[i] + ": S(1000 K) from A / from S − 1 = " + rel);
        }
        assertEquals(5381, b.size, "records in sample_CO.par (samples' README)");
    }

    @Test
    void coIntensityAt296KFromEinsteinAWithTheBuiltInRegistry() throws IOException {
        // the same relation at 296 K with the registry's abundances and Q(296 K) instead of the README table:
        // S from A must reproduce the records' S within the 1.0e-3 of their printed digits (class comment)
        LineBatch b = HitranSamples.records("CO");
        double[] s296 = b.intensityCmPerMolecule.clone();
        for (int i = 0; i < b.size; i++) {
            b.intensityCmPerMolecule[i] = Double.NaN;
        }
        double[] fromA = new double[b.size];
        LineIntensity.atTemperature(b, 296.0, MoleculeRegistry.builtIn(), fromA);
        for (int i = 0; i < b.size; i++) {
            double rel = fromA[i] / s296[i] - 1.0;
            assertTrue(Math.abs(rel) <= PRINTED_DIGITS_BOUND + 1e-9,
                    "line " + b.sourceLine[i] + ": S(296 K) from A / S − 1 = " + rel);
        }
    }
}
