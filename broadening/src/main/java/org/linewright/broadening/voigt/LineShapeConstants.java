package org.linewright.broadening.voigt;

/** Mathematical constants shared by the line-shape classes (no physics here). */
final class LineShapeConstants {
    /** √(ln 2). */
    static final double SQRT_LN2 = 0.83255461115769775635;
    /** √(ln 2 / π): peak of the unit-HWHM Gaussian profile. */
    static final double SQRT_LN2_OVER_PI = 0.46971863934982566689;
    /** 1/π. */
    static final double INV_PI = 0.31830988618379067154;
    /**
     * Ratio γL/αD above which the Voigt profile equals the Lorentz profile to double precision: the relative
     * difference is of order (αD/γL)², below 1e-16 here.
     */
    static final double PURE_LORENTZ_WIDTH_RATIO = 1e8;

    private LineShapeConstants() {
    }
}
