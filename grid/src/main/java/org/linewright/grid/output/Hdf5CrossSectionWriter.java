package org.linewright.grid.output;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.linewright.grid.hdf5.Compression;
import org.linewright.grid.hdf5.ElementType;
import org.linewright.grid.hdf5.Hdf5Dimension;
import org.linewright.grid.hdf5.Hdf5Variable;
import org.linewright.grid.hdf5.Hdf5Writer;

/**
 * HDF5 file of one cross section, readable as netCDF-4: the dimension coordinate {@code /wavenumber_cm1} and
 * {@code /cross_section_cm2_per_molecule(wavenumber_cm1)}, float64, each with a string attribute {@code units};
 * σ chunked by {@link #CHUNK_POINTS} points, shuffled and deflated; the computation's parameters as string
 * attributes of the root group.
 */
final class Hdf5CrossSectionWriter {
    /** Wavenumber points per chunk of σ (128 KiB of float64 before compression). */
    static final int CHUNK_POINTS = 16384;

    private Hdf5CrossSectionWriter() {
    }

    static void write(Path file, double[] wavenumberCm1, double[] sigma, Map<String, String> metadata)
            throws IOException {
        try (Hdf5Writer h5 = Hdf5Writer.create(file)) {
            Hdf5Dimension nu = h5.coordinate(CrossSectionFiles.WAVENUMBER_NAME, wavenumberCm1,
                    Map.of(Hdf5Writer.UNITS, CrossSectionFiles.WAVENUMBER_UNIT));
            int block = Math.max(1, Math.min(wavenumberCm1.length, CHUNK_POINTS));
            Hdf5Variable xs = h5.variable(CrossSectionFiles.SIGMA_NAME, ElementType.FLOAT64, List.of(nu),
                    new int[] {block}, Compression.DEFAULT, Map.of(Hdf5Writer.UNITS, CrossSectionFiles.SIGMA_UNIT));
            for (int b = 0; b < xs.chunksAlong(0); b++) {
                xs.writeChunk(new long[] {b}, sigma, b * block);
            }
            metadata.forEach(h5::attribute);
        }
    }
}
