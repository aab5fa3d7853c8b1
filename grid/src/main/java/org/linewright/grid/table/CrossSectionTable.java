package org.linewright.grid.table;

import io.jhdf.HdfFile;
import io.jhdf.api.Attribute;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.FieldVector;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
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
     * Reads a table written by {@link TableWriter} (format by extension).
     *
     * @throws InputException when the file is missing or not a linewright table
     */
    public static CrossSectionTable open(Path file) throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new InputException(file + ": no such table file");
        }
        return TableFormat.of(file) == TableFormat.ARROW ? readArrow(file) : readHdf5(file);
    }

    private static CrossSectionTable readArrow(Path file) throws IOException {
        List<Double> pressures = new ArrayList<>();
        List<Double> temperatures = new ArrayList<>();
        List<double[]> rows = new ArrayList<>();
        double[] nu = null;
        Map<String, String> metadata = new LinkedHashMap<>();
        TablePlan.Precision precision;
        try (BufferAllocator allocator = new RootAllocator();
             FileChannel ch = FileChannel.open(file);
             ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
            VectorSchemaRoot root = reader.getVectorSchemaRoot();
            Map<String, String> custom = root.getSchema().getCustomMetadata();
            if (custom != null) {
                custom.forEach((k, v) -> {
                    if (k.startsWith(TableWriter.ARROW_KEY_PREFIX)) {
                        metadata.put(k.substring(TableWriter.ARROW_KEY_PREFIX.length()), v);
                    }
                });
            }
            Float8Vector pv = column(file, root, TableFormat.PRESSURE, Float8Vector.class);
            Float8Vector tv = column(file, root, TableFormat.TEMPERATURE, Float8Vector.class);
            Float8Vector wv = column(file, root, TableFormat.WAVENUMBER, Float8Vector.class);
            FieldVector sv = column(file, root, TableFormat.SIGMA, FieldVector.class);
            precision = sv instanceof Float4Vector ? TablePlan.Precision.FLOAT32 : TablePlan.Precision.FLOAT64;
            while (reader.loadNextBatch()) {
                int n = root.getRowCount();
                if (n == 0) {
                    continue;
                }
                if (nu == null) {
                    nu = new double[n];
                    for (int i = 0; i < n; i++) {
                        nu[i] = wv.get(i);
                    }
                } else if (n != nu.length) {
                    throw new InputException(file + ": record batch " + (rows.size() + 1) + " has " + n
                            + " rows (expected " + nu.length + ", one per wavenumber)");
                }
                double p = pv.get(0);
                double t = tv.get(0);
                if (!pressures.contains(p)) {
                    pressures.add(p);
                }
                if (!temperatures.contains(t)) {
                    temperatures.add(t);
                }
                double[] s = new double[n];
                if (sv instanceof Float4Vector f4) {
                    for (int i = 0; i < n; i++) {
                        s[i] = f4.get(i);
                    }
                } else if (sv instanceof Float8Vector f8) {
                    for (int i = 0; i < n; i++) {
                        s[i] = f8.get(i);
                    }
                } else {
                    throw new InputException(file + ": column " + TableFormat.SIGMA + " is not float32 or float64");
                }
                rows.add(s);
            }
        }
        if (nu == null) {
            throw new InputException(file + ": the table holds no record batch");
        }
        int np = pressures.size();
        int nt = temperatures.size();
        if (rows.size() != np * nt) {
            throw new InputException(file + ": " + rows.size() + " record batches for " + np + " pressures and "
                    + nt + " temperatures (expected one batch per (p, T))");
        }
        double[][][] sigma = new double[np][nt][];
        for (int k = 0; k < rows.size(); k++) {
            sigma[k / nt][k % nt] = rows.get(k);
        }
        return new CrossSectionTable(file, nu, toArray(pressures), toArray(temperatures), sigma, precision, metadata);
    }

    private static <V> V column(Path file, VectorSchemaRoot root, String name, Class<V> type) {
        FieldVector v = root.getVector(name);
        if (v == null || !type.isInstance(v)) {
            throw new InputException(file + ": no column " + name + " of the expected type (not a linewright table?)");
        }
        return type.cast(v);
    }

    private static double[] toArray(List<Double> list) {
        double[] a = new double[list.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = list.get(i);
        }
        return a;
    }

    private static CrossSectionTable readHdf5(Path file) {
        try (HdfFile h5 = new HdfFile(file)) {
            double[] nu = (double[]) dataset(file, h5, TableFormat.WAVENUMBER).getData();
            double[] p = (double[]) dataset(file, h5, TableFormat.PRESSURE).getData();
            double[] t = (double[]) dataset(file, h5, TableFormat.TEMPERATURE).getData();
            Object data = dataset(file, h5, TableFormat.SIGMA).getData();
            double[][][] sigma = new double[p.length][t.length][];
            TablePlan.Precision precision;
            if (data instanceof float[][][] f) {
                precision = TablePlan.Precision.FLOAT32;
                for (int i = 0; i < p.length; i++) {
                    for (int j = 0; j < t.length; j++) {
                        sigma[i][j] = new double[nu.length];
                        for (int k = 0; k < nu.length; k++) {
                            sigma[i][j][k] = f[i][j][k];
                        }
                    }
                }
            } else if (data instanceof double[][][] d) {
                precision = TablePlan.Precision.FLOAT64;
                sigma = d;
            } else {
                throw new InputException(file + ": dataset " + TableFormat.SIGMA + " is not a 3-D float array");
            }
            if (sigma.length != p.length || sigma[0].length != t.length || sigma[0][0].length != nu.length) {
                throw new InputException(file + ": dataset " + TableFormat.SIGMA + " does not have the shape [p][T][ν]");
            }
            Map<String, String> metadata = new LinkedHashMap<>();
            for (Map.Entry<String, Attribute> e : h5.getAttributes().entrySet()) {
                Object v = e.getValue().getData();
                metadata.put(e.getKey(), v instanceof String s ? s : String.valueOf(v));
            }
            return new CrossSectionTable(file, nu, p, t, sigma, precision, metadata);
        }
    }

    private static Dataset dataset(Path file, HdfFile h5, String name) {
        try {
            return h5.getDatasetByPath("/" + name);
        } catch (RuntimeException e) {
            throw new InputException(file + ": no dataset /" + name + " (not a linewright table?)");
        }
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
