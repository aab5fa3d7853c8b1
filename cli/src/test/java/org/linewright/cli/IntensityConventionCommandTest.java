package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * {@code sigma --intensity-per / --abundance} and the refusal of several molecules, end to end on the HITRAN2020
 * CO and CO2 samples (Gordon et al. 2022, JQSRT 277, 107949; skipped visibly when absent). The outside fact: a
 * HITRAN intensity includes the isotopologue's abundance (Rothman et al. 1998, JQSRT 60, 665, appendix), which
 * for ¹³C¹⁶O is 1.1083e-2 in the HITRAN isotopologue metadata (Gordon et al. 2022; from memory) — so σ per ¹³C¹⁶O molecule is σ/1.1083e-2 and σ at twice that abundance is 2σ, at every point.
 */
class IntensityConventionCommandTest {
    private static final double CO_13C_ABUNDANCE = 1.1083e-2;

    @TempDir
    static Path tmp;
    static Path coStore;
    static Path co2Store;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void ingest() {
        coStore = tmp.resolve("co");
        co2Store = tmp.resolve("co2");
        Run r = run("ingest", ReferenceSamples.hitranSample("sample_CO.par").toString(), "--store", coStore.toString(),
                "-q");
        assertEquals(0, r.code(), r.err());
        r = run("ingest", ReferenceSamples.hitranSample("sample_CO2.par").toString(), "--store",
                co2Store.toString(), "-q");
        assertEquals(0, r.code(), r.err());
    }

    private static double[] sigma(Path csv) throws IOException {
        List<String> lines = Files.readAllLines(csv, StandardCharsets.US_ASCII);
        double[] s = new double[lines.size() - 1];
        for (int i = 1; i < lines.size(); i++) {
            s[i - 1] = Double.parseDouble(lines.get(i).substring(lines.get(i).indexOf(',') + 1));
        }
        return s;
    }

    private static double[] sigmaOf13CO(String name, String... extra) throws IOException {
        Path csv = tmp.resolve(name + ".csv");
        String[] base = {"sigma", coStore.toString(), "--temperature", "800", "--pressure", "1atm", "--background",
            "air=1", "--between", "2000", "2150", "--step", "0.01", "--molecule", "CO", "--isotopologue", "2",
            "--out", csv.toString(), "-q"};
        String[] args = java.util.Arrays.copyOf(base, base.length + extra.length);
        System.arraycopy(extra, 0, args, base.length, extra.length);
        Run r = run(args);
        assertEquals(0, r.code(), r.err());
        return sigma(csv);
    }

    @Test
    void perIsotopologueIsSigmaOverAbundanceAndDoubledAbundanceDoublesSigma() throws IOException {
        double[] natural = sigmaOf13CO("nat");
        double[] perIso = sigmaOf13CO("iso", "--intensity-per", "isotopologue");
        double[] doubled = sigmaOf13CO("dbl", "--abundance", "CO/2=" + (2 * CO_13C_ABUNDANCE));
        int positive = 0;
        for (int i = 0; i < natural.length; i++) {
            // CSV values carry 17 significant digits at most; 1e-12 relative leaves room for the division
            assertEquals(natural[i] / CO_13C_ABUNDANCE, perIso[i], 1e-12 * perIso[i], "point " + i);
            assertEquals(2 * natural[i], doubled[i], 1e-12 * doubled[i], "point " + i);
            positive += natural[i] > 0 ? 1 : 0;
        }
        assertEquals(natural.length, positive, "every point has absorption in the CO band");
    }

    @Test
    void theFileRecordsConventionAndAbundances() throws IOException {
        Path h5 = tmp.resolve("venus.h5");
        Run r = run("sigma", coStore.toString(), "--temperature", "296", "--pressure", "1atm", "--background",
                "air=1", "--between", "2100", "2110", "--step", "0.05", "--abundance", "CO/2=0.05", "--out",
                h5.toString(), "-q");
        assertEquals(0, r.code(), r.err());
        try (HdfFile hdf = new HdfFile(h5)) {
            assertEquals("natural-abundance", hdf.getAttribute("intensity_convention").getData());
            assertEquals("5/2=0.05000000000; others natural (registry)",
                    hdf.getAttribute("isotopologue_abundances").getData());
        }
    }

