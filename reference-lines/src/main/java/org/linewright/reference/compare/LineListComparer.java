package org.linewright.reference.compare;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.TreeMap;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.reference.data.ReferenceLines;

/**
 * Compares two line lists (line stores) and reports the lines added, removed and changed, field by field.
 *
 * <p>Pairing: a line of the old list is paired with the unpaired line of the new list that has the same species
 * and identical quantum labels (upper/lower global and local) and lies nearest to it within
 * {@link CompareOptions#matchWindowCm1()}; lines still unpaired are then paired with the nearest unpaired line of
 * the same species within {@link CompareOptions#nearestToleranceCm1()}. Everything left is removed (old) or
 * added (new).
 *
 * <p>Both stores are sorted by wavenumber, so the comparison is one merge over both with a window: with the old
 * list at position ν, the new list is held from about ν − W − 2T to ν + W + T (W the window, T the tolerance),
 * and a line is settled once no line that could still pair with it remains to be read. Memory is bounded by the
 * lines within that span (plus the listed changes), whatever the lists' length. Lines of the new list are found by
 * their labels through a hash index of the window, so the cost per line is constant when labels are unique (lists
 * without labels fall back to a scan of the lines of equal, empty labels within the window).
 */
public final class LineListComparer {
    private final CompareOptions options;

    public LineListComparer(CompareOptions options) {
        this.options = Objects.requireNonNull(options, "options");
    }

    /** Compares {@code oldStore} with {@code newStore}; the names label the report. */
    public ComparisonReport compare(LineStore oldStore, String oldName, LineStore newStore, String newName)
            throws IOException {
        try (LineWindow olds = new LineWindow(oldStore.cursor(LineQuery.all()));
             LineWindow news = new LineWindow(newStore.cursor(LineQuery.all()))) {
            Run run = new Run(olds, news);
            run.execute();
            return run.report(oldName, newName);
        }
    }

    /** One comparison. */
    private final class Run {
        private final LineWindow olds;
        private final LineWindow news;
        private final double window = options.matchWindowCm1();
        private final double tolerance = options.nearestToleranceCm1();
        private long[] pending = new long[64];
        private int pendingHead;
        private int pendingTail;
        private long addedScan;
        private long oldLines;
        private long newLines;
        private long unchanged;
        private long changed;
        private long added;
        private long removed;
        private final EnumMap<LineColumn, double[]> fieldStats = new EnumMap<>(LineColumn.class);
        /** Per band, keyed by zero-padded molecule/isotopologue and the labels (so the map sorts by species). */
        private final TreeMap<String, BandTally> bands = new TreeMap<>();
        private final List<LineChange> listed = new ArrayList<>();
        private final List<FieldChange> scratch = new ArrayList<>();

        Run(LineWindow olds, LineWindow news) {
            this.olds = olds;
            this.news = news;
        }

        void execute() throws IOException {
            long index = 0;
            while (true) {
                if (index == olds.end() && !olds.loadOne()) {
                    break;
                }
                double nu = olds.wavenumber(index);
                news.loadBeyond(nu + window + tolerance);
                long partner = labelPartner(index, nu);
                if (partner >= 0) {
                    pair(index, partner, LineChange.MatchedBy.QUANTA);
                } else {
                    enqueue(index);
                }
                settlePending(nu - window - tolerance);
                settleAdded(nu - window - 2 * tolerance);
                index++;
                olds.releaseBefore(pendingHead < pendingTail ? Math.min(pending[pendingHead], index) : index);
            }
            oldLines = index;
            settlePending(Double.POSITIVE_INFINITY);
            settleAdded(Double.POSITIVE_INFINITY);
            while (news.loadOne()) {
                settleAdded(Double.POSITIVE_INFINITY);
            }
            newLines = news.end();
        }

        /** The nearest unpaired new line with the same identity within the window, or −1. */
        private long labelPartner(long oldIndex, double nu) {
            LineWindow.Chunk oc = olds.chunk(oldIndex);
            int or = olds.row(oldIndex);
            long identity = oc.identity[or];
            long best = -1;
            double bestDistance = Double.POSITIVE_INFINITY;
            for (long n = news.newestWithIdentity(identity); n >= 0; n = news.previousSame(n)) {
                LineWindow.Chunk nc = news.chunk(n);
                int nr = news.row(n);
                double signed = nc.batch.wavenumberCm1[nr] - nu;
                if (signed < -window) {
                    // the chain runs from newer to older lines, i.e. downwards in wavenumber: none nearer follows
                    break;
                }
                double d = Math.abs(signed);
                if (!nc.done[nr] && d <= window && (d < bestDistance || (d == bestDistance && n < best))
                        && nc.identity[nr] == identity && sameIdentity(oc.batch, or, nc.batch, nr)) {
                    best = n;
                    bestDistance = d;
                }
            }
            return best;
        }

