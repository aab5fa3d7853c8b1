package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * σ(ν̃) curves — absorption cross sections over wavenumber — on a logarithmic y axis, several series overlaid
 * (one per temperature or pressure), optionally over vacuum wavelength in µm (λ = 10⁴/ν̃) instead of wavenumber.
 * Values that are zero or negative (outside every line's cutoff) cannot be drawn on a log axis and are left
 * as gaps.
 */
public final class CrossSectionPlot {
    /** Micrometres per centimetre: λ[µm] = 10⁴ / ν̃[cm⁻¹]. */
    private static final double UM_PER_CM = 1.0e4;

    /**
     * One curve.
     *
     * @param label                 legend text, e.g. {@code T = 800 K}
     * @param crossSectionCm2       σ at each grid point, cm²/molecule
     */
    public record Series(String label, double[] crossSectionCm2) {
    }

    private CrossSectionPlot() {
    }

    /**
     * Writes the plot as a PNG file.
     *
     * @param pngFile        the file to write (replaced atomically)
     * @param style          title and size
     * @param wavenumberCm1  the common wavenumber grid, cm⁻¹, all positive
     * @param series         the curves, each as long as the grid
     * @param wavelengthAxis true for a wavelength (µm) x axis, false for wavenumber (cm⁻¹)
     */
    public static void write(Path pngFile, PlotStyle style, double[] wavenumberCm1, List<Series> series,
                             boolean wavelengthAxis) throws IOException {
        PngCharts.requireNonEmpty(series.size(), "cross-section plot");
        double[] x = new double[wavenumberCm1.length];
        for (int i = 0; i < x.length; i++) {
            x[i] = wavelengthAxis ? UM_PER_CM / wavenumberCm1[i] : wavenumberCm1[i];
        }
        XYChart chart = PngCharts.newChart(style, wavelengthAxis ? "wavelength (µm)" : "wavenumber (cm⁻¹)",
                "cross section (cm²/molecule)");
        chart.getStyler().setYAxisLogarithmic(true);
        boolean anyPositive = false;
        for (Series s : series) {
            PngCharts.requireSameLength(wavenumberCm1, s.crossSectionCm2(), s.label());
            double[] y = new double[x.length];
            for (int i = 0; i < y.length; i++) {
                double v = s.crossSectionCm2()[i];
                // a log axis cannot show v <= 0: leave a gap rather than invent a floor
                y[i] = v > 0.0 ? v : Double.NaN;
                anyPositive |= v > 0.0;
            }
            XYSeries xy = chart.addSeries(s.label(), x, y);
            xy.setMarker(SeriesMarkers.NONE);
        }
        double xMin = Double.POSITIVE_INFINITY;
        double xMax = Double.NEGATIVE_INFINITY;
        for (double v : x) {
            xMin = Math.min(xMin, v);
            xMax = Math.max(xMax, v);
        }
        PngCharts.roundXAxis(chart, xMin, xMax);
        if (series.size() > 5) {
            // many curves: the legend goes beside the plot rather than over it
            chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.OutsideE);
        }
        if (!anyPositive) {
            throw new IllegalArgumentException("cross-section plot: no positive value to draw on a log axis");
        }
        PngCharts.write(chart, pngFile);
    }
}
