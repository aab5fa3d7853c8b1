package org.linewright.ingest.partition;

import org.linewright.ingest.registry.SpeciesKey;
import java.util.HashMap;
import java.util.Map;
import org.linewright.ingest.registry.AtomicMasses;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Temperature dependence of Q(T) for polyatomic isotopologues: a semiclassical rotor times a product of
 * oscillator sums over the isotopologue's own fundamentals,
 * <pre>
 * Q_model(T) = Q_rot(T) · Π_i (1 − exp(−c2·ν_i/T))^(−d_i)
 * Q_rot = (1/x)(1 + x/3 + x²/15 + 4x³/315),  x = c2·B/T                                (linear molecules)
 * Q_rot = √(π/(x_A x_B x_C)) · [1 + (2A+2B+2C − AB/C − BC/A − CA/B)·c2/(12T)],  x_i = c2·(A,B,C)/T  (non-linear)
 * </pre>
 * The linear series is Mulholland's expansion (H.P. Mulholland, Proc. Cambridge Phil. Soc. 24 (1928) 280);
 * the non-linear form is the classical rotor with its first quantum correction (J.O. Stripp and J.G. Kirkwood,
 * J. Chem. Phys. 19 (1951) 1131). The oscillator sums use the observed fundamentals (not the harmonic
 * wavenumbers), which absorbs the first-order anharmonicity of the lowest levels — common practice. Symmetry
 * numbers and nuclear-spin factors are constant above the lowest rotational levels and cancel in the ratio
 * Q_model(T)/Q_model(296 K) that {@link BuiltInPartitionSums} applies to the tabulated Q(296 K).
 *
 * <p>Constants: for the isotopologues listed in this class their own fundamentals (G. Herzberg,
 * <i>Molecular Spectra and Molecular Structure</i> II (1945) and III (1966); T. Shimanouchi, <i>Tables of
 * Molecular Vibrational Frequencies</i>, NSRDS-NBS 39 (1972); from memory). CO2 isotopologues not listed get
 * the main isotopologue's fundamentals scaled by the harmonic frequency ratios of a linear symmetric XY2
 * molecule (Herzberg II, ch. II: λ1 = k1/m_Y, λ2, λ3 ∝ (1 + 2m_Y/m_X)/m_Y, with the mean 1/m_Y of the two end
 * atoms), which reproduces the observed ¹³C¹⁶O2 fundamentals to 0.1 %. Every other minor isotopologue uses
 * its parent's constants (marked, see {@link Entry#own}).
 *
 * <p>Accuracy (ratio to 296 K, against thermochemical tables, see the tests): ~0.5 % at 1000 K; at 2000 K
 * a few % low, since anharmonicity and rotation–vibration coupling (which raise Q) are left out.
 */
final class PolyatomicModel {
    private static final double C2_CM_K = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;

    /**
     * The constants of one isotopologue.
     *
     * @param linear linear molecule (rotational constant B only)
     * @param rotationalCm1 {B} or {A, B, C} in cm⁻¹
     * @param vibrationalCm1 fundamentals in cm⁻¹
     * @param degeneracy degeneracy of each fundamental
     * @param own true when the fundamentals are the isotopologue's own (observed or mass-scaled)
     * @param approximate true for recalled fundamentals that miss the Teller–Redlich product rule by more than
     *                    anharmonicity explains (see the tests): trusted only as far as the parent's
     * @param note where the constants come from, for provenance
     */
    record Entry(boolean linear, double[] rotationalCm1, double[] vibrationalCm1, int[] degeneracy, boolean own,
                 boolean approximate, String note) { }

    private static final Map<Long, Entry> OWN = new HashMap<>();

