package org.linewright.ingest.source;

import java.io.Closeable;
import java.io.IOException;
import java.util.EnumSet;
import java.util.Map;
import java.util.Set;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.partition.PartitionTable;

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

    /**
     * The columns this reader can fill for its source. Rule: a column is listed when some line of the source may
     * carry a value in it; a column left out holds NaN (numbers) or an empty text in every line the reader
     * delivers, so a store may leave it out of the file and read it back as NaN or empty with nothing lost.
     * Known once the reader is open (a delimited file's header, a state/transition set's definition), constant
     * afterwards. The default lists every column.
     */
    default Set<LineColumn> columnsProvided() {
        return EnumSet.allOf(LineColumn.class);
    }

    /** The format this reader parses. */
    /**
     * Partition functions that came with the lines (e.g. an ExoMol-style set's {@code .pf}), by isotopologue;
     * they are recorded in the line store and used at every temperature (see
     * {@code org.linewright.ingest.partition.StoredPartitionFunctions}). The default: none.
     */
    default Map<IsotopologueLookup.Id, PartitionTable> partitionFunctions() {
        return Map.of();
    }

    LineFormat format();
}
