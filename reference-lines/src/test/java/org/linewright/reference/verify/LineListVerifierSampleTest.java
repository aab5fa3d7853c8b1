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
        assertTrue(report.lines() > 4000, "the samples hold 4424-5492 records (README)");
        for (IsotopologueSummary s : report.isotopologues()) {
            assertEquals(s.lines(), s.relationChecked(), "every sample record carries S and A: " + s.key());
            // S and A printed to 4 significant digits: each line within 1e-3 of the relation (rounding bound,
            // common practice), and the median of a few hundred such lines within 5e-4 of the true value
            assertTrue(s.maxAbsDeviation() <= 1.5e-3, s.key() + " " + s.maxAbsDeviation());
            // the registry's Q(296 K) and abundances are confirmed by these samples to 2e-3 (samples README)
            assertTrue(Math.abs(s.registryDeviation()) <= 2e-3, s.key() + " " + s.registryDeviation());
        }
        List<ReferenceMatch> refs = report.references();
        assertEquals(ReferenceLines.builtIn().size(), refs.size());
    }
}
