package org.linewright.spark;

import java.io.IOException;
import java.io.PrintStream;
import java.io.Serializable;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.stream.Stream;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.linewright.ingest.InputException;
import org.linewright.ingest.atomic.AtomicFile;
import org.linewright.ingest.partition.SpeciesDataFiles;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.pipeline.IngestReport;
import org.linewright.ingest.source.LineFormat;
import org.linewright.ingest.store.LineStoreWriter;

/**
 * A file-parallel ingest: each source file is read in its own Spark task, exactly as the local ingest reads it
 * ({@link IngestPipeline}: same reader, same external sort into sorted runs merged into one file), into a staging
 * store of its own under the target store ({@code .partial-spark-<id>/<n>/}); when every task has succeeded the
 * driver moves the finished files into the store and updates its index once ({@link LineStoreWriter#adopt}). The
 * store then holds the same lines, in the same order, with the same columns and metadata, as a sequential ingest of
 * the same files (the files differ only in their creation time).
 *
 * <p>All or nothing: a bad record in any file (strict ingest) stops the whole ingest with the one-line message of
 * the first failing file in the order given, and the store is left as it was (a sequential ingest would have kept
 * the files before it). A task that fails otherwise (an executor lost, a disk error) is tried again by Spark.
 *
 * <p>Storage: executors read the sources and write the staging store through the same paths as the driver, so
 * the sources and the store must be on storage all of them see under the same name (see docs/spark.md); the
 * sources are opened by the paths as given (and recorded so, as in a local ingest), so on a cluster give them as
 * absolute paths. One small job checks that every source is readable on an executor before any file is read.
 */
public final class SparkIngest implements AutoCloseable {
    private static final String STAGING_PREFIX = AtomicFile.PARTIAL + "spark-";

    private final JavaSparkContext context;
    private final boolean owned;

    private SparkIngest(JavaSparkContext context, boolean owned) {
        this.context = context;
        this.owned = owned;
    }

    /** Uses a running Spark context (kept open on close). */
    public static SparkIngest on(JavaSparkContext context) {
        return new SparkIngest(context, false);
    }

    /** Starts Spark on {@code master}; a bad or unreachable master is one {@link InputException} before Spark starts. */
    public static SparkIngest start(String master) throws InputException {
        String effective = SparkTableBuild.effectiveMaster(master);
        SparkTableBuild.checkReachable(master);
        SparkConf conf = new SparkConf().setAppName("linewright ingest").setMaster(effective)
                .set("spark.task.maxFailures", Integer.toString(SparkTableBuild.TASK_ATTEMPTS))
                .set("spark.ui.enabled", "false");
        return new SparkIngest(new JavaSparkContext(conf), true);
    }

    /**
     * The command line's entry ({@code linewright ingest ... --spark MASTER}): starts Spark, ingests, stops.
     *
     * @param formatIdOrNull the format of every source ({@link LineFormat#id()}), or null to detect it per file
     */
    public static IngestReport run(List<Path> sources, Path storeDir, String formatIdOrNull,
                                   Map<String, String> parameters, SpeciesDataFiles speciesData, String master,
                                   PrintStream progressOrNull) throws IOException {
        try (SparkIngest ingest = start(master)) {
            return ingest.ingest(sources, storeDir, formatIdOrNull, parameters, speciesData, progressOrNull);
        }
    }

    /** One source's result, as a task returns it. */
    record Outcome(int index, String failureOrNull, String storeName, String format, String compression,
                   String sha256, long recordsRead, long linesKept, long recordsRejected, long duplicates,
                   double minWavenumberCm1, double maxWavenumberCm1, double seconds) implements Serializable {
    }

