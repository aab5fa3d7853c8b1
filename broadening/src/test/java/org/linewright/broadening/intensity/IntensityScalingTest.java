package org.linewright.broadening.intensity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Map;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.testsupport.SampleIsotopologues;

/**
 * The check: S is proportional to the isotopologue abundance I_a on both intensity paths — S(296 K) lists carry
 * I_a in S by definition (Rothman et al. 1998, JQSRT 60, 665, appendix), and the Einstein-A relation is linear
 * in I_a (Šimečková et al. 2006, JQSRT 98, 130, eq. 20). So doubling one isotopologue's abundance doubles S of
 * every one of its lines and leaves the others unchanged; per molecule of one isotopologue S is S/I_a. Every
 * row of a batch mixing CO isotopologues 1 and 2 and both paths is compared, at several temperatures.
 */
class IntensityScalingTest {
    private static final double A1 = 0.986544; // CO 5/1 abundance of the test registry (HITRAN table, from the README)
    private static final double A2 = 0.011083; // CO 5/2

    private static LineBatch mixedBatch() {
        int n = 40;
        LineBatch b = new LineBatch(n);
        b.size = n;
        for (int i = 0; i < n; i++) {
            b.moleculeId[i] = 5;
            b.isotopologue[i] = 1 + (i % 2);
            b.wavenumberCm1[i] = 2000 + 3.7 * i;
            b.lowerEnergyCm1[i] = 50.0 * i;
            b.upperDegeneracy[i] = 2 * (i % 7) + 1;
            b.einsteinAS1[i] = 5 + i;
            // every third line from A (state-list style), the others from S(296 K)
            b.intensityCmPerMolecule[i] = i % 3 == 0 ? Double.NaN : 1e-20 * (1 + i);
        }
        return b;
    }

    @Test
    void doublingOneAbundanceDoublesItsLinesOnly() {
        SampleIsotopologues lookup = SampleIsotopologues.withLinearRotorQ();
        LineBatch b = mixedBatch();
        IntensityScaling doubled = new IntensityScaling(IntensityConvention.NATURAL_ABUNDANCE, Map.of("5/2", 2 * A2));
        for (double t : new double[] {100, 296, 1000, 3000}) {
            IsotopologueCache cache = new IsotopologueCache(lookup, t);
            double[] base = new double[b.size];
            double[] scaled = new double[b.size];
            LineIntensity.atTemperature(b, cache, base);
            LineIntensity.atTemperature(b, cache, scaled);
            doubled.newApplier().apply(b, cache, scaled);
            for (int i = 0; i < b.size; i++) {
                double expected = b.isotopologue[i] == 2 ? 2 * base[i] : base[i];
                assertEquals(expected, scaled[i], 1e-15 * expected, "row " + i + " at " + t + " K");
            }
        }
    }

    @Test
    void isotopologueConventionDividesByTheAbundance() {
        SampleIsotopologues lookup = SampleIsotopologues.withLinearRotorQ();
        LineBatch b = mixedBatch();
        IntensityScaling perIsotopologue = new IntensityScaling(IntensityConvention.ISOTOPOLOGUE, Map.of());
        IsotopologueCache cache = new IsotopologueCache(lookup, 700);
        double[] base = new double[b.size];
        double[] scaled = new double[b.size];
        LineIntensity.atTemperature(b, cache, base);
        LineIntensity.atTemperature(b, cache, scaled);
        perIsotopologue.newApplier().apply(b, cache, scaled);
        for (int i = 0; i < b.size; i++) {
            double expected = base[i] / (b.isotopologue[i] == 1 ? A1 : A2);
            assertEquals(expected, scaled[i], 1e-15 * expected, "row " + i);
        }
        // a line from A with I_a = 1 (isotopically pure sample, Šimečková et al. 2006 eq. 20) is the same number
        assertEquals(LineIntensity.fromEinsteinA(b.einsteinAS1[0], b.upperDegeneracy[0], b.wavenumberCm1[0],
                b.lowerEnergyCm1[0], 1.0, cache.partitionSum(5, 1), 700), scaled[0], 1e-14 * scaled[0]);
    }

    @Test
    void metadataStatesConventionAndAbundances() {
        IntensityScaling s = new IntensityScaling(IntensityConvention.NATURAL_ABUNDANCE, Map.of("1/4", 0.016));
        assertEquals("natural-abundance", s.metadata().get("intensity_convention"));
        assertEquals("1/4=0.01600000000; others natural (registry)", s.metadata().get("isotopologue_abundances"));
        assertEquals("natural (registry)", IntensityScaling.NATURAL.metadata().get("isotopologue_abundances"));
        assertThrows(InputException.class,
                () -> new IntensityScaling(IntensityConvention.NATURAL_ABUNDANCE, Map.of("5/1", 1.5)));
        assertThrows(InputException.class,
                () -> new IntensityScaling(IntensityConvention.ISOTOPOLOGUE, Map.of("5/1", 0.5)));
    }

    /**
     * σ_mix = Σ x_m σ_m / Σ x (definition, docs/physics.md): each molecule's S is multiplied by x_m / Σ x, on top of
     * the abundance factor; a molecule outside the mixture contributes nothing.
     */
    @Test
    void moleculeSharesMultiplyOnTopOfAbundances() {
        SampleIsotopologues lookup = SampleIsotopologues.withLinearRotorQ();
        LineBatch b = mixedBatch();
        for (int i = 0; i < b.size; i += 5) {
            b.moleculeId[i] = 2; // some rows of another molecule (CO2 id), outside or inside the mixture
        }
        IntensityScaling base = new IntensityScaling(IntensityConvention.NATURAL_ABUNDANCE, Map.of("5/2", 2 * A2));
        IntensityScaling coOnly = base.withMoleculeShares(Map.of(5, 0.3));
        IntensityScaling both = base.withMoleculeShares(new java.util.LinkedHashMap<>(Map.of(5, 1.0, 2, 3.0)));
        assertEquals(Map.of(5, 0.25, 2, 0.75), both.moleculeShares());
        IsotopologueCache cache = new IsotopologueCache(lookup, 296);
        double[] plain = new double[b.size];
        double[] one = new double[b.size];
        double[] two = new double[b.size];
        LineIntensity.atTemperature(b, cache, plain);
        base.newApplier().apply(b, cache, plain);
        LineIntensity.atTemperature(b, cache, one);
        coOnly.newApplier().apply(b, cache, one);
        LineIntensity.atTemperature(b, cache, two);
        both.newApplier().apply(b, cache, two);
        for (int i = 0; i < b.size; i++) {
            boolean co = b.moleculeId[i] == 5;
            assertEquals(co ? plain[i] : 0.0, one[i], 1e-15 * plain[i], "row " + i);
            assertEquals((co ? 0.25 : 0.75) * plain[i], two[i], 1e-15 * plain[i], "row " + i);
        }
        assertThrows(InputException.class, () -> base.withMoleculeShares(Map.of(5, -1.0)));
        assertThrows(InputException.class, () -> base.withMoleculeShares(Map.of()));
    }
}
