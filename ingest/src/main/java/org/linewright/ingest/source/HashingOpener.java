package org.linewright.ingest.source;

import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * A {@link StreamOpener} for multi-file sources that keeps the SHA-256 of every file it opened: each file is
 * opened through {@link SourceInput} (decompressed, raw bytes hashed as they stream past) and its digest is
 * taken when the reader closes the stream after reading it to its end. Files not read to their end (or never
 * opened) are hashed by a second pass over their raw bytes when the digests are asked for.
 */
final class HashingOpener implements StreamOpener {
    private static final int BUFFER_BYTES = 1 << 16;

    /** SHA-256 hex of the files read to their end, by absolute path. */
    private final Map<Path, String> digests = new ConcurrentHashMap<>();

    @Override
    public InputStream open(Path path) throws IOException {
        Path key = key(path);
        SourceInput input = SourceInput.open(path);
        return new FilterInputStream(input.stream()) {
            private boolean closed;

            @Override
            public void close() throws IOException {
                if (closed) {
                    return;
                }
                closed = true;
                try {
                    if (input.readToEnd()) {
                        // before the close: the trailer bytes the decompressor left unread are hashed too
                        digests.put(key, input.sha256Hex());
                    }
                } finally {
                    super.close();
                }
            }
        };
    }

    /**
     * The digests of {@code paths}, in that order, each named as {@code given}'s sibling (the directory as the
     * user wrote it).
     *
     * @throws UncheckedIOException when a file not read to its end cannot be read for its digest
     */
    List<OpenedSource.FileDigest> digests(Path given, List<Path> paths) {
        List<OpenedSource.FileDigest> out = new ArrayList<>(paths.size());
        for (Path p : paths) {
            String hex = digests.get(key(p));
            if (hex == null) {
                hex = sha256OfFile(p);
            }
            out.add(new OpenedSource.FileDigest(given.resolveSibling(p.getFileName()).toString(), hex));
        }
        return out;
    }

    private static Path key(Path path) {
        return path.toAbsolutePath().normalize();
    }

    /** SHA-256 of a file's raw bytes, lower-case hex (the second pass). */
    static String sha256OfFile(Path path) {
        try (InputStream in = Files.newInputStream(path)) {
            MessageDigest digest = MessageDigest.getInstance("SHA-256");
            byte[] buffer = new byte[BUFFER_BYTES];
            for (int n; (n = in.read(buffer)) >= 0; ) {
                digest.update(buffer, 0, n);
            }
            return HexFormat.of().formatHex(digest.digest());
        } catch (IOException e) {
            throw new UncheckedIOException(path + ": cannot read for the SHA-256", e);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }
}
