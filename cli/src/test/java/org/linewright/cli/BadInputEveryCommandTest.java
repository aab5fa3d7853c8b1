package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * Every command, fed bad input, exits with code 2 and says what is wrong in one line on stderr (the command-line
 * convention of this project: 0 success, 1 a check found problems, 2 bad input or usage).
 */
class BadInputEveryCommandTest {
    @TempDir
    Path tmp;

    private String[] badInvocation(String command) throws Exception {
        Path missing = tmp.resolve("does-not-exist");
        Path garbage = tmp.resolve("garbage.par");
        Files.writeString(garbage, "this is not a line list\n");
        return switch (command) {
            case "ingest" -> new String[] {"ingest", garbage.toString(), "--store", tmp.resolve("s").toString()};
            case "lines" -> new String[] {"lines", missing.toString()};
            case "sigma" -> new String[] {"sigma", missing.toString(), "--temperature", "296", "--pressure", "-1bar",
                "--background", "air=1", "--between", "2000", "2100", "--step", "0.01", "--out", tmp.resolve("x.csv").toString()};
            case "build" -> new String[] {"build", missing.toString()};
            case "verify" -> new String[] {"verify", missing.toString()};
            case "compare" -> new String[] {"compare", missing.toString(), garbage.toString()};
            case "demo" -> new String[] {"demo", "--demo-dir", missing.toString(), "--out", tmp.resolve("d").toString()};
            case "completion" -> new String[] {"completion", "--no-such-option"};
            default -> throw new AssertionError("a command without a bad-input case: " + command);
        };
    }

    @Test
    void everyCommandAnswersBadInputWithExitCode2AndOneLine() throws Exception {
        CommandLine root = Main.commandLine(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
        for (String command : root.getSubcommands().keySet()) {
            if (command.equals("help")) {
                continue;
            }
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();
            int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), badInvocation(command));
            String stderr = err.toString().strip();
            assertEquals(2, code, command + ": " + stderr);
            assertEquals(1, stderr.split("\\R").length, command + " printed more than one line:\n" + stderr);
            assertTrue(stderr.startsWith("linewright: error:"), command + ": " + stderr);
        }
    }
}
