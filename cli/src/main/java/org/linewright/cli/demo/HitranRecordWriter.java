package org.linewright.cli.demo;

import java.util.Locale;

/**
 * Writes a {@link SyntheticLine} as one HITRAN 160-character record (the fixed-column layout of
 * L.S. Rothman et al., JQSRT 96 (2005) 139, Table 1): I2 molecule, I1 isotopologue, F12.6 wavenumber, E10.3
 * intensity, E10.3 Einstein A, F5.4 air width, F5.3 self width, F10.4 lower energy, F4.2 exponent, F8.6 shift,
 * 4 × A15 quanta, 6I1 uncertainty codes, 6I2 reference codes, A1 line-mixing flag, 2 × F7.1 degeneracies.
 * Plain formatting for the demo data only; numbers that do not fit their field are an error, not truncated.
 */
final class HitranRecordWriter {
    /** Record length without the line terminator. */
    static final int RECORD_LENGTH = 160;
    /** Uncertainty codes: 0 = unreported, as befits invented values. */
    private static final String UNCERTAINTY_CODES = "000000";
    /** Reference codes: none. */
    private static final String REFERENCE_CODES = " 0 0 0 0 0 0";

    private HitranRecordWriter() {
    }

    static String format(SyntheticLine line) {
        StringBuilder sb = new StringBuilder(RECORD_LENGTH);
        sb.append(fit(Integer.toString(line.moleculeId()), 2));
        if (line.isotopologue() < 1 || line.isotopologue() > 9) {
            throw new IllegalArgumentException("isotopologue " + line.isotopologue() + " does not fit the I1 field");
        }
        sb.append(line.isotopologue());
        sb.append(fit(fixed(line.wavenumberCm1(), 6), 12));
        sb.append(fit(scientific(line.intensityCmPerMolecule()), 10));
        sb.append(fit(scientific(line.einsteinAS1()), 10));
        sb.append(fit(dropLeadingZero(fixed(line.airWidthCm1PerAtm(), 4)), 5));
        sb.append(fit(fixed(line.selfWidthCm1PerAtm(), 3), 5));
        sb.append(fit(fixed(line.lowerEnergyCm1(), 4), 10));
        sb.append(fit(fixed(line.airWidthExponent(), 2), 4));
        sb.append(fit(dropLeadingZero(fixed(line.airShiftCm1PerAtm(), 6)), 8));
        sb.append(fit(line.upperVibration(), 15));
        sb.append(fit(line.lowerVibration(), 15));
        sb.append(" ".repeat(15));
        // lower local quanta of a linear molecule: 5X, A1 branch, I3 J'', A1 parity, 5X
        sb.append("     ").append(line.branch()).append(fit(Integer.toString(line.lowerJ()), 3))
                .append(line.rotationalParity()).append("     ");
        sb.append(UNCERTAINTY_CODES).append(REFERENCE_CODES).append(' ');
        sb.append(fit(fixed(line.upperDegeneracy(), 1), 7));
        sb.append(fit(fixed(line.lowerDegeneracy(), 1), 7));
        if (sb.length() != RECORD_LENGTH) {
            throw new IllegalStateException("record of " + sb.length() + " characters: " + sb);
        }
        return sb.toString();
    }

    private static String fixed(double value, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", value);
    }

    private static String scientific(double value) {
        return String.format(Locale.ROOT, "%.3E", value);
    }

    /** F5.4 and F8.6 fields hold ".0803" and "-.002100": the Fortran layout without the leading zero. */
    private static String dropLeadingZero(String s) {
        if (s.startsWith("0.")) {
            return s.substring(1);
        }
        if (s.startsWith("-0.")) {
            return "-" + s.substring(2);
        }
        return s;
    }

    /** Right-aligns text in a field of the given width; too long is an error. */
    private static String fit(String s, int width) {
        if (s.length() > width) {
            throw new IllegalArgumentException("\"" + s + "\" does not fit a field of " + width + " characters");
        }
        return " ".repeat(width - s.length()) + s;
    }
}
