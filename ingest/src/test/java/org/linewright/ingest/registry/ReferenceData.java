package org.linewright.ingest.registry;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Assumptions;

/** Locates the shared read-only reference data (never copied into the repository). */
final class ReferenceData {
    private ReferenceData() {
    }

    /** The HITRAN2020 samples directory; the calling test is skipped with a visible reason when absent. */
    static Path hitranSamples() {
        String prop = System.getProperty("linewright.referenceDir");
        for (String candidate : new String[] {prop, "../shared/reference-data", "../../shared/reference-data"}) {
            if (candidate == null) {
                continue;
            }
            Path p = Path.of(candidate, "hitran2020-samples");
            if (Files.isRegularFile(p.resolve("README.md"))) {
                return p;
            }
        }
        Assumptions.assumeTrue(false, "reference data hitran2020-samples not found (system property linewright.referenceDir, "
                + "../shared/reference-data, ../../shared/reference-data)");
        return null;
    }
}
