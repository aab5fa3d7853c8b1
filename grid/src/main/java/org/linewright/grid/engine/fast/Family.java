package org.linewright.grid.engine.fast;

import org.linewright.broadening.wings.WingKernel;

/**
 * One family of lines in a {@link FastPlan}: lines of one width kind (Voigt, Doppler-dominated, pure Lorentz,
 * Lorentz-dominated, and the Voigt and Lorentz-dominated lines whose Lorentz width is large against the cutoff — the
 * "wide" kinds, given their own, finer Lorentz axis), without or with the χ factor, with the width axes chosen for
 * them and the errors those axes were measured to make. Immutable.
 */
final class Family {
    static final int VOIGT = 0;
    static final int DOPPLER_DOMINATED = 1;
    static final int LORENTZ_ONLY = 2;
    static final int LORENTZ_DOMINATED = 3;
    /** Voigt lines with γL at or above the plan's wide split: axes like {@link #VOIGT}, planned on their own. */
    static final int VOIGT_WIDE = 4;
    /** Lorentz-dominated lines with γL at or above the wide split: axes like {@link #LORENTZ_DOMINATED}. */
    static final int LORENTZ_DOMINATED_WIDE = 5;
    /** Width kinds; a family index is a kind, plus this for lines with the χ factor. */
    static final int KINDS = 6;
    /** Families: six width kinds, each without and with the χ factor. */
    static final int COUNT = 2 * KINDS;
    private static final String[] KIND_NAMES = {"voigt", "doppler", "lorentz", "lorentz-dominated", "voigt-wide",
        "lorentz-dominated-wide"};

    /** Family index, 0 … {@link #COUNT} − 1. */
    final int index;
    final int lines;
    final double alphaMin;
    final double alphaMax;
    final double gammaMin;
    final double gammaMax;
    /** Smallest γL/αD of the family's lines (+∞ for pure Lorentz lines). */
    final double minLorentzOverDoppler;
    /** Cutoff, pedestal and (for the χ families) χ factor of this family's lines. */
    final WingKernel kernel;
    final WidthAxis doppler;
    final WidthAxis lorentz;
    final double dopplerError;
    final double lorentzError;
    /** The floored Lorentz axis's first non-zero node, 0 when the axis is not floored. */
    final double lorentzFloorCm1;
    /** Index of the family's first slice in the plan's slice list. */
    final int firstSlice;
    /** Index of the family's first stencil key (its slices' line buckets). */
    final int firstKey;
    /** Whether this family's slices take the analytic kernel transform with wing correction. */
    final boolean analytic;

    Family(int index, FamilyStatistics stats, WingKernel kernel, WidthAxis doppler, WidthAxis lorentz,
           double dopplerError, double lorentzError, double lorentzFloorCm1, int firstSlice, int firstKey,
           boolean analytic) {
        this.index = index;
        this.lines = stats.lines;
        this.alphaMin = stats.alphaMin;
        this.alphaMax = stats.alphaMax;
        this.gammaMin = stats.gammaMin;
        this.gammaMax = stats.gammaMax;
        this.minLorentzOverDoppler = stats.minLorentzOverDoppler;
        this.kernel = kernel;
        this.doppler = doppler;
        this.lorentz = lorentz;
        this.dopplerError = dopplerError;
        this.lorentzError = lorentzError;
        this.lorentzFloorCm1 = lorentzFloorCm1;
        this.firstSlice = firstSlice;
        this.firstKey = firstKey;
        this.analytic = analytic;
    }

    static int kind(int familyIndex) {
        return familyIndex % KINDS;
    }

    /** The kind whose axes a family takes: a wide kind's narrow counterpart, else the family's own kind. */
    static int axisKind(int familyIndex) {
        int kind = kind(familyIndex);
        return kind == VOIGT_WIDE ? VOIGT : (kind == LORENTZ_DOMINATED_WIDE ? LORENTZ_DOMINATED : kind);
    }

    /** The wide counterpart of a Voigt or Lorentz-dominated kind; any other kind unchanged. */
    static int wide(int kind) {
        return kind == VOIGT ? VOIGT_WIDE : (kind == LORENTZ_DOMINATED ? LORENTZ_DOMINATED_WIDE : kind);
    }

    static boolean withChi(int familyIndex) {
        return familyIndex >= KINDS;
    }

    /** The family's name in plan entries: {@code voigt}, {@code doppler-chi}, … */
    static String name(int familyIndex) {
        return KIND_NAMES[kind(familyIndex)] + (withChi(familyIndex) ? "-chi" : "");
    }

    /** Width slices (Doppler nodes × Lorentz nodes). */
    int slices() {
        return doppler.size() * lorentz.size();
    }

    /** Width ranges of the lines of one family, gathered while planning. */
    static final class FamilyStatistics {
        double alphaMin = Double.POSITIVE_INFINITY;
        double alphaMax = 0;
        double gammaMin = Double.POSITIVE_INFINITY;
        double gammaMax = 0;
        int lines;
        double minLorentzOverDoppler = Double.POSITIVE_INFINITY;

        void add(double alphaCm1, double gammaCm1) {
            lines++;
            alphaMin = Math.min(alphaMin, alphaCm1);
            alphaMax = Math.max(alphaMax, alphaCm1);
            gammaMin = Math.min(gammaMin, gammaCm1);
            gammaMax = Math.max(gammaMax, gammaCm1);
            if (alphaCm1 > 0) {
                minLorentzOverDoppler = Math.min(minLorentzOverDoppler, gammaCm1 / alphaCm1);
            }
        }
    }
}
