package org.linewright.ingest.partition;

import java.util.Collections;
import java.util.HashMap;
import java.util.Map;

/**
 * Molecular constants of the most abundant isotopologue of each molecule, for the rigid-rotor /
 * harmonic-oscillator partition function ({@link RigidRotorHarmonicOscillator}) and as the main isotopologue's
 * constants of the built-in polyatomic model ({@code PolyatomicModel}).
 *
 * <p>Rotational constants (ground vibrational state, cm⁻¹), vibrational fundamentals (cm⁻¹) with their
 * degeneracies, symmetry numbers and low-lying electronic levels follow G. Herzberg, <i>Molecular Spectra and
 * Molecular Structure</i> I (1950), II (1945), III (1966) and the NIST Computational Chemistry Comparison and
 * Benchmark Database (CCCBDB, release 22); all transcribed from memory, rounded to 4–5 significant digits
 * (more is useless for this approximation). The nuclear-spin factor is Π(2I+1) over the atoms, the
 * convention of the tabulated Q(296 K) of the registry.
 *
 * @param moleculeId molecule number
 * @param linear true for linear molecules (one rotational constant B), false for non-linear ones (A, B, C)
 * @param rotationalCm1 {B} for linear molecules, {A, B, C} otherwise, in cm⁻¹
 * @param symmetryNumber rotational symmetry number σ
 * @param nuclearSpinFactor Π(2I+1) over the atoms
 * @param vibrationalCm1 vibrational fundamentals in cm⁻¹
 * @param vibrationalDegeneracy degeneracy of each fundamental
 * @param electronicCm1 electronic (or fine-structure) level energies in cm⁻¹, the first 0
 * @param electronicDegeneracy degeneracy of each level (Λ-doubling included)
 */
