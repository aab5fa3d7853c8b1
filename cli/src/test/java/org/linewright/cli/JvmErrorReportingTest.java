package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.stream.IntStream;

import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * A JVM error (out of memory, stack overflow) reaches the user as one line saying what ran out and what to change,
 * exit code 3, the stack trace only with --debug. The errors are thrown by a test command with the JDK's own
 * messages ("Java heap space", "Direct buffer memory", "unable to create native thread": the texts HotSpot uses,
 * from memory).
 */
class JvmErrorReportingTest {
    @Command(name = "explode")
    static final class Explode implements Callable<Integer> {
        @Option(names = "--what")
        String what = "heap";

        @Override
        public Integer call() {
            switch (what) {
                case "heap" -> throw new OutOfMemoryError("Java heap space");
                case "direct" -> throw new OutOfMemoryError("Direct buffer memory");
                case "threads" -> throw new OutOfMemoryError("unable to create native thread: possibly out of memory");
                case "wrapped" -> throw new IllegalStateException("worker failed", new OutOfMemoryError("Java heap space"));
                case "executor" -> {
                    // as the engines run their slices: a fixed pool, the failure comes back through Future.get
                    ExecutorService pool = Executors.newFixedThreadPool(2);
                    try {
                        pool.submit(() -> {
                            throw new OutOfMemoryError("Java heap space");
                        }).get();
                    } catch (InterruptedException | ExecutionException e) {
                        throw new IllegalStateException("slice failed", e);
                    } finally {
                        pool.shutdownNow();
                    }
                    return 0;
                }
                case "parallel" -> {
                    // a parallel stream rethrows a worker's error in the calling thread
                    IntStream.range(0, 64).parallel().forEach(i -> {
                        if (i == 37) {
                            throw new OutOfMemoryError("Java heap space");
                        }
                    });
                    return 0;
                }
                default -> throw new StackOverflowError();
            }
        }
    }

    private record Run(int code, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true), new Explode());
        int code;
        try {
            code = cl.execute(args);
        } catch (Error e) {
            // what Main.execute does with errors picocli lets through
            LinewrightCommand root = cl.getCommand();
            code = new ErrorReporting(root.globalOptions()).report(e, new PrintWriter(err, true));
        }
        return new Run(code, err.toString());
    }

    private static void assertOneLine(Run r, String... expectedParts) {
        assertEquals(ExitCodes.INTERNAL_ERROR, r.code(), r.err());
        String stderr = r.err().strip();
        assertEquals(1, stderr.split("\\R").length, stderr);
        assertTrue(stderr.startsWith(ErrorReporting.PREFIX), stderr);
        for (String part : expectedParts) {
            assertTrue(stderr.contains(part), "'" + part + "' in: " + stderr);
        }
    }

    @Test
    void heapExhaustionSaysHowToGiveMoreHeap() {
        assertOneLine(run("explode"), "Java heap", "LINEWRIGHT_JAVA_OPTS=-Xmx", "--threads", "block_points");
        assertOneLine(run("explode", "--what", "wrapped"), "Java heap", "LINEWRIGHT_JAVA_OPTS=-Xmx");
    }

    @Test
    void workerThreadsReportTheSameLine() {
        assertOneLine(run("explode", "--what", "executor"), "Java heap", "LINEWRIGHT_JAVA_OPTS=-Xmx", "--threads");
        assertOneLine(run("explode", "--what", "parallel"), "Java heap", "LINEWRIGHT_JAVA_OPTS=-Xmx", "--threads");
    }

    @Test
    void aThreadOutsideAnyExecutorGetsOneLineToo() throws InterruptedException {
        // the line Main's default uncaught-exception handler prints for a bare thread that dies
        Throwable[] seen = new Throwable[1];
        Thread bare = new Thread(() -> {
            throw new OutOfMemoryError("Java heap space");
        }, "reader-1");
        bare.setUncaughtExceptionHandler((t, e) -> seen[0] = e);
        bare.start();
        bare.join();
        String line = Main.uncaughtLine(bare, seen[0]);
        assertTrue(line.startsWith(ErrorReporting.PREFIX) && line.contains("Java heap")
                && line.contains("LINEWRIGHT_JAVA_OPTS=-Xmx") && !line.contains("\n"), line);
        String other = Main.uncaughtLine(bare, new IllegalStateException("bad\nstate"));
        assertTrue(other.contains("internal error in thread 'reader-1'") && other.lines().count() == 1, other);
    }

    @Test
    void directMemoryAndThreadsAreNamed() {
        assertOneLine(run("explode", "--what", "direct"), "direct", "MaxDirectMemorySize");
        assertOneLine(run("explode", "--what", "threads"), "threads", "--threads");
        assertOneLine(run("explode", "--what", "stack"), "stack", "-Xss");
    }

    @Test
    void debugAddsTheStackTrace() {
        Run r = run("--debug", "explode");
        assertEquals(ExitCodes.INTERNAL_ERROR, r.code());
        assertTrue(r.err().contains("java.lang.OutOfMemoryError"), r.err());
        assertTrue(r.err().lines().count() > 2, r.err());
        assertFalse(run("explode").err().contains("\tat "));
    }
}
