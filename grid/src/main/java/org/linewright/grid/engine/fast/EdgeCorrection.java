package org.linewright.grid.engine.fast;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import org.linewright.grid.engine.ParallelTasks;

import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingKernel;

/**
 * Makes the cutoff edges exact. With a cutoff R the exact engine's line jumps from S·(V(R) − pedestal)·χ(R) to 0
 * at ν₀ ± R; the transform spreads each line over six position nodes, so near ν₀ ± R some nodes see the kernel and
 * some do not, and the jump comes out blurred over three internal steps each side — an error of the order of the
 * jump itself, large against σ where σ is weak (between bands, in troughs, where a strong line's cut wing is a
 * large part of σ).
 *
 * <p>The correction is local and exact in position: at every output point whose value the transform computed from
 * a stencil that straddles one of the line's edges, the line's transform value — Σ_j w_j·K(q − x_j), its position
 * weights w_j (times S) on the nodes x_j against the truncated kernel at internal offsets, interpolated to the
 * output point on resolving-power grids as {@link OutputSampler} does — is replaced by the exact engine's value
 * ({@link WingKernel#addLine} at the point). K is evaluated with the line's own widths; the slices evaluate it at
 * their node widths and interpolate, so what remains is the width interpolation's error at detunings near R
 * (counted in the plan's edge term). Cost: about 13 profile values and up to 12 output points per line,
 * independent of R and of the grid, computed on the engine's threads.
 */
final class EdgeCorrection {
    private static final int P = FastPlanner.P;
    /** Kernel offsets kept below the last one inside the cutoff: the windows need at most 4 + 3 + 1. */
    private static final int KERNEL_SPAN = 12;

    private EdgeCorrection() {
    }

    /** Lines per task: a fixed split, so the replay order does not depend on the thread count. */
    static final int CHUNK_LINES = 8192;

    /**
     * Applies the correction of every transformed line to the raw output values. The corrections are computed in
     * parallel over fixed chunks of lines, each chunk recording its additions (output index, value) in line order,
     * and then replayed chunk after chunk: every output value receives the same additions in the same order as a
     * single pass over the lines would make, so σ is bitwise the same for any thread count.
     *
     * @param raw σ at the output points as the transform gave it (before clipping)
     */
    static void apply(FastPlan plan, LineBuffer lines, LineDistribution dist, double[] raw, ExecutorService pool,
                      int threads) {
        double cutoff = plan.edgeCutoffCm1;
        if (Double.isNaN(cutoff)) {
            return;
        }
        double h = plan.stepCm1;
        // the last internal offset the kernels keep: r·h ≤ R, computed as the kernels compute their offsets
        long last = (long) Math.floor(cutoff / h);
        while ((last + 1) * h <= cutoff) {
            last++;
        }
        while (last > 0 && last * h > cutoff) {
            last--;
        }
        int lo = (int) Math.max(0, last - KERNEL_SPAN);
        int span = (int) (last - lo + 1);
        double[] offsets = new double[span];
        for (int r = 0; r < span; r++) {
            offsets[r] = (lo + r) * h;
        }
        long finalLast = last;
        int chunks = (lines.count + CHUNK_LINES - 1) / CHUNK_LINES;
        // a few chunks per thread at a time bound the recorded additions (≤ 24 per line)
        int wave = Math.max(1, 2 * threads);
        for (int first = 0; first < chunks; first += wave) {
            List<Callable<Additions>> tasks = new ArrayList<>();
            for (int c = first; c < Math.min(chunks, first + wave); c++) {
                int from = c * CHUNK_LINES;
                int to = Math.min(lines.count, from + CHUNK_LINES);
                tasks.add(() -> corrections(plan, lines, dist, from, to, offsets, lo, finalLast, raw.length));
            }
            for (Additions a : ParallelTasks.invokeAll(pool, tasks, "correcting cutoff edges")) {
                a.replay(raw);
            }
        }
    }

    /** The corrections of lines [from, to), in line order. */
    private static Additions corrections(FastPlan plan, LineBuffer lines, LineDistribution dist, int from, int to,
                                         double[] offsets, int kernelLo, long last, int n) {
        int span = offsets.length;
        double[] kernel = new double[span];
        double[] lambda = new double[P];
        double[] weights = new double[P];
        Additions out = new Additions(24 * (to - from));
        Window window = new Window();
        for (int i = from; i < to; i++) {
            // the line's first node and position weights, computed as the distribution computes them (same bits)
            long f = LineDistribution.firstPoint(plan.originCm1, plan.stepCm1, lines.centerCm1[i],
                    plan.lineFamily[i], dist.lo, dist.hi);
            if (f == LineDistribution.NONE) {
                continue;
            }
            LineDistribution.positionWeights(plan.originCm1, plan.stepCm1, lines.centerCm1[i], lines.strength[i],
                    weights, 0);
            WingKernel wings = plan.families[plan.lineFamily[i]].kernel;
            double a = lines.dopplerCm1[i];
            double g = lines.lorentzCm1[i];
            java.util.Arrays.fill(kernel, 0.0);
            wings.addLine(LineShapeKind.VOIGT, offsets, 0, span, 0.0, a, g, 1.0, kernel);
            // internal points whose six offsets q − f − j straddle an edge: right [f+R+1, f+R+5], left [f−R, f−R+4]
            long leftLo = f - last;
            long leftHi = f - last + P - 2;
            long rightLo = f + last + 1;
            long rightHi = f + last + P - 1;
            if (leftHi >= rightLo - 1) {
                correct(plan, lines, i, f, weights, leftLo, rightHi, kernel, kernelLo, last, wings, lambda, n, window,
                        out);
            } else {
                correct(plan, lines, i, f, weights, leftLo, leftHi, kernel, kernelLo, last, wings, lambda, n, window,
                        out);
                correct(plan, lines, i, f, weights, rightLo, rightHi, kernel, kernelLo, last, wings, lambda, n, window,
                        out);
            }
        }
        return out;
    }

