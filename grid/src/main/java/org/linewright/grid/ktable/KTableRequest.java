package org.linewright.grid.ktable;

import org.linewright.ingest.InputException;

/**
 * What k-table to make of a σ table.
 *
 * @param binning                  how to cut the σ table's wavenumber range into bins
 * @param quadrature               the g quadrature
 * @param sampling                 how k_i is taken from each bin's distribution
 * @param transmissionColumnCm2    column u (molecule/cm²) of the transmission-equivalent band σ, or NaN for none
 * @param bandMean                 also write the band-mean σ of each bin
 * @param massGPerMol              molar mass for opacity per unit mass (cm²/g = cm²/molecule · N_A / M), or NaN for
 *                                 per molecule
 * @param massSource               what the molar mass is (metadata), or null
 */
public record KTableRequest(Binning binning, GQuadrature quadrature, KSampling sampling, double transmissionColumnCm2,
                            boolean bandMean, double massGPerMol, String massSource) {
    public KTableRequest {
        if (!Double.isNaN(transmissionColumnCm2) && !(transmissionColumnCm2 > 0 && Double.isFinite(transmissionColumnCm2))) {
            throw new InputException("transmission column " + transmissionColumnCm2
                    + " molecule/cm2 (expected a positive number)");
        }
        if (!Double.isNaN(massGPerMol) && !(massGPerMol > 0 && Double.isFinite(massGPerMol))) {
            throw new InputException("molar mass " + massGPerMol + " g/mol (expected a positive number)");
        }
    }

    /** The defaults: 16-point Gauss–Legendre, interval means, per molecule, k only. */
    public static KTableRequest of(Binning binning) {
        return new KTableRequest(binning, GQuadrature.of(QuadratureKind.GAUSS_LEGENDRE, 16), KSampling.INTERVAL_MEAN,
                Double.NaN, false, Double.NaN, null);
    }

    public KTableRequest withQuadrature(GQuadrature q) {
        return new KTableRequest(binning, q, sampling, transmissionColumnCm2, bandMean, massGPerMol, massSource);
    }

    public KTableRequest withSampling(KSampling s) {
        return new KTableRequest(binning, quadrature, s, transmissionColumnCm2, bandMean, massGPerMol, massSource);
    }

    public KTableRequest withBandSigma(boolean mean, double columnCm2) {
        return new KTableRequest(binning, quadrature, sampling, columnCm2, mean, massGPerMol, massSource);
    }

    public KTableRequest withPerMass(double gPerMol, String source) {
        return new KTableRequest(binning, quadrature, sampling, transmissionColumnCm2, bandMean, gPerMol, source);
    }

    /** How bins are made from the σ table's wavenumber range [from, to]. */
    @FunctionalInterface
    public interface Binning {
        SpectralBins bins(double fromCm1, double toCm1);

        static Binning resolvingPower(double r) {
            return (a, b) -> SpectralBins.resolvingPower(a, b, r);
        }

        static Binning fixedWidth(double widthCm1) {
            return (a, b) -> SpectralBins.fixedWidth(a, b, widthCm1);
        }

        static Binning of(SpectralBins bins) {
            return (a, b) -> bins;
        }
    }
}
