package org.linewright.broadening.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.rules.BroadeningRule.Quantity;
import org.linewright.ingest.source.LineFormatException;

/**
 * Spot checks of the built-in rules on single records of {@code reference-data/hitran2020-samples/*_out.par}
 * (HITRAN2020 records, Gordon et al. 2022, JQSRT 277, 107949; broadening values of Tan et al. 2022, ApJS 262,
 * 40, rounded there to 4 decimals). J'', J', K'a were read by eye from the records' local quanta, quoted in
 * each comment. The full comparison over every record is {@code SampleBroadeningRulesTest}.
 */
class RuleSetTest {
    private static final double ROUNDING = 0.5e-4 + 1e-9;
    private final RuleSet rules = RuleSet.builtIn();

    private void check(int mol, BackgroundGas gas, double lowerJ, double upperJ, double upperK,
                       double expectedWidth, double expectedExponent) {
        BroadeningRule w = rules.rule(mol, gas, Quantity.WIDTH);
        BroadeningRule n = rules.rule(mol, gas, Quantity.EXPONENT);
        assertEquals(expectedWidth, w.evaluate(lowerJ, upperJ, upperK), ROUNDING, "width " + w);
        assertEquals(expectedExponent, n.evaluate(lowerJ, upperJ, upperK), ROUNDING, "exponent " + n);
    }

    @Test
    void coRulesMatchSampleRecords() {
        // CO 3.545069 cm-1, "R  0": He 0.0489/0.5143, H2 0.0755/0.6634, CO2 0.1076/0.6983
        check(5, BackgroundGas.HE, 0, 1, Double.NaN, 0.0489, 0.5143);
        check(5, BackgroundGas.H2, 0, 1, Double.NaN, 0.0755, 0.6634);
        check(5, BackgroundGas.CO2, 0, 1, Double.NaN, 0.1076, 0.6983);
        // CO 225.441118 cm-1, "R 59": He 0.0449/0.5189, H2 0.0648/0.4124, CO2 0.0374/0.5488
        check(5, BackgroundGas.HE, 59, 60, Double.NaN, 0.0449, 0.5189);
        check(5, BackgroundGas.H2, 59, 60, Double.NaN, 0.0648, 0.4124);
        check(5, BackgroundGas.CO2, 59, 60, Double.NaN, 0.0374, 0.5488);
        // CO 3965.587350 cm-1, "P 13": He 0.0472/0.5778, H2 0.0695/0.6675, CO2 0.0653/0.7015
        check(5, BackgroundGas.HE, 13, 12, Double.NaN, 0.0472, 0.5778);
        check(5, BackgroundGas.H2, 13, 12, Double.NaN, 0.0695, 0.6675);
        check(5, BackgroundGas.CO2, 13, 12, Double.NaN, 0.0653, 0.7015);
    }

    @Test
    void co2RulesMatchSampleRecords() {
        // CO2 310.248338 cm-1, "P 27e": He 0.0562, H2 0.1103/0.5800, CO2 0.0910/0.6529
        assertEquals(0.0562, rules.rule(2, BackgroundGas.HE, Quantity.WIDTH).evaluate(27, 26, Double.NaN), ROUNDING);
        check(2, BackgroundGas.H2, 27, 26, Double.NaN, 0.1103, 0.5800);
        check(2, BackgroundGas.CO2, 27, 26, Double.NaN, 0.0910, 0.6529);
        // CO2 456.132213 cm-1, "Q  5e": He 0.0632, H2 0.1336, CO2 0.1157/0.7198
        assertEquals(0.0632, rules.rule(2, BackgroundGas.HE, Quantity.WIDTH).evaluate(5, 5, Double.NaN), ROUNDING);
        check(2, BackgroundGas.CO2, 5, 5, Double.NaN, 0.1157, 0.7198);
        // CO2-He exponent: the published linear rule (broadening-rules.md), evaluated by hand:
        // |m| = 2: 0.7207695 − 0.0068858·2 = 0.7069979; |m| = 20: 0.5830535; |m| = 21: 0.58
        BroadeningRule nHe = rules.rule(2, BackgroundGas.HE, Quantity.EXPONENT);
        assertEquals(0.7069979, nHe.evaluate(1, 2, Double.NaN), 1e-12);
        assertEquals(0.5830535, nHe.evaluate(20, 20, Double.NaN), 1e-12);
        assertEquals(0.58, nHe.evaluate(20, 21, Double.NaN), 0.0);
    }

