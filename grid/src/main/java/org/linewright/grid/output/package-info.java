/**
 * Writers of one cross section σ(ν): CSV, Arrow IPC and HDF5, each written under a temporary name and renamed
 * when complete ({@link org.linewright.grid.output.CrossSectionFiles}).
 */
package org.linewright.grid.output;
