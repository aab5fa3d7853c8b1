package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityConvention;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.sources.WidthSource;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.ingest.testsupport.SyntheticRecords;

/**
 * The calculator on 1, 2 and 3 threads: the same chunks reach the engine, σ and every statistic are the same bit
 * for bit, and a failure is the first one in line order. Real lines: the HITRAN2020 CO, CO2 and N2O samples
 * (Gordon et al. 2022, JQSRT 277, 107949; {@code ../shared/reference-data/hitran2020-samples/}), read in small
 * batches so that each store gives dozens of them; synthetic lines: {@link SyntheticRecords} (invented), in the
 * calculator's full-size batches. Line counts and the first failing line are found independently from the
 * fixed columns of the 160-character records (molecule 1–2, isotopologue 3, ν 4–15, S 16–25) or from the
 * generator's block.
 */
class CrossSectionCalculatorThreadsTest {
    /** Lines per batch for the samples: odd, so batch edges fall anywhere (about 20 batches per sample). */
    private static final int SMALL_CHUNK = 257;
    private static final double SYNTHETIC_FIRST_CM1 = 2000.0;
    private static final double SYNTHETIC_SPACING_CM1 = 0.0005;
    private static final int SYNTHETIC_BLOCK = 20_000;
    /** Four generator blocks: four full batches of the calculator and a partial one. */
    private static final int SYNTHETIC_LINES = 4 * SYNTHETIC_BLOCK;

    /** The built-in registry with its partition sums attached. */
    private static final MoleculeRegistry REGISTRY = PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();

    @TempDir
    static Path tmp;
    static Path coSample;
    static Path co2Sample;
    static Path n2oSample;
    static List<LineStore> samples;
    static LineStore synthetic;

    @BeforeAll
    static void stores() throws IOException {
        synthetic = writeSynthetic(tmp.resolve("synthetic"));
    }

    /** The three sample stores, ingested at first use (the test is skipped, visibly, without the reference data). */
    private static synchronized List<LineStore> samples() throws IOException {
        if (samples == null) {
            coSample = ReferenceSamples.hitranSample("sample_CO.par");
            co2Sample = ReferenceSamples.hitranSample("sample_CO2.par");
            n2oSample = ReferenceSamples.hitranSample("sample_N2O.par");
            samples = List.of(LineStore.open(ReferenceSamples.ingest(tmp.resolve("co"), coSample)),
                    LineStore.open(ReferenceSamples.ingest(tmp.resolve("co2"), co2Sample)),
                    LineStore.open(ReferenceSamples.ingest(tmp.resolve("n2o"), n2oSample)));
        }
        return samples;
    }

    /** {molecule, isotopologue, ν, S(296 K)} of every record, from the fixed columns of the 160-character format. */
    private static double[][] records(Path sample) throws IOException {
        return ReferenceSamples.lines(sample).stream().filter(l -> l.length() >= 160)
                .map(l -> new double[] {Double.parseDouble(l.substring(0, 2).trim()),
                    Double.parseDouble(l.substring(2, 3).trim()), Double.parseDouble(l.substring(3, 15).trim()),
                    Double.parseDouble(l.substring(15, 25).trim())})
                .toArray(double[][]::new);
    }

    /** The synthetic lines: the generator's block repeated at 2000 + i·0.0005 cm⁻¹, source line i + 1. */
    private static LineStore writeSynthetic(Path dir) throws IOException {
        LineBatch b = SyntheticRecords.block(SYNTHETIC_BLOCK, 7);
        try (LineStoreWriter writer = LineStoreWriter.create(dir, "synthetic",
                SourceMetadata.of("synthetic-co.par", "", "hitran160", Map.of("generator", "test")))) {
            for (int done = 0; done < SYNTHETIC_LINES; done += SYNTHETIC_BLOCK) {
                int n = SYNTHETIC_BLOCK;
                for (int i = 0; i < n; i++) {
                    b.wavenumberCm1[i] = syntheticCentreCm1(done + i);
                    b.sourceLine[i] = done + i + 1;
                }
                b.size = n;
                writer.write(b);
            }
            writer.commit(new IngestCounts(SYNTHETIC_LINES, SYNTHETIC_LINES, 0, 0));
        }
        return LineStore.open(dir);
    }

