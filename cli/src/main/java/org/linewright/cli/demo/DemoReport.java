package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Locale;
import org.linewright.ingest.ToolVersion;
import org.tomlj.TomlParseResult;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * The demo's account of itself — what was computed, with which parameters, how long each step took, where
 * the files are — written as {@value #TEXT_FILE} and {@value #HTML_FILE} in the output folder.
 *
 * @param started  when the demo started
 * @param outDir   the output folder
 * @param steps    the steps in the order run
 * @param total    wall time of all steps
 * @param plan     the demo plan as read by the staging step, or null
 */
public record DemoReport(Instant started, Path outDir, List<StepRecord> steps, Duration total,
                         TomlParseResult plan) {
    /** The plain-text report's file name. */
    public static final String TEXT_FILE = "report.txt";
    /** The HTML report's file name. */
    public static final String HTML_FILE = "report.html";

    private static final String SCENARIO = "Synthetic demo: all line data here are INVENTED for demonstration. "
            + "The scenario is a fictional warm sub-Neptune, \"Caldera Minor\", with an H2/He atmosphere holding "
            + "CO and CO2; its team wants absorption cross sections of both molecules over 2000-2400 cm-1 at a few "
            + "pressures and temperatures. The line lists were made by a model (Dunham constants, Hönl-London "
            + "factors, Boltzmann populations; see data/README.md in the demo folder), not measured.";

    /**
     * One step as run.
     *
     * @param name    the step's name
     * @param took    its wall time
     * @param details what it reported
     * @param files   the files it wrote
     */
    public record StepRecord(String name, Duration took, List<String> details, List<Path> files) {
    }

    /** @return the plain-text report's path */
    public Path textFile() {
        return outDir.resolve(TEXT_FILE);
    }

    /** @return the HTML report's path */
    public Path htmlFile() {
        return outDir.resolve(HTML_FILE);
    }

    /** Writes both reports (each under a temporary name, then renamed). */
    public void write() throws IOException {
        writeAtomically(textFile(), text());
        writeAtomically(htmlFile(), html());
    }

    /** @return the plain-text report */
    public String text() {
        StringBuilder sb = new StringBuilder();
        sb.append("linewright ").append(ToolVersion.get()).append(" demo report\n");
        sb.append("=".repeat(40)).append("\n\n");
        sb.append(wrap(SCENARIO, 100)).append("\n\n");
        sb.append("Started:  ").append(started.truncatedTo(ChronoUnit.SECONDS)).append(" (UTC)\n");
        sb.append("Output:   ").append(outDir.toAbsolutePath()).append('\n');
        sb.append("Machine:  ").append(machine()).append("\n\n");
        sb.append("Steps\n-----\n");
        int i = 1;
        for (StepRecord step : steps) {
            sb.append(String.format(Locale.ROOT, "%d. %s  [%s]%n", i++, step.name(), seconds(step.took())));
            for (String d : step.details()) {
                sb.append("     ").append(d).append('\n');
            }
            for (Path f : step.files()) {
                sb.append("     file: ").append(relative(f)).append('\n');
            }
        }
        sb.append(String.format(Locale.ROOT, "Total: %s%n%n", seconds(total)));
        String table = plannedTable();
        if (table != null) {
            sb.append("Planned cross-section table (plan.toml)\n---------------------------------------\n");
            sb.append(planSummary()).append('\n');
            sb.append(Files.exists(outDir.resolve(table))
                    ? "Table written: " + table + "\n"
                    : "Not produced by this build: " + table + " (no table step in this build)\n");
        }
        return sb.toString();
    }

    /** @return the HTML report (self-contained except for the plots it shows) */
    public String html() {
        StringBuilder sb = new StringBuilder();
        sb.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n<title>linewright demo report"
                + "</title>\n<style>body{font-family:sans-serif;max-width:70em;margin:2em auto;line-height:1.4}"
                + "table{border-collapse:collapse}td,th{border:1px solid #bbb;padding:.3em .6em;text-align:left;"
                + "vertical-align:top}.synthetic{background:#fff3cd;padding:.6em;border:1px solid #e0c060}"
                + "img{max-width:100%}</style>\n</head><body>\n");
        sb.append("<h1>linewright ").append(esc(ToolVersion.get())).append(" demo report</h1>\n");
        sb.append("<p class=\"synthetic\">").append(esc(SCENARIO)).append("</p>\n");
        sb.append("<p>Started ").append(esc(started.truncatedTo(ChronoUnit.SECONDS).toString()))
                .append(" (UTC) &middot; output <code>").append(esc(outDir.toAbsolutePath().toString()))
                .append("</code> &middot; ").append(esc(machine())).append("</p>\n");
        sb.append("<h2>Steps</h2>\n<table><tr><th>#</th><th>step</th><th>time</th><th>details</th><th>files</th>"
                + "</tr>\n");
        int i = 1;
        for (StepRecord step : steps) {
            sb.append("<tr><td>").append(i++).append("</td><td>").append(esc(step.name())).append("</td><td>")
                    .append(esc(seconds(step.took()))).append("</td><td>");
            for (String d : step.details()) {
                sb.append(esc(d)).append("<br>");
            }
            sb.append("</td><td>");
            for (Path f : step.files()) {
                String rel = relative(f);
                sb.append("<a href=\"").append(esc(rel)).append("\">").append(esc(rel)).append("</a><br>");
            }
            sb.append("</td></tr>\n");
        }
        sb.append("</table>\n<p>Total: ").append(esc(seconds(total))).append("</p>\n");
        for (StepRecord step : steps) {
            for (Path f : step.files()) {
                String rel = relative(f);
                if (rel.endsWith(".png")) {
                    sb.append("<h2>").append(esc(step.name())).append("</h2>\n<img src=\"").append(esc(rel))
                            .append("\" alt=\"").append(esc(step.name())).append("\">\n");
                }
            }
        }
        String table = plannedTable();
        if (table != null) {
            sb.append("<h2>Planned cross-section table (plan.toml)</h2>\n<pre>").append(esc(planSummary()))
                    .append("</pre>\n<p>").append(Files.exists(outDir.resolve(table))
                            ? "Table written: <code>" + esc(table) + "</code>"
                            : "Not produced by this build: <code>" + esc(table) + "</code> (no table step in this "
                                    + "build)").append("</p>\n");
        }
        sb.append("</body></html>\n");
        return sb.toString();
    }

    private String plannedTable() {
        return plan == null ? null : plan.getString("output.table");
    }

    /** The plan's parameters, one key per line, sorted by key. */
    private String planSummary() {
        StringBuilder sb = new StringBuilder();
        for (String key : new java.util.TreeSet<>(plan.dottedKeySet())) {
            Object value = plan.get(key);
            String shown = value instanceof org.tomlj.TomlArray a ? a.toList().toString() : String.valueOf(value);
            sb.append(String.format(Locale.ROOT, "  %-26s %s%n", key, shown));
        }
        return sb.toString();
    }

    private String relative(Path f) {
        Path abs = f.toAbsolutePath().normalize();
        Path base = outDir.toAbsolutePath().normalize();
        return abs.startsWith(base) ? base.relativize(abs).toString().replace('\\', '/') : abs.toString();
    }

    private static String machine() {
        return "Java " + System.getProperty("java.version") + ", " + Runtime.getRuntime().availableProcessors()
                + " processors, " + System.getProperty("os.name") + " " + System.getProperty("os.arch");
    }

    private static String seconds(Duration d) {
        return String.format(Locale.ROOT, "%.3f s", d.toNanos() / 1e9);
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

    private static String wrap(String text, int width) {
        StringBuilder sb = new StringBuilder();
        int col = 0;
        for (String word : text.split(" ")) {
            if (col > 0 && col + 1 + word.length() > width) {
                sb.append('\n');
                col = 0;
            } else if (col > 0) {
                sb.append(' ');
                col++;
            }
            sb.append(word);
            col += word.length();
        }
        return sb.toString();
    }

    private static void writeAtomically(Path file, String content) throws IOException {
        AtomicFile.writeText(file, out -> out.write(content));
    }
}
