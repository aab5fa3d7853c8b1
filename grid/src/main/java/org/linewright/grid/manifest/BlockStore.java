package org.linewright.grid.manifest;

import java.util.zip.Deflater;
import java.util.zip.DeflaterOutputStream;
import java.util.zip.InflaterInputStream;
import org.linewright.grid.engine.exact.FixedPointSums;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import org.linewright.ingest.atomic.AtomicFile;
import org.linewright.grid.table.BlockResult;
import org.linewright.ingest.InputException;

/**
 * The computed blocks of a table build, one file per block in {@code WORK/blocks/}, named by the block's input
 * hash ({@code <hash>.blk}): a block whose inputs did not change is found again under the same name, whatever
 * else changed. A file is written under a temporary name and renamed, so a file under its final name is complete
 * when the build process stops (an interrupted build resumes from the blocks it finished); block files are not
 * forced to disk one by one, so after an operating-system crash a damaged block is reported when loaded.
 *
 * <p>File layout (big-endian, {@link DataOutputStream}): the magic {@code LWBLK002}, the point count n, lines used,
 * lines below threshold, the error estimate, the number of named counts and each as (UTF name, long), the number
 * of warnings and each as UTF text, then n float64 σ values (so the counts can be read without σ).
 */
public final class BlockStore {
    private static final long MAGIC = 0x4C57424C4B303032L; // "LWBLK002"
    private static final String SUFFIX = ".blk";
    /** Exact sums of a block, beside its file: magic {@code LWSUM001}, then {@link FixedPointSums#write}, deflated. */
    private static final String SUMS_SUFFIX = ".sum";
    private static final long SUMS_MAGIC = 0x4C5753554D303031L; // "LWSUM001"

    private final Path dir;

    /** A block store in {@code workDir/blocks} (created when missing). */
    public BlockStore(Path workDir) throws IOException {
        this.dir = workDir.resolve("blocks");
        Files.createDirectories(dir);
    }

    /** True when the block of this hash is complete on disk. */
    public boolean has(String hash) {
        return Files.isRegularFile(file(hash));
    }

