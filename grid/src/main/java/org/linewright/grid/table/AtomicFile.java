package org.linewright.grid.table;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.concurrent.ThreadLocalRandom;

/**
 * Writing a file under a temporary name beside its target and renaming it into place, so that a file under its
 * final name is always complete. Temporary files are created with the process's default permissions (unlike
 * {@link Files#createTempFile}, which makes them private), so finished tables are as readable as any other file.
 */
public final class AtomicFile {
    /** Prefix of temporary files; such files can be deleted when no build is running. */
    public static final String PARTIAL = ".partial-";

    private AtomicFile() {
    }

    /** A new, empty temporary file in {@code target}'s folder (created when missing). */
    public static Path temporaryFor(Path target) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        while (true) {
            Path tmp = dir.resolve(PARTIAL + target.getFileName() + "-"
                    + Long.toHexString(ThreadLocalRandom.current().nextLong()));
            try {
                return Files.createFile(tmp);
            } catch (FileAlreadyExistsException e) {
                // another name
            }
        }
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

    private static void rename(Path tmp, Path target) throws IOException {
        try {
            Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
        }
    }
}