    @Test
    void severalMoleculesWithoutChoiceAreRefusedInOneLine() {
        Run r = run("sigma", coStore.toString(), co2Store.toString(), "--temperature", "296", "--pressure", "1atm",
                "--background", "air=1", "--between", "2000", "2400", "--step", "0.1", "--out",
                tmp.resolve("mix.csv").toString(), "-q");
        assertEquals(2, r.code(), r.err());
        String[] lines = r.err().split("\\R");
        assertEquals(1, lines.length, r.err());
        assertTrue(lines[0].startsWith("linewright: error: ") && lines[0].contains("several molecules"), lines[0]);
        assertTrue(!Files.exists(tmp.resolve("mix.csv")));
    }

    private static double[] sigmaOver20To300(String name, String... extra) throws IOException {
        Path csv = tmp.resolve(name + ".csv");
        String[] base = {"sigma", coStore.toString(), co2Store.toString(), "--temperature", "296", "--pressure",
            "1atm", "--background", "air=1", "--between", "20", "300", "--step", "0.05", "--out", csv.toString(),
            "-q"};
        String[] args = java.util.Arrays.copyOf(base, base.length + extra.length);
        System.arraycopy(extra, 0, args, base.length, extra.length);
        Run r = run(args);
        assertEquals(0, r.code(), r.err());
        return sigma(csv);
    }

    @Test
    void aMixtureIsTheVmrWeightedMeanOfTheSingleMoleculeSigmas() throws IOException {
        // σ per molecule of the mixture, Σ x_m σ_m / Σ x_m (definition of a number-weighted mean; the
        // normalisation is stated in docs/physics.md): checked at every grid point against the single-molecule
        // σ of the same command, with ratios that do not sum to 1 so that the normalisation is tested too
        double[] co = sigmaOver20To300("only-co", "--molecule", "CO");
        double[] co2 = sigmaOver20To300("only-co2", "--molecule", "CO2");
        double[] mix = sigmaOver20To300("mix-vmr", "--vmr", "CO=0.1,CO2=0.3");
        assertEquals(co.length, mix.length);
        assertTrue(java.util.Arrays.stream(co2).max().getAsDouble() > 0 && java.util.Arrays.stream(co).max()
                .getAsDouble() > 0, "both samples absorb in the range");
        for (int i = 0; i < mix.length; i++) {
            double expected = (0.1 * co[i] + 0.3 * co2[i]) / 0.4;
            assertEquals(expected, mix[i], 1e-12 * expected, "point " + i);
        }
        Run r = run("sigma", coStore.toString(), co2Store.toString(), "--temperature", "296", "--pressure", "1atm",
                "--background", "air=1", "--between", "2000", "2400", "--step", "0.1", "--vmr", "CO=0.1", "--out",
                tmp.resolve("mix-missing.csv").toString(), "-q");
        assertEquals(2, r.code(), r.err());
        assertTrue(r.err().contains("no mixing ratio for CO2"), r.err());
    }

    @Test
    void theMixtureFileRecordsTheShares() throws IOException {
        Path h5 = tmp.resolve("mix.h5");
        Run r = run("sigma", coStore.toString(), co2Store.toString(), "--temperature", "296", "--pressure", "1atm",
                "--background", "air=1", "--between", "2100", "2110", "--step", "0.05", "--vmr", "CO=1,CO2=3",
                "--out", h5.toString(), "-q");
        assertEquals(0, r.code(), r.err());
        try (HdfFile hdf = new HdfFile(h5)) {
            assertEquals("CO=0.2500000000;CO2=0.7500000000", hdf.getAttribute("mixture_shares").getData());
            // one computation over the lines of both declared molecules
            String selection = (String) hdf.getAttribute("line_selection").getData();
            assertEquals("molecules=5,2", selection);
        }
    }

    @Test
    void perIsotopologueOverSeveralIsotopologuesIsRefused() {
        Run r = run("sigma", coStore.toString(), "--temperature", "296", "--pressure", "1atm", "--background",
                "air=1", "--between", "2000", "2400", "--step", "0.1", "--intensity-per", "isotopologue", "--out",
                tmp.resolve("x.csv").toString(), "-q");
        assertEquals(2, r.code(), r.err());
        assertTrue(r.err().contains("--intensity-per isotopologue"), r.err());
    }
}
