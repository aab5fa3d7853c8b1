package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.style.Styler;
import org.linewright.ingest.atomic.AtomicFile;

/** What the plot writers share: headless set-up, a common look, and atomic PNG writing. */
final class PngCharts {
    static {
        // charts are drawn off-screen; never try to open a display
        System.setProperty("java.awt.headless", "true");
    }

    private PngCharts() {
    }

    static XYChart newChart(PlotStyle style, String xTitle, String yTitle) {
        XYChart chart = new XYChartBuilder().width(style.widthPx()).height(style.heightPx())
                .title(style.title()).xAxisTitle(xTitle).yAxisTitle(yTitle).build();
        chart.getStyler().setChartBackgroundColor(java.awt.Color.WHITE);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        chart.getStyler().setPlotGridLinesVisible(true);
        chart.getStyler().setAntiAlias(true);
        return chart;
    }

    /**
     * Puts the x axis's ends on round values (multiples of a 1-2-5 step giving about 10 intervals) so that its
     * ticks fall on round values too; left as it is when the data's range is empty or not finite.
     */
    static void roundXAxis(XYChart chart, double min, double max) {
        double[] ends = roundRange(min, max);
        if (ends != null) {
            chart.getStyler().setXAxisMin(ends[0]);
            chart.getStyler().setXAxisMax(ends[1]);
        }
    }

    /** {min, max} widened to multiples of a 1-2-5 step of about (max − min)/10; null when not a finite range. */
    static double[] roundRange(double min, double max) {
        if (!(max > min) || Double.isInfinite(max - min)) {
            return null;
        }
        double step = niceStep((max - min) / 10);
        // a hair of tolerance so that a bound already on the step is kept
        double lo = Math.floor(min / step + 1e-9) * step;
        double hi = Math.ceil(max / step - 1e-9) * step;
        return new double[] {lo, hi};
    }

    /** The 1, 2 or 5 × 10^k nearest above {@code rough}. */
    static double niceStep(double rough) {
        double decade = Math.pow(10, Math.floor(Math.log10(rough)));
        double m = rough / decade;
        return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * decade;
    }

    /** Writes the chart as PNG under a temporary name in the same folder, then renames it. */
    static void write(XYChart chart, Path pngFile) throws IOException {
        writePng(BitmapEncoder.getBitmapBytes(chart, BitmapEncoder.BitmapFormat.PNG), pngFile);
    }

    /** Writes several charts stacked top to bottom into one PNG (under a temporary name, then renamed). */
    static void writeStacked(List<XYChart> charts, Path pngFile) throws IOException {
        int width = 0;
        int height = 0;
        List<java.awt.image.BufferedImage> images = new java.util.ArrayList<>();
        for (XYChart c : charts) {
            java.awt.image.BufferedImage img = BitmapEncoder.getBufferedImage(c);
            images.add(img);
            width = Math.max(width, img.getWidth());
            height += img.getHeight();
        }
        java.awt.image.BufferedImage all = new java.awt.image.BufferedImage(width, height,
                java.awt.image.BufferedImage.TYPE_INT_RGB);
        java.awt.Graphics2D g = all.createGraphics();
        g.setColor(java.awt.Color.WHITE);
        g.fillRect(0, 0, width, height);
        int y = 0;
        for (java.awt.image.BufferedImage img : images) {
            g.drawImage(img, 0, y, null);
            y += img.getHeight();
        }
        g.dispose();
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
        javax.imageio.ImageIO.write(all, "png", bytes);
        writePng(bytes.toByteArray(), pngFile);
    }

    private static void writePng(byte[] png, Path pngFile) throws IOException {
        AtomicFile.writeBytes(pngFile, png);
    }

    static void requireSameLength(double[] a, double[] b, String what) {
        if (a.length != b.length) {
            throw new IllegalArgumentException(what + ": " + a.length + " x values but " + b.length + " y values");
        }
    }

    /** An empty plot is a caller error, not a blank picture. */
    static void requireNonEmpty(int n, String what) {
        if (n == 0) {
            throw new IllegalArgumentException(what + ": nothing to plot");
        }
    }
}
