package org.linewright.reference.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.LineFormatException;

class ReferenceLinesTest {
    private static final String HEADER = String.join("\t", ReferenceLines.COLUMNS) + "\n";

    private static List<ReferenceLine> parse(String text) throws IOException {
        return ReferenceLines.parse(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), "refs.tsv");
    }

    /** Every built-in value names its source, and its isotopologue exists in the registry. */
    @Test
    void builtInLinesCarrySourcesAndKnownIsotopologues() {
        List<ReferenceLine> lines = ReferenceLines.builtIn();
        assertTrue(lines.size() >= 15, "the brief's list plus further lines");
        for (ReferenceLine l : lines) {
            assertTrue(l.source().contains("from memory") || l.source().contains("common practice")
                    || l.source().matches(".*\\d{4}.*"), l.label() + ": " + l.source());
            assertTrue(MoleculeRegistry.builtIn().isotopologue(l.moleculeId(), l.isotopologue()) != null, l.label());
        }
    }

    /**
     * GHz to cm-1 by ν̃ = f/c with c = 299 792 458 m/s exactly (SI definition): CO J=1-0, 115.2712018 GHz
     * (from memory), is 3.845033 cm-1 to 7 digits.
     */
    @Test
    void frequenciesAreConvertedWithTheSpeedOfLight() throws IOException {
        List<ReferenceLine> l = parse(HEADER
                + "rotational\t5\t1\t1\t0\t-\t0\t0\t115.2712018\tGHz\t0.0001\tCO J=1-0\tfrom memory\n"
                + "rotational\t5\t1\t1\t0\t-\t-\t-\t115271.2018\tMHz\t0.1\tCO J=1-0 MHz\tfrom memory\n"
                + "wavenumber-standard\t5\t1\t1\t0\t-\t 1 \t0\t2147.0812\tcm-1\t0.001\tCO R(0)\tfrom memory\n");
        assertEquals(3, l.size());
        assertEquals(115.2712018e9 / 2.99792458e10, l.get(0).wavenumberCm1(), 1e-15);
        assertEquals(3.8450334, l.get(0).wavenumberCm1(), 1e-7);
        assertEquals(l.get(0).wavenumberCm1(), l.get(1).wavenumberCm1(), 1e-12);
        assertEquals(0.1e6 / 2.99792458e10, l.get(1).toleranceCm1(), 1e-18);
        assertEquals(2147.0812, l.get(2).wavenumberCm1(), 0.0);
        assertEquals("1", l.get(2).upperGlobal());
        assertEquals("", l.get(1).upperGlobal());
        assertTrue(Double.isNaN(l.get(0).upperK()));
        assertTrue(l.get(0).hasQuantumNumbers());
    }

    @Test
    void malformedRowsAreLocated() {
        LineFormatException e = assertThrows(LineFormatException.class, () -> parse(HEADER
                + "rotational\t5\t1\t1\t0\t-\t0\t0\t115.27\tTHz\t0.0001\tCO\tfrom memory\n"));
        assertTrue(e.getMessage().startsWith("refs.tsv:2:"), e.getMessage());
        assertTrue(e.getMessage().contains("field unit") && e.getMessage().contains("\"THz\""), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse(HEADER
                + "rotational\t5\t1\t1.3\t0\t-\t0\t0\t115.27\tGHz\t0.0001\tCO\tfrom memory\n"));
        assertTrue(e.getMessage().contains("field upper_j"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse(HEADER
                + "rotational\t5\t1\t1\t0\t-\t0\t0\t115.27\tGHz\t0.0001\tCO\t-\n"));
        assertTrue(e.getMessage().contains("field source"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse("category\tmolecule\n"));
        assertTrue(e.getMessage().contains("header"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse("# only a comment\n"));
        assertFalse(e.getMessage().isEmpty());
    }
}
