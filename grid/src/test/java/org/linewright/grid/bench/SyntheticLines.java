package org.linewright.grid.bench;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.linewright.ingest.hitran.HitranRecordWriter;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.testsupport.SyntheticRecords;

/**
 * Synthetic, invented CO lines (molecule 5, isotopologues 1–6) for the grid benchmarks, in the manner of the
 * ingest benchmark's generator: a block of 20,000 varied lines (S(296 K) 10⁻³⁰–10⁻²⁰ cm/molecule, air width
 * 0–0.1 cm⁻¹/atm, self width 0–1 cm⁻¹/atm, E'' 0–10,000 cm⁻¹, n 0–0.99, shift 0 to −0.01 cm⁻¹/atm), repeated
 * with rising centres {@value #FIRST_CM1} + i·{@value #SPACING_CM1} cm⁻¹ (10⁶ lines span 2000–2500 cm⁻¹, a
 * fundamental band's region; the spacing is below the Doppler HWHM there, ≈ 0.002 cm⁻¹ at 200–300 K). Every value is rounded to what the
 * 160-character record holds, so the generated store and the generated file carry the same lines.
 *
 * <p>A wider list (a band system) takes another line spacing: {@link #SyntheticLines(double)}.
 *
 * <p>A "list update" multiplies the air-broadened widths of a contiguous slice of lines by
 * {@value #UPDATE_WIDTH_FACTOR} (rounded to the record's 4 decimals).
 */
final class SyntheticLines {
    /** Lines per generated block. */
    static final int BLOCK = 20_000;
    /** Centre of line 0, cm⁻¹. */
    static final double FIRST_CM1 = 2000.0;
    /** Distance between consecutive centres, cm⁻¹. */
    static final double SPACING_CM1 = 0.0005;
    /** Factor applied to the air widths of the updated slice. */
    static final double UPDATE_WIDTH_FACTOR = 1.1;
    /** HITRAN molecule number of CO (common practice). */
    static final int CO = 5;

    private final LineBatch template;
    private final double[] airWidth = new double[BLOCK];
    private final double spacingCm1;

    SyntheticLines() {
        this(SPACING_CM1);
    }

    /** Lines {@code spacingCm1} apart (10⁶ lines at 0.002 cm⁻¹ span 2000–4000 cm⁻¹). */
    SyntheticLines(double spacingCm1) {
        this.spacingCm1 = spacingCm1;
        template = SyntheticRecords.block(BLOCK, 7);
        System.arraycopy(template.airWidthCm1PerAtm, 0, airWidth, 0, BLOCK);
    }

    /** Centre of line {@code index} at the default spacing, cm⁻¹ (rounded to the record's 6 decimals). */
    static double centreCm1(long index) {
        return Math.round((FIRST_CM1 + index * SPACING_CM1) * 1e6) / 1e6;
    }

    /** Centre of line {@code index} of this generator, cm⁻¹ (rounded to the record's 6 decimals). */
    double centre(long index) {
        return Math.round((FIRST_CM1 + index * spacingCm1) * 1e6) / 1e6;
    }

    /** Distance between consecutive centres, cm⁻¹. */
    double spacingCm1() {
        return spacingCm1;
    }

    /** Receives each generated block. */
    interface BlockSink {
        void accept(LineBatch batch) throws IOException;
    }

    /**
     * Generates {@code lines} lines block by block; lines with index in [{@code updateFrom}, {@code updateTo})
     * get updated air widths (an empty range for the original list).
     */
    void generate(long lines, long updateFrom, long updateTo, BlockSink sink) throws IOException {
        LineBatch b = template;
        for (long done = 0; done < lines; done += BLOCK) {
            int n = (int) Math.min(BLOCK, lines - done);
            for (int i = 0; i < n; i++) {
                long index = done + i;
                b.wavenumberCm1[i] = centre(index);
                b.sourceLine[i] = index + 1;
                b.airWidthCm1PerAtm[i] = index >= updateFrom && index < updateTo
                        ? Math.round(airWidth[i] * UPDATE_WIDTH_FACTOR * 1e4) / 1e4 : airWidth[i];
            }
            b.size = n;
            sink.accept(b);
        }
    }

    /** Writes the lines as 160-character records to {@code file}. */
    void writeRecords(Path file, long lines, long updateFrom, long updateTo) throws IOException {
        HitranRecordWriter writer = new HitranRecordWriter();
        try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(file), 1 << 20)) {
            generate(lines, updateFrom, updateTo, batch -> writer.write(batch, out));
        }
    }

    /** Writes the original lines straight into a line store at {@code storeDir} and opens it. */
    LineStore writeStore(Path storeDir, long lines) throws IOException {
        try (LineStoreWriter writer = LineStoreWriter.create(storeDir, "synthetic",
                SourceMetadata.of("synthetic-co.par", "", "hitran160", Map.of("generator", "SyntheticLines")))) {
            generate(lines, 0, 0, writer::write);
            writer.commit(new IngestCounts(lines, lines, 0, 0));
        }
        return LineStore.open(storeDir);
    }
}
