/** Pictures of built cross-section tables for the {@code build} command and the demo. */
package org.linewright.cli.table;
