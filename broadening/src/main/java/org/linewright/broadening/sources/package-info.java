/**
 * The chain of sources of per-line broadening parameters for each background gas — line list, rules,
 * J''-dependent tables, user constants, air values for N2/O2, defaults — its per-gas tally, and the
 * composition-weighted per-line summaries ({@link org.linewright.broadening.sources.WidthResolver},
 * {@link org.linewright.broadening.sources.ResolvedWidths}).
 */
package org.linewright.broadening.sources;
