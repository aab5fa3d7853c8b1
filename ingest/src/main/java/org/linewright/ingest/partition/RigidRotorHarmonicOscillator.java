package org.linewright.ingest.partition;

import org.linewright.ingest.units.PhysicalConstants;

/**
 * The rigid-rotor / harmonic-oscillator (RRHO) total internal partition sum, from molecular constants:
 * <pre>
 * Q(T) = g_ns · Q_el(T) · Q_rot(T) · Q_vib(T)
 * Q_el  = Σ_e g_e · exp(−c2·E_e/T)
 * Q_vib = Π_i (1 − exp(−c2·ν_i/T))^(−d_i)                      (energies from the ground vibrational state)
 * Q_rot = (1/σ) · (1/x) · (1 + x/3 + x²/15 + 4x³/315),  x = c2·B/T    (linear molecules)
 * Q_rot = (√π/σ) · √(T³ / (c2³·A·B·C))                                (non-linear molecules, classical limit)
 * </pre>
 * with c2 = hc/k the second radiation constant. The linear-molecule series is the high-temperature
 * expansion of Σ(2J+1)exp(−x·J(J+1)) (H.P. Mulholland, Proc. Cambridge Phil. Soc. 24 (1928) 280); the
 * non-linear form is the classical rotational partition function (e.g. G. Herzberg, Molecular Spectra and
 * Molecular Structure II, 1945, ch. V).
 *
 * <p>Accuracy: the model neglects anharmonicity, centrifugal distortion and rotation–vibration coupling. At
 * 296 K it reproduces the tabulated total partition sums of the registry's main isotopologues to about
 * 1–3 % (H2O, H2S, OH and H2, whose rotational constants are large, least well); in temperature ratios
 * Q(T)/Q(296 K) the errors partly cancel below ~500 K and grow to a few % at 1000 K and more.
 */
public final class RigidRotorHarmonicOscillator {
    /** c2 = hc/k in cm·K (CODATA 2018). */
    private static final double C2_CM_K = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;
    private static final double SQRT_PI = Math.sqrt(Math.PI);

    private RigidRotorHarmonicOscillator() {
    }

    /** Q_RRHO(T) of the molecule described by {@code c}, including its nuclear-spin factor. */
    public static double partitionSum(MolecularConstants c, double temperatureK) {
        if (!(temperatureK > 0) || Double.isInfinite(temperatureK)) {
            throw new IllegalArgumentException("temperature must be positive and finite: " + temperatureK + " K");
        }
        double t = temperatureK;
        double qRot;
        if (c.linear()) {
            double x = C2_CM_K * c.rotationalCm1()[0] / t;
            qRot = (1.0 + x / 3.0 + x * x / 15.0 + 4.0 * x * x * x / 315.0) / (x * c.symmetryNumber());
        } else {
            double[] r = c.rotationalCm1();
            double tOverC2 = t / C2_CM_K;
            qRot = SQRT_PI / c.symmetryNumber() * Math.sqrt(tOverC2 * tOverC2 * tOverC2 / (r[0] * r[1] * r[2]));
        }
        double qVib = 1.0;
        double[] nu = c.vibrationalCm1();
        int[] deg = c.vibrationalDegeneracy();
        for (int i = 0; i < nu.length; i++) {
            // -expm1 keeps 1 − e^(−y) accurate for low-frequency modes at high temperature.
            qVib *= Math.pow(-Math.expm1(-C2_CM_K * nu[i] / t), -deg[i]);
        }
        double qEl = 0.0;
        double[] e = c.electronicCm1();
        int[] g = c.electronicDegeneracy();
        for (int i = 0; i < e.length; i++) {
            qEl += g[i] * Math.exp(-C2_CM_K * e[i] / t);
        }
        return c.nuclearSpinFactor() * qEl * qRot * qVib;
    }
}