    /**
     * Records the replacement of line i's transform value by the exact value at the output points fed by internal
     * points [qLo, qHi]: first −(transform value) at each point, then the exact line's addition at each point.
     */
    private static void correct(FastPlan plan, LineBuffer lines, int i, long first, double[] weights, long qLo,
                                long qHi,
                                double[] kernel, int kernelLo, long last, WingKernel wings, double[] lambda,
                                int n, Window window, Additions out) {
        double[] points = plan.pointsCm1;
        int from;
        int to;
        if (plan.uniform) {
            int m = plan.oversampling;
            from = (int) Math.max(0, Math.floorDiv(qLo + m - 1, m));
            to = (int) Math.min(n, Math.floorDiv(qHi, m) + 1);
            if (from >= to) {
                return;
            }
            for (int k = from; k < to; k++) {
                out.add(k, -transformValue(first, weights, (long) k * m, kernel, kernelLo, last));
            }
        } else {
            double origin = plan.originCm1;
            double h = plan.stepCm1;
            // output points whose interpolation stencil k0 − 2 … k0 + 3 reaches [qLo, qHi]
            from = WingKernel.firstIndexAtOrAbove(points, 0, n, origin + (qLo - FastPlanner.SHIFT - 1) * h);
            to = from;
            while (to < n && Math.floor((points[to] - origin) / h) <= qHi + FastPlanner.SHIFT) {
                to++;
            }
            for (int k = from; k < to; k++) {
                double pos = (points[k] - origin) / h;
                long k0 = (long) Math.floor(pos);
                LagrangeWeights.centred(P, pos - k0, lambda, 0);
                double value = 0;
                for (int t = 0; t < P; t++) {
                    value += lambda[t] * transformValue(first, weights, k0 - FastPlanner.SHIFT + t, kernel, kernelLo, last);
                }
                out.add(k, -value);
            }
            if (from >= to) {
                return;
            }
        }
        // the exact line on the window's points alone (the same wavenumbers, so the same values), then recorded
        double[] exact = window.exact(points, from, to);
        wings.addLine(LineShapeKind.VOIGT, window.points, 0, to - from, lines.centerCm1[i], lines.dopplerCm1[i],
                lines.lorentzCm1[i], lines.strength[i], exact);
        for (int k = from; k < to; k++) {
            out.add(k, exact[k - from]);
        }
    }

    /** A few consecutive output wavenumbers and a zeroed accumulator for them, reused line after line. */
    private static final class Window {
        double[] points = new double[16];
        private double[] exact = new double[16];

        double[] exact(double[] all, int from, int to) {
            int len = to - from;
            if (len > points.length) {
                points = new double[len];
                exact = new double[len];
            }
            System.arraycopy(all, from, points, 0, len);
            java.util.Arrays.fill(exact, 0, len, 0.0);
            return exact;
        }
    }

    /** Additions to output values in the order they are to be made. */
    private static final class Additions {
        private int[] index;
        private double[] value;
        private int count;

        Additions(int capacity) {
            index = new int[Math.max(16, capacity)];
            value = new double[index.length];
        }

        void add(int k, double v) {
            if (count == index.length) {
                index = java.util.Arrays.copyOf(index, 2 * count);
                value = java.util.Arrays.copyOf(value, 2 * count);
            }
            index[count] = k;
            value[count] = v;
            count++;
        }

        /** raw[k] −= t is raw[k] + (−t) exactly; an added 0 changes no value that matters (clipped at 0 later). */
        void replay(double[] raw) {
            for (int j = 0; j < count; j++) {
                raw[index[j]] += value[j];
            }
        }
    }

    /**
     * Σ_j w_j·K(|q − f − j|) of a line (first node f, position weights w × S) at internal point q, K zero beyond the
     * last offset inside the cutoff.
     */
    private static double transformValue(long first, double[] weights, long q, double[] kernel, int kernelLo,
                                         long last) {
        long r0 = q - first;
        double value = 0;
        for (int j = 0; j < P; j++) {
            long r = Math.abs(r0 - j);
            if (r <= last) {
                // offsets below the kept span never occur in a window (it lies within 8 steps of the edge)
                value += weights[j] * kernel[(int) (r - kernelLo)];
            }
        }
        return value;
    }
}
