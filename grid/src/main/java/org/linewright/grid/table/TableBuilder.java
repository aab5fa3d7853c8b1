package org.linewright.grid.table;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.linewright.broadening.background.Composition;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.calc.MixtureCrossSection;
import org.linewright.grid.calc.StoreMolecules;
import org.linewright.grid.manifest.BlockLayout;
import org.linewright.grid.manifest.BlockStore;
import org.linewright.grid.manifest.BuildManifest;
import org.linewright.grid.manifest.LineReachHasher;
import org.linewright.grid.plan.LineCache;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.partition.TableSpec;
import org.linewright.ingest.partition.PartitionSumNotes;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceMetadata;

/**
 * Builds a plan's table block by block, reusing what an earlier build computed.
 *
 * <p>The grid is cut into fixed blocks ({@link BlockLayout}); each (p, T, block) cell is computed alone from the
 * lines whose centres lie within the block's reach (the wing cutoff plus a margin for pressure shifts), so a cell
 * is the same bit for bit whether computed in a full build, a rebuild or a resumed build. Each cell has an input
 * hash — SHA-256 over the tool version, every parameter of the plan and of the calculator, the partition-sum
 * files, the cell's p, T and grid indices and the hash of the lines within its reach ({@link LineReachHasher}) —
 * and its result is kept under that hash in the work folder {@code TABLE.work/} ({@link BlockStore}). A build
 * computes only the cells whose result is not there yet: after a line list changes only the blocks that see a
 * change are recomputed; after an interruption the build resumes with the cells not yet saved.
 */
public final class TableBuilder {
    /**
     * The largest shift per atm a block's reach ever allows for, cm⁻¹/atm: the calculator's own read margin
     * (it never takes a line from farther away), so a table cell never misses a line a single cross section of
     * the whole grid would use.
     */
    public static final double SHIFT_MARGIN_CM1_PER_ATM = CrossSectionCalculator.SHIFT_MARGIN_CM1_PER_ATM;
    /**
     * Grid steps added to a block's reach: a transform engine spreads a line over a position stencil of ±3 of its
     * internal steps (at most one grid step each) and rounds its kernel length up by one step; 8 covers both
     * with room for floating-point round-off in ν + δ·p and ν ± cutoff.
     */
    public static final int REACH_SLACK_STEPS = 8;

    private TableBuilder() {
    }

    /** Makes the calculator for a build once the plan's stores are open. */
    @FunctionalInterface
    public interface CalculatorFactory {
        /**
         * @param plan     the plan
         * @param stores   the plan's line stores, in plan order
         * @param registry the registry with the plan's partition-sum tables and molecule data attached
         * @param threads  threads the engine may use
         */
        BlockCalculator create(TablePlan plan, List<LineStore> stores, MoleculeRegistry registry, int threads)
                throws IOException;
    }

    /** The work folder of a table: {@code TABLE.work} beside it. */
    public static Path workDir(Path table) {
        return table.resolveSibling(table.getFileName() + ".work");
    }

    /**
     * The registry a plan asks for: built-in, plus its molecule data, partition-sum tables and a catalog's
     * partition functions (user tables and a data set's own {@code .pf} win over the catalog's, as in {@code sigma}).
     */
    public static MoleculeRegistry registry(TablePlan plan) throws IOException {
        MoleculeRegistry base = MoleculeRegistry.builtIn();
        if (plan.moleculeDataOrNull() != null) {
            base = base.withUserFile(plan.moleculeDataOrNull());
        }
        PartitionSums sums = PartitionSums.of(base).withTables(plan.partitionTables());
        if (plan.catalogPartitionOrNull() != null) {
            sums = sums.withCatalogFile(plan.catalogPartitionOrNull());
        }
        return sums.attachedRegistry();
    }

    /**
     * Builds (or, with {@code dryRun}, only plans) the table of {@code plan}.
     *
     * @param factory   the calculator
     * @param threads   threads for the engine (results are the same for any count)
     * @param dryRun    hash and count, compute and write nothing
     * @param listener  progress
     */
    public static BuildReport build(TablePlan plan, CalculatorFactory factory, int threads, boolean dryRun,
                                    BuildListener listener) throws IOException {
        return build(plan, factory, threads, dryRun, listener, LOCAL_RUNNER, null);
    }

    /** The runner named in a table's metadata when its cells were computed in this process. */
    public static final String LOCAL_RUNNER = "local";

