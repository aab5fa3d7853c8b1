package org.linewright.broadening.bench;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.LineIntensity;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.ingest.testsupport.SampleIsotopologues;
import org.linewright.broadening.width.DopplerWidth;
import org.linewright.broadening.width.PressureBroadening;
import org.linewright.ingest.line.LineBatch;

/**
 * Single-thread throughput of the per-line physics on synthetic CO lines (invented values), in batches of
 * 65 536 rows: S(T), Doppler HWHM, the width source chain for H2/He (Tan et al. rules) and γ_L(p, T).
 * Run with {@code ./mvnw -B -Pbenchmark -pl broadening -am verify}; figures go to docs/performance.md.
 */
@Tag("benchmark")
class BroadeningThroughputBenchmarkTest {
    private static final int BATCH = 65_536;
    private static final int BATCHES = 64; // 4.2 million lines per pass

    @Test
    void throughput() {
        LineBatch b = new LineBatch(BATCH);
        Random rnd = new Random(42);
        b.size = BATCH;
        for (int i = 0; i < BATCH; i++) {
            b.clearOptional(i);
            b.moleculeId[i] = 5;
            b.isotopologue[i] = 1 + rnd.nextInt(6); // interleaved, as in a list sorted by wavenumber
            b.wavenumberCm1[i] = 2000 + 400 * rnd.nextDouble();
            b.intensityCmPerMolecule[i] = Math.pow(10, -19 - 10 * rnd.nextDouble());
            b.lowerEnergyCm1[i] = 5000 * rnd.nextDouble();
            double j = Math.floor(80 * rnd.nextDouble());
            b.lowerJ[i] = j;
            b.upperJ[i] = rnd.nextBoolean() ? j + 1 : Math.max(0, j - 1);
            b.airWidthCm1PerAtm[i] = 0.06;
            b.airWidthExponent[i] = 0.7;
        }
        IsotopologueCache isotopologues = new IsotopologueCache(SampleIsotopologues.withLinearRotorQ(), 1000.0);
        WidthResolver resolver = WidthResolver.builder(Composition.parse("H2=0.85,He=0.15")).build();
        ResolvedWidths w = resolver.newResult(BATCH);
        double[] out = new double[BATCH];
        double sink = 0;
        for (int pass = 0; pass < 3; pass++) { // pass 0 warms up the JIT
            long t0 = System.nanoTime();
            for (int k = 0; k < BATCHES; k++) {
                LineIntensity.atTemperature(b, isotopologues, out);
                sink += out[k];
            }
            long t1 = System.nanoTime();
            for (int k = 0; k < BATCHES; k++) {
                DopplerWidth.hwhmCm1(b, isotopologues, out);
                sink += out[k];
            }
            long t2 = System.nanoTime();
            for (int k = 0; k < BATCHES; k++) {
                resolver.resolve(b, w);
                sink += w.backgroundWidthCm1PerAtm[k];
            }
            long t3 = System.nanoTime();
            for (int k = 0; k < BATCHES; k++) {
                PressureBroadening.lorentzHwhmCm1(w, 1.0, 1000.0, out);
                sink += out[k];
            }
            long t4 = System.nanoTime();
            double lines = (double) BATCH * BATCHES;
            System.out.printf("pass %d: S(T) %.1f Mlines/s, Doppler %.1f Mlines/s, width chain (H2+He rules) "
                            + "%.1f Mlines/s, Lorentz (2 gases) %.1f Mlines/s%n", pass,
                    lines / (t1 - t0) * 1e3, lines / (t2 - t1) * 1e3, lines / (t3 - t2) * 1e3,
                    lines / (t4 - t3) * 1e3);
        }
        assertTrue(sink > 0);
    }
}
