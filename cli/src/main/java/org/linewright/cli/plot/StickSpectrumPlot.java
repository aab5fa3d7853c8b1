package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * A stick spectrum: one vertical line per transition from the bottom of the plot up to its intensity, over
 * wavenumber, on a logarithmic intensity axis; one colour per series (molecule, isotopologue or band).
 */
public final class StickSpectrumPlot {
    /**
     * One set of lines.
     *
     * @param label                  legend text, e.g. {@code CO}
     * @param wavenumberCm1          line positions, cm⁻¹
     * @param intensityCmPerMolecule line intensities, cm/molecule (non-positive ones are not drawn)
     */
    public record Series(String label, double[] wavenumberCm1, double[] intensityCmPerMolecule) {
    }

    private StickSpectrumPlot() {
    }

    /**
     * Writes the plot as a PNG file. Sticks start at {@code floorCmPerMolecule}; lines weaker than the floor are
     * not drawn.
     *
     * @param floorCmPerMolecule bottom of the intensity axis, cm/molecule, positive; e.g. 10⁻⁶ of the strongest
     */
    public static void write(Path pngFile, PlotStyle style, List<Series> series, double floorCmPerMolecule)
            throws IOException {
        PngCharts.requireNonEmpty(series.size(), "stick spectrum");
        if (!(floorCmPerMolecule > 0.0)) {
            throw new IllegalArgumentException("stick spectrum: the floor must be positive, not " + floorCmPerMolecule);
        }
        XYChart chart = PngCharts.newChart(style, "wavenumber (cm⁻¹)", "line intensity (cm/molecule)");
        chart.getStyler().setYAxisLogarithmic(true);
        chart.getStyler().setYAxisMin(floorCmPerMolecule);
        int drawn = 0;
        for (Series s : series) {
            PngCharts.requireSameLength(s.wavenumberCm1(), s.intensityCmPerMolecule(), s.label());
            // each stick is (ν, floor) → (ν, S) followed by a NaN gap that breaks the polyline
            double[] x = new double[3 * s.wavenumberCm1().length];
            double[] y = new double[x.length];
            int n = 0;
            for (int i = 0; i < s.wavenumberCm1().length; i++) {
                double intensity = s.intensityCmPerMolecule()[i];
                if (!(intensity > floorCmPerMolecule)) {
                    continue;
                }
                double nu = s.wavenumberCm1()[i];
                x[n] = nu;
                y[n++] = floorCmPerMolecule;
                x[n] = nu;
                y[n++] = intensity;
                x[n] = nu;
                y[n++] = Double.NaN;
            }
            if (n == 0) {
                continue;
            }
            XYSeries xy = chart.addSeries(s.label(), java.util.Arrays.copyOf(x, n), java.util.Arrays.copyOf(y, n));
            xy.setMarker(SeriesMarkers.NONE);
            drawn += n / 3;
        }
        if (drawn == 0) {
            throw new IllegalArgumentException("stick spectrum: no line above the floor " + floorCmPerMolecule);
        }
        PngCharts.write(chart, pngFile);
    }
}
