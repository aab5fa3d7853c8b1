/**
 * Byte-level scanning shared by every text reader: {@link org.linewright.ingest.text.ByteLineScanner} splits a
 * stream into lines (and a line into blank-separated fields) over one reusable buffer, and
 * {@link org.linewright.ingest.text.DecimalParser} reads numbers in place from those bytes, bit for bit as the
 * JDK's correctly rounded parser does. Neither creates an object per line or field.
 */
package org.linewright.ingest.text;
