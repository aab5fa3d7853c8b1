package org.linewright.grid.engine.fast;

import org.linewright.grid.engine.ParallelTasks;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutorService;
import org.jtransforms.fft.DoubleFFT_1D;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VoigtProfile;
import org.linewright.broadening.wings.WingKernel;

/**
 * Convolves one segment's width slices with their kernels and sums them in the frequency domain: σ's spectrum on
 * the segment's ring, ready for one inverse transform.
 *
 * <p>Per slice: its lines spread on the ring ({@link LineDistribution#spread}), one forward FFT, times the kernel's
 * transform. A <i>sampled</i> kernel is the truncated profile at multiples of h, transformed numerically
 * ({@link #sampleKernel}). An <i>analytic</i> kernel's transform is the closed form of the untruncated, periodised
 * profile minus its Lorentz node's wing corrections, K_s − Ĉ_γ − (s²/2)·D̂_γ ({@link AnalyticKernels}); Ĉ_γ and D̂_γ
 * are transformed at the node's first slice and kept for its other slices (which follow it in the work order), or
 * kept across segments ({@link CorrectionCache}) when the plan says so.
 *
 * <p><b>Determinism.</b> The non-empty slices are split into {@value #BLOCKS} fixed contiguous blocks; each block
 * sums its slices' spectra in slice order, and the caller sums the blocks in block order, so σ is bitwise the same
 * for any thread count.
 */
final class SliceConvolver {
    /** Fixed number of slice blocks (independent of the thread count, for bitwise identical sums). */
    static final int BLOCKS = 8;
    /**
     * Curvature corrections whose effect is below this fraction of a line's peak are left out: far below the
     * transforms' round-off (64·2⁻⁵²·log₂L ≈ 3×10⁻¹³ of the peak) and 10⁻⁷ relative at the criterion's depth.
     */
    static final double NEGLIGIBLE_CURVATURE = 1e-13;

    private final FastPlan plan;
    private final ExecutorService pool;
    private final boolean removePedestal;
    private final int length;
    private final DoubleFFT_1D fft;
    private final double[] offsetsCm1;
    private final double[] sinSquared;
    private final CorrectionCache cache;
    /** The blocks' spectra and the threads' scratch, reused by every segment. */
    private final double[][] spectra = new double[BLOCKS][];
    private final ConcurrentLinkedQueue<double[][]> scratch = new ConcurrentLinkedQueue<>();
    /** Slices convolved in any segment. */
    final boolean[] sliceUsed;

    SliceConvolver(FastPlan plan, ExecutorService pool, boolean removePedestal, double[] sinSquaredOrNull) {
        this.plan = plan;
        this.pool = pool;
        this.removePedestal = removePedestal;
        this.length = plan.layout.ringLength();
        this.fft = new DoubleFFT_1D(length);
        int maxReach = 0;
        for (int r : plan.sliceReach) {
            maxReach = Math.max(maxReach, r);
        }
        this.offsetsCm1 = new double[maxReach + 1];
        for (int r = 0; r <= maxReach; r++) {
            offsetsCm1[r] = r * plan.stepCm1;
        }
        this.sinSquared = sinSquaredOrNull;
        this.cache = plan.shareCorrections ? new CorrectionCache() : null;
        this.sliceUsed = new boolean[plan.slices()];
    }

    /** One slice to convolve: its node indices and correction group. */
    private record Slice(Family family, int dopplerNode, int lorentzNode, double dopplerCm1, double lorentzCm1,
                         int reach, int group) {
    }

    /** What a segment's convolution took, and its spectrum. */
    static final class Counts {
        int slices;
        int ffts;
        int analyticSlices;
        int corrections;
        double aliasError;
        double curvatureError;

        void add(Counts other) {
            slices += other.slices;
            ffts += other.ffts;
            analyticSlices += other.analyticSlices;
            corrections += other.corrections;
            aliasError = Math.max(aliasError, other.aliasError);
            curvatureError = Math.max(curvatureError, other.curvatureError);
        }
    }

