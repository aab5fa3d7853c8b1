package org.linewright.cli;

import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.io.PrintStream;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.linewright.ingest.partition.SpeciesDataFiles;
import org.linewright.ingest.pipeline.IngestReport;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.BuildReport;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;

/**
 * {@code build --spark}: loads the Spark runner (module {@code spark}) by name, so the local tool needs Spark on
 * its class path only when asked; the launcher adds it when {@code --spark} is given.
 */
final class SparkRunner {
    static final String RUNNER_CLASS = "org.linewright.spark.SparkTableBuild";
    static final String INGEST_CLASS = "org.linewright.spark.SparkIngest";

    private SparkRunner() {
    }

    static BuildReport build(CommandSpec spec, TablePlan plan, String master, boolean quiet) throws Exception {
        Method run;
        try {
            run = Class.forName(RUNNER_CLASS).getMethod("run", TablePlan.class, String.class, boolean.class);
        } catch (ClassNotFoundException | NoSuchMethodException e) {
            throw new ParameterException(spec.commandLine(), "--spark " + org.linewright.ingest.text.OffendingText
                    .quote(master) + ": the Spark runner is not on the class path (run through ./linewright, "
                    + "which adds spark/target when --spark is given)");
        }
        try {
            return (BuildReport) run.invoke(null, plan, master, quiet);
        } catch (InvocationTargetException e) {
            throw e.getCause() instanceof Exception x ? x : e;
        }
    }

    /** {@code ingest --spark}: the file-parallel ingest of the spark module, loaded by name as for {@code build}. */
    static IngestReport ingest(CommandSpec spec, List<Path> sources, Path store, String formatIdOrNull,
                               Map<String, String> parameters, SpeciesDataFiles speciesData, String master,
                               boolean quiet) throws Exception {
        Method run;
        try {
            run = Class.forName(INGEST_CLASS).getMethod("run", List.class, Path.class, String.class, Map.class,
                    SpeciesDataFiles.class, String.class, PrintStream.class);
        } catch (ClassNotFoundException | NoSuchMethodException e) {
            throw new ParameterException(spec.commandLine(), "--spark " + org.linewright.ingest.text.OffendingText
                    .quote(master) + ": the Spark runner is not on the class path (run through ./linewright, "
                    + "which adds spark/target when --spark is given)");
        }
        try {
            return (IngestReport) run.invoke(null, sources, store, formatIdOrNull, parameters, speciesData, master,
                    quiet ? null : System.err);
        } catch (InvocationTargetException e) {
            throw e.getCause() instanceof Exception x ? x : e;
        }
    }
}
