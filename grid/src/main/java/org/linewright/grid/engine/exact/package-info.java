/**
 * The reference cross-section engine: direct summation of every line's Voigt profile on the grid points within
 * its cutoff, multi-threaded over fixed grid blocks so that σ is bitwise the same for any thread count.
 */
package org.linewright.grid.engine.exact;