    static {
        // H2O: 161 from MolecularConstants; the others (Herzberg II, Shimanouchi 1972; from memory).
        own(1, 2, false, r(27.53, 14.58, 9.22), v(3649.69, 1588.28, 3741.57), d(1, 1, 1));
        own(1, 3, false, r(27.70, 14.55, 9.25), v(3653.15, 1591.33, 3748.32), d(1, 1, 1));
        own(1, 4, false, r(23.41, 9.10, 6.42), v(2723.68, 1403.48, 3707.47), d(1, 1, 1));
        own(1, 5, false, r(23.0, 9.07, 6.38), v(2711.6, 1396.3, 3692.4), d(1, 1, 1));
        own(1, 6, false, r(23.2, 9.08, 6.40), v(2717.2, 1399.7, 3699.4), d(1, 1, 1));
        own(1, 7, false, r(15.42, 7.27, 4.85), v(2671.65, 1178.38, 2787.72), d(1, 1, 1));
        // O3 668, 686 (from memory; they miss the product rule by +3.0 % and −1.0 %: approximate).
        approx(3, 2, false, r(3.48, 0.4275, 0.3799), v(1090.4, 693.3, 1028.1), d(1, 1, 1));
        approx(3, 3, false, r(3.29, 0.4453, 0.3911), v(1074.3, 684.6, 1008.5), d(1, 1, 1));
        // N2O 456, 546, 448, 447 (from memory; 448 misses the product rule by +0.9 %: approximate).
        own(4, 2, true, r(0.41899), v(1280.4, 575.4, 2177.7), d(1, 2, 1));
        own(4, 3, true, r(0.40432), v(1269.9, 585.3, 2201.6), d(1, 2, 1));
        approx(4, 4, true, r(0.39556), v(1246.9, 585.3, 2218.9), d(1, 2, 1));
        own(4, 5, true, r(0.40668), v(1264.7, 586.9, 2220.1), d(1, 2, 1));
        // CH4: 13CH4, CH3D (from memory).
        own(6, 2, false, r(5.2410, 5.2410, 5.2410), v(2914.2, 1533.5, 3009.5, 1296.1), d(1, 2, 3, 3));
        own(6, 3, false, r(5.250, 3.880, 3.880), v(2970.0, 2200.0, 1306.8, 3017.0, 1471.0, 1161.1), d(1, 1, 1, 2, 2, 2));
        // 13CH3D: estimated, misses the product rule (no deuterium anharmonicity excess): approximate.
        approx(6, 4, false, r(5.250, 3.75, 3.75), v(2965.0, 2195.0, 1300.0, 3005.0, 1470.0, 1155.0), d(1, 1, 1, 2, 2, 2));
        // NH3: 15NH3 (inversion-averaged ν2; from memory, approximate).
        own(11, 2, false, r(9.944, 9.944, 6.228), v(3335.0, 945.0, 3435.0, 1625.0), d(1, 1, 2, 2));
        // SO2 646 (from memory; misses the product rule by −0.9 %: approximate).
        approx(9, 2, false, r(2.0277, 0.3344, 0.2863), v(1144.5, 513.5, 1345.1), d(1, 1, 1));
        // HCN: H13CN, HC15N (from memory).
        own(23, 2, true, r(1.43999), v(3292.5, 705.9, 2063.0), d(1, 2, 1));
        own(23, 3, true, r(1.43514), v(3310.0, 711.9, 2064.3), d(1, 2, 1));
        // C2H2: H12C13CH (misses the product rule by −1.2 %: approximate), C2HD (from memory).
        approx(26, 2, true, r(1.1476), v(3363.0, 1940.0, 3286.0, 606.0, 728.4), d(1, 1, 1, 2, 2));
        own(26, 3, true, r(0.9916), v(3335.6, 1853.8, 2583.6, 518.4, 677.8), d(1, 1, 1, 2, 2));
    }

    private PolyatomicModel() {
    }

    /**
     * The constants of an isotopologue: its own, CO2's mass-scaled ones, or its parent's ({@code own} false);
     * null when the molecule has none.
     *
     * @param nuclides the isotopologue's atoms in formula order (for the CO2 mass scaling)
     */
    static Entry constants(int moleculeId, int isotopologue, String[] nuclides) {
        MolecularConstants main = MolecularConstants.forMolecule(moleculeId);
        if (main == null) {
            return null;
        }
        if (isotopologue == 1) {
            return new Entry(main.linear(), main.rotationalCm1(), main.vibrationalCm1(), main.vibrationalDegeneracy(),
                    true, false, "own fundamentals");
        }
        Entry e = OWN.get(key(moleculeId, isotopologue));
        if (e != null) {
            return e;
        }
        if (moleculeId == 2 && nuclides != null && nuclides.length == 3) {
            Entry scaled = carbonDioxideScaled(main, nuclides);
            // A nuclide without a tabulated mass (user-added isotopologue) gives NaN: use the parent's then.
            if (Double.isFinite(scaled.rotationalCm1()[0]) && Double.isFinite(scaled.vibrationalCm1()[2])) {
                return scaled;
            }
        }
        return new Entry(main.linear(), main.rotationalCm1(), main.vibrationalCm1(), main.vibrationalDegeneracy(),
                false, false, "fundamentals of the main isotopologue");
    }

