package org.linewright.ingest.exomol;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;

/** File-set conventions, broadening and partition-function tables, and whole-file errors (synthetic files). */
class ExomolFilesTest {
    @TempDir
    Path dir;

    private void touch(String... names) throws IOException {
        for (String n : names) {
            Files.writeString(dir.resolve(n), "");
        }
    }

    @Test
    void locatesEveryFileOfTheSetFromAnyOfThem() throws IOException {
        touch("12C-16O__Synth.states.bz2", "12C-16O__Synth__00100-00200.trans.bz2", "12C-16O__Synth__00000-00100.trans.bz2",
                "12C-16O__Synth.pf", "12C-16O__Synth.def", "12C-16O__H2.broad", "12C-16O__Synth__He.broad",
                "12C-16O__Other.states", "12C-16O__Other.trans", "README.txt");
        for (String start : List.of("12C-16O__Synth.pf", "12C-16O__Synth__00100-00200.trans.bz2", "12C-16O__Synth.def",
                "12C-16O__Synth.states.bz2", "12C-16O__Synth__He.broad")) {
            ExomolFileSet set = ExomolFileSet.locate(dir.resolve(start));
            assertEquals("12C-16O__Synth", set.name(), start);
            assertEquals("12C-16O", set.isotopeFormula());
            assertEquals("12C-16O__Synth.states.bz2", set.states().getFileName().toString());
            assertEquals(List.of("12C-16O__Synth__00000-00100.trans.bz2", "12C-16O__Synth__00100-00200.trans.bz2"),
                    set.transitions().stream().map(p -> p.getFileName().toString()).toList());
            assertEquals(List.of("H2", "He"), List.copyOf(set.broadening().keySet()));
        }
        // a broadening file named by the isotopologue alone fits two sets here: the user must say which
        LineFormatException e = assertThrows(LineFormatException.class, () -> ExomolFileSet.locate(dir.resolve("12C-16O__H2.broad")));
        assertTrue(e.getMessage().contains("fits two sets"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> ExomolFileSet.locate(dir.resolve("README.txt")));
        assertTrue(e.getMessage().startsWith("README.txt: not a file of a state/transition set"), e.getMessage());
    }

    @Test
    void sameFileUnderTwoCompressionsIsAnError() throws IOException {
        touch("12C-16O__D.states", "12C-16O__D.states.gz", "12C-16O__D.trans");
        LineFormatException e = assertThrows(LineFormatException.class, () -> ExomolFileSet.locate(dir.resolve("12C-16O__D.trans")));
        assertTrue(e.getMessage().startsWith("12C-16O__D.states: found twice"), e.getMessage());
    }

    private static BroadeningTable broad(String text) throws IOException {
        return BroadeningTable.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.US_ASCII)), "x.broad", "H2");
    }

    @Test
    void broadeningTableLookupAndErrors() throws IOException {
        BroadeningTable t = broad("a0 0.0800 0.500 0.5\na0 0.0700 0.450 2.5\n");
        assertEquals(0.08, t.widthAt(0.5), 0.0);
        assertEquals(0.07, t.widthAt(7.5), 0.0); // above the table: last row
        assertTrue(Double.isNaN(t.widthAt(1.5))); // gap without default
        assertEquals(0.45, t.exponentAt(2.5), 0.0);

        LineFormatException e = assertThrows(LineFormatException.class, () -> broad("a0 0.08 0.5 1\nm0 0.07 0.4 2\n"));
        assertEquals("x.broad:2:cols 1-2: field code: \"m0\" (expected a0 or a1 (broadening by J'' only))", e.getMessage());
        e = assertThrows(LineFormatException.class, () -> broad("a1 0.08 0.5 1 2\n"));
        assertTrue(e.getMessage().contains("broadening by further quantum numbers is not supported"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> broad("a1 0.08 0.5 1\na1 0.07 0.5 1\n"));
        assertTrue(e.getMessage().startsWith("x.broad:2: field J'': \"1.0\" (expected each J'' once (also on line 1))"),
                e.getMessage());
        e = assertThrows(LineFormatException.class, () -> broad("a1 0.08 0.5 1.3\n"));
        assertEquals("x.broad:1:cols 13-15: field J'': \"1.3\" (expected an integer or half-integer J'' >= 0)", e.getMessage());
    }

    @Test
    void duplicateStateIdsAndTransitionsBelowTheirLowerStateAreErrors() throws IOException {
        CarbonMonoxideLookup registry = new CarbonMonoxideLookup();
        Files.writeString(dir.resolve("12C-16O__Dup.states"), "1 0.0 1 0\n2 3.845033 3 1\n1 11.534953 5 2\n");
        Files.writeString(dir.resolve("12C-16O__Dup.trans"), "2 1 7.207e-08\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> ExomolReader.open(
                dir.resolve("12C-16O__Dup.states"), Files::newInputStream, ReadOptions.strict(registry)));
        assertEquals("12C-16O__Dup.states: state id 1 appears twice (expected unique ids)", e.getMessage());

        Files.writeString(dir.resolve("12C-16O__Neg.states"), "1 0.0 1 0\n2 3.845033 3 1\n");
        Files.writeString(dir.resolve("12C-16O__Neg.trans"), "1 2 7.207e-08\n");
        e = assertThrows(LineFormatException.class, () -> {
            try (ExomolReader r = ExomolReader.open(dir.resolve("12C-16O__Neg.states"), Files::newInputStream,
                    ReadOptions.strict(registry))) {
                r.read(new org.linewright.ingest.line.LineBatch(4));
            }
        });
        assertEquals("12C-16O__Neg.trans:1:cols 1-3: field state ids: \"1 2 7.207e-08\" (expected an upper state above "
                + "the lower state (E' = 0.0, E'' = 3.845033 cm-1))", e.getMessage());
    }
}
