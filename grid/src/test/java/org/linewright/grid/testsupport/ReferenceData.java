package org.linewright.grid.testsupport;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;

/**
 * Finds the shared, read-only reference data beside the project ({@code linewright.referenceDir}, set by
 * Surefire, else {@code ../shared/reference-data} or {@code ../../shared/reference-data}); a test that needs it
 * is skipped with a visible reason when it is absent.
 */
public final class ReferenceData {
    private ReferenceData() {
    }

    /** A HITRAN2020 sample file, or a skipped test. */
    public static Path hitranSample(String fileName) {
        Path dir = null;
        String property = System.getProperty("linewright.referenceDir");
        for (String candidate : new String[] {property, "../shared/reference-data", "../../shared/reference-data"}) {
            if (candidate != null && Files.isDirectory(Paths.get(candidate))) {
                dir = Paths.get(candidate);
                break;
            }
        }
        assumeTrue(dir != null, "shared reference data not found (linewright.referenceDir="
                + property + "); skipping the test on HITRAN2020 samples");
        Path file = dir.resolve("hitran2020-samples").resolve(fileName);
        assumeTrue(Files.isRegularFile(file), file + " is absent; skipping the test on HITRAN2020 samples");
        return file;
    }
}
