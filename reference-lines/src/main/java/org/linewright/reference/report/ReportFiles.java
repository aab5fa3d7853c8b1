package org.linewright.reference.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.UUID;

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
        Path dir = file.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        // a fresh name beside the target (not createTempFile, whose owner-only permissions would stick to the report)
        Path temp = dir.resolve("." + file.getFileName() + "." + UUID.randomUUID() + ".partial");
        try {
            try (Writer out = Files.newBufferedWriter(temp, StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW,
                    StandardOpenOption.WRITE)) {
                content.writeTo(out);
            }
            try {
                Files.move(temp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temp, file, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(temp);
        }
    }
}
