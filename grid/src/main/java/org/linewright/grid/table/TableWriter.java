package org.linewright.grid.table;

import java.io.IOException;
import java.io.BufferedOutputStream;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.nio.channels.Channels;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.FieldVector;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;
import org.linewright.grid.hdf5.Compression;
import org.linewright.grid.hdf5.ElementType;
import org.linewright.grid.hdf5.Hdf5Dimension;
import org.linewright.grid.hdf5.Hdf5Variable;
import org.linewright.grid.hdf5.Hdf5Writer;
import org.linewright.grid.plan.TablePlan;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Writes cross-section tables as Arrow IPC or HDF5 (see {@code docs/table-format.md}). Every write goes to a
 * temporary file in the target folder that is forced to disk and renamed over the target when complete; then
 * the sidecar {@code TABLE.sha256} (one line {@code <hex>  <file name>}, the form {@code sha256sum -c} checks)
 * is written the same way. σ's own checksum ({@link SigmaDigest}) goes into the metadata as {@code sigma_sha256}.
 */
public final class TableWriter {
    /** Prefix of linewright's keys in Arrow schema metadata. */
    public static final String ARROW_KEY_PREFIX = "linewright.";
    /** Tables up to this many bytes of σ (as float64) are held in memory between the checksum and write passes. */
    public static final long CACHE_BYTES = 256L << 20;
    /** σ's HDF5 chunks span this many wavenumber points of one (p, T) (128 KiB of float64 before compression). */
    public static final int HDF5_CHUNK_POINTS = 16384;
    /** Metadata key of σ's checksum. */
    public static final String KEY_SIGMA_SHA256 = "sigma_sha256";

    private TableWriter() {
    }

    /**
     * What was written.
     *
     * @param file         the table file
     * @param fileSha256   SHA-256 of the file's bytes (also in the sidecar)
     * @param sigmaSha256  σ's checksum (also in the metadata)
     */
    public record Written(Path file, String fileSha256, String sigmaSha256) {
    }

    /** Writes {@code content} to {@code file}, format by extension, atomically; then the sidecar checksum. */
    public static Written write(Path file, TableContent content) throws IOException {
        TableFormat format = TableFormat.of(file);
        Path dir = file.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        // First pass: σ's checksum, so it can be part of metadata written before σ itself. Rows are kept for the
        // second pass when the whole table fits in CACHE_BYTES (else they are asked for again).
        int np = content.pressureBar().length;
        int nt = content.temperatureK().length;
        boolean cache = (long) np * nt * content.wavenumberCm1().length * Double.BYTES <= CACHE_BYTES;
        double[][][] rows = cache ? new double[np][nt][] : null;
        SigmaDigest digest = new SigmaDigest(content.precision());
        for (int p = 0; p < np; p++) {
            for (int t = 0; t < nt; t++) {
                double[] s = content.sigma().sigma(p, t);
                check(content, s);
                digest.update(s);
                if (cache) {
                    rows[p][t] = s;
                }
            }
        }
        String sigmaSha256 = digest.hex();
        SigmaSource sigma = cache ? (p, t) -> rows[p][t] : content.sigma();
        content = new TableContent(content.wavenumberCm1(), content.pressureBar(), content.temperatureK(), sigma,
                content.precision(), content.metadata());
        Map<String, String> metadata = new LinkedHashMap<>();
        metadata.put("table_format", TableFormat.FORMAT_VERSION);
        metadata.put("sigma_precision", content.precision().id());
        metadata.putAll(content.metadata());
        metadata.put(KEY_SIGMA_SHA256, sigmaSha256);
        Path tmp = AtomicFile.temporaryFor(file);
        String fileSha256;
        try {
            if (format == TableFormat.ARROW) {
                fileSha256 = writeArrow(tmp, content, metadata);
            } else {
                writeHdf5(tmp, content, metadata);
                fileSha256 = SourceMetadata.sha256(tmp);
            }
            AtomicFile.commit(tmp, file);
        } finally {
            Files.deleteIfExists(tmp);
        }
        Path sidecar = sidecar(file);
        Path tmpSidecar = AtomicFile.temporaryFor(sidecar);
        try {
            Files.writeString(tmpSidecar, fileSha256 + "  " + file.getFileName() + "\n", StandardCharsets.UTF_8);
            AtomicFile.commit(tmpSidecar, sidecar);
        } finally {
            Files.deleteIfExists(tmpSidecar);
        }
        return new Written(file, fileSha256, sigmaSha256);
    }

    /** The checksum sidecar of a table file: {@code TABLE.sha256} beside it. */
    public static Path sidecar(Path table) {
        return table.resolveSibling(table.getFileName() + ".sha256");
    }

    private static void check(TableContent content, double[] s) {
        if (s.length != content.wavenumberCm1().length) {
            throw new IllegalArgumentException("σ row of " + s.length + " values for a grid of "
                    + content.wavenumberCm1().length);
        }
    }

    private static Field field(String name, ArrowType type, String unit) {
        return new Field(name, new FieldType(false, type, null, Map.of("unit", unit)), null);
    }

