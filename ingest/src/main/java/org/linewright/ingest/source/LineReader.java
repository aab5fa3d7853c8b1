package org.linewright.ingest.source;

import java.io.Closeable;
import java.io.IOException;
import org.linewright.ingest.line.LineBatch;

/**
 * Streams the lines of one source (one line-list file, or one state/transition set) in batches.
 *
 * <p>A bad record either stops the read with a {@link LineFormatException} (the default) or, in lenient
 * mode, goes to the {@link RejectSink} with its reason and is counted in {@link #recordsRejected()}.
 * Nothing is dropped silently: {@code recordsRead() == linesKept() + recordsRejected()} at the end.
 */
public interface LineReader extends Closeable {

    /**
     * Clears {@code batch} and fills it with up to {@code batch.capacity()} lines.
     *
     * @return false when the input held no more lines (the batch is then empty)
     * @throws LineFormatException on the first bad record when not lenient
     */
    boolean read(LineBatch batch) throws IOException;

    /** Records (data lines) consumed so far, kept or rejected; blank trailing lines are not records. */
    long recordsRead();

    /** Records rejected so far (lenient mode only; otherwise the read stops at the first). */
    long recordsRejected();

    /** Lines delivered so far. */
    default long linesKept() {
        return recordsRead() - recordsRejected();
    }

    /** The format this reader parses. */
    LineFormat format();
}
