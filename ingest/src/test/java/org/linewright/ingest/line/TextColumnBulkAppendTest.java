package org.linewright.ingest.line;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class TextColumnBulkAppendTest {
    @Test
    void bulkAppendKeepsEveryRowIncludingEmptyAndGrowsStorage() {
        List<String> rows = List.of("", "a", "Åβ", "", "x".repeat(500), "tail");
        TextColumn src = new TextColumn(2, 1);
        rows.forEach(src::append);
        TextColumn dst = new TextColumn(1, 1);
        dst.append("first");
        dst.appendRows(src, 1, 4);
        dst.appendRows(src, 0, 1);
        dst.appendRows(src, 5, 1);
        dst.appendRows(src, 2, 0);
        // Expected rows written out by hand from the list above.
        List<String> want = List.of("first", "a", "Åβ", "", "x".repeat(500), "", "tail");
        assertEquals(want.size(), dst.rows());
        for (int i = 0; i < want.size(); i++) {
            assertEquals(want.get(i), dst.get(i), "row " + i);
        }
    }
}
