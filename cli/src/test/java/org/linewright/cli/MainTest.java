package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.cli.units.Pressure;
import org.linewright.ingest.InputException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** The command shell: version, help, exit codes and the one-line error convention. */
class MainTest {

    /** Result of one run. */
    private record Run(int code, String out, String err) {
        String[] errLines() {
            return err.isEmpty() ? new String[0] : err.split("\\R");
        }
    }

    private static Run run(CommandLine commandLine, StringWriter out, StringWriter err, String... args) {
        int code = commandLine.execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        return run(Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)), out, err, args);
    }

    /** A command of the test only, for failures the shipped commands cannot provoke on purpose. */
    @Command(name = "probe", description = "test only")
    static final class ProbeCommand implements Runnable {
        @Option(names = "--fail", description = "input or internal")
        String fail = "";

        @Option(names = "--pressure", description = "a pressure with unit")
        Pressure pressure;

        @Override
        public void run() {
            if (fail.equals("input")) {
                throw new InputException("lines.par:12:cols 4-15: field wavenumber: \"12.3x4\" is not a number");
            }
            if (fail.equals("internal")) {
                throw new IllegalStateException("broken invariant");
            }
        }
    }

    private static Run runProbe(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true), new ProbeCommand());
        return run(cl, out, err, args);
    }

    @Test
    void versionPrintsNameAndBuildVersion() {
        Run r = run("--version");
        assertEquals(ExitCodes.OK, r.code());
        // the version is filtered from the parent pom (0.1.0) into ingest's version.properties at build time
        assertEquals("linewright 0.1.0", r.out().strip());
    }

    @Test
    void helpOfRootAndOfEveryCommandExitsZeroWithAnExample() {
        Run root = run("--help");
        assertEquals(0, root.code());
        assertTrue(root.out().contains("Usage: linewright"), root.out());
        assertTrue(root.out().contains("Exit codes:"), root.out());
        CommandLine cl = Main.commandLine(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
        assertFalse(cl.getSubcommands().isEmpty());
        for (Map.Entry<String, CommandLine> sub : cl.getSubcommands().entrySet()) {
            Run r = run(sub.getKey(), "--help");
            assertEquals(0, r.code(), sub.getKey());
            assertTrue(r.out().contains("Usage: linewright " + sub.getKey()), r.out());
            assertTrue(r.out().contains("Example"), sub.getKey() + " help has no example");
            assertEquals("", r.err());
        }
    }

    @Test
    void usageErrorExitsTwoWithOneLineOnStderr() {
        Run r = run("demo", "--no-such-option");
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.errLines().length, r.err());
        assertTrue(r.err().startsWith("linewright: error: "), r.err());
        assertTrue(r.err().contains("--no-such-option"), r.err());
        assertTrue(r.err().contains("linewright demo --help"), r.err());
        Run unknownCommand = run("frobnicate");
        assertEquals(ExitCodes.BAD_INPUT, unknownCommand.code());
        assertEquals(1, unknownCommand.errLines().length, unknownCommand.err());
        Run noCommand = run();
        assertEquals(ExitCodes.BAD_INPUT, noCommand.code());
        assertEquals(1, noCommand.errLines().length, noCommand.err());
    }

    @Test
    void badUnitIsAUsageError() {
        Run r = runProbe("probe", "--pressure", "3 psi");
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.errLines().length, r.err());
        assertTrue(r.err().contains("psi"), r.err());
    }

    @Test
    void inputExceptionIsOneLineAndExitTwo() {
        Run r = runProbe("probe", "--fail", "input");
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.errLines().length, r.err());
        assertEquals("linewright: error: lines.par:12:cols 4-15: field wavenumber: \"12.3x4\" is not a number",
                r.err().strip());
    }

    @Test
    void debugAddsTheStackTraceWhereverItIsWritten() {
        Run before = runProbe("--debug", "probe", "--fail", "input");
        Run after = runProbe("probe", "--fail", "input", "--debug");
        for (Run r : new Run[] {before, after}) {
            assertEquals(ExitCodes.BAD_INPUT, r.code());
            assertTrue(r.errLines().length > 3, r.err());
            assertTrue(r.err().contains("at org.linewright.cli.MainTest$ProbeCommand.run"), r.err());
        }
    }

    @Test
    void internalErrorExitsThreeWithAHint() {
        Run r = runProbe("probe", "--fail", "internal");
        assertEquals(ExitCodes.INTERNAL_ERROR, r.code());
        assertEquals(1, r.errLines().length, r.err());
        assertTrue(r.err().contains("internal error: java.lang.IllegalStateException: broken invariant"), r.err());
        assertTrue(r.err().contains("--debug"), r.err());
    }

    @Test
    void missingDemoFolderIsBadInput(@TempDir Path tmp) {
        Run r = run("demo", "--demo-dir", tmp.resolve("absent").toString(), "--out", tmp.resolve("out").toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.errLines().length, r.err());
        assertTrue(r.err().contains("plan.toml"), r.err());
    }

    @Test
    void quietInheritedByTheDemoSilencesStdout(@TempDir Path tmp) {
        Path shipped = Path.of("..", "demo");
        org.junit.jupiter.api.Assumptions.assumeTrue(java.nio.file.Files.isRegularFile(shipped.resolve("plan.toml")),
                "shipped demo folder not found");
        Run r = run("demo", "--demo-dir", shipped.toString(), "--out", tmp.toString(), "--quiet");
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertEquals("", r.out());
        assertEquals("", r.err());
        assertTrue(java.nio.file.Files.isRegularFile(tmp.resolve("report.html")));
    }

    @Test
    void completionPrintsABashScriptCoveringTheCommands() {
        Run r = run("completion");
        assertEquals(0, r.code());
        // bash's own builtin registers the function: "complete -F <function> <command>" (bash manual, 8.7)
        assertTrue(r.out().contains("complete -F"), r.out());
        assertTrue(r.out().contains("demo"));
        assertTrue(r.out().contains("--out"));
    }
}
