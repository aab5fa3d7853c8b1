package org.linewright.grid.engine;

import java.util.List;
import java.util.Locale;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.engine.fast.FastEngine;
import org.linewright.ingest.InputException;

/**
 * Creates cross-section engines by id, as accepted by {@code --engine}. A plain switch: each engine of the build
 * has one case.
 */
public final class EngineFactory {
    /** The ids of the engines known to this factory . */
    public static final List<String> IDS = List.of(ExactEngine.ID, "fast");

    private EngineFactory() {
    }

    /**
     * @param id        {@code exact} or {@code fast} (case-insensitive)
     * @param threads   worker threads, at least 1
     * @param wings     the wing treatment every line gets
     * @param tolerance target relative error for approximate engines (ignored by the exact engine)
     * @return a new engine; close it when done
     * @throws InputException for an unknown or unavailable engine, or fewer than one thread
     */
    public static CrossSectionEngine create(String id, int threads, WingTreatment wings, double tolerance) {
        if (threads < 1) {
            throw new InputException("threads: " + threads + " (expected at least 1)");
        }
        String key = id == null ? "" : id.trim().toLowerCase(Locale.ROOT);
        switch (key) {
            case ExactEngine.ID:
                return new ExactEngine(threads, wings);
            case "fast":
                return new FastEngine(threads, wings, tolerance);
            default:
                throw new InputException("engine '" + id + "': unknown (expected one of " + String.join(", ", IDS) + ")");
        }
    }
}