    private static double syntheticCentreCm1(long index) {
        return Math.round((SYNTHETIC_FIRST_CM1 + index * SYNTHETIC_SPACING_CM1) * 1e6) / 1e6;
    }

    /** What an engine was given, chunk by chunk, and what a listener was told. */
    private static final class Run {
        final CrossSectionResult result;
        final List<double[]> chunks;
        final List<double[]> progress;

        Run(CrossSectionResult result, List<double[]> chunks, List<double[]> progress) {
            this.result = result;
            this.chunks = chunks;
            this.progress = progress;
        }
    }

    private static Run run(CrossSectionCalculator calc, CrossSectionRequest request, double lowCm1, double highCm1) {
        List<double[]> progress = new ArrayList<>();
        try (Recording engine = new Recording(new ExactEngine(1, request.wings()))) {
            CrossSectionResult r = calc.compute(request, engine, lowCm1, highCm1,
                    (lines, fraction) -> progress.add(new double[] {lines, fraction}));
            return new Run(r, engine.chunks, progress);
        }
    }

    /** Bit for bit: the engine's input, σ, every statistic, the tallies, the warnings, the metadata, the progress. */
    private static void assertSame(Run expected, Run actual, String what) {
        assertEquals(expected.chunks.size(), actual.chunks.size(), what + ": chunks");
        for (int c = 0; c < expected.chunks.size(); c++) {
            // Arrays.equals on double[] compares doubleToLongBits
            assertTrue(Arrays.equals(expected.chunks.get(c), actual.chunks.get(c)), what + ": chunk " + c);
        }
        CrossSectionResult a = expected.result;
        CrossSectionResult b = actual.result;
        assertTrue(Arrays.equals(a.sigmaCm2PerMolecule(), b.sigmaCm2PerMolecule()), what + ": sigma");
        assertEquals(a.linesUsed(), b.linesUsed(), what);
        assertEquals(a.linesBelowThreshold(), b.linesBelowThreshold(), what);
        assertEquals(Double.doubleToLongBits(a.droppedIntensityFraction()),
                Double.doubleToLongBits(b.droppedIntensityFraction()), what + ": dropped fraction");
        assertEquals(Double.doubleToLongBits(a.sumIntensityCmPerMolecule()),
                Double.doubleToLongBits(b.sumIntensityCmPerMolecule()), what + ": sum of S");
        assertEquals(Double.doubleToLongBits(a.wingLossFraction()), Double.doubleToLongBits(b.wingLossFraction()),
                what + ": wing loss");
        assertEquals(a.widthSources().report(), b.widthSources().report(), what + ": width sources");
        assertEquals(a.widthSources().warnings(), b.widthSources().warnings(), what + ": width-source warnings");
        for (BackgroundGas gas : BackgroundGas.values()) {
            for (WidthSource source : WidthSource.values()) {
                assertEquals(a.widthSources().exponents(gas, source), b.widthSources().exponents(gas, source),
                        what + ": exponents " + gas + " " + source);
            }
        }
        assertEquals(a.warnings(), b.warnings(), what + ": warnings");
        assertEquals(a.metadata(), b.metadata(), what + ": metadata");
        assertEquals(expected.progress.size(), actual.progress.size(), what + ": progress calls");
        for (int i = 0; i < expected.progress.size(); i++) {
            assertArrayEquals(expected.progress.get(i), actual.progress.get(i), what + ": progress " + i);
        }
    }

