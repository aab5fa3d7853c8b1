package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.linewright.cli.progress.Progress;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.pipeline.IngestReport;
import org.linewright.ingest.source.LineFormat;
import org.linewright.ingest.text.OffendingText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code linewright ingest}: line-list files into a line store. */
@Command(name = "ingest",
        mixinStandardHelpOptions = true,
        description = {
            "Read line lists into a line store (a folder of Arrow files sorted by wavenumber). Formats are detected "
                    + "from content: 160-character records, delimited exports with a header row, state/transition "
                    + "sets, 80-column catalogs; gzip, bzip2, xz, zstd and zip are read directly.",
            "By default the first bad record stops the run (exit code 2) and the store keeps what it had; with "
                    + "--lenient every bad record goes, verbatim with its reason, to the rejects file.",
            ""
        },
        footer = {
            "",
            "Example:",
            "  linewright ingest data/co-lines.par.bz2 data/co2-lines.par --store stores/planet-b",
            "  linewright ingest messy.par --store stores/x --lenient --rejects messy-rejects.tsv"
        })
public final class IngestCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(arity = "1..*", paramLabel = "SOURCE", description = "Line-list files (compressed or not).")
    private List<Path> sources;

    @Option(names = "--store", required = true, paramLabel = "DIR", description = "The line store to write (created when missing).")
    private Path store;

    @Option(names = "--input-format", paramLabel = "FORMAT",
            description = "Read every source as this format instead of detecting it: hitran160, hitran-delimited, exomol, catalog.")
    private String format;

    /** Deprecated spelling of --input-format, read for one version. */
    @Option(names = "--format", hidden = true, paramLabel = "FORMAT")
    private void deprecatedInputFormat(String value) {
        DeprecatedSpelling.note(spec, "--format", "--input-format");
        format = value;
    }

    @Option(names = "--lenient", description = "Go on after bad records; write them to the rejects file.")
    private boolean lenient;

    @Option(names = "--rejects", paramLabel = "FILE",
            description = "Rejects file of a lenient run (default: rejects.tsv in the store, written when something is rejected).")
    private Path rejects;

    @Mixin
    private SpeciesDataOptions speciesData;

    @Option(names = "--spark", paramLabel = "MASTER",
            description = "Read the files in parallel as Spark tasks, one task per file: local[N], spark://HOST:PORT, "
                    + "yarn or k8s://URL (see docs/spark.md). The same store as without it; strict only.")
    private String sparkMaster;

    @Override
    public Integer call() throws Exception {
        boolean quiet = root.globalOptions().quiet();
        PrintWriter out = spec.commandLine().getOut();
        if (rejects != null && !lenient) {
            // a strict run stops at the first bad record and never writes rejects: say so rather than ignore it
            throw new ParameterException(spec.commandLine(),
                    "--rejects " + OffendingText.escape(rejects.toString()) + ": only used with --lenient");
        }
        LineFormat lineFormat = format == null ? null : Formats.lineFormat(format);
        Map<String, String> parameters = new LinkedHashMap<>();
        parameters.put("command", "ingest");
        IngestOptions options = new IngestOptions(lineFormat, lenient, rejects, speciesData.registry(), parameters);
        IngestReport report;
        if (sparkMaster != null) {
            if (lenient) {
                throw new ParameterException(spec.commandLine(), "--lenient: not available with --spark yet "
                        + "(a file-parallel ingest is strict); ingest without --spark");
            }
            report = SparkRunner.ingest(spec, sources, store, lineFormat == null ? null : lineFormat.id(), parameters,
                    speciesData.files(), sparkMaster, quiet);
        } else {
            try (Progress progress = Progress.start("ingest", -1, "records", 1, quiet)) {
                report = IngestPipeline.run(sources, store, options, new IngestListener() {
                    private long before;

                    @Override
                    public void sourceStarted(Path source, long fileBytes) {
                        progress.message(source.getFileName().toString());
                    }

                    @Override
                    public void recordsRead(Path source, long records) {
                        progress.stepBy(records - before);
                        before = records;
                    }

                    @Override
                    public void sourceFinished(IngestReport.Source s) {
                        before = 0;
                    }
                });
            }
        }
        if (!quiet) {
            for (IngestReport.Source s : report.sources()) {
                out.printf(Locale.ROOT, "%s: %s%s, %d records read, %d kept, %d rejected, %d duplicates (kept); "
                                + "%.6f-%.6f cm-1; %.2f s%n",
                        s.file(), s.format(), s.compression().equals("none") ? "" : " (" + s.compression() + ")",
                        s.recordsRead(), s.linesKept(), s.recordsRejected(), s.duplicates(),
                        s.minWavenumberCm1(), s.maxWavenumberCm1(), s.seconds());
            }
            out.printf(Locale.ROOT, "store %s: %d lines from %d source(s)%n", store, report.linesKept(), report.sources().size());
            if (report.rejectsFileOrNull() != null) {
                out.printf(Locale.ROOT, "%d rejected record(s) written to %s%n", report.recordsRejected(), report.rejectsFileOrNull());
            }
        }
        return ExitCodes.OK;
    }
}
