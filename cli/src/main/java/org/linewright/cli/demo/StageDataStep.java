package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.linewright.ingest.InputException;
import org.tomlj.Toml;
import org.tomlj.TomlArray;
import org.tomlj.TomlParseError;
import org.tomlj.TomlParseResult;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Reads the demo plan ({@code plan.toml}) and copies it with the line lists it names into the output folder,
 * so the output folder is a self-contained copy of the demo's inputs.
 */
public final class StageDataStep implements DemoStep {
    /** File name of the plan inside the demo folder. */
    public static final String PLAN_FILE = "plan.toml";

    @Override
    public String name() {
        return "stage the synthetic data";
    }

    @Override
    public StepOutcome run(DemoContext context) throws IOException {
        Path planFile = context.demoDir().resolve(PLAN_FILE);
        if (!Files.isRegularFile(planFile)) {
            throw new InputException(planFile + ": no such file (expected the demo plan; give the demo folder "
                    + "with --demo-dir)");
        }
        TomlParseResult plan = Toml.parse(planFile);
        if (plan.hasErrors()) {
            TomlParseError e = plan.errors().get(0);
            throw new InputException(planFile + ":" + e.position().line() + ":" + e.position().column() + ": "
                    + e.getMessage());
        }
        TomlArray sources = plan.getArray("lines.sources");
        if (sources == null || sources.isEmpty()) {
            throw new InputException(planFile + ": key lines.sources: missing or empty (expected a list of line-list"
                    + " files)");
        }
        context.setPlan(plan);
        List<String> details = new ArrayList<>();
        List<Path> files = new ArrayList<>();
        Files.createDirectories(context.outDir());
        Path stagedPlan = context.outDir().resolve(PLAN_FILE);
        copy(planFile, stagedPlan);
        files.add(stagedPlan);
        for (int i = 0; i < sources.size(); i++) {
            Object entry = sources.get(i);
            if (!(entry instanceof String source)) {
                throw new InputException(planFile + ": key lines.sources[" + i + "]: \"" + entry
                        + "\" (expected a file name in quotes)");
            }
            Path from = context.demoDir().resolve(source).normalize();
            if (!Files.isRegularFile(from)) {
                throw new InputException(planFile + ": key lines.sources[" + i + "]: \"" + source
                        + "\" (expected an existing file relative to the plan)");
            }
            Path to = context.outDir().resolve(source).normalize();
            if (!to.startsWith(context.outDir().normalize())) {
                throw new InputException(planFile + ": key lines.sources[" + i + "]: \"" + source
                        + "\" (expected a path inside the demo folder)");
            }
            Files.createDirectories(to.getParent());
            copy(from, to);
            files.add(to);
            details.add(String.format(Locale.ROOT, "%s (%.1f kB, synthetic)", source, Files.size(to) / 1000.0));
        }
        return new StepOutcome(details, files);
    }

    /** Copies under a temporary name, then renames, so a half-copied file never looks complete. */
    private static void copy(Path from, Path to) throws IOException {
        AtomicFile.write(to, tmp -> Files.copy(from, tmp, StandardCopyOption.REPLACE_EXISTING));
    }
}