    @Test
    void threeRealStoresInSmallBatchesGiveTheSameBitsOnOneTwoAndThreeThreads() throws IOException {
        // CO2 as a foreign gas with its χ factor and the pedestal removed; H2O has no per-line widths in these
        // records (defaults, warned); a threshold drops part of the lines; the line range cuts batches
        WingTreatment wings = WingTreatment.defaults().withPedestalRemoval(true)
                .withChiFactor(ChiFactorKind.PERRIN_HARTMANN_CO2);
        WavenumberGrid grid = WavenumberGrid.uniform(150.0, 2450.0, 0.1);
        double threshold = 1e-28;
        double low = 200.0;
        double high = 2400.0;
        CrossSectionRequest request = new CrossSectionRequest(500.0, 0.3, Composition.parse("air=0.7,co2=0.2,h2o=0.1"),
                grid, wings, LineShapeKind.VOIGT, threshold, LineSelection.ALL, WidthOptions.DEFAULTS);
        List<LineStore> stores = samples();
        Run one = run(new CrossSectionCalculator(stores, REGISTRY, 1, SMALL_CHUNK), request,
                low, high);
        // lines read = records with low ≤ ν < high of the three files (the reach of the grid covers them all)
        long inRange = 0;
        for (Path sample : List.of(coSample, co2Sample, n2oSample)) {
            inRange += Arrays.stream(records(sample)).filter(r -> r[2] >= low && r[2] < high).count();
        }
        assertTrue(inRange > 10 * SMALL_CHUNK, "lines in range: " + inRange);
        assertEquals(inRange, one.result.linesUsed() + one.result.linesBelowThreshold());
        assertTrue(one.result.linesUsed() > 0 && one.result.linesBelowThreshold() > 0, "threshold splits the lines");
        assertTrue(one.chunks.size() > 10, "chunks: " + one.chunks.size());
        assertTrue(one.result.warnings().stream().anyMatch(w -> w.contains("h2o")), one.result.warnings().toString());
        for (int threads = 2; threads <= 3; threads++) {
            CrossSectionCalculator calc = new CrossSectionCalculator(stores, REGISTRY, threads,
                    SMALL_CHUNK);
            assertSame(one, run(calc, request, low, high), threads + " threads");
            // a second computation reuses the calculator's batch buffers
            assertSame(one, run(calc, request, low, high), threads + " threads, again");
        }
    }

