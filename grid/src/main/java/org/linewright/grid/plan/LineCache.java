package org.linewright.grid.plan;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Turns a plan's line sources into line stores. A source that is a line-store folder is opened as it is; a raw
 * line list is ingested (strictly, format detected) into a cache store of its own under
 * {@code .linewright-cache/} beside the plan, in a folder named after the file's SHA-256 and the tool version, so
 * an unchanged file is never ingested twice and a changed one (or a new tool version) is ingested afresh. A cache
 * store is built in a temporary folder and renamed into place when complete. A file not seen before with its
 * present path, size and modification time is ingested straight away, its SHA-256 taken while it is read (one pass
 * over a revised list instead of two); a file seen before is hashed first and its entry reused.
 */
public final class LineCache {
    /** Name of the cache folder beside the plan file. */
    public static final String CACHE_DIR = ".linewright-cache";

    private LineCache() {
    }

    /**
     * The stores of the plan's sources.
     *
     * @param sources  raw line lists or store folders
     * @param cacheDir the cache folder (created when missing)
     * @param lookup   isotopologue registry used while ingesting
     * @param listener told about ingests that run (not about cache hits)
     */
    public static Loaded load(List<Path> sources, Path cacheDir, IsotopologueLookup lookup, IngestListener listener)
            throws IOException {
        List<LineStore> stores = new ArrayList<>();
        Map<String, String> inputs = new LinkedHashMap<>();
        int ingested = 0;
        int reused = 0;
        for (Path source : sources) {
            if (Files.isDirectory(source)) {
                LineStore store = LineStore.open(source);
                stores.add(store);
                for (SourceInfo s : store.sources()) {
                    inputs.put(source.getFileName() + "/" + s.name(), s.metadata().sourceSha256());
                }
                continue;
            }
            // a file whose path, size and modification time were never seen is new or changed: ingest it at
            // once (the pipeline hashes it while reading) rather than hash it first only to find no cache entry
            Path seen = seenFile(cacheDir, source);
            String sha256 = Files.isRegularFile(seen) ? SourceMetadata.sha256(source) : null;
            Path dir = sha256 == null ? null : entry(cacheDir, sha256);
            if (dir == null || !Files.isRegularFile(dir.resolve("linestore.properties"))) {
                Files.createDirectories(cacheDir);
                Path tmp = Files.createTempDirectory(cacheDir, AtomicFile.PARTIAL);
                try {
                    IngestPipeline.run(List.of(source), tmp, IngestOptions.strict(lookup), listener);
                    String read = LineStore.open(tmp).sources().get(0).metadata().sourceSha256();
                    if (sha256 != null && !sha256.equals(read)) {
                        throw new IOException(source + " changed while it was read (SHA-256 " + sha256 + ", then "
                                + read + ")");
                    }
                    sha256 = read;
                    dir = entry(cacheDir, sha256);
                    if (Files.isRegularFile(dir.resolve("linestore.properties"))) {
                        // the same content under another name or time stamp: the entry is there already
                        reused++;
                    } else {
                        deleteTree(dir);
                        AtomicFile.rename(tmp, dir);
                        ingested++;
                    }
                } finally {
                    deleteTree(tmp);
                }
            } else {
                reused++;
            }
            inputs.put(source.getFileName().toString(), sha256);
            markSeen(seen);
            stores.add(LineStore.open(dir));
        }
        return new Loaded(List.copyOf(stores), inputs, ingested, reused);
    }

    /**
     * The stores and what they came from.
     *
     * @param stores         one per source, in plan order
     * @param inputSha256    SHA-256 of each input file (raw lists by file name; store sources by
     *                       {@code folder/source})
     * @param ingested       raw lists ingested now
     * @param reused         raw lists found in the cache
     */
    public record Loaded(List<LineStore> stores, Map<String, String> inputSha256, int ingested, int reused) {
    }

    /** The cache entry of a file with this SHA-256. */
    private static Path entry(Path cacheDir, String sha256) {
        return cacheDir.resolve(sha256.substring(0, 24) + "-v" + ToolVersion.get());
    }

    /**
     * The marker of a file's (absolute path, size, modification time): present when a file with exactly these
     * was loaded before. Only a hint: a seen file is still hashed to find its entry.
     */
    private static Path seenFile(Path cacheDir, Path source) throws IOException {
        Path abs = source.toAbsolutePath().normalize();
        String key = abs + "|" + Files.size(source) + "|"
                + Files.getLastModifiedTime(source).to(java.util.concurrent.TimeUnit.NANOSECONDS);
        String hex;
        try {
            hex = java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
                    .digest(key.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
        return cacheDir.resolve("seen").resolve(hex.substring(0, 32));
    }

    private static void markSeen(Path seen) throws IOException {
        if (!Files.isRegularFile(seen)) {
            Files.createDirectories(seen.getParent());
            Files.write(seen, new byte[0]);
        }
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}
