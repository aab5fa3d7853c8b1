package org.linewright.grid.engine.fast;

import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * What the fast engine does for one (p, T), chosen by {@link FastPlanner} before any convolution: the internal grid,
 * the families of lines with their width axes, the width slices, the segment layout, which lines are summed
 * directly instead, and the a-priori part of the error estimate. Immutable (its arrays are not changed after
 * planning).
 */
final class FastPlan {
    /** Per-line family code of a line summed directly (exactly) rather than through the transform. */
    static final byte DIRECT = -1;

    final WavenumberGrid grid;
    final double[] pointsCm1;
    final boolean uniform;
    /** Refinement of the output step; internal step h = output step / m. */
    final int oversampling;
    final double stepCm1;
    /** Wavenumber of internal point 0. */
    final double originCm1;
    final long internalPoints;
    /** Families by index ({@link Family#COUNT}); null where no line belongs. */
    final Family[] families;
    /** Stencil keys over all families (Doppler nodes × Lorentz nodes of each). */
    final int keys;
    /** Family index of every line, or {@link #DIRECT}. */
    final byte[] lineFamily;
    final int directLines;
    /** Why lines are summed directly (empty when none are). */
    final String directReason;
    /** (αD, γL) of every slice. */
    final double[][] sliceWidths;
    /** Kernel reach of every slice, in internal steps. */
    final int[] sliceReach;
    /** Largest kernel reach, internal steps. */
    final long reach;
    /** Internal points kept each side of a segment for the output interpolation (0 on uniform grids). */
    final int margin;
    /** Ring index of a segment's first owned point, less the margin. */
    final int offset;
    final SegmentLayout layout;
    /** The width-independent finite cutoff of the analytic kernels, or NaN. */
    final double analyticCutoffCm1;
    /** Largest wing-model remainder of the analytic families. */
    final double wingModelError;
    final boolean anyAnalytic;
    /** Whether the Lorentz nodes' correction transforms are kept across segments. */
    final boolean shareCorrections;
    /** The cutoff at whose edges lines are corrected exactly ({@link EdgeCorrection}), or NaN for none. */
    final double edgeCutoffCm1;
    /** Largest position error (counted twice on resolving-power grids). */
    final double positionError;
    /** Largest Doppler + Lorentz axis error over the families. */
    final double widthError;
    final double roundOffError;
    /**
     * The criterion's depth the errors were measured to: 10⁻⁶, lowered by the ratio of the strongest line peak to a
     * lower bound of max σ on the grid when the grid samples peaks coarsely.
     */
    final double effectiveDepth;

    FastPlan(Builder b) {
        grid = b.grid;
        pointsCm1 = b.grid.pointsCm1();
        uniform = b.uniform;
        oversampling = b.oversampling;
        stepCm1 = b.stepCm1;
        originCm1 = b.originCm1;
        internalPoints = b.internalPoints;
        families = b.families;
        keys = b.keys;
        lineFamily = b.lineFamily;
        directLines = b.directLines;
        directReason = b.directReason;
        sliceWidths = b.sliceWidths;
        sliceReach = b.sliceReach;
        reach = b.reach;
        margin = b.margin;
        offset = b.offset;
        layout = b.layout;
        analyticCutoffCm1 = b.analyticCutoffCm1;
        wingModelError = b.wingModelError;
        anyAnalytic = b.anyAnalytic;
        shareCorrections = b.shareCorrections;
        edgeCutoffCm1 = b.edgeCutoffCm1;
        positionError = b.positionError;
        widthError = b.widthError;
        roundOffError = b.roundOffError;
        effectiveDepth = b.effectiveDepth;
    }

    /** Lines that go through the transform. */
    int transformedLines() {
        return lineFamily.length - directLines;
    }

    int slices() {
        return sliceWidths.length;
    }

    /**
     * The a-priori estimate: width axes (their cutoff-edge terms included), position and round-off (the analytic
     * terms come at run time).
     */
    double plannedError() {
        return widthError + positionError + roundOffError;
    }

    /** Mutable fields the planner fills. */
    static final class Builder {
        WavenumberGrid grid;
        boolean uniform;
        int oversampling = 1;
        double stepCm1;
        double originCm1;
        long internalPoints;
        Family[] families = new Family[Family.COUNT];
        int keys;
        byte[] lineFamily = new byte[0];
        int directLines;
        String directReason = "";
        double[][] sliceWidths = new double[0][];
        int[] sliceReach = new int[0];
        long reach;
        int margin;
        int offset;
        SegmentLayout layout;
        double analyticCutoffCm1 = Double.NaN;
        double wingModelError;
        boolean anyAnalytic;
        boolean shareCorrections;
        double edgeCutoffCm1 = Double.NaN;
        double positionError;
        double widthError;
        double roundOffError;
        double effectiveDepth = FastErrorModel.DEPTH;
    }
}
