package org.linewright.ingest.source;

/** The line-list formats linewright reads; the ids are the values of the {@code --format} option. */
public enum LineFormat {
    /** The 160-character fixed-column records (2004 and later layout). */
    HITRAN160("hitran160"),
    /** Comma- or tab-separated exports of the same database with a header row of parameter names. */
    HITRAN_DELIMITED("hitran-delimited"),
    /** State lists joined with transition lists by state id (ExoMol data format). */
    EXOMOL("exomol"),
    /** 80-column catalog lines with frequencies in MHz and log10 intensities at 300 K. */
    CATALOG("catalog");

    private final String id;

    LineFormat(String id) {
        this.id = id;
    }

    public String id() {
        return id;
    }

    public static LineFormat byId(String id) {
        for (LineFormat f : values()) {
            if (f.id.equalsIgnoreCase(id)) {
                return f;
            }
        }
        throw new IllegalArgumentException("unknown format '" + id + "' (expected one of hitran160, hitran-delimited, exomol, catalog)");
    }
}