    /**
     * A cell still to compute.
     *
     * @param pressureIndex    index into the plan's pressures
     * @param temperatureIndex index into the plan's temperatures
     * @param block            block along the grid
     * @param hash             the cell's input hash, the name its result is saved under in the block store
     */
    public record PendingCell(int pressureIndex, int temperatureIndex, int block, String hash)
            implements java.io.Serializable {
    }

    /**
     * Computes a build's pending cells somewhere else (for example as tasks of a cluster) and saves each result in
     * the work folder's {@link BlockStore} under the cell's hash, before the builder assembles the table from the
     * block store exactly as after a local build.
     */
    @FunctionalInterface
    public interface CellRunner {
        /**
         * @param plan    the plan
         * @param layout  the build's blocks (the runner's workers must derive the same layout from the plan)
         * @param pending the cells to compute, pressure-major
         * @param workDir the work folder holding the block store
         */
        void run(TablePlan plan, BlockLayout layout, List<PendingCell> pending, Path workDir) throws IOException;
    }

    /** Computes one cell of a build: the block's slice of the grid at the cell's (p, T). */
    public static BlockResult computeCell(BlockCalculator calculator, TablePlan plan, BlockLayout layout,
                                          int pressureIndex, int temperatureIndex, int block) throws IOException {
        BlockResult r = calculator.compute(layout.slice(block), plan.pressuresAtm()[pressureIndex],
                plan.temperaturesK()[temperatureIndex], layout.lineMinCm1(block), layout.lineMaxCm1(block));
        if (r.sigmaCm2PerMolecule().length != layout.toIndex(block) - layout.fromIndex(block)) {
            throw new IllegalStateException("calculator returned " + r.sigmaCm2PerMolecule().length
                    + " values for a block of " + (layout.toIndex(block) - layout.fromIndex(block)));
        }
        return r;
    }

