package org.linewright.grid.ktable;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.linewright.grid.table.TableFormat;
import org.linewright.grid.table.TableWriter;
import org.linewright.ingest.atomic.AtomicFile;
import org.linewright.ingest.store.SourceMetadata;

/**
 * Writes a k-table as HDF5 ({@link Hdf5KTableWriter}) or Arrow IPC ({@link ArrowKTableWriter}), by extension, under a
 * temporary name renamed when complete, then the {@code KTABLE.sha256} sidecar the way σ tables have one.
 */
public final class KTableWriter {
    private KTableWriter() {
    }

    /** What was written: the file and the SHA-256 of its bytes. */
    public record Written(Path file, String fileSha256) {
    }

    public static Written write(Path file, KTableContent content) throws IOException {
        TableFormat format = TableFormat.of(file);
        Path dir = file.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = AtomicFile.temporaryFor(file);
        String sha;
        try {
            if (format == TableFormat.ARROW) {
                ArrowKTableWriter.write(tmp, content);
            } else {
                Files.delete(tmp); // jHDF creates its file itself
                Hdf5KTableWriter.write(tmp, content);
            }
            sha = SourceMetadata.sha256(tmp);
            AtomicFile.commit(tmp, file);
        } finally {
            Files.deleteIfExists(tmp);
        }
        Path sidecar = TableWriter.sidecar(file);
        Path tmpSidecar = AtomicFile.temporaryFor(sidecar);
        try {
            Files.writeString(tmpSidecar, sha + "  " + file.getFileName() + "\n", StandardCharsets.UTF_8);
            AtomicFile.commit(tmpSidecar, sidecar);
        } finally {
            Files.deleteIfExists(tmpSidecar);
        }
        return new Written(file, sha);
    }
}