    /** Saves a block atomically. */
    public void save(String hash, BlockResult result) throws IOException {
        if (result.exactSumsOrNull() != null) {
            // first: a block file under its final name then always has its sums beside it
            saveSums(hash, result.exactSumsOrNull());
        }
        Path tmp = AtomicFile.temporaryFor(file(hash));
        try {
            try (OutputStream os = Files.newOutputStream(tmp);
                 DataOutputStream out = new DataOutputStream(new BufferedOutputStream(os, 1 << 16))) {
                out.writeLong(MAGIC);
                double[] s = result.sigmaCm2PerMolecule();
                out.writeInt(s.length);
                out.writeLong(result.linesUsed());
                out.writeLong(result.linesBelowThreshold());
                out.writeDouble(result.estimatedRelativeError());
                out.writeInt(result.counts().size());
                for (Map.Entry<String, Long> e : result.counts().entrySet()) {
                    out.writeUTF(e.getKey());
                    out.writeLong(e.getValue());
                }
                out.writeInt(result.warnings().size());
                for (String w : result.warnings()) {
                    out.writeUTF(w);
                }
                java.nio.ByteBuffer bytes = java.nio.ByteBuffer.allocate(8 * s.length); // big-endian, as DataOutput
                bytes.asDoubleBuffer().put(s);
                out.write(bytes.array());
            }
            // No fsync per block (it would cost more than computing a small block): a stopped build keeps every
            // renamed block; after an operating-system crash a damaged block is reported by load().
            AtomicFile.commitWithoutSync(tmp, file(hash));
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /**
     * The exact sums saved with a block, or null when there are none (an engine without them, or the file was
     * deleted: then a rebuild recomputes the block instead of updating it).
     */
    public FixedPointSums loadSums(String hash) throws IOException {
        Path f = sumsFile(hash);
        if (!Files.isRegularFile(f)) {
            return null;
        }
        try (InputStream is = Files.newInputStream(f);
             DataInputStream in = new DataInputStream(new BufferedInputStream(new InflaterInputStream(is), 1 << 16))) {
            if (in.readLong() != SUMS_MAGIC) {
                throw new InputException(f + ": not a sums file of this version (delete it to recompute the block)");
            }
            return FixedPointSums.read(in);
        } catch (java.io.EOFException | java.util.zip.ZipException e) {
            throw new InputException(f + ": damaged sums file (delete it to recompute the block)");
        }
    }

    /** True when the block of this hash has exact sums on disk. */
    public boolean hasSums(String hash) {
        return Files.isRegularFile(sumsFile(hash));
    }

    private void saveSums(String hash, FixedPointSums sums) throws IOException {
        Path tmp = AtomicFile.temporaryFor(sumsFile(hash));
        try {
            try (OutputStream os = Files.newOutputStream(tmp);
                 DataOutputStream out = new DataOutputStream(new BufferedOutputStream(
                         new DeflaterOutputStream(os, new Deflater(Deflater.BEST_SPEED), 1 << 16), 1 << 16))) {
                out.writeLong(SUMS_MAGIC);
                sums.write(out);
            }
            AtomicFile.commitWithoutSync(tmp, sumsFile(hash));
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /** Loads a block. */
    public BlockResult load(String hash) throws IOException {
        return read(hash, true);
    }

    /** Loads a block's counts without its σ (an empty array stands in for it). */
    public BlockResult loadSummary(String hash) throws IOException {
        return read(hash, false);
    }

    private BlockResult read(String hash, boolean withSigma) throws IOException {
        Path f = file(hash);
        try (InputStream is = Files.newInputStream(f);
             DataInputStream in = new DataInputStream(new BufferedInputStream(is, withSigma ? 1 << 16 : 4096))) {
            if (in.readLong() != MAGIC) {
                throw new InputException(f + ": not a block file of this version (delete the work folder to rebuild)");
            }
            int points = in.readInt();
            long used = in.readLong();
            long below = in.readLong();
            double error = in.readDouble();
            int n = in.readInt();
            Map<String, Long> counts = new LinkedHashMap<>();
            for (int i = 0; i < n; i++) {
                counts.put(in.readUTF(), in.readLong());
            }
            int nw = in.readInt();
            java.util.List<String> warnings = new java.util.ArrayList<>();
            for (int i = 0; i < nw; i++) {
                warnings.add(in.readUTF());
            }
            double[] s = new double[withSigma ? points : 0];
            if (withSigma) {
                byte[] bytes = in.readNBytes(8 * points);
                if (bytes.length != 8 * points) {
                    throw new InputException(f + ": truncated block file (delete it to recompute the block)");
                }
                java.nio.ByteBuffer.wrap(bytes).asDoubleBuffer().get(s);
            }
            return new BlockResult(s, used, below, counts, error, warnings);
        }
    }

    /** Deletes block files (and leftover temporary files) whose hash is not in {@code keep}. */
    public int prune(Set<String> keep) throws IOException {
        int removed = 0;
        try (DirectoryStream<Path> files = Files.newDirectoryStream(dir)) {
            for (Path f : files) {
                String name = f.getFileName().toString();
                String hash = name.endsWith(SUFFIX) ? name.substring(0, name.length() - SUFFIX.length())
                        : name.endsWith(SUMS_SUFFIX) ? name.substring(0, name.length() - SUMS_SUFFIX.length()) : null;
                if (name.startsWith(AtomicFile.PARTIAL) || hash != null && !keep.contains(hash)) {
                    Files.deleteIfExists(f);
                    removed++;
                }
            }
        }
        return removed;
    }

    private Path sumsFile(String hash) {
        return dir.resolve(hash + SUMS_SUFFIX);
    }

    private Path file(String hash) {
        return dir.resolve(hash + SUFFIX);
    }
}
