package org.linewright.reference.verify;

import java.util.Arrays;

/**
 * Residual points (x, y) kept for plotting with a fixed upper bound on memory: once {@code capacity} points
 * are held, every second point is dropped and only every second later point is kept (the stride doubles), so
 * the kept points stay evenly spread over the list in its order. Deterministic.
 */
public final class ResidualSeries {
    private final int capacity;
    private double[] x;
    private double[] y;
    private int size;
    private long stride = 1;
    private long offered;

    /** @param capacity at most this many points are kept (at least 2) */
    public ResidualSeries(int capacity) {
        if (capacity < 2) {
            throw new IllegalArgumentException("capacity must be at least 2: " + capacity);
        }
        this.capacity = capacity;
        this.x = new double[Math.min(capacity, 1024)];
        this.y = new double[x.length];
    }

    /** Offers one point; NaN residuals are skipped. */
    public void add(double xValue, double yValue) {
        if (Double.isNaN(yValue) || Double.isNaN(xValue)) {
            return;
        }
        if (offered++ % stride != 0) {
            return;
        }
        if (size == capacity) {
            // keep every second point and double the stride
            int k = 0;
            for (int i = 0; i < size; i += 2) {
                x[k] = x[i];
                y[k] = y[i];
                k++;
            }
            size = k;
            stride *= 2;
            if ((offered - 1) % stride != 0) {
                return;
            }
        }
        if (size == x.length) {
            int n = Math.min(capacity, x.length * 2);
            x = Arrays.copyOf(x, n);
            y = Arrays.copyOf(y, n);
        }
        x[size] = xValue;
        y[size] = yValue;
        size++;
    }

    /** The kept abscissae (a copy). */
    public double[] x() {
        return Arrays.copyOf(x, size);
    }

    /** The kept residuals (a copy). */
    public double[] y() {
        return Arrays.copyOf(y, size);
    }

    public int size() {
        return size;
    }
}
