package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Residuals as a scatter plot on linear axes, e.g. (computed − reference)/reference over wavenumber, with a
 * zero line; several series overlaid.
 */
public final class ResidualPlot {
    /**
     * One set of points.
     *
     * @param label    legend text
     * @param x        abscissae (e.g. wavenumber, cm⁻¹)
     * @param residual residuals, in the unit named by the y-axis title; NaN points are skipped
     */
    public record Series(String label, double[] x, double[] residual) {
    }

    private ResidualPlot() {
    }

    /**
     * Writes the plot as a PNG file.
     *
     * @param xTitle x-axis title with its unit, e.g. {@code wavenumber (cm⁻¹)}
     * @param yTitle y-axis title with its unit, e.g. {@code relative residual}
     */
    public static void write(Path pngFile, PlotStyle style, String xTitle, String yTitle, List<Series> series)
            throws IOException {
        PngCharts.requireNonEmpty(series.size(), "residual plot");
        XYChart chart = PngCharts.newChart(style, xTitle, yTitle);
        chart.getStyler().setDefaultSeriesRenderStyle(org.knowm.xchart.XYSeries.XYSeriesRenderStyle.Scatter);
        chart.getStyler().setMarkerSize(4);
        double xMin = Double.POSITIVE_INFINITY;
        double xMax = Double.NEGATIVE_INFINITY;
        for (Series s : series) {
            PngCharts.requireSameLength(s.x(), s.residual(), s.label());
            PngCharts.requireNonEmpty(s.x().length, s.label());
            XYSeries xy = chart.addSeries(s.label(), s.x(), s.residual());
            xy.setMarker(SeriesMarkers.CIRCLE);
            for (double v : s.x()) {
                xMin = Math.min(xMin, v);
                xMax = Math.max(xMax, v);
            }
        }
        XYSeries zero = chart.addSeries("zero", new double[] {xMin, xMax}, new double[] {0.0, 0.0});
        zero.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        zero.setMarker(SeriesMarkers.NONE);
        zero.setLineColor(java.awt.Color.GRAY);
        zero.setShowInLegend(false);
        PngCharts.write(chart, pngFile);
    }
}
