package org.linewright.cli.plot;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The PNG writers, checked with the JDK's independent PNG decoder ({@link ImageIO}) and the PNG signature of
 * the PNG specification (ISO/IEC 15948:2004, section 5.2: 137 80 78 71 13 10 26 10).
 */
class PlotsTest {
    private static final byte[] PNG_SIGNATURE = {(byte) 137, 80, 78, 71, 13, 10, 26, 10};

    private static BufferedImage readPng(Path file) throws IOException {
        assertTrue(Files.isRegularFile(file), file + " missing");
        byte[] bytes = Files.readAllBytes(file);
        for (int i = 0; i < PNG_SIGNATURE.length; i++) {
            assertEquals(PNG_SIGNATURE[i], bytes[i], "PNG signature byte " + i);
        }
        BufferedImage image = ImageIO.read(file.toFile());
        assertTrue(image != null, "ImageIO cannot decode " + file);
        return image;
    }

    /** A Lorentz-like curve with zeros outside a cutoff, as a cross section would have. */
    private static double[] curve(double[] nu, double centre, double peak, double width) {
        double[] y = new double[nu.length];
        for (int i = 0; i < nu.length; i++) {
            double d = nu[i] - centre;
            y[i] = Math.abs(d) > 25 ? 0.0 : peak * width * width / (d * d + width * width);
        }
        return y;
    }

    @Test
    void crossSectionPlotIsAPngOfTheRequestedSize(@TempDir Path tmp) throws IOException {
        double[] nu = new double[2001];
        for (int i = 0; i < nu.length; i++) {
            nu[i] = 2000.0 + 0.2 * i;
        }
        List<CrossSectionPlot.Series> series = List.of(
                new CrossSectionPlot.Series("T = 500 K", curve(nu, 2150, 1e-18, 0.1)),
                new CrossSectionPlot.Series("T = 1100 K", curve(nu, 2150, 4e-19, 0.2)));
        Path wn = tmp.resolve("sigma.png");
        CrossSectionPlot.write(wn, new PlotStyle("σ", 800, 500), nu, series, false);
        BufferedImage a = readPng(wn);
        assertEquals(800, a.getWidth());
        assertEquals(500, a.getHeight());
        Path um = tmp.resolve("sub/sigma-um.png");
        CrossSectionPlot.write(um, new PlotStyle("σ over wavelength", 640, 480), nu, series, true);
        BufferedImage b = readPng(um);
        assertEquals(640, b.getWidth());
        assertEquals(480, b.getHeight());
        try (var files = Files.list(tmp)) {
            assertTrue(files.noneMatch(p -> p.getFileName().toString().endsWith(".tmp")), "temporary file left");
        }
    }

    @Test
    void stickSpectrumIsAPngOfTheRequestedSize(@TempDir Path tmp) throws IOException {
        Path png = tmp.resolve("sticks.png");
        StickSpectrumPlot.write(png, new PlotStyle("sticks", 1200, 600), List.of(
                new StickSpectrumPlot.Series("A", new double[] {2100, 2110, 2120}, new double[] {1e-19, 3e-20, 0}),
                new StickSpectrumPlot.Series("B", new double[] {2300, 2310}, new double[] {2e-18, 1e-30})), 1e-25);
        BufferedImage image = readPng(png);
        assertEquals(1200, image.getWidth());
        assertEquals(600, image.getHeight());
    }

    @Test
    void residualPlotIsAPngOfTheRequestedSize(@TempDir Path tmp) throws IOException {
        Path png = tmp.resolve("residuals.png");
        ResidualPlot.write(png, new PlotStyle("residuals", 300, 200), "wavenumber (cm⁻¹)", "relative residual",
                List.of(new ResidualPlot.Series("CO", new double[] {2100, 2140, 2180},
                        new double[] {1e-4, -2e-4, Double.NaN})));
        BufferedImage image = readPng(png);
        assertEquals(300, image.getWidth());
        assertEquals(200, image.getHeight());
    }

    @Test
    void nothingToDrawIsRefusedWithoutWritingAFile(@TempDir Path tmp) {
        Path png = tmp.resolve("empty.png");
        assertThrows(IllegalArgumentException.class, () -> StickSpectrumPlot.write(png, PlotStyle.of("x"),
                List.of(new StickSpectrumPlot.Series("A", new double[] {1}, new double[] {1e-30})), 1e-25));
        assertThrows(IllegalArgumentException.class, () -> CrossSectionPlot.write(png, PlotStyle.of("x"),
                new double[] {1, 2}, List.of(new CrossSectionPlot.Series("s", new double[] {0, 0})), false));
        assertThrows(IllegalArgumentException.class, () -> CrossSectionPlot.write(png, PlotStyle.of("x"),
                new double[] {1, 2}, List.of(new CrossSectionPlot.Series("s", new double[] {1})), false));
        assertThrows(IllegalArgumentException.class, () -> new PlotStyle("tiny", 10, 10));
        assertTrue(Files.notExists(png));
    }

    /** Axis ends on multiples of a 1-2-5 step (common practice for tick marks) of about a tenth of the range. */
    @Test
    void axisEndsAreRound() {
        assertArrayEquals(new double[] {2000, 2400}, PngCharts.roundRange(2000.025, 2399.975), 1e-9);
        assertArrayEquals(new double[] {1500, 2400}, PngCharts.roundRange(1563.2, 2398.1), 1e-9);
        assertArrayEquals(new double[] {2134, 2152}, PngCharts.roundRange(2135.546, 2150.856), 1e-9);
        assertEquals(0.05, PngCharts.niceStep(0.031), 1e-15);
        assertEquals(2.0, PngCharts.niceStep(1.2), 1e-15);
        assertEquals(100.0, PngCharts.niceStep(84), 1e-12);
        assertEquals(null, PngCharts.roundRange(5, 5));
    }

    /** Residual labels in a power of ten that is a multiple of 3 (engineering notation, common practice). */
    @Test
    void residualScaleMakesShortLabels() {
        assertEquals(-6, ResidualPlot.displayExponent(List.of(new ResidualPlot.Series("a", new double[] {1, 2},
                new double[] {6.5e-4, -2e-4}))));
        assertEquals(-3, ResidualPlot.displayExponent(List.of(new ResidualPlot.Series("a", new double[] {1},
                new double[] {1e-3}))));
        assertEquals(0, ResidualPlot.displayExponent(List.of(new ResidualPlot.Series("a", new double[] {1},
                new double[] {Double.NaN}))));
    }

    /** Two panels stack into one PNG of the style's size. */
    @Test
    void panelsStackIntoOnePng(@org.junit.jupiter.api.io.TempDir Path dir) throws IOException {
        Path png = dir.resolve("p.png");
        ResidualPlot.writePanels(png, new PlotStyle("two", 800, 600), List.of(
                new ResidualPlot.Panel("x", "relative", List.of(new ResidualPlot.Series("a", new double[] {1, 2},
                        new double[] {1e-4, -1e-4}))),
                new ResidualPlot.Panel("x", "cm-1", List.of(new ResidualPlot.Series("b", new double[] {1.5},
                        new double[] {2e-5})))));
        var image = javax.imageio.ImageIO.read(png.toFile());
        assertEquals(800, image.getWidth());
        assertEquals(600, image.getHeight());
    }
}
