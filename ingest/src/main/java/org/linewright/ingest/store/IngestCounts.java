package org.linewright.ingest.store;

/**
 * What became of a source's records, given by the caller when a store file is committed and kept in its
 * metadata: {@code recordsRead = linesKept + recordsRejected}; {@code duplicates} counts the kept lines the
 * caller found to repeat another line (reported, not necessarily removed — the caller decides).
 *
 * @param recordsRead data records consumed from the source
 * @param linesKept records turned into lines
 * @param recordsRejected records rejected (lenient reading)
 * @param duplicates duplicate lines found by the caller
 */
public record IngestCounts(long recordsRead, long linesKept, long recordsRejected, long duplicates) {
    public IngestCounts {
        if (recordsRead < 0 || linesKept < 0 || recordsRejected < 0 || duplicates < 0) {
            throw new IllegalArgumentException("counts must not be negative: " + recordsRead + ", " + linesKept
                    + ", " + recordsRejected + ", " + duplicates);
        }
        if (recordsRead != linesKept + recordsRejected) {
            throw new IllegalArgumentException("records read (" + recordsRead + ") must equal lines kept ("
                    + linesKept + ") + records rejected (" + recordsRejected + ")");
        }
    }
}