    /**
     * As {@link #build(TablePlan, CalculatorFactory, int, boolean, BuildListener)}, with the pending cells
     * computed by {@code cellRunner} (null: in this process) and {@code runner} recorded in the table's metadata
     * as {@code runner}. Everything else — hashes, manifest, block store, table bits — is the same whichever
     * computes the cells, so builds by either reuse each other's cells.
     */
    public static BuildReport build(TablePlan plan, CalculatorFactory factory, int threads, boolean dryRun,
                                    BuildListener listener, String runner, CellRunner cellRunner) throws IOException {
        long t0 = System.nanoTime();
        MoleculeRegistry registry = registry(plan);
        LineCache.Loaded loaded = LineCache.load(plan.sources(), plan.baseDir().resolve(LineCache.CACHE_DIR),
                registry, listener);
        long linesInStores = 0;
        for (LineStore s : loaded.stores()) {
            linesInStores += s.totalLines();
        }
        refuseUndeclaredMixture(plan, loaded.stores(), registry);
        Path work = workDir(plan.outputTable());
        BuildManifest previous = previousManifest(work);
        try (BlockCalculator calculator = factory.create(plan, loaded.stores(), registry, threads)) {
            Blocks blocksPlan = blocks(plan, calculator, loaded.stores());
            BlockLayout layout = blocksPlan.layout();
            listener.hashing(layout.blocks(), layout.blockPoints(), layout.reachCm1());
            LineReachHasher.Result lineHashes = LineReachHasher.hash(loaded.stores(), speciesQuery(plan), layout);
            Map<String, String> parameters = parameters(plan, calculator);
            String parametersHash = sha256Hex(parameters.toString().getBytes(StandardCharsets.UTF_8));
            int np = plan.pressuresBar().length;
            int nt = plan.temperaturesK().length;
            int nb = layout.blocks();
            String[][][] cellHash = new String[np][nt][nb];
            BuildManifest manifest = BuildManifest.create();
            manifest.put("table", plan.outputTable().getFileName().toString());
            manifest.put("tool_version", ToolVersion.get());
            manifest.put("parameters_sha256", parametersHash);
            manifest.put("blocks", Integer.toString(nb));
            manifest.put("block_points", Integer.toString(layout.blockPoints()));
            manifest.put("block_points_from", blocksPlan.blockPointsFromEngine() ? "engine" : "plan");
            manifest.put("reach_cm1", Double.toString(layout.reachCm1()));
            manifest.put("reach.cutoff_cm1", Double.toString(plan.profile().cutoffCm1()));
            manifest.put("reach.max_shift_cm1_per_atm", Double.toString(blocksPlan.shiftBoundCm1PerAtm()));
            manifest.put("reach.max_pressure_atm", Double.toString(blocksPlan.maxPressureAtm()));
            manifest.put("reach.slack_cm1", Double.toString(blocksPlan.slackCm1()));
            for (int b = 0; b < nb; b++) {
                manifest.put("block." + b + ".range_cm1", layout.slice(b).firstCm1() + " " + layout.slice(b).lastCm1());
                manifest.put("block." + b + ".lines", Long.toString(lineHashes.lines()[b]));
                manifest.put("block." + b + ".lines_sha256", lineHashes.hashes()[b]);
            }
            for (int s = 0; s < loaded.stores().size(); s++) {
                manifest.put("store." + s + ".dir", loaded.stores().get(s).directory().toAbsolutePath().toString());
                manifest.put("store." + s + ".sources_sha256", sourcesId(loaded.stores().get(s)));
            }
            manifest.put("incremental.sums", calculator.keepsExactSums() ? "exact" : "none");
            BlockStore blocks = dryRun ? null : new BlockStore(work);
            List<String> pending = new ArrayList<>();
            List<PendingCell> pendingCells = new ArrayList<>();
            long pendingPoints = 0;
            for (int p = 0; p < np; p++) {
                for (int t = 0; t < nt; t++) {
                    for (int b = 0; b < nb; b++) {
                        String h = cellHash(parametersHash, lineHashes.hashes()[b], plan.pressuresBar()[p],
                                plan.temperaturesK()[t], layout.fromIndex(b), layout.toIndex(b));
                        cellHash[p][t][b] = h;
                        manifest.put(BuildManifest.cellKey(p, t, b), h);
                        boolean done = dryRun ? java.nio.file.Files.isRegularFile(work.resolve("blocks").resolve(h + ".blk"))
                                : blocks.has(h);
                        if (!done) {
                            pending.add(describeCell(plan, layout, p, t, b));
                            pendingCells.add(new PendingCell(p, t, b, h));
                            pendingPoints += layout.toIndex(b) - layout.fromIndex(b);
                        }
                    }
                }
            }
            int cells = np * nt * nb;
            listener.planned(cells, pending.size(), pendingPoints);
            Update update = update(previous, manifest, loaded.stores(), calculator, layout, plan, lineHashes,
                    pendingCells, work);
            if (dryRun) {
                return new BuildReport(plan.outputTable(), true, cells, pending.size(), cells - pending.size(),
                        pending, linesInStores, 0, Map.of(), 0, List.of(), null, loaded.ingested(),
                        (System.nanoTime() - t0) * 1e-9, update.summary());
            }
            manifest.write(work);
            if (cellRunner != null && !pendingCells.isEmpty()) {
                cellRunner.run(plan, layout, List.copyOf(pendingCells), work);
                for (PendingCell c : pendingCells) {
                    if (!blocks.has(c.hash())) {
                        throw new IOException(work + ": the " + runner + " runner did not save cell "
                                + BuildManifest.cellKey(c.pressureIndex(), c.temperatureIndex(), c.block()));
                    }
                    listener.computed(c.pressureIndex(), c.temperatureIndex(), c.block(),
                            layout.toIndex(c.block()) - layout.fromIndex(c.block()));
                }
            }
            long linesUsed = 0;
            double maxError = 0;
            // each cell's estimate: the largest over its blocks
            double[][] cellError = new double[np][nt];
            Map<String, Long> counts = new TreeMap<>();
            java.util.Set<String> warnings = new java.util.LinkedHashSet<>();
            double[] pressuresAtm = plan.pressuresAtm();
            int gridSize = plan.grid().size();
            // A table that fits in memory is assembled while its blocks are read for their counts (one read each)
            boolean inMemory = (long) np * nt * gridSize * Double.BYTES <= TableWriter.CACHE_BYTES;
            double[][][] rows = inMemory ? new double[np][nt][] : null;
            for (int p = 0; p < np; p++) {
                for (int t = 0; t < nt; t++) {
                    if (inMemory) {
                        rows[p][t] = new double[gridSize];
                    }
                    for (int b = 0; b < nb; b++) {
                        String h = cellHash[p][t][b];
                        BlockResult r;
                        if (blocks.has(h)) {
                            r = inMemory ? blocks.load(h) : blocks.loadSummary(h);
                        } else {
                            String oldHash = update.oldHash(p, t, b);
                            r = oldHash != null ? update.cell(calculator, factory, registry, threads, blocks, oldHash,
                                    plan, layout, p, t, b) : null;
                            if (r == null) {
                                r = computeCell(calculator, plan, layout, p, t, b);
                            }
                            blocks.save(h, r);
                            listener.computed(p, t, b, r.sigmaCm2PerMolecule().length);
                        }
                        if (inMemory) {
                            double[] s = r.sigmaCm2PerMolecule();
                            if (s.length != layout.toIndex(b) - layout.fromIndex(b)) {
                                throw new InputException(work + ": block file of cell " + BuildManifest.cellKey(p, t, b)
                                        + " holds " + s.length + " points (expected "
                                        + (layout.toIndex(b) - layout.fromIndex(b)) + "; delete the work folder)");
                            }
                            System.arraycopy(s, 0, rows[p][t], layout.fromIndex(b), s.length);
                        }
                        linesUsed += r.linesUsed();
                        maxError = Math.max(maxError, r.estimatedRelativeError());
                        cellError[p][t] = Math.max(cellError[p][t], r.estimatedRelativeError());
                        r.counts().forEach((k, v) -> counts.merge(k, v, Long::sum));
                        counts.merge("lines_below_threshold", r.linesBelowThreshold(), Long::sum);
                        warnings.addAll(r.warnings());
                    }
                }
            }
            listener.writing();
            Map<String, String> metadata = new LinkedHashMap<>();
            metadata.put("tool_version", ToolVersion.get());
            metadata.put("created_utc", Instant.now().toString());
            metadata.put("plan_file", plan.planFile().getFileName().toString());
            metadata.put("runner", runner);
            loaded.inputSha256().forEach((name, sha) -> metadata.put("input." + name + ".sha256", sha));
            parameters.forEach((k, v) -> metadata.put(k, v));
            // the same keys as a sigma file's: convention, user abundances, and each species' share of a mixture
            metadata.putAll(plan.species().intensityScaling().metadata());
            if (plan.species().mixture()) {
                metadata.putAll(MixtureCrossSection.metadata(plan.species().vmrByFormula()));
            }
            metadata.put("pressure_bar_values", join(plan.pressuresBar()));
            metadata.put("temperature_K_values", join(plan.temperaturesK()));
            metadata.put("lines_in_stores", Long.toString(linesInStores));
            metadata.put("lines_used_summed_over_cells", Long.toString(linesUsed));
            counts.forEach((k, v) -> metadata.put("count." + k, Long.toString(v)));
            metadata.put("estimated_relative_error", Double.toString(maxError));
            StringBuilder byCell = new StringBuilder();
            for (int p = 0; p < np; p++) {
                for (int t = 0; t < nt; t++) {
                    byCell.append(byCell.length() == 0 ? "" : ",").append(cellError[p][t]);
                }
            }
            // pressure-major, as the cells are stored
            metadata.put("estimated_relative_error_by_cell", byCell.toString());
            metadata.put("build_cells", Integer.toString(cells));
            // per isotopologue, where Q(T) came from at the plan's temperatures (distinct sources joined), and why
            // a value may be off
            Map<String, java.util.LinkedHashSet<String>> qSources = new java.util.TreeMap<>();
            for (double t : plan.temperaturesK()) {
                PartitionSumNotes notes = PartitionSumNotes.of(registry, loaded.stores(), t);
                notes.metadata().forEach((k, v) -> {
                    if (k.startsWith("partition_sum.")) {
                        qSources.computeIfAbsent(k, x -> new java.util.LinkedHashSet<>()).add(v);
                    }
                });
                warnings.addAll(notes.warnings());
            }
            qSources.forEach((k, v) -> metadata.put(k, String.join("; ", v)));
            metadata.put("line_shape_rule", CrossSectionCalculator.shapeRule(plan.profile().shape()));
            int w = 0;
            for (String text : warnings) {
                metadata.put("warning." + (++w), text);
            }
            final BlockStore store = blocks;
            SigmaSource sigma = inMemory ? (p, t) -> rows[p][t] : (p, t) -> {
                double[] row = new double[gridSize];
                for (int b = 0; b < nb; b++) {
                    double[] s = store.load(cellHash[p][t][b]).sigmaCm2PerMolecule();
                    System.arraycopy(s, 0, row, layout.fromIndex(b), s.length);
                }
                return row;
            };
            TableWriter.Written written = TableWriter.write(plan.outputTable(), new TableContent(
                    plan.grid().pointsCm1(), plan.pressuresBar(), plan.temperaturesK(), sigma, plan.precision(),
                    metadata));
            // a finished build is the next rebuild's base: the interrupted-rebuild keys go
            manifest.removeAll(BASE);
            manifest.put("table_sha256", written.fileSha256());
            manifest.put("sigma_sha256", written.sigmaSha256());
            manifest.write(work);
            Set<String> keep = new HashSet<>();
            for (String[][] byT : cellHash) {
                for (String[] byB : byT) {
                    keep.addAll(List.of(byB));
                }
            }
            blocks.prune(keep);
            update.close();
            return new BuildReport(plan.outputTable(), false, cells, pending.size(), cells - pending.size(), pending,
                    linesInStores, linesUsed, counts, maxError, List.copyOf(warnings), written, loaded.ingested(),
                    (System.nanoTime() - t0) * 1e-9, update.summary());
        }
    }

