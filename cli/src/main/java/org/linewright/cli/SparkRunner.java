package org.linewright.cli;

import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
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
}
