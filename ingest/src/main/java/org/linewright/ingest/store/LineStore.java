package org.linewright.ingest.store;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.linewright.ingest.InputException;
import org.linewright.ingest.source.IsotopologueLookup;

/**
 * A line store opened for reading: the sources listed in its index (ordered by name), their metadata, and
 * cursors that stream the lines of all sources merged in wavenumber order.
 *
 * <p>Layout: a directory with the index {@code linestore.properties} and one Arrow IPC file per source
 * ({@code lines-<name>-<hash>.arrow}), sorted by wavenumber, one field per
 * {@link org.linewright.ingest.line.LineColumn} with its unit in the field metadata; schema metadata holds
 * the provenance, the counts and per-batch wavenumber ranges (completed when the file ends, in the schema of
 * the file's footer, which IPC file readers use). Files named
 * {@code .partial-...} are unfinished writes and are ignored.
 *
 * <p>The store is a snapshot taken at {@link #open}: later commits are seen by opening it again.
 */
public final class LineStore {
    private final Path dir;
    private final List<SourceInfo> sources;
    private final List<ArrowLineFile> files;

    private LineStore(Path dir, List<SourceInfo> sources, List<ArrowLineFile> files) {
        this.dir = dir;
        this.sources = List.copyOf(sources);
        this.files = List.copyOf(files);
    }

    /**
     * Opens a store directory.
     *
     * @throws InputException when the directory is not a line store or a listed file is missing or damaged
     */
    public static LineStore open(Path dir) throws IOException {
        if (!Files.isDirectory(dir)) {
            throw new InputException(dir + ": not a directory (expected a line store)");
        }
        if (!Files.exists(dir.resolve(StoreIndex.FILE_NAME))) {
            throw new InputException(dir + ": no " + StoreIndex.FILE_NAME + " (expected a line store)");
        }
        TreeMap<String, StoreIndex.Entry> entries = StoreIndex.read(dir);
        List<SourceInfo> sources = new ArrayList<>();
        List<ArrowLineFile> files = new ArrayList<>();
        for (StoreIndex.Entry e : entries.values()) {
            Path path = dir.resolve(e.fileName());
            if (!Files.isRegularFile(path)) {
                throw new InputException(dir.resolve(StoreIndex.FILE_NAME) + ": source '" + e.name() + "': file "
                        + e.fileName() + " is missing");
            }
            ArrowLineFile file = ArrowLineFile.open(path);
            files.add(file);
            sources.add(describe(e.name(), file));
        }
        return new LineStore(dir, sources, files);
    }

    /** The store directory. */
    public Path directory() {
        return dir;
    }

    /** The sources, ordered by name (the merge order of equal wavenumbers). */
    public List<SourceInfo> sources() {
        return sources;
    }

    /** The source of this name, or null. */
    public SourceInfo source(String name) {
        for (SourceInfo s : sources) {
            if (s.name().equals(name)) {
                return s;
            }
        }
        return null;
    }

    /** Lines in all sources. */
    public long totalLines() {
        long n = 0;
        for (SourceInfo s : sources) {
            n += s.lines();
        }
        return n;
    }

    /** Lowest wavenumber of all sources in cm⁻¹ (NaN when the store holds no lines). */
    public double minWavenumberCm1() {
        double min = Double.NaN;
        for (SourceInfo s : sources) {
            if (s.lines() > 0 && !(s.minWavenumberCm1() >= min)) {
                min = s.minWavenumberCm1();
            }
        }
        return min;
    }

    /** Highest wavenumber of all sources in cm⁻¹ (NaN when the store holds no lines). */
    public double maxWavenumberCm1() {
        double max = Double.NaN;
        for (SourceInfo s : sources) {
            if (s.lines() > 0 && !(s.maxWavenumberCm1() <= max)) {
                max = s.maxWavenumberCm1();
            }
        }
        return max;
    }

