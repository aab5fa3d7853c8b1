package org.linewright.ingest.pipeline;

import java.nio.file.Path;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormat;

/**
 * How {@link IngestPipeline} reads its sources.
 *
 * @param formatOrNull the format of every source, or null to detect it from each file's content
 * @param lenient false: the first bad record stops the ingest (exit code 2 on the command line); true: bad
 *                records go to the rejects file with their reason and the ingest goes on
 * @param rejectsFileOrNull where lenient ingests write rejected records; null means {@code rejects.tsv} in the
 *                          store directory, written only when there is something to write
 * @param isotopologues the molecule registry (with any user metadata and partition sums attached)
 * @param parameters free-form creation parameters recorded in every store file's metadata
 */
public record IngestOptions(LineFormat formatOrNull, boolean lenient, Path rejectsFileOrNull,
                            IsotopologueLookup isotopologues, Map<String, String> parameters) {
    public IngestOptions {
        Objects.requireNonNull(isotopologues, "isotopologues");
        parameters = Map.copyOf(new TreeMap<>(Objects.requireNonNull(parameters, "parameters")));
    }

    /** Strict ingest, format detected, no extra parameters. */
    public static IngestOptions strict(IsotopologueLookup isotopologues) {
        return new IngestOptions(null, false, null, isotopologues, Map.of());
    }
}
