package org.linewright.cli.demo;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.tomlj.TomlParseResult;

/**
 * What the demo's steps share: the shipped demo folder, the output folder, the parsed plan and the line sets
 * that earlier steps made available for plotting.
 */
public final class DemoContext {
    private final Path demoDir;
    private final Path outDir;
    private final boolean quiet;
    private final List<LineSet> lineSets = new ArrayList<>();
    private TomlParseResult plan;

    /**
     * A set of lines of one species, as primitive columns.
     *
     * @param label                  e.g. {@code 12C16O}
     * @param wavenumberCm1          positions, cm⁻¹
     * @param intensityCmPerMolecule intensities at 296 K, cm/molecule
     */
    public record LineSet(String label, double[] wavenumberCm1, double[] intensityCmPerMolecule) {
    }

    /**
     * @param demoDir the shipped demo folder (holding {@code plan.toml} and {@code data/})
     * @param outDir  where the demo writes everything
     * @param quiet   the {@code --quiet} option, for steps that draw progress
     */
    public DemoContext(Path demoDir, Path outDir, boolean quiet) {
        this.demoDir = demoDir;
        this.outDir = outDir.toAbsolutePath().normalize();
        this.quiet = quiet;
    }

    public Path demoDir() {
        return demoDir;
    }

    public Path outDir() {
        return outDir;
    }

    public boolean quiet() {
        return quiet;
    }

    /** @return the plan read by the staging step, or null before it ran */
    public TomlParseResult plan() {
        return plan;
    }

    void setPlan(TomlParseResult plan) {
        this.plan = plan;
    }

    /** @return the line sets added so far, in order */
    public List<LineSet> lineSets() {
        return List.copyOf(lineSets);
    }

    /** Makes a line set available to later steps (plots, summaries). */
    public void addLineSet(LineSet set) {
        lineSets.add(set);
    }
}
