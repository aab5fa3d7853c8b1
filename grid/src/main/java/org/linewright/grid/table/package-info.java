/**
 * Cross-section tables: the block-by-block builder ({@link org.linewright.grid.table.TableBuilder}) with its
 * calculator ({@link org.linewright.grid.table.CalculatorBlocks}), the Arrow IPC and HDF5 writer
 * ({@link org.linewright.grid.table.TableWriter}) and the reader with (ln p, T) interpolation
 * ({@link org.linewright.grid.table.CrossSectionTable}). Layouts in {@code docs/table-format.md}.
 */
package org.linewright.grid.table;
