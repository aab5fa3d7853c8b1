/**
 * Writing files so that a file under its final name is always complete
 * ({@link org.linewright.ingest.atomic.AtomicFile}): every output of every module goes through it.
 */
package org.linewright.ingest.atomic;
