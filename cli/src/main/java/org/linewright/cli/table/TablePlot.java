package org.linewright.cli.table;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.linewright.cli.plot.CrossSectionPlot;
import org.linewright.cli.plot.PlotStyle;
import org.linewright.grid.table.CrossSectionTable;

/**
 * Plots a built table: σ at every (p, T) of the table, one curve each. Grids of more points than a picture has pixels are reduced to the largest σ of each group of
 * neighbouring points (peaks stay visible).
 */
public final class TablePlot {
    /** Points drawn at most per curve. */
    static final int MAX_POINTS = 8_000;

    private TablePlot() {
    }

    /** Writes the plot of {@code table} to {@code png}. */
    public static void write(CrossSectionTable table, Path png, String title) throws IOException {
        write(table, png, title, false);
    }

    /** As {@link #write(CrossSectionTable, Path, String)}, with the x axis in wavelength (µm) when asked. */
    public static void write(CrossSectionTable table, Path png, String title, boolean wavelengthAxis) throws IOException {
        double[] nu = table.wavenumberCm1();
        CrossSectionPlot.write(png, new PlotStyle(title, 1200, 650), reduceAxis(nu), series(table), wavelengthAxis);
    }

    /** The curves drawn: one per (p, T) of the table, pressures outer, temperatures inner. */
    public static List<CrossSectionPlot.Series> series(CrossSectionTable table) throws IOException {
        double[] p = table.pressureBar();
        double[] t = table.temperatureK();
        List<CrossSectionPlot.Series> series = new ArrayList<>();
        for (int i = 0; i < p.length; i++) {
            for (int j = 0; j < t.length; j++) {
                series.add(new CrossSectionPlot.Series(label(p[i], t[j]), reduce(table.sigma(i, j))));
            }
        }
        return series;
    }

    private static String label(double pressureBar, double temperatureK) {
        return String.format(Locale.ROOT, "p = %.3g bar, T = %.0f K", pressureBar, temperatureK);
    }

    private static int group(int n) {
        return (n + MAX_POINTS - 1) / MAX_POINTS;
    }

    private static double[] reduce(double[] sigma) {
        int g = group(sigma.length);
        if (g <= 1) {
            return sigma;
        }
        double[] out = new double[(sigma.length + g - 1) / g];
        for (int k = 0; k < out.length; k++) {
            double max = 0;
            for (int i = k * g; i < Math.min(sigma.length, (k + 1) * g); i++) {
                max = Math.max(max, sigma[i]);
            }
            out[k] = max;
        }
        return out;
    }

    private static double[] reduceAxis(double[] nu) {
        int g = group(nu.length);
        if (g <= 1) {
            return nu;
        }
        double[] out = new double[(nu.length + g - 1) / g];
        for (int k = 0; k < out.length; k++) {
            out[k] = nu[Math.min(nu.length - 1, k * g + g / 2)];
        }
        return out;
    }
}
