package org.linewright.grid.output;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Writes one cross section σ(ν) to a file in any {@link CrossSectionFormat}. Every writer writes a temporary
 * file ({@code .partial-<name>}) beside the target and renames it when complete, so a reader never sees a
 * half-written file and an interrupted write leaves the previous file intact.
 */
public final class CrossSectionFiles {
    /** Column / dataset name of the wavenumbers. */
    public static final String WAVENUMBER_NAME = "wavenumber_cm1";
    /** Column / dataset name of the cross sections. */
    public static final String SIGMA_NAME = "cross_section_cm2_per_molecule";
    /** Unit of {@link #WAVENUMBER_NAME}. */
    public static final String WAVENUMBER_UNIT = "cm-1";
    /** Unit of {@link #SIGMA_NAME}. */
    public static final String SIGMA_UNIT = "cm2/molecule";
    /** Metadata key of a column's unit (Arrow field metadata, HDF5 dataset attribute). */
    public static final String UNIT_KEY = "unit";

    private CrossSectionFiles() {
    }

    /**
     * @param out      target file
     * @param format   file format
     * @param grid     the wavenumber grid of σ
     * @param sigma    σ in cm²/molecule, one value per grid point
     * @param metadata parameters of the computation, written as file metadata (not in CSV)
     */
    public static void write(Path out, CrossSectionFormat format, WavenumberGrid grid, double[] sigma,
                             Map<String, String> metadata) throws IOException {
        if (sigma.length != grid.size()) {
            throw new IllegalArgumentException("sigma has " + sigma.length + " values, the grid " + grid.size());
        }
        Path target = out.toAbsolutePath();
        Path dir = target.getParent();
        if (dir != null) {
            Files.createDirectories(dir);
        }
        Path partial = AtomicFile.temporaryPathFor(target);
        try {
            switch (format) {
                case CSV -> CsvCrossSectionWriter.write(partial, grid.pointsCm1(), sigma);
                case ARROW -> ArrowCrossSectionWriter.write(partial, grid.pointsCm1(), sigma, metadata);
                case HDF5 -> Hdf5CrossSectionWriter.write(partial, grid.pointsCm1(), sigma, metadata);
                default -> throw new AssertionError(format);
            }
            AtomicFile.commit(partial, target);
        } finally {
            Files.deleteIfExists(partial);
        }
    }
}
