package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import io.jhdf.HdfFile;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * {@code linewright sigma} end to end on the HITRAN2020 CO sample (Gordon et al. 2022, JQSRT 277, 107949; read
 * from {@code ../shared/reference-data/hitran2020-samples/}, skipped visibly when absent).
 */
class SigmaCommandTest {

    @TempDir
    static Path tmp;
    static Path sample;
    static Path store;

    private record Run(int code, String out, String err) {
        String[] errLines() {
            return err.isEmpty() ? new String[0] : err.split("\\R");
        }
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void ingest() {
        sample = ReferenceSamples.hitranSample("sample_CO.par");
        store = tmp.resolve("store");
        Run r = run("ingest", sample.toString(), "--store", store.toString(), "-q");
        assertEquals(0, r.code(), r.err());
    }

    @Test
    void csvEndToEndHasTheHeaderAndTheSampleIntensity() throws IOException {
        Path csv = tmp.resolve("co.csv");
        Run r = run("sigma", store.toString(), "--temperature", "296", "--pressure", "1atm", "--background", "air=1",
                "--between", "2000", "2200", "--step", "0.01", "--threads", "2", "--out", csv.toString(),
                "--plot", tmp.resolve("co.png").toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("lines used: "), r.out());
        assertTrue(r.out().contains("time: "), r.out());
        List<String> lines = Files.readAllLines(csv, StandardCharsets.US_ASCII);
        assertEquals("wavenumber_cm1,cross_section_cm2_per_molecule", lines.get(0));
        assertEquals(20001, lines.size() - 1);
        double integral = 0;
        double prevNu = Double.NaN;
        double prevSigma = 0;
        for (String line : lines.subList(1, lines.size())) {
            int comma = line.indexOf(',');
            double nu = Double.parseDouble(line.substring(0, comma));
            double sigma = Double.parseDouble(line.substring(comma + 1));
            if (!Double.isNaN(prevNu)) {
                integral += 0.5 * (sigma + prevSigma) * (nu - prevNu);
            }
            prevNu = nu;
            prevSigma = sigma;
        }
        // Expected from the records' own columns (160-character format: ν 4–15, S 16–25, γ_air 36–40, δ_air
        // 60–67): each line's Lorentz area inside [2000, 2200] ∩ [ν0 − 25, ν0 + 25], ν0 = ν + δ·1 atm,
        // (1/π)(atan((b − ν0)/γ) − atan((a − ν0)/γ)) (common practice); the Voigt core (αD ≈ 0.1 γ) changes the
        // areas of lines cut by the range edges by well under 1e-3 of the total
        double expected = 0;
        for (String rec : Files.readAllLines(sample, StandardCharsets.US_ASCII)) {
            double nu0 = Double.parseDouble(rec.substring(3, 15).trim()) + Double.parseDouble(rec.substring(59, 67).trim());
            double s = Double.parseDouble(rec.substring(15, 25).trim());
            double gamma = Double.parseDouble(rec.substring(35, 40).trim());
            double a = Math.max(2000, nu0 - 25);
            double b = Math.min(2200, nu0 + 25);
            if (a < b) {
                expected += s / Math.PI * (Math.atan((b - nu0) / gamma) - Math.atan((a - nu0) / gamma));
            }
        }
        assertEquals(expected, integral, 1e-3 * expected);
        assertTrue(Files.size(tmp.resolve("co.png")) > 0);
    }

    @Test
    void hdf5FromTheExtensionCarriesTheParameters() throws IOException {
        Path h5 = tmp.resolve("co.h5");
        Run r = run("sigma", store.toString(), "--temperature", "296K", "--pressure", "0.5", "--background",
                "H2=0.85,He=0.15", "--between", "4.6", "4.7", "--unit", "um", "--resolving-power", "20000",
                "--out", h5.toString(), "-q");
        assertEquals(0, r.code(), r.err());
        assertEquals("", r.out());
        try (HdfFile hdf = new HdfFile(h5)) {
            double[] nu = (double[]) hdf.getDatasetByPath("/wavenumber_cm1").getData();
            // 4.7 µm and 4.6 µm are 1e4/4.7 and 1e4/4.6 cm-1 (definition of the wavenumber)
            assertEquals(1e4 / 4.7, nu[0], 1e-9);
            assertTrue(nu[nu.length - 1] <= 1e4 / 4.6 + 1e-9);
            assertEquals("exact", hdf.getAttribute("engine").getData());
            // 0.5 bar = 0.5e5 Pa / 101325 Pa/atm (definition of the standard atmosphere)
            assertEquals(0.5, Double.parseDouble((String) hdf.getAttribute("pressure_bar").getData()), 1e-15);
        }
    }

