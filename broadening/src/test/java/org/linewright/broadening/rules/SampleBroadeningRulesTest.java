package org.linewright.broadening.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.broadening.sources.WidthSource;
import org.linewright.broadening.testsupport.HitranSamples;
import org.linewright.ingest.line.LineBatch;

/**
 * The built-in rules against every record of the HITRAN2020 samples
 * ({@code reference-data/hitran2020-samples}; records: Gordon et al. 2022, JQSRT 277, 107949; appended H2, He and
 * CO2 parameters: Tan et al. 2022, ApJS 262, 40, rounded to 4 decimals, layout in the folder's README).
 * The records are read with the project's 160-character reader (J'', J', K' from the local quanta); the
 * widths go through the full source chain ({@link WidthResolver}, defaults forbidden): the records carry no
 * foreign-broadener columns, so every line must be served by a rule.
 */
class SampleBroadeningRulesTest {
    /** Half a unit of the 4th decimal, plus a margin for the binary representation of the printed values. */
    private static final double ROUNDING = 0.5e-4 + 1e-9;

    private static LineBatch checkedRecords(String name, int expectedCount) throws IOException {
        LineBatch b = HitranSamples.records(name);
        // record counts: the samples' README table
        assertEquals(expectedCount, b.size, "records in sample_" + name + ".par");
        List<String> raw = Files.readAllLines(HitranSamples.folder().resolve("sample_" + name + ".par"),
                StandardCharsets.US_ASCII);
        assertEquals(raw, HitranSamples.outRecords(name), "the _out file holds the same records in the same order");
        return b;
    }

    /** Resolves the batch for the gases with defaults forbidden and checks that rules served every line. */
    private static ResolvedWidths resolveByRules(LineBatch b, String composition, BackgroundGas... gases) {
        WidthResolver r = WidthResolver.builder(Composition.parse(composition)).forbidDefaults().build();
        ResolvedWidths w = r.newResult(b.size);
        r.resolve(b, w);
        for (BackgroundGas g : gases) {
            assertEquals(b.size, r.tally().widths(g, WidthSource.RULE), g + " widths served by rules");
            assertEquals(b.size, r.tally().exponents(g, WidthSource.RULE), g + " exponents served by rules");
        }
        return w;
    }

    private static void assertColumn(String what, double[][] expected, int column, double[] actual, LineBatch b) {
        for (int i = 0; i < b.size; i++) {
            int row = i;
            double e = expected[i][column];
            assertTrue(Math.abs(e - actual[i]) <= ROUNDING, () -> what + " of line " + b.sourceLine[row]
                    + ": expected " + e + " (file), got " + actual[row]);
        }
    }

    @Test
    void coEveryRecord() throws IOException {
        LineBatch b = checkedRecords("CO", 5381);
        double[][] v = HitranSamples.appendedValues("CO"); // γHe, nHe, γH2, nH2, γCO2, nCO2
        ResolvedWidths w = resolveByRules(b, "He=0.2,H2=0.5,CO2=0.3", BackgroundGas.HE, BackgroundGas.H2,
                BackgroundGas.CO2);
        assertColumn("CO γ_He", v, 0, w.widthCm1PerAtm[BackgroundGas.HE.ordinal()], b);
        assertColumn("CO n_He", v, 1, w.exponent[BackgroundGas.HE.ordinal()], b);
        assertColumn("CO γ_H2", v, 2, w.widthCm1PerAtm[BackgroundGas.H2.ordinal()], b);
        assertColumn("CO n_H2", v, 3, w.exponent[BackgroundGas.H2.ordinal()], b);
        assertColumn("CO γ_CO2", v, 4, w.widthCm1PerAtm[BackgroundGas.CO2.ordinal()], b);
        assertColumn("CO n_CO2", v, 5, w.exponent[BackgroundGas.CO2.ordinal()], b);
        // the mixture width: Σxγ of the file's values, within Σx·(rounding) = 0.5e-4
        for (int i = 0; i < b.size; i++) {
            double mix = 0.2 * v[i][0] + 0.5 * v[i][2] + 0.3 * v[i][4];
            assertEquals(mix, w.backgroundWidthCm1PerAtm[i], ROUNDING);
        }
    }

