/**
 * Verification of a line list: the intensity/Einstein-A relation per isotopologue against the registry's Q(296 K)
 * and abundances, physical sanity of every line, and the positions of reference lines
 * ({@link org.linewright.reference.verify.LineListVerifier}).
 */
package org.linewright.reference.verify;
