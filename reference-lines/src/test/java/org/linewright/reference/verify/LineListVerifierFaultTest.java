package org.linewright.reference.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.input.LineListInput;
import org.linewright.reference.testsupport.ParFiles;

/** Faults planted in modified copies (in a temporary folder) of the real HITRAN2020 samples are found exactly. */
class LineListVerifierFaultTest {
    @TempDir
    Path temp;

    private static VerificationReport verify(Path file) throws IOException {
        try (LineListInput in = LineListInput.open(file, MoleculeRegistry.builtIn())) {
            return new LineListVerifier(MoleculeRegistry.builtIn(), ReferenceLines.builtIn(), VerifyOptions.defaults())
                    .verify(in.store(), file.getFileName().toString());
        }
    }

    /**
     * One intensity doubled: S = Iₐ·A·g′·…/Q (Šimečková et al. 2006) then deviates by +100 % from the A it is
     * listed with, against the sample's own ±1e-3 (printed digits); exactly that record is flagged.
     */
    @Test
    void doubledIntensityIsFlaggedAtThatLine() throws IOException {
        List<String> records = ParFiles.records(ReferenceSamples.hitranSample("sample_CO.par"));
        int index = 1234;
        String original = records.get(index);
        records.set(index, ParFiles.withIntensity(original, 2 * ParFiles.intensity(original)));
        VerificationReport report = verify(ParFiles.write(temp.resolve("co-doubled.par"), records));

        assertFalse(report.passed());
        assertEquals(1, report.count(Check.INTENSITY_RELATION));
        assertEquals(1, report.totalFindings(), () -> report.findings().toString());
        Finding f = report.findings().get(0);
        assertEquals(index + 1, f.sourceLine(), "1-based record number of the doubled line");
        assertEquals(ParFiles.wavenumber(original), f.wavenumberCm1(), 0.0);
        assertEquals(2 * ParFiles.intensity(original), f.value(), 0.0);
        // expected S is the original one within the printed precision (4 significant digits)
        assertEquals(ParFiles.intensity(original), f.expected(), 1.5e-3 * ParFiles.intensity(original));
    }

    /**
     * Every intensity doubled (as if computed with half the partition sum, e.g. another nuclear-spin convention):
     * the lines agree with each other, so no line is flagged, but the isotopologue's Q(296 K)/abundance is half
     * the registry's (samples README: registry confirmed to 2e-3) and is reported once.
     */
    @Test
    void allIntensitiesScaledIsOneRegistryFinding() throws IOException {
        List<String> records = ParFiles.records(ReferenceSamples.hitranSample("sample_PH3.par"));
        records.replaceAll(r -> ParFiles.withIntensity(r, 2 * ParFiles.intensity(r)));
        VerificationReport report = verify(ParFiles.write(temp.resolve("ph3-doubled.par"), records));
        assertEquals(1, report.count(Check.REGISTRY_VALUES), () -> report.findings().toString());
        assertEquals(0, report.count(Check.INTENSITY_RELATION));
        IsotopologueSummary ph3 = report.isotopologues().get(0);
        assertEquals(-0.5, ph3.registryDeviation(), 2e-3);
    }

    /** A negative E″ (a convention for "unknown" in some lists) and a duplicated record are both reported. */
    @Test
    void negativeLowerEnergyAndDuplicateAreReported() throws IOException {
        List<String> records = ParFiles.records(ReferenceSamples.hitranSample("sample_PH3.par"));
        String duplicated = records.get(100);
        records.add(101, duplicated);
        String r = records.get(2000);
        // E″ field, columns 46–55 (F10.4) of the 160-character format (common practice)
        records.set(2000, r.substring(0, 45) + "   -1.0000" + r.substring(55));
        VerificationReport report = verify(ParFiles.write(temp.resolve("ph3-faults.par"), records));

        assertEquals(1, report.count(Check.DUPLICATE), () -> report.findings().toString());
        assertEquals(1, report.count(Check.LOWER_ENERGY), () -> report.findings().toString());
        assertEquals(2, report.totalFindings(), () -> report.findings().toString());
        for (Finding f : report.findings()) {
            if (f.check() == Check.DUPLICATE) {
                assertEquals(ParFiles.wavenumber(duplicated), f.wavenumberCm1(), 0.0);
            } else {
                assertEquals(2001, f.sourceLine());
                assertEquals(-1.0, f.value(), 0.0);
            }
        }
    }

    /** A reference line moved beyond its tolerance fails the position check. */
    @Test
    void misplacedReferenceLineFails() throws IOException {
        List<String> records = ParFiles.records(ReferenceSamples.hitranSample("sample_PH3.par"));
        boolean moved = false;
        for (int i = 0; i < records.size(); i++) {
            // PH3 J=1-0 at 266.9445 GHz = 8.9043 cm-1 (common practice); move it by +0.01 cm-1
            if (Math.abs(ParFiles.wavenumber(records.get(i)) - 8.9043) < 1e-3) {
                records.set(i, ParFiles.withWavenumber(records.get(i), ParFiles.wavenumber(records.get(i)) + 0.01));
                moved = true;
            }
        }
        assertTrue(moved, "the PH3 sample holds the J=1-0 line");
        VerificationReport report = verify(ParFiles.write(temp.resolve("ph3-moved.par"), records));
        assertEquals(1, report.count(Check.REFERENCE_POSITION), () -> report.findings().toString());
        ReferenceMatch m = report.references().stream().filter(x -> x.reference().label().equals("PH3 J=1-0"))
                .findFirst().orElseThrow();
        assertEquals(ReferenceMatch.Status.OFFSET, m.status());
        assertEquals(0.01, m.offsetCm1(), 2e-5);
    }
}
