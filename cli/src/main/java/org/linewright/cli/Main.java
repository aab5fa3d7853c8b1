package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.charset.Charset;
import org.linewright.cli.units.QuantityConverters;
import picocli.CommandLine;

/**
 * Entry point of the {@code linewright} command line. The commands are thin shells over the Java APIs of
 * the modules; this class only builds the command tree and its error handling.
 */
public final class Main {
    private Main() {
    }

    /** Runs the command line and exits the JVM with the command's exit code ({@link ExitCodes}). */
    public static void main(String[] args) {
        // plots are drawn off-screen; no display is needed or wanted
        System.setProperty("java.awt.headless", "true");
        PrintWriter out = new PrintWriter(System.out, true, Charset.defaultCharset());
        PrintWriter err = new PrintWriter(System.err, true, Charset.defaultCharset());
        Thread.setDefaultUncaughtExceptionHandler((thread, failure) -> {
            // A thread outside any executor (or a pool thread given a bare Runnable) died: one line, not the JVM's
            // stack trace; after a JVM error (out of memory) nothing can be trusted to finish, so stop at once.
            err.println(uncaughtLine(thread, failure));
            err.flush();
            if (failure instanceof VirtualMachineError) {
                Runtime.getRuntime().halt(ExitCodes.INTERNAL_ERROR);
            }
        });
        int code = execute(out, err, args);
        out.flush();
        err.flush();
        System.exit(code);
    }

    /**
     * The one line printed when {@code failure} escapes a thread other than the command's: what ran out and what
     * to change for a JVM error, else the internal error and its thread.
     */
    static String uncaughtLine(Thread thread, Throwable failure) {
        String resources = JvmErrors.describe(failure);
        String line = resources != null ? resources
                : "internal error in thread '" + thread.getName() + "': " + failure.getClass().getName()
                        + (failure.getMessage() == null ? "" : ": " + ErrorReporting.oneLine(failure.getMessage()));
        return ErrorReporting.PREFIX + ErrorReporting.printable(line);
    }

    /**
     * Runs one command line without exiting the JVM.
     *
     * @return the exit code ({@link ExitCodes})
     */
    public static int execute(PrintWriter out, PrintWriter err, String... args) {
        CommandLine commandLine = commandLine(out, err);
        try {
            return commandLine.execute(args);
        } catch (Error e) {
            // picocli hands exceptions to ErrorReporting but lets errors (out of memory, stack overflow) through
            LinewrightCommand root = commandLine.getCommand();
            return new ErrorReporting(root.globalOptions()).report(e, err);
        }
    }

    /**
     * The configured command tree writing to the given streams. Streams, converters and error handling are
     * applied to every command present when this returns, so extra commands must be passed here rather than
     * added afterwards.
     *
     * @param extraCommands further picocli command objects (annotated with {@code @Command(name = ...)})
     */
    public static CommandLine commandLine(PrintWriter out, PrintWriter err, Object... extraCommands) {
        LinewrightCommand root = new LinewrightCommand();
        CommandLine commandLine = new CommandLine(root);
        for (Object command : extraCommands) {
            commandLine.addSubcommand(command);
        }
        QuantityConverters.registerAll(commandLine);
        ErrorReporting errors = new ErrorReporting(root.globalOptions());
        commandLine.setOut(out)
                .setErr(err)
                .setExecutionExceptionHandler(errors)
                .setParameterExceptionHandler(errors)
                .setExitCodeExceptionMapper(t -> ExitCodes.INTERNAL_ERROR)
                .setCaseInsensitiveEnumValuesAllowed(true);
        return commandLine;
    }
}
