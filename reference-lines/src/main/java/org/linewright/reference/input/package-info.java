/** Line lists given to verification and comparison: line stores, or raw files ingested into temporary stores. */
package org.linewright.reference.input;
