package org.linewright.broadening.width;

import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Doppler (thermal) half width at half maximum of a Gaussian line profile:
 * <pre>
 *   α_D = ν/c · √(2·ln2·k·T / m)
 * </pre>
 * with m = M·m_u the molecular mass (M in g/mol, m_u the atomic mass constant), k the Boltzmann constant and c
 * the speed of light in m/s (CODATA 2018, {@link PhysicalConstants}). Common practice; e.g. the handbook form
 * α_D = 3.581×10⁻⁷·ν·√(T/M). Accuracy: that of the constants and the mass (a few ulps of arithmetic).
 */
public final class DopplerWidth {
    /** 2·ln2·k/m_u in m²/(s²·K): multiplied by T/M (M in g/mol) gives (c·α_D/ν)². */
    private static final double TWO_LN2_K_OVER_MU = 2.0 * Math.log(2.0) * PhysicalConstants.BOLTZMANN_J_PER_K
            / PhysicalConstants.ATOMIC_MASS_CONSTANT_KG;

    private DopplerWidth() {
    }

    /**
     * @param wavenumberCm1 line position in cm⁻¹
     * @param temperatureK temperature in K
     * @param massGPerMol molecular mass in g/mol
     * @return α_D in cm⁻¹
     */
    public static double hwhmCm1(double wavenumberCm1, double temperatureK, double massGPerMol) {
        return wavenumberCm1 / PhysicalConstants.SPEED_OF_LIGHT_M_PER_S
                * Math.sqrt(TWO_LN2_K_OVER_MU * temperatureK / massGPerMol);
    }

    /**
     * α_D for every row of a batch at the cache's temperature (allocation-free).
     *
     * @param isotopologues registry values (one cache per thread; reuse it batch after batch)
     * @param out receives α_D in cm⁻¹ for rows {@code 0 .. batch.size-1}
     * @throws InputException when the registry has no mass for a row's isotopologue
     */
    public static void hwhmCm1(LineBatch batch, IsotopologueCache isotopologues, double[] out) {
        // α_D/ν = √(2ln2·k/m_u · T/M)/c: the T part once, the mass per row from the cache
        double perMass = TWO_LN2_K_OVER_MU * isotopologues.temperatureK();
        for (int i = 0; i < batch.size; i++) {
            double mass = isotopologues.massGPerMol(batch.moleculeId[i], batch.isotopologue[i]);
            if (!(mass > 0)) {
                throw new InputException("no mass for molecule " + batch.moleculeId[i] + " isotopologue "
                        + batch.isotopologue[i] + " (line " + batch.sourceLine[i]
                        + "; expected the isotopologue in the registry)");
            }
            out[i] = batch.wavenumberCm1[i] / PhysicalConstants.SPEED_OF_LIGHT_M_PER_S * Math.sqrt(perMass / mass);
        }
    }

    /**
     * {@link #hwhmCm1(LineBatch, IsotopologueCache, double[])} with a new cache for this call; loops over many
     * batches should keep one {@link IsotopologueCache} instead.
     */
    public static void hwhmCm1(LineBatch batch, double temperatureK, IsotopologueLookup lookup, double[] out) {
        hwhmCm1(batch, new IsotopologueCache(lookup, temperatureK), out);
    }
}
