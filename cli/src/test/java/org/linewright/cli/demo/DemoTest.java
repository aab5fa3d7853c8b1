package org.linewright.cli.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.InputException;

/** The demo on the shipped synthetic data: steps run in order, reports and plot written. */
class DemoTest {
    /** The shipped demo folder, seen from the cli module (Surefire's working directory). */
    private static final Path SHIPPED = Paths.get("..", "demo");

    @Test
    void demoWritesReportsAndStickPlot(@TempDir Path out) throws IOException {
        Assumptions.assumeTrue(Files.isRegularFile(SHIPPED.resolve("plan.toml")), "shipped demo folder not found");
        DemoReport report = new Demo(SHIPPED, out, Demo.availableSteps(), true).run(Demo.StepListener.NONE);
        assertEquals(5, report.steps().size());
        // the synthetic lines are generated from the S-A relation (Simeckova et al. 2006) with the registry's
        // Q(296 K) and abundances: the verify step must pass them
        assertTrue(Files.readString(out.resolve(VerifyStep.REPORT_FILE)).contains("result: PASSED"));
        assertTrue(Files.isRegularFile(out.resolve(VerifyStep.PLOT_FILE)));
        String text = Files.readString(out.resolve("report.txt"));
        String html = Files.readString(out.resolve("report.html"));
        assertTrue(text.contains("INVENTED"), text);
        assertTrue(html.contains("<img src=\"plots/stick-spectrum.png\""), html);
        // the plan's parameters are reported (values written in demo/plan.toml)
        assertTrue(text.contains("grid.temperatures_K") && text.contains("[500.0, 800.0, 1100.0]"), text);
        // 12C16O: 3 bands x (101 R + 100 P); 12C16O2: nu3 (81 R + 80 P) and the hot band (160 R + 159 P + 80 Q)
        assertTrue(text.contains("12C16O: 603 lines") && text.contains("12C16O2: 560 lines"), text);
        assertTrue(Files.isRegularFile(out.resolve("data/synthetic-co.par.bz2")));
        var image = ImageIO.read(out.resolve(StickSpectrumStep.PLOT_FILE).toFile());
        assertEquals(1200, image.getWidth());
        // the table step: the table named in demo/plan.toml, with the plan's axes, its checksum and its plot
        var table = org.linewright.grid.table.CrossSectionTable.open(out.resolve("tables/synthetic-subneptune.arrow"));
        assertEquals(java.util.List.of(1e-3, 1e-1, 10.0),
                java.util.Arrays.stream(table.pressureBar()).boxed().toList());
        assertEquals(java.util.List.of(500.0, 800.0, 1100.0),
                java.util.Arrays.stream(table.temperatureK()).boxed().toList());
        assertEquals(table.metadata().get("sigma_sha256"), table.sigmaSha256());
        assertTrue(Files.isRegularFile(out.resolve("tables/synthetic-subneptune.arrow.sha256")));
        assertTrue(ImageIO.read(out.resolve(TableStep.PLOT).toFile()).getWidth() > 0);
        assertTrue(html.contains("plots/cross-sections.png"), html);
        // the plot draws every (p, T) of the table: 3 pressures x 3 temperatures (demo/plan.toml)
        var curves = org.linewright.cli.table.TablePlot.series(table);
        assertEquals(9, curves.size());
        for (String expected : List.of("p = 0.00100 bar, T = 500 K", "p = 0.100 bar, T = 800 K", "p = 10.0 bar, T = 1100 K")) {
            assertTrue(curves.stream().anyMatch(c -> c.label().equals(expected)), expected);
        }
        // every warning the table carries in its metadata (warning.1, warning.2, ...) is in both reports
        List<String> warnings = table.metadata().entrySet().stream().filter(e -> e.getKey().startsWith("warning."))
                .map(java.util.Map.Entry::getValue).toList();
        assertFalse(warnings.isEmpty(), "the demo grid (step 0.01 cm-1) under-resolves its narrowest Doppler lines");
        for (String w : warnings) {
            assertTrue(text.contains("warning: " + w), w);
            assertTrue(html.contains(w.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")), w);
        }
    }

    /** Every link and image of report.html names a file that exists, relative to the output folder (RFC 3986). */
    private static void assertLinksResolve(Path out) throws IOException {
        String html = Files.readString(out.resolve("report.html"));
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("(?:href|src)=\"([^\"]+)\"").matcher(html);
        int links = 0;
        while (m.find()) {
            String target = m.group(1);
            assertFalse(Paths.get(target).isAbsolute(), "a relative link: " + target);
            assertTrue(Files.exists(out.resolve(target)), "link " + target + " resolves inside " + out);
            links++;
        }
        assertTrue(links >= 6, "links found: " + links);
    }

    @Test
    void demoRunsIntoARelativeOutputFolder() throws IOException {
        // The command's default output folder is relative (linewright-out/demo): every step must cope with it.
        Assumptions.assumeTrue(Files.isRegularFile(SHIPPED.resolve("plan.toml")), "shipped demo folder not found");
        Path relative = Paths.get("target", "demo-relative-" + System.nanoTime());
        DemoReport report = new Demo(SHIPPED, relative, Demo.availableSteps(), true).run(Demo.StepListener.NONE);
        assertEquals(Demo.availableSteps().size(), report.steps().size());
        assertTrue(Files.isRegularFile(relative.resolve("report.html")));
        assertLinksResolve(relative);
    }

    @Test
    void stepsRunInOrderAndAreTimed(@TempDir Path out) throws IOException {
        StringBuilder order = new StringBuilder();
        DemoStep first = step("first", order);
        DemoStep second = step("second", order);
        DemoReport report = new Demo(out, out, List.of(first, second), true).run(Demo.StepListener.NONE);
        assertEquals("first second ", order.toString());
        assertEquals(List.of("first", "second"), report.steps().stream().map(DemoReport.StepRecord::name).toList());
        assertTrue(report.steps().get(0).took().toNanos() >= 0);
        assertTrue(Files.readString(report.textFile()).contains("2. second"));
    }

    @Test
    void aPlanNamingAMissingListIsBadInput(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("plan.toml"), "[lines]\nsources = [\"data/absent.par.bz2\"]\n");
        InputException e = assertThrows(InputException.class,
                () -> new Demo(dir, dir.resolve("out"), Demo.availableSteps(), true).run(Demo.StepListener.NONE));
        assertTrue(e.getMessage().contains("lines.sources[0]") && e.getMessage().contains("absent.par.bz2"),
                e.getMessage());
    }

    @Test
    void aBrokenPlanIsBadInputWithItsPosition(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("plan.toml"), "[lines]\nsources = [\"a\"\n");
        InputException e = assertThrows(InputException.class,
                () -> new Demo(dir, dir.resolve("out"), Demo.availableSteps(), true).run(Demo.StepListener.NONE));
        assertTrue(e.getMessage().contains("plan.toml:"), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), e.getMessage());
    }

    private static DemoStep step(String name, StringBuilder order) {
        return new DemoStep() {
            @Override
            public String name() {
                return name;
            }

            @Override
            public StepOutcome run(DemoContext context) {
                order.append(name).append(' ');
                return new StepOutcome(List.of("ran " + name), List.of());
            }
        };
    }
}
