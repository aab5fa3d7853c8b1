package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.testsupport.ChildJvm;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * The fast engine in a small heap: the same computation run in a child JVM limited to {@value #CHILD_HEAP} and in
 * this test's own JVM must give the same σ bit for bit (SHA-256 of the values), since nothing in the method may
 * depend on the heap. The lines (synthetic, invented here: uniform positions, log-uniform intensities, widths of
 * a mid-infrared band at 1 bar and 296 K) need more than the child's heap when every line's distribution weights
 * are held at once, so the test fails if they are again.
 */
class FastEngineSmallHeapTest {
    static final String CHILD_HEAP = "-Xmx64m";
    static final int LINES = 500_000;

    @Test
    void sameSigmaInASmallHeap() throws Exception {
        String own = digest(LINES, 2);
        System.out.println("own sha256 " + own);
        String out = ChildJvm.run(FastEngineSmallHeapTest.class, List.of(CHILD_HEAP), Integer.toString(LINES), "2");
        String child = null;
        for (String line : out.split("\n")) {
            if (line.startsWith("sha256 ")) {
                child = line.substring(7).trim();
            }
        }
        assertTrue(child != null, out);
        assertEquals(own, child, "sigma in a " + CHILD_HEAP + " heap");
    }

    /** Runs {@link #digest} and prints it; the last argument is the work folder (unused). */
    public static void main(String[] args) throws Exception {
        System.out.println("sha256 " + digest(Integer.parseInt(args[0]), Integer.parseInt(args[1])));
    }

    /** SHA-256 of σ (big-endian doubles) over the synthetic lines. */
    static String digest(int lines, int threads) throws Exception {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(1.0));
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1400, 0.002);
        double[] sigma = new double[grid.size()];
        SplittableRandom random = new SplittableRandom(20261202L);
        try (FastEngine engine = new FastEngine(threads, wings, FastEngine.DEFAULT_TOLERANCE)) {
            engine.begin(grid, 1.0, 296.0);
            LineChunk chunk = new LineChunk(1 << 14);
            for (int i = 0; i < lines; i++) {
                int k = chunk.size++;
                chunk.centerCm1[k] = 999.5 + 401 * random.nextDouble();
                chunk.intensityCmPerMolecule[k] = 1e-20 * Math.pow(10, -6 * random.nextDouble());
                chunk.dopplerHwhmCm1[k] = 1.0e-3 * (1 + 0.2 * random.nextDouble());
                chunk.lorentzHwhmCm1[k] = 0.07 * (0.5 + random.nextDouble());
                chunk.chiFactor[k] = false;
                if (chunk.size == chunk.capacity()) {
                    engine.accumulate(chunk, sigma);
                    chunk.size = 0;
                }
            }
            if (chunk.size > 0) {
                engine.accumulate(chunk, sigma);
            }
            engine.finish(sigma);
            System.out.println("plan " + engine.describe());
        }
        ByteBuffer bytes = ByteBuffer.allocate(sigma.length * Double.BYTES);
        bytes.asDoubleBuffer().put(sigma);
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes.array()));
    }
}