    /** Ingests {@code sources} (strict: the first bad record stops the ingest) into {@code storeDir}, one task per file. */
    public IngestReport ingest(List<Path> sources, Path storeDir, String formatIdOrNull, Map<String, String> parameters,
                               SpeciesDataFiles speciesData, PrintStream progressOrNull) throws IOException {
        if (sources.isEmpty()) {
            throw new InputException("no line-list source given");
        }
        if (formatIdOrNull != null) {
            try {
                LineFormat.byId(formatIdOrNull);
            } catch (IllegalArgumentException e) {
                throw new InputException("--input-format: " + e.getMessage());
            }
        }
        IngestPipeline.checkNames(sources);
        List<String> files = new ArrayList<>();
        for (Path s : sources) {
            // As given, as a local ingest records it: a relative path resolves in each executor's working directory
            // (the driver's in local mode); the check below finds one that does not resolve there.
            files.add(s.toString());
        }
        checkReadableOnExecutors(files, speciesData.files());
        Path store = storeDir.toAbsolutePath();
        Files.createDirectories(store);
        Path staging = store.resolve(STAGING_PREFIX + UUID.randomUUID());
        Files.createDirectory(staging);
        String stagingPath = staging.toString();
        Map<String, String> params = Map.copyOf(parameters);
        try {
            List<Integer> indices = new ArrayList<>();
            for (int i = 0; i < files.size(); i++) {
                indices.add(i);
            }
            if (progressOrNull != null) {
                progressOrNull.println("ingest: " + files.size() + " file(s) as Spark tasks on " + context.master());
            }
            List<Outcome> outcomes;
            try {
                outcomes = new ArrayList<>(context.parallelize(indices, indices.size())
                        .map(i -> ingestOne(i, files.get(i), stagingPath, formatIdOrNull, params, speciesData))
                        .collect());
            } catch (RuntimeException e) {
                throw new IOException("a Spark ingest task failed " + SparkTableBuild.TASK_ATTEMPTS + " times: "
                        + CellTask.rootMessage(e), e);
            }
            outcomes.sort(Comparator.comparingInt(Outcome::index));
            for (Outcome o : outcomes) {
                if (o.failureOrNull() != null) {
                    // The first bad file in the order given, whatever order the tasks ran in.
                    throw new InputException(o.failureOrNull());
                }
            }
            List<IngestReport.Source> reports = new ArrayList<>();
            for (Outcome o : outcomes) {
                LineStoreWriter.adopt(store, staging.resolve(Integer.toString(o.index())));
                reports.add(new IngestReport.Source(sources.get(o.index()), o.storeName(), o.format(), o.compression(),
                        o.sha256(), o.recordsRead(), o.linesKept(), o.recordsRejected(), o.duplicates(),
                        o.minWavenumberCm1(), o.maxWavenumberCm1(), o.seconds()));
            }
            return new IngestReport(storeDir, List.copyOf(reports), null);
        } finally {
            deleteTree(staging);
        }
    }

    /** The task: one file into its own staging store; a bad record is an outcome, not a failure to retry. */
    static Outcome ingestOne(int index, String file, String staging, String formatIdOrNull, Map<String, String> params,
                             SpeciesDataFiles speciesData) {
        Path stagedStore = Path.of(staging, Integer.toString(index));
        try {
            deleteTree(stagedStore);   // a retried attempt starts afresh
            LineFormat format = formatIdOrNull == null ? null : LineFormat.byId(formatIdOrNull);
            IngestOptions options = new IngestOptions(format, false, null, speciesData.registry(), params);
            IngestReport report = IngestPipeline.run(List.of(Path.of(file)), stagedStore, options, IngestListener.NONE);
            IngestReport.Source s = report.sources().get(0);
            return new Outcome(index, null, s.storeName(), s.format(), s.compression(), s.sha256(), s.recordsRead(),
                    s.linesKept(), s.recordsRejected(), s.duplicates(), s.minWavenumberCm1(), s.maxWavenumberCm1(),
                    s.seconds());
        } catch (InputException e) {
            deleteTree(stagedStore);
            return new Outcome(index, e.getMessage(), null, null, null, null, 0, 0, 0, 0, Double.NaN, Double.NaN, 0);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** One small job before any file is read: every input must be readable on the executors. */
    private void checkReadableOnExecutors(List<String> sources, List<String> speciesFiles) throws InputException {
        List<String> paths = new ArrayList<>(sources);
        for (String f : speciesFiles) {
            paths.add(Path.of(f).toAbsolutePath().toString());
        }
        List<String> missing = context.parallelize(paths, 1)
                .filter(f -> !Files.isRegularFile(Path.of(f)) || !Files.isReadable(Path.of(f))).collect();
        if (!missing.isEmpty()) {
            throw new InputException(missing.get(0) + ": not readable on a Spark executor (" + missing.size()
                    + " input(s) missing there); put the line lists on storage every executor sees");
        }
    }

    private static void deleteTree(Path dir) {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        } catch (IOException ignored) {
            // a leftover .partial- folder is never listed by the store and can be deleted by hand
        }
    }

    @Override
    public void close() {
        if (owned) {
            context.stop();
        }
    }
}
