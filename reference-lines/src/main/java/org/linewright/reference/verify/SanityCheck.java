package org.linewright.reference.verify;

import java.util.Locale;

import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;

/**
 * Physical sanity of every line, each fault an error: NaN where a value is required (ν, S, E″); ν or S not
 * positive; A or a width negative; E″ below zero (−1, a convention for "unknown" in some lists, fails); g′ not
 * positive, g″ (where given) not positive; E′ ≠ E″ + ν beyond {@link VerifyOptions#upperEnergyToleranceCm1()} where
 * E′ is given.
 */
final class SanityCheck implements LineCheck {
    private static final LineColumn[] FOREIGN_WIDTHS = foreignWidthColumns();

    private final double upperEnergyToleranceCm1;

    SanityCheck(VerifyOptions options) {
        this.upperEnergyToleranceCm1 = options.upperEnergyToleranceCm1();
    }

    @Override
    public void check(LineBatch b, int r, Findings f) {
        required(f, b, r, LineColumn.WAVENUMBER, b.wavenumberCm1[r]);
        required(f, b, r, LineColumn.INTENSITY, b.intensityCmPerMolecule[r]);
        notNegative(f, b, r, LineColumn.EINSTEIN_A, b.einsteinAS1[r]);
        notNegative(f, b, r, LineColumn.AIR_WIDTH, b.airWidthCm1PerAtm[r]);
        notNegative(f, b, r, LineColumn.SELF_WIDTH, b.selfWidthCm1PerAtm[r]);
        for (int k = 0; k < b.foreignWidthCm1PerAtm.length; k++) {
            notNegative(f, b, r, FOREIGN_WIDTHS[k], b.foreignWidthCm1PerAtm[k][r]);
        }
        double lowerEnergy = b.lowerEnergyCm1[r];
        if (Double.isNaN(lowerEnergy)) {
            f.add(Check.NAN_VALUE, Severity.ERROR, b, r, LineColumn.LOWER_ENERGY.columnName(), lowerEnergy, Double.NaN,
                    "lower_energy_cm1 is NaN (expected a number >= 0)");
        } else if (lowerEnergy < 0) {
            f.add(Check.LOWER_ENERGY, Severity.ERROR, b, r, LineColumn.LOWER_ENERGY.columnName(), lowerEnergy, 0.0,
                    fmt("lower_energy_cm1 = %s (expected >= 0)", lowerEnergy));
        }
        double gUpper = b.upperDegeneracy[r];
        if (!(gUpper > 0)) {
            f.add(Check.DEGENERACY, Severity.ERROR, b, r, LineColumn.UPPER_DEGENERACY.columnName(), gUpper, Double.NaN,
                    fmt("upper_degeneracy = %s (expected > 0)", gUpper));
        }
        double gLower = b.lowerDegeneracy[r];
        if (gLower <= 0) {
            f.add(Check.DEGENERACY, Severity.ERROR, b, r, LineColumn.LOWER_DEGENERACY.columnName(), gLower, Double.NaN,
                    fmt("lower_degeneracy = %s (expected > 0)", gLower));
        }
        double upperEnergy = b.upperEnergyCm1[r];
        if (!Double.isNaN(upperEnergy) && !Double.isNaN(lowerEnergy)) {
            double expected = lowerEnergy + b.wavenumberCm1[r];
            if (!(Math.abs(upperEnergy - expected) <= upperEnergyToleranceCm1)) {
                f.add(Check.UPPER_ENERGY, Severity.ERROR, b, r, LineColumn.UPPER_ENERGY.columnName(), upperEnergy,
                        expected, fmt("upper_energy_cm1 = %s but lower_energy_cm1 + wavenumber_cm1 = %s (tolerance %s cm-1)",
                                upperEnergy, expected, upperEnergyToleranceCm1));
            }
        }
    }

    private static void required(Findings f, LineBatch b, int r, LineColumn column, double v) {
        if (Double.isNaN(v)) {
            f.add(Check.NAN_VALUE, Severity.ERROR, b, r, column.columnName(), v, Double.NaN,
                    column.columnName() + " is NaN (expected a number > 0)");
        } else if (!(v > 0)) {
            f.add(Check.NEGATIVE_VALUE, Severity.ERROR, b, r, column.columnName(), v, Double.NaN,
                    fmt(column.columnName() + " = %s (expected > 0)", v));
        }
    }

    private static void notNegative(Findings f, LineBatch b, int r, LineColumn column, double v) {
        if (v < 0) {
            f.add(Check.NEGATIVE_VALUE, Severity.ERROR, b, r, column.columnName(), v, Double.NaN,
                    fmt(column.columnName() + " = %s (expected >= 0)", v));
        }
    }

    private static LineColumn[] foreignWidthColumns() {
        // indexed like LineBatch.foreignWidthCm1PerAtm (Broadener ordinal)
        LineColumn[] c = new LineColumn[Broadener.values().length];
        for (Broadener b : Broadener.values()) {
            c[b.ordinal()] = LineColumn.valueOf(b.name() + "_WIDTH");
        }
        return c;
    }

    private static String fmt(String format, Object... args) {
        return String.format(Locale.ROOT, format, args);
    }
}
