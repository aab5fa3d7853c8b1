package org.linewright.ingest.source;

import java.io.BufferedInputStream;
import java.io.Closeable;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InterruptedIOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Enumeration;
import java.util.HexFormat;
import java.util.Locale;
import org.apache.commons.compress.archivers.zip.ZipArchiveEntry;
import org.apache.commons.compress.archivers.zip.ZipArchiveInputStream;
import org.apache.commons.compress.archivers.zip.ZipFile;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorInputStream;
import org.apache.commons.compress.compressors.gzip.GzipCompressorInputStream;
import org.apache.commons.compress.compressors.xz.XZCompressorInputStream;
import org.apache.commons.compress.compressors.zstandard.ZstdCompressorInputStream;

/**
 * One input file opened for reading: its decompressed bytes as a stream, the compression found by magic
 * bytes, and the SHA-256 of the raw (compressed) file bytes computed while they stream past.
 *
 * <p>Compressions: gzip ({@code 1F 8B}, concatenated members allowed), bzip2 ({@code BZh}), xz
 * ({@code FD 37 7A 58 5A 00}), Zstandard ({@code 28 B5 2F FD}) and zip ({@code PK 03 04}, exactly one file
 * entry), all through Apache Commons Compress; bzip2 and xz are decompressed on a read-ahead thread. A file
 * name ending in a compression suffix whose content lacks that magic is an error, as are an empty file,
 * truncated or corrupt compressed data ({@link LineFormatException#ofFile}, never a silent short read).
 */
public final class SourceInput implements Closeable {
    /** Compression of a source file. */
    public enum Compression {
        NONE("none", ""), GZIP("gzip", ".gz"), BZIP2("bzip2", ".bz2"), XZ("xz", ".xz"), ZSTD("zstd", ".zst"),
        ZIP("zip", ".zip");

        private final String id;
        private final String suffix;

        Compression(String id, String suffix) {
            this.id = id;
            this.suffix = suffix;
        }

        /** Short name, e.g. {@code gzip}. */
        public String id() {
            return id;
        }

        /** The usual file-name suffix, empty for none. */
        public String suffix() {
            return suffix;
        }

        /** The compression a file name's suffix announces (also {@code .gzip}, {@code .bzip2}, {@code .zstd}). */
        public static Compression bySuffix(String fileName) {
            String n = fileName.toLowerCase(Locale.ROOT);
            if (n.endsWith(".gz") || n.endsWith(".gzip")) {
                return GZIP;
            }
            if (n.endsWith(".bz2") || n.endsWith(".bzip2")) {
                return BZIP2;
            }
            if (n.endsWith(".xz")) {
                return XZ;
            }
            if (n.endsWith(".zst") || n.endsWith(".zstd")) {
                return ZSTD;
            }
            if (n.endsWith(".zip")) {
                return ZIP;
            }
            return NONE;
        }
    }

    private static final int RAW_BUFFER_BYTES = 1 << 16;
    private static final int MAGIC_BYTES = 6;

    private final String fileName;
    private final Compression compression;
    private final HashingInputStream raw;
    private final InputStream decompressed;
    private String sha256Hex;

    private SourceInput(String fileName, Compression compression, HashingInputStream raw, InputStream decompressed) {
        this.fileName = fileName;
        this.compression = compression;
        this.raw = raw;
        this.decompressed = decompressed;
    }

