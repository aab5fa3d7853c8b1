package org.linewright.ingest.partition;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ConcurrentHashMap;
import org.linewright.ingest.registry.IsotopeFormula;
import org.linewright.ingest.registry.Isotopologue;

/**
 * The built-in temperature dependence of Q(T): Q(T) = Q(296 K)_tabulated · Q_model(T) / Q_model(296 K), with
 * Q_model from the isotopologue's own constants —
 * <ul>
 *   <li>diatomic molecules: direct summation over the bound rovibrational levels ({@link DiatomicLevelSum});</li>
 *   <li>polyatomic molecules: semiclassical rotor × oscillator sums over the fundamentals
 *       ({@link PolyatomicModel});</li>
 * </ul>
 * and what the value can be trusted to. Validity, stated per value ({@link Estimate#warnings()}):
 * <ul>
 *   <li>diatomic: within 0.5 % from {@value #LOW_LIMIT_K} K to {@value #DIATOMIC_LIMIT_K} K (checked for CO against
 *       an independent level summation and thermochemical tables; other diatomics share the method, their
 *       constants checked through Q(296 K)); a warning beyond;</li>
 *   <li>polyatomic with own constants: within 1 % to {@value #POLYATOMIC_OWN_LIMIT_K} K ({@value #WATER_LIMIT_K} K
 *       for the H2O isotopologues, {@value #CARBON_DIOXIDE_MAIN_LIMIT_K} K for ¹²C¹⁶O2, as checked against
 *       thermochemical tables), a warning above (missing anharmonicity: up to a few % low at 2000 K);</li>
 *   <li>polyatomic minor isotopologue with its parent's constants, or with approximate own ones: a warning
 *       above {@value #POLYATOMIC_PARENT_LIMIT_K} K;</li>
 *   <li>NH3 and C2H6 below {@value #POLYATOMIC_LOW_LIMIT_K} K: a warning; the other polyatomics are used down to
 *       {@value #LOW_LIMIT_K} K (the semiclassical rotor with its first correction is within 0.4 % of exact
 *       rigid-rotor level sums with nuclear-spin weights there, see the tests).</li>
 * </ul>
 * Thread-safe; diatomic levels are computed once per isotopologue.
 */
final class BuiltInPartitionSums {
    /** Version of the built-in model, recorded with every value it gives. */
    static final String VERSION = "2";
    static final double REFERENCE_TEMPERATURE_K = 296.0;
    static final double LOW_LIMIT_K = 50.0;
    static final double DIATOMIC_LIMIT_K = 3000.0;
    static final double POLYATOMIC_OWN_LIMIT_K = 1000.0;
    static final double POLYATOMIC_PARENT_LIMIT_K = 500.0;
    static final double POLYATOMIC_LOW_LIMIT_K = 100.0;
    /** H2O: 1.2 % low at 1000 K against thermochemical tables (see the tests), so its limit is lower. */
    static final double WATER_LIMIT_K = 700.0;
    private static final int WATER = 1;
    /** ¹²C¹⁶O2: +0.07 % at 1000 K and −0.75 % at 2000 K against thermochemical tables (see the tests). */
    static final double CARBON_DIOXIDE_MAIN_LIMIT_K = 2000.0;
    private static final int CARBON_DIOXIDE = 2;

    /**
     * A modelled Q(T)/Q(296 K) and what it assumed.
     *
     * @param ratio Q_model(T)/Q_model(296 K)
     * @param method the model and its constants, e.g. {@code built-in v2: level sum (Dunham, mass-scaled)}
     * @param warnings where the value may be outside the stated accuracy (empty when within it)
     */
    record Estimate(double ratio, String method, List<String> warnings) { }

    private final ConcurrentHashMap<String, DiatomicLevelSum> diatomics = new ConcurrentHashMap<>();

