package org.linewright.ingest.source;

import java.io.Closeable;
import java.io.IOException;
import java.util.function.Supplier;

/**
 * A line-list source opened by {@link LineSources#open}: its reader, the format and compression found,
 * the SHA-256 of the raw file bytes (available once the reader has been read to its end) and the file
 * name as shown to the user.
 *
 * @param reader the lines
 * @param format the format read
 * @param compression the compression id ({@code none}, {@code gzip}, {@code bzip2}, {@code xz},
 *                    {@code zstd}, {@code zip})
 * @param sha256Hex the SHA-256 of the raw file bytes, lower-case hex; call after the last batch
 * @param fileName the file name as given
 */
public record OpenedSource(LineReader reader, LineFormat format, String compression, Supplier<String> sha256Hex,
                           String fileName) implements Closeable {

    /** Duplicate lines seen so far when the reader counts them ({@link DuplicateCounter}), else -1. */
    public long duplicatesSeen() {
        return reader instanceof DuplicateCounter ? ((DuplicateCounter) reader).duplicatesSeen() : -1;
    }

    @Override
    public void close() throws IOException {
        reader.close();
    }
}
