package org.linewright.ingest.pipeline;

import java.nio.file.Path;
import java.util.List;

/**
 * What an ingest did, source by source.
 *
 * @param storeDir the store written
 * @param sources one entry per source, in the order given
 * @param rejectsFileOrNull the rejects file written, or null when none was written
 */
public record IngestReport(Path storeDir, List<Source> sources, Path rejectsFileOrNull) {

    /**
     * One ingested source.
     *
     * @param file the source path as given
     * @param storeName the name under which the store keeps it
     * @param format the format read
     * @param compression the compression found ({@code none}, {@code gzip}, ...)
     * @param sha256 SHA-256 of the raw file bytes
     * @param recordsRead data records consumed
     * @param linesKept lines stored
     * @param recordsRejected records rejected (lenient mode)
     * @param duplicates kept lines that repeat the previous line (reported, kept)
     * @param minWavenumberCm1 lowest stored wavenumber (NaN when no line was kept)
     * @param maxWavenumberCm1 highest stored wavenumber (NaN when no line was kept)
     * @param seconds wall-clock time of reading and storing this source
     */
    public record Source(Path file, String storeName, String format, String compression, String sha256,
                         long recordsRead, long linesKept, long recordsRejected, long duplicates,
                         double minWavenumberCm1, double maxWavenumberCm1, double seconds) { }

    public long recordsRead() {
        return sources.stream().mapToLong(Source::recordsRead).sum();
    }

    public long linesKept() {
        return sources.stream().mapToLong(Source::linesKept).sum();
    }

    public long recordsRejected() {
        return sources.stream().mapToLong(Source::recordsRejected).sum();
    }

    public long duplicates() {
        return sources.stream().mapToLong(Source::duplicates).sum();
    }
}
