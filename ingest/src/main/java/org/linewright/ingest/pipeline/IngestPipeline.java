package org.linewright.ingest.pipeline;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.linewright.ingest.InputException;
import org.linewright.ingest.partition.StoredPartitionFunctions;
import org.linewright.ingest.source.LineSources;
import org.linewright.ingest.source.OpenedSource;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.source.RejectSink;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceInfo;
import org.linewright.ingest.store.SourceMetadata;

/**
 * Reads line-list sources into a line store: format and compression detected per file (or the format given),
 * every source streamed batch by batch into its own store file (so memory stays bounded whatever the number of
 * lines), hashed while it is read, and committed atomically with its counts. Nothing is dropped silently: a
 * strict ingest stops at the first bad record with a one-line {@link InputException} and leaves the store as it
 * was for that source; a lenient one sends every bad record, verbatim with its reason, to the rejects file.
 * Parsing and storing overlap: a reader thread fills batches while the calling thread writes them
 * ({@link BatchHandoff}), so an ingest uses two cores.
 */
public final class IngestPipeline {

    private IngestPipeline() {
    }

    /**
     * Ingests {@code sources} into {@code storeDir} (created if missing). Sources already in the store under the
     * same name (the file name) are replaced.
     */
    public static IngestReport run(List<Path> sources, Path storeDir, IngestOptions options, IngestListener listener)
            throws IOException {
        if (sources.isEmpty()) {
            throw new InputException("no line-list source given");
        }
        for (Path source : sources) {
            if (!Files.isRegularFile(source)) {
                throw new InputException(source + ": no such file");
            }
        }
        checkNames(sources);
        Path rejectsPath = options.rejectsFileOrNull() != null ? options.rejectsFileOrNull()
                : storeDir.resolve("rejects.tsv");
        List<IngestReport.Source> reports = new ArrayList<>();
        try (RejectsFile rejects = new RejectsFile(rejectsPath)) {
            RejectSink sink = options.lenient() ? rejects : RejectSink.DISCARD;
            ReadOptions readOptions = new ReadOptions(options.lenient(), sink, options.isotopologues(),
                    ReadOptions.DEFAULT_BATCH_SIZE);
            for (Path source : sources) {
                reports.add(ingestOne(source, storeDir, options, readOptions, readOptions.batchSize(), listener));
            }
            Path written = rejects.commit();
            if (written == null && options.lenient() && options.rejectsFileOrNull() != null) {
                // The user asked for this file: an empty one (header only) says "nothing rejected".
                Files.createDirectories(rejectsPath.toAbsolutePath().getParent());
                Files.writeString(rejectsPath, RejectsFile.HEADER + System.lineSeparator());
                written = rejectsPath;
            }
            return new IngestReport(storeDir, List.copyOf(reports), written);
        }
    }

    private static IngestReport.Source ingestOne(Path source, Path storeDir, IngestOptions options,
                                                 ReadOptions readOptions, int batchCapacity, IngestListener listener)
            throws IOException {
        long started = System.nanoTime();
        listener.sourceStarted(source, Files.size(source));
        String name = storeName(source);
        try (OpenedSource opened = open(source, options, readOptions)) {
            Map<String, String> parameters = new LinkedHashMap<>(options.parameters());
            parameters.put("lenient", Boolean.toString(options.lenient()));
            parameters.put("format_requested", options.formatOrNull() == null ? "detect" : options.formatOrNull().id());
            parameters.put("compression", opened.compression());
            // The data's own partition function travels with the lines, to be used at every temperature.
            opened.reader().partitionFunctions().forEach((id, table) ->
                    parameters.putAll(StoredPartitionFunctions.parameters(id.moleculeId(), id.isotopologue(), table)));
            SourceMetadata metadata = SourceMetadata.of(opened.fileName(), "", opened.format().id(), parameters);
            try (LineStoreWriter writer = LineStoreWriter.create(storeDir, name, metadata,
                    opened.reader().columnsProvided())) {
                new BatchHandoff(opened.reader(), batchCapacity).drainInto(writer, records -> listener.recordsRead(source, records));
                long read = opened.reader().recordsRead();
                long rejected = opened.reader().recordsRejected();
                long duplicates = Math.max(0, opened.duplicatesSeen());
                String sha256 = digests(opened);
                SourceInfo info = writer.commit(new IngestCounts(read, read - rejected, rejected, duplicates), sha256);
                IngestReport.Source report = new IngestReport.Source(source, name, opened.format().id(),
                        opened.compression(), sha256, read, read - rejected, rejected, duplicates,
                        info.minWavenumberCm1(), info.maxWavenumberCm1(), (System.nanoTime() - started) * 1e-9);
                listener.sourceFinished(report);
                return report;
            }
        }
    }

    /**
     * The SHA-256 of a single-file source, or {@code name=sha256} pairs separated by {@code ;} for a multi-file
     * source (a state/transition set), every file named.
     */
    private static String digests(OpenedSource opened) {
        List<OpenedSource.FileDigest> files = opened.files().get();
        if (files.size() == 1) {
            return files.get(0).sha256Hex();
        }
        StringBuilder sb = new StringBuilder();
        for (OpenedSource.FileDigest d : files) {
            if (sb.length() > 0) {
                sb.append(';');
            }
            sb.append(d.fileName()).append('=').append(d.sha256Hex());
        }
        return sb.toString();
    }

    private static OpenedSource open(Path source, IngestOptions options, ReadOptions readOptions) throws IOException {
        try {
            return LineSources.open(source, options.formatOrNull(), readOptions);
        } catch (NoSuchFileException e) {
            throw new InputException(source + ": no such file", e);
        }
    }

    /** Refuses two sources with the same store name (file name): one would replace the other in the store. */
    public static void checkNames(List<Path> sources) throws InputException {
        Set<String> names = new HashSet<>();
        for (Path source : sources) {
            String name = storeName(source);
            if (!names.add(name)) {
                throw new InputException(source + ": another source has the same file name '" + name
                        + "'; the store names sources by file name, so ingest them into separate stores or rename one");
            }
        }
    }

    /** The name a source has in the store: its file name. */
    public static String storeName(Path source) {
        return source.getFileName().toString();
    }
}
