package org.linewright.spark;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentLinkedQueue;
import org.apache.spark.TaskContext;
import org.linewright.grid.manifest.BlockLayout;
import org.linewright.grid.manifest.BlockStore;
import org.linewright.grid.plan.LineCache;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.BlockCalculator;
import org.linewright.grid.table.BlockResult;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.TableBuilder;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;

/**
 * One cell on an executor: reads the plan and its line stores (kept open per executor and reused by later tasks,
 * one set per concurrently running task), derives the block layout, checks that it is the driver's, computes the
 * cell with one engine thread and saves it into the work folder's block store under the driver's hash.
 */
final class CellTask {
    /**
     * Per build (the driver names each build afresh, since a plan's inputs may change between builds): idle
     * workers, each used by one task at a time. Workers of earlier builds are dropped.
     */
    private static final Map<String, ConcurrentLinkedQueue<Worker>> IDLE = new ConcurrentHashMap<>();

    private CellTask() {
    }

    private record Worker(TablePlan plan, BlockCalculator calculator, BlockLayout layout, BlockStore store) {
    }

    static void run(String buildId, String planFile, int blocks, double reachCm1, TableBuilder.PendingCell cell, String failOnce)
            throws IOException {
        String me = cell.pressureIndex() + "," + cell.temperatureIndex() + "," + cell.block();
        TaskContext task = TaskContext.get();
        if (me.equals(failOnce) && task != null && task.attemptNumber() == 0) {
            throw new IllegalStateException("test hook " + SparkTableBuild.FAIL_ONCE_KEY + ": first attempt of cell "
                    + me + " fails");
        }
        IDLE.keySet().removeIf(k -> !k.equals(buildId));
        ConcurrentLinkedQueue<Worker> idle = IDLE.computeIfAbsent(buildId, k -> new ConcurrentLinkedQueue<>());
        Worker w = idle.poll();
        if (w == null) {
            w = open(planFile);
        }
        if (w.layout().blocks() != blocks || w.layout().reachCm1() != reachCm1) {
            throw new IllegalStateException(planFile + ": the executor lays out " + w.layout().blocks()
                    + " blocks of reach " + w.layout().reachCm1() + " cm-1, the driver " + blocks + " of "
                    + reachCm1 + ": its inputs differ from the driver's");
        }
        BlockResult r = TableBuilder.computeCell(w.calculator(), w.plan(), w.layout(), cell.pressureIndex(),
                cell.temperatureIndex(), cell.block());
        w.store().save(cell.hash(), r);
        idle.add(w);
    }

    private static Worker open(String planFile) throws IOException {
        TablePlan plan = PlanReader.read(Path.of(planFile));
        MoleculeRegistry registry = TableBuilder.registry(plan);
        List<LineStore> stores = LineCache.load(plan.sources(), plan.baseDir().resolve(LineCache.CACHE_DIR),
                registry, BuildListener.NONE).stores();
        BlockCalculator calculator = CalculatorBlocks.factory().create(plan, stores, registry, 1);
        BlockLayout layout = TableBuilder.blocks(plan, calculator, stores).layout();
        return new Worker(plan, calculator, layout, new BlockStore(TableBuilder.workDir(plan.outputTable())));
    }

    static String rootMessage(Throwable e) {
        Throwable t = e;
        while (t.getCause() != null && t.getCause() != t) {
            t = t.getCause();
        }
        String m = t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage();
        int nl = m.indexOf('\n');
        return nl < 0 ? m : m.substring(0, nl);
    }

    static UncheckedIOException unchecked(IOException e) {
        return new UncheckedIOException(e);
    }
}
