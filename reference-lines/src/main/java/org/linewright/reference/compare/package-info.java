/**
 * Comparison of two line lists: lines paired by species and quantum labels (else by nearest position), with the
 * lines added, removed and changed, field by field, summarised per band
 * ({@link org.linewright.reference.compare.LineListComparer}).
 */
package org.linewright.reference.compare;
