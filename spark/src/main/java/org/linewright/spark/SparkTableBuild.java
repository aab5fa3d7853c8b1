package org.linewright.spark;

import java.io.IOException;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.URI;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.BuildReport;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.TableBuilder;
import org.linewright.ingest.InputException;

/**
 * A table build whose pending (p, T, block) cells run as Spark tasks, one task per cell. The driver plans the build
 * exactly as a local build ({@link TableBuilder}: same hashes, manifest and block store), the executors compute
 * the cells ({@link CellTask}) and save them into the work folder, and the driver assembles the table from the
 * block store: the table is the same bits as a local build, its metadata differs only in {@code runner = spark},
 * and local and Spark builds reuse each other's cells.
 *
 * <p>Storage: executors read the plan, its line lists and line cache, and write the work folder, through the
 * same paths as the driver, so every path must be on storage all of them see under the same name (local paths in
 * local mode; a shared file system mounted at the same place on every node for a cluster).
 */
public final class SparkTableBuild implements AutoCloseable {
    /** The runner recorded in the table metadata. */
    public static final String RUNNER = "spark";
    /** Task attempts before a cell fails the build (Spark's spark.task.maxFailures, applied in local mode too). */
    public static final int TASK_ATTEMPTS = 4;
    /** Spark configuration key of the test hook: "p,t,b" of a cell whose first attempt fails. */
    public static final String FAIL_ONCE_KEY = "spark.linewright.test.failOnceCell";
    private static final Pattern LOCAL = Pattern.compile("local(\\[(\\d+|\\*)])?");
    private static final int CONNECT_TIMEOUT_MS = 5000;

    private final JavaSparkContext context;
    private final boolean owned;
    private final SparkProgress progress;
    private volatile double taskPhaseSeconds;

    private SparkTableBuild(JavaSparkContext context, boolean owned, PrintStream progressOut) {
        this.context = context;
        this.owned = owned;
        this.progress = new SparkProgress(progressOut);
        context.sc().addSparkListener(progress);
    }

    /** Uses a running Spark context (kept open on close). */
    public static SparkTableBuild on(JavaSparkContext context, PrintStream progressOut) {
        return new SparkTableBuild(context, false, progressOut);
    }

    /**
     * Starts Spark on {@code master} ({@code local[N]}, {@code spark://host:port}, {@code yarn}, {@code k8s://…}).
     * A {@code spark://} or {@code k8s://} master that does not answer is one {@link InputException} before
     * anything starts.
     */
    public static SparkTableBuild start(String master, PrintStream progressOut) throws InputException {
        String effective = effectiveMaster(master);
        checkReachable(master);
        SparkConf conf = new SparkConf().setAppName("linewright build").setMaster(effective)
                .set("spark.task.maxFailures", Integer.toString(TASK_ATTEMPTS))
                .set("spark.ui.enabled", "false");
        return new SparkTableBuild(new JavaSparkContext(conf), true, progressOut);
    }

    /**
     * The master Spark is given: {@code local} and {@code local[N]} become {@code local[N,4]}, since Spark's local
     * mode otherwise tries a failed task once only.
     */
    static String effectiveMaster(String master) throws InputException {
        if (master == null || master.isBlank()) {
            throw new InputException("--spark: empty master (expected local[N], spark://HOST:PORT, yarn or k8s://URL)");
        }
        Matcher m = LOCAL.matcher(master);
        if (m.matches()) {
            String n = m.group(2) == null ? "1" : m.group(2);
            if (!n.equals("*") && Integer.parseInt(n) < 1) {
                throw new InputException("--spark: " + master + " (local[N] needs N >= 1)");
            }
            return "local[" + n + "," + TASK_ATTEMPTS + "]";
        }
        if (master.startsWith("local[") || !(master.startsWith("spark://") || master.equals("yarn")
                || master.startsWith("k8s://"))) {
            throw new InputException("--spark: " + org.linewright.ingest.text.OffendingText.quote(master)
                    + " (expected local[N], spark://HOST:PORT, yarn or k8s://URL)");
        }
        return master;
    }

