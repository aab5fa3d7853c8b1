/**
 * What makes table builds incremental: the block layout of the grid, the content hash of the lines within reach
 * of each block, the work folder of computed blocks named by their input hash, and the build manifest.
 */
package org.linewright.grid.manifest;
