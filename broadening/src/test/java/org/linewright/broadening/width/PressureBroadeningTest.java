package org.linewright.broadening.width;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.GasParameters;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.ingest.line.LineBatch;

/**
 * Hand-computed cases of γ_L = p·Σ x·γ·(296/T)^n and δ = p·Σ x·δ (Rothman et al. 1998, JQSRT 60, 665,
 * appendix; common practice), evaluated with Python 3 floating point:
 * {@code 2*(0.85*0.06*(296/150)**0.6 + 0.15*0.05*(296/150)**0.3) = 0.17175589636543864}.
 */
class PressureBroadeningTest {

    @Test
    void mixtureWidthAndShiftByHand() {
        double[] x = {0.85, 0.15};
        double[] g = {0.06, 0.05};
        double[] n = {0.6, 0.3};
        assertEquals(0.17175589636543864, PressureBroadening.lorentzHwhmCm1(2.0, 150.0, x, g, n), 1e-15);
        // 2*(0.85*-0.002 + 0.15*0.001) = -0.0031
        assertEquals(-0.0031, PressureBroadening.shiftCm1(2.0, x, new double[] {-0.002, 0.001}), 1e-16);
    }

    @Test
    void atReferenceTemperatureWidthIsPressureTimesWeightedSum() {
        // T = 296 K: (296/T)^n = 1 for any n; 0.5 atm·(0.7·0.08 + 0.3·0.1) = 0.043 (by hand)
        assertEquals(0.043, PressureBroadening.lorentzHwhmCm1(0.5, 296.0, new double[] {0.7, 0.3},
                new double[] {0.08, 0.1}, new double[] {0.75, 0.5}), 1e-16);
    }

    @Test
    void batchFormAgreesWithHandValues() {
        Composition c = Composition.parse("H2=0.85,He=0.15");
        WidthResolver r = WidthResolver.builder(c)
                .order("user")
                .userConstant(BackgroundGas.H2, new GasParameters(0.06, 0.6, -0.002))
                .userConstant(BackgroundGas.HE, new GasParameters(0.05, 0.3, 0.001))
                .build();
        LineBatch b = new LineBatch(2);
        b.size = 2;
        b.moleculeId[0] = b.moleculeId[1] = 99;
        ResolvedWidths w = r.newResult(2);
        r.resolve(b, w);
        double[] out = new double[2];
        PressureBroadening.lorentzHwhmCm1(w, 2.0, 150.0, out);
        assertEquals(0.17175589636543864, out[0], 1e-15);
        PressureBroadening.shiftCm1(w, 2.0, out);
        assertEquals(-0.0031, out[1], 1e-16);
        assertThrows(IllegalArgumentException.class, () -> PressureBroadening.lorentzHwhmCm1(w, -1, 300, out));
        assertThrows(IllegalArgumentException.class, () -> PressureBroadening.lorentzHwhmCm1(w, 1, 0, out));
    }
}
