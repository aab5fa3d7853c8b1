/**
 * The fast cross-section engine: a discrete integral transform (lines spread over position and log-width nodes,
 * one FFT convolution per width slice) whose steps follow from a requested tolerance and which reports the error it
 * estimates. Entry point: {@link org.linewright.grid.engine.fast.FastEngine}.
 */
package org.linewright.grid.engine.fast;
