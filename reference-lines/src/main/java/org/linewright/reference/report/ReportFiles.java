package org.linewright.reference.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import org.linewright.ingest.atomic.AtomicFile;

/** Writes a report file atomically: under a temporary name beside it, then renamed over the target. */
public final class ReportFiles {
    private ReportFiles() {
    }

    /** Something that writes a report. */
    @FunctionalInterface
    public interface Content {
        void writeTo(Writer out) throws IOException;
    }

    /** Writes {@code content} to {@code file} (UTF-8) under a temporary name and renames it when complete. */
    public static void write(Path file, Content content) throws IOException {
        AtomicFile.writeText(file, content::writeTo);
    }
}
