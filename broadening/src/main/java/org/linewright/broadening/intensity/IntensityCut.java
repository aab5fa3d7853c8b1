package org.linewright.broadening.intensity;

/**
 * Drops weak lines: keeps a line when S(T) ≥ a threshold, and reports how much of the total intensity was
 * dropped so the user can judge the cut. Lines with a NaN intensity count as dropped with zero weight.
 */
public final class IntensityCut {

    /**
     * Outcome of a cut.
     *
     * @param keptCount number of lines kept
     * @param droppedCount number of lines dropped
     * @param droppedFraction Σ S(dropped) / Σ S(all), 0 when the total is 0
     */
    public record Result(int keptCount, int droppedCount, double droppedFraction) { }

    private IntensityCut() {
    }

    /**
     * Marks the lines to keep.
     *
     * @param intensity S(T) per line (cm⁻¹/(molecule·cm⁻²)), {@code count} values
     * @param count number of lines
     * @param thresholdCmPerMolecule lines with S(T) below this are dropped; 0 keeps every finite line
     * @param keep receives true for a kept line
     */
    public static Result apply(double[] intensity, int count, double thresholdCmPerMolecule, boolean[] keep) {
        if (!(thresholdCmPerMolecule >= 0)) {
            throw new IllegalArgumentException("intensity threshold must be non-negative: " + thresholdCmPerMolecule);
        }
        // Neumaier-compensated sums: line intensities span 30+ decades, plain sums lose the small ones
        double total = 0, totalC = 0, dropped = 0, droppedC = 0;
        int kept = 0;
        for (int i = 0; i < count; i++) {
            double s = intensity[i];
            boolean k = s >= thresholdCmPerMolecule && Double.isFinite(s);
            keep[i] = k;
            if (Double.isFinite(s)) {
                double t = total + s;
                totalC += Math.abs(total) >= Math.abs(s) ? (total - t) + s : (s - t) + total;
                total = t;
                if (!k) {
                    double d = dropped + s;
                    droppedC += Math.abs(dropped) >= Math.abs(s) ? (dropped - d) + s : (s - d) + dropped;
                    dropped = d;
                }
            }
            if (k) {
                kept++;
            }
        }
        double sumAll = total + totalC;
        double fraction = sumAll > 0 ? (dropped + droppedC) / sumAll : 0.0;
        return new Result(kept, count - kept, fraction);
    }
}