    /**
     * A cursor over the lines the query selects, from all sources merged in ascending wavenumber order
     * (equal wavenumbers: sources by name, then file order). Sources holding none of the selected species
     * or no line in the range are not opened.
     */
    public LineCursor cursor(LineQuery query) throws IOException {
        List<ArrowLineFile> selected = new ArrayList<>();
        for (int i = 0; i < sources.size(); i++) {
            SourceInfo s = sources.get(i);
            if (s.lines() == 0 || s.maxWavenumberCm1() < query.minWavenumberCm1()
                    || s.minWavenumberCm1() > query.maxWavenumberCm1()) {
                continue;
            }
            if (query.selectsSpecies() && s.isotopologues().stream().noneMatch(id -> query.selects(id.moleculeId(), id.isotopologue()))) {
                continue;
            }
            selected.add(files.get(i));
        }
        return new LineCursor(selected, query, LineCursor.DEFAULT_SLICE_ROWS);
    }

    /** Reads a source's description from its file's metadata. */
    static SourceInfo describe(String name, ArrowLineFile file) {
        Map<String, String> s = file.metadata;
        Map<String, String> f = file.metadata;
        String where = file.path.toString();
        if (!StoreColumns.STORE_FORMAT_VERSION.equals(s.get(StoreColumns.KEY_STORE_FORMAT))) {
            throw new InputException(where + ": schema metadata " + StoreColumns.KEY_STORE_FORMAT + ": \""
                    + s.get(StoreColumns.KEY_STORE_FORMAT) + "\" (expected " + StoreColumns.STORE_FORMAT_VERSION + ")");
        }
        Map<String, String> params = new LinkedHashMap<>();
        s.forEach((k, v) -> {
            if (k.startsWith(StoreColumns.PARAM_PREFIX)) {
                params.put(k.substring(StoreColumns.PARAM_PREFIX.length()), v);
            }
        });
        SourceMetadata meta = new SourceMetadata(s.getOrDefault(StoreColumns.KEY_SOURCE_FILE, ""),
                s.getOrDefault(StoreColumns.KEY_SOURCE_SHA256, ""), s.getOrDefault(StoreColumns.KEY_READER_FORMAT, ""),
                s.getOrDefault(StoreColumns.KEY_TOOL_VERSION, ""), params);
        Instant created;
        try {
            created = Instant.parse(s.getOrDefault(StoreColumns.KEY_CREATED, ""));
        } catch (DateTimeParseException e) {
            throw new InputException(where + ": schema metadata " + StoreColumns.KEY_CREATED + ": \""
                    + s.get(StoreColumns.KEY_CREATED) + "\" (expected an ISO-8601 instant)");
        }
        IngestCounts counts = new IngestCounts(number(where, f, StoreColumns.KEY_RECORDS_READ),
                number(where, f, StoreColumns.KEY_LINES_KEPT), number(where, f, StoreColumns.KEY_RECORDS_REJECTED),
                number(where, f, StoreColumns.KEY_DUPLICATES));
        List<IsotopologueLookup.Id> isotopologues = new ArrayList<>();
        String isoList = f.getOrDefault(StoreColumns.KEY_ISOTOPOLOGUES, "");
        if (!isoList.isEmpty()) {
            for (String pair : isoList.split(" ")) {
                int slash = pair.indexOf('/');
                isotopologues.add(new IsotopologueLookup.Id(Integer.parseInt(pair.substring(0, slash)),
                        Integer.parseInt(pair.substring(slash + 1))));
            }
        }
        return new SourceInfo(name, file.path, meta, created, counts, number(where, f, StoreColumns.KEY_LINES),
                Double.parseDouble(f.getOrDefault(StoreColumns.KEY_WAVENUMBER_MIN, "NaN")),
                Double.parseDouble(f.getOrDefault(StoreColumns.KEY_WAVENUMBER_MAX, "NaN")), isotopologues);
    }

    private static long number(String where, Map<String, String> metadata, String key) {
        String v = metadata.get(key);
        try {
            return Long.parseLong(v);
        } catch (NumberFormatException e) {
            throw new InputException(where + ": schema metadata " + key + ": \"" + v + "\" (expected a whole number)");
        }
    }
}