    static void checkReachable(String master) throws InputException {
        List<String> hostPorts = new ArrayList<>();
        if (master.startsWith("spark://")) {
            for (String hp : master.substring("spark://".length()).split(",")) {
                hostPorts.add(hp);
            }
        } else if (master.startsWith("k8s://")) {
            URI u = URI.create(master.substring("k8s://".length()));
            int port = u.getPort() > 0 ? u.getPort() : ("http".equals(u.getScheme()) ? 80 : 443);
            hostPorts.add(u.getHost() + ":" + port);
        } else {
            return;
        }
        for (String hp : hostPorts) {
            int colon = hp.lastIndexOf(':');
            String host = colon < 0 ? hp : hp.substring(0, colon);
            int port = colon < 0 ? 7077 : Integer.parseInt(hp.substring(colon + 1));
            try (Socket s = new Socket()) {
                s.connect(new InetSocketAddress(host, port), CONNECT_TIMEOUT_MS);
                return;
            } catch (IOException e) {
                // try the next master of a high-availability list
            }
        }
        throw new InputException("--spark: master " + master + " does not answer (tried for "
                + CONNECT_TIMEOUT_MS / 1000 + " s); check the address and that the cluster is up");
    }

    /**
     * The command line's entry ({@code linewright build --spark MASTER}): starts Spark on {@code master}, builds,
     * stops. Progress goes to stderr unless {@code quiet}.
     */
    public static BuildReport run(TablePlan plan, String master, boolean quiet) throws IOException {
        try (SparkTableBuild b = start(master, quiet ? null : System.err)) {
            return b.build(plan, BuildListener.NONE);
        }
    }

    /** Builds {@code plan} with its pending cells as Spark tasks. */
    public BuildReport build(TablePlan plan, BuildListener listener) throws IOException {
        checkInputsOnExecutors(plan);
        String failOnce = context.getConf().get(FAIL_ONCE_KEY, "");
        return TableBuilder.build(plan, CalculatorBlocks.factory(), 1, false, listener, RUNNER,
                (p, layout, pending, workDir) -> {
                    progress.begin(pending.size());
                    long t0 = System.nanoTime();
                    String planFile = p.planFile().toAbsolutePath().toString();
                    int blocks = layout.blocks();
                    double reach = layout.reachCm1();
                    String buildId = java.util.UUID.randomUUID().toString();
                    try {
                        context.parallelize(pending, pending.size())
                                .foreach(cell -> CellTask.run(buildId, planFile, blocks, reach, cell, failOnce));
                    } catch (RuntimeException e) {
                        throw new IOException("a Spark task failed " + TASK_ATTEMPTS + " times: "
                                + CellTask.rootMessage(e), e);
                    } finally {
                        taskPhaseSeconds = (System.nanoTime() - t0) * 1e-9;
                        progress.end();
                    }
                });
    }

    /** One small job before any work: every input of the plan must be readable on the executors. */
    private void checkInputsOnExecutors(TablePlan plan) throws InputException {
        List<String> paths = new ArrayList<>();
        paths.add(plan.planFile().toAbsolutePath().toString());
        for (Path s : plan.sources()) {
            paths.add(s.toAbsolutePath().toString());
        }
        List<String> missing = context.parallelize(paths, 1)
                .filter(f -> !Files.isReadable(Path.of(f))).collect();
        if (!missing.isEmpty()) {
            throw new InputException(missing.get(0) + ": not readable on a Spark executor (" + missing.size()
                    + " input(s) missing there); put the plan and its line lists on storage every executor sees");
        }
    }

    /** Executor run time of each successful cell task of the last build, s (for benchmarks). */
    public List<Double> taskSeconds() {
        return progress.taskSeconds();
    }

    /** Wall time of the last build's task phase (from submitting the cells to the last one saved), s. */
    public double taskPhaseSeconds() {
        return taskPhaseSeconds;
    }

    /** Spark's context (for tests). */
    public JavaSparkContext context() {
        return context;
    }

    /** Tasks that failed and were tried again in the last build. */
    public int failedTasks() {
        return progress.failedTasks();
    }

    @Override
    public void close() {
        context.sc().removeSparkListener(progress);
        if (owned) {
            context.stop();
        }
    }

    static UncheckedIOException unchecked(IOException e) {
        return new UncheckedIOException(e);
    }
}
