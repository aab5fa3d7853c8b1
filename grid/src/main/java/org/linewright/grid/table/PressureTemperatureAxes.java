package org.linewright.grid.table;

import java.nio.file.Path;
import org.linewright.ingest.InputException;

/**
 * The (p, T) axes of a tabulated quantity and the bilinear interpolation in (ln p, T) every table reader of the
 * project uses (σ tables, k-tables): with p_i ≤ p ≤ p_{i+1} and T_j ≤ T ≤ T_{j+1},
 * u = (ln p − ln p_i)/(ln p_{i+1} − ln p_i), v = (T − T_j)/(T_{j+1} − T_j) and
 * f = (1−u)(1−v)f_{i,j} + u(1−v)f_{i+1,j} + (1−u)v f_{i,j+1} + uv f_{i+1,j+1}. It is exact for f linear in ln p and
 * T (and in their product); elsewhere its error is the tabulation's. An axis of a single value accepts only that
 * value (relative 10⁻⁹); there is no extrapolation.
 */
public final class PressureTemperatureAxes {
    private static final double SINGLE_POINT_TOLERANCE = 1e-9;

    private final Path file;
    private final double[] pressureBar;
    private final double[] temperatureK;

    /**
     * The four corners of the axis cell holding (p, T) and their weights.
     *
     * @param p0 lower pressure index, {@code p1} the upper (equal on a single-value axis)
     * @param t0 lower temperature index, {@code t1} the upper
     */
    public record Corners(int p0, int p1, int t0, int t1, double w00, double w10, double w01, double w11) {
        /** The interpolated value from the four corner values f[p0][t0], f[p1][t0], f[p0][t1], f[p1][t1]. */
        public double combine(double f00, double f10, double f01, double f11) {
            return w00 * f00 + w10 * f10 + w01 * f01 + w11 * f11;
        }
    }

    /**
     * @param file         the file the axes come from (named in error messages)
     * @param pressureBar  ascending pressures, bar (kept, not copied)
     * @param temperatureK ascending temperatures, K (kept, not copied)
     */
    public PressureTemperatureAxes(Path file, double[] pressureBar, double[] temperatureK) {
        this.file = file;
        this.pressureBar = pressureBar;
        this.temperatureK = temperatureK;
    }

    /**
     * The corners and weights of (p, T), bilinear in (ln p, T) (see the class comment).
     *
     * @throws InputException when p or T lies outside the axes
     */
    public Corners corners(double pressureBarValue, double temperatureKValue) {
        int i = cell(pressureBar, pressureBarValue, "pressure", "bar");
        int j = cell(temperatureK, temperatureKValue, "temperature", "K");
        double u = pressureBar.length == 1 ? 0.0
                : (Math.log(pressureBarValue) - Math.log(pressureBar[i]))
                / (Math.log(pressureBar[i + 1]) - Math.log(pressureBar[i]));
        double v = temperatureK.length == 1 ? 0.0
                : (temperatureKValue - temperatureK[j]) / (temperatureK[j + 1] - temperatureK[j]);
        int i1 = Math.min(i + 1, pressureBar.length - 1);
        int j1 = Math.min(j + 1, temperatureK.length - 1);
        return new Corners(i, i1, j, j1, (1 - u) * (1 - v), u * (1 - v), (1 - u) * v, u * v);
    }

    /** Index of the lower corner of the axis cell holding {@code x}. */
    private int cell(double[] axis, double x, String what, String unit) {
        if (axis.length == 1) {
            if (!(Math.abs(x - axis[0]) <= SINGLE_POINT_TOLERANCE * axis[0])) {
                throw new InputException(file + ": " + what + " " + x + " " + unit + " is not in the table (its only "
                        + what + " is " + axis[0] + " " + unit + ")");
            }
            return 0;
        }
        if (!(x >= axis[0] && x <= axis[axis.length - 1])) {
            throw new InputException(file + ": " + what + " " + x + " " + unit + " is outside the table's axis ["
                    + axis[0] + ", " + axis[axis.length - 1] + "] " + unit + " (interpolation only, no extrapolation)");
        }
        int lo = 0;
        int hi = axis.length - 1;
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (axis[mid] <= x) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
