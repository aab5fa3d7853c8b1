package org.linewright.ingest.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.Arrays;
import java.util.HexFormat;
import org.apache.commons.compress.archivers.zip.ZipArchiveEntry;
import org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorOutputStream;
import org.apache.commons.compress.compressors.gzip.GzipCompressorOutputStream;
import org.apache.commons.compress.compressors.xz.XZCompressorOutputStream;
import org.apache.commons.compress.compressors.zstandard.ZstdCompressorOutputStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.ingest.hitran.HitranRecordReader;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.ingest.testsupport.SampleIsotopologues;

/** Compressed copies of a real sample are made here with Commons Compress; SHA-256 reference: the JDK's MessageDigest. */
class LineSourcesTest {
    private static final ReadOptions STRICT = ReadOptions.strict(new SampleIsotopologues());
    @TempDir
    static Path tmp;
    static byte[] plain;
    static double plainSum;

    @BeforeAll
    static void readPlain() throws IOException {
        plain = Files.readAllBytes(ReferenceSamples.hitranSample("sample_CO.par"));
        plainSum = wavenumberSum(new HitranRecordReader(new java.io.ByteArrayInputStream(plain), "p", STRICT));
    }

    static double wavenumberSum(LineReader r) throws IOException {
        LineBatch b = new LineBatch(1024);
        double sum = 0;
        while (r.read(b)) {
            for (int i = 0; i < b.size; i++) {
                sum += b.wavenumberCm1[i];
            }
        }
        return sum;
    }