    /**
     * σ of the segment whose lines {@code dist} holds, on the ring (real space, after the inverse transform), or null
     * when no slice has a line there.
     */
    double[] convolve(LineDistribution dist, Counts counts) {
        // the non-empty slices in family order; within an analytic family Lorentz-node major, so that the slices
        // sharing a Lorentz node (and so a wing correction) are contiguous; otherwise Doppler-node major
        List<Slice> work = new ArrayList<>();
        int groups = 0;
        for (Family f : plan.families) {
            if (f == null) {
                continue;
            }
            int nl = f.lorentz.size();
            int ng = f.doppler.size();
            for (int outer = 0; outer < (f.analytic ? nl : ng); outer++) {
                boolean groupUsed = false;
                for (int inner = 0; inner < (f.analytic ? ng : nl); inner++) {
                    int ig = f.analytic ? inner : outer;
                    int il = f.analytic ? outer : inner;
                    if (dist.linesOfSlice(f, ig, il) > 0) {
                        int s = f.firstSlice + ig * nl + il;
                        sliceUsed[s] = true;
                        double[] w = plan.sliceWidths[s];
                        work.add(new Slice(f, ig, il, w[0], w[1], plan.sliceReach[s], f.analytic ? groups : -1));
                        groupUsed = true;
                    }
                }
                if (f.analytic && groupUsed) {
                    groups++;
                }
            }
        }
        counts.slices += work.size();
        if (work.isEmpty()) {
            return null;
        }
        int blocks = Math.min(BLOCKS, work.size());
        List<Callable<BlockOutput>> tasks = new ArrayList<>();
        for (int b = 0; b < blocks; b++) {
            int from = (int) ((long) b * work.size() / blocks);
            int to = (int) ((long) (b + 1) * work.size() / blocks);
            List<Slice> mine = work.subList(from, to);
            if (spectra[b] == null) {
                spectra[b] = new double[length];
            }
            double[] spectrum = spectra[b];
            tasks.add(() -> {
                // lines and kernel scratch: at most one pair per running thread, fully overwritten before use
                double[][] pair = scratch.poll();
                if (pair == null) {
                    pair = new double[][] {new double[length], new double[length]};
                }
                try {
                    return convolveBlock(mine, dist, spectrum, pair[0], pair[1]);
                } finally {
                    scratch.add(pair);
                }
            });
        }
        double[][] blockSpectra = new double[blocks][];
        List<BlockOutput> outputs = ParallelTasks.invokeAll(pool, tasks, "convolving the fast engine's slices");
        for (int b = 0; b < blocks; b++) {
            BlockOutput out = outputs.get(b);
            blockSpectra[b] = out.spectrum;
            counts.ffts += out.ffts;
            counts.analyticSlices += out.analyticSlices;
            counts.corrections += out.corrections;
            counts.aliasError = Math.max(counts.aliasError, out.aliasError);
            counts.curvatureError = Math.max(counts.curvatureError, out.curvatureError);
        }
        // the blocks' spectra summed in block order, then one inverse transform
        double[] total = blockSpectra[0];
        for (int b = 1; b < blocks; b++) {
            double[] add = blockSpectra[b];
            for (int i = 0; i < length; i++) {
                total[i] += add[i];
            }
        }
        fft.realInverse(total, true);
        counts.ffts++;
        return total;
    }

    /** One block's spectrum and counts. */
    private static final class BlockOutput {
        double[] spectrum;
        int ffts;
        int analyticSlices;
        int corrections;
        double aliasError;
        double curvatureError;
    }

