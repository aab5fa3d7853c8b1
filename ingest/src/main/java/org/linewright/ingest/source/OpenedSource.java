package org.linewright.ingest.source;

import java.io.Closeable;
import java.io.IOException;
import java.util.List;
import java.util.function.Supplier;

/**
 * A line-list source opened by {@link LineSources#open}: its reader, the format and compression found,
 * the SHA-256 of the raw file bytes (available once the reader has been read to its end), the file name as
 * shown to the user, and the provenance of every file read (one for a single file, all files of a
 * state/transition set).
 *
 * @param reader the lines
 * @param format the format read
 * @param compression the compression id of the file given ({@code none}, {@code gzip}, {@code bzip2},
 *                    {@code xz}, {@code zstd}, {@code zip})
 * @param sha256Hex the SHA-256 of the raw bytes of the file given, lower-case hex; call after the last batch
 * @param fileName the file name as given
 * @param files every file the source consists of with the SHA-256 of its raw bytes; call after the last batch
 */
public record OpenedSource(LineReader reader, LineFormat format, String compression, Supplier<String> sha256Hex,
                           String fileName, Supplier<List<FileDigest>> files) implements Closeable {

    /**
     * One file of a source and the SHA-256 of its raw (compressed) bytes.
     *
     * @param fileName the file name, in the directory the source was given in
     * @param sha256Hex the SHA-256 of the file's raw bytes, lower-case hex
     */
    public record FileDigest(String fileName, String sha256Hex) {
    }

    /** Duplicate lines seen so far when the reader counts them ({@link DuplicateCounter}), else -1. */
    public long duplicatesSeen() {
        return reader instanceof DuplicateCounter ? ((DuplicateCounter) reader).duplicatesSeen() : -1;
    }

    @Override
    public void close() throws IOException {
        reader.close();
    }
}