    /** The estimate for an isotopologue, or null when no constants are known for its molecule. */
    Estimate estimate(Isotopologue iso, double temperatureK) {
        String[] nuclides = nuclides(iso.isotopeFormula());
        DiatomicConstants dc = DiatomicConstants.forMolecule(iso.moleculeId());
        List<String> warnings = new ArrayList<>();
        if (dc != null && nuclides != null && nuclides.length == 2) {
            DiatomicLevelSum levels;
            try {
                levels = diatomics.computeIfAbsent(iso.key(), k -> DiatomicLevelSum.of(dc, nuclides[0], nuclides[1]));
            } catch (IllegalArgumentException e) {
                // A user-added isotopologue with a nuclide whose mass or spin is not tabulated: no model.
                return null;
            }
            double ratio = levels.partitionSum(temperatureK) / levels.partitionSum(REFERENCE_TEMPERATURE_K);
            if (temperatureK < LOW_LIMIT_K || temperatureK > DIATOMIC_LIMIT_K) {
                warnings.add(warning(iso, temperatureK, "outside " + (int) LOW_LIMIT_K + "–" + (int) DIATOMIC_LIMIT_K
                        + " K, where the level sum is checked to 0.5 %"));
            }
            return new Estimate(ratio, "built-in v" + VERSION + ": direct sum over " + levels.levelCount()
                    + " rovibrational levels (Dunham constants, mass-scaled) × Q(296 K) of the registry", warnings);
        }
        PolyatomicModel.Entry pc = PolyatomicModel.constants(iso.moleculeId(), iso.number(), nuclides);
        if (pc == null) {
            return null;
        }
        double ratio = PolyatomicModel.partitionSum(pc, temperatureK) / PolyatomicModel.partitionSum(pc, REFERENCE_TEMPERATURE_K);
        double limit;
        if (!pc.own() || pc.approximate()) {
            limit = POLYATOMIC_PARENT_LIMIT_K;
        } else if (iso.moleculeId() == WATER) {
            limit = WATER_LIMIT_K;
        } else if (iso.moleculeId() == CARBON_DIOXIDE && iso.number() == 1) {
            limit = CARBON_DIOXIDE_MAIN_LIMIT_K;
        } else {
            limit = POLYATOMIC_OWN_LIMIT_K;
        }
        if (temperatureK > limit) {
            warnings.add(warning(iso, temperatureK, "above " + (int) limit + " K the rotor–oscillator model may be off"
                    + " by more than 1 % (no anharmonicity; " + pc.note() + "): give a table"));
        }
        if (temperatureK < LOW_LIMIT_K || (temperatureK < POLYATOMIC_LOW_LIMIT_K && hasSpinSpecies(iso))) {
            warnings.add(warning(iso, temperatureK, "below " + (int) (hasSpinSpecies(iso)
                    ? POLYATOMIC_LOW_LIMIT_K : LOW_LIMIT_K) + " K the semiclassical rotor is not checked (inversion or torsion levels): give a table"));
        }
        return new Estimate(ratio, "built-in v" + VERSION + ": semiclassical rotor × oscillator sums ("
                + pc.note() + ") × Q(296 K) of the registry", warnings);
    }

    /**
     * NH3 (inversion doubling with its spin statistics) and C2H6 (torsion): the semiclassical rotor is not checked
     * against a level sum below {@value #POLYATOMIC_LOW_LIMIT_K} K. (CH4, PH3, CH3D and CH3Cl are, with their
     * nuclear-spin species: within 0.24 % at 50 K.)
     */
    private static boolean hasSpinSpecies(Isotopologue iso) {
        int m = iso.moleculeId();
        return m == 11 || m == 27;
    }

    private static String warning(Isotopologue iso, double temperatureK, String what) {
        return String.format(Locale.ROOT, "Q(%.6g K) of %s (%s) is modelled: %s", temperatureK, iso.isotopeFormula(),
                iso.key(), what);
    }

    /** The nuclides of a formula, one per atom in formula order; null when it cannot be parsed. */
    static String[] nuclides(String isotopeFormula) {
        try {
            List<String> out = new ArrayList<>();
            for (IsotopeFormula.Part p : IsotopeFormula.parse(isotopeFormula)) {
                for (int i = 0; i < p.count(); i++) {
                    out.add(p.nuclide());
                }
            }
            return out.toArray(new String[0]);
        } catch (IllegalArgumentException e) {
            return null;
        }
    }
}
