package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.jtransforms.fft.DoubleFFT_1D;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;

/**
 * The engine's slice kernels, transformed as the engine transforms them, against the closed-form Fourier transform
 * of the Voigt profile: with F(f) = ∫ V(ν)·e^(−2πifν) dν, F_V(f) = exp(−π²f²αD²/ln2)·exp(−2πγL|f|), the product of
 * the Gaussian and Lorentzian transforms (standard transform pairs, e.g. Bracewell, "The Fourier Transform and Its
 * Applications", and the form used by van den Bekerom &amp; Pannier, JQSRT 261 (2021) 107476).
 */
class KernelTransformTest {

    private static final int LENGTH = 1 << 17;

    @ParameterizedTest(name = "alphaD={0} gammaL={1}")
    @CsvSource({"0.01, 0.02", "0.02, 0.0", "0.0, 0.03", "0.005, 0.1"})
    void sampledKernelTransformMatchesTheClosedForm(double alpha, double gamma) {
        double h = 0.001;
        int reach = LENGTH / 2 - 1;
        double[] offsets = new double[reach + 1];
        for (int r = 0; r <= reach; r++) {
            offsets[r] = r * h;
        }
        WingKernel wings = WingTreatment.defaults().withCutoff(WingCutoff.none()).atConditions(1.0, 296.0);
        double[] kernel = new double[LENGTH];
        SliceConvolver.sampleKernel(wings, alpha, gamma, offsets, reach, new double[reach + 1], kernel);
        new DoubleFFT_1D(LENGTH).realForward(kernel);
        // the Lorentz wings beyond ±L·h/2 = ±65.5 cm⁻¹ are outside the kernel: (2/π)·atan(γ/65.5) of the area, so
        // the comparison allows that much plus rounding
        double allowance = 2 / Math.PI * Math.atan(gamma / (reach * h)) + 1e-9;
        int checked = 0;
        for (int k = 1; k < LENGTH / 2; k++) {
            double f = k / (LENGTH * h);
            double closedForm = Math.exp(-Math.PI * Math.PI * f * f * alpha * alpha / Math.log(2))
                    * Math.exp(-2 * Math.PI * gamma * f);
            if (closedForm < 1e-8) {
                break;
            }
            // the DFT of samples h·V(r·h) approximates F_V at f = k/(L·h); a symmetric kernel has no imaginary part
            assertEquals(closedForm, h * kernel[2 * k], allowance + 1e-6 * closedForm, "f=" + f);
            assertEquals(0.0, h * kernel[2 * k + 1], 1e-12);
            checked++;
        }
        assertEquals(1.0, h * kernel[0], allowance + 1e-9);
        assertTrue(checked > 100, "frequencies compared: " + checked);
    }
}
