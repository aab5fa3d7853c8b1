package org.linewright.broadening.sources;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.ingest.InputException;
import org.linewright.ingest.exomol.BroadeningTable;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;

/**
 * The source chain on invented (synthetic) lines. Expected rule values come from records of
 * {@code reference-data/hitran2020-samples/sample_CO_out.par} (Tan et al. 2022, ApJS 262, 40, 4 decimals):
 * CO "R 0" line: γ_H2 0.0755, n_H2 0.6634, γ_He 0.0489, n_He 0.5143.
 */
class WidthResolverTest {
    private static final double ROUNDING = 0.5e-4 + 1e-9;

    /** Three synthetic CO lines: J'' 0 → 1 (R 0), J'' 3 → 2, unknown J. */
    private static LineBatch coLines() {
        LineBatch b = new LineBatch(4);
        b.size = 3;
        for (int i = 0; i < 3; i++) {
            b.clearOptional(i);
            b.moleculeId[i] = 5;
            b.isotopologue[i] = 1;
            b.wavenumberCm1[i] = 2000 + i;
            b.airWidthCm1PerAtm[i] = 0.06;
            b.airWidthExponent[i] = 0.7;
            b.airShiftCm1PerAtm[i] = -0.003;
            b.selfWidthCm1PerAtm[i] = 0.07;
            b.sourceLine[i] = 10 + i;
        }
        b.lowerJ[0] = 0;
        b.upperJ[0] = 1;
        b.lowerJ[1] = 3;
        b.upperJ[1] = 2;
        return b;
    }

    @Test
    void chainServesEachLineFromTheFirstSourceThatHasAWidth() {
        LineBatch b = coLines();
        int h2 = Broadener.H2.ordinal();
        b.foreignWidthCm1PerAtm[h2][1] = 0.081; // line 1 carries its own H2 values
        b.foreignWidthExponent[h2][1] = 0.55;
        b.foreignShiftCm1PerAtm[h2][1] = -0.001;
        WidthResolver r = WidthResolver.builder(Composition.parse("H2=0.85,He=0.15"))
                .table(5, 0, BackgroundGas.HE, new BroadeningTable("He", Double.NaN, Double.NaN,
                        new double[] {0, 1, 2}, new double[] {0.05, 0.045, 0.04}, new double[] {0.5, 0.45, 0.4}))
                .userConstant(BackgroundGas.H2, new GasParameters(0.066, 0.6, 0.0))
                .build();
        ResolvedWidths w = r.newResult(4);
        r.resolve(b, w);
        int g = BackgroundGas.H2.ordinal();
        // line 0: rule (Tan et al. R 0 value); line 1: line list; line 2 (no J): user constants
        assertEquals(0.0755, w.widthCm1PerAtm[g][0], ROUNDING);
        assertEquals(0.6634, w.exponent[g][0], ROUNDING);
        assertEquals(0.081, w.widthCm1PerAtm[g][1]);
        assertEquals(-0.001, w.shiftCm1PerAtm[g][1]);
        assertEquals(0.066, w.widthCm1PerAtm[g][2]);
        assertEquals(WidthSource.RULE, w.source(BackgroundGas.H2, 0));
        assertEquals(WidthSource.LINE_LIST, w.source(BackgroundGas.H2, 1));
        assertEquals(WidthSource.USER_CONSTANT, w.source(BackgroundGas.H2, 2));
        // He: rule for lines 0 and 1; line 2 has no J: the table needs J too, so the default serves it
        assertEquals(WidthSource.DEFAULT, w.source(BackgroundGas.HE, 2));
        assertEquals(0.07, w.widthCm1PerAtm[BackgroundGas.HE.ordinal()][2]);
        assertNull(w.source(BackgroundGas.CO2, 0));
        WidthSourceTally t = r.tally();
        assertEquals(1, t.widths(BackgroundGas.H2, WidthSource.RULE));
        assertEquals(1, t.widths(BackgroundGas.H2, WidthSource.LINE_LIST));
        assertEquals(1, t.widths(BackgroundGas.H2, WidthSource.USER_CONSTANT));
        assertEquals(2, t.widths(BackgroundGas.HE, WidthSource.RULE));
        assertEquals(1, t.widths(BackgroundGas.HE, WidthSource.DEFAULT));
        assertEquals(1, t.warnings().size(), t.warnings().toString());
        assertTrue(t.warnings().get(0).contains("he: 1 widths"), t.warnings().toString());
        assertTrue(t.report().get(0).startsWith("h2 widths: line 1, rule 1, user 1"), t.report().toString());
    }

