package org.linewright.broadening.listing;

import org.linewright.broadening.sources.WidthResolver;

/**
 * Which lines {@link LineListing} lists and what it adds to them.
 *
 * @param lowCm1 lowest wavenumber listed (inclusive)
 * @param highCm1 highest wavenumber listed (inclusive)
 * @param moleculeId molecule number, or 0 for every molecule
 * @param isotopologue local isotopologue number, or 0 for every isotopologue
 * @param strongest list only the N strongest lines (by S(T) when a temperature is given, else by S(296 K)),
 *                  still in wavenumber order; 0 lists every selected line
 * @param temperatureK adds the intensity at this temperature; NaN for none
 * @param widthsOrNull adds the widths every line gets in this background (a resolver builder carrying the
 *                     composition, source order and constants); null for none
 */
public record LineListingRequest(double lowCm1, double highCm1, int moleculeId, int isotopologue, int strongest,
                                 double temperatureK, WidthResolver.Builder widthsOrNull) {
    public LineListingRequest {
        if (!(lowCm1 <= highCm1)) {
            throw new org.linewright.ingest.InputException("wavenumber range: " + lowCm1 + " to " + highCm1
                    + " cm-1 (expected low <= high)");
        }
        if (strongest < 0) {
            throw new org.linewright.ingest.InputException("strongest: " + strongest + " (expected a positive count)");
        }
        if (!Double.isNaN(temperatureK) && !(temperatureK > 0)) {
            throw new org.linewright.ingest.InputException("temperature: " + temperatureK + " K (expected > 0)");
        }
    }

    /** Every line of the store, nothing added. */
    public static LineListingRequest all() {
        return new LineListingRequest(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, 0, 0, 0, Double.NaN, null);
    }
}