    /** Lines that may differ between two versions before a rebuild recomputes blocks instead of updating them. */
    static final long MAX_CHANGED_LINES = 5_000_000;

    /** The manifest of the previous build, or null (none, or of another format: then every cell is recomputed). */
    private static BuildManifest previousManifest(Path work) throws IOException {
        try {
            return BuildManifest.read(work);
        } catch (InputException e) {
            return null;
        }
    }

    /** What identifies a store's content: its sources' SHA-256, in order. */
    private static String sourcesId(LineStore store) {
        StringBuilder b = new StringBuilder();
        for (org.linewright.ingest.store.SourceInfo s : store.sources()) {
            b.append(b.length() == 0 ? "" : " ").append(s.name()).append('=').append(s.metadata().sourceSha256());
        }
        return b.toString();
    }

    /**
     * How a rebuild obtains its pending cells from the previous build: with exact sums kept (exact engine), the same
     * parameters and blocks, and the previous line stores still there (the plan's cache keeps every version it
     * ingested), a cell is its previous exact sums minus the removed lines' and plus the added lines' — the same
     * bits as summing the current lines afresh, since exact sums do not depend on order. Otherwise the cells are
     * computed afresh, and {@link BuildReport.Incremental#mode} says why.
     */
    private static Update update(BuildManifest previous, BuildManifest current, List<LineStore> stores,
                                 BlockCalculator calculator, BlockLayout layout, TablePlan plan,
                                 LineReachHasher.Result lineHashes, List<PendingCell> pending, Path work)
            throws IOException {
        long full = 0;
        for (long n : lineHashes.lines()) {
            full += n;
        }
        full *= (long) plan.pressuresBar().length * plan.temperaturesK().length;
        long freshCost = 0;
        for (PendingCell c : pending) {
            freshCost += lineHashes.lines()[c.block()];
        }
        double freshRelative = full > 0 ? (double) freshCost / full : 0;
        String why = null;
        if (pending.isEmpty()) {
            why = "nothing to compute";
        } else if (previous == null) {
            why = "first build";
        } else if (!calculator.keepsExactSums()) {
            why = "engine " + plan.profile().engine() + " keeps no exact sums: the blocks a change reaches are "
                    + "computed afresh";
        } else if (!"exact".equals(previous.get("incremental.sums"))) {
            why = "the previous build kept no exact sums";
        } else {
            for (String key : List.of("parameters_sha256", "blocks", "block_points", "reach_cm1")) {
                if (!java.util.Objects.equals(previous.get(key), current.get(key))) {
                    why = "parameters or blocks changed (" + key + "): every cell they reach is computed afresh";
                    break;
                }
            }
        }
        List<LineStore> oldStores = new ArrayList<>();
        if (why == null) {
            for (int s = 0; s < stores.size() && why == null; s++) {
                String dir = base(previous, "store." + s + ".dir");
                String id = base(previous, "store." + s + ".sources_sha256");
                if (dir == null || id == null || !java.nio.file.Files.isRegularFile(
                        Path.of(dir).resolve("linestore.properties"))) {
                    why = "the previous version of line store " + s + " is gone: the blocks a change reaches are "
                            + "computed afresh";
                    break;
                }
                LineStore old = LineStore.open(Path.of(dir));
                if (!id.equals(sourcesId(old))) {
                    why = "line store " + old.directory() + " was changed in place: the blocks a change reaches are "
                            + "computed afresh";
                }
                oldStores.add(old);
            }
            if (why == null && base(previous, "store." + stores.size() + ".dir") != null) {
                why = "the plan has fewer line sources than before";
            }
        }
        LineDelta delta = null;
        if (why == null) {
            delta = LineDelta.between(oldStores, stores, speciesQuery(plan), layout.lineMinCm1(0),
                    layout.lineMaxCm1(layout.blocks() - 1), MAX_CHANGED_LINES);
            if (delta == null) {
                why = "more than " + MAX_CHANGED_LINES + " lines changed: the blocks are computed afresh";
            }
        }
        if (why != null) {
            return new Update(null, List.of(), null, new BuildReport.Incremental(why, 0, 0, 0, pending.size(),
                    freshRelative));
        }
        BlockStore blocks = new BlockStore(work);
        Map<Long, String> oldHashes = new java.util.HashMap<>();
        long cost = 0;
        int updated = 0;
        for (PendingCell c : pending) {
            String key = BuildManifest.cellKey(c.pressureIndex(), c.temperatureIndex(), c.block());
            String oldHash = base(previous, key);
            double lo = layout.lineMinCm1(c.block());
            double hi = layout.lineMaxCm1(c.block());
            if (oldHash != null && blocks.has(oldHash) && blocks.hasSums(oldHash)) {
                oldHashes.put(cellIndex(c.pressureIndex(), c.temperatureIndex(), c.block()), oldHash);
                current.put(BASE + key, oldHash);
                cost += delta.removedIn(lo, hi) + delta.addedIn(lo, hi);
                updated++;
            } else {
                cost += lineHashes.lines()[c.block()];
            }
        }
        for (int s = 0; s < oldStores.size(); s++) {
            current.put(BASE + "store." + s + ".dir", oldStores.get(s).directory().toAbsolutePath().toString());
            current.put(BASE + "store." + s + ".sources_sha256", sourcesId(oldStores.get(s)));
        }
        String mode = "cells updated from the changed lines (exact sums: the same bits as a build from scratch)";
        return new Update(delta, oldStores, oldHashes, new BuildReport.Incremental(mode, delta.removedLines(),
                delta.addedLines(), updated, pending.size() - updated, full > 0 ? (double) cost / full : 0));
    }

