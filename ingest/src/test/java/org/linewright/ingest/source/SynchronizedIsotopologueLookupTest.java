package org.linewright.ingest.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import org.junit.jupiter.api.Test;
import org.linewright.ingest.registry.MoleculeRegistry;

/** The serialized view answers exactly what its delegate answers, for every method of the interface. */
class SynchronizedIsotopologueLookupTest {

    /**
     * Every method of {@link IsotopologueLookup}, default methods included, is overridden and synchronized: a
     * default method left to the interface would answer from the interface's default instead of the delegate (how
     * partition-sum sources were once lost behind a wrapper).
     */
    @Test
    void overridesEveryMethodOfTheInterface() throws Exception {
        for (Method m : IsotopologueLookup.class.getMethods()) {
            if (Modifier.isStatic(m.getModifiers())) {
                continue;
            }
            Method own = SynchronizedIsotopologueLookup.class.getDeclaredMethod(m.getName(), m.getParameterTypes());
            assertTrue(Modifier.isSynchronized(own.getModifiers()), m.getName() + " is not synchronized");
        }
    }

    /** Answers equal the registry's own (the built-in registry as delegate), and wrapping twice is one wrapper. */
    @Test
    void delegates() {
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        IsotopologueLookup view = SynchronizedIsotopologueLookup.of(registry);
        assertSame(view, SynchronizedIsotopologueLookup.of(view));
        assertEquals(registry.partitionSum(5, 1, 1000.0), view.partitionSum(5, 1, 1000.0), 0.0);
        assertEquals(registry.partitionSumSource(5, 1, 1000.0), view.partitionSumSource(5, 1, 1000.0));
        assertEquals(registry.naturalAbundance(2, 1), view.naturalAbundance(2, 1), 0.0);
        assertEquals(registry.massGPerMol(2, 2), view.massGPerMol(2, 2), 0.0);
    }
}
