package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;

import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * Every command × every option (and every positional parameter), given a bad value on top of an otherwise valid
 * invocation, exits with code 2 and says what is wrong in one line on stderr, without a stack trace or a control
 * character (the command-line convention of this project: 0 success, 1 a check found problems, 2 bad input or
 * usage, 3 internal error). The options are taken from the command model, so a new option without a bad-value
 * case here fails the test.
 */
class BadInputEveryCommandTest {
    /** The shipped synthetic CO list (invented data, demo/data/README.md), seen from the cli module. */
    private static final Path SYNTHETIC_CO = Paths.get("..", "demo", "data", "synthetic-co.par.bz2");
    private static final Path DEMO = Paths.get("..", "demo");

    @TempDir
    static Path tmp;

    private static Path store;
    private static Path plan;
    private static Path sigmaTable;
    private static Path ktable;
    private static Path garbage;
    private static Path missing;
    private static Path underAFile;
    private static int counter;

    @BeforeAll
    static void setUp() throws Exception {
        Assumptions.assumeTrue(Files.isRegularFile(SYNTHETIC_CO), "shipped demo data not found: " + SYNTHETIC_CO);
        store = tmp.resolve("store");
        Run ingest = run("ingest", SYNTHETIC_CO.toString(), "--store", store.toString(), "--quiet");
        assertEquals(ExitCodes.OK, ingest.code(), ingest.err());
        garbage = Files.writeString(tmp.resolve("garbage.par"), "this is not a line list\n");
        missing = tmp.resolve("does-not-exist");
        // a path whose parent is a regular file: nothing can be written there
        underAFile = garbage.resolve("sub").resolve("out");
        plan = tmp.resolve("plan.toml");
        Files.writeString(plan, """
                [lines]
                sources = ["%s"]
                [grid]
                wavenumber = { from = 2100.0, to = 2101.0, step = 0.1 }
                pressures_bar = [1.0]
                temperatures_K = [296.0]
                [background]
                H2 = 0.85
                He = 0.15
                [output]
                table = "t.arrow"
                """.formatted(SYNTHETIC_CO.toAbsolutePath().normalize().toString().replace("\\", "/")));
        Run build = run("build", plan.toString(), "--quiet");
        assertEquals(ExitCodes.OK, build.code(), build.err());
        sigmaTable = tmp.resolve("t.arrow");
        ktable = tmp.resolve("k.h5");
        Run k = run("ktable", sigmaTable.toString(), "--bin-width", "0.5", "--g-points", "4", "--out",
                ktable.toString(), "--quiet");
        assertEquals(ExitCodes.OK, k.code(), k.err());
    }

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), args);
        return new Run(code, out.toString(), err.toString());
    }

    private static String fresh(String name) {
        return tmp.resolve(name + "-" + (++counter)).toString();
    }

    /** A valid invocation of each command as option → values (positionals under ""), in order. */
    private static Map<String, List<String>> base(String command) {
        Map<String, List<String>> m = new LinkedHashMap<>();
        switch (command) {
            case "ingest" -> {
                m.put("", List.of(SYNTHETIC_CO.toString()));
                m.put("--store", List.of(fresh("ingest-store")));
            }
            case "lines" -> {
                m.put("", List.of(store.toString()));
                m.put("--between", List.of("2100", "2101"));
            }
            case "sigma" -> {
                m.put("", List.of(store.toString()));
                m.put("--temperature", List.of("296"));
                m.put("--pressure", List.of("1bar"));
                m.put("--background", List.of("H2=0.85,He=0.15"));
                m.put("--between", List.of("2100", "2101"));
                m.put("--step", List.of("0.1"));
                m.put("--out", List.of(fresh("sigma") + ".csv"));
            }
            case "build" -> m.put("", List.of(plan.toString()));
            case "ktable" -> {
                m.put("", List.of(sigmaTable.toString()));
                m.put("--bin-width", List.of("0.5"));
                m.put("--g-points", List.of("4"));
                m.put("--out", List.of(fresh("ktable") + ".h5"));
            }
            case "ktable-mix" -> {
                m.put("", List.of(ktable + "=0.7", ktable + "=0.3"));
                m.put("--out", List.of(fresh("ktable-mix") + ".h5"));
            }
            case "verify" -> m.put("", List.of(store.toString()));
            case "compare" -> m.put("", List.of(store.toString(), store.toString()));
            case "demo" -> {
                m.put("--demo-dir", List.of(DEMO.toString()));
                m.put("--out", List.of(fresh("demo")));
            }
            case "completion" -> {
            }
            default -> fail("a command without a base invocation: " + command);
        }
        return m;
    }

    /** Bad values of an option (each an array of arguments that follow it), per command where they differ. */
    private static List<String[]> badValues(String command, String option) {
        String text = "\u0001\u001b[31mred\u0007";
        List<String[]> v = new ArrayList<>();
        switch (option) {
            case "--debug", "--quiet", "--lenient", "--no-default-widths", "--strict", "--chi-factor",
                    "--remove-pedestal", "--plot-wavelength", "--dry-run" -> v.add(new String[] {"=maybe"});
            case "--format", "--input-format", "--report-format" -> {
                v.add(new String[] {"bogus"});
                v.add(new String[] {text});
            }
            case "--molecule-data", "--catalog-partition" -> {
                v.add(new String[] {missing.toString()});
                v.add(new String[] {garbage.toString()});
            }
            case "--partition-sum" -> {
                v.add(new String[] {"bogus"});
                v.add(new String[] {"5/1=" + missing});
                v.add(new String[] {"5/1=" + garbage});
            }
            case "--store", "--rejects", "--out", "--plot", "--report" -> v.add(new String[] {underAFile.toString()});
            case "--background" -> {
                v.add(new String[] {"bogus"});
                v.add(new String[] {"H2=2"});
                v.add(new String[] {"Xe=0.5,H2=0.5"});
            }
            case "--between" -> {
                v.add(new String[] {"abc", "2101"});
                v.add(new String[] {"2100", text});
                v.add(new String[] {"2100", "5 furlong"});
                v.add(new String[] {"2100", "2101", "--between", "2200", "2201"});
            }
            case "--unit" -> v.add(new String[] {"furlong"});
            case "--molecule" -> {
                v.add(new String[] {"XYZ"});
                v.add(new String[] {text});
                v.add(new String[] {""});
            }
            case "--isotopologue" -> {
                v.add(new String[] {"abc"});
                v.add(new String[] {"1"}); // without --molecule
                v.add(new String[] {"99", "--molecule", "CO"});
                v.add(new String[] {"-1", "--molecule", "CO"});
            }
            case "--strongest", "--max-listed" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"many"});
            }
            case "--temperature" -> {
                v.add(new String[] {"hot"});
                v.add(new String[] {"-5K"});
                v.add(new String[] {"0"});
            }
            case "--pressure" -> {
                v.add(new String[] {"-1bar"});
                v.add(new String[] {"high"});
            }
            case "--width-constants" -> {
                v.add(new String[] {"bogus"});
                v.add(new String[] {"H2=-0.1"});
            }
            case "--width-sources" -> v.add(new String[] {"bogus"});
            case "--cutoff", "--cutoff-per-atm" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"far"});
            }
            case "--cutoff-hwhm-multiple", "--cutoff-hwhm" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"x"});
            }
            case "--engine" -> v.add(new String[] {"bogus"});
            case "--spark" -> v.add(new String[] {"bogus://nowhere"});
            case "--max-relative-error", "--tolerance", "--pair-within" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"tight"});
            }
            case "--max-shift", "--window" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"wide"});
            }
            case "--shape" -> v.add(new String[] {"square"});
            case "--intensity-per" -> v.add(new String[] {"gram"});
            case "--vmr" -> {
                v.add(new String[] {"CO=-1"});
                v.add(new String[] {"XYZ=0.5"});
                v.add(new String[] {"CO=0.5,CO=0.2"});
                v.add(new String[] {"lots"});
            }
            case "--abundance" -> {
                v.add(new String[] {"CO/1=2"});
                v.add(new String[] {"CO/1=-0.5"});
                v.add(new String[] {"CO/99=0.5"});
                v.add(new String[] {"half"});
            }
            case "--step" -> {
                v.add(new String[] {"-0.1"});
                v.add(new String[] {"0"});
                v.add(new String[] {"tiny"});
            }
            case "--resolving-power" -> {
                v.add(new String[] {"-5"});
                v.add(new String[] {"huge"});
            }
            case "--threads" -> {
                v.add(new String[] {"0"});
                v.add(new String[] {"-2"});
                v.add(new String[] {"all"});
            }
            case "--threshold", "--threshold-cm-per-molecule" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"NaN"});
            }
            case "--reference" -> {
                v.add(new String[] {missing.toString()});
                v.add(new String[] {garbage.toString()});
            }
            case "--plan" -> {
                v.add(new String[] {missing.toString()});
                v.add(new String[] {garbage.toString()});
            }
            case "--demo-dir" -> v.add(new String[] {missing.toString()});
            case "--bin-width" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"0"});
                v.add(new String[] {"wide"});
                v.add(new String[] {"1e-6"}); // bins narrower than the table's step hold no sigma point
            }
            case "--bin-edges" -> {
                v.add(new String[] {missing.toString()});
                v.add(new String[] {garbage.toString()});
            }
            case "--g-points" -> {
                v.add(new String[] {"0"});
                v.add(new String[] {"-3"});
                v.add(new String[] {"1000"});
                v.add(new String[] {"many"});
            }
            case "--quadrature" -> {
                v.add(new String[] {"simpson"});
                v.add(new String[] {text});
            }
            case "--band-mean" -> v.add(new String[] {"=maybe"});
            case "--transmission-column-per-cm2" -> {
                v.add(new String[] {"-1"});
                v.add(new String[] {"NaN"});
                v.add(new String[] {"thick"});
            }
            case "--per-unit-mass" -> {
                v.add(new String[] {"XYZ"});
                v.add(new String[] {text});
            }
            default -> {
                return null;
            }
        }
        return v;
    }

    /** Bad positional parameters of each command (replacing the valid ones). */
    private static List<String[]> badPositionals(String command) {
        return switch (command) {
            case "ingest" -> List.of(new String[] {garbage.toString()}, new String[] {missing.toString()});
            case "lines" -> List.of(new String[] {missing.toString()}, new String[] {garbage.toString()});
            case "sigma" -> List.of(new String[] {missing.toString()}, new String[] {garbage.toString()});
            case "build" -> List.of(new String[] {missing.toString()}, new String[] {garbage.toString()});
            case "ktable" -> List.of(new String[] {missing.toString()}, new String[] {garbage.toString()},
                    new String[] {plan.toString()});
            case "ktable-mix" -> List.of(new String[] {missing + "=0.5", ktable + "=0.5"},
                    new String[] {garbage + "=0.5", ktable + "=0.5"}, new String[] {ktable + "=abc", ktable + "=0.5"},
                    new String[] {ktable.toString(), ktable + "=0.5"}, new String[] {ktable + "=-1", ktable + "=0.5"},
                    new String[] {sigmaTable + "=0.5", ktable + "=0.5"});
            case "verify" -> List.of(new String[] {missing.toString()}, new String[] {garbage.toString()});
            case "compare" -> List.of(new String[] {missing.toString(), store.toString()},
                    new String[] {store.toString(), garbage.toString()});
            default -> List.of();
        };
    }

    @Test
    void everyOptionOfEveryCommandAnswersABadValueWithExitCode2AndOneLine() {
        CommandLine root = Main.commandLine(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
        List<String> failures = new ArrayList<>();
        TreeSet<String> uncovered = new TreeSet<>();
        int invocations = 0;
        for (Map.Entry<String, CommandLine> sub : root.getSubcommands().entrySet()) {
            String command = sub.getKey();
            if (command.equals("help")) {
                continue;
            }
            for (OptionSpec o : sub.getValue().getCommandSpec().options()) {
                if (o.usageHelp() || o.versionHelp()) {
                    continue;
                }
                String name = o.longestName();
                List<String[]> bad = badValues(command, name);
                if (bad == null) {
                    uncovered.add(command + " " + name);
                    continue;
                }
                for (String[] value : bad) {
                    Map<String, List<String>> args = base(command);
                    args.remove(name);
                    for (String alias : o.names()) {
                        args.remove(alias);
                    }
                    if (name.equals("--resolving-power") || name.equals("--bin-edges")) {
                        args.remove("--step"); // the spacing options are exclusive
                        args.remove("--bin-width");
                    }
                    List<String> argv = flatten(command, args);
                    if (value[0].startsWith("=")) {
                        argv.add(name + value[0]);
                    } else {
                        argv.add(name);
                        argv.addAll(Arrays.asList(value));
                    }
                    invocations++;
                    check(argv, failures);
                }
            }
            for (String[] positionals : badPositionals(command)) {
                Map<String, List<String>> args = base(command);
                args.put("", List.of(positionals));
                invocations++;
                check(flatten(command, args), failures);
            }
        }
        assertTrue(uncovered.isEmpty(), "options without a bad-value case: " + uncovered);
        assertTrue(failures.isEmpty(), failures.size() + " of " + invocations + " bad invocations misbehaved:\n"
                + String.join("\n", failures));
        // 9 commands with 75 options and positionals between them (the count guards against a silently empty loop)
        assertTrue(invocations >= 150, "bad invocations tried: " + invocations);
        System.out.println("bad-input matrix: " + invocations + " invocations");
    }

    private static List<String> flatten(String command, Map<String, List<String>> args) {
        List<String> argv = new ArrayList<>();
        argv.add(command);
        argv.addAll(args.getOrDefault("", List.of()));
        for (Map.Entry<String, List<String>> e : args.entrySet()) {
            if (!e.getKey().isEmpty()) {
                argv.add(e.getKey());
                argv.addAll(e.getValue());
            }
        }
        return argv;
    }

    private static void check(List<String> argv, List<String> failures) {
        Run r = run(argv.toArray(String[]::new));
        // a hidden old spelling prints its one deprecation note first (DEVELOPERS.md, "Naming"); the error is
        // then the one line after it
        String stderr = r.err().strip().replaceFirst("^note: --[a-z-]+ is deprecated, write --[a-z-]+\\R", "");
        String what = String.join(" ", argv) + "\n    -> exit " + r.code() + ": " + stderr.replace("\n", "\n       ");
        if (r.code() != ExitCodes.BAD_INPUT) {
            failures.add(what);
        } else if (stderr.split("\\R").length != 1 || !stderr.startsWith(ErrorReporting.PREFIX)) {
            failures.add(what);
        } else if (stderr.contains("\tat ") || stderr.contains("NullPointerException")
                || stderr.chars().anyMatch(c -> c < 0x20 && c != '\n' && c != '\r')) {
            failures.add(what);
        }
    }

    /** A line of binary garbage in a list: the message is one line, its control bytes escaped and its text cut. */
    @Test
    void binaryGarbageInAnInputIsEscapedAndCut() throws Exception {
        byte[] bytes = new byte[400];
        for (int i = 0; i < bytes.length; i++) {
            bytes[i] = (byte) (i * 37 + 11);
        }
        Path file = tmp.resolve("binary.par");
        Files.write(file, bytes);
        Run r = run("ingest", file.toString(), "--store", fresh("binary-store"));
        String stderr = r.err().strip();
        assertEquals(ExitCodes.BAD_INPUT, r.code(), stderr);
        assertEquals(1, stderr.split("\\R").length, stderr);
        assertFalse(stderr.chars().anyMatch(c -> c < 0x20 || c == 0x7f), stderr);
        assertTrue(stderr.length() < 600, "offending text is cut: " + stderr.length() + " characters");
    }
}
