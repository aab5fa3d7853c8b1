package org.linewright.ingest.pipeline;

import java.nio.file.Path;

/** Follows an ingest as it goes (for progress bars); every method has an empty default. */
public interface IngestListener {
    IngestListener NONE = new IngestListener() { };

    /**
     * A source is about to be read.
     *
     * @param source the file
     * @param fileBytes its size on disk
     */
    default void sourceStarted(Path source, long fileBytes) {
    }

    /** After each batch: records consumed so far from this source. */
    default void recordsRead(Path source, long records) {
    }

    /** The source is stored. */
    default void sourceFinished(IngestReport.Source report) {
    }
}
