package org.linewright.ingest.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class WavenumberOrderTest {

    /**
     * The radix order must equal a stable comparison sort: java.util.List.sort is documented as stable (its
     * Javadoc: "equal elements will not be reordered"), with Double.compare's order except that -0.0 and 0.0 tie,
     * as the store's "ascending, stable" rule (w >= previous) has them. Keys with heavy ties, negative values,
     * both zeros, infinities, and subnormal numbers.
     */
    @Test
    void equalsAStableComparisonSortOnTiesSignsZerosAndExtremes() {
        Random random = new Random(7);
        double[] special = {0.0, -0.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MAX_VALUE, -Double.MAX_VALUE,
                Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 1e-310, 2000.0, 2000.0000000000002};
        for (int n : new int[] {0, 1, 2, 17, 1000, 50_000}) {
            double[] keys = new double[n];
            for (int i = 0; i < n; i++) {
                int pick = random.nextInt(4);
                keys[i] = pick == 0 ? special[random.nextInt(special.length)]
                        : pick == 1 ? Math.rint(random.nextDouble() * 20) - 5
                        : random.nextDouble() * 1e5 - 10;
            }
            List<Integer> expected = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                expected.add(i);
            }
            expected.sort((a, b) -> keys[a] == keys[b] ? 0 : Double.compare(keys[a], keys[b]));
            int[] want = expected.stream().mapToInt(Integer::intValue).toArray();
            int[] got = java.util.Arrays.copyOf(new WavenumberOrder(Math.max(1, n)).permutation(keys, n), n);
            assertArrayEquals(want, got, "n=" + n);
        }
    }

    @Test
    void sortedInputKeepsItsOrder() {
        double[] keys = {1, 1, 2, 3, 3, 3, 10};
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6},
                java.util.Arrays.copyOf(new WavenumberOrder(keys.length).permutation(keys, keys.length), keys.length));
    }
}
