/** Quantities with units in command-line option values: parsers and picocli converters. */
package org.linewright.cli.units;