    @Test
    void theFastEngineSaysItsEstimateAndCriterionAndRefusesATolerance() {
        Path csv = tmp.resolve("co-fast.csv");
        Run r = run("sigma", store.toString(), "--temperature", "296", "--pressure", "1atm", "--background", "air=1",
                "--between", "2100", "2150", "--step", "0.002", "--engine", "fast", "--out", csv.toString());
        assertEquals(0, r.code(), r.err());
        // the summary carries the estimate with its tolerance and criterion
        assertTrue(r.out().matches("(?s).*estimated error: [0-9.e+-]+ \\(tolerance 0\\.001; relative error where sigma "
                + ">= 1e-6 max sigma\\).*"), r.out());
        // a tolerance the transform cannot keep: one line before any work, exit 2
        Run refused = run("sigma", store.toString(), "--temperature", "296", "--pressure", "1atm", "--background",
                "air=1", "--between", "2100", "2150", "--step", "0.002", "--engine", "fast", "--max-relative-error", "1e-9",
                "--out", tmp.resolve("refused.csv").toString());
        assertEquals(2, refused.code(), refused.err());
        assertEquals(1, refused.errLines().length, refused.err());
        assertTrue(refused.err().contains("tolerance"), refused.err());
        assertTrue(Files.notExists(tmp.resolve("refused.csv")));
    }

    @Test
    void fileRecordsWhereEachPartitionSumCameFromAndWarnsOutsideTheModelsRange() throws IOException {
        Path h5 = tmp.resolve("co-hot.h5");
        Run r = run("sigma", store.toString(), "--temperature", "4000K", "--pressure", "1atm", "--background",
                "air=1", "--between", "2100", "2110", "--step", "0.05", "--out", h5.toString(), "-q");
        assertEquals(0, r.code(), r.err());
        // 4000 K is beyond the 3000 K to which the diatomic level sums are checked: said for every isotopologue
        // of the sample (CO 1–6), also with -q, naming isotopologue and temperature.
        for (String iso : new String[] {"12C-16O (5/1)", "13C-16O (5/2)", "13C-17O (5/6)"}) {
            assertTrue(r.err().contains("warning: Q(4000.00 K) of " + iso), r.err());
        }
        try (HdfFile hdf = new HdfFile(h5)) {
            String source = (String) hdf.getAttribute("partition_sum.5/1").getData();
            assertTrue(source.startsWith("built-in v2: direct sum over"), source);
            String warning = (String) hdf.getAttribute("partition_sum_warning.1").getData();
            assertTrue(warning.contains("4000") && warning.contains("5/1"), warning);
        }
    }

    @Test
    void helpHasAnExample() {
        Run r = run("sigma", "--help");
        assertEquals(0, r.code());
        assertTrue(r.out().contains("Example"), r.out());
        assertTrue(r.out().contains("linewright sigma "), r.out());
    }

    private void assertOneLineError(Run r, String mention) {
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals(1, r.errLines().length, r.err());
        assertTrue(r.err().startsWith("linewright: error: "), r.err());
        assertTrue(r.err().contains(mention), r.err());
    }

    private Run sigma(String storeDir, String pressure, String background, String low, String high, String engine) {
        return run("sigma", storeDir, "--temperature", "296", "--pressure", pressure, "--background", background,
                "--between", low, high, "--step", "0.01", "--engine", engine, "--out", tmp.resolve("bad.csv").toString());
    }

    @Test
    void badInputIsExitTwoWithOneLine() {
        assertOneLineError(sigma(store.toString(), "-1bar", "air=1", "2000", "2100", "exact"), "pressure");
        assertOneLineError(sigma(store.toString(), "1bar", "air=1", "2000", "2000", "exact"), "empty range");
        assertOneLineError(sigma(store.toString(), "1bar", "xenon=1", "2000", "2100", "exact"), "xenon");
        assertOneLineError(sigma(tmp.resolve("no-such-store").toString(), "1bar", "air=1", "2000", "2100", "exact"),
                "no-such-store");
        assertOneLineError(sigma(store.toString(), "1bar", "air=1", "2000", "2100", "slow"), "engine 'slow'");
        assertTrue(Files.notExists(tmp.resolve("bad.csv")));
    }
}
