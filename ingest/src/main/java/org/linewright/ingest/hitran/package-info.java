/**
 * Line lists in the 160-character fixed-column layout (2004 and later) and its comma- or tab-separated
 * exports: {@link org.linewright.ingest.hitran.HitranRecordReader},
 * {@link org.linewright.ingest.hitran.HitranDelimitedReader}, the writer
 * {@link org.linewright.ingest.hitran.HitranRecordWriter}, the field layout
 * {@link org.linewright.ingest.hitran.HitranField} and the reading of J and K from the local quanta
 * {@link org.linewright.ingest.hitran.HitranQuanta}. Files are usually opened through
 * {@link org.linewright.ingest.source.LineSources}, which handles compression and format detection.
 */
package org.linewright.ingest.hitran;
