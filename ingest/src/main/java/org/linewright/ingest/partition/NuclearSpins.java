package org.linewright.ingest.partition;

import java.util.Map;

/**
 * Ground-state nuclear spins I of the nuclides of the registry, for the nuclear-spin degeneracies (2I+1) that
 * the total internal partition sums include (the convention of the 160-character line lists' intensities:
 * Q counts every nuclear-spin state). Values: standard nuclear data (e.g. N.J. Stone, "Table of nuclear
 * magnetic dipole and electric quadrupole moments", At. Data Nucl. Data Tables 90 (2005) 75), from memory.
 */
final class NuclearSpins {
    /** Twice the spin, 2I, so that half-integer spins stay integers. */
    private static final Map<String, Integer> TWICE_SPIN = Map.ofEntries(
            Map.entry("1H", 1), Map.entry("2H", 2), Map.entry("12C", 0), Map.entry("13C", 1),
            Map.entry("14N", 2), Map.entry("15N", 1), Map.entry("16O", 0), Map.entry("17O", 5),
            Map.entry("18O", 0), Map.entry("19F", 1), Map.entry("31P", 1), Map.entry("32S", 0),
            Map.entry("33S", 3), Map.entry("34S", 0), Map.entry("36S", 0), Map.entry("35Cl", 3),
            Map.entry("37Cl", 3), Map.entry("79Br", 3), Map.entry("81Br", 3), Map.entry("127I", 5));

    private NuclearSpins() {
    }

    /** 2I of a nuclide such as {@code 13C}; −1 when not tabulated. */
    static int twiceSpin(String nuclide) {
        Integer s = TWICE_SPIN.get(nuclide);
        return s == null ? -1 : s;
    }

    /** The degeneracy 2I+1 of a nuclide; −1 when not tabulated. */
    static int degeneracy(String nuclide) {
        int s = twiceSpin(nuclide);
        return s < 0 ? -1 : s + 1;
    }
}
