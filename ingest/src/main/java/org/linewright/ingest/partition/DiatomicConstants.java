package org.linewright.ingest.partition;

import java.util.List;
import java.util.Map;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Spectroscopic constants of the diatomic molecules of the registry, for the direct level summation
 * {@link DiatomicLevelSum}: Dunham coefficients Y_kl of a reference isotopologue (mass-scaled to the others),
 * the dissociation energy, the electronic structure of the ground state and any low excited state that
 * matters below 4000 K.
 *
 * <p>Term values E(v, J) = Σ_kl Y_kl (v + ½)^k [J(J+1)]^l (J. L. Dunham, Phys. Rev. 41 (1932) 721); where only
 * the Herzberg constants are known, Y10 = ωe, Y20 = −ωexe, Y30 = ωeye, Y01 = Be, Y11 = −αe, Y21 = γe, Y02 = −De,
 * Y12 = −βe, Y03 = He (common practice; the small differences between Y01 and Be are neglected).
 * Sources: K.P. Huber and G. Herzberg, <i>Constants of Diatomic Molecules</i> (1979), and for ¹²C¹⁶O the Dunham
 * fit of G. Guelachvili et al., J. Mol. Spectrosc. 98 (1983) 64; all transcribed from memory, so each molecule's
 * model is checked against its tabulated Q(296 K) in the tests.
 *
 * @param moleculeId molecule number
 * @param nuclide1 first nuclide of the reference isotopologue (e.g. {@code 12C})
 * @param nuclide2 second nuclide of the reference isotopologue (e.g. {@code 16O})
 * @param dunhamCm1 Y_kl in cm⁻¹, indexed [k][l] (missing entries 0)
 * @param dissociationCm1 D0, the dissociation energy from the lowest level, in cm⁻¹ (bound levels lie below)
 * @param ground the ground electronic state
 * @param excited low excited electronic states (term value of v = 0, J = 0 above the ground state's v = 0)
 */
record DiatomicConstants(int moleculeId, String nuclide1, String nuclide2, double[][] dunhamCm1,
                         double dissociationCm1, State ground, List<ExcitedState> excited) {

    /**
     * Electronic structure of a state.
     *
     * @param lambda |Λ| (0 for Σ, 1 for Π, 2 for Δ); Λ > 0 levels are doubled (both Λ components counted)
     * @param multiplicity 2S+1
     * @param spinOrbitCm1 spin–orbit constant A for a ²Π state (Hill–Van Vleck energies), else 0
     * @param evenSymmetric for Σ states of homonuclear molecules: true when even-N levels are symmetric
     *                      under nuclear exchange (Σg⁺), false when odd ones are (Σg⁻)
     * @param lowestBelowCentroidCm1 for a Σ state with spin (O2 X ³Σg⁻): how far the lowest fine-structure
     *                               level lies below the (2J+1)-weighted centroid of its rotational level, which
     *                               is where the model puts all of them; applied when the lowest rotational
     *                               level is not N = 0 (which has a single fine-structure level)
     */
    record State(int lambda, int multiplicity, double spinOrbitCm1, boolean evenSymmetric,
                 double lowestBelowCentroidCm1) { }

    /** An excited electronic state: its term value (v = 0 to v = 0), own Dunham coefficients and structure. */
    record ExcitedState(double termCm1, double[][] dunhamCm1, State state) { }

    private static final State SIGMA_PLUS = new State(0, 1, 0, true, 0);

    private static final Map<Integer, DiatomicConstants> BY_MOLECULE = Map.ofEntries(
            // CO X¹Σ⁺: Dunham fit of Guelachvili et al. 1983 (from memory); D0 = 11.09 eV (Huber & Herzberg).
            entry(new DiatomicConstants(5, "12C", "16O", y(
                    row(0, 1.93128087, -6.12147e-6, 5.7e-12),
                    row(2169.81358, -1.7504391e-2, 1.0e-9),
                    row(-13.28831, 5.487e-7),
                    row(1.0511e-2),
                    row(5.74e-5)), ev(11.09), SIGMA_PLUS, List.of())),
            // O2 X³Σg⁻: the triplet is put at its rotational level's centroid; the N = 1 fine-structure levels
            // J = 0, 2, 1 lie at 0, 2.084, 3.961 cm⁻¹ (the 56.3 and 118.75 GHz lines, from memory), weighted
            // centroid 2.478 cm⁻¹ above the lowest level. a¹Δg (T0 = 7882.4 cm⁻¹) and b¹Σg⁺ (13120.9 cm⁻¹)
            // add ~4 % at 3000 K.
            entry(new DiatomicConstants(7, "16O", "16O", y(
                    row(0, 1.44563, -4.839e-6),
                    row(1580.193, -0.0159),
                    row(-11.981),
                    row(0.04747)), ev(5.116), new State(0, 3, 0, false, 2.478), List.of(
                    new ExcitedState(7882.39, y(row(0, 1.4264, -4.86e-6), row(1483.50, -0.0171), row(-12.9)),
                            new State(2, 1, 0, true, 0)),
                    new ExcitedState(13120.91, y(row(0, 1.40037, -5.35e-6), row(1432.77, -0.0182), row(-14.00)),
                            new State(0, 1, 0, true, 0))))),
            // NO X²Π (regular, A = 123.26 cm⁻¹); Be = B0 + αe/2 with B0 = 1.6961 cm⁻¹ (from memory).
            entry(new DiatomicConstants(8, "14N", "16O", y(
                    row(0, 1.70465, -5.4e-6),
                    row(1904.20, -0.0171),
                    row(-14.075),
                    row(0.0110)), ev(6.497), new State(1, 2, 123.26, true, 0), List.of())),
            // OH X²Π (inverted, A = −139.21 cm⁻¹).
            entry(new DiatomicConstants(13, "16O", "1H", y(
                    row(0, 18.911, -1.938e-3),
                    row(3737.76, -0.7242),
                    row(-84.881),
                    row(0.540)), ev(4.392), new State(1, 2, -139.21, true, 0), List.of())),
            entry(new DiatomicConstants(14, "1H", "19F", y(
                    row(0, 20.9557, -2.151e-3),
                    row(4138.32, -0.798),
                    row(-89.88),
                    row(0.90)), ev(5.869), SIGMA_PLUS, List.of())),
            entry(new DiatomicConstants(15, "1H", "35Cl", y(
                    row(0, 10.5934, -5.3194e-4, 1.68e-8),
                    row(2990.946, -0.30718),
                    row(-52.8186),
                    row(0.2243)), ev(4.4336), SIGMA_PLUS, List.of())),
            entry(new DiatomicConstants(16, "1H", "79Br", y(
                    row(0, 8.46488, -3.458e-4),
                    row(2648.975, -0.23328),
                    row(-45.2175),
                    row(-0.0029)), ev(3.758), SIGMA_PLUS, List.of())),
            entry(new DiatomicConstants(17, "1H", "127I", y(
                    // Be = B0 + αe/2 with B0 = 6.4263 cm⁻¹ (from memory).
                    row(0, 6.51075, -2.069e-4),
                    row(2309.014, -0.1689),
                    row(-39.6435)), ev(3.054), SIGMA_PLUS, List.of())),
            // N2 X¹Σg⁺.
            entry(new DiatomicConstants(22, "14N", "14N", y(
                    row(0, 1.99824, -5.76e-6),
                    row(2358.57, -0.017318),
                    row(-14.324),
                    row(-0.00226)), ev(9.759), SIGMA_PLUS, List.of())),
            // H2 X¹Σg⁺: large centrifugal terms; the Dunham series is least reliable at high J here.
            entry(new DiatomicConstants(45, "1H", "1H", y(
                    row(0, 60.853, -0.0471, 4.9e-5),
                    row(4401.21, -3.062),
                    row(-121.34, 0.057),
                    row(0.81)), ev(4.4781), SIGMA_PLUS, List.of())));

    /** The constants of a diatomic molecule, or null when it is not one of those tabulated here. */
    static DiatomicConstants forMolecule(int moleculeId) {
        return BY_MOLECULE.get(moleculeId);
    }

    private static Map.Entry<Integer, DiatomicConstants> entry(DiatomicConstants c) {
        return Map.entry(c.moleculeId(), c);
    }

    /** eV to cm⁻¹ ({@link PhysicalConstants#ELECTRON_VOLT_CM1}). */
    private static double ev(double electronVolts) {
        return electronVolts * PhysicalConstants.ELECTRON_VOLT_CM1;
    }

    private static double[][] y(double[]... rows) {
        return rows;
    }

    private static double[] row(double... values) {
        return values;
    }
}
