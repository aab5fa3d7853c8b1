/** PNG plots of cross sections, stick spectra and residuals, drawn headless with XChart. */
package org.linewright.cli.plot;