    @Test
    void syntheticLinesInFullBatchesGiveTheSameBitsOnOneTwoAndThreeThreads() {
        // every line's reach (25 cm-1) covers this grid: all of them are read, in four full batches and one partial
        WavenumberGrid grid = WavenumberGrid.uniform(2010.0, 2030.0, 0.1);
        CrossSectionRequest request = new CrossSectionRequest(296.0, 1.0, Composition.air(), grid,
                WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        Run one = run(new CrossSectionCalculator(List.of(synthetic), REGISTRY, 1), request,
                Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        assertEquals(SYNTHETIC_LINES, one.result.linesUsed());
        // S(296 K) is the stored intensity: the sum is that of the generator's values (order aside: 1e-12)
        LineBatch block = SyntheticRecords.block(SYNTHETIC_BLOCK, 7);
        double sum = 0;
        for (int i = 0; i < SYNTHETIC_LINES; i++) {
            sum += block.intensityCmPerMolecule[i % SYNTHETIC_BLOCK];
        }
        assertEquals(sum, one.result.sumIntensityCmPerMolecule(), 1e-12 * sum);
        for (int threads = 2; threads <= 3; threads++) {
            assertSame(one, run(new CrossSectionCalculator(List.of(synthetic), REGISTRY, threads),
                    request, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY), threads + " threads");
        }
    }

    @Test
    void oneCalculatorServesRequestsOfDifferentIntensityScalingsAtOnce() throws Exception {
        // the scaling travels with the request: two threads computing with one calculator, each its own
        // scaling, get the bits a calculator of their own gives them
        WavenumberGrid grid = WavenumberGrid.uniform(2010.0, 2030.0, 0.1);
        CrossSectionRequest natural = new CrossSectionRequest(296.0, 1.0, Composition.air(), grid,
                WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        double registryAbundance = REGISTRY.naturalAbundance(5, 2);
        CrossSectionRequest doubled = natural.withIntensityScaling(new IntensityScaling(
                IntensityConvention.NATURAL_ABUNDANCE, Map.of("5/2", 2 * registryAbundance)));
        Run naturalAlone = run(new CrossSectionCalculator(List.of(synthetic), REGISTRY, 1), natural,
                Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        Run doubledAlone = run(new CrossSectionCalculator(List.of(synthetic), REGISTRY, 1), doubled,
                Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        CrossSectionCalculator shared = new CrossSectionCalculator(List.of(synthetic), REGISTRY, 2);
        java.util.concurrent.ExecutorService callers = java.util.concurrent.Executors.newFixedThreadPool(2);
        try {
            for (int round = 0; round < 3; round++) {
                var a = callers.submit(() -> run(shared, natural, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
                var b = callers.submit(() -> run(shared, doubled, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
                assertSame(naturalAlone, a.get(), "natural, round " + round);
                assertSame(doubledAlone, b.get(), "doubled 5/2, round " + round);
            }
        } finally {
            callers.shutdownNow();
        }
        // S is linear in the abundance (Simeckova et al. 2006, JQSRT 98, 130, eq. 20): doubling one isotopologue's
        // abundance adds its natural sigma once more
        Run iso2 = run(new CrossSectionCalculator(List.of(synthetic), REGISTRY, 1),
                natural.withSelection(LineSelection.isotopologue(5, 2)), Double.NEGATIVE_INFINITY,
                Double.POSITIVE_INFINITY);
        double[] n = naturalAlone.result.sigmaCm2PerMolecule();
        double[] d = doubledAlone.result.sigmaCm2PerMolecule();
        double[] i2 = iso2.result.sigmaCm2PerMolecule();
        double max = Arrays.stream(d).max().orElseThrow();
        assertTrue(Arrays.stream(i2).max().orElseThrow() > 1e-3 * max, "isotopologue 2 contributes");
        for (int i = 0; i < n.length; i++) {
            assertEquals(n[i] + i2[i], d[i], 1e-12 * max, "point " + i);
        }
    }

    @Test
    void aMissingPartitionSumIsReportedAtTheFirstLineInLineOrder() throws IOException {
        // the registry lacks Q of 13C16O2 (CO2 isotopologue 2): every CO2 batch with such a line fails, from the
        // seventh on; the first such line in wavenumber order (from the records) must be the one named, whatever
        // the thread count, while the CO and N2O stores are merged in between
        IsotopologueLookup withoutCo2Iso2 = new IsotopologueLookup() {
            @Override
            public Id byIsotopeFormula(String isotopeFormula) {
                return REGISTRY.byIsotopeFormula(isotopeFormula);
            }

            @Override
            public Id byCatalogTag(int speciesTag) {
                return REGISTRY.byCatalogTag(speciesTag);
            }

            @Override
            public boolean isKnown(int moleculeId, int isotopologue) {
                return REGISTRY.isKnown(moleculeId, isotopologue);
            }

            @Override
            public double massGPerMol(int moleculeId, int isotopologue) {
                return REGISTRY.massGPerMol(moleculeId, isotopologue);
            }

            @Override
            public double naturalAbundance(int moleculeId, int isotopologue) {
                return REGISTRY.naturalAbundance(moleculeId, isotopologue);
            }

            @Override
            public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
                return moleculeId == 2 && isotopologue == 2 ? Double.NaN
                        : REGISTRY.partitionSum(moleculeId, isotopologue, temperatureK);
            }
        };
        List<LineStore> stores = samples();
        double[][] co2 = records(co2Sample);
        int first = -1;
        for (int i = 0; i < co2.length; i++) {
            if (co2[i][0] == 2 && co2[i][1] == 2 && (first < 0 || co2[i][2] < co2[first][2])) {
                first = i;
            }
        }
        long before = 0;
        for (double[] r : co2) {
            before += r[2] < co2[first][2] ? 1 : 0;
        }
        assertTrue(before > 4 * SMALL_CHUNK, "the first failing line lies beyond the first batches: " + before);
        String expected = "molecule 2 isotopologue 2 at 296.0 K (line " + (first + 1) + ";";
        double low = Double.NEGATIVE_INFINITY;
        WavenumberGrid grid = WavenumberGrid.uniform(1.0, 2500.0, 0.5);
        CrossSectionRequest request = new CrossSectionRequest(1000.0, 1.0, Composition.air(), grid,
                WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        for (int threads = 1; threads <= 3; threads++) {
            CrossSectionCalculator calc = new CrossSectionCalculator(stores, withoutCo2Iso2, threads, SMALL_CHUNK);
            InputException e = assertThrows(InputException.class,
                    () -> run(calc, request, low, Double.POSITIVE_INFINITY));
            assertTrue(e.getMessage().contains(expected), threads + " threads: " + e.getMessage());
        }
    }

    @Test
    void aLineWithoutAWidthIsReportedAtTheFirstSuchLineInLineOrder() {
        // only the line list may give widths: the generator's lines of air width 0 have none; the first of them
        // (from the generator's block) must be named, whatever the thread count
        LineBatch block = SyntheticRecords.block(SYNTHETIC_BLOCK, 7);
        int first = 0;
        while (block.airWidthCm1PerAtm[first] != 0.0) {
            first++;
        }
        assertTrue(first > 4 * 100, "the first line without a width lies beyond the first batches: " + first);
        String expected = ", line " + (first + 1) + " at " + syntheticCentreCm1(first) + " cm-1: no air width";
        WavenumberGrid grid = WavenumberGrid.uniform(2000.0, 2040.0, 0.05);
        CrossSectionRequest request = new CrossSectionRequest(296.0, 1.0, Composition.air(), grid,
                WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL,
                WidthOptions.DEFAULTS.withOrder(List.of(WidthSource.LINE_LIST)));
        for (int threads = 1; threads <= 3; threads++) {
            CrossSectionCalculator calc = new CrossSectionCalculator(List.of(synthetic), REGISTRY,
                    threads, 100);
            InputException e = assertThrows(InputException.class,
                    () -> run(calc, request, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
            assertTrue(e.getMessage().contains(expected), threads + " threads: " + e.getMessage());
        }
    }

    /** Passes chunks to a real engine and keeps a copy of each (centres, S, widths, χ flags as 0/1). */
    private static final class Recording implements CrossSectionEngine {
        final CrossSectionEngine engine;
        final List<double[]> chunks = new ArrayList<>();

        Recording(CrossSectionEngine engine) {
            this.engine = engine;
        }

        @Override
        public void begin(WavenumberGrid grid, double pressureAtm, double temperatureK) {
            engine.begin(grid, pressureAtm, temperatureK);
        }

        @Override
        public void accumulate(LineChunk chunk, double[] sigmaCm2PerMolecule) {
            int n = chunk.size;
            double[] copy = new double[5 * n];
            System.arraycopy(chunk.centerCm1, 0, copy, 0, n);
            System.arraycopy(chunk.intensityCmPerMolecule, 0, copy, n, n);
            System.arraycopy(chunk.dopplerHwhmCm1, 0, copy, 2 * n, n);
            System.arraycopy(chunk.lorentzHwhmCm1, 0, copy, 3 * n, n);
            for (int i = 0; i < n; i++) {
                copy[4 * n + i] = chunk.chiFactor[i] ? 1 : 0;
            }
            chunks.add(copy);
            engine.accumulate(chunk, sigmaCm2PerMolecule);
        }

        @Override
        public void finish(double[] sigmaCm2PerMolecule) {
            engine.finish(sigmaCm2PerMolecule);
        }

        @Override
        public String id() {
            return engine.id();
        }

        @Override
        public Map<String, String> describe() {
            return engine.describe();
        }

        @Override
        public double estimatedRelativeError() {
            return engine.estimatedRelativeError();
        }

        @Override
        public void close() {
            engine.close();
        }
    }
}
