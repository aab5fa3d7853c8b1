package org.linewright.ingest.source;

import java.io.IOException;
import java.io.InputStream;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.text.ByteLineScanner;

/**
 * Base of the readers whose input is one text stream holding one record per line (the 160-character records,
 * delimited exports, 80-column catalogs). The batch loop, the record counts and the strict or lenient handling
 * of bad records live here; a subclass parses the current line into one batch row.
 *
 * <p>Wholly blank lines (spaces, tabs, stray CRs) carry no data and are skipped; they are not records. A bad
 * record is thrown in strict mode; in lenient mode it is counted as rejected, passed to the reject sink with its
 * line number and text, and reading goes on.
 */
public abstract class RecordPerLineReader implements LineReader {
    /** The lines of the input; while {@link #parseRecord} runs, the current line is the record. */
    protected final ByteLineScanner lines;
    /** The file name shown in error messages and passed to the reject sink. */
    protected final String fileName;
    protected final ReadOptions options;
    private long recordsRead;
    private long recordsRejected;

    /**
     * @param in the decompressed bytes (closed by {@link #close()})
     * @param fileName the file name shown in error messages and passed to the reject sink
     */
    protected RecordPerLineReader(InputStream in, String fileName, ReadOptions options) {
        this.lines = new ByteLineScanner(in);
        this.fileName = fileName;
        this.options = options;
    }

    /**
     * Parses the current line of {@link #lines} into row {@code row} of {@code batch} (all columns, text
     * columns appended once each).
     *
     * @return null when the record is good, else the problem (it may also be thrown); the row is then undefined
     *         and the text columns must not have been appended to
     */
    protected abstract LineFormatException parseRecord(LineBatch batch, int row);

    /** Called once per batch before its first record; readers that clear columns batch-wide do it here. */
    protected void startBatch(LineBatch batch) {
    }

    @Override
    public final boolean read(LineBatch batch) throws IOException {
        batch.clear();
        startBatch(batch);
        while (!batch.isFull() && lines.next()) {
            if (lines.isBlank()) {
                continue;
            }
            recordsRead++;
            LineFormatException problem;
            try {
                problem = parseRecord(batch, batch.size);
            } catch (LineFormatException e) {
                problem = e;
            }
            if (problem == null) {
                batch.size++;
            } else if (options.lenient()) {
                recordsRejected++;
                options.rejects().reject(fileName, lines.lineNumber(), lines.lineText(), problem.reason());
            } else {
                throw problem;
            }
        }
        return batch.size > 0;
    }

    @Override
    public final long recordsRead() {
        return recordsRead;
    }

    @Override
    public final long recordsRejected() {
        return recordsRejected;
    }

    /** Closes the input. */
    @Override
    public void close() throws IOException {
        lines.close();
    }
}
