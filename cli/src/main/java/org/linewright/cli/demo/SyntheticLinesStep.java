package org.linewright.cli.demo;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorInputStream;
import org.linewright.ingest.InputException;

/**
 * Makes the synthetic lines available to later steps, taken from the generator's model, after checking that
 * the staged files hold exactly the records the model produces (so the plot shows what the files contain).
 * When the line readers are wired into the demo, a step that reads the staged files into the line store takes
 * this step's place.
 */
public final class SyntheticLinesStep implements DemoStep {
    @Override
    public String name() {
        return "synthetic lines (model, checked against the files)";
    }

    @Override
    public StepOutcome run(DemoContext context) throws IOException {
        List<String> details = new ArrayList<>();
        addChecked(context, SyntheticLineListGenerator.CO_FILE, SyntheticLineListGenerator.carbonMonoxideLines(),
                details);
        addChecked(context, SyntheticLineListGenerator.CO2_FILE, SyntheticLineListGenerator.carbonDioxideLines(),
                details);
        return new StepOutcome(details, List.of());
    }

    private static void addChecked(DemoContext context, String fileName, List<SyntheticLine> lines,
                                   List<String> details) throws IOException {
        Path staged = context.outDir().resolve("data").resolve(fileName);
        if (!Files.isRegularFile(staged)) {
            throw new InputException(staged + ": no such file (expected the staged synthetic list " + fileName + ")");
        }
        String expected = SyntheticLineListGenerator.toRecords(lines);
        String actual;
        try (InputStream in = new BZip2CompressorInputStream(Files.newInputStream(staged))) {
            actual = new String(in.readAllBytes(), StandardCharsets.US_ASCII);
        }
        if (!expected.equals(actual)) {
            throw new InputException(staged + ": records differ from the synthetic model (expected the files "
                    + "written by SyntheticLineListGenerator; regenerate them as demo/data/README.md says)");
        }
        Map<String, List<SyntheticLine>> bySpecies = new TreeMap<>();
        for (SyntheticLine line : lines) {
            bySpecies.computeIfAbsent(speciesLabel(line), k -> new ArrayList<>()).add(line);
        }
        for (Map.Entry<String, List<SyntheticLine>> e : bySpecies.entrySet()) {
            List<SyntheticLine> set = e.getValue();
            double[] nu = new double[set.size()];
            double[] s = new double[set.size()];
            int strongest = 0;
            for (int i = 0; i < nu.length; i++) {
                nu[i] = set.get(i).wavenumberCm1();
                s[i] = set.get(i).intensityCmPerMolecule();
                if (s[i] > s[strongest]) {
                    strongest = i;
                }
            }
            context.addLineSet(new DemoContext.LineSet(e.getKey(), nu, s));
            details.add(String.format(Locale.ROOT,
                    "%s: %d lines, %.2f–%.2f cm-1, strongest %.3e cm/molecule at %.4f cm-1 (%s)",
                    e.getKey(), nu.length, nu[0], nu[nu.length - 1], s[strongest], nu[strongest], fileName));
        }
    }

    private static String speciesLabel(SyntheticLine line) {
        if (line.moleculeId() == SyntheticLineListGenerator.CO_MOLECULE) {
            return line.isotopologue() == 1 ? "12C16O" : "13C16O";
        }
        return "12C16O2";
    }
}
