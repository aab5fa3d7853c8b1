package org.linewright.reference.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.reference.compare.CompareOptions;
import org.linewright.reference.compare.ComparisonReport;
import org.linewright.reference.compare.LineListComparer;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.input.LineListInput;
import org.linewright.reference.testsupport.ParFiles;
import org.linewright.reference.verify.LineListVerifier;
import org.linewright.reference.verify.VerificationReport;
import org.linewright.reference.verify.VerifyOptions;

/** CSV rows follow RFC 4180 with the header's number of fields; JSON brackets and quotes balance (RFC 8259). */
class ReportWritersTest {
    @TempDir
    Path temp;

    /** Splits one CSV record after RFC 4180 (quoted fields may hold commas and doubled quotes). */
    private static List<String> fields(String row) {
        List<String> out = new ArrayList<>();
        StringBuilder f = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < row.length(); i++) {
            char c = row.charAt(i);
            if (quoted) {
                if (c == '"' && i + 1 < row.length() && row.charAt(i + 1) == '"') {
                    f.append('"');
                    i++;
                } else if (c == '"') {
                    quoted = false;
                } else {
                    f.append(c);
                }
            } else if (c == '"') {
                quoted = true;
            } else if (c == ',') {
                out.add(f.toString());
                f.setLength(0);
            } else {
                f.append(c);
            }
        }
        out.add(f.toString());
        return out;
    }

    private static void assertBalancedJson(String json) {
        int depth = 0;
        boolean inString = false;
        for (int i = 0; i < json.length(); i++) {
            char c = json.charAt(i);
            if (inString) {
                if (c == '\\') {
                    i++;
                } else if (c == '"') {
                    inString = false;
                }
            } else if (c == '"') {
                inString = true;
            } else if (c == '{' || c == '[') {
                depth++;
            } else if (c == '}' || c == ']') {
                depth--;
                assertTrue(depth >= 0, "closing bracket without opening at " + i);
            }
        }
        assertEquals(0, depth);
        assertTrue(!inString);
        assertTrue(!json.contains("NaN") && !json.contains("Infinity"), "JSON has no NaN or Infinity literals");
    }

    @Test
    void verificationAndComparisonReportsAreWellFormed() throws IOException {
        List<String> records = ParFiles.records(ReferenceSamples.hitranSample("sample_CO2.par"));
        records.set(7, ParFiles.withIntensity(records.get(7), 3 * ParFiles.intensity(records.get(7))));
        Path changed = ParFiles.write(temp.resolve("co2.par"), records);
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        VerificationReport v;
        ComparisonReport c;
        try (LineListInput a = LineListInput.open(ReferenceSamples.hitranSample("sample_CO2.par"), registry);
             LineListInput b = LineListInput.open(changed, registry)) {
            v = new LineListVerifier(registry, ReferenceLines.builtIn(), VerifyOptions.defaults()).verify(b.store(), "x,\"y\"");
            c = new LineListComparer(CompareOptions.defaults()).compare(a.store(), "a", b.store(), "b");
        }
        assertEquals(1, c.changed());

        StringWriter csv = new StringWriter();
        VerificationReportWriter.write(v, ReportFormat.CSV, csv);
        int columns = fields(VerificationReportWriter.CSV_HEADER).size();
        for (String row : csv.toString().split("\n")) {
            assertEquals(columns, fields(row).size(), row);
        }
        assertTrue(csv.toString().contains("summary,failed,,,,,lines,"), csv.toString());
        csv = new StringWriter();
        ComparisonReportWriter.write(c, ReportFormat.CSV, csv);
        String[] rows = csv.toString().split("\n");
        assertEquals(2, rows.length, "header and the one changed field");
        columns = fields(ComparisonReportWriter.CSV_HEADER).size();
        List<String> f = fields(rows[1]);
        assertEquals(columns, f.size(), rows[1]);
        assertEquals("intensity_cm_per_molecule", f.get(12));
        assertEquals(3 * Double.parseDouble(f.get(13)), Double.parseDouble(f.get(14)), 1e-3 * Double.parseDouble(f.get(14)));

        for (ReportFormat format : ReportFormat.values()) {
            Path file = temp.resolve("out/verify." + format.id());
            ReportFiles.write(file, w -> VerificationReportWriter.write(v, format, w));
            String text = Files.readString(file);
            assertTrue(text.length() > 100);
            if (format == ReportFormat.JSON) {
                assertBalancedJson(text);
                assertTrue(text.contains("\"subject\": \"x,\\\"y\\\"\""), text);
            }
            StringWriter w = new StringWriter();
            ComparisonReportWriter.write(c, format, w);
            if (format == ReportFormat.JSON) {
                assertBalancedJson(w.toString());
            }
        }
        try (var listing = Files.list(temp.resolve("out"))) {
            assertEquals(3, listing.count(), "no partial files left behind");
        }
    }
}
