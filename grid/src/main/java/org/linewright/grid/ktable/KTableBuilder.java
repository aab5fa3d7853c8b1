package org.linewright.grid.ktable;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.linewright.grid.engine.ParallelTasks;
import org.linewright.grid.table.SigmaTableCells;
import org.linewright.ingest.InputException;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Makes a k-table of a σ table: reads one (p, T) cell at a time ({@link SigmaTableCells}), sorts the σ values of
 * each spectral bin and takes the N k_i of the quadrature ({@link KDistribution}), then writes the table
 * ({@link KTableWriter}). Memory holds one σ cell plus the k-table itself (p·T·bins·N values). The bins of a cell
 * are shared out to the threads in fixed blocks; each bin is computed on its own, so the bits are the same for any
 * thread count.
 */
public final class KTableBuilder {
    /**
     * What a user of the table should know about its accuracy (metadata {@code transmittance_accuracy_note}), from
     * the measurements in docs/physics.md.
     */
    public static final String ACCURACY_NOTE = "homogeneous-path band transmittance sum w_i exp(-k_i u) is exact as "
            + "u -> 0 (sum w_i k_i = band-mean sigma) and errs low on thick paths; measured on real CO and CO2 sigma "
            + "tables (10 cm-1 bins, Gauss-Legendre) the worst relative error where T >= 1e-3 was 21 % with 8 g points, "
            + "4.5 % with 16, 1.3 % with 32 (where T >= 0.1: 4 %, 0.95 %, 0.35 %); see docs/physics.md";
    /** Bins per parallel task. */
    private static final int BINS_PER_TASK = 64;

    private KTableBuilder() {
    }

    /**
     * What was made.
     *
     * @param content  the k-table
     * @param written  the file, or null when not written
     * @param warnings what the user should know (under-resolved bins)
     */
    public record Report(KTableContent content, KTableWriter.Written written, List<String> warnings) {
    }

    /** Computes the k-table of {@code sigmaTable} and writes it to {@code out} (format by extension). */
    public static Report build(Path sigmaTable, KTableRequest request, int threads, Path out) throws IOException {
        org.linewright.grid.table.TableFormat.of(out); // reject a bad extension before the work
        Report r = compute(sigmaTable, request, threads);
        return new Report(r.content(), KTableWriter.write(out, r.content()), r.warnings());
    }

