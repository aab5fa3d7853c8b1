package org.linewright.cli;

import org.linewright.ingest.ToolVersion;
import picocli.CommandLine.Command;
import picocli.CommandLine.IVersionProvider;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ScopeType;
import picocli.CommandLine.Spec;

/** The root command: global options, version, the list of subcommands. */
@Command(name = "linewright",
        mixinStandardHelpOptions = true,
        versionProvider = LinewrightCommand.Version.class,
        subcommands = {IngestCommand.class, LinesCommand.class, SigmaCommand.class, BuildCommand.class, KTableCommand.class, KTableMixCommand.class,
            VerifyCommand.class, CompareCommand.class, DemoCommand.class,
            CompletionCommand.class},
        description = {
            "Turns spectral line lists into absorption cross-section tables (cm^2/molecule over wavenumber, "
                    + "per pressure and temperature) for chosen background gases.",
            ""
        },
        commandListHeading = "%nCommands:%n",
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {
            "0:success",
            "1:a check ran and found problems",
            "2:bad input or usage (one line on stderr says what and where)",
            "3:internal error (run again with --debug and report the stack trace)"
        },
        footer = {
            "",
            "Example (run the synthetic demo and look at its report):",
            "  linewright demo --out /tmp/lw-demo && less /tmp/lw-demo/report.txt"
        })
public final class LinewrightCommand implements Runnable {
    private final GlobalOptions globalOptions = new GlobalOptions();

    @Spec
    private CommandSpec spec;

    /** @return the global options as set on the command line */
    public GlobalOptions globalOptions() {
        return globalOptions;
    }

    @Option(names = "--debug", scope = ScopeType.INHERIT,
            description = "Show the stack trace with an error message.")
    void setDebug(boolean debug) {
        globalOptions.setDebug(debug);
    }

    @Option(names = {"-q", "--quiet"}, scope = ScopeType.INHERIT,
            description = "No progress bars or informational messages; errors are still reported.")
    void setQuiet(boolean quiet) {
        globalOptions.setQuiet(quiet);
    }

    @Override
    public void run() {
        throw new ParameterException(spec.commandLine(), "no command given");
    }

    /** {@code linewright <version>} from the build. */
    static final class Version implements IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"linewright " + ToolVersion.get()};
        }
    }
}
