package org.linewright.grid.table;

import java.io.IOException;

/**
 * σ(ν) of a table, one (pressure, temperature) at a time, so writers can stream tables that do not fit in memory
 * twice over. Indices follow the table's pressure and temperature axes.
 */
@FunctionalInterface
public interface SigmaSource {
    /** σ in cm²/molecule at every wavenumber of the table, for pressure {@code p} and temperature {@code t}. */
    double[] sigma(int p, int t) throws IOException;
}