    /**
     * Opens {@code path}, detecting its compression from its first bytes.
     *
     * @throws LineFormatException when the file is empty, its name promises a compression its content lacks,
     *                             or a zip archive does not hold exactly one file
     */
    public static SourceInput open(Path path) throws IOException {
        String name = path.toString();
        long size;
        try {
            size = Files.size(path);
        } catch (NoSuchFileException e) {
            throw LineFormatException.ofFile(name, "no such file", e);
        }
        if (size == 0) {
            throw LineFormatException.ofFile(name, "the file is empty (0 bytes)", null);
        }
        HashingInputStream raw = new HashingInputStream(Files.newInputStream(path));
        BufferedInputStream buffered = new BufferedInputStream(raw, RAW_BUFFER_BYTES);
        boolean ok = false;
        Compression found = Compression.NONE;
        try {
            byte[] magic = new byte[MAGIC_BYTES];
            buffered.mark(MAGIC_BYTES);
            int n = buffered.readNBytes(magic, 0, MAGIC_BYTES);
            buffered.reset();
            found = byMagic(magic, n);
            Compression named = Compression.bySuffix(path.getFileName().toString());
            if (named != Compression.NONE && named != found) {
                throw LineFormatException.ofFile(name, "the name says " + named.id() + " but the content does not start with "
                        + named.id() + " magic bytes (first bytes " + hex(magic, n) + ")", null);
            }
            InputStream stream;
            switch (found) {
                case GZIP:
                    stream = GzipCompressorInputStream.builder().setInputStream(buffered)
                            .setDecompressConcatenated(true).get();
                    break;
                case BZIP2:
                    stream = new ReadAheadInputStream(new BZip2CompressorInputStream(buffered, true), "bzip2 " + name);
                    break;
                case XZ:
                    stream = new ReadAheadInputStream(XZCompressorInputStream.builder().setInputStream(buffered).setDecompressConcatenated(true).get(), "xz " + name);
                    break;
                case ZSTD:
                    stream = new ZstdCompressorInputStream(buffered);
                    break;
                case ZIP:
                    stream = openSingleZipEntry(path, name, buffered);
                    break;
                default:
                    stream = buffered;
            }
            ok = true;
            return new SourceInput(name, found, raw, new CheckedInputStream(stream, name, found));
        } catch (IOException e) {
            if (found == Compression.NONE) {
                throw e;
            }
            // decompressors read their first block on construction: a bad start shows up here
            throw LineFormatException.ofFile(name, "corrupt or truncated " + found.id() + " data ("
                    + e.getMessage() + ")", e);
        } finally {
            if (!ok) {
                buffered.close();
            }
        }
    }

    /** A {@link StreamOpener}: the decompressed bytes of {@code path} (use as {@code SourceInput::openStream}). */
    public static InputStream openStream(Path path) throws IOException {
        return open(path).stream();
    }

    private static InputStream openSingleZipEntry(Path path, String name, InputStream buffered) throws IOException {
        int files = 0;
        try (ZipFile zip = ZipFile.builder().setPath(path).get()) {
            for (Enumeration<ZipArchiveEntry> e = zip.getEntries(); e.hasMoreElements(); ) {
                if (!e.nextElement().isDirectory()) {
                    files++;
                }
            }
        }
        if (files != 1) {
            throw LineFormatException.ofFile(name, "the zip archive holds " + files
                    + " files (expected exactly one; unpack it and name the file to read)", null);
        }
        ZipArchiveInputStream zip = new ZipArchiveInputStream(buffered);
        ZipArchiveEntry entry;
        while ((entry = zip.getNextEntry()) != null && entry.isDirectory()) {
            // directories carry no data
        }
        if (entry == null) {
            throw LineFormatException.ofFile(name, "the zip archive holds no file entry", null);
        }
        return zip;
    }

    static Compression byMagic(byte[] m, int n) {
        if (n >= 2 && (m[0] & 0xff) == 0x1f && (m[1] & 0xff) == 0x8b) {
            return Compression.GZIP;
        }
        if (n >= 3 && m[0] == 'B' && m[1] == 'Z' && m[2] == 'h') {
            return Compression.BZIP2;
        }
        if (n >= 6 && (m[0] & 0xff) == 0xfd && m[1] == '7' && m[2] == 'z' && m[3] == 'X' && m[4] == 'Z' && m[5] == 0) {
            return Compression.XZ;
        }
        if (n >= 4 && (m[0] & 0xff) == 0x28 && (m[1] & 0xff) == 0xb5 && (m[2] & 0xff) == 0x2f && (m[3] & 0xff) == 0xfd) {
            return Compression.ZSTD;
        }
        if (n >= 4 && m[0] == 'P' && m[1] == 'K' && ((m[2] == 3 && m[3] == 4) || (m[2] == 5 && m[3] == 6))) {
            return Compression.ZIP;
        }
        return Compression.NONE;
    }

    private static String hex(byte[] bytes, int n) {
        return HexFormat.ofDelimiter(" ").formatHex(bytes, 0, n);
    }

    /** The decompressed bytes. Failures of the decompressor surface as {@link LineFormatException}. */
    public InputStream stream() {
        return decompressed;
    }

    public Compression compression() {
        return compression;
    }

    /** The file name as given, for messages. */
    public String fileName() {
        return fileName;
    }

