package org.linewright.grid.engine.fast;

import java.util.Arrays;
import org.linewright.grid.engine.LineChunk;

/**
 * The lines of one fast computation, kept from {@link FastEngine#accumulate} to {@link FastEngine#finish}: centre,
 * intensity, Doppler and Lorentz HWHM and the χ flag, in the order fed (33 bytes per line). Lines with S = 0 are
 * not kept. Primitive arrays grown by half their length.
 */
final class LineBuffer {
    /** Heap per line kept: four doubles and a boolean. */
    static final int BYTES_PER_LINE = 4 * Double.BYTES + 1;
    double[] centerCm1 = new double[0];
    double[] strength = new double[0];
    double[] dopplerCm1 = new double[0];
    double[] lorentzCm1 = new double[0];
    boolean[] chi = new boolean[0];
    int count;

    void clear() {
        count = 0;
    }

    /**
     * Appends a chunk's lines.
     *
     * @param withChi whether a line flagged for the χ factor keeps the flag (false when the treatment has none)
     * @throws IllegalArgumentException for a line with non-finite values or both widths zero
     */
    void add(LineChunk chunk, boolean withChi) {
        ensureCapacity(count + chunk.size);
        for (int i = 0; i < chunk.size; i++) {
            double s = chunk.intensityCmPerMolecule[i];
            double a = chunk.dopplerHwhmCm1[i];
            double g = chunk.lorentzHwhmCm1[i];
            double c = chunk.centerCm1[i];
            if (!(a >= 0) || !(g >= 0) || Double.isInfinite(a) || Double.isInfinite(g) || (a == 0 && g == 0)
                    || !Double.isFinite(s) || !Double.isFinite(c)) {
                throw new IllegalArgumentException("fast engine: line at " + c + " cm-1 with S=" + s + ", alphaD=" + a
                        + ", gammaL=" + g + " (expected finite values and widths not both zero)");
            }
            if (s == 0) {
                continue;
            }
            centerCm1[count] = c;
            strength[count] = s;
            dopplerCm1[count] = a;
            lorentzCm1[count] = g;
            chi[count] = chunk.chiFactor[i] && withChi;
            count++;
        }
    }

    /** Heap the buffer holds: {@value #BYTES_PER_LINE} bytes per line of capacity. */
    long bytes() {
        return (long) centerCm1.length * BYTES_PER_LINE;
    }

    private void ensureCapacity(int needed) {
        if (needed <= centerCm1.length) {
            return;
        }
        // grown by half: at most a third of the capacity unused (doubling would leave up to half)
        int capacity = (int) Math.min(Integer.MAX_VALUE - 8,
                Math.max(needed, Math.max(1 << 12, centerCm1.length + (long) centerCm1.length / 2)));
        centerCm1 = Arrays.copyOf(centerCm1, capacity);
        strength = Arrays.copyOf(strength, capacity);
        dopplerCm1 = Arrays.copyOf(dopplerCm1, capacity);
        lorentzCm1 = Arrays.copyOf(lorentzCm1, capacity);
        chi = Arrays.copyOf(chi, capacity);
    }
}
