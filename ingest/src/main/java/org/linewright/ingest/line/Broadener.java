package org.linewright.ingest.line;

/**
 * Foreign broadeners for which a line list may carry per-line parameters beyond air and self
 * (the extra broadener columns of delimited exports). The order is the storage order.
 */
public enum Broadener {
    H2("h2"), HE("he"), CO2("co2"), H2O("h2o");

    private final String columnPrefix;

    Broadener(String columnPrefix) {
        this.columnPrefix = columnPrefix;
    }

    /** Prefix of this broadener's store and CSV columns, e.g. {@code h2} in {@code h2_width_cm1_per_atm}. */
    public String columnPrefix() {
        return columnPrefix;
    }
}