    /** True once {@link #stream()} has been read to its end (the SHA-256 is then available). */
    public boolean readToEnd() {
        return ((CheckedInputStream) decompressed).atEnd;
    }

    /**
     * SHA-256 of the raw file bytes, lower-case hex. Valid once {@link #stream()} has been read to its end:
     * bytes the decompressor left unread (trailers, a zip central directory) are read and hashed here.
     *
     * @throws IllegalStateException when the decompressed stream has not been read to its end
     */
    public String sha256Hex() {
        if (sha256Hex == null) {
            if (!readToEnd()) {
                throw new IllegalStateException(fileName + ": the SHA-256 is known only after the whole file was read");
            }
            try {
                raw.drain();
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(fileName + ": cannot finish reading for the SHA-256", e);
            }
            sha256Hex = HexFormat.of().formatHex(raw.digest.digest());
        }
        return sha256Hex;
    }

    @Override
    public void close() throws IOException {
        decompressed.close();
    }

    /** Counts raw bytes into a SHA-256 digest as they are read. */
    private static final class HashingInputStream extends FilterInputStream {
        final MessageDigest digest;
        private boolean drained;

        HashingInputStream(InputStream in) {
            super(in);
            try {
                digest = MessageDigest.getInstance("SHA-256");
            } catch (NoSuchAlgorithmException e) {
                throw new IllegalStateException("SHA-256 is required of every Java platform", e);
            }
        }

        @Override
        public int read() throws IOException {
            int b = in.read();
            if (b >= 0) {
                digest.update((byte) b);
            }
            return b;
        }

        @Override
        public int read(byte[] b, int off, int len) throws IOException {
            int n = in.read(b, off, len);
            if (n > 0) {
                digest.update(b, off, n);
            }
            return n;
        }

        @Override
        public long skip(long n) throws IOException {
            // skipped bytes must still be hashed
            byte[] scratch = new byte[(int) Math.min(8192, Math.max(1, n))];
            long done = 0;
            while (done < n) {
                int r = read(scratch, 0, (int) Math.min(scratch.length, n - done));
                if (r < 0) {
                    break;
                }
                done += r;
            }
            return done;
        }

        @Override
        public boolean markSupported() {
            return false;
        }

        void drain() throws IOException {
            if (drained) {
                return;
            }
            byte[] scratch = new byte[RAW_BUFFER_BYTES];
            while (read(scratch, 0, scratch.length) >= 0) {
                // hashing happens in read
            }
            drained = true;
        }
    }

    /** Turns decompressor failures into one-line located errors and records that the end was reached. */
    private static final class CheckedInputStream extends FilterInputStream {
        private final String name;
        private final Compression compression;
        volatile boolean atEnd;
        private RuntimeException failed;

        CheckedInputStream(InputStream in, String name, Compression compression) {
            super(in);
            this.name = name;
            this.compression = compression;
        }

        @Override
        public int read() throws IOException {
            rethrowEarlierFailure();
            try {
                int b = in.read();
                if (b < 0) {
                    atEnd = true;
                }
                return b;
            } catch (InterruptedIOException e) {
                throw e;
            } catch (IOException | RuntimeException e) {
                throw failure(e);
            }
        }

        @Override
        public int read(byte[] b, int off, int len) throws IOException {
            rethrowEarlierFailure();
            try {
                int n = in.read(b, off, len);
                if (n < 0) {
                    atEnd = true;
                }
                return n;
            } catch (InterruptedIOException e) {
                throw e;
            } catch (IOException | RuntimeException e) {
                throw failure(e);
            }
        }

        private RuntimeException failure(Exception e) {
            if (failed == null) {
                failed = describe(e);
            }
            return failed;
        }

        private void rethrowEarlierFailure() {
            if (failed != null) {
                throw failed; // again on every read: never a short read after a failure
            }
        }

        private RuntimeException describe(Exception e) {
            if (e instanceof LineFormatException) {
                return (LineFormatException) e;
            }
            if (compression == Compression.NONE) {
                return new java.io.UncheckedIOException(name + ": read error: " + e.getMessage(),
                        e instanceof IOException ? (IOException) e : new IOException(e));
            }
            return LineFormatException.ofFile(name, "corrupt or truncated " + compression.id() + " data ("
                    + e.getMessage() + ")", e);
        }
    }
}