    static byte[] compress(String kind, byte[] data) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        switch (kind) {
            case "gzip":
                try (OutputStream o = new GzipCompressorOutputStream(bytes)) {
                    o.write(data);
                }
                break;
            case "bzip2":
                try (OutputStream o = new BZip2CompressorOutputStream(bytes)) {
                    o.write(data);
                }
                break;
            case "xz":
                try (OutputStream o = new XZCompressorOutputStream(bytes)) {
                    o.write(data);
                }
                break;
            case "zstd":
                try (OutputStream o = new ZstdCompressorOutputStream(bytes)) {
                    o.write(data);
                }
                break;
            case "zip":
                try (ZipArchiveOutputStream z = new ZipArchiveOutputStream(bytes)) {
                    z.putArchiveEntry(new ZipArchiveEntry("sample_CO.par"));
                    z.write(data);
                    z.closeArchiveEntry();
                }
                break;
            default:
                return data;
        }
        return bytes.toByteArray();
    }

    static String sha256(byte[] data) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(data));
    }

    @ParameterizedTest
    @CsvSource({"none,.par", "gzip,.par.gz", "bzip2,.par.bz2", "xz,.par.xz", "zstd,.par.zst", "zip,.zip", "gzip,.bin"})
    void everyCompressionGivesTheSameRecordsAndTheRawSha256(String kind, String suffix) throws Exception {
        byte[] raw = compress(kind, plain);
        Path p = tmp.resolve("co-" + kind + suffix);
        Files.write(p, raw);
        try (OpenedSource s = LineSources.open(p, null, STRICT)) {
            assertEquals(LineFormat.HITRAN160, s.format());
            assertEquals(kind, s.compression());
            assertEquals(plainSum, wavenumberSum(s.reader()));
            assertEquals(5381, s.reader().recordsRead(), "README table: 5381 CO records");
            assertEquals(sha256(raw), s.sha256Hex().get());
            assertEquals(p.toString(), s.fileName());
        }
    }

    /** A gzip file of several members (RFC 1952 §2.2: members follow one another) reads as their concatenation. */
    @Test
    void concatenatedGzipMembersAreOneStream() throws Exception {
        int half = 161 * 2000;
        byte[] first = compress("gzip", Arrays.copyOf(plain, half));
        byte[] second = compress("gzip", Arrays.copyOfRange(plain, half, plain.length));
        byte[] both = Arrays.copyOf(first, first.length + second.length);
        System.arraycopy(second, 0, both, first.length, second.length);
        Path p = tmp.resolve("members.par.gz");
        Files.write(p, both);
        try (OpenedSource s = LineSources.open(p, null, STRICT)) {
            assertEquals(plainSum, wavenumberSum(s.reader()));
            assertEquals(sha256(both), s.sha256Hex().get());
        }
    }

    @Test
    void sha256IsRefusedBeforeTheEnd() throws IOException {
        Path p = tmp.resolve("early.par");
        Files.write(p, plain);
        try (OpenedSource s = LineSources.open(p, LineFormat.HITRAN160, STRICT)) {
            assertThrows(IllegalStateException.class, () -> s.sha256Hex().get());
        }
    }

    @ParameterizedTest
    @CsvSource({"gzip,.gz", "bzip2,.bz2", "xz,.xz", "zstd,.zst"})
    void truncatedCompressedInputIsAnErrorNotAShortRead(String kind, String suffix) throws IOException {
        byte[] raw = compress(kind, plain);
        Path p = tmp.resolve("cut-" + kind + ".par" + suffix);
        Files.write(p, Arrays.copyOf(raw, raw.length * 2 / 3));
        LineFormatException e = assertThrows(LineFormatException.class, () -> {
            try (OpenedSource s = LineSources.open(p, null, STRICT)) {
                wavenumberSum(s.reader());
            }
        });
        assertTrue(e.getMessage().startsWith(p + ": corrupt or truncated " + kind + " data"), e.getMessage());
        // reading on after the failure repeats it rather than ending quietly
        try (SourceInput in = SourceInput.open(p)) {
            byte[] buffer = new byte[8192];
            LineFormatException first = assertThrows(LineFormatException.class, () -> {
                while (in.stream().read(buffer) >= 0) {
                    // until the failure
                }
            });
            assertEquals(first.getMessage(), assertThrows(LineFormatException.class, () -> in.stream().read(buffer)).getMessage());
        } catch (LineFormatException atOpen) {
            assertTrue(atOpen.getMessage().contains("corrupt or truncated"), atOpen.getMessage()); // bzip2: the first block
        }
    }

    @Test
    void corruptMagicIsReported() throws IOException {
        Path named = tmp.resolve("plain-but-named.par.gz");
        Files.write(named, plain);
        LineFormatException e = assertThrows(LineFormatException.class, () -> LineSources.open(named, null, STRICT));
        assertTrue(e.getMessage().contains("the name says gzip but the content does not start with gzip magic bytes (first bytes 20 35 35"),
                e.getMessage());
        byte[] broken = compress("gzip", plain);
        for (int i = 10; i < 200; i++) {
            broken[i] = (byte) 0x55; // destroy the deflate stream after the gzip header
        }
        Path garbled = tmp.resolve("garbled.par.gz");
        Files.write(garbled, broken);
        assertThrows(LineFormatException.class, () -> {
            try (OpenedSource s = LineSources.open(garbled, null, STRICT)) {
                wavenumberSum(s.reader());
            }
        });
    }

    @Test
    void emptyFileIsOneLine() throws IOException {
        Path p = tmp.resolve("empty.par");
        Files.write(p, new byte[0]);
        LineFormatException e = assertThrows(LineFormatException.class, () -> LineSources.open(p, null, STRICT));
        assertEquals(p + ": the file is empty (0 bytes)", e.getMessage());
        Path gz = tmp.resolve("empty.par.gz");
        Files.write(gz, compress("gzip", new byte[0]));
        e = assertThrows(LineFormatException.class, () -> LineSources.open(gz, null, STRICT));
        assertTrue(e.getMessage().contains("decompress to nothing"), e.getMessage());
    }

    @Test
    void zipWithSeveralEntriesIsRefused() throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ZipArchiveOutputStream z = new ZipArchiveOutputStream(bytes)) {
            for (String n : new String[] {"a.par", "b.par"}) {
                z.putArchiveEntry(new ZipArchiveEntry(n));
                z.write(plain, 0, 1610);
                z.closeArchiveEntry();
            }
        }
        Path p = tmp.resolve("two.zip");
        Files.write(p, bytes.toByteArray());
        LineFormatException e = assertThrows(LineFormatException.class, () -> LineSources.open(p, null, STRICT));
        assertTrue(e.getMessage().contains("holds 2 files (expected exactly one"), e.getMessage());
    }

    @Test
    void wrongFormatSaysWhatWasFound() throws IOException {
        Path csv = tmp.resolve("lines.csv");
        Files.writeString(csv, "molec_id,local_iso_id,nu,sw,elower,gamma_air,n_air\n5,1,2100.5,1e-20,1,0.05,0.7\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> LineSources.open(csv, LineFormat.HITRAN160, STRICT));
        assertEquals(csv + ": expected hitran160 but the content looks like hitran-delimited", e.getMessage());
        try (OpenedSource s = LineSources.open(csv, null, STRICT)) {
            assertEquals(LineFormat.HITRAN_DELIMITED, s.format());
            assertEquals(2100.5, wavenumberSum(s.reader()));
        }
        Path prose = tmp.resolve("notes.txt");
        Files.writeString(prose, "synthetic text that is no line list\n");
        e = assertThrows(LineFormatException.class, () -> LineSources.open(prose, null, STRICT));
        assertTrue(e.getMessage().startsWith(prose + ": cannot recognise the format: found an unrecognised first line of 35 characters"),
                e.getMessage());
    }

    /** An invented catalog line (synthetic values) in the 80-column layout: F13.4 F8.4 F8.4 I2 F10.4 I3 I7 I4 6I2 6I2. */
    static final String SYNTHETIC_CATALOG_LINE = "  123456.7890  0.0050 -4.1234 3   12.3456  5 -99001 101 2         1";

    @Test
    void detectorRecognisesEachFormat() {
        byte[] hitran = Arrays.copyOf(plain, 4000);
        assertEquals(LineFormat.HITRAN160, FormatDetector.byContent(hitran, hitran.length));
        byte[] cat = (SYNTHETIC_CATALOG_LINE + "\n" + SYNTHETIC_CATALOG_LINE + "\n").getBytes(StandardCharsets.US_ASCII);
        assertEquals(LineFormat.CATALOG, FormatDetector.byContent(cat, cat.length));
        byte[] tsv = "molec_id\tlocal_iso_id\tnu\tsw\n".getBytes(StandardCharsets.US_ASCII);
        assertEquals(LineFormat.HITRAN_DELIMITED, FormatDetector.byContent(tsv, tsv.length));
        byte[] trans = "\n        12         1  1.2345e-02\n        13         2  2.0000e-03\n".getBytes(StandardCharsets.US_ASCII);
        assertEquals(LineFormat.EXOMOL, FormatDetector.byContent(trans, trans.length));
        assertEquals(LineFormat.EXOMOL, FormatDetector.byFileName("1H2-16O__synthetic__00000-00100.trans.bz2"));
        for (String name : new String[] {"a__b.states", "a__b.def.gz", "a__b.pf", "a__H2.broad.xz", "a__b.STATES.zst"}) {
            assertEquals(LineFormat.EXOMOL, FormatDetector.byFileName(name), name);
        }
        assertNull(FormatDetector.byFileName("lines.par.bz2"));
        byte[] binary = {1, 2, 0, 4};
        assertTrue(FormatDetector.describe(binary, 4).startsWith("binary"));
    }

    @Test
    void openStreamSatisfiesStreamOpener() throws IOException {
        Path p = tmp.resolve("opener.par.xz");
        Files.write(p, compress("xz", plain));
        StreamOpener opener = SourceInput::openStream;
        try (var in = opener.open(p)) {
            assertTrue(Arrays.equals(plain, in.readAllBytes()));
        }
    }
}
