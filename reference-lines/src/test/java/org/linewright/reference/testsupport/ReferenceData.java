package org.linewright.reference.testsupport;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;

import org.junit.jupiter.api.Assumptions;

/**
 * Locates the read-only reference data: system property {@code linewright.referenceDir} (set by Surefire),
 * else {@code ../shared/reference-data} or {@code ../../shared/reference-data}. Tests that need it are skipped,
 * with the reason shown, when it is absent.
 */
public final class ReferenceData {
    private ReferenceData() {
    }

    /** The file {@code hitran2020-samples/name}, or a visible skip when the samples are absent. */
    public static Path hitranSample(String name) {
        Path file = require("hitran2020-samples").resolve(name);
        Assumptions.assumeTrue(Files.isRegularFile(file), "reference sample " + file + " not found");
        return file;
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
}
