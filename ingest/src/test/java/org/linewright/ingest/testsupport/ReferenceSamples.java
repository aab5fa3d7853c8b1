package org.linewright.ingest.testsupport;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.registry.MoleculeRegistry;

/**
 * Locates the read-only real reference data beside the project (never copied into the repository):
 * system property {@code linewright.referenceDir}, else {@code ../shared/reference-data}, else
 * {@code ../../shared/reference-data}. Tests that need it are skipped with a visible reason when absent. The one
 * locator of every module's tests (published in the ingest module's test jar).
 */
public final class ReferenceSamples {
    /** The samples of the 160-character line lists (see the README beside them). */
    public static final String HITRAN_SAMPLES = "hitran2020-samples";

    private ReferenceSamples() {
    }

    /** The reference folder, or a skipped test. */
    public static Path dir(String sub) {
        String property = System.getProperty("linewright.referenceDir");
        for (String candidate : new String[] {property, "../shared/reference-data", "../../shared/reference-data"}) {
            if (candidate != null && !candidate.isBlank()) {
                Path p = Paths.get(candidate, sub);
                if (Files.isDirectory(p)) {
                    return p;
                }
            }
        }
        assumeTrue(false, "reference data folder " + sub + " not found (set -Dlinewright.referenceDir)");
        return null;
    }

    /** A file of the 160-character samples, e.g. {@code sample_CO.par}, or a skipped test. */
    public static Path hitranSample(String fileName) {
        Path p = dir(HITRAN_SAMPLES).resolve(fileName);
        assumeTrue(Files.isRegularFile(p), "reference sample " + p + " not found");
        return p;
    }

    /**
     * Ingests sample files into a line store with the built-in registry (strict), for tests of later stages.
     *
     * @return {@code storeDir}
     */
    public static Path ingest(Path storeDir, Path... samples) throws IOException {
        IngestPipeline.run(List.of(samples), storeDir, IngestOptions.strict(MoleculeRegistry.builtIn()),
                IngestListener.NONE);
        return storeDir;
    }

    /** The lines of a sample file (ASCII). */
    public static List<String> lines(Path p) throws IOException {
        return Files.readAllLines(p, java.nio.charset.StandardCharsets.ISO_8859_1);
    }
}
