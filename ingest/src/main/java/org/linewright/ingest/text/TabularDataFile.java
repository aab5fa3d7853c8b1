package org.linewright.ingest.text;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.List;
import org.linewright.ingest.source.LineFormatException;

/**
 * Reads the tab-separated data files of our own format (isotopologue registry, reference lines, ...): UTF-8, lines
 * starting with {@code #} are comments, blank lines are skipped, the first other line must be exactly the expected
 * header, every later line is a row. Not for line lists (they have their own fast readers).
 */
public final class TabularDataFile {

    /** Receives each data row with its 1-based line number, the line as read and its cells. */
    @FunctionalInterface
    public interface RowHandler {
        void row(long lineNumber, String line, String[] cells);
    }

    /** Receives each comment line; {@code afterHeader} tells whether the header has been read. */
    @FunctionalInterface
    public interface CommentHandler {
        void comment(long lineNumber, String line, boolean afterHeader);
    }

    private TabularDataFile() {
    }

    /**
     * Reads {@code in} to its end.
     *
     * @throws LineFormatException on a wrong header or a file without one (file, line, text, what was expected)
     */
    public static void read(InputStream in, String fileName, List<String> columns, CommentHandler comments,
                            RowHandler rows) throws IOException {
        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
        String line;
        long lineNumber = 0;
        boolean headerSeen = false;
        while ((line = reader.readLine()) != null) {
            lineNumber++;
            if (line.isBlank() || line.startsWith("#")) {
                if (!line.isBlank()) {
                    comments.comment(lineNumber, line, headerSeen);
                }
                continue;
            }
            String[] cells = line.split("\t", -1);
            if (!headerSeen) {
                if (!Arrays.asList(cells).equals(columns)) {
                    throw new LineFormatException(fileName, lineNumber, 1, line.length(), "header", line,
                            "the tab-separated header " + String.join(" ", columns));
                }
                headerSeen = true;
                continue;
            }
            rows.row(lineNumber, line, cells);
        }
        if (!headerSeen) {
            throw LineFormatException.ofFile(fileName, "no header line (expected " + String.join(" ", columns) + ")", null);
        }
    }
}
