package org.linewright.ingest.source;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Reference for every digest: the JDK's {@code MessageDigest} over the raw file bytes. */
class HashingOpenerTest {
    @TempDir
    Path dir;

    /**
     * A file read to its end keeps the digest of the bytes streamed (so no second pass: replacing the file
     * afterwards does not change it); a file opened but not read to its end is hashed again as it is now.
     */
    @Test
    void digestsComeFromTheStreamWhenReadToTheEndElseFromASecondPass() throws Exception {
        byte[] text = "synthetic line 1\nsynthetic line 2\n".getBytes(StandardCharsets.US_ASCII);
        byte[] raw = LineSourcesTest.compress("gzip", text);
        Path read = dir.resolve("read.gz");
        Path partly = dir.resolve("partly.gz");
        Files.write(read, raw);
        Files.write(partly, raw);
        HashingOpener opener = new HashingOpener();
        try (InputStream in = opener.open(read)) {
            assertArrayEquals(text, in.readAllBytes());
        }
        try (InputStream in = opener.open(partly)) {
            assertEquals('s', in.read());
        }
        byte[] other = "other synthetic bytes".getBytes(StandardCharsets.US_ASCII);
        Files.write(read, other);
        Files.write(partly, other);
        List<OpenedSource.FileDigest> digests = opener.digests(dir.resolve("given"), List.of(read, partly));
        assertEquals(List.of(new OpenedSource.FileDigest(read.toString(), LineSourcesTest.sha256(raw)),
                new OpenedSource.FileDigest(partly.toString(), LineSourcesTest.sha256(other))), digests);
    }

    @Test
    void namesFollowTheDirectoryAsGiven() throws IOException {
        Path file = dir.resolve("x.states");
        Files.writeString(file, "1 0 1 0\n");
        Path relative = Path.of("data", "x.trans");
        assertEquals(Path.of("data", "x.states").toString(),
                new HashingOpener().digests(relative, List.of(file)).get(0).fileName());
    }
}
