package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * {@code linewright verify} and {@code linewright compare} on the real HITRAN2020 samples and on modified copies of
 * them in a temporary folder: exit codes 0/1/2, reports, plots and one-line errors.
 */
class VerifyCompareCommandsTest {
    @TempDir
    Path temp;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), args);
        return new Run(code, out.toString(), err.toString());
    }

    /** A HITRAN2020 sample, or a visible skip when the shared reference data are absent. */
    private static Path sample(String name) {
        return ReferenceSamples.hitranSample(name);
    }

    /** Columns 16–25 of a 160-character record hold S as E10.3 (common practice). */
    private static String doubled(String record) {
        double s = Double.parseDouble(record.substring(15, 25).trim());
        return record.substring(0, 15) + String.format(Locale.ROOT, "%10.3E", 2 * s) + record.substring(25);
    }

    private Path writeGarbage() {
        try {
            return Files.writeString(temp.resolve("garbage.par"), "this is not a line list\n");
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private static void assertOneErrorLine(Run r) {
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        String[] lines = r.err().strip().split("\\R");
        assertEquals(1, lines.length, r.err());
        assertTrue(lines[0].startsWith("linewright: error: "), r.err());
    }

    /** The PH3 sample passes (samples README: every record obeys the S–A relation), exit code 0. */
    @Test
    void verifyPassesOnARealSample() {
        Run r = run("verify", sample("sample_PH3.par").toString());
        assertEquals(ExitCodes.OK, r.code(), r.err() + r.out());
        assertTrue(r.out().contains("result: PASSED"), r.out());
        // PH3 J=1-0 at 266.9445 GHz = 8.9043 cm-1 (common practice)
        assertTrue(r.out().lines().anyMatch(l -> l.contains("PH3 J=1-0") && l.contains("found") && l.contains("8.9043")),
                r.out());
    }

    /**
     * Every real sample passes with exit code 0 (samples README: every record obeys the S–A relation within 7e-4
     * with the registry's values), in default and in strict mode, and the report states its consistency figure.
     */
    @ParameterizedTest
    @ValueSource(strings = {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"})
    void everyRealSamplePassesWithExitCode0(String name) {
        Run r = run("verify", sample(name).toString());
        assertEquals(ExitCodes.OK, r.code(), r.err() + r.out());
        assertTrue(r.out().contains("result: PASSED (0 errors, 0 warnings, 0 notes)"), r.out());
        assertTrue(r.out().contains("internal consistency of S and A: robust spread of S/S(A) - 1 "), r.out());
        Run strict = run("verify", sample(name).toString(), "--strict");
        assertEquals(ExitCodes.OK, strict.code(), strict.err() + strict.out());
    }

    /**
     * A registry disagreement of 0.6 % (every PH3 intensity × 1.006, re-rounded as E10.3) is a warning (exit 0) by
     * default and an error (exit 1) with {@code --strict} (fixed tolerance 5e-3).
     */
    @Test
    void registryWarningPassesUnlessStrict() throws IOException {
        List<String> records = new ArrayList<>(Files.readAllLines(sample("sample_PH3.par"), StandardCharsets.US_ASCII));
        records.replaceAll(r -> r.substring(0, 15) + String.format(Locale.ROOT, "%10.3E",
                1.006 * Double.parseDouble(r.substring(15, 25).trim())) + r.substring(25));
        Path file = Files.write(temp.resolve("ph3.par"), records, StandardCharsets.US_ASCII);
        Run r = run("verify", file.toString());
        assertEquals(ExitCodes.OK, r.code(), r.out());
        assertTrue(r.out().contains("(0 errors, 1 warning, 0 notes)"), r.out());
        assertTrue(r.out().lines().anyMatch(l -> l.contains("warning") && l.contains("registry-values")), r.out());
        assertEquals(ExitCodes.CHECK_FOUND_PROBLEMS, run("verify", file.toString(), "--strict").code());
    }

    /** One doubled intensity: exit code 1, the JSON report names that record; the plot is a PNG. */
    @Test
    void verifyFlagsADoubledIntensity() throws IOException {
        List<String> records = new ArrayList<>(Files.readAllLines(sample("sample_CO.par"), StandardCharsets.US_ASCII));
        records.set(99, doubled(records.get(99)));
        Path file = Files.write(temp.resolve("co.par"), records, StandardCharsets.US_ASCII);
        Path report = temp.resolve("out/report.json");
        Path plot = temp.resolve("out/residuals.png");
        Run r = run("verify", file.toString(), "--report-format", "json", "--report", report.toString(), "--plot", plot.toString());
        assertEquals(ExitCodes.CHECK_FOUND_PROBLEMS, r.code(), r.err());
        String json = Files.readString(report);
        assertTrue(json.contains("\"passed\": false"), json);
        assertTrue(json.contains("\"check\": \"intensity-relation\"") && json.contains("\"source_line\": 100,"), json);
        byte[] png = Arrays.copyOf(Files.readAllBytes(plot), 8);
        // PNG signature (ISO/IEC 15948)
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G', 0x0d, 0x0a, 0x1a, 0x0a}, png);
    }

    @Test
    void verifyBadInputIsOneLineAndExitCode2() throws IOException {
        assertOneErrorLine(run("verify", temp.resolve("missing.par").toString()));
        assertOneErrorLine(run("verify", sample("sample_PH3.par").toString(), "--report-format", "xml"));
        Path badReference = Files.writeString(temp.resolve("refs.tsv"), String.join("\t",
                org.linewright.reference.data.ReferenceLines.COLUMNS) + "\nrotational\t5\t1\t1\t0\t-\t-\t-\tabc\tGHz\t0.001\tx\tfrom memory\n");
        Run r = run("verify", sample("sample_PH3.par").toString(), "--reference", badReference.toString());
        assertOneErrorLine(r);
        assertTrue(r.err().contains("refs.tsv:2") && r.err().contains("position"), r.err());
    }

    /**
     * A user's reference file is read with the built-in set: a CO J=1-0 entry 10 MHz off the rest frequency
     * (115.2712018 GHz, from memory) with a 1 MHz tolerance is found misplaced, exit code 1.
     */
    @Test
    void userReferenceLinesAreChecked() throws IOException {
        Path refs = Files.writeString(temp.resolve("my-lines.tsv"), "# test\n"
                + String.join("\t", org.linewright.reference.data.ReferenceLines.COLUMNS) + "\n"
                + "rotational\t5\t1\t1\t0\t-\t0\t0\t115.2812018\tGHz\t0.001\tCO J=1-0 shifted\tfrom memory, shifted by 10 MHz\n");
        Run r = run("verify", sample("sample_CO.par").toString(), "--reference", refs.toString());
        assertEquals(ExitCodes.CHECK_FOUND_PROBLEMS, r.code(), r.err() + r.out());
        assertTrue(r.out().lines().anyMatch(l -> l.contains("CO J=1-0 shifted") && l.contains("offset")), r.out());
        assertTrue(r.out().contains("reference-position   1 finding(s)"), r.out());
    }

    /** Shift one line by 0.01 cm-1, remove one, add one: exit code 1 and exactly three CSV rows. */
    @Test
    void compareReportsExactlyThePlantedChanges() throws IOException {
        List<String> records = Files.readAllLines(sample("sample_N2O.par"), StandardCharsets.US_ASCII);
        List<String> newer = new ArrayList<>(records);
        String shifted = newer.get(500);
        double nu = Double.parseDouble(shifted.substring(3, 15).trim());
        newer.set(500, shifted.substring(0, 3) + String.format(Locale.ROOT, "%12.6f", nu + 0.01) + shifted.substring(15));
        newer.remove(3000);
        List<String> older = new ArrayList<>(records);
        older.remove(4000);
        Path oldFile = Files.write(temp.resolve("old.par"), older, StandardCharsets.US_ASCII);
        Path newFile = Files.write(temp.resolve("new.par"), newer, StandardCharsets.US_ASCII);
        Path report = temp.resolve("changes.csv");

        Run r = run("compare", oldFile.toString(), newFile.toString(), "--report-format", "csv", "--report", report.toString());
        assertEquals(ExitCodes.CHECK_FOUND_PROBLEMS, r.code(), r.err());
        List<String> rows = Files.readAllLines(report);
        assertEquals(4, rows.size(), rows.toString());
        assertTrue(rows.stream().anyMatch(l -> l.startsWith("changed,quanta,") && l.contains(",wavenumber_cm1,")), rows.toString());
        assertTrue(rows.stream().anyMatch(l -> l.startsWith("added,")), rows.toString());
        assertTrue(rows.stream().anyMatch(l -> l.startsWith("removed,")), rows.toString());

        // deprecated spellings (DEVELOPERS.md, "Naming"): same report, one note each on standard error
        Run renamed = run("compare", oldFile.toString(), newFile.toString(), "--max-shift", "0.2cm-1", "--pair-within",
                "0.002cm-1", "--report-format", "csv");
        Run deprecated = run("compare", oldFile.toString(), newFile.toString(), "--window", "0.2cm-1", "--tolerance",
                "0.002cm-1", "--format", "csv");
        assertEquals(renamed.code(), deprecated.code(), deprecated.err());
        assertEquals(renamed.out(), deprecated.out());
        String noted = deprecated.err();
        for (String n : new String[] {"--window is deprecated, write --max-shift",
                "--tolerance is deprecated, write --pair-within", "--format is deprecated, write --report-format"}) {
            assertTrue(noted.contains(n), noted);
        }

        Run same = run("compare", oldFile.toString(), oldFile.toString());
        assertEquals(ExitCodes.OK, same.code(), same.err());
        assertTrue(same.out().contains("0 changed, 0 added, 0 removed"), same.out());
    }

    /** Line stores written by {@code linewright ingest} are verified and compared as they are. */
    @Test
    void storesAreAcceptedAsTheyAre() {
        Path store = temp.resolve("store");
        Run ingest = run("-q", "ingest", sample("sample_CO2.par").toString(), "--store", store.toString());
        assertEquals(ExitCodes.OK, ingest.code(), ingest.err());
        Run verify = run("verify", store.toString(), "--report-format", "csv");
        assertEquals(ExitCodes.OK, verify.code(), verify.err() + verify.out());
        // CO2 sample: 5492 records (samples README)
        assertTrue(verify.out().contains("summary,passed,,,,,lines,5492,"), verify.out());
        Run compare = run("compare", store.toString(), sample("sample_CO2.par").toString());
        assertEquals(ExitCodes.OK, compare.code(), compare.err() + compare.out());
        assertTrue(compare.out().contains("5492 unchanged, 0 changed, 0 added, 0 removed"), compare.out());
    }

    /**
     * {@code compare --plan}: the CO 1-0 R(0) line of the real CO sample (2147.081134 cm-1) with its intensity
     * doubled reaches only the block around it, and there σ changes by a factor close to 2 at the grid point
     * nearest the line (σ is linear in S, common practice; the line dominates near its centre).
     */
    @Test
    void comparePlanReportsTheCellsReached() throws IOException {
        List<String> records = new ArrayList<>(Files.readAllLines(sample("sample_CO.par"), StandardCharsets.US_ASCII));
        int index = -1;
        for (int i = 0; i < records.size(); i++) {
            if (records.get(i).substring(3, 15).trim().equals("2147.081134")) {
                index = i;
            }
        }
        assertTrue(index >= 0, "the CO sample holds R(0) of the 1-0 band");
        List<String> newer = new ArrayList<>(records);
        newer.set(index, doubled(newer.get(index)));
        Path newFile = Files.write(temp.resolve("co-new.par"), newer, StandardCharsets.US_ASCII);
        Path plan = Files.writeString(temp.resolve("plan.toml"), String.join("\n",
                "[lines]",
                "sources = [\"co-new.par\"]",
                "[grid]",
                "wavenumber = { from = 2100.0, to = 2200.0, step = 0.01 }",
                "pressures_bar = [1e-3, 1.0]",
                "temperatures_K = [296.0]",
                "[background]",
                "air = 1.0",
                "[profile]",
                "engine = \"exact\"",
                "cutoff_cm1 = 1.0",
                "[build]",
                "block_points = 2000",
                "[output]",
                "table = \"unused.arrow\"", ""));
        Path report = temp.resolve("plan-report.json");
        Run r = run("compare", sample("sample_CO.par").toString(), newFile.toString(), "--plan", plan.toString(),
                "--threads", "1", "--report-format", "json", "--report", report.toString());
        assertEquals(ExitCodes.CHECK_FOUND_PROBLEMS, r.code(), r.err());
        String json = Files.readString(report);
        // blocks of 2000 points (20 cm-1) from 2100 cm-1: 2147.08 lies in block 2, more than the reach from its edges
        assertEquals(2, json.split("\"block\": 2,", -1).length - 1, json);
        assertEquals(2, json.split("\"block\": ", -1).length - 1, "one cell per pressure: " + json);
        for (String cell : json.substring(json.indexOf("\"plan_cells\"")).split("\\{")) {
            if (cell.contains("max_relative_change")) {
                double rel = Double.parseDouble(cell.replaceAll("(?s).*\"max_relative_change\": ([^,]+),.*", "$1"));
                double at = Double.parseDouble(cell.replaceAll("(?s).*\"at_wavenumber_cm1\": ([^}]+)}.*", "$1"));
                assertTrue(rel > 0.5 && rel < 1.0 + 1e-9, cell);
                assertEquals(2147.08, at, 0.02, cell);
            }
        }
    }

    /**
     * {@code compare --plan} and the rebuild of the same plan agree on the cells a change reaches: the real CO sample
     * with the intensities of lines near 2120, 2147 and 2183 cm-1 doubled; the cells the dry run would compute, those
     * the rebuild updated from the changed lines and those compare reports are the same set.
     */
    @Test
    void compareAndTheRebuildReachTheSameCells() throws IOException {
        List<String> records = new ArrayList<>(Files.readAllLines(sample("sample_CO.par"), StandardCharsets.US_ASCII));
        List<String> newer = new ArrayList<>(records);
        int doubledLines = 0;
        for (int i = 0; i < records.size(); i++) {
            double nu = Double.parseDouble(records.get(i).substring(3, 15).trim());
            if (Math.abs(nu - 2120) < 0.6 || Math.abs(nu - 2147) < 0.6 || Math.abs(nu - 2183) < 0.6) {
                newer.set(i, doubled(records.get(i)));
                doubledLines++;
            }
        }
        assertTrue(doubledLines >= 3, "lines near the three positions: " + doubledLines);
        Path newFile = Files.write(temp.resolve("co-new.par"), newer, StandardCharsets.US_ASCII);
        Path d = Files.createDirectories(temp.resolve("agree"));
        Files.copy(sample("sample_CO.par"), d.resolve("co.par"));
        Path plan = Files.writeString(d.resolve("plan.toml"), String.join("\n",
                "[lines]", "sources = [\"co.par\"]", "[grid]", "wavenumber = { from = 2100.0, to = 2200.0, step = 0.01 }",
                "pressures_bar = [1e-3, 1.0]", "temperatures_K = [296.0, 900.0]", "[background]", "air = 1.0",
                "[profile]", "engine = \"exact\"", "cutoff_cm1 = 1.0", "[build]", "block_points = 1000", "[output]",
                "table = \"t.arrow\"", ""));
        assertEquals(ExitCodes.OK, run("build", plan.toString(), "--threads", "1").code());
        Files.copy(newFile, d.resolve("co.par"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        Run dry = run("build", plan.toString(), "--dry-run");
        java.util.Set<String> rebuilt = new java.util.TreeSet<>();
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("compute p=([^ ]+) bar, T=([^ ]+) K, ([0-9.]+)-")
                .matcher(dry.out());
        while (m.find()) {
            rebuilt.add(cellName(m.group(1), m.group(2), m.group(3)));
        }
        Path report = temp.resolve("agree.json");
        run("compare", sample("sample_CO.par").toString(), newFile.toString(), "--plan", plan.toString(),
                "--threads", "1", "--report-format", "json", "--report", report.toString());
        java.util.Set<String> compared = new java.util.TreeSet<>();
        m = java.util.regex.Pattern.compile("\"pressure_bar\": ([^,]+), \"temperature_K\": ([^,]+), \"block\": [0-9]+, "
                + "\"from_cm1\": ([^,]+),").matcher(Files.readString(report));
        while (m.find()) {
            compared.add(cellName(m.group(1), m.group(2), m.group(3)));
        }
        assertTrue(rebuilt.size() >= 3 * 4 && rebuilt.size() < 10 * 4, dry.out());
        assertEquals(rebuilt, compared);
        Run build = run("build", plan.toString(), "--threads", "2");
        assertTrue(build.out().contains(rebuilt.size() + " block(s) were updated from them, 0 computed afresh"),
                build.out());
    }

    private static String cellName(String pressureBar, String temperatureK, String fromCm1) {
        return Double.parseDouble(pressureBar) + " bar " + Double.parseDouble(temperatureK) + " K "
                + String.format(Locale.ROOT, "%.4f", Double.parseDouble(fromCm1));
    }

    @Test
    void compareBadInputIsOneLineAndExitCode2() {
        assertOneErrorLine(run("compare", temp.resolve("a.par").toString(), temp.resolve("b.par").toString()));
        assertOneErrorLine(run("compare", temp.toString(), temp.toString()));
        assertOneErrorLine(run("compare", "x", "y", "--max-shift", "-1 cm-1"));
        Run r = run("compare", sample("sample_CO.par").toString(), writeGarbage().toString());
        assertOneErrorLine(r);
        assertTrue(r.err().contains("garbage.par"), r.err());
    }
}
