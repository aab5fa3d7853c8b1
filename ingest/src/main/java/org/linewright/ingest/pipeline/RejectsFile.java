package org.linewright.ingest.pipeline;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.linewright.ingest.source.RejectSink;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * The rejects file of a lenient ingest: one tab-separated line per rejected record — source file, line number,
 * reason, and the record verbatim as the last field — under a header. Written under a temporary name and
 * renamed on {@link #commit()}, so a crash never leaves a file that looks complete.
 */
final class RejectsFile implements RejectSink, AutoCloseable {
    static final String HEADER = "# linewright rejected records: file<TAB>line<TAB>reason<TAB>record (verbatim)";

    private final Path target;
    private Path partial;
    private BufferedWriter out;
    private long count;

    RejectsFile(Path target) {
        this.target = target.toAbsolutePath();
    }

    @Override
    public void reject(String file, long lineNumber, String record, String reason) {
        try {
            if (out == null) {
                partial = AtomicFile.temporaryFor(target);
                out = Files.newBufferedWriter(partial, StandardCharsets.UTF_8);
                out.write(HEADER);
                out.newLine();
            }
            out.write(file);
            out.write('\t');
            out.write(Long.toString(lineNumber));
            out.write('\t');
            out.write(reason.replace('\t', ' ').replace('\n', ' '));
            out.write('\t');
            out.write(record);
            out.newLine();
            count++;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the rejects file " + partial, e);
        }
    }

    long count() {
        return count;
    }

    /** Makes the file visible under its name; returns it, or null when nothing was rejected. */
    Path commit() throws IOException {
        if (out == null) {
            return null;
        }
        out.close();
        out = null;
        AtomicFile.commit(partial, target);
        return target;
    }

    @Override
    public void close() throws IOException {
        if (out != null) {
            out.close();
            out = null;
            Files.deleteIfExists(partial);
        }
    }
}
