package org.linewright.ingest.atomic;

import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.concurrent.ThreadLocalRandom;

/**
 * Writing a file under a temporary name beside its target and renaming it into place, so that a file under its
 * final name is always complete: the one implementation of write-then-rename in linewright. Temporary names are
 * {@value #PARTIAL}{@code <target name>-<16 hex digits>} in the target's folder (so readers that list a folder,
 * such as a line store, can skip them by their prefix); they are created with the process's default permissions
 * (unlike {@link Files#createTempFile}, which makes them owner-only), so finished files are as readable as any
 * other. The rename is atomic where the file system supports it; where it does not
 * ({@link AtomicMoveNotSupportedException}, e.g. some network file systems) a plain rename within the same folder
 * stands in — the file is complete before it is renamed either way.
 */
public final class AtomicFile {
    /** Prefix of temporary files; such files can be deleted when no linewright process is running. */
    public static final String PARTIAL = ".partial-";

    private AtomicFile() {
    }

    /** Writes the content of a file at {@code tmp} (an existing, empty file). */
    @FunctionalInterface
    public interface Body {
        void writeTo(Path tmp) throws IOException;
    }

    /** Writes text. */
    @FunctionalInterface
    public interface TextBody {
        void writeTo(Writer out) throws IOException;
    }

    /** Writes bytes. */
    @FunctionalInterface
    public interface StreamBody {
        void writeTo(OutputStream out) throws IOException;
    }

    /** A new, empty temporary file in {@code target}'s folder (created when missing). */
    public static Path temporaryFor(Path target) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        while (true) {
            try {
                return Files.createFile(temporaryPathFor(target));
            } catch (FileAlreadyExistsException e) {
                // another name
            }
        }
    }

    /**
     * A fresh temporary name in {@code target}'s folder, not created (for writers that must create their file
     * themselves); the folder is created when missing.
     */
    public static Path temporaryPathFor(Path target) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp;
        do {
            tmp = dir.resolve(PARTIAL + target.getFileName() + "-"
                    + String.format("%016x", ThreadLocalRandom.current().nextLong()));
        } while (Files.exists(tmp));
        return tmp;
    }

    /**
     * Writes {@code target}: {@code body} fills a temporary file, which is forced to disk and renamed over the
     * target; on any failure the temporary file is deleted and the target left as it was.
     */
    public static void write(Path target, Body body) throws IOException {
        Path tmp = temporaryFor(target);
        try {
            body.writeTo(tmp);
            commit(tmp, target);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /** Writes {@code target} as UTF-8 text, as {@link #write(Path, Body)} does. */
    public static void writeText(Path target, TextBody body) throws IOException {
        write(target, tmp -> {
            try (Writer out = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8, StandardOpenOption.WRITE,
                    StandardOpenOption.TRUNCATE_EXISTING)) {
                body.writeTo(out);
            }
        });
    }

    /** Writes {@code target} from a stream, as {@link #write(Path, Body)} does. */
    public static void writeStream(Path target, StreamBody body) throws IOException {
        write(target, tmp -> {
            try (OutputStream out = new java.io.BufferedOutputStream(Files.newOutputStream(tmp,
                    StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING))) {
                body.writeTo(out);
            }
        });
    }

    /** Writes {@code content} to {@code target}, as {@link #write(Path, Body)} does. */
    public static void writeBytes(Path target, byte[] content) throws IOException {
        write(target, tmp -> Files.write(tmp, content, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING));
    }

    /** Forces {@code tmp} to disk and renames it over {@code target}. */
    public static void commit(Path tmp, Path target) throws IOException {
        try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE)) {
            ch.force(true);
        }
        rename(tmp, target);
    }

    /**
     * Renames {@code tmp} over {@code target} without forcing it to disk first: complete under its final name if the
     * process stops (the case a resumed build must survive), possibly not after an operating-system crash.
     */
    public static void commitWithoutSync(Path tmp, Path target) throws IOException {
        rename(tmp, target);
    }

    /**
     * Renames {@code tmp} (a file, or a directory when {@code target} does not exist) to {@code target}, replacing
     * a file there: atomically where supported, else by a plain rename.
     */
    public static void rename(Path tmp, Path target) throws IOException {
        rename(tmp, target, (from, to) -> Files.move(from, to, StandardCopyOption.ATOMIC_MOVE,
                StandardCopyOption.REPLACE_EXISTING));
    }

    /** A move that is atomic or throws {@link AtomicMoveNotSupportedException}. */
    @FunctionalInterface
    interface AtomicMove {
        void move(Path from, Path to) throws IOException;
    }

    /** {@link #rename(Path, Path)} with the atomic move given (tests simulate a file system without one). */
    static void rename(Path tmp, Path target, AtomicMove atomic) throws IOException {
        try {
            atomic.move(tmp, target);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
        }
    }
}