    @Test
    void tableServesWhenOrderedBeforeRules() {
        LineBatch b = coLines();
        WidthResolver r = WidthResolver.builder(Composition.parse("He=1"))
                .order("table,rule,default")
                .table(5, 0, BackgroundGas.HE, new BroadeningTable("He", Double.NaN, Double.NaN,
                        new double[] {0, 1, 2}, new double[] {0.05, 0.045, 0.04}, new double[] {0.5, 0.45, Double.NaN}))
                .build();
        ResolvedWidths w = r.newResult(3);
        r.resolve(b, w);
        int he = BackgroundGas.HE.ordinal();
        assertEquals(0.05, w.widthCm1PerAtm[he][0]);
        // J'' = 3 beyond the table: last row; its exponent is missing, so the rule's exponent is used
        assertEquals(0.04, w.widthCm1PerAtm[he][1]);
        assertEquals(WidthSource.J_TABLE, w.source(BackgroundGas.HE, 1));
        assertEquals(1, r.tally().exponents(BackgroundGas.HE, WidthSource.RULE));
        assertEquals(1, r.tally().exponents(BackgroundGas.HE, WidthSource.J_TABLE));
    }

    @Test
    void n2AndO2UseAirValuesWithWarning() {
        LineBatch b = coLines();
        WidthResolver r = WidthResolver.builder(Composition.parse("N2=0.79,O2=0.21")).forbidDefaults().build();
        ResolvedWidths w = r.newResult(3);
        r.resolve(b, w);
        for (int i = 0; i < 3; i++) {
            assertEquals(WidthSource.AIR_PROXY, w.source(BackgroundGas.N2, i));
            // Σxγ = (0.79 + 0.21)·0.06; exponent 0.7; shift −0.003 (by hand)
            assertEquals(0.06, w.backgroundWidthCm1PerAtm[i], 1e-15);
            assertEquals(0.7, w.backgroundWidthExponent[i], 1e-15);
            assertEquals(-0.003, w.backgroundShiftCm1PerAtm[i], 1e-15);
        }
        assertEquals(2, r.tally().warnings().size());
    }

    @Test
    void selfUsesSelfWidthAndAirExponent() {
        LineBatch b = coLines();
        WidthResolver r = WidthResolver.builder(Composition.parse("air=0.9,self=0.1")).forbidDefaults().build();
        ResolvedWidths w = r.newResult(3);
        r.resolve(b, w);
        // by hand: 0.9·0.06 + 0.1·0.07 = 0.061; both exponents 0.7; shift 0.9·(−0.003) = −0.0027
        assertEquals(0.061, w.backgroundWidthCm1PerAtm[0], 1e-15);
        assertEquals(0.7, w.backgroundWidthExponent[0], 1e-15);
        assertEquals(-0.0027, w.backgroundShiftCm1PerAtm[0], 1e-15);
        assertEquals(0.0, w.shiftCm1PerAtm[BackgroundGas.SELF.ordinal()][0]);
    }