    /**
     * Prefix of the manifest keys a rebuild writes before it computes: the previous build's cells and stores it
     * updates from, so that a rebuild interrupted after the manifest was written resumes from the same base. Removed
     * when the build finishes.
     */
    private static final String BASE = "base.";

    /** The previous build's value of {@code key}: from an interrupted rebuild's base when there is one. */
    private static String base(BuildManifest previous, String key) {
        String b = previous.get(BASE + key);
        return b != null ? b : previous.get(key);
    }

    private static long cellIndex(int p, int t, int b) {
        return ((long) p << 42) | ((long) t << 21) | b;
    }

    /** The rebuild's way to its cells (see {@link #update}). */
    private static final class Update {
        private final LineDelta delta;
        private final List<LineStore> oldStores;
        private final Map<Long, String> oldHashes;
        private final BuildReport.Incremental summary;
        private BlockCalculator oldCalculator;
        private org.linewright.grid.calc.LineFilter removed;
        private org.linewright.grid.calc.LineFilter added;

        Update(LineDelta delta, List<LineStore> oldStores, Map<Long, String> oldHashes,
               BuildReport.Incremental summary) {
            this.delta = delta;
            this.oldStores = oldStores;
            this.oldHashes = oldHashes;
            this.summary = summary;
        }

        BuildReport.Incremental summary() {
            return summary;
        }

