package org.linewright.ingest.store;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.linewright.ingest.source.IsotopologueLookup;

/**
 * One source of a line store, as recorded in its file's metadata.
 *
 * @param name the source name the lines were ingested under (unique in the store)
 * @param file the Arrow IPC file holding its lines
 * @param metadata provenance (source file, SHA-256, reader format, tool version, creation parameters)
 * @param created when the store file was created
 * @param counts records read / kept / rejected / duplicates
 * @param lines lines in the file
 * @param minWavenumberCm1 lowest wavenumber (NaN when empty)
 * @param maxWavenumberCm1 highest wavenumber (NaN when empty)
 * @param isotopologues the (molecule, isotopologue) pairs present, ascending
 */
public record SourceInfo(String name, Path file, SourceMetadata metadata, Instant created, IngestCounts counts,
                         long lines, double minWavenumberCm1, double maxWavenumberCm1,
                         List<IsotopologueLookup.Id> isotopologues) {
    public SourceInfo {
        isotopologues = List.copyOf(isotopologues);
    }

    /** Creation parameters (shortcut for {@code metadata().creationParameters()}). */
    public Map<String, String> creationParameters() {
        return metadata.creationParameters();
    }
}
