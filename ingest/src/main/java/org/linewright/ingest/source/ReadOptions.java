package org.linewright.ingest.source;

import java.util.Objects;

/**
 * How a reader treats bad records and how it names isotopologues.
 *
 * @param lenient false: the first bad record stops the read with a {@link LineFormatException};
 *                true: bad records go to {@code rejects} with their reason and the read goes on
 * @param rejects where lenient readers send rejected records
 * @param isotopologues maps the isotopologue names of state-list and catalog formats to registry ids
 * @param batchSize lines per batch the caller intends to use (a hint for buffer sizes)
 */
public record ReadOptions(boolean lenient, RejectSink rejects, IsotopologueLookup isotopologues, int batchSize) {
    public static final int DEFAULT_BATCH_SIZE = 65_536;

    public ReadOptions {
        Objects.requireNonNull(rejects, "rejects");
        Objects.requireNonNull(isotopologues, "isotopologues");
        if (batchSize <= 0) {
            throw new IllegalArgumentException("batchSize must be positive");
        }
    }

    /** Strict reading with the given isotopologue lookup. */
    public static ReadOptions strict(IsotopologueLookup isotopologues) {
        return new ReadOptions(false, RejectSink.DISCARD, isotopologues, DEFAULT_BATCH_SIZE);
    }

    public ReadOptions withLenient(boolean lenientValue, RejectSink sink) {
        return new ReadOptions(lenientValue, sink, isotopologues, batchSize);
    }
}
