package org.linewright.ingest.line;

import java.util.function.Function;

/**
 * The columns of the canonical line model, declared once: their names in the line store and in CSV
 * output, their unit, their kind, and where a {@link LineBatch} holds them. The first twelve are the
 * fixed leading columns of {@code lines --format csv}.
 */
public enum LineColumn {
    MOLECULE("molecule", "", Kind.INT, b -> b.moleculeId),
    ISOTOPOLOGUE("isotopologue", "", Kind.INT, b -> b.isotopologue),
    WAVENUMBER("wavenumber_cm1", "cm-1", Kind.DOUBLE, b -> b.wavenumberCm1),
    INTENSITY("intensity_cm_per_molecule", "cm-1/(molecule cm-2) at 296 K", Kind.DOUBLE, b -> b.intensityCmPerMolecule),
    EINSTEIN_A("einstein_a_s1", "s-1", Kind.DOUBLE, b -> b.einsteinAS1),
    AIR_WIDTH("air_width_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.airWidthCm1PerAtm),
    SELF_WIDTH("self_width_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.selfWidthCm1PerAtm),
    AIR_WIDTH_EXPONENT("air_width_exponent", "1", Kind.DOUBLE, b -> b.airWidthExponent),
    AIR_SHIFT("air_shift_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.airShiftCm1PerAtm),
    LOWER_ENERGY("lower_energy_cm1", "cm-1", Kind.DOUBLE, b -> b.lowerEnergyCm1),
    UPPER_DEGENERACY("upper_degeneracy", "1", Kind.DOUBLE, b -> b.upperDegeneracy),
    LOWER_DEGENERACY("lower_degeneracy", "1", Kind.DOUBLE, b -> b.lowerDegeneracy),
    H2_WIDTH("h2_width_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignWidthCm1PerAtm[Broadener.H2.ordinal()]),
    H2_WIDTH_EXPONENT("h2_width_exponent", "1", Kind.DOUBLE, b -> b.foreignWidthExponent[Broadener.H2.ordinal()]),
    H2_SHIFT("h2_shift_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignShiftCm1PerAtm[Broadener.H2.ordinal()]),
    HE_WIDTH("he_width_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignWidthCm1PerAtm[Broadener.HE.ordinal()]),
    HE_WIDTH_EXPONENT("he_width_exponent", "1", Kind.DOUBLE, b -> b.foreignWidthExponent[Broadener.HE.ordinal()]),
    HE_SHIFT("he_shift_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignShiftCm1PerAtm[Broadener.HE.ordinal()]),
    CO2_WIDTH("co2_width_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignWidthCm1PerAtm[Broadener.CO2.ordinal()]),
    CO2_WIDTH_EXPONENT("co2_width_exponent", "1", Kind.DOUBLE, b -> b.foreignWidthExponent[Broadener.CO2.ordinal()]),
    CO2_SHIFT("co2_shift_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignShiftCm1PerAtm[Broadener.CO2.ordinal()]),
    H2O_WIDTH("h2o_width_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignWidthCm1PerAtm[Broadener.H2O.ordinal()]),
    H2O_WIDTH_EXPONENT("h2o_width_exponent", "1", Kind.DOUBLE, b -> b.foreignWidthExponent[Broadener.H2O.ordinal()]),
    H2O_SHIFT("h2o_shift_cm1_per_atm", "cm-1/atm at 296 K", Kind.DOUBLE, b -> b.foreignShiftCm1PerAtm[Broadener.H2O.ordinal()]),
    UPPER_ENERGY("upper_energy_cm1", "cm-1", Kind.DOUBLE, b -> b.upperEnergyCm1),
    WAVENUMBER_UNCERTAINTY("wavenumber_uncertainty_cm1", "cm-1", Kind.DOUBLE, b -> b.wavenumberUncertaintyCm1),
    UPPER_J("upper_j", "1", Kind.DOUBLE, b -> b.upperJ),
    LOWER_J("lower_j", "1", Kind.DOUBLE, b -> b.lowerJ),
    UPPER_K("upper_k", "1", Kind.DOUBLE, b -> b.upperK),
    UPPER_GLOBAL_QUANTA("upper_global_quanta", "", Kind.TEXT, b -> b.upperGlobalQuanta),
    LOWER_GLOBAL_QUANTA("lower_global_quanta", "", Kind.TEXT, b -> b.lowerGlobalQuanta),
    UPPER_LOCAL_QUANTA("upper_local_quanta", "", Kind.TEXT, b -> b.upperLocalQuanta),
    LOWER_LOCAL_QUANTA("lower_local_quanta", "", Kind.TEXT, b -> b.lowerLocalQuanta),
    UNCERTAINTY_CODES("uncertainty_codes", "", Kind.TEXT, b -> b.uncertaintyCodes),
    REFERENCE_CODES("reference_codes", "", Kind.TEXT, b -> b.referenceCodes),
    LINE_MIXING_FLAG("line_mixing_flag", "", Kind.TEXT, b -> b.lineMixingFlag),
    SOURCE_LINE("source_line", "", Kind.LONG, b -> b.sourceLine);

    /** Storage kind of a column. */
    public enum Kind { INT, LONG, DOUBLE, TEXT }

    private final String columnName;
    private final String unit;
    private final Kind kind;
    private final Function<LineBatch, Object> array;

    LineColumn(String columnName, String unit, Kind kind, Function<LineBatch, Object> array) {
        this.columnName = columnName;
        this.unit = unit;
        this.kind = kind;
        this.array = array;
    }

    /** Name in the line store and in CSV headers. */
    public String columnName() {
        return columnName;
    }

    /** Unit, empty for labels and counts, "1" for dimensionless numbers. */
    public String unit() {
        return unit;
    }

    public Kind kind() {
        return kind;
    }

    public int[] ints(LineBatch batch) {
        return (int[]) array.apply(batch);
    }

    public long[] longs(LineBatch batch) {
        return (long[]) array.apply(batch);
    }

    public double[] doubles(LineBatch batch) {
        return (double[]) array.apply(batch);
    }

    public TextColumn text(LineBatch batch) {
        return (TextColumn) array.apply(batch);
    }

    /** The columns of a foreign broadener: width, width exponent, shift (in that order). */
    public static LineColumn[] foreignColumns(Broadener broadener) {
        return switch (broadener) {
            case H2 -> new LineColumn[] {H2_WIDTH, H2_WIDTH_EXPONENT, H2_SHIFT};
            case HE -> new LineColumn[] {HE_WIDTH, HE_WIDTH_EXPONENT, HE_SHIFT};
            case CO2 -> new LineColumn[] {CO2_WIDTH, CO2_WIDTH_EXPONENT, CO2_SHIFT};
            case H2O -> new LineColumn[] {H2O_WIDTH, H2O_WIDTH_EXPONENT, H2O_SHIFT};
        };
    }

    /** The column with this store/CSV name, or null. */
    public static LineColumn byName(String columnName) {
        for (LineColumn c : values()) {
            if (c.columnName.equals(columnName)) {
                return c;
            }
        }
        return null;
    }
}
