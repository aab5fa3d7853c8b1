package org.linewright.grid.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;

/** Raw line lists are ingested once per content (SHA-256) and tool version; store folders are used as they are. */
class LineCacheTest {
    @TempDir
    Path dir;

    @Test
    void rawListIsIngestedOnceAndStoreFoldersAreUsedAsTheyAre() throws Exception {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        Path raw = Files.copy(sample, dir.resolve("co.par"));
        Path store = ReferenceSamples.ingest(dir.resolve("co2-store"), ReferenceSamples.hitranSample("sample_CO2.par"));
        Path cache = dir.resolve(LineCache.CACHE_DIR);
        MoleculeRegistry registry = MoleculeRegistry.builtIn();

        LineCache.Loaded first = LineCache.load(List.of(raw, store), cache, registry, IngestListener.NONE);
        assertEquals(1, first.ingested());
        // the HITRAN2020 samples hold 5381 CO and 5492 CO2 records (shared/reference-data README)
        assertEquals(5381, first.stores().get(0).totalLines());
        assertEquals(5492, first.stores().get(1).totalLines());
        // cache folder named by the file's SHA-256 (JDK digest) and the tool version
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(raw)));
        assertEquals(sha, first.inputSha256().get("co.par"));
        assertTrue(Files.isDirectory(cache.resolve(sha.substring(0, 24) + "-v" + ToolVersion.get())));
        assertTrue(first.inputSha256().containsKey("co2-store/sample_CO2.par"), first.inputSha256().toString());

        LineCache.Loaded again = LineCache.load(List.of(raw, store), cache, registry, IngestListener.NONE);
        assertEquals(0, again.ingested());
        assertEquals(1, again.reused());

        // the first 100 records (160 characters and a newline each)
        Files.writeString(raw, Files.readString(sample).substring(0, 161 * 100));
        LineCache.Loaded changed = LineCache.load(List.of(raw), cache, registry, IngestListener.NONE);
        assertEquals(1, changed.ingested());
        assertEquals(100, changed.stores().get(0).totalLines());
        // ingested in one pass, yet recorded under the file's own SHA-256 (JDK digest of the bytes)
        String changedSha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(raw)));
        assertEquals(changedSha, changed.inputSha256().get("co.par"));
        assertTrue(Files.isDirectory(cache.resolve(changedSha.substring(0, 24) + "-v" + ToolVersion.get())));

        // the first content again under a new time stamp: not seen, so read once, and its entry is found and reused
        Files.copy(sample, raw, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        Files.setLastModifiedTime(raw, java.nio.file.attribute.FileTime.fromMillis(1_000_000_000_000L));
        LineCache.Loaded back = LineCache.load(List.of(raw), cache, registry, IngestListener.NONE);
        assertEquals(0, back.ingested());
        assertEquals(1, back.reused());
        assertEquals(sha, back.inputSha256().get("co.par"));
        assertEquals(5381, back.stores().get(0).totalLines());
        try (var entries = Files.list(cache)) {
            assertTrue(entries.noneMatch(p -> p.getFileName().toString().startsWith(".partial-")), "no partial entry left");
        }
    }

    @Test
    void aBadRecordLeavesNoCacheEntry() throws IOException {
        Path raw = dir.resolve("bad.par");
        Files.writeString(raw, "this is not a line list\n");
        Path cache = dir.resolve(LineCache.CACHE_DIR);
        RuntimeException e = org.junit.jupiter.api.Assertions.assertThrows(RuntimeException.class,
                () -> LineCache.load(List.of(raw), cache, MoleculeRegistry.builtIn(), IngestListener.NONE));
        assertTrue(e.getMessage().contains("bad.par"), e.getMessage());
        try (var entries = Files.list(cache)) {
            assertTrue(entries.noneMatch(p -> Files.isRegularFile(p.resolve("linestore.properties"))),
                    "nothing complete in the cache");
        }
    }
}
