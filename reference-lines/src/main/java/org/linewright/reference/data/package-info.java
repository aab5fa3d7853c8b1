/**
 * Reference lines with their sources: well-known rotational rest frequencies and infrared wavenumber standards,
 * loaded from data files of linewright's own documented format ({@link org.linewright.reference.data.ReferenceLines}).
 */
package org.linewright.reference.data;
