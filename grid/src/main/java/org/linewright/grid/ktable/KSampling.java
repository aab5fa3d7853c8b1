package org.linewright.grid.ktable;

/** How k_i is taken from the sorted σ distribution of a bin (metadata {@code k_sampling_kind}). */
public enum KSampling {
    /**
     * k_i = the mean of k(g) over the g-interval [G_{i−1}, G_i] that weight w_i stands for. Σ w_i k_i is the bin's
     * mean σ exactly, so the thin-path limit of the transmittance is exact; the default.
     */
    INTERVAL_MEAN("interval_mean"),
    /** k_i = k(g_i), the step function sampled at the Gauss node (textbook Gauss quadrature of ∫ exp(−k(g)u) dg). */
    NODE("node");

    private final String id;

    KSampling(String id) {
        this.id = id;
    }

    public String id() {
        return id;
    }
}
