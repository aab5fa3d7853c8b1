package org.linewright.ingest.hitran;

import java.io.IOException;
import java.io.OutputStream;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.function.IntFunction;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.TextColumn;

/**
 * Formats rows of a {@link LineBatch} as 160-character records (layout of {@link HitranField}).
 *
 * <p>Numbers: each field is written with its nominal number of decimals (F12.6, E10.3, ...), correctly
 * rounded from the exact binary value; when that text does not read back to the same double, more decimals
 * are used as far as the field width allows (so values read from a record are written back as they were).
 * As with Fortran output, a leading {@code 0} before the decimal point is dropped when the field would
 * otherwise overflow ({@code .0803} in F5.4, {@code -.000479} in F8.6).
 *
 * <p>Wavenumbers below 100 cm⁻¹ are written in one of two conventions found in published lists, chosen by
 * {@link WavenumberDigits}. Texts (quanta, codes, flag) are written verbatim; a shorter text is
 * right-justified for global quanta and left-justified for the other texts.
 */
public final class HitranRecordWriter {
    /** How many decimals the wavenumber gets. */
    public enum WavenumberDigits {
        /** Always six decimals (F12.6). */
        SIX_DECIMALS,
        /**
         * max(6, 9 − number of integer digits) decimals: nine decimals below 1 cm⁻¹, eight below 10,
         * seven below 100, six above (the extended-precision convention of some lists).
         */
        EXTENDED_BELOW_100
    }

    private static final byte[] SPACES = new byte[HitranField.RECORD_LENGTH];

    static {
        Arrays.fill(SPACES, (byte) ' ');
    }

    private final WavenumberDigits wavenumberDigits;

    public HitranRecordWriter(WavenumberDigits wavenumberDigits) {
        this.wavenumberDigits = wavenumberDigits;
    }

    /** A writer with six-decimal wavenumbers. */
    public HitranRecordWriter() {
        this(WavenumberDigits.SIX_DECIMALS);
    }

    /**
     * Writes row {@code row} as 160 bytes at {@code out[offset, offset+160)}.
     *
     * @throws IllegalArgumentException when a value does not fit its field or is NaN
     */
    public void format(LineBatch b, int row, byte[] out, int offset) {
        System.arraycopy(SPACES, 0, out, offset, HitranField.RECORD_LENGTH);
        put(out, offset, HitranField.MOLECULE, Integer.toString(b.moleculeId[row]), true);
        put(out, offset, HitranField.ISOTOPOLOGUE, isotopologueCode(b.isotopologue[row]), true);
        int nuDecimals = 6;
        double nu = b.wavenumberCm1[row];
        if (wavenumberDigits == WavenumberDigits.EXTENDED_BELOW_100) {
            double a = Math.abs(nu);
            int integerDigits = a < 1 ? 0 : a < 10 ? 1 : a < 100 ? 2 : 3;
            nuDecimals = Math.max(6, 9 - integerDigits);
        }
        put(out, offset, HitranField.WAVENUMBER, fixed(HitranField.WAVENUMBER, nu, nuDecimals), true);
        put(out, offset, HitranField.INTENSITY, scientific(HitranField.INTENSITY, b.intensityCmPerMolecule[row], 3), true);
        put(out, offset, HitranField.EINSTEIN_A, scientific(HitranField.EINSTEIN_A, b.einsteinAS1[row], 3), true);
        put(out, offset, HitranField.AIR_WIDTH, fixed(HitranField.AIR_WIDTH, b.airWidthCm1PerAtm[row], 4), true);
        put(out, offset, HitranField.SELF_WIDTH, fixed(HitranField.SELF_WIDTH, b.selfWidthCm1PerAtm[row], 3), true);
        put(out, offset, HitranField.LOWER_ENERGY, fixed(HitranField.LOWER_ENERGY, b.lowerEnergyCm1[row], 4), true);
        put(out, offset, HitranField.AIR_WIDTH_EXPONENT, fixed(HitranField.AIR_WIDTH_EXPONENT, b.airWidthExponent[row], 2), true);
        put(out, offset, HitranField.AIR_SHIFT, fixed(HitranField.AIR_SHIFT, b.airShiftCm1PerAtm[row], 6), true);
        text(out, offset, HitranField.UPPER_GLOBAL_QUANTA, b.upperGlobalQuanta, row, true);
        text(out, offset, HitranField.LOWER_GLOBAL_QUANTA, b.lowerGlobalQuanta, row, true);
        text(out, offset, HitranField.UPPER_LOCAL_QUANTA, b.upperLocalQuanta, row, false);
        text(out, offset, HitranField.LOWER_LOCAL_QUANTA, b.lowerLocalQuanta, row, false);
        text(out, offset, HitranField.UNCERTAINTY_CODES, b.uncertaintyCodes, row, false);
        text(out, offset, HitranField.REFERENCE_CODES, b.referenceCodes, row, false);
        text(out, offset, HitranField.LINE_MIXING_FLAG, b.lineMixingFlag, row, false);
        put(out, offset, HitranField.UPPER_DEGENERACY, fixed(HitranField.UPPER_DEGENERACY, b.upperDegeneracy[row], 1), true);
        put(out, offset, HitranField.LOWER_DEGENERACY, fixed(HitranField.LOWER_DEGENERACY, b.lowerDegeneracy[row], 1), true);
    }