    @Test
    void co2EveryRecord() throws IOException {
        LineBatch b = checkedRecords("CO2", 5492);
        double[][] v = HitranSamples.appendedValues("CO2"); // γHe, nHe, γH2, nH2, γCO2, nCO2
        ResolvedWidths w = resolveByRules(b, "He=0.2,H2=0.5,CO2=0.3", BackgroundGas.HE, BackgroundGas.H2,
                BackgroundGas.CO2);
        assertColumn("CO2 γ_He", v, 0, w.widthCm1PerAtm[BackgroundGas.HE.ordinal()], b);
        assertColumn("CO2 γ_H2", v, 2, w.widthCm1PerAtm[BackgroundGas.H2.ordinal()], b);
        assertColumn("CO2 n_H2", v, 3, w.exponent[BackgroundGas.H2.ordinal()], b);
        assertColumn("CO2 γ_CO2", v, 4, w.widthCm1PerAtm[BackgroundGas.CO2.ordinal()], b);
        assertColumn("CO2 n_CO2", v, 5, w.exponent[BackgroundGas.CO2.ordinal()], b);
        // n_He: the file carries an earlier constant 0.3000 (samples' README, "known exception") ...
        double[] nHe = w.exponent[BackgroundGas.HE.ordinal()];
        for (int i = 0; i < b.size; i++) {
            assertEquals(0.3, v[i][1], 0.0, "sample_CO2_out.par n_He is the earlier constant");
            // ... so compare with the published linear rule (broadening-rules.md), evaluated here with |m|
            // taken independently from the record text: branch letter and J'' of the lower local quanta
            String lowerLocal = b.lowerLocalQuanta.get(i);
            char branch = lowerLocal.charAt(5);
            int jLower = Integer.parseInt(lowerLocal.substring(6, 9).trim());
            int m = branch == 'R' ? jLower + 1 : jLower;
            double expected = m <= 20 ? 0.7207695 - 0.0068858 * m : 0.58;
            assertEquals(expected, nHe[i], 1e-12, "CO2 n_He, line " + b.sourceLine[i]);
        }
    }

    @Test
    void n2oEveryRecord() throws IOException {
        LineBatch b = checkedRecords("N2O", 5446);
        double[][] v = HitranSamples.appendedValues("N2O"); // γHe, nHe
        ResolvedWidths w = resolveByRules(b, "He=1", BackgroundGas.HE);
        assertColumn("N2O γ_He", v, 0, w.widthCm1PerAtm[BackgroundGas.HE.ordinal()], b);
        assertColumn("N2O n_He", v, 1, w.exponent[BackgroundGas.HE.ordinal()], b);
    }

    @Test
    void ph3EveryRecord() throws IOException {
        LineBatch b = checkedRecords("PH3", 4424);
        double[][] v = HitranSamples.appendedValues("PH3"); // γHe, nHe, γH2, nH2
        ResolvedWidths w = resolveByRules(b, "H2=0.85,He=0.15", BackgroundGas.HE, BackgroundGas.H2);
        assertColumn("PH3 γ_He", v, 0, w.widthCm1PerAtm[BackgroundGas.HE.ordinal()], b);
        assertColumn("PH3 n_He", v, 1, w.exponent[BackgroundGas.HE.ordinal()], b);
        assertColumn("PH3 γ_H2", v, 2, w.widthCm1PerAtm[BackgroundGas.H2.ordinal()], b);
        assertColumn("PH3 n_H2", v, 3, w.exponent[BackgroundGas.H2.ordinal()], b);
    }
}