public record MolecularConstants(int moleculeId, boolean linear, double[] rotationalCm1, int symmetryNumber,
                                 int nuclearSpinFactor, double[] vibrationalCm1, int[] vibrationalDegeneracy,
                                 double[] electronicCm1, int[] electronicDegeneracy) {

    private static final Map<Integer, MolecularConstants> BY_MOLECULE;

    static {
        Map<Integer, MolecularConstants> m = new HashMap<>();
        // H2O: asymmetric top; ν1, ν2, ν3.
        put(m, nonlinear(1, 27.8806, 14.5216, 9.2777, 2, 4, v(3657.05, 1594.75, 3755.93), d(1, 1, 1)));
        // CO2: linear, σ = 2; ν1 (Fermi-averaged), ν2 bend (doubly degenerate), ν3.
        put(m, linear(2, 0.39022, 2, 1, v(1333.0, 667.38, 2349.14), d(1, 2, 1)));
        put(m, nonlinear(3, 3.5537, 0.44528, 0.39479, 2, 1, v(1103.14, 700.93, 1042.08), d(1, 1, 1)));
        put(m, linear(4, 0.41901, 1, 9, v(1284.9, 588.77, 2223.76), d(1, 2, 1)));
        put(m, linear(5, 1.92253, 1, 1, v(2143.27), d(1)));
        // CH4: spherical top A = B = C, σ = 12.
        put(m, nonlinear(6, 5.2410, 5.2410, 5.2410, 12, 16, v(2917.0, 1533.3, 3019.5, 1306.2), d(1, 2, 3, 3)));
        // O2: X ³Σg⁻, spin triplet.
        put(m, withElectronic(linear(7, 1.43777, 2, 1, v(1556.38), d(1)), v(0), d(3)));
        // NO: X ²Π1/2 and ²Π3/2 (119.8 cm⁻¹), each Λ-doubled.
        put(m, withElectronic(linear(8, 1.6961, 1, 3, v(1876.08), d(1)), v(0, 119.82), d(2, 2)));
        put(m, nonlinear(9, 2.02736, 0.344174, 0.293527, 2, 1, v(1151.7, 517.87, 1362.06), d(1, 1, 1)));
        // NO2: ²A1, spin doublet.
        put(m, withElectronic(nonlinear(10, 8.0023, 0.43370, 0.41040, 2, 3, v(1319.7, 749.65, 1616.85), d(1, 1, 1)), v(0), d(2)));
        put(m, nonlinear(11, 9.9443, 9.9443, 6.2284, 3, 24, v(3336.2, 950.0, 3443.6, 1626.1), d(1, 1, 2, 2)));
        put(m, nonlinear(12, 0.43405, 0.40416, 0.20873, 1, 6,
                v(3550.0, 1709.0, 1326.0, 1304.0, 879.0, 647.0, 579.0, 762.0, 456.0), d(1, 1, 1, 1, 1, 1, 1, 1, 1)));
        // OH: X ²Π3/2 and ²Π1/2 (139.2 cm⁻¹), each Λ-doubled.
        put(m, withElectronic(linear(13, 18.5348, 1, 2, v(3569.6), d(1)), v(0, 139.21), d(2, 2)));
        put(m, linear(14, 20.5567, 1, 4, v(3961.4), d(1)));
        put(m, linear(15, 10.4398, 1, 8, v(2885.98), d(1)));
        put(m, linear(16, 8.3482, 1, 8, v(2558.5), d(1)));
        put(m, linear(17, 6.4263, 1, 12, v(2229.6), d(1)));
        put(m, linear(19, 0.202857, 1, 1, v(858.97, 520.42, 2062.2), d(1, 2, 1)));
        put(m, nonlinear(20, 9.40551, 1.29535, 1.13423, 2, 4, v(2782.5, 1746.1, 1500.2, 1167.3, 2843.3, 1249.1), d(1, 1, 1, 1, 1, 1)));
        put(m, linear(22, 1.98958, 2, 9, v(2329.91), d(1)));
        put(m, linear(23, 1.478222, 1, 6, v(3311.5, 713.46, 2096.85), d(1, 2, 1)));
        put(m, nonlinear(24, 5.2053, 0.443402, 0.443402, 3, 32,
                v(2967.8, 1354.9, 732.8, 3039.3, 1452.2, 1018.1), d(1, 1, 1, 2, 2, 2)));
        put(m, linear(26, 1.176646, 2, 4, v(3372.9, 1974.3, 3294.9, 612.9, 730.3), d(1, 1, 1, 2, 2)));
        // C2H6: the torsion (289 cm⁻¹) is treated as a harmonic oscillator, its largest error source.
        put(m, nonlinear(27, 2.6687, 0.66310, 0.66310, 6, 64,
                v(2954.0, 1388.0, 995.0, 289.0, 2896.0, 1379.0, 2969.0, 1468.0, 822.0, 2985.0, 1469.0, 1190.0),
                d(1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2)));
        put(m, nonlinear(28, 4.4524, 4.4524, 3.9190, 3, 16, v(2323.0, 992.1, 2327.7, 1118.3), d(1, 1, 2, 2)));
        put(m, nonlinear(31, 10.3601, 9.0181, 4.7307, 2, 4, v(2614.6, 1182.7, 2628.5), d(1, 1, 1)));
        // H2: σ = 2; the expansion in B/T is least accurate here (B ≈ 59 cm⁻¹).
        put(m, linear(45, 59.322, 2, 4, v(4161.17), d(1)));
        BY_MOLECULE = Collections.unmodifiableMap(m);
    }

    /** The constants of a molecule's main isotopologue, or null when none are tabulated. */
    public static MolecularConstants forMolecule(int moleculeId) {
        return BY_MOLECULE.get(moleculeId);
    }

    private static void put(Map<Integer, MolecularConstants> m, MolecularConstants c) {
        m.put(c.moleculeId(), c);
    }

    private static MolecularConstants linear(int id, double b, int sigma, int spin, double[] nu, int[] deg) {
        return new MolecularConstants(id, true, new double[] {b}, sigma, spin, nu, deg, v(0), d(1));
    }

    private static MolecularConstants nonlinear(int id, double a, double b, double c, int sigma, int spin, double[] nu, int[] deg) {
        return new MolecularConstants(id, false, new double[] {a, b, c}, sigma, spin, nu, deg, v(0), d(1));
    }

    private static MolecularConstants withElectronic(MolecularConstants c, double[] e, int[] g) {
        return new MolecularConstants(c.moleculeId(), c.linear(), c.rotationalCm1(), c.symmetryNumber(),
                c.nuclearSpinFactor(), c.vibrationalCm1(), c.vibrationalDegeneracy(), e, g);
    }

    private static double[] v(double... values) {
        return values;
    }

    private static int[] d(int... values) {
        return values;
    }
}
