package org.linewright.broadening.isotopologue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.testsupport.SampleIsotopologues;
import org.linewright.ingest.InputException;
import org.linewright.ingest.source.IsotopologueLookup;

class IsotopologueCacheTest {

    /** Counts the registry calls of a test lookup. */
    private static final class Counting implements IsotopologueLookup {
        final SampleIsotopologues inner = SampleIsotopologues.withLinearRotorQ();
        int calls;

        @Override public Id byIsotopeFormula(String f) { return null; }
        @Override public Id byCatalogTag(int t) { return null; }
        @Override public boolean isKnown(int m, int i) { return inner.isKnown(m, i); }
        @Override public double massGPerMol(int m, int i) { calls++; return inner.massGPerMol(m, i); }
        @Override public double naturalAbundance(int m, int i) { calls++; return inner.naturalAbundance(m, i); }
        @Override public double partitionSum(int m, int i, double t) { calls++; return inner.partitionSum(m, i, t); }
    }

    @Test
    void asksTheRegistryOncePerIsotopologue() {
        Counting lookup = new Counting();
        IsotopologueCache cache = new IsotopologueCache(lookup, 500.0);
        for (int row = 0; row < 1000; row++) { // interleaved isotopologues, as in a list sorted by wavenumber
            int iso = 1 + row % 3;
            cache.massGPerMol(5, iso);
            cache.partitionSum(5, iso);
        }
        assertEquals(3 * 4, lookup.calls, "mass, abundance, Q(296), Q(T) once for each of 3 isotopologues");
        // values are those of the lookup: README table Q(296) of 5/2 is 224.69; the test lookup's Q(T) is
        // Q(296)·T/296
        assertEquals(224.69, cache.partitionSum296(5, 2), 1e-12);
        assertEquals(224.69 * 500.0 / 296.0, cache.partitionSum(5, 2), 1e-12);
        assertEquals(0.011083, cache.naturalAbundance(5, 2), 0.0);
    }

    @Test
    void unknownIsotopologuesAndLargeNumbers() {
        IsotopologueCache cache = new IsotopologueCache(SampleIsotopologues.withLinearRotorQ(), 300.0);
        assertTrue(Double.isNaN(cache.massGPerMol(120, 3)), "grows to molecule 120, unknown there");
        assertTrue(Double.isNaN(cache.partitionSum(5, 70)), "isotopologue beyond the slots: direct lookup");
        InputException e = assertThrows(InputException.class, () -> cache.requirePartitionSums(9, 1, 42));
        assertTrue(e.getMessage().contains("molecule 9 isotopologue 1") && e.getMessage().contains("line 42"),
                e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new IsotopologueCache(SampleIsotopologues.withLinearRotorQ(), 0));
    }
}
