package org.linewright.ingest.source;

import java.nio.charset.StandardCharsets;
import java.util.Locale;
import org.linewright.ingest.text.ByteLineScanner;
import org.linewright.ingest.text.DecimalParser;

/**
 * Recognises the format of a line list from its file name and its first non-blank lines.
 *
 * <ul>
 *   <li>{@link LineFormat#EXOMOL}: a name ending in {@code .states}, {@code .trans}, {@code .def}, {@code .pf} or
 *       {@code .broad} (before any compression suffix), or lines of whitespace-separated numbers starting with an
 *       integer id;</li>
 *   <li>{@link LineFormat#HITRAN160}: 160-character lines with a molecule number, an isotopologue code and
 *       a wavenumber in their first 15 columns;</li>
 *   <li>{@link LineFormat#CATALOG}: lines of 55–81 characters whose frequency, error, log intensity,
 *       degrees of freedom, lower energy, degeneracy, species tag and quantum-number format fields
 *       (columns 1–55) are all numbers;</li>
 *   <li>{@link LineFormat#HITRAN_DELIMITED}: a first line of comma- or tab-separated names among which
 *       {@code nu} and {@code molec_id} (or {@code local_iso_id}).</li>
 * </ul>
 */
public final class FormatDetector {
    /** Bytes of (decompressed) content the detector looks at. */
    public static final int HEAD_BYTES = 64 * 1024;
    private static final int LINES_EXAMINED = 3;

    private FormatDetector() {
    }

    /**
     * The format a file name alone announces ({@code .states}, {@code .trans}, {@code .def}, {@code .pf},
     * {@code .broad}, each optionally followed by a compression suffix), or null.
     */
    public static LineFormat byFileName(String fileName) {
        String n = fileName.toLowerCase(Locale.ROOT);
        SourceInput.Compression c = SourceInput.Compression.bySuffix(n);
        if (c != SourceInput.Compression.NONE) {
            n = n.substring(0, n.lastIndexOf('.'));
        }
        if (n.endsWith(".states") || n.endsWith(".trans") || n.endsWith(".def") || n.endsWith(".pf")
                || n.endsWith(".broad")) {
            return LineFormat.EXOMOL;
        }
        return null;
    }

    /**
     * The format of the content {@code head[0, length)} (the start of the decompressed file), or null when
     * not recognised.
     */
    public static LineFormat byContent(byte[] head, int length) {
        LineFormat found = null;
        int examined = 0;
        int start = 0;
        while (start < length && examined < LINES_EXAMINED) {
            int end = start;
            while (end < length && head[end] != '\n') {
                end++;
            }
            if (end == length && length == HEAD_BYTES) {
                break; // a partial line at the end of the head proves nothing
            }
            int stop = end > start && head[end - 1] == '\r' ? end - 1 : end;
            if (!ByteLineScanner.isBlank(head, start, stop)) {
                LineFormat line = classify(head, start, stop, examined == 0);
                if (line == null || (found != null && line != found)) {
                    return examined == 0 ? null : found;
                }
                found = line;
                examined++;
                if (found == LineFormat.HITRAN_DELIMITED) {
                    return found; // only the header row is examined
                }
            }
            start = end + 1;
        }
        return found;
    }

    /** A short description of what the content looks like, for error messages. */
    public static String describe(byte[] head, int length) {
        for (int i = 0; i < length; i++) {
            if (head[i] == 0) {
                return "binary content (not a text line list, nor a known compression)";
            }
        }
        LineFormat f = byContent(head, length);
        if (f != null) {
            return f.id() + " content";
        }
        int start = 0;
        while (start < length) {
            int end = start;
            while (end < length && head[end] != '\n') {
                end++;
            }
            int stop = end > start && head[end - 1] == '\r' ? end - 1 : end;
            if (!ByteLineScanner.isBlank(head, start, stop)) {
                String first = new String(head, start, Math.min(stop - start, 60), StandardCharsets.UTF_8);
                return "an unrecognised first line of " + (stop - start) + " characters \"" + first + "\"";
            }
            start = end + 1;
        }
        return "no data lines";
    }

    private static LineFormat classify(byte[] b, int s, int e, boolean firstLine) {
        int n = e - s;
        if (n == 160 && DecimalParser.parseInt(b, s, s + 2) >= 1 && isIsotopologueCode(b[s + 2])
                && Double.isFinite(DecimalParser.parse(b, s + 3, s + 15))) {
            return LineFormat.HITRAN160;
        }
        if (n >= 55 && n <= 81 && isCatalogLine(b, s)) {
            return LineFormat.CATALOG;
        }
        if (firstLine && isDelimitedHeader(b, s, e)) {
            return LineFormat.HITRAN_DELIMITED;
        }
        if (isNumericTokens(b, s, e)) {
            return LineFormat.EXOMOL;
        }
        return null;
    }

    private static boolean isIsotopologueCode(byte c) {
        return (c >= '0' && c <= '9') || c == 'A' || c == 'B';
    }

    private static boolean isCatalogLine(byte[] b, int s) {
        // F13.4 frequency, F8.4 error, F8.4 log10 intensity, I2, F10.4 lower energy, I3, I7 tag, I4 format
        return Double.isFinite(DecimalParser.parse(b, s, s + 13))
                && Double.isFinite(DecimalParser.parse(b, s + 13, s + 21))
                && Double.isFinite(DecimalParser.parse(b, s + 21, s + 29))
                && DecimalParser.parseInt(b, s + 29, s + 31) != Long.MIN_VALUE
                && Double.isFinite(DecimalParser.parse(b, s + 31, s + 41))
                && DecimalParser.parseInt(b, s + 44, s + 51) != Long.MIN_VALUE
                && DecimalParser.parseInt(b, s + 51, s + 55) != Long.MIN_VALUE;
    }

    private static boolean isDelimitedHeader(byte[] b, int s, int e) {
        String line = new String(b, s, e - s, StandardCharsets.UTF_8).toLowerCase(Locale.ROOT).replace("\uFEFF", "");
        char delimiter = line.indexOf('\t') >= 0 ? '\t' : ',';
        if (line.indexOf(delimiter) < 0) {
            return false;
        }
        boolean nu = false;
        boolean id = false;
        for (String token : line.split(String.valueOf(delimiter), -1)) {
            String t = token.trim();
            if (t.length() >= 2 && t.charAt(0) == '"' && t.charAt(t.length() - 1) == '"') {
                t = t.substring(1, t.length() - 1).trim();
            }
            nu |= t.equals("nu");
            id |= t.equals("molec_id") || t.equals("local_iso_id");
        }
        return nu && id;
    }

    /** Whitespace-separated tokens, the first an integer id, the next two numbers (state or transition lines). */
    private static boolean isNumericTokens(byte[] b, int s, int e) {
        int[] start = new int[3];
        int[] end = new int[3];
        int n = ByteLineScanner.splitOnBlanks(b, s, e, start, end);
        return n >= 3 && DecimalParser.parseInt(b, start[0], end[0]) >= 0
                && Double.isFinite(DecimalParser.parse(b, start[1], end[1]))
                && Double.isFinite(DecimalParser.parse(b, start[2], end[2]));
    }
}
