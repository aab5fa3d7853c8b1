package org.linewright.cli.plot;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.linewright.ingest.InputException;
import org.linewright.reference.verify.ReferenceMatch;
import org.linewright.reference.verify.VerificationReport;

/** The residual plot of a verification, drawn with {@link ResidualPlot}. */
public final class VerificationPlot {
    private VerificationPlot() {
    }

    /** The residual plot: S/S(A) − 1 of every (thinned) line and offset/position of the reference lines found. */
    public static void write(VerificationReport report, Path png) throws IOException {
        List<ResidualPlot.Series> series = new ArrayList<>();
        if (report.relationResiduals().size() > 0) {
            series.add(new ResidualPlot.Series("lines: S/S(A) - 1", report.relationResiduals().x(),
                    report.relationResiduals().y()));
        }
        List<ReferenceMatch> found = report.references().stream().filter(m -> !Double.isNaN(m.offsetCm1())).toList();
        if (!found.isEmpty()) {
            double[] x = new double[found.size()];
            double[] y = new double[found.size()];
            for (int i = 0; i < x.length; i++) {
                x[i] = found.get(i).reference().wavenumberCm1();
                y[i] = found.get(i).relativeOffset();
            }
            series.add(new ResidualPlot.Series("reference lines: offset / position", x, y));
        }
        if (series.isEmpty()) {
            throw new InputException("--plot " + png
                    + ": nothing to plot (no line with S and A, no reference line found)");
        }
        ResidualPlot.write(png, PlotStyle.of("verify " + report.subject()), "wavenumber (cm-1)", "relative residual",
                series);
    }
}
