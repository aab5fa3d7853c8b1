package org.linewright.grid.plan;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
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

/**
 * Turns a plan's line sources into line stores. A source that is a line-store folder is opened as it is; a raw
 * line list is ingested (strictly, format detected) into a cache store of its own under
 * {@code .linewright-cache/} beside the plan, in a folder named after the file's SHA-256 and the tool version, so
 * an unchanged file is never ingested twice and a changed one (or a new tool version) is ingested afresh. A cache
 * store is built in a temporary folder and renamed into place when complete.
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
            String sha256 = SourceMetadata.sha256(source);
            inputs.put(source.getFileName().toString(), sha256);
            Path dir = cacheDir.resolve(sha256.substring(0, 24) + "-v" + ToolVersion.get());
            if (!Files.isRegularFile(dir.resolve("linestore.properties"))) {
                Files.createDirectories(cacheDir);
                Path tmp = Files.createTempDirectory(cacheDir, ".partial-");
                try {
                    IngestPipeline.run(List.of(source), tmp, IngestOptions.strict(lookup), listener);
                    deleteTree(dir);
                    try {
                        Files.move(tmp, dir, StandardCopyOption.ATOMIC_MOVE);
                    } catch (AtomicMoveNotSupportedException e) {
                        Files.move(tmp, dir);
                    }
                } finally {
                    deleteTree(tmp);
                }
                ingested++;
            } else {
                reused++;
            }
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
