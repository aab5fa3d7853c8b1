package org.linewright.grid.hdf5;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * A dimension of an HDF5 file written by {@link Hdf5Writer}: a 1-D dimension-scale dataset named like the
 * dimension, holding the coordinate values (float64, contiguous) or, for a dimension without coordinate, none
 * (netCDF-4's "dimension but not a variable" convention).
 */
public final class Hdf5Dimension {
    /** netCDF-4's NAME of a dimension scale that is not a variable, followed by the length in 10 characters. */
    static final String NOT_A_VARIABLE = "This is a netCDF dimension but not a netCDF variable.";

    private final String name;
    private final int length;
    private final double[] values;
    private final Map<String, String> attributes;
    private final long dataAddress;
    /** Each variable using this dimension and at which of its axes, in declaration order. */
    final List<Use> users = new ArrayList<>();

    /** A variable's use of this dimension as its axis number {@code axis}. */
    record Use(Hdf5Variable variable, int axis) {
    }

    Hdf5Dimension(String name, int length, double[] values, Map<String, String> attributes, long dataAddress) {
        this.name = name;
        this.length = length;
        this.values = values;
        this.attributes = attributes;
        this.dataAddress = dataAddress;
    }

    public String name() {
        return name;
    }

    public int length() {
        return length;
    }

    /** Whether the dimension carries coordinate values. */
    public boolean hasCoordinates() {
        return values != null;
    }

    Map<String, String> attributes() {
        return attributes;
    }

    long dataAddress() {
        return dataAddress;
    }
}
