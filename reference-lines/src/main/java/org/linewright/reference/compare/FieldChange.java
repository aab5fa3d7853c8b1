package org.linewright.reference.compare;

import org.linewright.ingest.line.LineColumn;

/**
 * One field of a paired line that differs between the old and the new list.
 *
 * @param column    the field
 * @param oldValue  old numeric value (NaN for text fields)
 * @param newValue  new numeric value (NaN for text fields)
 * @param oldText   old text (null for numeric fields)
 * @param newText   new text (null for numeric fields)
 */
public record FieldChange(LineColumn column, double oldValue, double newValue, String oldText, String newText) {
    /** new − old (NaN for text fields or when a side is NaN). */
    public double absoluteChange() {
        return newValue - oldValue;
    }

    /** (new − old)/|old| (NaN for text fields, infinite when old is 0). */
    public double relativeChange() {
        return (newValue - oldValue) / Math.abs(oldValue);
    }

    /** True for a text field. */
    public boolean isText() {
        return column.kind() == LineColumn.Kind.TEXT;
    }
}
