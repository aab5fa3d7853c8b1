package org.linewright.grid.ktable;

import io.jhdf.HdfFile;
import io.jhdf.api.Attribute;
import io.jhdf.api.Dataset;
import io.jhdf.api.Node;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.FieldVector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.IntVector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.linewright.grid.table.PressureTemperatureAxes;
import org.linewright.grid.table.TableFormat;
import org.linewright.grid.table.TableWriter;
import org.linewright.ingest.InputException;

/**
 * A k-table read back (either format of {@link KTableWriter}), with k(g) at any (p, T) inside the axes by the same
 * bilinear (ln p, T) interpolation as σ tables ({@link PressureTemperatureAxes}), g point by g point.
 */
public final class KTable {
    private final Path file;
    private final KTableContent content;
    private final PressureTemperatureAxes axes;

    private KTable(Path file, KTableContent content) {
        this.file = file;
        this.content = content;
        this.axes = new PressureTemperatureAxes(file, content.pressureBar(), content.temperatureK());
    }

    /**
     * Reads a k-table (format by extension).
     *
     * @throws InputException when the file is missing or not a linewright k-table
     */
    public static KTable open(Path file) throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new InputException(file + ": no such k-table file");
        }
        return new KTable(file, TableFormat.of(file) == TableFormat.ARROW ? readArrow(file) : readHdf5(file));
    }

    public Path file() {
        return file;
    }

    /** Everything read (arrays are the reader's own: do not change them). */
    public KTableContent content() {
        return content;
    }

    public Map<String, String> metadata() {
        return content.metadata();
    }

    /** k_i at tabulated (p, t) in bin b (a copy). */
    public double[] k(int p, int t, int b) {
        double[] out = new double[content.gPoints()];
        System.arraycopy(content.k(), content.kOffset(p, t, b), out, 0, out.length);
        return out;
    }

    /**
     * k_i at (p, T) inside the axes in bin b, bilinear in (ln p, T) for each g point.
     *
     * @throws InputException when p or T lies outside the axes
     */
    public double[] kAt(double pressureBar, double temperatureK, int bin) {
        PressureTemperatureAxes.Corners c = axes.corners(pressureBar, temperatureK);
        double[] k = content.k();
        int o00 = content.kOffset(c.p0(), c.t0(), bin);
        int o10 = content.kOffset(c.p1(), c.t0(), bin);
        int o01 = content.kOffset(c.p0(), c.t1(), bin);
        int o11 = content.kOffset(c.p1(), c.t1(), bin);
        double[] out = new double[content.gPoints()];
        for (int i = 0; i < out.length; i++) {
            out[i] = c.combine(k[o00 + i], k[o10 + i], k[o01 + i], k[o11 + i]);
        }
        return out;
    }

    private static boolean perGram(Path file, boolean hasPerGram, boolean hasPerMolecule) {
        if (hasPerGram == hasPerMolecule) {
            throw new InputException(file + ": expected one of " + KTableLayout.K_PER_MOLECULE + " or "
                    + KTableLayout.K_PER_GRAM + " (not a linewright k-table?)");
        }
        return hasPerGram;
    }

    private static KTableContent readArrow(Path file) throws IOException {
        try (BufferAllocator allocator = new RootAllocator();
             FileChannel ch = FileChannel.open(file);
             ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
            VectorSchemaRoot root = reader.getVectorSchemaRoot();
            Map<String, String> metadata = new LinkedHashMap<>();
            Map<String, String> custom = root.getSchema().getCustomMetadata();
            if (custom != null) {
                custom.forEach((k, v) -> {
                    if (k.startsWith(TableWriter.ARROW_KEY_PREFIX)) {
                        metadata.put(k.substring(TableWriter.ARROW_KEY_PREFIX.length()), v);
                    }
                });
            }
            boolean perGram = perGram(file, root.getVector(KTableLayout.K_PER_GRAM) != null,
                    root.getVector(KTableLayout.K_PER_MOLECULE) != null);
            String kName = perGram ? KTableLayout.K_PER_GRAM : KTableLayout.K_PER_MOLECULE;
            String meanName = perGram ? KTableLayout.BAND_MEAN_PER_GRAM : KTableLayout.BAND_MEAN_PER_MOLECULE;
            String teName = perGram ? KTableLayout.TRANSMISSION_EQUIVALENT_PER_GRAM
                    : KTableLayout.TRANSMISSION_EQUIVALENT_PER_MOLECULE;
            Float8Vector pv = f8(file, root, KTableLayout.PRESSURE);
            Float8Vector tv = f8(file, root, KTableLayout.TEMPERATURE);
            Float8Vector lo = f8(file, root, KTableLayout.BIN_LOWER);
            Float8Vector hi = f8(file, root, KTableLayout.BIN_UPPER);
            Float8Vector gv = f8(file, root, KTableLayout.G);
            Float8Vector wv = f8(file, root, KTableLayout.G_WEIGHT);
            Float8Vector kv = f8(file, root, kName);
            FieldVector npv = root.getVector(KTableLayout.POINTS_PER_BIN);
            Float8Vector mv = root.getVector(meanName) instanceof Float8Vector m ? m : null;
            Float8Vector ev = root.getVector(teName) instanceof Float8Vector e ? e : null;
            List<Double> pressures = new ArrayList<>();
            List<Double> temperatures = new ArrayList<>();
            List<double[]> ks = new ArrayList<>();
            List<double[]> means = new ArrayList<>();
            List<double[]> tes = new ArrayList<>();
            double[] g = null;
            double[] w = null;
            double[] lower = null;
            double[] upper = null;
            int[] points = null;
            int rows = -1;
            while (reader.loadNextBatch()) {
                int n = root.getRowCount();
                if (g == null) {
                    rows = n;
                    int ng = 0;
                    while (ng < n && (ng == 0 || lo.get(ng) == lo.get(0))) {
                        ng++;
                    }
                    int nb = n / ng;
                    g = new double[ng];
                    w = new double[ng];
                    lower = new double[nb];
                    upper = new double[nb];
                    points = new int[nb];
                    for (int i = 0; i < ng; i++) {
                        g[i] = gv.get(i);
                        w[i] = wv.get(i);
                    }
                    for (int b = 0; b < nb; b++) {
                        lower[b] = lo.get(b * ng);
                        upper[b] = hi.get(b * ng);
                        points[b] = npv instanceof IntVector iv ? iv.get(b * ng) : 0;
                    }
                } else if (n != rows) {
                    throw new InputException(file + ": record batch " + (ks.size() + 1) + " has " + n + " rows (expected "
                            + rows + ", one per (bin, g))");
                }
                if (!pressures.contains(pv.get(0))) {
                    pressures.add(pv.get(0));
                }
                if (!temperatures.contains(tv.get(0))) {
                    temperatures.add(tv.get(0));
                }
                double[] k = new double[n];
                for (int i = 0; i < n; i++) {
                    k[i] = kv.get(i);
                }
                ks.add(k);
                int ng = g.length;
                if (mv != null) {
                    double[] m = new double[lower.length];
                    for (int b = 0; b < m.length; b++) {
                        m[b] = mv.get(b * ng);
                    }
                    means.add(m);
                }
                if (ev != null) {
                    double[] e = new double[lower.length];
                    for (int b = 0; b < e.length; b++) {
                        e[b] = ev.get(b * ng);
                    }
                    tes.add(e);
                }
            }
            if (g == null) {
                throw new InputException(file + ": the k-table holds no record batch");
            }
            int np = pressures.size();
            int nt = temperatures.size();
            if (ks.size() != np * nt) {
                throw new InputException(file + ": " + ks.size() + " record batches for " + np + " pressures and "
                        + nt + " temperatures (expected one batch per (p, T))");
            }
            return new KTableContent(toArray(pressures), toArray(temperatures), lower, upper, g, w, concat(ks),
                    points, mv == null ? null : concat(means), ev == null ? null : concat(tes), perGram, metadata);
        }
    }

    private static Float8Vector f8(Path file, VectorSchemaRoot root, String name) {
        if (!(root.getVector(name) instanceof Float8Vector v)) {
            throw new InputException(file + ": no float64 column " + name + " (not a linewright k-table?)");
        }
        return v;
    }

    private static double[] concat(List<double[]> parts) {
        int n = 0;
        for (double[] p : parts) {
            n += p.length;
        }
        double[] a = new double[n];
        int o = 0;
        for (double[] p : parts) {
            System.arraycopy(p, 0, a, o, p.length);
            o += p.length;
        }
        return a;
    }

    private static double[] toArray(List<Double> list) {
        double[] a = new double[list.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = list.get(i);
        }
        return a;
    }

    private static KTableContent readHdf5(Path file) {
        try (HdfFile h5 = new HdfFile(file)) {
            Map<String, Node> children = h5.getChildren();
            boolean perGram = perGram(file, children.containsKey(KTableLayout.K_PER_GRAM),
                    children.containsKey(KTableLayout.K_PER_MOLECULE));
            double[] p = doubles(file, h5, KTableLayout.PRESSURE);
            double[] t = doubles(file, h5, KTableLayout.TEMPERATURE);
            double[] g = doubles(file, h5, KTableLayout.G);
            double[] w = doubles(file, h5, KTableLayout.G_WEIGHT);
            double[] lower = doubles(file, h5, KTableLayout.BIN_LOWER);
            double[] upper = doubles(file, h5, KTableLayout.BIN_UPPER);
            double[] pointsStored = doubles(file, h5, KTableLayout.POINTS_PER_BIN);
            int[] points = new int[pointsStored.length];
            for (int b = 0; b < points.length; b++) {
                points[b] = (int) pointsStored[b];
            }
            Object kData = dataset(file, h5, perGram ? KTableLayout.K_PER_GRAM : KTableLayout.K_PER_MOLECULE).getData();
            if (!(kData instanceof double[][][][] k4)) {
                throw new InputException(file + ": k is not a 4-D float64 dataset [p][T][bin][g]");
            }
            double[] k = new double[p.length * t.length * lower.length * g.length];
            int o = 0;
            for (double[][][] byT : k4) {
                for (double[][] byBin : byT) {
                    for (double[] kg : byBin) {
                        System.arraycopy(kg, 0, k, o, kg.length);
                        o += kg.length;
                    }
                }
            }
            if (o != k.length) {
                throw new InputException(file + ": k does not have the shape [p][T][bin][g]");
            }
            String meanName = perGram ? KTableLayout.BAND_MEAN_PER_GRAM : KTableLayout.BAND_MEAN_PER_MOLECULE;
            String teName = perGram ? KTableLayout.TRANSMISSION_EQUIVALENT_PER_GRAM
                    : KTableLayout.TRANSMISSION_EQUIVALENT_PER_MOLECULE;
            double[] mean = children.containsKey(meanName) ? band(dataset(file, h5, meanName)) : null;
            double[] te = children.containsKey(teName) ? band(dataset(file, h5, teName)) : null;
            Map<String, String> metadata = new LinkedHashMap<>();
            for (Map.Entry<String, Attribute> e : h5.getAttributes().entrySet()) {
                Object v = e.getValue().getData();
                metadata.put(e.getKey(), v instanceof String s ? s : String.valueOf(v));
            }
            return new KTableContent(p, t, lower, upper, g, w, k, points, mean, te, perGram, metadata);
        }
    }

    private static double[] band(Dataset d) {
        double[][][] a = (double[][][]) d.getData();
        List<double[]> rows = new ArrayList<>();
        for (double[][] byT : a) {
            for (double[] row : byT) {
                rows.add(row);
            }
        }
        return concat(rows);
    }

    private static double[] doubles(Path file, HdfFile h5, String name) {
        if (!(dataset(file, h5, name).getData() instanceof double[] a)) {
            throw new InputException(file + ": dataset /" + name + " is not a 1-D float64 array");
        }
        return a;
    }

    private static Dataset dataset(Path file, HdfFile h5, String name) {
        try {
            return h5.getDatasetByPath("/" + name);
        } catch (RuntimeException e) {
            throw new InputException(file + ": no dataset /" + name + " (not a linewright k-table?)");
        }
    }
}
