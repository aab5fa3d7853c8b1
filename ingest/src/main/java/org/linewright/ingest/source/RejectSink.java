package org.linewright.ingest.source;

/** Receives every record a lenient reader rejects, verbatim, with the reason. */
@FunctionalInterface
public interface RejectSink {
    /**
     * @param file source file name as given by the user
     * @param lineNumber 1-based line number in the (decompressed) file
     * @param record the record text exactly as read, without its line terminator
     * @param reason one line: column range, field, offending text and what was expected
     */
    void reject(String file, long lineNumber, String record, String reason);

    /** A sink that keeps nothing (for callers that only need the counts). */
    RejectSink DISCARD = (file, lineNumber, record, reason) -> { };
}