    /**
     * Sums the spectra of a block's slices, in order: spectrum(lines) × spectrum(kernel).
     */
    private BlockOutput convolveBlock(List<Slice> mine, LineDistribution dist, double[] spectrum, double[] lines,
                                      double[] kernel) {
        int half = length / 2;
        BlockOutput out = new BlockOutput();
        // the block's spectrum is kept from segment to segment: cleared here
        Arrays.fill(spectrum, 0.0);
        double[] profile = new double[offsetsCm1.length];
        boolean anyGroup = false;
        for (Slice s : mine) {
            anyGroup |= s.group >= 0 && s.lorentzCm1 > 0;
        }
        boolean own = anyGroup && cache == null;
        double[] plainCorrection = own ? new double[half + 1] : null;
        double[] curvatureCorrection = own ? new double[half + 1] : null;
        int loadedGroup = -1;
        boolean curvatureLoaded = false;
        for (Slice s : mine) {
            dist.spread(s.family, s.dopplerNode, s.lorentzNode, lines);
            fft.realForward(lines);
            out.ffts++;
            boolean corrected = s.group >= 0 && s.lorentzCm1 > 0;
            if (corrected && s.group != loadedGroup) {
                if (own) {
                    correctionTransform(s.lorentzCm1, false, kernel, plainCorrection);
                    out.ffts++;
                    out.corrections++;
                } else {
                    plainCorrection = cache.get(s.lorentzCm1, false, kernel, out);
                }
                // the curvature term's largest effect, relative to the node's lowest line peak: left out (one FFT
                // less) when far below round-off, and then counted in the estimate
                double widestDoppler = s.family.doppler.widthCm1(s.family.doppler.size() - 1);
                double curvature = curvatureBound(widestDoppler, s.lorentzCm1, plan.analyticCutoffCm1);
                curvatureLoaded = curvature > NEGLIGIBLE_CURVATURE;
                if (curvatureLoaded && own) {
                    correctionTransform(s.lorentzCm1, true, kernel, curvatureCorrection);
                    out.ffts++;
                } else if (curvatureLoaded) {
                    curvatureCorrection = cache.get(s.lorentzCm1, true, kernel, out);
                } else {
                    out.curvatureError = Math.max(out.curvatureError, curvature / plan.effectiveDepth);
                }
                loadedGroup = s.group;
            }
            double tail = s.group >= 0
                    ? AnalyticKernels.voigtTransform(s.dopplerCm1, s.lorentzCm1, plan.stepCm1, length, kernel) : -1;
            if (tail >= 0) {
                out.analyticSlices++;
                // a line's weakest point of interest is 10⁻⁶ of its peak; the neglected aliases are at most
                // tail/h anywhere in real space
                double peak = VoigtProfile.value(0, s.dopplerCm1, s.lorentzCm1);
                out.aliasError = Math.max(out.aliasError, tail / (plan.stepCm1 * plan.effectiveDepth * peak));
                if (corrected && curvatureLoaded) {
                    double w = 0.5 * AnalyticKernels.dopplerVariance(s.dopplerCm1);
                    for (int k = 0; k <= half; k++) {
                        kernel[k] -= plainCorrection[k] + w * curvatureCorrection[k];
                    }
                } else if (corrected) {
                    for (int k = 0; k <= half; k++) {
                        kernel[k] -= plainCorrection[k];
                    }
                }
                // packed real-FFT layout: [Re0, Re(L/2), Re1, Im1, Re2, Im2, ...]; the kernel is real and even
                spectrum[0] += lines[0] * kernel[0];
                spectrum[1] += lines[1] * kernel[half];
                for (int k = 1; k < half; k++) {
                    double c = kernel[k];
                    spectrum[2 * k] += lines[2 * k] * c;
                    spectrum[2 * k + 1] += lines[2 * k + 1] * c;
                }
            } else {
                sampleKernel(s.family.kernel, s.dopplerCm1, s.lorentzCm1, offsetsCm1, s.reach, profile, kernel);
                fft.realForward(kernel);
                out.ffts++;
                multiplyAdd(lines, kernel, spectrum);
            }
        }
        out.spectrum = spectrum;
        return out;
    }

    /**
     * Bound of the curvature correction's effect, (s²/2)·max|L''| beyond R, relative to the peak of the node's
     * widest line: (s²/2)·6γ/(π(R² + γ²)²) / V(0; αD, γ) (|L''(x)| ≤ 6γ/(π(x² + γ²)²) for any x).
     */
    static double curvatureBound(double dopplerCm1, double lorentzCm1, double cutoffCm1) {
        double r2 = cutoffCm1 * cutoffCm1 + lorentzCm1 * lorentzCm1;
        double curvature = 6 * lorentzCm1 / (Math.PI * r2 * r2);
        return 0.5 * AnalyticKernels.dopplerVariance(dopplerCm1) * curvature
                / VoigtProfile.value(0, dopplerCm1, lorentzCm1);
    }