    @Test
    void n2oRuleIsCappedAtM40() {
        // N2O 517.125914 cm-1, "P 34e": He 0.0549/0.30; 562.534689 cm-1, "R 22e": 0.0557
        check(4, BackgroundGas.HE, 34, 33, Double.NaN, 0.0549, 0.30);
        check(4, BackgroundGas.HE, 22, 23, Double.NaN, 0.0557, 0.30);
        BroadeningRule w = rules.rule(4, BackgroundGas.HE, Quantity.WIDTH);
        // cap (broadening-rules.md: |m| capped at 40): every |m| > 40 gives the |m| = 40 value
        assertEquals(w.evaluate(40, 39, Double.NaN), w.evaluate(75, 74, Double.NaN), 0.0);
    }

    @Test
    void ph3RulesMatchSampleRecords() {
        // PH3 0.000057843 cm-1, upper "5  3 0A-", lower "5  3 0A+": He 0.0539/0.3030, H2 0.1025/0.6732
        check(28, BackgroundGas.HE, 5, 5, 3, 0.0539, 0.3030);
        check(28, BackgroundGas.H2, 5, 5, 3, 0.1025, 0.6732);
        // PH3 197.703942 cm-1, upper "22  1 0E", lower "21  4 0E" (R): He 0.0446, H2 0.0827/0.6114
        check(28, BackgroundGas.HE, 21, 22, 1, 0.0446, 0.3030);
        check(28, BackgroundGas.H2, 21, 22, 1, 0.0827, 0.6114);
        // PH3 869.570314 cm-1, upper "9  0 1E", lower "10  2 1E" (P): He 0.0488, H2 0.0965/0.6217
        check(28, BackgroundGas.HE, 10, 9, 0, 0.0488, 0.3030);
        check(28, BackgroundGas.H2, 10, 9, 0, 0.0965, 0.6217);
        // the polynomial needs K'a
        assertTrue(Double.isNaN(rules.rule(28, BackgroundGas.H2, Quantity.WIDTH).evaluate(10, 9, Double.NaN)));
    }

    @Test
    void runningIndexFollowsBranch() {
        // |m| = J''+1 for R, J'' for P and Q (common practice; Tan et al. 2022)
        assertEquals(1.0, RunningIndex.absoluteM(0, 1));
        assertEquals(13.0, RunningIndex.absoluteM(13, 12));
        assertEquals(5.0, RunningIndex.absoluteM(5, 5));
        assertTrue(Double.isNaN(RunningIndex.absoluteM(5, Double.NaN)));
    }

    @Test
    void builtInRulesNameTheirSource() {
        assertEquals(18, rules.size());
        assertTrue(rules.sources().get(0).contains("ApJS 262 (2022) 40"));
        assertNull(rules.rule(1, BackgroundGas.H2, Quantity.WIDTH));
    }

    private static RuleSet parse(String text) throws Exception {
        return RuleSet.parse(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), "my.rules");
    }

    @Test
    void userFileOverridesBuiltIn() throws Exception {
        RuleSet user = parse("source my own fit (synthetic)\n"
                + "molecule=5 gas=H2 quantity=width form=constant coefficients=0.05\n");
        RuleSet merged = rules.overriddenBy(user);
        assertEquals(0.05, merged.rule(5, BackgroundGas.H2, Quantity.WIDTH).evaluate(3, 4, 0), 0.0);
        assertEquals(18, merged.size());
    }

    @Test
    void malformedRuleFilesGiveLocatedErrors() {
        LineFormatException e = assertThrows(LineFormatException.class, () -> parse(
                "source synthetic\nmolecule=5 gas=Xe quantity=width form=constant coefficients=0.05\n"));
        assertEquals("my.rules:2:cols 12-17: field gas: \"Xe\" (expected a background gas: air, h2, he, co2, n2, "
                + "o2, h2o, self)", e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse(
                "source synthetic\nmolecule=5 gas=he quantity=width form=pade coefficients=1,2,3\n"));
        assertTrue(e.getMessage().contains("8 coefficients for form pade"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse(
                "molecule=5 gas=he quantity=width form=constant coefficients=1\n"));
        assertTrue(e.getMessage().startsWith("my.rules:1:"), e.getMessage());
        assertTrue(e.getMessage().contains("'source' line"), e.getMessage());
        e = assertThrows(LineFormatException.class, () -> parse(
                "source s\nmolecule=5 gas=he quantity=width form=linear coefficients=1,x\n"));
        assertTrue(e.getMessage().contains("\"x\""), e.getMessage());
    }
}
