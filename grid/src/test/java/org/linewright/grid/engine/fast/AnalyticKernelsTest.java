package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.jtransforms.fft.DoubleFFT_1D;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.broadening.voigt.VoigtProfile;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;

/**
 * The closed-form pieces of the analytic kernel path against brute force: the periodic Lorentz sum and its second
 * derivative against the image sum Σ_m L(x + mP) of the Lorentzian's definition L = γ/(π(x² + γ²)) (common
 * practice), and the alias-summed Voigt transform against the periodised samples of {@link VoigtProfile} (itself
 * tested against SciPy's wofz in the broadening module).
 */
class AnalyticKernelsTest {

    /** Σ_{|m| ≤ M} f(x + mP) plus the tail 2·c/(P²·M) of the 1/x² (c/x²) or 1/x⁴ far terms, M = 200,000. */
    private static double imageSum(double x, double gamma, double period, boolean second) {
        return imageSum(x, gamma, period, second, true);
    }

    /** The same, with or without the central term m = 0; summed from the far images inwards (small terms first). */
    private static double imageSum(double x, double gamma, double period, boolean second, boolean centre) {
        int images = 200_000;
        double sum = 0;
        for (int a = images; a >= (centre ? 0 : 1); a--) {
            for (int m : a == 0 ? new int[] {0} : new int[] {-a, a}) {
                double y = x + m * period;
                sum += second ? AnalyticKernels.lorentzSecondDerivative(y, gamma) : AnalyticKernels.lorentz(y, gamma);
            }
        }
        // the far images: L ≈ γ/(π y²) and L'' ≈ 6γ/(π y⁴); Σ_{m>M} 1/m² ≈ 1/M, Σ 1/m⁴ ≈ 1/(3M³)
        double tail = second ? 2 * 6 * gamma / Math.PI / Math.pow(period, 4) / (3.0 * images * images * images)
                : 2 * gamma / Math.PI / (period * period) / images;
        return sum + tail;
    }

    @ParameterizedTest(name = "gamma={0} P={1} x={2}")
    @CsvSource({"0.05, 100, 0", "0.05, 100, 0.03", "0.05, 100, 7.5", "0.05, 100, 50", "1e-5, 2000, 0",
            "1e-5, 2000, 1e-5", "1e-5, 2000, 300", "7.0, 60, 0", "7.0, 60, 25", "7.0, 60, 30", "0.3, 1, 0.4"})
    void periodicLorentzSumEqualsTheImageSum(double gamma, double period, double x) {
        double s = Math.sin(Math.PI * x / period);
        double closed = AnalyticKernels.periodicLorentz(s * s, gamma, period);
        double brute = imageSum(x, gamma, period, false);
        assertEquals(brute, closed, 1e-9 * brute);
        double closed2 = AnalyticKernels.periodicLorentzSecondDerivative(s * s, gamma, period);
        double brute2 = imageSum(x, gamma, period, true);
        // L'' changes sign at x = γ/√3: compare against the scale of its terms there
        double scale = Math.abs(AnalyticKernels.lorentzSecondDerivative(x, gamma))
                + Math.abs(AnalyticKernels.lorentzSecondDerivative(0, gamma)) * 1e-6;
        assertEquals(brute2, closed2, 1e-8 * scale + 1e-9 * Math.abs(brute2));
    }

    @ParameterizedTest(name = "gamma={0} P={1} x={2}")
    @CsvSource({"1e-5, 131, 0", "1e-5, 131, 0.002", "1e-5, 131, 2.0", "0.05, 100, 0", "0.05, 100, 20", "7.0, 60, 0",
            "7.0, 60, 25", "20, 60, 1"})
    void imagesAloneEqualTheImageSumWithoutTheCentralTerm(double gamma, double period, double x) {
        double s = Math.sin(Math.PI * x / period);
        for (boolean second : new boolean[] {false, true}) {
            double brute = imageSum(x, gamma, period, second, false);
            // compare at the scale of the images' own terms, γ/(πP²) (6γ/(πP⁴)) where the sum passes near zero
            double scale = second ? 6 * gamma / Math.PI / Math.pow(period, 4) : gamma / Math.PI / (period * period);
            double images = AnalyticKernels.imagesOnly(x, gamma, period, s * s, second);
            assertEquals(brute, images, 1e-9 * Math.max(scale, Math.abs(brute)), "second=" + second);
        }
    }

