/**
 * What a change of line list does to a planned cross-section table: the (p, T, block) cells it reaches and the
 * largest change of σ in each ({@link org.linewright.cli.impact.TableImpact}); used by {@code compare --plan}.
 */
package org.linewright.cli.impact;
