package org.linewright.grid.engine.fast;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.linewright.broadening.wings.WingTreatment;

/**
 * The fast engine's metadata entries: what the method is (static) and what one computation's plan and run did
 * ({@code fast.*} keys, documented in docs/cross-sections.md).
 */
final class PlanDescription {
    private PlanDescription() {
    }

    /** Entries that do not depend on the lines: method, tolerance, criterion, kernel treatment, wings. */
    static Map<String, String> method(double tolerance, WingTreatment wings) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("engine", FastEngine.ID);
        m.put("fast.method", "discrete integral transform (van den Bekerom & Pannier 2021): 3-D distribution over "
                + "position (6-point Lagrange weights), ln alphaD and ln gammaL (4-point); FFT convolution per width slice");
        m.put("fast.tolerance", Double.toString(tolerance));
        m.put("fast.criterion", FastEngine.CRITERION);
        m.put("fast.kernel", "per-slice Voigt truncated as in the exact engine (cutoff and pedestal at the slice's "
                + "node widths); with a fixed or pressure-scaled cutoff R >> alphaD and no chi factor, closed-form "
                + "transform of the periodised profile corrected per Lorentz node by the transforms of its periodic "
                + "Lorentz wings beyond R and their second derivative (remainder O(alphaD^4/R^4), in the estimate); "
                + "otherwise sampled and transformed numerically");
        m.put("fast.cutoff_edge", "at output points whose position stencil straddles a line's cutoff edge the line's "
                + "transform value is replaced by its exact value (the edge is exact in position)");
        m.putAll(wings.describe());
        return m;
    }

    /** Entries of one computation. */
    static Map<String, String> run(FastPlan plan, SliceConvolver.Counts counts, int distinctSlices, double estimate,
                                   int lines) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("fast.lines", Integer.toString(lines));
        m.put("fast.direct_lines", Integer.toString(plan.directLines));
        if (plan.directLines > 0) {
            m.put("fast.direct_reason", plan.directReason);
        }
        m.put("fast.oversampling", Integer.toString(plan.oversampling));
        m.put("fast.internal_step_cm1", Double.toString(plan.stepCm1));
        m.put("fast.internal_points", Long.toString(plan.internalPoints));
        if (plan.layout != null) {
            m.put("fast.segments", Integer.toString(plan.layout.segments()));
            m.put("fast.segment_fft_length", Integer.toString(plan.layout.ringLength()));
            m.put("fast.segment_points", Long.toString(plan.layout.end(0) - plan.layout.start(0)));
            // kept for readers of the one-ring plan: the length of every FFT done
            m.put("fast.fft_length", Integer.toString(plan.layout.ringLength()));
        }
        m.put("fast.slices", Integer.toString(counts.slices));
        m.put("fast.distinct_slices", Integer.toString(distinctSlices));
        m.put("fast.analytic_slices", Integer.toString(counts.analyticSlices));
        m.put("fast.correction_kernels", Integer.toString(counts.corrections));
        m.put("fast.correction_kernels_shared", Boolean.toString(plan.shareCorrections));
        m.put("fast.ffts", Integer.toString(counts.ffts));
        if (counts.analyticSlices > 0) {
            m.put("fast.analytic_cutoff_cm1", Double.toString(plan.analyticCutoffCm1));
            m.put("fast.wing_model_error", format(plan.wingModelError));
            m.put("fast.alias_error", format(counts.aliasError));
            m.put("fast.omitted_curvature_error", format(counts.curvatureError));
        }
        m.put("fast.edge_correction", Double.isNaN(plan.edgeCutoffCm1) ? "none (no finite cutoff)"
                : "exact at the cutoff " + plan.edgeCutoffCm1 + " cm-1");
        m.put("fast.position_error", format(plan.positionError));
        m.put("fast.width_error", format(plan.widthError));
        m.put("fast.criterion_depth", format(plan.effectiveDepth));
        m.put("fast.round_off_error", format(plan.roundOffError));
        for (Family f : plan.families) {
            if (f != null) {
                String key = "fast.family." + Family.name(f.index);
                m.put(key + ".lines", Integer.toString(f.lines));
                m.put(key + ".doppler_nodes", Integer.toString(f.doppler.size()));
                m.put(key + ".doppler_log_step", Double.toString(f.doppler.logStep()));
                m.put(key + ".lorentz_nodes", Integer.toString(f.lorentz.size()));
                m.put(key + ".lorentz_log_step", Double.toString(f.lorentz.logStep()));
                m.put(key + ".lorentz_floor_cm1", Double.toString(f.lorentzFloorCm1));
                m.put(key + ".kernel", f.analytic ? "analytic" : "sampled");
            }
        }
        m.put("fast.estimated_relative_error", format(estimate));
        return m;
    }

    static String format(double v) {
        return String.format(Locale.ROOT, "%.3e", v);
    }
}
