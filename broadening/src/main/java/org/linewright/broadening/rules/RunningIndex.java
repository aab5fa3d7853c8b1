package org.linewright.broadening.rules;

/**
 * The running index |m| of a rotational transition, the variable of most broadening rules (common practice;
 * e.g. Tan et al. 2022, ApJS 262, 40): |m| = J''+1 for an R-branch line (J' = J''+1), |m| = J'' for P- and
 * Q-branch lines.
 */
public final class RunningIndex {
    private RunningIndex() {
    }

    /**
     * @param lowerJ J'' (NaN when unknown)
     * @param upperJ J' (NaN when unknown)
     * @return |m|, or NaN when either J is unknown (the branch cannot be told)
     */
    public static double absoluteM(double lowerJ, double upperJ) {
        if (Double.isNaN(lowerJ) || Double.isNaN(upperJ)) {
            return Double.NaN;
        }
        // exact comparison is safe: J values are integers or half-integers, exactly representable
        return upperJ == lowerJ + 1.0 ? lowerJ + 1.0 : lowerJ;
    }
}
