package org.linewright.reference.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.Map;
import java.util.function.Function;
import java.util.stream.Collectors;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.input.LineListInput;

/** The built-in reference lines found in the real HITRAN2020 samples at their published positions. */
class ReferencePositionTest {
    private static final double GHZ_PER_CM1 = 29.9792458; // c in units of GHz·cm (exact, SI definition)

    private static Map<String, ReferenceMatch> matches(String sample) throws IOException {
        try (LineListInput in = LineListInput.open(ReferenceSamples.hitranSample(sample), MoleculeRegistry.builtIn())) {
            VerificationReport report = new LineListVerifier(MoleculeRegistry.builtIn(), ReferenceLines.builtIn(),
                    VerifyOptions.defaults()).verify(in.store(), sample);
            return report.references().stream().collect(Collectors.toMap(m -> m.reference().label(), Function.identity()));
        }
    }

    /** PH3 J=1-0: 266.9445 GHz, the 1.123 mm line (common practice), at 8.9043 cm-1 in the PH3 sample. */
    @Test
    void phosphineJ1To0() throws IOException {
        ReferenceMatch m = matches("sample_PH3.par").get("PH3 J=1-0");
        assertEquals(ReferenceMatch.Status.FOUND, m.status());
        assertEquals(8.9043, m.wavenumberCm1(), 0.5e-4);
        assertEquals(266.9445, m.wavenumberCm1() * GHZ_PER_CM1, 0.0005);
        // 1.123 mm (common practice): λ = 1/ν̃
        assertEquals(1.123, 10.0 / m.wavenumberCm1(), 0.0005);
    }

    /**
     * CO rotational lines (from memory: 115.2712018, 230.538, 345.7959899 GHz; 13CO 110.2013543 GHz, C18O
     * 109.7821734 GHz) and CO 1-0 wavenumber standards (from memory: R(0) 2147.0812, P(1) 2139.4261,
     * R(1) 2150.856, P(2) 2135.546 cm-1) in the CO sample.
     */
    @Test
    void carbonMonoxideReferences() throws IOException {
        Map<String, ReferenceMatch> m = matches("sample_CO.par");
        Object[][] expected = {
            {"CO J=1-0", 115.2712018 / GHZ_PER_CM1, 0.0001 / GHZ_PER_CM1},
            {"CO J=2-1", 230.538 / GHZ_PER_CM1, 0.001 / GHZ_PER_CM1},
            {"CO J=3-2", 345.7959899 / GHZ_PER_CM1, 0.0001 / GHZ_PER_CM1},
            {"13CO J=1-0", 110.2013543 / GHZ_PER_CM1, 0.0005 / GHZ_PER_CM1},
            {"C18O J=1-0", 109.7821734 / GHZ_PER_CM1, 0.0005 / GHZ_PER_CM1},
            {"CO 1-0 R(0)", 2147.0812, 0.001},
            {"CO 1-0 P(1)", 2139.4261, 0.001},
            {"CO 1-0 R(1)", 2150.856, 0.001},
            {"CO 1-0 P(2)", 2135.546, 0.001},
        };
        for (Object[] e : expected) {
            ReferenceMatch match = m.get((String) e[0]);
            assertEquals(ReferenceMatch.Status.FOUND, match.status(), (String) e[0]);
            assertEquals((double) e[1], match.wavenumberCm1(), (double) e[2], (String) e[0]);
        }
        // species absent from the CO sample are not failures
        assertEquals(ReferenceMatch.Status.NOT_COVERED, m.get("PH3 J=1-0").status());
        assertTrue(m.values().stream().allMatch(x -> x.status().passes()));
    }
}
