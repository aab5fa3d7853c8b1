package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.ingest.InputException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** The wing options map to the documented cutoff rules (docs/physics.md; the rules are our own choices). */
class WingOptionsTest {
    @Command(name = "probe")
    static final class Probe implements Runnable {
        @Mixin
        WingOptions wings;

        @Override
        public void run() {
        }
    }

    private static WingTreatment parse(String... args) {
        Probe p = new Probe();
        new CommandLine(p).parseArgs(args);
        return p.wings.treatment();
    }

    @Test
    void rulesAndTheirDistances() {
        // Default: fixed 25 cm-1 (common practice), pedestal kept, no chi factor.
        WingTreatment d = parse();
        assertEquals(25.0, d.cutoff().distanceCm1(0.003, 0.07, 1.0));
        assertEquals(ChiFactorKind.NONE, d.chiFactor());
        // 100 half widths of a Lorentzian line (alpha_D -> 0: Voigt HWHM = gamma_L; the Olivero-Longbothum 1977
        // fit gives (0.5346 + sqrt(0.2166)) = 1.000003 gamma_L there), capped at --cutoff.
        WingTreatment h = parse("--cutoff-hwhm-multiple", "100", "--cutoff", "50");
        assertEquals(100 * 0.07, h.cutoff().distanceCm1(0.0, 0.07, 1.0), 100 * 0.07 * 4e-6);
        assertEquals(50.0, h.cutoff().distanceCm1(0.0, 0.7, 10.0), 1e-12);
        // 5 cm-1/atm between 1 cm-1 and the cap.
        WingTreatment p = parse("--cutoff-per-atm", "5", "--remove-pedestal", "--chi-factor");
        assertEquals(10.0, p.cutoff().distanceCm1(0.003, 0.14, 2.0), 1e-12);
        assertEquals(1.0, p.cutoff().distanceCm1(0.003, 0.0007, 0.01), 1e-12);
        assertEquals(25.0, p.cutoff().distanceCm1(0.003, 7.0, 100.0), 1e-12);
        assertEquals(true, p.removePedestal());
        assertEquals(ChiFactorKind.PERRIN_HARTMANN_CO2, p.chiFactor());
    }

    @Test
    void contradictoryOrNonPositiveValuesAreInputErrors() {
        assertThrows(InputException.class, () -> parse("--cutoff-hwhm-multiple", "10", "--cutoff-per-atm", "2"));
        assertThrows(InputException.class, () -> parse("--cutoff", "0"));
        assertThrows(InputException.class, () -> parse("--cutoff-hwhm-multiple", "-1"));
    }

    /** The deprecated spelling (DEVELOPERS.md, "Naming") still works for one version and gives the same treatment. */
    @Test
    void deprecatedCutoffHwhmSpellingGivesTheSameTreatment() {
        assertEquals(parse("--cutoff-hwhm-multiple", "100", "--cutoff", "50").describe(),
                parse("--cutoff-hwhm", "100", "--cutoff", "50").describe());
    }
}
