package org.linewright.ingest.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Sources → store end to end on the real HITRAN2020 record samples (../shared/reference-data, see its README:
 * record counts per file are from that README's table).
 */
class IngestPipelineTest {
    private static final MoleculeRegistry REGISTRY = MoleculeRegistry.builtIn();

    @TempDir
    Path tmp;

    @Test
    void allFourSamplesAreStoredWithCountsAndDigests() throws Exception {
        List<Path> samples = List.of(ReferenceSamples.hitranSample("sample_CO.par"), ReferenceSamples.hitranSample("sample_CO2.par"),
                ReferenceSamples.hitranSample("sample_N2O.par"), ReferenceSamples.hitranSample("sample_PH3.par"));
        Path store = tmp.resolve("store");
        IngestReport report = IngestPipeline.run(samples, store, IngestOptions.strict(REGISTRY), IngestListener.NONE);

        // Record counts from the samples' README table.
        long[] expected = {5381, 5492, 5446, 4424};
        for (int i = 0; i < expected.length; i++) {
            IngestReport.Source s = report.sources().get(i);
            assertEquals(expected[i], s.recordsRead(), s.file().toString());
            assertEquals(expected[i], s.linesKept());
            assertEquals(0, s.recordsRejected());
            assertEquals("hitran160", s.format());
            assertEquals("none", s.compression());
            // Independent digest: the JDK's MessageDigest over the whole file.
            assertEquals(sha256(samples.get(i)), s.sha256());
        }
        assertNull(report.rejectsFileOrNull());

        LineStore opened = LineStore.open(store);
        assertEquals(5381 + 5492 + 5446 + 4424, opened.totalLines());
        SourceInfo co = opened.source("sample_CO.par");
        assertEquals(sha256(samples.get(0)), co.metadata().sourceSha256());
        assertEquals(5381, co.counts().recordsRead());
        // The merged cursor yields every line in non-decreasing wavenumber order.
        long n = 0;
        double last = Double.NEGATIVE_INFINITY;
        LineBatch batch = new LineBatch(4096);
        try (LineCursor cursor = opened.cursor(LineQuery.all())) {
            while (cursor.read(batch)) {
                for (int i = 0; i < batch.size; i++) {
                    assertTrue(batch.wavenumberCm1[i] >= last);
                    last = batch.wavenumberCm1[i];
                }
                n += batch.size;
            }
        }
        assertEquals(opened.totalLines(), n);
    }

    @Test
    void recordStoreFileLeavesOutTheColumnsA160CharacterRecordCannotFill() throws Exception {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        Path store = tmp.resolve("store");
        IngestPipeline.run(List.of(sample), store, IngestOptions.strict(REGISTRY), IngestListener.NONE);
        Path file;
        try (Stream<Path> files = Files.list(store)) {
            file = files.filter(p -> p.getFileName().toString().startsWith("lines-")).findFirst().orElseThrow();
        }
        // The 160-character record (HITRAN2004+ layout, common practice) has no fields for H2/He/CO2/H2O
        // broadening nor an upper-state energy or a numeric position uncertainty.
        List<String> absent = List.of("h2_width_cm1_per_atm", "h2_width_exponent", "h2_shift_cm1_per_atm",
                "he_width_cm1_per_atm", "he_width_exponent", "he_shift_cm1_per_atm", "co2_width_cm1_per_atm",
                "co2_width_exponent", "co2_shift_cm1_per_atm", "h2o_width_cm1_per_atm", "h2o_width_exponent",
                "h2o_shift_cm1_per_atm", "upper_energy_cm1", "wavenumber_uncertainty_cm1");
        List<String> fields;
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ);
             BufferAllocator allocator = new RootAllocator();
             ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
            // Arrow's own reader: the schema in the file's footer.
            fields = reader.getVectorSchemaRoot().getSchema().getFields().stream().map(Field::getName)
                    .collect(Collectors.toList());
        }
        for (String name : absent) {
            assertFalse(fields.contains(name), name + " in " + fields);
        }
        for (String name : List.of("molecule", "isotopologue", "wavenumber_cm1", "intensity_cm_per_molecule",
                "air_width_cm1_per_atm", "lower_energy_cm1", "upper_global_quanta", "line_mixing_flag", "source_line")) {
            assertTrue(fields.contains(name), name + " missing from " + fields);
        }
        assertEquals(LineColumn.values().length - absent.size(), fields.size());

        // Read back: absent columns are NaN; present ones hold the record's fields (gamma_air in columns
        // 36-40 and E'' in columns 46-55 of the record, common practice).
        List<String> records = ReferenceSamples.lines(sample);
        long n = 0;
        LineBatch batch = new LineBatch(1000);
        try (LineCursor cursor = LineStore.open(store).cursor(LineQuery.all())) {
            while (cursor.read(batch)) {
                for (int i = 0; i < batch.size; i++, n++) {
                    String record = records.get((int) batch.sourceLine[i] - 1);
                    assertEquals(Double.parseDouble(record.substring(35, 40)), batch.airWidthCm1PerAtm[i], record);
                    assertEquals(Double.parseDouble(record.substring(45, 55)), batch.lowerEnergyCm1[i], record);
                    assertTrue(Double.isNaN(batch.upperEnergyCm1[i]) && Double.isNaN(batch.wavenumberUncertaintyCm1[i]));
                    for (int k = 0; k < batch.foreignWidthCm1PerAtm.length; k++) {
                        assertTrue(Double.isNaN(batch.foreignWidthCm1PerAtm[k][i])
                                && Double.isNaN(batch.foreignWidthExponent[k][i])
                                && Double.isNaN(batch.foreignShiftCm1PerAtm[k][i]));
                    }
                }
            }
        }
        // Record count from the samples' README table.
        assertEquals(5381, n);
    }

    @Test
    void compressedSourceGivesTheSameLinesAndTheDigestOfTheCompressedBytes() throws Exception {
        Path sample = ReferenceSamples.hitranSample("sample_PH3.par");
        Path bz2 = tmp.resolve("ph3.par.bz2");
        try (OutputStream out = new BZip2CompressorOutputStream(Files.newOutputStream(bz2))) {
            Files.copy(sample, out);
        }
        IngestReport report = IngestPipeline.run(List.of(bz2), tmp.resolve("store"), IngestOptions.strict(REGISTRY),
                IngestListener.NONE);
        IngestReport.Source s = report.sources().get(0);
        assertEquals("bzip2", s.compression());
        assertEquals(4424, s.linesKept());
        assertEquals(sha256(bz2), s.sha256());
    }

    @Test
    void strictIngestStopsAtTheFirstBadRecordAndLeavesTheStoreAsItWas() throws Exception {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        List<String> lines = ReferenceSamples.lines(sample);
        Path store = tmp.resolve("store");
        Path good = tmp.resolve("co.par");
        Files.write(good, lines.subList(0, 100), StandardCharsets.ISO_8859_1);
        IngestPipeline.run(List.of(good), store, IngestOptions.strict(REGISTRY), IngestListener.NONE);

        // Line 51: the wavenumber field (columns 4-15) made non-numeric.
        List<String> bad = new java.util.ArrayList<>(lines.subList(0, 100));
        String r = bad.get(50);
        bad.set(50, r.substring(0, 3) + "  21x3.45678" + r.substring(15));
        Files.write(good, bad, StandardCharsets.ISO_8859_1);
        LineFormatException e = assertThrows(LineFormatException.class,
                () -> IngestPipeline.run(List.of(good), store, IngestOptions.strict(REGISTRY), IngestListener.NONE));
        assertEquals(51, e.lineNumber());
        assertTrue(e.getMessage().contains("co.par:51"), e.getMessage());
        assertTrue(e.getMessage().contains("21x3.45678"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
        // The earlier, complete file of this source is intact.
        assertEquals(100, LineStore.open(store).source("co.par").lines());
        try (var files = Files.list(store)) {
            assertTrue(files.noneMatch(p -> p.getFileName().toString().contains("partial")), "no partial file left");
        }
    }

    @Test
    void lenientIngestWritesEveryRejectVerbatimWithItsReason() throws Exception {
        List<String> lines = ReferenceSamples.lines(ReferenceSamples.hitranSample("sample_CO.par"));
        List<String> bad = new java.util.ArrayList<>(lines.subList(0, 200));
        String shortRecord = bad.get(9).substring(0, 120);
        bad.set(9, shortRecord);
        String r = bad.get(99);
        // γair (columns 36-40) made negative.
        String negativeWidth = r.substring(0, 35) + "-.050" + r.substring(40);
        bad.set(99, negativeWidth);
        Path file = tmp.resolve("co-bad.par");
        Files.write(file, bad, StandardCharsets.ISO_8859_1);
        Path rejects = tmp.resolve("rejects.tsv");
        IngestOptions options = new IngestOptions(null, true, rejects, REGISTRY, Map.of());
        IngestReport report = IngestPipeline.run(List.of(file), tmp.resolve("store"), options, IngestListener.NONE);

        assertEquals(200, report.recordsRead());
        assertEquals(198, report.linesKept());
        assertEquals(2, report.recordsRejected());
        assertEquals(rejects.toAbsolutePath(), report.rejectsFileOrNull());
        List<String> rows = Files.readAllLines(rejects, StandardCharsets.UTF_8);
        assertEquals(3, rows.size(), "header + two rejects");
        String[] first = rows.get(1).split("\t", 4);
        assertEquals("10", first[1]);
        assertEquals(shortRecord, first[3], "record kept verbatim");
        String[] second = rows.get(2).split("\t", 4);
        assertEquals("100", second[1]);
        assertTrue(second[2].contains("-.050"), second[2]);
        assertEquals(negativeWidth, second[3]);
        assertEquals(198, LineStore.open(tmp.resolve("store")).totalLines());
    }

    @Test
    void missingAndDuplicateNamedSourcesAreOneLineErrors() {
        Path missing = tmp.resolve("nothing-here.par");
        InputException e = assertThrows(InputException.class,
                () -> IngestPipeline.run(List.of(missing), tmp.resolve("s"), IngestOptions.strict(REGISTRY), IngestListener.NONE));
        assertTrue(e.getMessage().contains("nothing-here.par"));
    }

    private static String sha256(Path file) throws IOException, java.security.NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
    }
}
