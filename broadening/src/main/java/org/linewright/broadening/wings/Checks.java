package org.linewright.broadening.wings;

/** Argument checks shared by the wing policies. */
final class Checks {
    private Checks() {
    }

    static void positiveFinite(double value, String what) {
        if (!(value > 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException(what + " must be positive and finite, got " + value);
        }
    }
}
