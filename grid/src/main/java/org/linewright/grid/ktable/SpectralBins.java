package org.linewright.grid.ktable;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;

/**
 * Contiguous spectral bins [lower_b, upper_b) in wavenumber (cm⁻¹), ascending, the last one closed: from a constant
 * resolving power (edges ν_{b+1} = ν_b (1 + 1/R), so every bin has ν_lower/Δν = R), from a fixed width, or from a file of
 * edges. A σ point at ν belongs to the bin with lower ≤ ν < upper (the last bin also takes ν = upper).
 */
public final class SpectralBins {
    /** How the bins were made (metadata {@code bin_spacing_kind}). */
    public enum Kind {
        RESOLVING_POWER("resolving_power"), FIXED_WIDTH("fixed_width"), EDGES_FILE("edges_file");

        private final String id;

        Kind(String id) {
            this.id = id;
        }

        public String id() {
            return id;
        }
    }

    private final double[] edgesCm1;
    private final Kind kind;

    private SpectralBins(double[] edgesCm1, Kind kind) {
        this.edgesCm1 = edgesCm1;
        this.kind = kind;
    }

    /**
     * Bins of constant resolving power R = ν_lower/Δν starting at {@code fromCm1}; the last bin ends at or beyond
     * {@code toCm1} is cut at {@code toCm1}.
     */
    public static SpectralBins resolvingPower(double fromCm1, double toCm1, double resolvingPower) {
        if (!(resolvingPower > 0) || Double.isInfinite(resolvingPower)) {
            throw new InputException("resolving power " + resolvingPower + " (expected a positive number)");
        }
        checkRange(fromCm1, toCm1);
        List<Double> edges = new ArrayList<>();
        double ratio = 1.0 + 1.0 / resolvingPower;
        for (int b = 0; ; b++) {
            // ν_b = from·ratio^b computed from the start, not by repeated multiplication, so rounding does not pile up
            double e = fromCm1 * Math.pow(ratio, b);
            if (e >= toCm1 * (1 - 1e-12)) {
                break;
            }
            edges.add(e);
        }
        edges.add(toCm1);
        return new SpectralBins(toArray(edges), Kind.RESOLVING_POWER);
    }

    /** Bins of a fixed width from {@code fromCm1}; the last bin is cut at {@code toCm1}. */
    public static SpectralBins fixedWidth(double fromCm1, double toCm1, double widthCm1) {
        if (!(widthCm1 > 0) || Double.isInfinite(widthCm1)) {
            throw new InputException("bin width " + widthCm1 + " cm-1 (expected a positive number)");
        }
        checkRange(fromCm1, toCm1);
        List<Double> edges = new ArrayList<>();
        for (long b = 0; ; b++) {
            double e = fromCm1 + b * widthCm1;
            if (e >= toCm1 - 1e-9 * widthCm1) {
                break;
            }
            edges.add(e);
        }
        edges.add(toCm1);
        return new SpectralBins(toArray(edges), Kind.FIXED_WIDTH);
    }

    /** Bins between given edges (cm⁻¹, strictly ascending, at least two). */
    public static SpectralBins edges(double[] edgesCm1) {
        if (edgesCm1.length < 2) {
            throw new InputException("bin edges: " + edgesCm1.length + " value(s) (expected at least two)");
        }
        for (int i = 0; i < edgesCm1.length; i++) {
            if (!Double.isFinite(edgesCm1[i]) || edgesCm1[i] < 0 || (i > 0 && !(edgesCm1[i] > edgesCm1[i - 1]))) {
                throw new InputException("bin edge " + (i + 1) + ": " + edgesCm1[i]
                        + " (expected finite, non-negative, strictly ascending wavenumbers in cm-1)");
            }
        }
        return new SpectralBins(edgesCm1.clone(), Kind.EDGES_FILE);
    }

    /**
     * Reads bin edges from a text file: one wavenumber in cm⁻¹ per line (blank lines and lines starting with
     * {@code #} are skipped), strictly ascending.
     *
     * @throws InputException naming the file, line and offending text for anything else
     */
    public static SpectralBins readEdges(Path file) throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new InputException(file + ": no such bin-edges file");
        }
        List<String> lines = Files.readAllLines(file, StandardCharsets.ISO_8859_1);
        List<Double> edges = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String s = lines.get(i).strip();
            if (s.isEmpty() || s.startsWith("#")) {
                continue;
            }
            double v;
            try {
                v = Double.parseDouble(s);
            } catch (NumberFormatException e) {
                v = Double.NaN;
            }
            if (!Double.isFinite(v) || v < 0 || (!edges.isEmpty() && !(v > edges.get(edges.size() - 1)))) {
                throw new InputException(file + ": line " + (i + 1) + ", column 1, field bin edge: "
                        + OffendingText.quote(s) + " (expected a non-negative wavenumber in cm-1, above the previous edge)");
            }
            edges.add(v);
        }
        if (edges.size() < 2) {
            throw new InputException(file + ": " + edges.size() + " bin edge(s) (expected at least two, one per line)");
        }
        return new SpectralBins(toArray(edges), Kind.EDGES_FILE);
    }

    private static void checkRange(double fromCm1, double toCm1) {
        if (!(fromCm1 > 0) || !(toCm1 > fromCm1) || Double.isInfinite(toCm1)) {
            throw new InputException("bin range [" + fromCm1 + ", " + toCm1 + "] cm-1 (expected 0 < from < to)");
        }
    }

    private static double[] toArray(List<Double> list) {
        double[] a = new double[list.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = list.get(i);
        }
        return a;
    }

    /** How the bins were made. */
    public Kind kind() {
        return kind;
    }

    /** The number of bins. */
    public int count() {
        return edgesCm1.length - 1;
    }

    /** The edges, cm⁻¹ (count() + 1 values, a copy). */
    public double[] edgesCm1() {
        return edgesCm1.clone();
    }

    /** Lower edge of bin {@code b}, cm⁻¹. */
    public double lowerCm1(int b) {
        return edgesCm1[b];
    }

    /** Upper edge of bin {@code b}, cm⁻¹. */
    public double upperCm1(int b) {
        return edgesCm1[b + 1];
    }

    /** Centre of bin {@code b}, (lower + upper)/2, cm⁻¹. */
    public double centreCm1(int b) {
        return 0.5 * (edgesCm1[b] + edgesCm1[b + 1]);
    }

    /**
     * The index range of a sorted wavenumber axis that falls in each bin: points {@code [start[b], start[b+1])}
     * belong to bin b (lower ≤ ν < upper; the last bin closed). Points outside all bins are in none.
     *
     * @return count() + 1 indices into {@code axisCm1}
     */
    public int[] pointRanges(double[] axisCm1) {
        int n = count();
        int[] start = new int[n + 1];
        for (int b = 0; b <= n; b++) {
            double e = edgesCm1[b];
            // first index with ν ≥ e (for the closing edge: first index with ν > e)
            int lo = 0;
            int hi = axisCm1.length;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                boolean before = b == n ? axisCm1[mid] <= e : axisCm1[mid] < e;
                if (before) {
                    lo = mid + 1;
                } else {
                    hi = mid;
                }
            }
            start[b] = lo;
        }
        return start;
    }
}
