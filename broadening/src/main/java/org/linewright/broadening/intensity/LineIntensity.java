package org.linewright.broadening.intensity;

import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.IsotopologueLookup;

/**
 * Line intensity S(T) in cm⁻¹/(molecule·cm⁻²), abundance-weighted as in the line model.
 *
 * <p>From the intensity at T_ref = 296 K (Rothman et al. 1998, JQSRT 60, 665, appendix, eq. A11;
 * Šimečková et al. 2006, JQSRT 98, 130, eq. 11):
 * <pre>
 *   S(T) = S(T_ref) · Q(T_ref)/Q(T) · exp(−c2·E''/T)/exp(−c2·E''/T_ref) · [1 − exp(−c2·ν/T)]/[1 − exp(−c2·ν/T_ref)]
 * </pre>
 * From the Einstein A coefficient when no intensity is given (state lists) (Šimečková et al. 2006, eq. 20):
 * <pre>
 *   S(T) = I_a · A · g' / (8π·c·ν²) · exp(−c2·E''/T) · [1 − exp(−c2·ν/T)] / Q(T)
 * </pre>
 * with c in cm/s, ν in cm⁻¹, E'' in cm⁻¹, c2 = hc/k the second radiation constant (CODATA 2018) and I_a the
 * natural abundance, Q(T) the total internal partition sum, both from {@link IsotopologueLookup}; constants
 * from {@code PhysicalConstants} (CODATA 2018).
 *
 * <p>Numerics: 1 − exp(−x) is evaluated as {@code -Math.expm1(-x)}; for x = c2ν/T ≪ 1 (microwave lines,
 * ν ~ 10⁻³ cm⁻¹ gives x ~ 10⁻⁵) the direct form loses about −log10(x) digits to cancellation, expm1 keeps full
 * double precision. The Boltzmann ratio is one exponential exp(−c2·E''·(1/T − 1/T_ref)), which avoids the
 * 0/0 that two separately underflowing factors would give for very high E''. The accuracy is that of the inputs:
 * a few ulps of double arithmetic beyond the Q(T) and abundance values supplied.
 *
 * <p>The single-line relations are evaluated by {@link EinsteinCoefficients} of the line model (one place for
 * them in linewright, shared with the readers); this class applies them to whole batches with the partition
 * sums and abundances of the registry.
 *
 * <p>The batch method is allocation-free: it writes into a caller-supplied array of at least
 * {@code batch.size} elements and reads Q(T), Q(296 K) and abundances from an {@link IsotopologueCache}.
 */
public final class LineIntensity {
    /** Reference temperature of the line model's intensities, in K. */
    public static final double REFERENCE_TEMPERATURE_K = LineBatch.REFERENCE_TEMPERATURE_K;

    private LineIntensity() {
    }

    /**
     * S(T) from S(296 K) for one line (formula in the class comment).
     *
     * @param intensity296 S(296 K) in cm⁻¹/(molecule·cm⁻²)
     * @param wavenumberCm1 line position ν in cm⁻¹ (positive)
     * @param lowerEnergyCm1 lower-state energy E'' in cm⁻¹
     * @param partitionRatio Q(296 K)/Q(T)
     * @param temperatureK T in K
     */
    public static double scaledFromReference(double intensity296, double wavenumberCm1, double lowerEnergyCm1,
                                             double partitionRatio, double temperatureK) {
        // partitionRatio = Q(296)/Q(T): passed as "from" sum against a "to" sum of 1
        return intensity296 * EinsteinCoefficients.intensityRatio(wavenumberCm1, lowerEnergyCm1,
                REFERENCE_TEMPERATURE_K, partitionRatio, temperatureK, 1.0);
    }

    /**
     * S(T) from the Einstein A coefficient for one line (formula in the class comment).
     *
     * @param einsteinAS1 A in s⁻¹
     * @param upperDegeneracy g' (total statistical weight of the upper state, nuclear spin included)
     * @param wavenumberCm1 ν in cm⁻¹
     * @param lowerEnergyCm1 E'' in cm⁻¹
     * @param abundance natural abundance I_a (1 for an isotopically pure sample)
     * @param partitionSum Q(T)
     * @param temperatureK T in K
     */
    public static double fromEinsteinA(double einsteinAS1, double upperDegeneracy, double wavenumberCm1,
                                       double lowerEnergyCm1, double abundance, double partitionSum,
                                       double temperatureK) {
        return EinsteinCoefficients.intensityFromEinsteinA(einsteinAS1, wavenumberCm1, upperDegeneracy,
                lowerEnergyCm1, temperatureK, partitionSum, abundance);
    }

    /**
     * S(T) for every row of a batch: from S(296 K) where the row has one (finite and positive), else from the
     * Einstein A coefficient and g'. Rows with neither get NaN. Allocation-free.
     *
     * @param isotopologues registry values at T (one cache per thread; reuse it batch after batch)
     * @param out receives S(T) for rows {@code 0 .. batch.size-1}
     * @throws InputException when the registry has no partition sum for a row's isotopologue
     */
    public static void atTemperature(LineBatch batch, IsotopologueCache isotopologues, double[] out) {
        double temperatureK = isotopologues.temperatureK();
        for (int i = 0; i < batch.size; i++) {
            int mol = batch.moleculeId[i];
            int iso = batch.isotopologue[i];
            double qT = isotopologues.partitionSum(mol, iso);
            double q296 = isotopologues.partitionSum296(mol, iso);
            if (!(qT > 0) || !(q296 > 0)) {
                isotopologues.requirePartitionSums(mol, iso, batch.sourceLine[i]);
            }
            double s296 = batch.intensityCmPerMolecule[i];
            if (s296 > 0 && Double.isFinite(s296)) {
                out[i] = scaledFromReference(s296, batch.wavenumberCm1[i], batch.lowerEnergyCm1[i], q296 / qT,
                        temperatureK);
            } else if (batch.einsteinAS1[i] >= 0 && batch.upperDegeneracy[i] > 0) {
                out[i] = fromEinsteinA(batch.einsteinAS1[i], batch.upperDegeneracy[i], batch.wavenumberCm1[i],
                        batch.lowerEnergyCm1[i], isotopologues.naturalAbundance(mol, iso), qT, temperatureK);
            } else {
                out[i] = Double.NaN;
            }
        }
    }

    /**
     * {@link #atTemperature(LineBatch, IsotopologueCache, double[])} with a new cache for this call (a few
     * small arrays); loops over many batches should keep one {@link IsotopologueCache} instead.
     *
     * @throws IllegalArgumentException for a non-positive temperature
     */
    public static void atTemperature(LineBatch batch, double temperatureK, IsotopologueLookup lookup, double[] out) {
        atTemperature(batch, new IsotopologueCache(lookup, temperatureK), out);
    }
}
