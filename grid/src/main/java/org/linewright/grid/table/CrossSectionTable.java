package org.linewright.grid.table;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.grid.plan.TablePlan;
import org.linewright.ingest.InputException;

/**
 * A cross-section table read into memory (either format): the wavenumber, pressure and temperature axes, σ at
 * every (p, T) and the provenance metadata, with σ(ν) at any (p, T) inside the axes by interpolation.
 *
 * <p>Interpolation is bilinear in (ln p, T), point by point in ν ({@link PressureTemperatureAxes}, shared with the
 * k-table reader): exact for σ linear in ln p and T (and in their product); elsewhere its error is the
 * tabulation's (choose the axes dense enough). An axis of a single value accepts only that value (relative 10⁻⁹).
 */
public final class CrossSectionTable {
    private final Path file;
    private final double[] wavenumberCm1;
    private final double[] pressureBar;
    private final double[] temperatureK;
    private final double[][][] sigma;
    private final TablePlan.Precision precision;
    private final Map<String, String> metadata;

    private CrossSectionTable(Path file, double[] wavenumberCm1, double[] pressureBar, double[] temperatureK,
                              double[][][] sigma, TablePlan.Precision precision, Map<String, String> metadata) {
        this.file = file;
        this.wavenumberCm1 = wavenumberCm1;
        this.pressureBar = pressureBar;
        this.temperatureK = temperatureK;
        this.sigma = sigma;
        this.precision = precision;
        this.metadata = Collections.unmodifiableMap(metadata);
    }

    /**
     * Reads a table written by {@link TableWriter} (format by extension), through {@link SigmaTableCells}.
     *
     * @throws InputException when the file is missing or not a linewright table
     */
    public static CrossSectionTable open(Path file) throws IOException {
        SigmaTableCells.Header[] header = new SigmaTableCells.Header[1];
        double[][][][] sigma = new double[1][][][];
        SigmaTableCells.read(file, h -> {
            header[0] = h;
            sigma[0] = new double[h.pressureBar().length][h.temperatureK().length][];
        }, (p, t, row) -> sigma[0][p][t] = row.clone());
        SigmaTableCells.Header h = header[0];
        return new CrossSectionTable(file, h.wavenumberCm1(), h.pressureBar(), h.temperatureK(), sigma[0],
                h.precision(), new LinkedHashMap<>(h.metadata()));
    }

    public Path file() {
        return file;
    }

    /** The wavenumber axis, cm⁻¹ (a copy). */
    public double[] wavenumberCm1() {
        return wavenumberCm1.clone();
    }

    /** The pressure axis, bar (a copy). */
    public double[] pressureBar() {
        return pressureBar.clone();
    }

    /** The temperature axis, K (a copy). */
    public double[] temperatureK() {
        return temperatureK.clone();
    }

    /** σ's element type in the file. */
    public TablePlan.Precision precision() {
        return precision;
    }

    /** Provenance metadata (keys without prefix). */
    public Map<String, String> metadata() {
        return metadata;
    }

    /** σ in cm²/molecule at the tabulated pressure {@code p} and temperature {@code t} (a copy). */
    public double[] sigma(int p, int t) {
        return sigma[p][t].clone();
    }

    /** The checksum of σ as read (compare with {@code metadata().get("sigma_sha256")}). */
    public String sigmaSha256() {
        SigmaDigest d = new SigmaDigest(precision);
        for (double[][] byT : sigma) {
            for (double[] row : byT) {
                d.update(row);
            }
        }
        return d.hex();
    }

    /**
     * σ(ν) in cm²/molecule at a pressure and temperature inside the axes, bilinear in (ln p, T) (see the class
     * comment).
     *
     * @throws InputException when p or T lies outside the table's axes
     */
    public double[] sigmaAt(double pressureBarValue, double temperatureKValue) {
        PressureTemperatureAxes.Corners c = new PressureTemperatureAxes(file, pressureBar, temperatureK)
                .corners(pressureBarValue, temperatureKValue);
        double[] a = sigma[c.p0()][c.t0()];
        double[] b = sigma[c.p1()][c.t0()];
        double[] d01 = sigma[c.p0()][c.t1()];
        double[] d11 = sigma[c.p1()][c.t1()];
        double[] out = new double[wavenumberCm1.length];
        for (int k = 0; k < out.length; k++) {
            out[k] = c.combine(a[k], b[k], d01[k], d11[k]);
        }
        return out;
    }
}
