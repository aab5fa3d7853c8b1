package org.linewright.cli.demo;

import java.io.IOException;

/**
 * One step of the demo, timed and reported by {@link Demo}. A step reads what earlier steps left in the
 * {@link DemoContext}, writes its files under {@link DemoContext#outDir()}, and says what it did.
 */
public interface DemoStep {
    /** @return a short name for the report, e.g. {@code stage the synthetic data} */
    String name();

    /**
     * Does the work.
     *
     * @return what was done and which files were written
     * @throws org.linewright.ingest.InputException when the demo's own inputs are bad or missing
     */
    StepOutcome run(DemoContext context) throws IOException;
}
