package org.linewright.grid.output;

import java.nio.file.Path;
import java.util.Map;
import io.jhdf.HdfFile;
import io.jhdf.WritableHdfFile;
import io.jhdf.api.WritableDataset;

/**
 * HDF5 file of one cross section, written with jHDF: float64 datasets {@code /wavenumber_cm1} and
 * {@code /cross_section_cm2_per_molecule}, each with a string attribute {@code unit}; the computation's
 * parameters as string attributes of the root group.
 */
final class Hdf5CrossSectionWriter {

    private Hdf5CrossSectionWriter() {
    }

    static void write(Path file, double[] wavenumberCm1, double[] sigma, Map<String, String> metadata) {
        try (WritableHdfFile hdf = HdfFile.write(file)) {
            WritableDataset nu = hdf.putDataset(CrossSectionFiles.WAVENUMBER_NAME, wavenumberCm1);
            nu.putAttribute(CrossSectionFiles.UNIT_KEY, CrossSectionFiles.WAVENUMBER_UNIT);
            WritableDataset xs = hdf.putDataset(CrossSectionFiles.SIGMA_NAME, sigma);
            xs.putAttribute(CrossSectionFiles.UNIT_KEY, CrossSectionFiles.SIGMA_UNIT);
            for (Map.Entry<String, String> e : metadata.entrySet()) {
                hdf.putAttribute(e.getKey(), e.getValue());
            }
        }
    }
}
