package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.InputException;
import org.linewright.reference.verify.ReferenceMatch;
import org.linewright.reference.verify.VerificationReport;

/**
 * The residual plot of a verification, drawn with {@link ResidualPlot}: one panel for S/S(A) − 1 of the lines (a
 * relative intensity residual), one for the reference lines' listed − reference positions in cm⁻¹ (an absolute
 * offset); each panel only when it has points.
 */
public final class VerificationPlot {
    private VerificationPlot() {
    }

    /** Writes the plot of {@code report} to {@code png}. */
    public static void write(VerificationReport report, Path png) throws IOException {
        List<ResidualPlot.Panel> panels = new ArrayList<>();
        if (report.relationResiduals().size() > 0) {
            panels.add(new ResidualPlot.Panel("wavenumber (cm-1)", "S/S(A) - 1", List.of(new ResidualPlot.Series(
                    "lines: intensity vs Einstein A", report.relationResiduals().x(), report.relationResiduals().y()))));
        }
        List<ReferenceMatch> found = report.references().stream().filter(m -> !Double.isNaN(m.offsetCm1())).toList();
        if (!found.isEmpty()) {
            double[] x = new double[found.size()];
            double[] y = new double[found.size()];
            for (int i = 0; i < x.length; i++) {
                x[i] = found.get(i).reference().wavenumberCm1();
                y[i] = found.get(i).offsetCm1();
            }
            panels.add(new ResidualPlot.Panel("reference position (cm-1)", "listed - reference (cm-1)",
                    List.of(new ResidualPlot.Series("reference lines found", x, y))));
        }
        if (panels.isEmpty()) {
            throw new InputException("--plot " + png
                    + ": nothing to plot (no line with S and A, no reference line found)");
        }
        ResidualPlot.writePanels(png, new PlotStyle("verify " + report.subject(), 1000, 400 * panels.size()), panels);
    }
}
