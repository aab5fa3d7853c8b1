package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.pipeline.IngestReport;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.tomlj.TomlArray;

/**
 * Reads the staged synthetic line lists through the real readers into a line store ({@code store/} in the output
 * folder), exactly as {@code linewright ingest} does, and hands the stored lines of each isotopologue to the
 * later steps (stick spectrum).
 */
public final class IngestStep implements DemoStep {
    /** Folder of the demo's line store inside the output folder. */
    public static final String STORE_DIR = "store";

    @Override
    public String name() {
        return "ingest the line lists into a line store";
    }

    @Override
    public StepOutcome run(DemoContext context) throws IOException {
        TomlArray sources = context.plan().getArray("lines.sources");
        List<Path> files = new ArrayList<>();
        for (int i = 0; i < sources.size(); i++) {
            files.add(context.outDir().resolve(sources.getString(i)).normalize());
        }
        Path storeDir = context.outDir().resolve(STORE_DIR);
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        IngestReport report = IngestPipeline.run(files, storeDir, IngestOptions.strict(registry), IngestListener.NONE);
        List<String> details = new ArrayList<>();
        for (IngestReport.Source s : report.sources()) {
            details.add(String.format(Locale.ROOT, "%s: %s (%s), %d records read, %d kept, %d rejected, %.2f-%.2f cm-1",
                    s.file().getFileName(), s.format(), s.compression(), s.recordsRead(), s.linesKept(),
                    s.recordsRejected(), s.minWavenumberCm1(), s.maxWavenumberCm1()));
        }
        LineStore store = LineStore.open(storeDir);
        for (Isotopologue iso : storedIsotopologues(store, registry)) {
            DemoContext.LineSet set = lineSet(store, iso);
            context.addLineSet(set);
            double[] nu = set.wavenumberCm1();
            details.add(String.format(Locale.ROOT, "%s: %d lines, %.2f-%.2f cm-1", set.label(), nu.length, nu[0],
                    nu[nu.length - 1]));
        }
        details.add(String.format(Locale.ROOT, "store %s: %d lines", STORE_DIR, store.totalLines()));
        return new StepOutcome(details, List.of(storeDir));
    }

    private static List<Isotopologue> storedIsotopologues(LineStore store, MoleculeRegistry registry) throws IOException {
        List<Isotopologue> found = new ArrayList<>();
        LineBatch batch = new LineBatch(4096);
        boolean[] seen = new boolean[100 * 16];
        try (LineCursor cursor = store.cursor(LineQuery.all().withColumns(List.of()))) {
            while (cursor.read(batch)) {
                for (int i = 0; i < batch.size; i++) {
                    int key = batch.moleculeId[i] * 16 + batch.isotopologue[i];
                    if (!seen[key]) {
                        seen[key] = true;
                        found.add(registry.isotopologue(batch.moleculeId[i], batch.isotopologue[i]));
                    }
                }
            }
        }
        return found;
    }

    private static DemoContext.LineSet lineSet(LineStore store, Isotopologue iso) throws IOException {
        List<double[]> chunks = new ArrayList<>();
        int total = 0;
        LineBatch batch = new LineBatch(4096);
        LineQuery query = LineQuery.all().withIsotopologue(iso.moleculeId(), iso.number())
                .withColumns(LineQuery.CROSS_SECTION_COLUMNS);
        try (LineCursor cursor = store.cursor(query)) {
            while (cursor.read(batch)) {
                double[] pairs = new double[2 * batch.size];
                for (int i = 0; i < batch.size; i++) {
                    pairs[2 * i] = batch.wavenumberCm1[i];
                    pairs[2 * i + 1] = batch.intensityCmPerMolecule[i];
                }
                chunks.add(pairs);
                total += batch.size;
            }
        }
        double[] nu = new double[total];
        double[] s = new double[total];
        int k = 0;
        for (double[] pairs : chunks) {
            for (int i = 0; i < pairs.length; i += 2, k++) {
                nu[k] = pairs[i];
                s[k] = pairs[i + 1];
            }
        }
        return new DemoContext.LineSet(iso.isotopeFormula().replace("-", ""), nu, s);
    }
}