    /** Computes the k-table of {@code sigmaTable} in memory. */
    public static Report compute(Path sigmaTable, KTableRequest request, int threads) throws IOException {
        if (threads < 1) {
            throw new IllegalArgumentException("threads: " + threads);
        }
        State s = new State(sigmaTable, request);
        ExecutorService pool = threads == 1 ? null : Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "ktable");
            t.setDaemon(true);
            return t;
        });
        try {
            SigmaTableCells.read(sigmaTable, s::header, (p, t, row) -> s.cell(p, t, row, pool));
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
        }
        return s.finish(SourceMetadata.sha256(sigmaTable));
    }

    /** The work of one build. */
    private static final class State {
        private final Path file;
        private final KTableRequest request;
        private final GQuadrature q;
        private SigmaTableCells.Header header;
        private SpectralBins bins;
        private int[] ranges;
        private int[] counts;
        private double[] k;
        private double[] bandMean;
        private double[] transmissionEquivalent;
        private int maxCount;

        State(Path file, KTableRequest request) {
            this.file = file;
            this.request = request;
            this.q = request.quadrature();
        }

        void header(SigmaTableCells.Header h) {
            header = h;
            double[] nu = h.wavenumberCm1();
            bins = request.binning().bins(nu[0], nu[nu.length - 1]);
            double lo = bins.lowerCm1(0);
            double hi = bins.upperCm1(bins.count() - 1);
            if (lo < nu[0] || hi > nu[nu.length - 1]) {
                throw new InputException(file + ": bins from " + lo + " to " + hi + " cm-1 reach outside the table's "
                        + "wavenumber range [" + nu[0] + ", " + nu[nu.length - 1] + "] cm-1");
            }
            ranges = bins.pointRanges(nu);
            counts = new int[bins.count()];
            for (int b = 0; b < counts.length; b++) {
                counts[b] = ranges[b + 1] - ranges[b];
                if (counts[b] == 0) {
                    throw new InputException(String.format(Locale.ROOT,
                            "%s: bin %d [%.9g, %.9g) cm-1 holds no sigma point of the table (choose wider bins)",
                            file, b + 1, bins.lowerCm1(b), bins.upperCm1(b)));
                }
                maxCount = Math.max(maxCount, counts[b]);
            }
            int cells = h.pressureBar().length * h.temperatureK().length;
            long size = (long) cells * bins.count() * q.size();
            if (size > Integer.MAX_VALUE - 8) {
                throw new InputException(file + ": a k-table of " + size + " values is too large (fewer bins or g points)");
            }
            k = new double[(int) size];
            if (request.bandMean()) {
                bandMean = new double[cells * bins.count()];
            }
            if (!Double.isNaN(request.transmissionColumnCm2())) {
                transmissionEquivalent = new double[cells * bins.count()];
            }
        }

        void cell(int p, int t, double[] row, ExecutorService pool) {
            int nb = bins.count();
            int cellIndex = p * header.temperatureK().length + t;
            if (pool == null) {
                bins(row, cellIndex, 0, nb, new double[maxCount]);
                return;
            }
            List<Callable<Void>> tasks = new ArrayList<>();
            for (int from = 0; from < nb; from += BINS_PER_TASK) {
                int a = from;
                int b = Math.min(nb, from + BINS_PER_TASK);
                tasks.add(() -> {
                    bins(row, cellIndex, a, b, new double[maxCount]);
                    return null;
                });
            }
            ParallelTasks.invokeAll(pool, tasks, "computing k-distributions");
        }

        /** Bins [from, to) of one cell: copy the bin's σ, sort, take k_i and the band σ. */
        private void bins(double[] row, int cellIndex, int from, int to, double[] scratch) {
            int nb = bins.count();
            int nq = q.size();
            double u = request.transmissionColumnCm2();
            for (int b = from; b < to; b++) {
                int n = counts[b];
                System.arraycopy(row, ranges[b], scratch, 0, n);
                KDistribution.ofEqualWeights(scratch, 0, n, q, request.sampling(), k, (cellIndex * nb + b) * nq);
                if (bandMean != null) {
                    bandMean[cellIndex * nb + b] = KDistribution.mean(scratch, 0, n);
                }
                if (transmissionEquivalent != null) {
                    transmissionEquivalent[cellIndex * nb + b] = KDistribution.transmissionEquivalent(scratch, 0, n, u);
                }
            }
        }

        Report finish(String sourceSha256) {
            boolean perGram = !Double.isNaN(request.massGPerMol());
            if (perGram) {
                // cm²/molecule → cm²/g: × N_A / M
                double f = PhysicalConstants.AVOGADRO_PER_MOL / request.massGPerMol();
                scale(k, f);
                scale(bandMean, f);
                scale(transmissionEquivalent, f);
            }
            int nb = bins.count();
            int nq = q.size();
            List<String> warnings = new ArrayList<>();
            int minCount = Integer.MAX_VALUE;
            int underResolved = 0;
            int firstUnder = -1;
            for (int b = 0; b < nb; b++) {
                minCount = Math.min(minCount, counts[b]);
                if (counts[b] < nq) {
                    underResolved++;
                    if (firstUnder < 0) {
                        firstUnder = b;
                    }
                }
            }
            if (underResolved > 0) {
                warnings.add(String.format(Locale.ROOT, "%d of %d bins hold fewer sigma points than g points (%d; "
                        + "fewest %d, first at bin %d [%.9g, %.9g) cm-1): their k(g) is a step function of so few "
                        + "values that it is only as good as the sigma table's sampling; use a finer sigma grid or "
                        + "wider bins", underResolved, nb, nq, minCount, firstUnder + 1, bins.lowerCm1(firstUnder),
                        bins.upperCm1(firstUnder)));
            }
            Map<String, String> m = new LinkedHashMap<>();
            m.put("ktable_format", KTableLayout.FORMAT_VERSION);
            header.metadata().forEach((key, v) -> {
                // the source's own format keys describe the σ file: kept under source_*
                if (key.equals("table_format") || key.equals("sigma_precision")) {
                    m.put("source_" + key, v);
                } else {
                    m.put(key, v);
                }
            });
            m.put("source_table_file", file.getFileName().toString());
            m.put("source_table_sha256", sourceSha256);
            m.put("ktable_tool_version", ToolVersion.get());
            m.put("bin_spacing_kind", bins.kind().id());
            m.put("bins", Integer.toString(nb));
            m.put("g_points", Integer.toString(nq));
            m.put("g_quadrature_kind", q.kind().id());
            m.put("g_quadrature_source", q.kind().source());
            m.put("k_sampling_kind", request.sampling().id());
            m.put("k_ordering", "ascending in g within each bin");
            m.put("transmittance_accuracy_note", ACCURACY_NOTE);
            m.put("sigma_points_per_bin_min", Integer.toString(minCount));
            m.put("under_resolved_bins", Integer.toString(underResolved));
            m.put("under_resolved_rule", "a bin with fewer sigma points than g points");
            m.put("k_unit", perGram ? KTableLayout.UNIT_PER_GRAM : KTableLayout.UNIT_PER_MOLECULE);
            if (perGram) {
                m.put("molar_mass_g_per_mol", Double.toString(request.massGPerMol()));
                m.put("molar_mass_source", request.massSource() == null ? "given" : request.massSource());
            }
            if (transmissionEquivalent != null) {
                m.put("transmission_column_per_cm2", Double.toString(request.transmissionColumnCm2()));
            }
            for (int i = 0; i < warnings.size(); i++) {
                m.put("ktable_warning." + (i + 1), warnings.get(i));
            }
            double[] lower = new double[nb];
            double[] upper = new double[nb];
            for (int b = 0; b < nb; b++) {
                lower[b] = bins.lowerCm1(b);
                upper[b] = bins.upperCm1(b);
            }
            KTableContent c = new KTableContent(header.pressureBar(), header.temperatureK(), lower, upper, q.nodes(),
                    q.weights(), k, counts, bandMean, transmissionEquivalent, perGram, m);
            return new Report(c, null, List.copyOf(warnings));
        }

        private static void scale(double[] a, double f) {
            if (a != null) {
                for (int i = 0; i < a.length; i++) {
                    a[i] *= f;
                }
            }
        }
    }
}
