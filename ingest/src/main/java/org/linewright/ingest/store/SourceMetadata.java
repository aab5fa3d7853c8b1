package org.linewright.ingest.store;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import org.linewright.ingest.ToolVersion;

/**
 * Provenance of one ingested source, known before its lines are written; stored in the schema metadata of
 * the source's Arrow file.
 *
 * @param sourceFileName the source file name as given by the user
 * @param sourceSha256 hex SHA-256 of the source file's bytes as read (empty when not computed)
 * @param readerFormat the reader's format id, e.g. {@code hitran160}
 * @param toolVersion the linewright version that wrote the store file
 * @param creationParameters free-form parameters of the ingest (options, filters), kept verbatim
 */
public record SourceMetadata(String sourceFileName, String sourceSha256, String readerFormat, String toolVersion,
                             Map<String, String> creationParameters) {
    public SourceMetadata {
        Objects.requireNonNull(sourceFileName, "sourceFileName");
        Objects.requireNonNull(sourceSha256, "sourceSha256");
        Objects.requireNonNull(readerFormat, "readerFormat");
        Objects.requireNonNull(toolVersion, "toolVersion");
        creationParameters = Map.copyOf(new TreeMap<>(Objects.requireNonNull(creationParameters, "creationParameters")));
    }

    /** Provenance with the running tool's version ({@link ToolVersion#get()}). */
    public static SourceMetadata of(String sourceFileName, String sourceSha256, String readerFormat,
                                    Map<String, String> creationParameters) {
        return new SourceMetadata(sourceFileName, sourceSha256, readerFormat, ToolVersion.get(), creationParameters);
    }

    /** Hex SHA-256 of a file's bytes as stored (before any decompression), for {@link #sourceSha256}. */
    public static String sha256(Path file) throws IOException {
        MessageDigest digest;
        try {
            digest = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
        try (InputStream in = new DigestInputStream(Files.newInputStream(file), digest)) {
            in.transferTo(java.io.OutputStream.nullOutputStream());
        }
        return HexFormat.of().formatHex(digest.digest());
    }
}
