package org.linewright.broadening.listing;

import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;

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
 * @param backgroundOrNull adds the widths every line gets in this background; null for none
 * @param widths how the widths are found (source order, constants, rules)
 */
public record LineListingRequest(double lowCm1, double highCm1, int moleculeId, int isotopologue, int strongest,
                                 double temperatureK, Composition backgroundOrNull, WidthOptions widths) {
    public LineListingRequest {
        widths = widths == null ? WidthOptions.DEFAULTS : widths;
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
        return new LineListingRequest(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, 0, 0, 0, Double.NaN, null,
                WidthOptions.DEFAULTS);
    }
}
