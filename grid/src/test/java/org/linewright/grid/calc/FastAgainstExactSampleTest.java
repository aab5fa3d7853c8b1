package org.linewright.grid.calc;


import java.io.IOException;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * The fast engine against the exact one on real lines — the HITRAN2020 CO and CO2 samples
 * ({@code ../shared/reference-data/hitran2020-samples/}) — with the same wing treatment (pedestal removed, so
 * neither engine has a step at the cutoff): relative difference within the requested tolerance wherever
 * σ ≥ 10⁻⁶·max σ, and within the fast engine's own error estimate.
 */
class FastAgainstExactSampleTest {
    private static final double TOLERANCE = 1e-3;

    @TempDir
    static Path tmp;
    static LineStore store;

    @BeforeAll
    static void ingest() throws IOException {
        store = LineStore.open(ReferenceSamples.ingest(tmp.resolve("store"), ReferenceSamples.hitranSample("sample_CO.par"),
                ReferenceSamples.hitranSample("sample_CO2.par")));
    }

    @ParameterizedTest(name = "p = {0} atm, T = {1} K, background {2}")
    @CsvSource({"1.0, 296, air=1", "0.01, 600, H2=0.85;He=0.15", "10.0, 1000, CO2=1"})
    void fastMatchesExactWithinTolerance(double pressureAtm, double temperatureK, String background) {
        // the regime matrix's check: every point within the tolerance and the estimate, absolute error bounded
        FastEngineRegimeMatrixTest.check(store, "CO+CO2 samples", "u:2000:2400:0.01", pressureAtm * 1.01325,
                temperatureK, background, "fixed:25", "remove", "plain", TOLERANCE);
    }
}
