package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.linewright.cli.demo.Demo;
import org.linewright.cli.demo.DemoReport;
import org.linewright.cli.demo.DemoStep;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** Runs the demo on the shipped synthetic data and writes its report. */
@Command(name = "demo",
        mixinStandardHelpOptions = true,
        description = {
            "Run the demo on the shipped SYNTHETIC line lists (invented CO and CO2 lines for a fictional "
                    + "sub-Neptune) and write report.txt, report.html and plots into the output folder.",
            ""
        },
        footer = {
            "",
            "Example:",
            "  linewright demo --out /tmp/lw-demo",
            "  xdg-open /tmp/lw-demo/report.html"
        })
public final class DemoCommand implements Callable<Integer> {
    /** System property naming the linewright installation (set by the launcher); the demo lives below it. */
    static final String HOME_PROPERTY = "linewright.home";

    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Option(names = {"-o", "--out"}, paramLabel = "DIR", defaultValue = "linewright-out/demo",
            description = "Output folder (created when missing; files in it are replaced). Default: ${DEFAULT-VALUE}")
    private Path outDir;

    @Option(names = "--demo-dir", paramLabel = "DIR",
            description = "The shipped demo folder with plan.toml and data/. Default: demo/ of the installation.")
    private Path demoDir;

    @Override
    public Integer call() throws Exception {
        boolean quiet = root.globalOptions().quiet();
        PrintWriter out = spec.commandLine().getOut();
        Demo demo = new Demo(demoDir != null ? demoDir : defaultDemoDir(), outDir, Demo.availableSteps(), quiet);
        DemoReport report = demo.run(quiet ? Demo.StepListener.NONE : new Demo.StepListener() {
            @Override
            public void started(DemoStep step) {
            }

            @Override
            public void finished(DemoReport.StepRecord record) {
                out.printf(Locale.ROOT, "  %-62s %8.3f s%n", record.name(), record.took().toNanos() / 1e9);
                out.flush();
            }
        });
        if (!quiet) {
            out.printf(Locale.ROOT, "Demo done in %.1f s (synthetic data). Report: %s%n",
                    report.total().toNanos() / 1e9, report.htmlFile());
        }
        return ExitCodes.OK;
    }

    static Path defaultDemoDir() {
        String home = System.getProperty(HOME_PROPERTY);
        return home != null ? Paths.get(home, "demo") : Paths.get("demo");
    }
}
