package org.linewright.ingest.atomic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFileAttributeView;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Write-then-rename: complete files only under the final name, nothing left behind, the fallback rename. */
class AtomicFileTest {
    @TempDir
    Path dir;

    private List<String> names() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void writesAndLeavesNoTemporaryFile() throws IOException {
        Path target = dir.resolve("sub/report.txt");
        AtomicFile.writeText(target, out -> out.write("two\nlines\n"));
        assertEquals("two\nlines\n", Files.readString(target));
        AtomicFile.writeBytes(target, "replaced".getBytes(StandardCharsets.UTF_8));
        assertEquals("replaced", Files.readString(target));
        try (Stream<Path> s = Files.list(target.getParent())) {
            assertEquals(List.of("report.txt"), s.map(p -> p.getFileName().toString()).toList());
        }
    }

    @Test
    void aFailedWriteKeepsThePreviousFileAndCleansUp() throws IOException {
        Path target = dir.resolve("table.csv");
        Files.writeString(target, "previous");
        assertThrows(IOException.class, () -> AtomicFile.writeText(target, out -> {
            out.write("half of it");
            throw new IOException("disk full (simulated)");
        }));
        assertEquals("previous", Files.readString(target));
        assertEquals(List.of("table.csv"), names());
    }

    @Test
    void temporaryNamesShareOnePrefixAndAreDistinct() throws IOException {
        Path target = dir.resolve("x.arrow");
        Path a = AtomicFile.temporaryFor(target);
        Path b = AtomicFile.temporaryFor(target);
        assertTrue(a.getFileName().toString().startsWith(AtomicFile.PARTIAL + "x.arrow-"), a.toString());
        assertTrue(!a.equals(b) && Files.exists(a) && Files.exists(b));
        Path c = AtomicFile.temporaryPathFor(target);
        assertTrue(!Files.exists(c) && c.getParent().equals(dir.toAbsolutePath()));
    }

    /** Temporary files get the default permissions of new files, not the owner-only ones of createTempFile. */
    @Test
    void finishedFilesHaveDefaultPermissions() throws IOException {
        Assumptions.assumeTrue(Files.getFileStore(dir).supportsFileAttributeView(PosixFileAttributeView.class),
                "POSIX permissions");
        Path plain = Files.createFile(dir.resolve("plain"));
        Path target = dir.resolve("atomic");
        AtomicFile.writeBytes(target, new byte[] {1, 2, 3});
        assertEquals(Files.getPosixFilePermissions(plain), Files.getPosixFilePermissions(target));
    }

    /**
     * Where the file system refuses an atomic move (AtomicMoveNotSupportedException, as some network file systems
     * do: java.nio.file.Files#move documentation), the plain rename stands in and replaces the old file.
     */
    @Test
    void fallsBackWhereAtomicMoveIsUnsupported() throws IOException {
        Path target = Files.writeString(dir.resolve("data.txt"), "old");
        Path tmp = Files.writeString(AtomicFile.temporaryFor(target), "new");
        AtomicFile.rename(tmp, target, (from, to) -> {
            throw new AtomicMoveNotSupportedException(from.toString(), to.toString(), "simulated");
        });
        assertEquals("new", Files.readString(target));
        assertEquals(List.of("data.txt"), names());
    }
}
