package org.linewright.ingest.registry;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Atomic (nuclide) masses in unified atomic mass units, from the Atomic Mass Evaluation AME2020
 * (M. Wang, W.J. Huang, F.G. Kondev, G. Audi, S. Naimi, "The AME 2020 atomic mass evaluation (II).
 * Tables, graphs and references", Chinese Physics C 45 (2021) 030003). Values are neutral-atom masses,
 * transcribed to 1×10⁻⁹ u or better (their published uncertainties are far smaller than the 1×10⁻⁶ g/mol
 * to which molecular masses are needed). The mass of a molecule is the sum of its atoms' masses (chemical
 * binding energies, ~10⁻⁸ u, neglected), and a mass in u is numerically the molar mass in g/mol.
 */
public final class AtomicMasses {
    private static final Map<String, Double> MASSES_U;

    static {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("1H", 1.007825031898);
        m.put("2H", 2.014101777844);
        m.put("3He", 3.016029321967);
        m.put("4He", 4.002603254130);
        m.put("12C", 12.0);
        m.put("13C", 13.003354835336);
        m.put("14N", 14.003074004251);
        m.put("15N", 15.000108898266);
        m.put("16O", 15.994914619257);
        m.put("17O", 16.999131755953);
        m.put("18O", 17.999159612136);
        m.put("19F", 18.998403162067);
        m.put("31P", 30.973761997677);
        m.put("32S", 31.972071173540);
        m.put("33S", 32.971458908640);
        m.put("34S", 33.967867011);
        m.put("36S", 35.967080699);
        m.put("35Cl", 34.968852694);
        m.put("37Cl", 36.965902584);
        m.put("79Br", 78.9183376);
        m.put("81Br", 80.9162897);
        m.put("127I", 126.9044719);
        MASSES_U = Collections.unmodifiableMap(m);
    }

    private AtomicMasses() {
    }

    /** Mass of a nuclide written as mass number and element symbol (e.g. {@code 13C}) in u; NaN when not listed. */
    public static double massU(String nuclide) {
        Double m = MASSES_U.get(nuclide);
        return m == null ? Double.NaN : m;
    }

    /** The listed nuclides and their masses in u. */
    public static Map<String, Double> all() {
        return MASSES_U;
    }

    /**
     * Mass of an isotopologue written as in state-list file names ({@code 12C-16O2}, {@code 1H-2H-16O},
     * {@code 12C-1H3-2H}) in g/mol: the sum of its nuclides' masses.
     *
     * @return the mass, or NaN when a nuclide is not listed
     * @throws IllegalArgumentException when the formula is malformed
     */
    public static double massGPerMol(String isotopeFormula) {
        double sum = 0;
        for (IsotopeFormula.Part p : IsotopeFormula.parse(isotopeFormula)) {
            sum += p.count() * massU(p.nuclide());
        }
        return sum;
    }
}
