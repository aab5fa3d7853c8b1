package org.linewright.ingest.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;

/**
 * The store on real records: the HITRAN2020 samples (Gordon et al., JQSRT 277 (2022) 107949; shared reference
 * data, never copied into the repository). The few fields needed are cut from the 160-character records here
 * (columns of the format, common practice), so this test does not depend on the readers.
 */
class LineStoreSampleDataTest {
    @TempDir
    Path store;

    /** Record counts per file: the samples README. */
    private static final Map<String, Integer> RECORDS = Map.of("sample_CO.par", 5381, "sample_CO2.par", 5492,
            "sample_N2O.par", 5446, "sample_PH3.par", 4424);

    private static Path samples() {
        String prop = System.getProperty("linewright.referenceDir");
        for (String c : new String[] {prop, "../shared/reference-data", "../../shared/reference-data"}) {
            if (c != null && Files.isDirectory(Path.of(c, "hitran2020-samples"))) {
                return Path.of(c, "hitran2020-samples");
            }
        }
        Assumptions.assumeTrue(false, "reference data hitran2020-samples not found");
        return null;
    }

    record Rec(String file, long line, int mol, int iso, double wn, double s, String text) { }

    private static List<Rec> read(Path file) throws IOException {
        List<Rec> out = new ArrayList<>();
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.US_ASCII)) {
            String l;
            long n = 0;
            while ((l = r.readLine()) != null) {
                n++;
                char isoChar = l.charAt(2);
                int iso = isoChar == '0' ? 10 : isoChar >= 'A' ? 11 + (isoChar - 'A') : isoChar - '0';
                out.add(new Rec(file.getFileName().toString(), n, Integer.parseInt(l.substring(0, 2).trim()), iso,
                        Double.parseDouble(l.substring(3, 15)), Double.parseDouble(l.substring(15, 25)), l.substring(67, 82)));
            }
        }
        return out;
    }

    @Test
    void samplesIngestedAsFourSourcesComeBackMergedAndFiltered() throws IOException {
        Path dir = samples();
        List<Rec> all = new ArrayList<>();
        for (String name : RECORDS.keySet().stream().sorted().collect(Collectors.toList())) {
            List<Rec> recs = read(dir.resolve(name));
            assertEquals(RECORDS.get(name), recs.size(), name);
            all.addAll(recs);
            try (LineStoreWriter w = LineStoreWriter.create(store, name,
                    SourceMetadata.of(name, SourceMetadata.sha256(dir.resolve(name)), "hitran160", Map.of()), 1000)) {
                LineBatch b = new LineBatch(512);
                for (Rec rec : recs) {
                    int i = b.size++;
                    b.moleculeId[i] = rec.mol;
                    b.isotopologue[i] = rec.iso;
                    b.wavenumberCm1[i] = rec.wn;
                    b.intensityCmPerMolecule[i] = rec.s;
                    b.sourceLine[i] = rec.line;
                    b.clearOptional(i);
                    b.upperGlobalQuanta.append(rec.text);
                    b.lowerGlobalQuanta.appendEmpty();
                    b.upperLocalQuanta.appendEmpty();
                    b.lowerLocalQuanta.appendEmpty();
                    b.uncertaintyCodes.appendEmpty();
                    b.referenceCodes.appendEmpty();
                    b.lineMixingFlag.appendEmpty();
                    if (b.isFull()) {
                        w.write(b);
                        b.clear();
                    }
                }
                w.write(b);
                w.commit(new IngestCounts(recs.size(), recs.size(), 0, 0));
            }
        }
        LineStore s = LineStore.open(store);
        assertEquals(5381 + 5492 + 5446 + 4424, s.totalLines());
        // Expected: a stable sort (java.util.List.sort) of the records in source-name order.
        List<Rec> want = new ArrayList<>(all);
        want.sort(Comparator.comparingDouble(Rec::wn));
        List<Rec> got = new ArrayList<>();
        try (LineCursor c = s.cursor(LineQuery.all())) {
            LineBatch b = new LineBatch(1000);
            while (c.read(b)) {
                for (int i = 0; i < b.size; i++) {
                    got.add(new Rec(null, b.sourceLine[i], b.moleculeId[i], b.isotopologue[i], b.wavenumberCm1[i],
                            b.intensityCmPerMolecule[i], b.upperGlobalQuanta.get(i)));
                }
            }
        }
        assertEquals(want.size(), got.size());
        for (int i = 0; i < want.size(); i++) {
            Rec w = want.get(i);
            Rec g = got.get(i);
            assertEquals(w.line + "/" + w.mol + "/" + w.iso + "/" + w.wn + "/" + w.s + "/" + w.text,
                    g.line + "/" + g.mol + "/" + g.iso + "/" + g.wn + "/" + g.s + "/" + g.text, "line " + i);
        }
        // CO (molecule 5) between 2000 and 2200 cm-1, intensity and wavenumber only.
        long expected = all.stream().filter(r -> r.mol == 5 && r.wn >= 2000 && r.wn <= 2200).count();
        assertTrue(expected > 100);
        long n = 0;
        try (LineCursor c = s.cursor(LineQuery.all().withMolecules(5).withWavenumberRange(2000, 2200)
                .withColumns(List.of(LineColumn.INTENSITY)))) {
            LineBatch b = new LineBatch(64);
            while (c.read(b)) {
                n += b.size;
                for (int i = 0; i < b.size; i++) {
                    assertEquals(5, b.moleculeId[i]);
                }
            }
        }
        assertEquals(expected, n);
        // Isotopologues present per source, as listed in the samples README (CO 1-6, CO2 1-8, N2O 1-5, PH3 1).
        assertEquals(6, s.source("sample_CO.par").isotopologues().size());
        assertEquals(8, s.source("sample_CO2.par").isotopologues().size());
        assertEquals(5, s.source("sample_N2O.par").isotopologues().size());
        assertEquals(1, s.source("sample_PH3.par").isotopologues().size());
    }
}
