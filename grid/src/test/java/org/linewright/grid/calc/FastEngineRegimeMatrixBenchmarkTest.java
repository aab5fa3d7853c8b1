package org.linewright.grid.calc;

import java.io.IOException;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.JitteredSamples;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * The larger regime matrix of the fast engine (benchmark profile: {@code ./mvnw -B -Pbenchmark -pl grid -am verify
 * -Dtest=FastEngineRegimeMatrixBenchmarkTest -Dsurefire.failIfNoSpecifiedTests=false}): the checks of {@link
 * FastEngineRegimeMatrixTest} — fast against exact at every grid point, within the tolerance, within the estimate —
 * on 50,000-line lists made from the real CO, CO2, N2O and PH3 samples and more regimes (wider grids, more
 * temperatures, pressures and backgrounds).
 */
@Tag("benchmark")
class FastEngineRegimeMatrixBenchmarkTest {
    @TempDir
    static Path tmp;
    static LineStore co;
    static LineStore infrared;

    @BeforeAll
    static void stores() throws IOException {
        co = LineStore.open(ReferenceSamples.ingest(tmp.resolve("co"), JitteredSamples.write(
                ReferenceSamples.hitranSample("sample_CO.par"), tmp.resolve("co.par"), 50_000, 1900, 4400, 0.3, 11)));
        Path n2o = JitteredSamples.write(ReferenceSamples.hitranSample("sample_N2O.par"), tmp.resolve("n2o.par"),
                25_000, 400, 1000, 0.3, 12);
        Path ph3 = JitteredSamples.write(ReferenceSamples.hitranSample("sample_PH3.par"), tmp.resolve("ph3.par"),
                25_000, 400, 1000, 0.3, 13);
        infrared = LineStore.open(ReferenceSamples.ingest(tmp.resolve("ir"), n2o, ph3));
    }

    @ParameterizedTest(name = "{0}: {1}, {2} bar, {3} K, {4}, cutoff {5}, pedestal {6}, {7}, tolerance {8}")
    @CsvSource({
            "CO, u:1950:2300:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1.01325, 296, air=1, fixed:5, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1.01325, 296, air=1, fixed:1, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 10.1325, 700, H2=0.85;He=0.15, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 0.101325, 296, air=1, hwhm:200:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1e-4, 1500, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1e-6, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1.01325, 50, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1.01325, 4000, air=1, fixed:25, remove, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1000, 296, N2=1, peratm:1:1000, keep, plain, 1e-3",
            "CO, u:4000:4400:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.02, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, r:1950:2300:1e5, 1.01325, 1000, air=1, fixed:25, keep, plain, 1e-3",
            "CO, r:2050:2150:1e6, 1e-3, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:1950:2300:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-5",
            "CO, u:1950:2300:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-2",
            "IR, u:500:900:0.002, 1.01325, 296, air=1, fixed:5, keep, plain, 1e-3",
            "IR, u:500:900:0.002, 1.01325, 296, air=1, fixed:25, remove, plain, 1e-3",
            "IR, u:500:900:0.002, 101.325, 740, CO2=1, peratm:1:100, keep, plain, 1e-3",
            "IR, r:400:1000:1e5, 1.01325, 1000, H2=0.85;He=0.15, fixed:25, keep, plain, 1e-3",
            "IR, u:500:900:0.01, 10.1325, 500, H2=0.85;He=0.15, none, keep, plain, 1e-3",
    })
    void withinToleranceAndEstimateAtEveryPoint(String store, String gridSpec, double pressureBar, double temperatureK,
                                               String background, String cutoff, String pedestal, String chi,
                                               double tolerance) {
        FastEngineRegimeMatrixTest.check(store.equals("CO") ? co : infrared, store, gridSpec, pressureBar,
                temperatureK, background, cutoff, pedestal, chi, tolerance);
    }
}
