package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.style.Styler;

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

    /** Writes the chart as PNG under a temporary name in the same folder, then renames it. */
    static void write(XYChart chart, Path pngFile) throws IOException {
        Path parent = pngFile.toAbsolutePath().getParent();
        Files.createDirectories(parent);
        byte[] png = BitmapEncoder.getBitmapBytes(chart, BitmapEncoder.BitmapFormat.PNG);
        // A plain file (not createTempFile, which makes it owner-only): plots get the usual permissions.
        Path tmp = parent.resolve("." + pngFile.getFileName() + ".partial");
        try {
            Files.write(tmp, png);
            Files.move(tmp, pngFile, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(tmp);
        }
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
