package org.linewright.reference.testsupport;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Modified copies of 160-character records for tests, written into temporary folders (the shared samples stay
 * untouched and are never copied into the repository). Field columns of the format (common practice): molecule
 * 1–2, isotopologue 3, wavenumber 4–15 (F12.6), intensity 16–25 (E10.3), Einstein A 26–35 (E10.3), upper and
 * lower global quanta 68–82 and 83–97 (15 characters each).
 */
public final class ParFiles {
    private ParFiles() {
    }

    /** The records of a file, one per element. */
    public static List<String> records(Path file) throws IOException {
        return new ArrayList<>(Files.readAllLines(file, StandardCharsets.US_ASCII));
    }

    /** Writes records to {@code file}. */
    public static Path write(Path file, List<String> records) throws IOException {
        Files.write(file, records, StandardCharsets.US_ASCII);
        return file;
    }

    /** The wavenumber field of a record. */
    public static double wavenumber(String record) {
        return Double.parseDouble(record.substring(3, 15).trim());
    }

    /** The record with its wavenumber replaced (F12.6). */
    public static String withWavenumber(String record, double wavenumberCm1) {
        return record.substring(0, 3) + String.format(Locale.ROOT, "%12.6f", wavenumberCm1) + record.substring(15);
    }

    /** The intensity field of a record. */
    public static double intensity(String record) {
        return Double.parseDouble(record.substring(15, 25).trim());
    }

    /** The record with its intensity replaced (E10.3). */
    public static String withIntensity(String record, double intensity) {
        String field = String.format(Locale.ROOT, "%10.3E", intensity);
        if (field.length() != 10) {
            throw new IllegalArgumentException("intensity does not fit E10.3: " + field);
        }
        return record.substring(0, 15) + field + record.substring(25);
    }

    /** The isotopologue field (column 3) of a record. */
    public static char isotopologue(String record) {
        return record.charAt(2);
    }

    /** The upper global quanta of a record, trimmed. */
    public static String upperGlobal(String record) {
        return record.substring(67, 82).trim();
    }

    /** The lower global quanta of a record, trimmed. */
    public static String lowerGlobal(String record) {
        return record.substring(82, 97).trim();
    }
}