    @Test
    void co2SelfWithoutSelfWidthUsesCo2Rules() {
        // a CO2 line "P 27" without a self width: the CO2-CO2 rule serves; sample_CO2_out.par, record at
        // 310.248338 cm-1 (Tan et al. 2022): γ_CO2 0.0910, n_CO2 0.6529
        LineBatch b = coLines();
        b.size = 1;
        b.moleculeId[0] = 2;
        b.lowerJ[0] = 27;
        b.upperJ[0] = 26;
        b.selfWidthCm1PerAtm[0] = Double.NaN;
        WidthResolver r = WidthResolver.builder(Composition.parse("self=1")).forbidDefaults().build();
        ResolvedWidths w = r.newResult(1);
        r.resolve(b, w);
        assertEquals(WidthSource.RULE, w.source(BackgroundGas.SELF, 0));
        assertEquals(0.0910, w.backgroundWidthCm1PerAtm[0], ROUNDING);
        assertEquals(0.6529, w.backgroundWidthExponent[0], ROUNDING);
    }

    @Test
    void compositeExponentIsWidthWeightedMean() {
        LineBatch b = coLines();
        WidthResolver r = WidthResolver.builder(Composition.parse("H2=0.85,He=0.15")).order("user")
                .userConstant(BackgroundGas.H2, new GasParameters(0.06, 0.6, 0))
                .userConstant(BackgroundGas.HE, new GasParameters(0.05, 0.3, 0)).build();
        ResolvedWidths w = r.newResult(3);
        r.resolve(b, w);
        // by hand: Σxγ = 0.85·0.06 + 0.15·0.05 = 0.0585; Σxγn/Σxγ = (0.0306 + 0.00225)/0.0585 = 0.56153846...
        assertEquals(0.0585, w.backgroundWidthCm1PerAtm[0], 1e-16);
        assertEquals(0.5615384615384615, w.backgroundWidthExponent[0], 1e-15);
        // first-order match in ln T at 296 K: d/dlnT of Σxγ(296/T)^n equals −Σxγn (by definition)
        assertEquals(0.85 * 0.06 * 0.6 + 0.15 * 0.05 * 0.3,
                w.backgroundWidthCm1PerAtm[0] * w.backgroundWidthExponent[0], 1e-16);
    }

    @Test
    void forbiddenDefaultsMakeMissingWidthAnError() {
        LineBatch b = coLines();
        WidthResolver r = WidthResolver.builder(Composition.parse("H2O=1")).forbidDefaults().build();
        InputException e = assertThrows(InputException.class, () -> r.resolve(b, r.newResult(3)));
        assertEquals("molecule 5 isotopologue 1, line 10 at 2000.0 cm-1: no h2o width from any source (tried line, "
                + "rule, table, user, air-proxy; defaults forbidden; expected per-line values, a rule, a table or "
                + "user constants for h2o)", e.getMessage());
    }

    @Test
    void userConstantsParse() {
        var m = UserConstants.parse("h2=0.06:0.6, He=0.05, co2=0.1:0.7:-0.002");
        assertEquals(new GasParameters(0.06, 0.6, 0.0), m.get(BackgroundGas.H2));
        assertEquals(new GasParameters(0.05, 0.5, 0.0), m.get(BackgroundGas.HE));
        assertEquals(new GasParameters(0.1, 0.7, -0.002), m.get(BackgroundGas.CO2));
        assertThrows(InputException.class, () -> UserConstants.parse("ar=0.05"));
        assertThrows(InputException.class, () -> UserConstants.parse("h2=0"));
        assertThrows(InputException.class, () -> UserConstants.parse("h2=0.05:x"));
        assertThrows(InputException.class, () -> UserConstants.parse("h2=0.05:1:2:3"));
        assertThrows(InputException.class, () -> UserConstants.parse("h2=0.05,h2=0.06"));
    }

    @Test
    void badOrdersAndTablesAreRejected() {
        Composition c = Composition.air();
        assertThrows(InputException.class, () -> WidthResolver.builder(c).order("line,guess"));
        assertThrows(InputException.class, () -> WidthResolver.builder(c).order("line,line"));
    }
}
