package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * The ingest and lines commands end to end on the real HITRAN2020 record samples (../shared/reference-data; see
 * the README there): exit codes, one-line errors, unknown isotopologues made known by user metadata.
 */
class IngestAndLinesCommandTest {
    @TempDir
    Path tmp;

    private record Run(int code, String out, String err) {
        List<String> errLines() {
            return err.isBlank() ? List.of() : List.of(err.strip().split("\\R"));
        }
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), args);
        return new Run(code, out.toString(), err.toString());
    }

    private static Path sample(String name) {
        return ReferenceSamples.hitranSample(name);
    }

    @Test
    void ingestThenListAsCsv() {
        Path store = tmp.resolve("store");
        Run ingest = run("ingest", sample("sample_CO.par").toString(), "--store", store.toString());
        assertEquals(0, ingest.code(), ingest.err());
        assertTrue(ingest.out().contains("5381 records read, 5381 kept"), ingest.out());

        // CO 1-0 R(0) at 2147.081 cm-1 (band origin 2143.27 + 2B; common practice) lies in this window.
        Run lines = run("lines", store.toString(), "--between", "2147.0", "2147.2", "--molecule", "CO",
                "--isotopologue", "1", "--format", "csv");
        assertEquals(0, lines.code(), lines.err());
        String[] rows = lines.out().split("\n");
        assertTrue(rows[0].startsWith("molecule,isotopologue,wavenumber_cm1,"), rows[0]);
        assertTrue(rows.length >= 2);
        assertTrue(rows[1].startsWith("5,1,2147.08"), rows[1]);
    }

    @Test
    void badRecordIsOneLineAndExitCode2() throws Exception {
        List<String> records = new ArrayList<>(Files.readAllLines(sample("sample_CO.par"), StandardCharsets.ISO_8859_1)
                .subList(0, 20));
        String r = records.get(4);
        records.set(4, r.substring(0, 15) + " 1.234Q-20" + r.substring(25));
        Path bad = tmp.resolve("bad.par");
        Files.write(bad, records, StandardCharsets.ISO_8859_1);
        Run ingest = run("ingest", bad.toString(), "--store", tmp.resolve("s").toString());
        assertEquals(2, ingest.code());
        assertEquals(1, ingest.errLines().size(), ingest.err());
        String line = ingest.errLines().get(0);
        assertTrue(line.contains("bad.par:5") && line.contains("cols 16-25") && line.contains("1.234Q-20"), line);
    }

    @Test
    void unknownIsotopologueNeedsUserMetadata() throws Exception {
        // CO with isotopologue code 9: not in the built-in registry (which knows CO 1-6).
        String r = Files.readAllLines(sample("sample_CO.par"), StandardCharsets.ISO_8859_1).get(0);
        Path file = tmp.resolve("co9.par");
        Files.writeString(file, r.substring(0, 2) + "9" + r.substring(3) + "\n", StandardCharsets.ISO_8859_1);
        Run strict = run("ingest", file.toString(), "--store", tmp.resolve("s").toString());
        assertEquals(2, strict.code());
        assertEquals(1, strict.errLines().size(), strict.err());
        assertTrue(strict.err().contains("metadata"), strict.err());

        // 14C16O: mass 14.003242 + 15.994915 = 29.998157 u (AME2020 nuclide masses, from memory); abundance and Q
        // invented for the test (14C is not in the built-in nuclide table, so the mass is given).
        Path meta = tmp.resolve("extra.tsv");
        Files.writeString(meta, String.join("\t", "molecule_id", "molecule", "molecule_name", "isotopologue", "code",
                "isotope_formula", "aliases", "abundance", "q296", "mass_g_per_mol", "catalog_tags", "provenance") + "\n"
                + String.join("\t", "5", "CO", "carbon monoxide", "9", "46", "14C-16O", "-", "1e-12", "110.0", "29.998157", "-",
                "test") + "\n");
        Run known = run("ingest", file.toString(), "--store", tmp.resolve("s").toString(), "--molecule-data", meta.toString());
        assertEquals(0, known.code(), known.err());
    }

    @Test
    void missingStoreAndBadOptionsAreOneLineErrors() {
        Run missing = run("lines", tmp.resolve("no-store").toString());
        assertEquals(2, missing.code());
        assertEquals(1, missing.errLines().size(), missing.err());
        Run badFormat = run("ingest", "x.par", "--store", tmp.toString(), "--input-format", "fits");
        assertEquals(2, badFormat.code());
        assertEquals(1, badFormat.errLines().size(), badFormat.err());
    }
}
