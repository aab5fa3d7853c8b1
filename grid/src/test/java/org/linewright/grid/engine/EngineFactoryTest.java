package org.linewright.grid.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.ingest.InputException;

class EngineFactoryTest {

    @Test
    void createsTheExactEngineAndNamesWhatIsMissing() {
        try (CrossSectionEngine e = EngineFactory.create("EXACT", 2, WingTreatment.defaults(), 1e-3)) {
            assertEquals("exact", e.id());
            // the reference engine claims no error of its own (interface contract)
            assertEquals(0.0, e.estimatedRelativeError());
        }
        // message wording fixed by the command-line specification of --engine
        InputException fast = assertThrows(InputException.class,
                () -> EngineFactory.create("fast", 1, WingTreatment.defaults(), 1e-3));
        assertEquals("engine 'fast' is not available in this build", fast.getMessage());
        assertThrows(InputException.class, () -> EngineFactory.create("magic", 1, WingTreatment.defaults(), 1e-3));
        assertThrows(InputException.class, () -> EngineFactory.create("exact", 0, WingTreatment.defaults(), 1e-3));
    }
}
