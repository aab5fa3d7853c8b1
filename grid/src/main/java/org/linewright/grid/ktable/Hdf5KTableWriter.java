package org.linewright.grid.ktable;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.linewright.grid.hdf5.Compression;
import org.linewright.grid.hdf5.ElementType;
import org.linewright.grid.hdf5.Hdf5Dimension;
import org.linewright.grid.hdf5.Hdf5Variable;
import org.linewright.grid.hdf5.Hdf5Writer;

/**
 * The HDF5 layout of a k-table, self-describing in the netCDF-4 convention (HDF5 dimension scales, written by
 * {@link Hdf5Writer}): dimensions {@code pressure_bar}, {@code temperature_K} and {@code g} with their coordinate
 * values, and {@code bin} without (its edges and centre are the variables {@code bin_lower_cm1},
 * {@code bin_upper_cm1}, {@code bin_centre_cm1} over it); {@code g_weight} [g], {@code sigma_points_per_bin}
 * [bin]; {@code k_cm2_per_molecule} (or {@code k_cm2_per_g}) [pressure_bar][temperature_K][bin][g], one chunk per
 * (p, T), shuffled and deflated; the optional band σ [pressure_bar][temperature_K][bin]. Every variable has a
 * {@code units} attribute; the metadata are root attributes. The only class that writes k-table HDF5.
 */
final class Hdf5KTableWriter {
    private Hdf5KTableWriter() {
    }

    static void write(Path file, KTableContent c) {
        int np = c.pressureBar().length;
        int nt = c.temperatureK().length;
        int nb = c.bins();
        int ng = c.gPoints();
        double[] centre = new double[nb];
        double[] points = new double[nb];
        for (int b = 0; b < nb; b++) {
            centre[b] = c.binCentreCm1(b);
            points[b] = c.pointsPerBin()[b];
        }
        try (Hdf5Writer w = Hdf5Writer.create(file)) {
            Hdf5Dimension p = w.coordinate(KTableLayout.PRESSURE, c.pressureBar(), units(KTableLayout.UNIT_PRESSURE));
            Hdf5Dimension t = w.coordinate(KTableLayout.TEMPERATURE, c.temperatureK(),
                    units(KTableLayout.UNIT_TEMPERATURE));
            Hdf5Dimension bin = w.dimension("bin", nb);
            Hdf5Dimension g = w.coordinate(KTableLayout.G, c.g(), units(KTableLayout.UNIT_ONE));
            oneDimensional(w, KTableLayout.G_WEIGHT, g, c.gWeight(), KTableLayout.UNIT_ONE);
            oneDimensional(w, KTableLayout.BIN_LOWER, bin, c.binLowerCm1(), KTableLayout.UNIT_WAVENUMBER);
            oneDimensional(w, KTableLayout.BIN_UPPER, bin, c.binUpperCm1(), KTableLayout.UNIT_WAVENUMBER);
            oneDimensional(w, KTableLayout.BIN_CENTRE, bin, centre, KTableLayout.UNIT_WAVENUMBER);
            oneDimensional(w, KTableLayout.POINTS_PER_BIN, bin, points, KTableLayout.UNIT_ONE);
            Hdf5Variable k = w.variable(c.kName(), ElementType.FLOAT64, List.of(p, t, bin, g),
                    new int[] {1, 1, nb, ng}, Compression.DEFAULT, units(c.unit()));
            for (int ip = 0; ip < np; ip++) {
                for (int it = 0; it < nt; it++) {
                    k.writeChunk(new long[] {ip, it, 0, 0}, c.k(), c.kOffset(ip, it, 0));
                }
            }
            if (c.bandMean() != null) {
                band(w, c.bandMeanName(), p, t, bin, c, c.bandMean());
            }
            if (c.transmissionEquivalent() != null) {
                band(w, c.transmissionEquivalentName(), p, t, bin, c, c.transmissionEquivalent());
            }
            for (Map.Entry<String, String> e : c.metadata().entrySet()) {
                w.attribute(e.getKey(), e.getValue());
            }
        } catch (IOException e) {
            throw new UncheckedIOException(file + ": " + e.getMessage(), e);
        }
    }

    private static Map<String, String> units(String unit) {
        return Map.of(Hdf5Writer.UNITS, unit);
    }

    private static void oneDimensional(Hdf5Writer w, String name, Hdf5Dimension dim, double[] values, String unit)
            throws IOException {
        w.variable(name, ElementType.FLOAT64, List.of(dim), new int[] {values.length}, Compression.DEFAULT,
                units(unit)).writeAll(values);
    }

    private static void band(Hdf5Writer w, String name, Hdf5Dimension p, Hdf5Dimension t, Hdf5Dimension bin,
                             KTableContent c, double[] flat) throws IOException {
        Hdf5Variable v = w.variable(name, ElementType.FLOAT64, List.of(p, t, bin), new int[] {1, 1, c.bins()},
                Compression.DEFAULT, units(c.unit()));
        for (int ip = 0; ip < c.pressureBar().length; ip++) {
            for (int it = 0; it < c.temperatureK().length; it++) {
                v.writeChunk(new long[] {ip, it, 0}, flat, c.bandOffset(ip, it, 0));
            }
        }
    }
}
