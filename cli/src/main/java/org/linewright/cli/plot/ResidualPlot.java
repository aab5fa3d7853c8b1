package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Residuals as scatter plots on linear axes, e.g. (computed − reference)/reference over wavenumber, with a zero
 * line. Quantities of different kinds (a relative intensity residual, a position offset in cm⁻¹) go into separate
 * panels stacked in one PNG, never onto one axis. Each panel's y values are shown in a power of ten (a multiple of
 * 3) that makes its labels short numbers, the power named in the axis title, e.g. "S/S(A) − 1 (× 10⁻³)"; the x
 * axis ends on round values.
 */
public final class ResidualPlot {
    /**
     * One set of points.
     *
     * @param label    legend text
     * @param x        abscissae (e.g. wavenumber, cm⁻¹)
     * @param residual residuals, in the unit named by the panel's y-axis title; NaN points are skipped
     */
    public record Series(String label, double[] x, double[] residual) {
    }

    /**
     * One panel: its axes and the series drawn on them.
     *
     * @param xTitle x-axis title with its unit, e.g. {@code wavenumber (cm⁻¹)}
     * @param yTitle y-axis title with its unit, e.g. {@code S/S(A) − 1}; the scale factor is appended
     * @param series the point sets
     */
    public record Panel(String xTitle, String yTitle, List<Series> series) {
    }

    private ResidualPlot() {
    }

    /** Writes one panel as a PNG file. */
    public static void write(Path pngFile, PlotStyle style, String xTitle, String yTitle, List<Series> series)
            throws IOException {
        writePanels(pngFile, style, List.of(new Panel(xTitle, yTitle, series)));
    }

    /**
     * Writes the panels stacked top to bottom into one PNG file; the first carries the style's title, each panel
     * is {@code style.heightPx()} / number of panels high (at least {@link PlotStyle#MIN_SIZE_PX}).
     */
    public static void writePanels(Path pngFile, PlotStyle style, List<Panel> panels) throws IOException {
        PngCharts.requireNonEmpty(panels.size(), "residual plot");
        int height = Math.max(PlotStyle.MIN_SIZE_PX, style.heightPx() / panels.size());
        List<XYChart> charts = new ArrayList<>();
        for (int p = 0; p < panels.size(); p++) {
            Panel panel = panels.get(p);
            PlotStyle panelStyle = new PlotStyle(p == 0 ? style.title() : "", style.widthPx(), height);
            charts.add(chart(panelStyle, panel));
        }
        if (charts.size() == 1) {
            PngCharts.write(charts.get(0), pngFile);
        } else {
            PngCharts.writeStacked(charts, pngFile);
        }
    }

    private static XYChart chart(PlotStyle style, Panel panel) {
        PngCharts.requireNonEmpty(panel.series().size(), "residual panel " + panel.yTitle());
        int exponent = displayExponent(panel.series());
        double scale = Math.pow(10, -exponent);
        XYChart chart = PngCharts.newChart(style, panel.xTitle(),
                exponent == 0 ? panel.yTitle() : panel.yTitle() + " (× 1e" + exponent + ")");
        chart.getStyler().setDefaultSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        chart.getStyler().setMarkerSize(4);
        chart.getStyler().setYAxisDecimalPattern("0.###");
        double xMin = Double.POSITIVE_INFINITY;
        double xMax = Double.NEGATIVE_INFINITY;
        for (Series s : panel.series()) {
            PngCharts.requireSameLength(s.x(), s.residual(), s.label());
            PngCharts.requireNonEmpty(s.x().length, s.label());
            double[] y = new double[s.residual().length];
            for (int i = 0; i < y.length; i++) {
                y[i] = s.residual()[i] * scale;
            }
            XYSeries xy = chart.addSeries(s.label(), s.x(), y);
            xy.setMarker(SeriesMarkers.CIRCLE);
            for (double v : s.x()) {
                xMin = Math.min(xMin, v);
                xMax = Math.max(xMax, v);
            }
        }
        double[] ends = PngCharts.roundRange(xMin, xMax);
        if (ends == null) {
            // a single abscissa: a small range around it
            double half = Math.max(1.0, Math.abs(xMin) * 1e-3);
            ends = PngCharts.roundRange(xMin - half, xMax + half);
        }
        if (ends != null) {
            chart.getStyler().setXAxisMin(ends[0]);
            chart.getStyler().setXAxisMax(ends[1]);
            XYSeries zero = chart.addSeries("zero", new double[] {ends[0], ends[1]}, new double[] {0.0, 0.0});
            zero.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            zero.setMarker(SeriesMarkers.NONE);
            zero.setLineColor(java.awt.Color.GRAY);
            zero.setShowInLegend(false);
        }
        return chart;
    }

    /**
     * The multiple of 3 such that the largest |residual| divided by 10 to that power lies in [1, 1000) (0 when all
     * residuals are zero or NaN).
     */
    static int displayExponent(List<Series> series) {
        double max = 0;
        for (Series s : series) {
            for (double v : s.residual()) {
                if (!Double.isNaN(v)) {
                    max = Math.max(max, Math.abs(v));
                }
            }
        }
        if (!(max > 0) || Double.isInfinite(max)) {
            return 0;
        }
        return 3 * (int) Math.floor(Math.log10(max) / 3);
    }
}
