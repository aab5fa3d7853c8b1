package org.linewright.broadening.listing;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.intensity.LineIntensity;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.ingest.InputException;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineExportWriter;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Lists the lines of a store — a wavenumber window, a molecule or isotopologue, the N strongest — with what the
 * physics gives them: the intensity at a temperature and the width every line gets in a chosen background. Lines
 * come out in wavenumber order whatever the selection. Streams the store (twice for {@code strongest}: once to
 * rank, once to list), so memory stays bounded by one batch plus N ranks.
 *
 * <p>CSV: a header row, then every {@link LineColumn} in declaration order (the first twelve are
 * {@code molecule,isotopologue,wavenumber_cm1,intensity_cm_per_molecule,einstein_a_s1,air_width_cm1_per_atm,
 * self_width_cm1_per_atm,air_width_exponent,air_shift_cm1_per_atm,lower_energy_cm1,upper_degeneracy,
 * lower_degeneracy}), then the computed columns. Numbers are printed with {@link Double#toString(double)}, which
 * reads back as the same double; missing values are empty; texts are always quoted (quanta keep their blanks).
 */
public final class LineListing {
    /** Name of the computed column of intensities at the requested temperature. */
    public static final String INTENSITY_AT_T_COLUMN = "intensity_at_temperature_cm_per_molecule";
    private static final LineColumn[] COLUMNS = LineColumn.values();
    private static final int BATCH = 8192;

    /**
     * What a listing did.
     *
     * @param linesListed lines written
     * @param linesInSelection lines in the window and species selection (before {@code strongest})
     * @param widthSourcesOrNull how many lines each width source served, per gas (null without a background)
     */
    public record Summary(long linesListed, long linesInSelection, WidthSourceTally widthSourcesOrNull) { }

    private LineListing() {
    }

    /**
     * Lists the lines selected by {@code request}.
     *
     * @param lookup isotopologue data (Q(T), abundances, masses) for the computed columns
     * @param outOrNull the file to write (atomically); null writes CSV or table output to {@code stdout}
     * @param stdout where output goes when {@code outOrNull} is null (flushed, not closed)
     */
    public static Summary write(LineStore store, LineListingRequest request, IsotopologueLookup lookup,
                                ListingFormat format, Path outOrNull, Writer stdout) throws IOException {
        if (format == ListingFormat.ARROW && outOrNull == null) {
            throw new InputException("format arrow writes a file: give the output file (--out FILE.arrow)");
        }
        LineQuery query = query(request);
        long[] selected = request.strongest() > 0 ? strongestSequence(store, query, request, lookup) : null;
        Computed computed = new Computed(request, lookup);
        if (outOrNull == null) {
            return list(store, query, selected, computed, format, stdout, null);
        }
        Path target = outOrNull.toAbsolutePath();
        Files.createDirectories(target.getParent());
        if (format == ListingFormat.ARROW) {
            return list(store, query, selected, computed, format, null, target);
        }
        Summary[] s = new Summary[1];
        AtomicFile.writeText(target, out -> s[0] = list(store, query, selected, computed, format, out, null));
        return s[0];
    }

    /**
     * Positions and intensities of the selected lines — S(T) when the request has a temperature, else S(296 K) —
     * in wavenumber order, for a stick spectrum. At most {@code maxLines} lines: a larger selection is cut to its
     * {@code maxLines} strongest.
     *
     * @return {wavenumbers in cm⁻¹, intensities in cm/molecule}
     */
    public static double[][] sticks(LineStore store, LineListingRequest request, IsotopologueLookup lookup, int maxLines)
            throws IOException {
        LineQuery query = query(request).withColumns(LineQuery.CROSS_SECTION_COLUMNS);
        int limit = request.strongest() > 0 ? Math.min(request.strongest(), maxLines) : maxLines;
        LineListingRequest ranked = new LineListingRequest(request.lowCm1(), request.highCm1(), request.moleculeId(),
                request.isotopologue(), limit, request.temperatureK(), null, null);
        long[] selected = strongestSequence(store, query, ranked, lookup);
        double[] nu = new double[selected.length];
        double[] s = new double[selected.length];
        IsotopologueCache cache = Double.isNaN(request.temperatureK()) ? null
                : new IsotopologueCache(lookup, request.temperatureK());
        LineBatch batch = new LineBatch(BATCH);
        double[] key = new double[BATCH];
        long seq = 0;
        int next = 0;
        try (LineCursor cursor = store.cursor(query)) {
            while (cursor.read(batch) && next < selected.length) {
                rankingIntensity(batch, cache, key);
                for (int i = 0; i < batch.size; i++, seq++) {
                    if (next < selected.length && selected[next] == seq) {
                        nu[next] = batch.wavenumberCm1[i];
                        s[next] = key[i];
                        next++;
                    }
                }
            }
        }
        return new double[][] {Arrays.copyOf(nu, next), Arrays.copyOf(s, next)};
    }

    private static LineQuery query(LineListingRequest r) {
        LineQuery q = LineQuery.all();
        if (Double.isFinite(r.lowCm1()) || Double.isFinite(r.highCm1())) {
            q = q.withWavenumberRange(r.lowCm1(), r.highCm1());
        }
        if (r.moleculeId() > 0) {
            q = r.isotopologue() > 0 ? q.withIsotopologue(r.moleculeId(), r.isotopologue()) : q.withMolecules(r.moleculeId());
        } else if (r.isotopologue() > 0) {
            throw new InputException("isotopologue " + r.isotopologue() + " given without a molecule");
        }
        return q;
    }

    /**
     * First pass for {@code strongest}: the stream positions of the N largest ranking intensities (ties broken by
     * position, earlier first), sorted ascending. A binary min-heap on primitive arrays.
     */
    private static long[] strongestSequence(LineStore store, LineQuery query, LineListingRequest request,
                                            IsotopologueLookup lookup) throws IOException {
        int n = request.strongest();
        double[] heapKey = new double[n];
        long[] heapSeq = new long[n];
        int heapSize = 0;
        LineBatch batch = new LineBatch(BATCH);
        double[] key = new double[BATCH];
        IsotopologueCache cache = Double.isNaN(request.temperatureK()) ? null
                : new IsotopologueCache(lookup, request.temperatureK());
        long seq = 0;
        try (LineCursor cursor = store.cursor(query.withColumns(LineQuery.CROSS_SECTION_COLUMNS))) {
            while (cursor.read(batch)) {
                rankingIntensity(batch, cache, key);
                for (int i = 0; i < batch.size; i++, seq++) {
                    double k = Double.isNaN(key[i]) ? Double.NEGATIVE_INFINITY : key[i];
                    if (heapSize < n) {
                        heapKey[heapSize] = k;
                        heapSeq[heapSize] = seq;
                        siftUp(heapKey, heapSeq, heapSize++);
                    } else if (k > heapKey[0]) {
                        // Strictly greater: on ties the earlier line (already in the heap) stays.
                        heapKey[0] = k;
                        heapSeq[0] = seq;
                        siftDown(heapKey, heapSeq, heapSize);
                    }
                }
            }
        }
        long[] result = Arrays.copyOf(heapSeq, heapSize);
        Arrays.sort(result);
        return result;
    }

    private static void rankingIntensity(LineBatch batch, IsotopologueCache cacheOrNull, double[] out) {
        if (cacheOrNull == null) {
            System.arraycopy(batch.intensityCmPerMolecule, 0, out, 0, batch.size);
        } else {
            LineIntensity.atTemperature(batch, cacheOrNull, out);
        }
    }

    // Min-heap ordered by key, then by later sequence first, so the root is the line to evict.
    private static boolean below(double[] k, long[] s, int a, int b) {
        return k[a] < k[b] || (k[a] == k[b] && s[a] > s[b]);
    }

    private static void siftUp(double[] k, long[] s, int i) {
        while (i > 0) {
            int parent = (i - 1) >>> 1;
            if (!below(k, s, i, parent)) {
                return;
            }
            swap(k, s, i, parent);
            i = parent;
        }
    }

    private static void siftDown(double[] k, long[] s, int size) {
        int i = 0;
        while (true) {
            int l = 2 * i + 1;
            int r = l + 1;
            int m = i;
            if (l < size && below(k, s, l, m)) {
                m = l;
            }
            if (r < size && below(k, s, r, m)) {
                m = r;
            }
            if (m == i) {
                return;
            }
            swap(k, s, i, m);
            i = m;
        }
    }

    private static void swap(double[] k, long[] s, int a, int b) {
        double tk = k[a];
        k[a] = k[b];
        k[b] = tk;
        long ts = s[a];
        s[a] = s[b];
        s[b] = ts;
    }

    private static Summary list(LineStore store, LineQuery query, long[] selectedOrNull, Computed computed,
                                ListingFormat format, Writer text, Path arrowTarget) throws IOException {
        LineBatch batch = new LineBatch(BATCH);
        LineBatch chosen = new LineBatch(BATCH);
        int[] rows = new int[BATCH];
        long seq = 0;
        int nextSelected = 0;
        long listed = 0;
        try (LineCursor cursor = store.cursor(query);
             LineExportWriter arrow = arrowTarget == null ? null
                     : new LineExportWriter(arrowTarget, computed.arrowColumns(), computed.metadata())) {
            if (text != null) {
                header(text, format, computed);
            }
            while (cursor.read(batch)) {
                LineBatch out = batch;
                if (selectedOrNull != null) {
                    int m = 0;
                    for (int i = 0; i < batch.size; i++, seq++) {
                        if (nextSelected < selectedOrNull.length && selectedOrNull[nextSelected] == seq) {
                            rows[m++] = i;
                            nextSelected++;
                        }
                    }
                    chosen.clear();
                    chosen.gatherRows(batch, rows, 0, m);
                    chosen.size = m;
                    out = chosen;
                }
                if (out.size == 0) {
                    continue;
                }
                computed.compute(out);
                if (arrow != null) {
                    arrow.write(out, computed.arrowValues());
                } else if (format == ListingFormat.CSV) {
                    csvRows(text, out, computed);
                } else {
                    tableRows(text, out, computed);
                }
                listed += out.size;
            }
            if (arrow != null) {
                arrow.commit();
            }
            if (text != null) {
                text.flush();
            }
            return new Summary(listed, cursor.linesDelivered(), computed.tally());
        }
    }

    private static void header(Writer w, ListingFormat format, Computed computed) throws IOException {
        if (format == ListingFormat.CSV) {
            StringBuilder sb = new StringBuilder();
            for (LineColumn c : COLUMNS) {
                sb.append(c.columnName()).append(',');
            }
            for (String name : computed.csvColumns()) {
                sb.append(name).append(',');
            }
            sb.setLength(sb.length() - 1);
            w.write(sb.append('\n').toString());
        } else {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT,
                    "%3s %3s %14s %11s %11s %9s %10s %5s %9s %11s %7s %7s  %-15s",
                    "mol", "iso", "wavenumber", "S(296K)", "A(s-1)", "gamma_air", "gamma_self", "n_air", "d_air",
                    "E''", "g'", "g''", "lower quanta"));
            if (computed.hasTemperature()) {
                sb.append(String.format(Locale.ROOT, " %11s", "S(T)"));
            }
            if (computed.hasWidths()) {
                sb.append(String.format(Locale.ROOT, " %9s %6s", "gamma_bg", "n_bg"));
            }
            w.write(sb.append('\n').toString());
        }
    }

    private static void csvRows(Writer w, LineBatch b, Computed computed) throws IOException {
        StringBuilder sb = new StringBuilder(512);
        for (int i = 0; i < b.size; i++) {
            sb.setLength(0);
            for (LineColumn c : COLUMNS) {
                switch (c.kind()) {
                    case INT -> sb.append(c.ints(b)[i]);
                    case LONG -> sb.append(c.longs(b)[i]);
                    case DOUBLE -> number(sb, c.doubles(b)[i]);
                    case TEXT -> quoted(sb, c.text(b), i);
                    default -> throw new AssertionError(c);
                }
                sb.append(',');
            }
            computed.appendCsv(sb, i);
            sb.setLength(sb.length() - 1);
            sb.append('\n');
            w.write(sb.toString());
        }
    }

    private static void tableRows(Writer w, LineBatch b, Computed computed) throws IOException {
        for (int i = 0; i < b.size; i++) {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT,
                    "%3d %3d %14.6f %11.4e %11.4e %9.4f %10.4f %5.2f %9.6f %11.4f %7.1f %7.1f  %-15s",
                    b.moleculeId[i], b.isotopologue[i], b.wavenumberCm1[i], b.intensityCmPerMolecule[i],
                    b.einsteinAS1[i], b.airWidthCm1PerAtm[i], b.selfWidthCm1PerAtm[i], b.airWidthExponent[i],
                    b.airShiftCm1PerAtm[i], b.lowerEnergyCm1[i], b.upperDegeneracy[i], b.lowerDegeneracy[i],
                    b.lowerLocalQuanta.get(i).strip()));
            computed.appendTable(sb, i);
            w.write(sb.append('\n').toString());
        }
    }

    private static void number(StringBuilder sb, double v) {
        if (!Double.isNaN(v)) {
            sb.append(v);
        }
    }

    private static void quoted(StringBuilder sb, TextColumn column, int row) {
        sb.append('"');
        byte[] bytes = column.bytes();
        int start = column.start(row);
        int end = start + column.length(row);
        boolean ascii = true;
        for (int k = start; k < end; k++) {
            if (bytes[k] < 0) {
                ascii = false;
                break;
            }
        }
        String s = ascii ? null : column.get(row);
        if (ascii) {
            for (int k = start; k < end; k++) {
                char ch = (char) bytes[k];
                if (ch == '"') {
                    sb.append('"');
                }
                sb.append(ch);
            }
        } else {
            sb.append(s.replace("\"", "\"\""));
        }
        sb.append('"');
    }

    /** The computed columns: S(T) and background widths, per batch. */
    private static final class Computed {
        private final LineListingRequest request;
        private final IsotopologueCache cache;
        private final WidthResolver resolver;
        private final ResolvedWidths widths;
        private final double[] intensityAtT = new double[BATCH];
        private final BackgroundGas[] gases;

        Computed(LineListingRequest request, IsotopologueLookup lookup) {
            this.request = request;
            this.cache = Double.isNaN(request.temperatureK()) ? null : new IsotopologueCache(lookup, request.temperatureK());
            this.resolver = request.backgroundOrNull() == null ? null : request.widths().newResolver(request.backgroundOrNull());
            this.widths = resolver == null ? null : resolver.newResult(BATCH);
            this.gases = resolver == null ? new BackgroundGas[0] : resolver.composition().presentGases();
        }

        boolean hasTemperature() {
            return cache != null;
        }

        boolean hasWidths() {
            return resolver != null;
        }

        WidthSourceTally tally() {
            return resolver == null ? null : resolver.tally();
        }

        void compute(LineBatch b) {
            if (cache != null) {
                LineIntensity.atTemperature(b, cache, intensityAtT);
            }
            if (resolver != null) {
                resolver.resolve(b, widths);
            }
        }

        List<String> csvColumns() {
            List<String> names = new ArrayList<>(arrowColumns().keySet());
            for (BackgroundGas g : gases) {
                names.add(ResolvedWidths.sourceColumn(g));
            }
            return names;
        }

        Map<String, String> arrowColumns() {
            Map<String, String> m = new LinkedHashMap<>();
            if (cache != null) {
                m.put(INTENSITY_AT_T_COLUMN, "cm-1/(molecule cm-2) at " + request.temperatureK() + " K");
            }
            if (resolver != null) {
                m.put(ResolvedWidths.WIDTH_COLUMN, "cm-1/atm at 296 K");
                m.put(ResolvedWidths.EXPONENT_COLUMN, "1");
                m.put(ResolvedWidths.SHIFT_COLUMN, "cm-1/atm");
            }
            return m;
        }

        double[][] arrowValues() {
            List<double[]> v = new ArrayList<>();
            if (cache != null) {
                v.add(intensityAtT);
            }
            if (resolver != null) {
                v.add(widths.backgroundWidthCm1PerAtm);
                v.add(widths.backgroundWidthExponent);
                v.add(widths.backgroundShiftCm1PerAtm);
            }
            return v.toArray(new double[0][]);
        }

        Map<String, String> metadata() {
            Map<String, String> m = new LinkedHashMap<>();
            m.put("linewright.tool_version", ToolVersion.get());
            m.put("linewright.listing.window_cm1", request.lowCm1() + " " + request.highCm1());
            m.put("linewright.listing.molecule", Integer.toString(request.moleculeId()));
            m.put("linewright.listing.isotopologue", Integer.toString(request.isotopologue()));
            m.put("linewright.listing.strongest", Integer.toString(request.strongest()));
            if (cache != null) {
                m.put("linewright.listing.temperature_K", Double.toString(request.temperatureK()));
            }
            if (resolver != null) {
                m.put("linewright.listing.background", resolver.composition().toString());
                m.put("linewright.listing.background_width_exponent",
                        "width-weighted mean sum(x*g*n)/sum(x*g) of the gases' exponents");
            }
            return m;
        }

        void appendCsv(StringBuilder sb, int row) {
            if (cache != null) {
                number(sb, intensityAtT[row]);
                sb.append(',');
            }
            if (resolver != null) {
                number(sb, widths.backgroundWidthCm1PerAtm[row]);
                sb.append(',');
                number(sb, widths.backgroundWidthExponent[row]);
                sb.append(',');
                number(sb, widths.backgroundShiftCm1PerAtm[row]);
                sb.append(',');
                for (BackgroundGas g : gases) {
                    sb.append(widths.source(g, row).label()).append(',');
                }
            }
        }

        void appendTable(StringBuilder sb, int row) {
            if (cache != null) {
                sb.append(String.format(Locale.ROOT, " %11.4e", intensityAtT[row]));
            }
            if (resolver != null) {
                sb.append(String.format(Locale.ROOT, " %9.5f %6.3f", widths.backgroundWidthCm1PerAtm[row],
                        widths.backgroundWidthExponent[row]));
            }
        }
    }
}
