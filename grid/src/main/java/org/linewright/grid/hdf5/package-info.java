/**
 * A minimal HDF5 writer for netCDF-4-readable files of dimension coordinates and chunked, compressed variables
 * ({@link org.linewright.grid.hdf5.Hdf5Writer}), written from the HDF5 File Format Specification: superblock v2,
 * v2 object headers, dimension scales, version-1 chunk B-trees, shuffle + deflate, a global heap for
 * variable-length attributes. Variables are filled chunk by chunk as they are computed, so nothing the size of a
 * variable is held in memory. Reading stays with jHDF.
 */
package org.linewright.grid.hdf5;