    /** spectrum += a × b, both in the packed real-FFT layout [Re0, Re(L/2), Re1, Im1, Re2, Im2, ...]. */
    private static void multiplyAdd(double[] a, double[] b, double[] spectrum) {
        spectrum[0] += a[0] * b[0];
        spectrum[1] += a[1] * b[1];
        for (int i = 2; i < a.length; i += 2) {
            double ar = a[i];
            double ai = a[i + 1];
            double br = b[i];
            double bi = b[i + 1];
            spectrum[i] += ar * br - ai * bi;
            spectrum[i + 1] += ar * bi + ai * br;
        }
    }

    /**
     * The transform of a Lorentz node's correction kernel c_γ (or d_γ), real and even, so real: its values at
     * k = 0 … L/2 in {@code half}; the imaginary parts the FFT returns are round-off and are left out.
     */
    private void correctionTransform(double lorentzCm1, boolean second, double[] work, double[] half) {
        AnalyticKernels.correctionKernel(lorentzCm1, offsetsCm1, plan.analyticCutoffCm1, removePedestal,
                plan.stepCm1, sinSquared, second, work);
        fft.realForward(work);
        int n = half.length - 1;
        half[0] = work[0];
        half[n] = work[1];
        for (int k = 1; k < n; k++) {
            half[k] = work[2 * k];
        }
    }

    /**
     * Transforms of the Lorentz nodes' correction kernels (real, L/2 + 1 values each), kept for all segments of one
     * computation: they depend on γ, the ring length, the step and the cutoff only. Whichever block first needs
     * one computes it; the values do not depend on which, so results stay bitwise the same for any thread count.
     */
    private final class CorrectionCache {
        private final ConcurrentHashMap<Long, double[]> plain = new ConcurrentHashMap<>();
        private final ConcurrentHashMap<Long, double[]> curvature = new ConcurrentHashMap<>();

        double[] get(double lorentzCm1, boolean second, double[] work, BlockOutput out) {
            return (second ? curvature : plain).computeIfAbsent(Double.doubleToLongBits(lorentzCm1), k -> {
                double[] half = new double[length / 2 + 1];
                correctionTransform(lorentzCm1, second, work, half);
                out.ffts++;
                if (!second) {
                    out.corrections++;
                }
                return half;
            });
        }
    }

    /**
     * A slice's convolution kernel: the profile at the offsets r·h, r = 0 … reach, cut and de-pedestalled exactly as
     * the exact engine treats a line ({@link WingKernel#addLine}), laid out circularly (r at index r, −r at
     * L − r) and zero elsewhere.
     *
     * @param wings          the wing treatment at this (p, T)
     * @param dopplerCm1     the slice's αD
     * @param lorentzCm1     the slice's γL
     * @param offsetsCm1     r·h for r = 0 … at least {@code reach}
     * @param reach          largest offset index kept, below L/2
     * @param profileScratch scratch of length ≥ reach + 1
     * @param kernelOut      receives the kernel, length L
     */
    static void sampleKernel(WingKernel wings, double dopplerCm1, double lorentzCm1, double[] offsetsCm1, int reach,
                             double[] profileScratch, double[] kernelOut) {
        int length = kernelOut.length;
        Arrays.fill(profileScratch, 0, reach + 1, 0.0);
        wings.addLine(LineShapeKind.VOIGT, offsetsCm1, 0, reach + 1, 0.0, dopplerCm1, lorentzCm1, 1.0,
                profileScratch);
        Arrays.fill(kernelOut, 0.0);
        kernelOut[0] = profileScratch[0];
        for (int r = 1; r <= reach; r++) {
            kernelOut[r] = profileScratch[r];
            kernelOut[length - r] = profileScratch[r];
        }
    }
}