    /** Writes the Arrow file and returns the SHA-256 of its bytes, computed as they are written. */
    private static String writeArrow(Path tmp, TableContent content, Map<String, String> metadata) throws IOException {
        ArrowType f64 = new ArrowType.FloatingPoint(FloatingPointPrecision.DOUBLE);
        ArrowType sigmaType = content.precision() == TablePlan.Precision.FLOAT32
                ? new ArrowType.FloatingPoint(FloatingPointPrecision.SINGLE) : f64;
        Map<String, String> schemaMeta = new LinkedHashMap<>();
        metadata.forEach((k, v) -> schemaMeta.put(ARROW_KEY_PREFIX + k, v));
        Schema schema = new Schema(List.of(
                field(TableFormat.PRESSURE, f64, TableFormat.UNIT_PRESSURE),
                field(TableFormat.TEMPERATURE, f64, TableFormat.UNIT_TEMPERATURE),
                field(TableFormat.WAVENUMBER, f64, TableFormat.UNIT_WAVENUMBER),
                field(TableFormat.SIGMA, sigmaType, TableFormat.UNIT_SIGMA)), schemaMeta);
        double[] nu = content.wavenumberCm1();
        int n = nu.length;
        try (BufferAllocator allocator = new RootAllocator();
             VectorSchemaRoot root = VectorSchemaRoot.create(schema, allocator);
             DigestOutputStream out = new DigestOutputStream(new BufferedOutputStream(Files.newOutputStream(tmp), 1 << 20),
                     sha256());
             ArrowFileWriter writer = new ArrowFileWriter(root, null, Channels.newChannel(out))) {
            writer.start();
            Float8Vector pv = (Float8Vector) root.getVector(0);
            Float8Vector tv = (Float8Vector) root.getVector(1);
            Float8Vector wv = (Float8Vector) root.getVector(2);
            FieldVector sv = root.getVector(3);
            for (int p = 0; p < content.pressureBar().length; p++) {
                for (int t = 0; t < content.temperatureK().length; t++) {
                    double[] s = content.sigma().sigma(p, t);
                    check(content, s);
                    pv.allocateNew(n);
                    tv.allocateNew(n);
                    wv.allocateNew(n);
                    ((org.apache.arrow.vector.BaseFixedWidthVector) sv).allocateNew(n);
                    for (int i = 0; i < n; i++) {
                        pv.set(i, content.pressureBar()[p]);
                        tv.set(i, content.temperatureK()[t]);
                        wv.set(i, nu[i]);
                    }
                    if (sv instanceof Float4Vector f4) {
                        for (int i = 0; i < n; i++) {
                            f4.set(i, (float) s[i]);
                        }
                    } else {
                        Float8Vector f8 = (Float8Vector) sv;
                        for (int i = 0; i < n; i++) {
                            f8.set(i, s[i]);
                        }
                    }
                    root.setRowCount(n);
                    writer.writeBatch();
                }
            }
            writer.end();
            out.flush();
            return HexFormat.of().formatHex(out.getMessageDigest().digest());
        }
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    /**
     * Writes the HDF5 file: the axes as dimension coordinates and σ chunked by (1, 1, {@link #HDF5_CHUNK_POINTS})
     * points of (p, T, ν), shuffled and deflated, one (p, T) row at a time as the source hands them over.
     */
    private static void writeHdf5(Path tmp, TableContent content, Map<String, String> metadata) throws IOException {
        double[] nu = content.wavenumberCm1();
        try (Hdf5Writer h5 = Hdf5Writer.create(tmp)) {
            Hdf5Dimension p = h5.coordinate(TableFormat.PRESSURE, content.pressureBar(),
                    Map.of(Hdf5Writer.UNITS, TableFormat.UNIT_PRESSURE));
            Hdf5Dimension t = h5.coordinate(TableFormat.TEMPERATURE, content.temperatureK(),
                    Map.of(Hdf5Writer.UNITS, TableFormat.UNIT_TEMPERATURE));
            Hdf5Dimension w = h5.coordinate(TableFormat.WAVENUMBER, nu,
                    Map.of(Hdf5Writer.UNITS, TableFormat.UNIT_WAVENUMBER));
            ElementType type = content.precision() == TablePlan.Precision.FLOAT32 ? ElementType.FLOAT32
                    : ElementType.FLOAT64;
            int block = Math.max(1, Math.min(nu.length, HDF5_CHUNK_POINTS));
            Hdf5Variable sigma = h5.variable(TableFormat.SIGMA, type, List.of(p, t, w), new int[] {1, 1, block},
                    Compression.DEFAULT, Map.of(Hdf5Writer.UNITS, TableFormat.UNIT_SIGMA));
            metadata.forEach(h5::attribute);
            for (int i = 0; i < content.pressureBar().length; i++) {
                for (int j = 0; j < content.temperatureK().length; j++) {
                    double[] s = content.sigma().sigma(i, j);
                    check(content, s);
                    for (int b = 0; b < sigma.chunksAlong(2); b++) {
                        sigma.writeChunk(new long[] {i, j, b}, s, b * block);
                    }
                }
            }
        }
    }
}
