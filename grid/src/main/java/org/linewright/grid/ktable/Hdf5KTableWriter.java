package org.linewright.grid.ktable;

import io.jhdf.HdfFile;
import io.jhdf.WritableHdfFile;
import io.jhdf.api.WritableDataset;
import java.nio.file.Path;
import java.util.Map;

/**
 * The HDF5 layout of a k-table (jHDF): coordinate datasets {@code pressure_bar}, {@code temperature_K}, {@code g},
 * {@code g_weight}, {@code bin_lower_cm1}, {@code bin_upper_cm1}, {@code bin_centre_cm1}, {@code sigma_points_per_bin};
 * {@code k_cm2_per_molecule} (or {@code k_cm2_per_g}) [pressure_bar][temperature_K][bin][g]; the optional band σ
 * [pressure_bar][temperature_K][bin]. Each dataset has a {@code unit} attribute and the data sets a
 * {@code dimensions} attribute; the metadata are root attributes. The only class that writes k-table HDF5.
 */
final class Hdf5KTableWriter {
    private Hdf5KTableWriter() {
    }

    static void write(Path file, KTableContent c) {
        int np = c.pressureBar().length;
        int nt = c.temperatureK().length;
        int nb = c.bins();
        int ng = c.gPoints();
        double[][][][] k = new double[np][nt][nb][ng];
        for (int p = 0; p < np; p++) {
            for (int t = 0; t < nt; t++) {
                for (int b = 0; b < nb; b++) {
                    System.arraycopy(c.k(), c.kOffset(p, t, b), k[p][t][b], 0, ng);
                }
            }
        }
        double[] centre = new double[nb];
        for (int b = 0; b < nb; b++) {
            centre[b] = c.binCentreCm1(b);
        }
        String bandDims = KTableLayout.PRESSURE + "," + KTableLayout.TEMPERATURE + ",bin";
        try (WritableHdfFile h5 = HdfFile.write(file)) {
            unit(h5.putDataset(KTableLayout.PRESSURE, c.pressureBar().clone()), KTableLayout.UNIT_PRESSURE);
            unit(h5.putDataset(KTableLayout.TEMPERATURE, c.temperatureK().clone()), KTableLayout.UNIT_TEMPERATURE);
            unit(h5.putDataset(KTableLayout.G, c.g().clone()), KTableLayout.UNIT_ONE);
            unit(h5.putDataset(KTableLayout.G_WEIGHT, c.gWeight().clone()), KTableLayout.UNIT_ONE);
            unit(h5.putDataset(KTableLayout.BIN_LOWER, c.binLowerCm1().clone()), KTableLayout.UNIT_WAVENUMBER);
            unit(h5.putDataset(KTableLayout.BIN_UPPER, c.binUpperCm1().clone()), KTableLayout.UNIT_WAVENUMBER);
            unit(h5.putDataset(KTableLayout.BIN_CENTRE, centre), KTableLayout.UNIT_WAVENUMBER);
            unit(h5.putDataset(KTableLayout.POINTS_PER_BIN, c.pointsPerBin().clone()), KTableLayout.UNIT_ONE);
            WritableDataset kd = h5.putDataset(c.kName(), k);
            unit(kd, c.unit());
            kd.putAttribute("dimensions", KTableLayout.PRESSURE + "," + KTableLayout.TEMPERATURE + ",bin," + KTableLayout.G);
            if (c.bandMean() != null) {
                WritableDataset d = h5.putDataset(c.bandMeanName(), band(c, c.bandMean()));
                unit(d, c.unit());
                d.putAttribute("dimensions", bandDims);
            }
            if (c.transmissionEquivalent() != null) {
                WritableDataset d = h5.putDataset(c.transmissionEquivalentName(), band(c, c.transmissionEquivalent()));
                unit(d, c.unit());
                d.putAttribute("dimensions", bandDims);
            }
            for (Map.Entry<String, String> e : c.metadata().entrySet()) {
                h5.putAttribute(e.getKey(), e.getValue());
            }
        }
    }

    private static double[][][] band(KTableContent c, double[] flat) {
        int np = c.pressureBar().length;
        int nt = c.temperatureK().length;
        int nb = c.bins();
        double[][][] a = new double[np][nt][nb];
        for (int p = 0; p < np; p++) {
            for (int t = 0; t < nt; t++) {
                System.arraycopy(flat, c.bandOffset(p, t, 0), a[p][t], 0, nb);
            }
        }
        return a;
    }

    private static void unit(WritableDataset d, String unit) {
        d.putAttribute("unit", unit);
    }
}
