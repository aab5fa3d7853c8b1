/**
 * Registry values (mass, abundance, partition sums) of isotopologues cached in primitive arrays for the
 * per-line loops of the broadening module.
 */
package org.linewright.broadening.isotopologue;