        /** The previous build's hash of a cell to update from, or null to compute it afresh. */
        String oldHash(int p, int t, int b) {
            return oldHashes == null ? null : oldHashes.get(cellIndex(p, t, b));
        }

        /**
         * The cell from the previous cell's exact sums, the removed lines' and the added lines' (summed by the
         * same engine on the same block grid, so each line's values are the bits a full computation adds), with
         * the statistics of the current lines; null when the previous sums are gone.
         */
        BlockResult cell(BlockCalculator calculator, CalculatorFactory factory, MoleculeRegistry registry,
                         int threads, BlockStore blocks, String oldHash, TablePlan plan, BlockLayout layout, int p,
                         int t, int b) throws IOException {
            org.linewright.grid.engine.exact.FixedPointSums sums = blocks.loadSums(oldHash);
            if (sums == null) {
                return null;
            }
            WavenumberGrid g = layout.slice(b);
            double pressureAtm = plan.pressuresAtm()[p];
            double temperatureK = plan.temperaturesK()[t];
            double lo = layout.lineMinCm1(b);
            double hi = layout.lineMaxCm1(b);
            if (delta.removedIn(lo, hi) > 0) {
                if (oldCalculator == null) {
                    oldCalculator = factory.create(plan, oldStores, registry, threads);
                    removed = delta.removed();
                }
                sums.subtract(oldCalculator.computeSelected(g, pressureAtm, temperatureK, lo, hi, removed)
                        .exactSumsOrNull());
            }
            if (delta.addedIn(lo, hi) > 0) {
                if (added == null) {
                    added = delta.added();
                }
                sums.add(calculator.computeSelected(g, pressureAtm, temperatureK, lo, hi, added).exactSumsOrNull());
            }
            BlockResult stats = calculator.statistics(g, pressureAtm, temperatureK, lo, hi);
            double[] sigma = new double[sums.size()];
            sums.values(sigma);
            return new BlockResult(sigma, stats.linesUsed(), stats.linesBelowThreshold(), stats.counts(),
                    stats.estimatedRelativeError(), stats.warnings(), sums);
        }

