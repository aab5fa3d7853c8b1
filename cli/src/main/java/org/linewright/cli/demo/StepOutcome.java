package org.linewright.cli.demo;

import java.nio.file.Path;
import java.util.List;

/**
 * What a {@link DemoStep} did.
 *
 * @param details one line per fact worth reporting (counts, ranges, parameters)
 * @param files   the files written, absolute or relative to the output folder
 */
public record StepOutcome(List<String> details, List<Path> files) {
    public StepOutcome {
        details = List.copyOf(details);
        files = List.copyOf(files);
    }
}
