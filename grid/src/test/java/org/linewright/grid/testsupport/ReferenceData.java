package org.linewright.grid.testsupport;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import org.junit.jupiter.api.Assumptions;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.registry.MoleculeRegistry;

/**
 * Locates the read-only reference data: system property {@code linewright.referenceDir} (set by Surefire),
 * else {@code ../shared/reference-data} or {@code ../../shared/reference-data}. Tests that need it are skipped,
 * with the reason shown, when it is absent.
 */
public final class ReferenceData {
    private ReferenceData() {
    }

    /** The folder {@code name} inside the reference data, or a visible skip when it is absent. */
    public static Path require(String name) {
        String prop = System.getProperty("linewright.referenceDir");
        Path[] candidates = {
            prop == null ? null : Paths.get(prop),
            Paths.get("..", "shared", "reference-data"),
            Paths.get("..", "..", "shared", "reference-data")
        };
        for (Path base : candidates) {
            if (base != null && Files.isDirectory(base.resolve(name))) {
                return base.resolve(name);
            }
        }
        Assumptions.abort("reference data folder '" + name + "' not found (system property linewright.referenceDir="
                + prop + ", ../shared/reference-data, ../../shared/reference-data)");
        throw new AssertionError("unreachable");
    }

    /** A HITRAN2020 sample file, e.g. {@code sample_CO.par}, or a visible skip. */
    public static Path hitranSample(String fileName) {
        Path p = require("hitran2020-samples").resolve(fileName);
        Assumptions.assumeTrue(Files.isRegularFile(p), "reference sample " + p + " not found");
        return p;
    }

    /** Ingests sample files into a new line store at {@code storeDir} with the built-in registry. */
    public static Path ingest(Path storeDir, Path... samples) throws IOException {
        IngestPipeline.run(List.of(samples), storeDir, IngestOptions.strict(MoleculeRegistry.builtIn()),
                IngestListener.NONE);
        return storeDir;
    }
}