        void close() {
            if (oldCalculator != null) {
                oldCalculator.close();
            }
        }
    }

    /**
     * How a build cuts the grid and how far each block looks for its lines.
     *
     * @param layout                the blocks and their reach
     * @param blockPointsFromEngine true when the plan set no block size and the engine's preference was taken
     * @param shiftBoundCm1PerAtm   the bound on |δ| used for the reach, cm⁻¹/atm
     * @param maxPressureAtm        the plan's highest pressure, atm
     * @param slackCm1              the slack added for the engines' stencils and round-off, cm⁻¹
     */
    public record Blocks(BlockLayout layout, boolean blockPointsFromEngine, double shiftBoundCm1PerAtm,
                         double maxPressureAtm, double slackCm1) {
    }

    /**
     * The blocks of {@code plan}'s build with {@code calculator} on the lines of {@code stores}.
     *
     * <p>Block size: the plan's {@code block_points}, else the calculator's (engine's) preference for the grid
     * and the plan's largest cutoff.
     *
     * <p>Reach: r = d + δ_max·p_max + s, where d is the largest wing cutoff of the plan (the cap of every cutoff
     * rule), p_max its highest pressure, s = {@value #REACH_SLACK_STEPS} × the largest grid step, and δ_max
     * bounds the background shift per atm of every line: the resolved shift is Σ_g x_g·δ_g with Σ x_g ≤ 1 +
     * {@link Composition#SUM_TOLERANCE} and each δ_g drawn from a line's shift columns (air and foreign
     * broadeners, {@link LineReachHasher#maxAbsShiftCm1PerAtm} over every line that could reach the grid) or a
     * constant of the width options ({@link BlockCalculator#maxConstantShiftCm1PerAtm}), so
     * |δ·p| ≤ (1 + tolerance)·max|δ_g|·p_max. A line contributes only within d of its shifted centre, so a line
     * whose stored centre is farther than r from a block cannot touch it at any pressure of the plan. δ_max is
     * capped by {@link #SHIFT_MARGIN_CM1_PER_ATM}, beyond which the calculator reads no lines anyway.
     */
    public static Blocks blocks(TablePlan plan, BlockCalculator calculator, List<LineStore> stores)
            throws IOException {
        WavenumberGrid grid = plan.grid();
        double[] points = grid.pointsCm1();
        double maxStep = 0;
        for (int i = 1; i < points.length; i++) {
            maxStep = Math.max(maxStep, points[i] - points[i - 1]);
        }
        double maxPressureAtm = 0;
        for (double p : plan.pressuresAtm()) {
            maxPressureAtm = Math.max(maxPressureAtm, p);
        }
        double cutoff = plan.profile().cutoffCm1();
        double slack = REACH_SLACK_STEPS * maxStep;
        double widest = cutoff + SHIFT_MARGIN_CM1_PER_ATM * maxPressureAtm + slack;
        double lineShift = LineReachHasher.maxAbsShiftCm1PerAtm(stores, speciesQuery(plan),
                points[0] - widest, points[points.length - 1] + widest);
        double shiftBound = Math.min(SHIFT_MARGIN_CM1_PER_ATM,
                Math.max(lineShift, calculator.maxConstantShiftCm1PerAtm()) * (1 + Composition.SUM_TOLERANCE));
        double reach = cutoff + shiftBound * maxPressureAtm + slack;
        boolean fromEngine = plan.blockPoints() == TablePlan.ENGINE_BLOCK_POINTS;
        int blockPoints = fromEngine ? calculator.preferredBlockPoints(grid, cutoff) : plan.blockPoints();
        return new Blocks(new BlockLayout(grid, blockPoints, reach), fromEngine, shiftBound, maxPressureAtm, slack);
    }