        /** Pairs pending old lines below {@code limit} with the nearest unpaired new line, else removes them. */
        private void settlePending(double limit) {
            while (pendingHead < pendingTail) {
                long o = pending[pendingHead];
                LineWindow.Chunk oc = olds.chunk(o);
                int or = olds.row(o);
                double nu = oc.batch.wavenumberCm1[or];
                if (!(nu < limit)) {
                    break;
                }
                pendingHead++;
                long best = -1;
                double bestDistance = Double.POSITIVE_INFINITY;
                for (long n = news.lowerBound(nu - tolerance); n < news.end(); n++) {
                    LineWindow.Chunk nc = news.chunk(n);
                    int nr = news.row(n);
                    double d = Math.abs(nc.batch.wavenumberCm1[nr] - nu);
                    if (nc.batch.wavenumberCm1[nr] - nu > tolerance) {
                        break;
                    }
                    if (!nc.done[nr] && d <= tolerance && d < bestDistance
                            && nc.batch.moleculeId[nr] == oc.batch.moleculeId[or]
                            && nc.batch.isotopologue[nr] == oc.batch.isotopologue[or]) {
                        best = n;
                        bestDistance = d;
                    }
                }
                if (best >= 0) {
                    pair(o, best, LineChange.MatchedBy.NEAREST);
                } else {
                    removed++;
                    oc.done[or] = true;
                    record(LineChange.Kind.REMOVED, null, oc.batch, or, null, -1, List.of());
                }
            }
        }

        /** Declares unpaired new lines below {@code limit} added and releases what is settled. */
        private void settleAdded(double limit) {
            while (addedScan < news.end()) {
                LineWindow.Chunk nc = news.chunk(addedScan);
                int nr = news.row(addedScan);
                if (!(nc.batch.wavenumberCm1[nr] < limit)) {
                    break;
                }
                if (!nc.done[nr]) {
                    nc.done[nr] = true;
                    added++;
                    record(LineChange.Kind.ADDED, null, null, -1, nc.batch, nr, List.of());
                }
                addedScan++;
            }
            news.releaseBefore(addedScan);
        }

        private void enqueue(long index) {
            if (pendingTail == pending.length) {
                int live = pendingTail - pendingHead;
                if (pendingHead > pending.length / 2) {
                    System.arraycopy(pending, pendingHead, pending, 0, live);
                } else {
                    pending = Arrays.copyOfRange(pending, pendingHead, pendingHead + Math.max(64, 2 * pending.length));
                }
                pendingHead = 0;
                pendingTail = live;
            }
            pending[pendingTail++] = index;
        }

        private void pair(long o, long n, LineChange.MatchedBy by) {
            LineWindow.Chunk oc = olds.chunk(o);
            LineWindow.Chunk nc = news.chunk(n);
            int or = olds.row(o);
            int nr = news.row(n);
            oc.done[or] = true;
            nc.done[nr] = true;
            scratch.clear();
            for (int k = 0; k < LineWindow.NUMERIC_COMPARED.length; k++) {
                double a = oc.numeric[k][or];
                double b = nc.numeric[k][nr];
                if (!(a == b || (Double.isNaN(a) && Double.isNaN(b)))) {
                    scratch.add(new FieldChange(LineWindow.NUMERIC_COMPARED[k], a, b, null, null));
                }
            }
            for (int k = 0; k < LineWindow.TEXT_COMPARED.length; k++) {
                TextColumn a = oc.text[k];
                TextColumn b = nc.text[k];
                if (!sameText(a, or, b, nr)) {
                    scratch.add(new FieldChange(LineWindow.TEXT_COMPARED[k], Double.NaN, Double.NaN, text(a, or),
                            text(b, nr)));
                }
            }
            // report fields in column order
            scratch.sort(Comparator.comparing(FieldChange::column));
            if (scratch.isEmpty()) {
                unchanged++;
                return;
            }
            changed++;
            double at = nc.batch.wavenumberCm1[nr];
            for (FieldChange f : scratch) {
                double[] s = fieldStats.computeIfAbsent(f.column(), k -> new double[] {0, Double.NaN, Double.NaN, Double.NaN});
                s[0]++;
                if (!f.isText()) {
                    double abs = Math.abs(f.absoluteChange());
                    if (!(abs <= s[1])) {
                        s[1] = abs;
                        s[3] = at;
                    }
                    double rel = Math.abs(f.relativeChange());
                    if (!(rel <= s[2])) {
                        s[2] = rel;
                    }
                }
            }
            record(LineChange.Kind.CHANGED, by, oc.batch, or, nc.batch, nr, scratch);
        }

