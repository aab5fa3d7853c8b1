package org.linewright.broadening.background;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.InputException;

class CompositionTest {

    @Test
    void parsesCaseInsensitiveNamesAndFractions() {
        // a solar-like H2/He mixture (mole fractions by hand)
        Composition c = Composition.parse("H2=0.85, he=0.15");
        assertEquals(0.85, c.fraction(BackgroundGas.H2));
        assertEquals(0.15, c.fraction(BackgroundGas.HE));
        assertEquals(0.0, c.fraction(BackgroundGas.SELF), "self defaults to 0: a trace absorber");
        assertArrayEquals(new BackgroundGas[] {BackgroundGas.H2, BackgroundGas.HE}, c.presentGases());
        assertEquals(c, Composition.of(Map.of(BackgroundGas.H2, 0.85, BackgroundGas.HE, 0.15)));
    }

    @Test
    void acceptsSelfAndSumWithinTolerance() {
        Composition c = Composition.parse("N2=0.7808,O2=0.2095,self=0.0097000004");
        assertEquals(0.0097000004, c.fraction(BackgroundGas.SELF));
        assertTrue(Composition.air().fraction(BackgroundGas.AIR) == 1.0);
    }

    @Test
    void unknownGasIsOneLineError() {
        InputException e = assertThrows(InputException.class, () -> Composition.parse("H2=0.9,Ar=0.1"));
        assertTrue(e.getMessage().contains("unknown gas \"Ar\""), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
    }

    @Test
    void negativeFractionIsRejected() {
        InputException e = assertThrows(InputException.class, () -> Composition.parse("H2=1.1,He=-0.1"));
        assertTrue(e.getMessage().contains("fraction of h2 is 1.1") || e.getMessage().contains("he is -0.1"),
                e.getMessage());
    }

    @Test
    void sumNotOneIsRejectedNotRenormalised() {
        InputException e = assertThrows(InputException.class, () -> Composition.parse("H2=0.8,He=0.1"));
        assertTrue(e.getMessage().contains("sum to 0.9"), e.getMessage());
        // 1e-6 tolerance: 1 + 2e-6 is outside
        assertThrows(InputException.class, () -> Composition.parse("air=1.000002"));
    }

    @Test
    void malformedItemsAreRejected() {
        assertThrows(InputException.class, () -> Composition.parse(""));
        assertThrows(InputException.class, () -> Composition.parse("H2"));
        assertThrows(InputException.class, () -> Composition.parse("H2=abc"));
        assertThrows(InputException.class, () -> Composition.parse("H2=0.5,h2=0.5"));
        assertThrows(InputException.class, () -> Composition.parse("H2=NaN"));
    }
}
