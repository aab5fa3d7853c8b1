/** Verification and comparison reports as text, CSV or JSON, written atomically. */
package org.linewright.reference.report;