        private void record(LineChange.Kind kind, LineChange.MatchedBy by, LineBatch ob, int or, LineBatch nb, int nr,
                            List<FieldChange> fields) {
            LineBatch id = nb != null ? nb : ob;
            int ir = nb != null ? nr : or;
            String upperGlobal = text(id.upperGlobalQuanta, ir);
            String lowerGlobal = text(id.lowerGlobalQuanta, ir);
            double nu = id.wavenumberCm1[ir];
            String band = String.format(Locale.ROOT, "%06d/%06d\t%s\t%s", id.moleculeId[ir], id.isotopologue[ir],
                    ReferenceLines.normalizeLabel(upperGlobal), ReferenceLines.normalizeLabel(lowerGlobal));
            BandTally tally = bands.computeIfAbsent(band, k -> new BandTally(id.moleculeId[ir], id.isotopologue[ir],
                    ReferenceLines.normalizeLabel(upperGlobal), ReferenceLines.normalizeLabel(lowerGlobal)));
            tally.counts[kind.ordinal()]++;
            tally.minWavenumberCm1 = Math.min(tally.minWavenumberCm1, nu);
            tally.maxWavenumberCm1 = Math.max(tally.maxWavenumberCm1, nu);
            if (listed.size() < options.maxListedChanges()) {
                listed.add(new LineChange(kind, by, id.moleculeId[ir], id.isotopologue[ir],
                        ob == null ? Double.NaN : ob.wavenumberCm1[or], nb == null ? Double.NaN : nb.wavenumberCm1[nr],
                        ob == null ? 0 : ob.sourceLine[or], nb == null ? 0 : nb.sourceLine[nr], upperGlobal, lowerGlobal,
                        text(id.upperLocalQuanta, ir), text(id.lowerLocalQuanta, ir), fields));
            }
        }

        ComparisonReport report(String oldName, String newName) {
            EnumMap<LineColumn, ComparisonReport.FieldSummary> fields = new EnumMap<>(LineColumn.class);
            fieldStats.forEach((c, s) -> fields.put(c, new ComparisonReport.FieldSummary((long) s[0], s[1], s[2], s[3])));
            List<ComparisonReport.BandSummary> bandSummaries = new ArrayList<>();
            for (BandTally t : bands.values()) {
                bandSummaries.add(new ComparisonReport.BandSummary(t.moleculeId, t.isotopologue, t.upperGlobal,
                        t.lowerGlobal, t.counts[LineChange.Kind.ADDED.ordinal()],
                        t.counts[LineChange.Kind.REMOVED.ordinal()], t.counts[LineChange.Kind.CHANGED.ordinal()],
                        t.minWavenumberCm1, t.maxWavenumberCm1));
            }
            List<LineChange> sorted = new ArrayList<>(listed);
            sorted.sort(Comparator.comparingDouble(LineChange::wavenumberCm1));
            return new ComparisonReport(oldName, newName, options, oldLines, newLines, unchanged, changed, added,
                    removed, fields, bandSummaries, sorted);
        }
    }

    /** Changes counted in one band (one per band, not per line). */
    private static final class BandTally {
        final int moleculeId;
        final int isotopologue;
        final String upperGlobal;
        final String lowerGlobal;
        /** Indexed by {@link LineChange.Kind#ordinal()}. */
        final long[] counts = new long[LineChange.Kind.values().length];
        double minWavenumberCm1 = Double.POSITIVE_INFINITY;
        double maxWavenumberCm1 = Double.NEGATIVE_INFINITY;

        BandTally(int moleculeId, int isotopologue, String upperGlobal, String lowerGlobal) {
            this.moleculeId = moleculeId;
            this.isotopologue = isotopologue;
            this.upperGlobal = upperGlobal;
            this.lowerGlobal = lowerGlobal;
        }
    }

    private static boolean sameIdentity(LineBatch a, int ar, LineBatch b, int br) {
        return a.moleculeId[ar] == b.moleculeId[br] && a.isotopologue[ar] == b.isotopologue[br]
                && sameText(a.upperGlobalQuanta, ar, b.upperGlobalQuanta, br)
                && sameText(a.lowerGlobalQuanta, ar, b.lowerGlobalQuanta, br)
                && sameText(a.upperLocalQuanta, ar, b.upperLocalQuanta, br)
                && sameText(a.lowerLocalQuanta, ar, b.lowerLocalQuanta, br);
    }

    private static boolean sameText(TextColumn a, int ar, TextColumn b, int br) {
        int al = a.rows() > ar ? a.length(ar) : 0;
        int bl = b.rows() > br ? b.length(br) : 0;
        if (al != bl) {
            return false;
        }
        return al == 0 || Arrays.equals(a.bytes(), a.start(ar), a.start(ar) + al, b.bytes(), b.start(br), b.start(br) + bl);
    }

    private static String text(TextColumn c, int r) {
        return c.rows() > r ? c.get(r) : "";
    }
}