    @ParameterizedTest(name = "alphaD={0} gammaL={1} h={2}")
    @CsvSource({"0.02, 0.05, 0.01", "0.005, 0.05, 0.01", "0.004, 0.0, 0.01", "0.01, 2.0, 0.01", "0.003, 1e-5, 0.002"})
    void voigtTransformIsTheTransformOfThePeriodisedSamples(double alpha, double gamma, double h) {
        int length = 1 << 12;
        double[] half = new double[length];
        double tail = AnalyticKernels.voigtTransform(alpha, gamma, h, length, half);
        assertTrue(tail >= 0 && tail <= AnalyticKernels.ALIAS_TAIL, "tail " + tail);
        double[] packed = new double[length];
        packed[0] = half[0];
        packed[1] = half[length / 2];
        for (int k = 1; k < length / 2; k++) {
            packed[2 * k] = half[k];
        }
        new DoubleFFT_1D(length).realInverse(packed, true);
        double period = length * h;
        double peak = VoigtProfile.value(0, alpha, gamma);
        for (int n = 0; n < length; n += 7) {
            double x = (n <= length / 2 ? n : n - length) * h;
            double brute = 0;
            for (int m = -3000; m <= 3000; m++) {
                brute += VoigtProfile.value(x + m * period, alpha, gamma);
            }
            // the images beyond ±3000 periods: Lorentz tails 2γ/(π P²·3000)
            brute += 2 * gamma / (Math.PI * period * period * 3000);
            assertEquals(brute, packed[n], 1e-11 * peak + 1e-7 * brute, "n=" + n);
        }
    }

    @ParameterizedTest(name = "alphaD={0} gammaL={1} R={2} pedestal={3}")
    @CsvSource({"0.003, 0.07, 1.0, false", "0.003, 0.07, 1.0, true", "0.003, 7.0, 25, true", "0.003, 7.0, 1.0, false",
            "0.004, 1e-5, 2.0, true"})
    void correctedTransformEqualsTheTruncatedProfile(double alpha, double gamma, double cutoff, boolean pedestal) {
        int length = 1 << 16;
        double h = 0.002;
        int reach = (int) Math.floor(cutoff / h) + 1;
        double[] offsets = new double[reach + 1];
        for (int r = 0; r <= reach; r++) {
            offsets[r] = r * h;
        }
        // reference: the exact engine's truncated line, sampled as the sampled-kernel path samples it
        WingKernel wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(cutoff)).withPedestalRemoval(pedestal)
                .atConditions(1.0, 296.0);
        double[] truncated = new double[length];
        SliceConvolver.sampleKernel(wings, alpha, gamma, offsets, reach, new double[reach + 1], truncated);

        double[] half = new double[length];
        AnalyticKernels.voigtTransform(alpha, gamma, h, length, half);
        double[] sinSquared = AnalyticKernels.sinSquaredTable(length);
        double[] c = new double[length];
        double[] d = new double[length];
        AnalyticKernels.correctionKernel(gamma, offsets, cutoff, pedestal, h, sinSquared, false, c);
        AnalyticKernels.correctionKernel(gamma, offsets, cutoff, pedestal, h, sinSquared, true, d);
        DoubleFFT_1D fft = new DoubleFFT_1D(length);
        fft.realForward(c);
        fft.realForward(d);
        double w = 0.5 * AnalyticKernels.dopplerVariance(alpha);
        double[] packed = new double[length];
        packed[0] = half[0] - c[0] - w * d[0];
        packed[1] = half[length / 2] - c[1] - w * d[1];
        for (int k = 1; k < length / 2; k++) {
            packed[2 * k] = half[k] - c[2 * k] - w * d[2 * k];
        }
        fft.realInverse(packed, true);
        double peak = VoigtProfile.value(0, alpha, gamma);
        double model = AnalyticKernels.wingModelError(alpha, cutoff);
        double edge = VoigtProfile.value(cutoff, alpha, gamma);
        // round-off of transforms of length L: 64·2⁻⁵²·log₂L of the peak, the allowance the engine's estimate uses
        double roundOff = 64 * Math.ulp(1.0) * 16 * peak;
        double worstInside = 0;
        double worstOutside = 0;
        for (int n = 0; n < length; n++) {
            double diff = Math.abs(packed[n] - truncated[n]);
            if (truncated[n] != 0) {
                // the pedestal's modelled part adds up to model·V(R) anywhere inside
                double allowed = model * (Math.abs(truncated[n]) + (pedestal ? edge : 0)) + roundOff;
                worstInside = Math.max(worstInside, diff / allowed);
            } else {
                worstOutside = Math.max(worstOutside, diff);
            }
        }
        // inside the cutoff: the wing model's remainder relative to the line (plus, with pedestal removal, relative to
        // V(R)) and round-off; outside: the remainder relative to V(R), plus round-off
        assertTrue(worstInside <= 1, "inside: error / allowance " + worstInside + ", model " + model);
        assertTrue(worstOutside <= model * edge + roundOff, "outside " + worstOutside + " edge " + edge);
    }

    @Test
    void wingModelErrorFallsAsTheFourthPowerOfDopplerOverCutoff() {
        // 2·15·s⁴/R⁴ with s² = αD²/(2 ln 2): at αD/R = 0.1, 30·(0.01/(2 ln 2))² = 1.5612e-3
        assertEquals(30 * Math.pow(0.01 / (2 * Math.log(2)), 2), AnalyticKernels.wingModelError(0.1, 1.0), 1e-15);
        assertEquals(16.0, AnalyticKernels.wingModelError(0.2, 1.0) / AnalyticKernels.wingModelError(0.1, 1.0), 1e-9);
    }
}