    /**
     * σ in cm²/molecule over lines of several molecules has no single "molecule" (docs/physics.md, "Per molecule
     * of what"): a plan whose selected lines span several molecules must declare their mixing ratios
     * ({@code species.vmr}), one for each of them. Checked once the stores are open, before any block is hashed or
     * computed.
     *
     * @throws InputException one line naming the molecules found and the key to write
     */
    static void refuseUndeclaredMixture(TablePlan plan, List<LineStore> stores, MoleculeRegistry registry) {
        TablePlan.Species species = plan.species();
        java.util.SortedSet<Integer> found = new java.util.TreeSet<>();
        for (int id : StoreMolecules.of(stores)) {
            boolean selected = species.all() || species.molecules().contains(id)
                    || species.isotopologues().stream().anyMatch(pair -> pair[0] == id);
            if (selected) {
                found.add(id);
            }
        }
        if (species.mixture()) {
            Set<Integer> declared = new HashSet<>();
            species.vmr().forEach(v -> declared.add(v.moleculeId()));
            for (int id : found) {
                if (!declared.contains(id)) {
                    throw new InputException(plan.planFile() + ": species.vmr: no mixing ratio for "
                            + StoreMolecules.name(registry, id) + ", whose lines are in the stores (expected a ratio "
                            + "for every molecule of the stores " + StoreMolecules.names(registry, found) + ")");
                }
            }
        } else if (found.size() > 1) {
            List<String> names = StoreMolecules.names(registry, found);
            StringBuilder example = new StringBuilder();
            for (String n : names) {
                example.append(example.length() == 0 ? "" : ", ").append(n).append(" = ...");
            }
            throw new InputException(plan.planFile() + ": the line stores hold lines of several molecules " + names
                    + ": a table per molecule of a mixture needs declared mixing ratios (expected species.vmr = { "
                    + example + " } in the plan, or species.molecules with one molecule)");
        }
    }

    /** The plan's species selection as a line query (every line when none is set). */
    static LineQuery speciesQuery(TablePlan plan) {
        LineQuery q = LineQuery.all();
        int[] molecules = plan.species().molecules().stream().mapToInt(Integer::intValue).toArray();
        if (molecules.length > 0) {
            q = q.withMolecules(molecules);
        }
        for (int[] iso : plan.species().isotopologues()) {
            q = q.withIsotopologue(iso[0], iso[1]);
        }
        return q;
    }

    /** Every parameter that affects σ: the plan's, the calculator's (threads excluded) and the partition files'. */
    private static Map<String, String> parameters(TablePlan plan, BlockCalculator calculator) throws IOException {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("tool_version", ToolVersion.get());
        plan.describe().forEach((k, v) -> m.put("param." + k, v));
        calculator.describe().forEach((k, v) -> {
            if (!k.toLowerCase(Locale.ROOT).contains("thread")) {
                m.put("calc." + k, v);
            }
        });
        for (TableSpec t : plan.partitionTables()) {
            m.put("partition_table." + t.moleculeId() + "/" + t.isotopologue() + ".sha256", SourceMetadata.sha256(t.file()));
        }
        if (plan.moleculeDataOrNull() != null) {
            m.put("molecule_data.sha256", SourceMetadata.sha256(plan.moleculeDataOrNull()));
        }
        if (plan.catalogPartitionOrNull() != null) {
            m.put("catalog_partition.sha256", SourceMetadata.sha256(plan.catalogPartitionOrNull()));
        }
        return m;
    }

    private static String cellHash(String parametersHash, String linesHash, double pressureBar, double temperatureK,
                                   int fromIndex, int toIndex) {
        ByteBuffer b = ByteBuffer.allocate(24);
        b.putLong(Double.doubleToLongBits(pressureBar)).putLong(Double.doubleToLongBits(temperatureK))
                .putInt(fromIndex).putInt(toIndex);
        MessageDigest d = sha256();
        d.update(parametersHash.getBytes(StandardCharsets.US_ASCII));
        d.update(linesHash.getBytes(StandardCharsets.US_ASCII));
        d.update(b.array());
        return HexFormat.of().formatHex(d.digest());
    }

    private static String describeCell(TablePlan plan, BlockLayout layout, int p, int t, int b) {
        return String.format(Locale.ROOT, "p=%s bar, T=%s K, %.6f-%.6f cm-1", plan.pressuresBar()[p],
                plan.temperaturesK()[t], layout.slice(b).firstCm1(), layout.slice(b).lastCm1());
    }

    private static String join(double[] values) {
        StringBuilder b = new StringBuilder();
        for (double v : values) {
            b.append(b.length() == 0 ? "" : " ").append(v);
        }
        return b.toString();
    }

    private static String sha256Hex(byte[] bytes) {
        return HexFormat.of().formatHex(sha256().digest(bytes));
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }
}
