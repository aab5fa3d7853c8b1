package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.security.MessageDigest;
import java.util.HexFormat;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.table.CrossSectionTable;

/** {@code linewright build}: summary, dry run, reuse, plot and the one-line error for a bad plan. */
class BuildCommandTest {
    /** The shipped SYNTHETIC demo lines, seen from the cli module. */
    private static final Path SYNTHETIC_CO = Paths.get("..", "demo", "data", "synthetic-co.par.bz2");

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    private static Path plan(Path dir, String table) throws Exception {
        Path plan = dir.resolve("plan.toml");
        Files.writeString(plan, """
                # SYNTHETIC lines (the demo's invented CO list)
                [lines]
                sources = ["%s"]
                [grid]
                wavenumber = { from = 2100.0, to = 2200.0, step = 0.05 }
                pressures_bar = [0.01, 1.0]
                temperatures_K = [500.0, 1000.0]
                [background]
                H2 = 0.85
                He = 0.15
                [profile]
                cutoff_cm1 = 10.0
                [build]
                block_points = 500
                [output]
                table = "%s"
                """.formatted(SYNTHETIC_CO.toAbsolutePath().normalize().toString().replace("\\", "/"), table));
        return plan;
    }

    @Test
    void buildsThenReusesEverythingAndPlots(@TempDir Path dir) throws Exception {
        assumeTrue(Files.isRegularFile(SYNTHETIC_CO), "shipped demo data not found");
        Path plan = plan(dir, "t.h5");
        Run first = run("build", plan.toString(), "--threads", "2", "--plot", dir.resolve("s.png").toString());
        assertEquals(0, first.code(), first.err());
        // 2001 points in blocks of 500: 5 blocks x 2 pressures x 2 temperatures = 20 cells (arithmetic)
        assertTrue(first.out().contains("blocks: 20 computed, 0 reused (of 20)"), first.out());
        Path table = dir.resolve("t.h5");
        // the sidecar holds the file's SHA-256 (checked with the JDK's digest) as sha256sum writes it
        String hex = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(table)));
        assertEquals(hex + "  t.h5\n", Files.readString(dir.resolve("t.h5.sha256")));
        assertTrue(first.out().contains("sha256 " + hex), first.out());
        assertTrue(ImageIO.read(dir.resolve("s.png").toFile()).getWidth() > 0);

        Run dry = run("build", plan.toString(), "--dry-run");
        assertEquals(0, dry.code(), dry.err());
        assertTrue(dry.out().contains("dry run: 0 of 20 blocks would be computed, 20 reused"), dry.out());

        Run again = run("build", plan.toString());
        assertTrue(again.out().contains("blocks: 0 computed, 20 reused (of 20); 0 raw line list(s) ingested"),
                again.out());
        CrossSectionTable t = CrossSectionTable.open(table);
        assertEquals(2001, t.wavenumberCm1().length);
        assertEquals(t.metadata().get("sigma_sha256"), t.sigmaSha256());
    }

    @Test
    void aBadPlanIsOneLineAndExitCode2(@TempDir Path dir) throws Exception {
        Path plan = dir.resolve("plan.toml");
        Files.writeString(plan, "[grid]\npressures_bar = [1.0]\ntemperatures_K = [300.0]\nwavenumbr = 3\n");
        Run r = run("build", plan.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        String[] lines = r.err().strip().split("\\R");
        assertEquals(1, lines.length, r.err());
        assertTrue(lines[0].contains("grid.wavenumbr: unknown key"), r.err());
    }

    @Test
    void severalMoleculesWithoutMixingRatiosAreRefusedInOneLineWithExitCode2(@TempDir Path dir) throws Exception {
        Path co2 = Paths.get("..", "demo", "data", "synthetic-co2.par.bz2");
        assumeTrue(Files.isRegularFile(SYNTHETIC_CO) && Files.isRegularFile(co2), "shipped demo data not found");
        Path plan = plan(dir, "mix.arrow");
        Files.writeString(plan, Files.readString(plan).replace("sources = [\"",
                "sources = [\"" + co2.toAbsolutePath().normalize().toString().replace("\\", "/") + "\", \""));
        Run r = run("build", plan.toString(), "--threads", "1");
        assertEquals(2, r.code(), r.err());
        String[] lines = r.err().strip().split("\\R");
        assertEquals(1, lines.length, r.err());
        // the demo's invented lists are of CO (molecule 5) and CO2 (molecule 2), named in ascending molecule number
        assertTrue(lines[0].startsWith("linewright: error: ") && lines[0].contains("several molecules [CO2, CO]")
                && lines[0].contains("species.vmr"), lines[0]);
        assertFalse(Files.exists(dir.resolve("mix.arrow")));
        assertFalse(Files.exists(dir.resolve("mix.arrow.work")), "no cell was computed");

        // with the ratios declared, the same plan builds
        Files.writeString(plan, Files.readString(plan).replace("[output]", "[species]\nvmr = { CO = 3.0, CO2 = 1.0 }\n[output]"));
        Run ok = run("build", plan.toString(), "--threads", "1");
        assertEquals(0, ok.code(), ok.err());
        assertEquals("CO=0.7500000000;CO2=0.2500000000",
                CrossSectionTable.open(dir.resolve("mix.arrow")).metadata().get("mixture_shares"));
    }
}
