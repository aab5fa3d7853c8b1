package org.linewright.grid.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.ingest.InputException;

class EngineFactoryTest {

    @Test
    void createsBothEnginesAndRefusesUnknownOnes() {
        try (CrossSectionEngine e = EngineFactory.create("EXACT", 2, WingTreatment.defaults(), 1e-3)) {
            assertEquals("exact", e.id());
            // the reference engine claims no error of its own (interface contract)
            assertEquals(0.0, e.estimatedRelativeError());
        }
        try (CrossSectionEngine e = EngineFactory.create("fast", 1, WingTreatment.defaults(), 1e-3)) {
            assertEquals("fast", e.id());
        }
        assertThrows(InputException.class, () -> EngineFactory.create("magic", 1, WingTreatment.defaults(), 1e-3));
        assertThrows(InputException.class, () -> EngineFactory.create("exact", 0, WingTreatment.defaults(), 1e-3));
    }
}
