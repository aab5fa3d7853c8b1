package org.linewright.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;
import picocli.CommandLine;
import picocli.CommandLine.IExecutionExceptionHandler;
import picocli.CommandLine.IParameterExceptionHandler;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ParseResult;

/**
 * How every command reports failures: one line on stderr, prefixed {@value #PREFIX}, and an exit code from
 * {@link ExitCodes}. Bad input ({@link InputException}, a missing or unreadable file, a usage error) exits with
 * {@link ExitCodes#BAD_INPUT}; anything else is a fault of the program and exits with
 * {@link ExitCodes#INTERNAL_ERROR}. A JVM error (out of memory, stack overflow) is one line saying what ran out and
 * what to change. Every line passes through {@link OffendingText}, so no control character of the input reaches
 * the terminal. The stack trace follows only with {@code --debug}.
 */
final class ErrorReporting implements IExecutionExceptionHandler, IParameterExceptionHandler {
    /** Prefix of every error line. */
    static final String PREFIX = "linewright: error: ";

    private final GlobalOptions globalOptions;

    ErrorReporting(GlobalOptions globalOptions) {
        this.globalOptions = globalOptions;
    }

    /** Longest error line printed (characters of the message; the rest is cut with a count). */
    static final int MAX_LINE_CHARS = 1000;

    @Override
    public int handleExecutionException(Exception ex, CommandLine commandLine, ParseResult parseResult) {
        return report(ex, commandLine.getErr());
    }

    /** Reports any throwable (an exception from a command, or an {@link Error} that escaped picocli). */
    int report(Throwable ex, PrintWriter err) {
        int code;
        String line;
        InputException input = find(ex, InputException.class);
        IOException io = input == null ? find(ex, IOException.class) : null;
        String resources = input == null ? JvmErrors.describe(ex) : null;
        if (resources != null) {
            line = resources;
            code = ExitCodes.INTERNAL_ERROR;
        } else if (input != null) {
            line = oneLine(input.getMessage());
            code = ExitCodes.BAD_INPUT;
        } else if (io != null) {
            line = describe(io);
            code = ExitCodes.BAD_INPUT;
        } else {
            line = "internal error: " + ex.getClass().getName()
                    + (ex.getMessage() == null ? "" : ": " + oneLine(ex.getMessage()))
                    + (globalOptions.debug() ? "" : " (run again with --debug for the stack trace)");
            code = ExitCodes.INTERNAL_ERROR;
        }
        err.println(PREFIX + printable(line));
        if (globalOptions.debug()) {
            ex.printStackTrace(err);
        }
        err.flush();
        return code;
    }

    /** The line with every non-printable character escaped and cut to {@link #MAX_LINE_CHARS}. */
    static String printable(String line) {
        return OffendingText.escape(line, MAX_LINE_CHARS);
    }

    @Override
    public int handleParseException(ParameterException ex, String[] args) {
        CommandLine commandLine = ex.getCommandLine();
        PrintWriter err = commandLine.getErr();
        String command = commandLine.getCommandSpec().qualifiedName();
        String message = oneLine(ex.getMessage());
        // picocli starts some messages with its own "Error: ", which would follow our prefix
        if (message.startsWith("Error: ")) {
            message = message.substring("Error: ".length());
        }
        err.println(PREFIX + printable(message) + " (see '" + command + " --help')");
        if (globalOptions.debug()) {
            ex.printStackTrace(err);
        }
        err.flush();
        return ExitCodes.BAD_INPUT;
    }

    /** The first throwable of the given type along the cause chain, or null. */
    private static <T extends Throwable> T find(Throwable t, Class<T> type) {
        for (Throwable c = t; c != null; c = c.getCause()) {
            if (type.isInstance(c)) {
                return type.cast(c);
            }
            if (c.getCause() == c) {
                break;
            }
        }
        return null;
    }

    private static String describe(IOException e) {
        if (e instanceof NoSuchFileException n) {
            return n.getFile() + ": no such file or directory";
        }
        if (e instanceof AccessDeniedException a) {
            return a.getFile() + ": permission denied";
        }
        if (e instanceof FileSystemException f && f.getFile() != null) {
            return f.getFile() + ": " + (f.getReason() == null ? f.getClass().getSimpleName() : f.getReason());
        }
        return "I/O error: " + (e.getMessage() == null ? e.getClass().getSimpleName() : oneLine(e.getMessage()));
    }

    /** Folds a multi-line message onto one line. */
    static String oneLine(String message) {
        if (message == null) {
            return "";
        }
        return message.strip().replaceAll("\\s*[\\r\\n]+\\s*", "; ");
    }
}
