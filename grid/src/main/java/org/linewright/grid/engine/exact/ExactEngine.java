package org.linewright.grid.engine.exact;

import org.linewright.grid.engine.ParallelTasks;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicInteger;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * The reference engine: direct summation of every line's profile on every grid point within its cutoff,
 * <pre>
 *   σ(ν_j) = Σ_i S_i · [V(ν_j − ν_i; αD_i, γL_i)·χ_i(ν_j − ν_i) − pedestal_i]     for |ν_j − ν_i| ≤ d_i
 * </pre>
 * with V the area-normalised Voigt profile evaluated by {@link org.linewright.broadening.voigt.VoigtProfile}
 * (Faddeeva function by Humlíček/Weideman-type methods, relative error below 1×10⁻⁹ in the far-wing closed
 * forms and 1×10⁻¹³ near the centre; the pure Doppler and Lorentz shapes are its limits αD = 0 or γL = 0), and
 * the cutoff d_i, pedestal and χ factor applied by {@link WingKernel}. A line flagged
 * {@link LineChunk#vanVleckWeisskopf} gets the Van Vleck–Weisskopf shape
 * (ν/ν₀)²·[V(ν − ν₀) + V(ν + ν₀)] instead (J.H. Van Vleck and V.F. Weisskopf, Rev. Mod. Phys. 17 (1945) 227; see
 * {@link org.linewright.broadening.voigt.VanVleckWeisskopfProfile}) on the grid points within its cutoff. Its error is that of the profile; the
 * {@link #estimatedRelativeError()} is 0.
 *
 * <p>Parallel scheme: the grid is cut into fixed blocks of {@value #BLOCK_POINTS} points (independent of the
 * thread count). For each chunk the lines touching each block are listed in chunk order; the threads then take
 * whole blocks, so every grid point is summed by exactly one thread, in chunk line order. σ is therefore the
 * same bit for bit for any number of threads. The thread pool is created once per engine; per chunk the
 * engine allocates nothing but the task handles (the block lists grow only when a chunk needs more room).
 */
public final class ExactEngine implements CrossSectionEngine {
    /** Engine id in metadata and on the command line. */
    public static final String ID = "exact";
    /** Grid points per block, the unit of work of one thread. */
    public static final int BLOCK_POINTS = 2048;
    /** Most (line, block) pairs listed at once; larger chunks are processed in consecutive runs of lines. */
    static final int MAX_PAIRS = 1 << 22;

    private final int threads;
    private final WingTreatment wings;
    /** Whether σ is summed exactly ({@link FixedPointSums}) instead of in double precision. */
    private final boolean exactSums;
    private FixedPointSums sums;
    /** Per worker thread, a grid-sized scratch row for one line's profile (exact sums only). */
    private final ThreadLocal<double[]> scratch = new ThreadLocal<>();
    private final ExecutorService pool;
    private final List<Callable<Void>> workers = new ArrayList<>();
    private final AtomicInteger nextBlock = new AtomicInteger();

    private WavenumberGrid grid;
    private double[] gridCm1;
    private int blocks;
    private WingKernel kernel;
    private WingKernel kernelNoChi;

    // the chunk being accumulated, visible to the workers through the pool's happens-before edges
    private LineChunk chunk;
    private double[] sigma;
    private int[] lineLo = new int[0];
    private int[] lineHi = new int[0];
    private int[] blockStart = new int[1];
    private int[] blockFill = new int[0];
    private int[] pairs = new int[0];

    /**
     * @param threads worker threads, at least 1 (1 computes on the caller's thread)
     * @param wings   the wing treatment applied to every line
     */
    public ExactEngine(int threads, WingTreatment wings) {
        this(threads, wings, false);
    }

    /**
     * @param threads   worker threads, at least 1 (1 computes on the caller's thread)
     * @param wings     the wing treatment applied to every line
     * @param exactSums whether each line's profile values are added exactly ({@link FixedPointSums}): σ is then
     *                  independent of the order and grouping of the lines, and {@link #sums()} gives the exact
     *                  sums from which lines can later be taken out or added (incremental table builds)
     */
    public ExactEngine(int threads, WingTreatment wings, boolean exactSums) {
        this.exactSums = exactSums;
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1: " + threads);
        }
        this.threads = threads;
        this.wings = Objects.requireNonNull(wings, "wings");
        if (threads > 1) {
            this.pool = Executors.newFixedThreadPool(threads, r -> {
                Thread t = new Thread(r, "linewright-exact");
                t.setDaemon(true);
                return t;
            });
            for (int t = 0; t < threads; t++) {
                workers.add(() -> {
                    work();
                    return null;
                });
            }
        } else {
            this.pool = null;
        }
    }

    @Override
    public void begin(WavenumberGrid newGrid, double pressureAtm, double temperatureK) {
        this.grid = Objects.requireNonNull(newGrid, "grid");
        this.gridCm1 = newGrid.pointsCm1();
        this.blocks = (gridCm1.length + BLOCK_POINTS - 1) / BLOCK_POINTS;
        this.kernel = wings.atConditions(pressureAtm, temperatureK);
        this.kernelNoChi = wings.withChiFactor(ChiFactorKind.NONE).atConditions(pressureAtm, temperatureK);
        this.sums = exactSums ? new FixedPointSums(gridCm1.length) : null;
        if (blockStart.length < blocks + 1) {
            blockStart = new int[blocks + 1];
            blockFill = new int[blocks];
        }
    }

    @Override
    public void accumulate(LineChunk lines, double[] sigmaCm2PerMolecule) {
        if (grid == null) {
            throw new IllegalStateException("begin() was not called");
        }
        if (sigmaCm2PerMolecule.length != gridCm1.length) {
            throw new IllegalArgumentException("sigma has " + sigmaCm2PerMolecule.length + " points, the grid "
                    + gridCm1.length);
        }
        int n = lines.size;
        if (lineLo.length < n) {
            lineLo = new int[lines.capacity()];
            lineHi = new int[lines.capacity()];
        }
        int points = gridCm1.length;
        for (int i = 0; i < n; i++) {
            double d = kernel.cutoffCm1(lines.dopplerHwhmCm1[i], lines.lorentzHwhmCm1[i]);
            double c = lines.centerCm1[i];
            int lo = WingKernel.firstIndexAtOrAbove(gridCm1, 0, points, c - d);
            lineLo[i] = lo;
            lineHi[i] = WingKernel.firstIndexAbove(gridCm1, lo, points, c + d);
        }
        this.chunk = lines;
        this.sigma = sigmaCm2PerMolecule;
        int from = 0;
        while (from < n) {
            int to = listPairs(from, n);
            runBlocks();
            from = to;
        }
        this.chunk = null;
        this.sigma = null;
    }

    /**
     * Lists, per block, the lines of [from, to) touching it, in line order, for the largest {@code to} ≤ n whose
     * pairs fit in {@link #MAX_PAIRS} (at least one line).
     */
    private int listPairs(int from, int n) {
        java.util.Arrays.fill(blockFill, 0, blocks, 0);
        long total = 0;
        int to = from;
        while (to < n) {
            int lo = lineLo[to];
            int hi = lineHi[to];
            int touched = lo >= hi ? 0 : (hi - 1) / BLOCK_POINTS - lo / BLOCK_POINTS + 1;
            if (to > from && total + touched > MAX_PAIRS) {
                break;
            }
            total += touched;
            if (touched > 0) {
                for (int b = lo / BLOCK_POINTS, last = (hi - 1) / BLOCK_POINTS; b <= last; b++) {
                    blockFill[b]++;
                }
            }
            to++;
        }
        if (pairs.length < total) {
            pairs = new int[(int) Math.max(total, Math.min(MAX_PAIRS, 2 * total))];
        }
        blockStart[0] = 0;
        for (int b = 0; b < blocks; b++) {
            blockStart[b + 1] = blockStart[b] + blockFill[b];
            blockFill[b] = blockStart[b];
        }
        for (int i = from; i < to; i++) {
            int lo = lineLo[i];
            int hi = lineHi[i];
            if (lo >= hi) {
                continue;
            }
            for (int b = lo / BLOCK_POINTS, last = (hi - 1) / BLOCK_POINTS; b <= last; b++) {
                pairs[blockFill[b]++] = i;
            }
        }
        return to;
    }

    private void runBlocks() {
        nextBlock.set(0);
        if (pool == null) {
            work();
            return;
        }
        ParallelTasks.invokeAll(pool, workers, "summing line profiles");
    }

    /** Takes blocks until none is left; each block's lines are added in chunk order. */
    private void work() {
        LineChunk c = chunk;
        double[] g = gridCm1;
        int points = g.length;
        double[] out = sigma;
        if (exactSums) {
            out = scratch.get();
            if (out == null || out.length != points) {
                out = new double[points];
                scratch.set(out);
            }
        }
        for (int b = nextBlock.getAndIncrement(); b < blocks; b = nextBlock.getAndIncrement()) {
            int blockFrom = b * BLOCK_POINTS;
            int blockTo = Math.min(points, blockFrom + BLOCK_POINTS);
            for (int p = blockStart[b], end = blockStart[b + 1]; p < end; p++) {
                int i = pairs[p];
                int from = Math.max(blockFrom, lineLo[i]);
                int to = Math.min(blockTo, lineHi[i]);
                double s = c.intensityCmPerMolecule[i];
                double exempt = c.chiFactor[i] ? c.chiExemptShare[i] : 1.0;
                // the profile is linear in χ: (1 − w)·[line without χ] + w·[line with χ], same cutoff for both
                if (exempt < 1.0) {
                    kernel.addLine(LineShapeKind.VOIGT, c.vanVleckWeisskopf[i], g, from, to, c.centerCm1[i],
                            c.dopplerHwhmCm1[i], c.lorentzHwhmCm1[i], s * (1.0 - exempt), out);
                }
                if (exempt > 0.0) {
                    kernelNoChi.addLine(LineShapeKind.VOIGT, c.vanVleckWeisskopf[i], g, from, to, c.centerCm1[i],
                            c.dopplerHwhmCm1[i], c.lorentzHwhmCm1[i], s * exempt, out);
                }
                if (exactSums) {
                    // the line's own values (a function of the line and the grid alone), each added exactly
                    for (int k = from; k < to; k++) {
                        double v = out[k];
                        if (v != 0.0) {
                            sums.add(k, v);
                            out[k] = 0.0;
                        }
                    }
                }
            }
        }
    }

    @Override
    public void finish(double[] sigmaCm2PerMolecule) {
        // direct summation has no deferred work, but for turning the exact sums into σ
        if (exactSums) {
            for (int k = 0; k < sigmaCm2PerMolecule.length; k++) {
                sigmaCm2PerMolecule[k] += sums.value(k);
            }
        }
    }

    /** The exact sums of the last computation (engines made with exact sums), or null. */
    public FixedPointSums sums() {
        return sums;
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("method", "direct summation of Voigt profiles within the cutoff");
        m.put("block_points", Integer.toString(BLOCK_POINTS));
        if (exactSums) {
            m.put("summation", "exact: each value rounded to a multiple of 2^-" + FixedPointSums.FRACTION_BITS
                    + " and summed as a 128-bit integer (independent of line order)");
        }
        return m;
    }

    @Override
    public double estimatedRelativeError() {
        return 0.0;
    }

    /** Worker threads this engine uses. */
    public int threads() {
        return threads;
    }

    @Override
    public void close() {
        if (pool != null) {
            pool.shutdownNow();
        }
    }
}
