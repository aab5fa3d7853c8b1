/**
 * Correlated-k tables: spectral bins, the g quadrature, the k-distribution of each (p, T, bin) cell of a σ table,
 * the k-table builder, its writers and reader, band-averaged σ and mixtures by random overlap
 * (see {@code docs/physics.md} and {@code docs/table-format.md}).
 */
package org.linewright.grid.ktable;
