package org.linewright.reference.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.input.LineListInput;

/** Verification of the real HITRAN2020 samples (../shared/reference-data/hitran2020-samples, see its README). */
class LineListVerifierSampleTest {
    @TempDir
    Path temp;

    /**
     * Every record of the samples satisfies the S–A relation within ±7 × 10⁻⁴ with the registry's Q(296 K) and
     * abundances (samples README, Šimečková et al. 2006), has E″ ≥ 0, positive weights and no duplicate: each
     * sample must pass.
     */
    @ParameterizedTest
    @ValueSource(strings = {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"})
    void everySamplePasses(String name) throws IOException {
        Path sample = ReferenceSamples.hitranSample(name);
        VerificationReport report;
        try (LineListInput in = LineListInput.open(sample, MoleculeRegistry.builtIn())) {
            report = new LineListVerifier(MoleculeRegistry.builtIn(), ReferenceLines.builtIn(), VerifyOptions.defaults())
                    .verify(in.store(), name);
        }
        assertTrue(report.passed(), () -> name + ": " + report.findingCounts() + " " + report.findings().subList(0,
                Math.min(5, report.findings().size())));
        // a clean published list: not even a warning (the registry values are confirmed by these samples to 2e-3)
        assertEquals(0, report.count(Severity.WARNING), () -> name + ": " + report.findings());
        assertEquals(0, report.count(Severity.NOTE), () -> name + ": " + report.findings());
        // internal consistency: every record within 7e-4 of the relation (README), so the median |S/S(A) - 1|
        // (robust spread / 1.4826) lies below that, and the 99th percentile too (within 1.5e-4 of each consensus)
        Consistency c = report.consistency();
        assertTrue(c.robustSpread() / 1.4826 < 7e-4, name + " " + c);
        assertTrue(c.deviation99() < 7e-4 + 1.5e-4, name + " " + c);

        assertTrue(report.lines() > 4000, "the samples hold 4424-5492 records (README)");
        for (IsotopologueSummary s : report.isotopologues()) {
            assertEquals(s.lines(), s.relationChecked(), "every sample record carries S and A: " + s.key());
            // S and A printed to 4 significant digits: each line within 1e-3 of the relation (rounding bound,
            // common practice), and the median of a few hundred such lines within 5e-4 of the true value
            assertTrue(s.maxAbsDeviation() <= 1.5e-3, s.key() + " " + s.maxAbsDeviation());
            // the registry's Q(296 K) and abundances are confirmed by these samples to 2e-3 (samples README)
            assertTrue(Math.abs(s.registryDeviation()) <= 2e-3, s.key() + " " + s.registryDeviation());
            // the digits the records carry, counted in the record text (mantissa of the E10.3 fields without
            // trailing zeros; columns 16-25 and 26-35, common practice): 4, except that the sample's 13C16O2
            // intensities all end in 0
            assertEquals(textDigits(sample, s.isotopologue(), 15, 25), s.intensityDigits(), s.key());
            assertEquals(textDigits(sample, s.isotopologue(), 25, 35), s.einsteinADigits(), s.key());
        }
        List<ReferenceMatch> refs = report.references();
        assertEquals(ReferenceLines.builtIn().size(), refs.size());
    }

    /** Largest count of significant digits in the mantissas of one field of an isotopologue's records. */
    private static int textDigits(Path file, int isotopologue, int from, int to) throws IOException {
        int max = 0;
        for (String r : java.nio.file.Files.readAllLines(file)) {
            if (r.charAt(2) - '0' != isotopologue) {
                continue;
            }
            String mantissa = r.substring(from, to).trim().split("[Ee]")[0].replace(".", "").replace("-", "");
            mantissa = mantissa.replaceAll("^0+", "").replaceAll("0+$", "");
            max = Math.max(max, mantissa.length());
        }
        return max;
    }
}
