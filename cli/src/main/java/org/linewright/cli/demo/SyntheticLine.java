package org.linewright.cli.demo;

/**
 * One invented line of the synthetic demo list, with the fields of a HITRAN 160-character record.
 *
 * @param moleculeId                HITRAN molecule number (5 = CO, 2 = CO2)
 * @param isotopologue              HITRAN local isotopologue number
 * @param wavenumberCm1             vacuum wavenumber of the transition, cm⁻¹
 * @param intensityCmPerMolecule    line intensity at 296 K, weighted by natural abundance, cm/molecule
 * @param einsteinAS1               Einstein A coefficient, s⁻¹
 * @param airWidthCm1PerAtm         air-broadened half width at 296 K, cm⁻¹/atm
 * @param selfWidthCm1PerAtm        self-broadened half width at 296 K, cm⁻¹/atm
 * @param lowerEnergyCm1            lower-state energy, cm⁻¹
 * @param airWidthExponent          temperature exponent of the air width
 * @param airShiftCm1PerAtm         air pressure shift at 296 K, cm⁻¹/atm
 * @param upperVibration            upper vibrational level, written as the record's upper global quanta
 * @param lowerVibration            lower vibrational level, written as the record's lower global quanta
 * @param branch                    'P', 'Q' or 'R'
 * @param lowerJ                    lower rotational quantum number J″
 * @param rotationalParity          the e/f label of the lower level, or ' ' when not written
 * @param upperDegeneracy           upper-state statistical weight g′
 * @param lowerDegeneracy           lower-state statistical weight g″
 */
public record SyntheticLine(int moleculeId, int isotopologue, double wavenumberCm1, double intensityCmPerMolecule,
                            double einsteinAS1, double airWidthCm1PerAtm, double selfWidthCm1PerAtm,
                            double lowerEnergyCm1, double airWidthExponent, double airShiftCm1PerAtm,
                            String upperVibration, String lowerVibration, char branch, int lowerJ,
                            char rotationalParity, double upperDegeneracy, double lowerDegeneracy) {

    /** @return the upper rotational quantum number J′ = J″ + 1 (R), J″ (Q) or J″ − 1 (P) */
    public int upperJ() {
        return switch (branch) {
            case 'R' -> lowerJ + 1;
            case 'Q' -> lowerJ;
            case 'P' -> lowerJ - 1;
            default -> throw new IllegalStateException("branch " + branch);
        };
    }

    /**
     * The lower local quanta of a linear molecule in the 160-character layout: 5X, A1 branch, I3 J″, A1 e/f
     * label, 5X (e.g. {@code "     R  0e     "}).
     */
    public String lowerLocalQuanta() {
        String j = Integer.toString(lowerJ);
        return "     " + branch + "   ".substring(j.length()) + j + rotationalParity + "     ";
    }
}