    /** Row {@code row} as a 160-character string. */
    public String format(LineBatch b, int row) {
        byte[] record = new byte[HitranField.RECORD_LENGTH];
        format(b, row, record, 0);
        return new String(record, StandardCharsets.ISO_8859_1);
    }

    /** Writes every row of the batch, each record followed by LF. */
    public void write(LineBatch b, OutputStream out) throws IOException {
        byte[] record = new byte[HitranField.RECORD_LENGTH + 1];
        record[HitranField.RECORD_LENGTH] = '\n';
        for (int row = 0; row < b.size; row++) {
            format(b, row, record, 0);
            out.write(record);
        }
    }

    private static String isotopologueCode(int isotopologue) {
        if (isotopologue >= 1 && isotopologue <= 9) {
            return Integer.toString(isotopologue);
        }
        switch (isotopologue) {
            case 10: return "0";
            case 11: return "A";
            case 12: return "B";
            default: throw new IllegalArgumentException("isotopologue " + isotopologue + " has no one-character code");
        }
    }

    /** Fixed-point text of {@code value} with at least {@code decimals} decimals that reads back exactly. */
    static String fixed(HitranField field, double value, int decimals) {
        requireFinite(field, value);
        BigDecimal exact = new BigDecimal(Math.abs(value));
        String sign = Double.doubleToRawLongBits(value) < 0 ? "-" : "";
        return shortestExact(field, value, decimals, d -> {
            String digits = exact.setScale(d, RoundingMode.HALF_EVEN).toPlainString();
            String text = sign + digits;
            if (text.length() > field.width() && digits.startsWith("0.")) {
                // Fortran F editing drops the optional leading zero when the field is full
                text = sign + digits.substring(1);
            }
            return text;
        });
    }

    /** Scientific text d.ddd…E±xx with at least {@code decimals} mantissa decimals that reads back exactly. */
    static String scientific(HitranField field, double value, int decimals) {
        requireFinite(field, value);
        BigDecimal exact = new BigDecimal(Math.abs(value));
        String sign = Double.doubleToRawLongBits(value) < 0 ? "-" : "";
        return shortestExact(field, value, decimals, d -> {
            if (value == 0) {
                return sign + "0." + "0".repeat(d) + "E+00";
            }
            BigDecimal rounded = exact.round(new MathContext(d + 1, RoundingMode.HALF_EVEN));
            String digits = rounded.unscaledValue().toString();
            int exponent = digits.length() - 1 - rounded.scale();
            // the unscaled value may carry fewer digits than asked (trailing zeros stripped by rounding)
            StringBuilder mantissa = new StringBuilder(digits);
            while (mantissa.length() < d + 1) {
                mantissa.append('0');
            }
            mantissa.setLength(d + 1);
            int absExponent = Math.abs(exponent);
            return sign + mantissa.charAt(0) + "." + mantissa.substring(1) + "E" + (exponent < 0 ? '-' : '+')
                    + (absExponent < 10 ? "0" : "") + absExponent;
        });
    }

    /**
     * The text {@code textWithDecimals(d)} for the fewest decimals d ≥ {@code decimals} that reads back as
     * {@code value} and fits the field; when none does, the one with {@code decimals} decimals (the closest
     * that fits).
     *
     * @throws IllegalArgumentException when not even that fits the field
     */
    private static String shortestExact(HitranField field, double value, int decimals, IntFunction<String> textWithDecimals) {
        String best = null;
        for (int d = decimals; d < field.width(); d++) {
            String text = textWithDecimals.apply(d);
            if (text.length() > field.width()) {
                break;
            }
            if (best == null) {
                best = text;
            }
            if (Double.parseDouble(text) == value) {
                return text;
            }
        }
        if (best == null) {
            throw new IllegalArgumentException("field " + field.fieldName() + ": " + value
                    + " does not fit " + field.format());
        }
        return best;
    }

    private static void requireFinite(HitranField field, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("field " + field.fieldName() + ": " + value
                    + " cannot be written as " + field.format());
        }
    }

    private static void put(byte[] out, int offset, HitranField field, String text, boolean rightJustify) {
        int width = field.width();
        if (text.length() > width) {
            throw new IllegalArgumentException("field " + field.fieldName() + ": \"" + text
                    + "\" is wider than " + width + " characters");
        }
        int at = offset + field.start() + (rightJustify ? width - text.length() : 0);
        for (int i = 0; i < text.length(); i++) {
            out[at + i] = (byte) text.charAt(i);
        }
    }

    private static void text(byte[] out, int offset, HitranField field, TextColumn column, int row, boolean rightJustify) {
        int length = column.length(row);
        int width = field.width();
        if (length > width) {
            throw new IllegalArgumentException("field " + field.fieldName() + ": \"" + column.get(row)
                    + "\" is wider than " + width + " characters");
        }
        int at = offset + field.start() + (rightJustify ? width - length : 0);
        System.arraycopy(column.bytes(), column.start(row), out, at, length);
    }
}