    /** Q_model(T) of the class comment (no symmetry number, no nuclear-spin factor). */
    static double partitionSum(Entry c, double temperatureK) {
        double t = temperatureK;
        double[] r = c.rotationalCm1();
        double qRot;
        if (c.linear()) {
            double x = C2_CM_K * r[0] / t;
            qRot = (1.0 + x / 3.0 + x * x / 15.0 + 4.0 * x * x * x / 315.0) / x;
        } else {
            double a = r[0];
            double b = r[1];
            double cc = r[2];
            double classical = Math.sqrt(Math.PI * Math.pow(t / C2_CM_K, 3) / (a * b * cc));
            double correction = (2 * a + 2 * b + 2 * cc - a * b / cc - b * cc / a - cc * a / b) * C2_CM_K / (12.0 * t);
            qRot = classical * (1.0 + correction);
        }
        double qVib = 1.0;
        double[] nu = c.vibrationalCm1();
        int[] deg = c.degeneracy();
        for (int i = 0; i < nu.length; i++) {
            // -expm1 keeps 1 − e^(−y) accurate for low-frequency modes at high temperature.
            qVib *= Math.pow(-Math.expm1(-C2_CM_K * nu[i] / t), -deg[i]);
        }
        return qRot * qVib;
    }

    private static Entry carbonDioxideScaled(MolecularConstants main, String[] nuclides) {
        double mO = AtomicMasses.massU("16O");
        double mC = AtomicMasses.massU("12C");
        // The carbon is the centre: first in 13C-16O2, second in 16O-13C-18O.
        int c = nuclides[0].endsWith("C") ? 0 : 1;
        double centre = AtomicMasses.massU(nuclides[c]);
        double end1 = AtomicMasses.massU(nuclides[c == 0 ? 1 : 0]);
        double end2 = AtomicMasses.massU(nuclides[2]);
        double invY = 0.5 * (1 / end1 + 1 / end2);
        double s1 = Math.sqrt(invY * mO);
        double s23 = Math.sqrt((invY + 2 / centre) / (1 / mO + 2 / mC));
        double[] nu = main.vibrationalCm1();
        double[] scaled = {nu[0] * s1, nu[1] * s23, nu[2] * s23};
        // B ∝ 1/I with I = Σ m_i r_i² about the centre of mass (equal C–O bond lengths).
        double total = end1 + centre + end2;
        double z = (end2 - end1) / total; // centre-of-mass offset in bond lengths
        double inertia = end1 * (1 + z) * (1 + z) + centre * z * z + end2 * (1 - z) * (1 - z);
        double b = main.rotationalCm1()[0] * 2 * mO / inertia;
        return new Entry(true, new double[] {b}, scaled, main.vibrationalDegeneracy(), true, false,
                "fundamentals of 12C16O2 scaled by XY2 harmonic mass ratios");
    }

    private static void own(int mol, int iso, boolean linear, double[] rot, double[] nu, int[] deg) {
        OWN.put(key(mol, iso), new Entry(linear, rot, nu, deg, true, false, "own fundamentals"));
    }

    private static void approx(int mol, int iso, boolean linear, double[] rot, double[] nu, int[] deg) {
        OWN.put(key(mol, iso), new Entry(linear, rot, nu, deg, true, true, "approximate own fundamentals"));
    }

    private static long key(int mol, int iso) {
        return SpeciesKey.of(mol, iso);
    }

    private static double[] r(double... x) {
        return x;
    }

    private static double[] v(double... x) {
        return x;
    }

    private static int[] d(int... x) {
        return x;
    }
}
