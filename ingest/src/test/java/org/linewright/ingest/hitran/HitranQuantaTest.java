package org.linewright.ingest.hitran;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/**
 * Local-quanta layouts of the 2004 format (common practice; Rothman et al., JQSRT 96 (2005) 139, from
 * memory): asymmetric tops I3 J, I3 Ka, I3 Kc; symmetric tops I3 J, I3 K; linear molecules branch letter in
 * column 6 and J″ in columns 7–9 of the lower local quanta. The quanta strings below are synthetic.
 */
class HitranQuantaTest {

    private static double[] read(int molecule, String upper, String lower) {
        byte[] rec = (upper + lower).getBytes(StandardCharsets.US_ASCII);
        assertEquals(30, rec.length);
        double[] out = new double[3];
        HitranQuanta.read(molecule, rec, 0, 15, out);
        return out;
    }

    @Test
    void asymmetricTopGivesJAndKa() {
        // H2O (1): J'=5 Ka'=2 Kc'=3, J''=4 Ka''=1 Kc''=4
        assertArrayEquals(new double[] {5, 4, 2}, read(1, "  5  2  3      ", "  4  1  4      "));
    }

    @Test
    void symmetricTopGivesJAndK() {
        // NH3 (11): J'=3 K'=3, J''=3 K''=3
        assertArrayEquals(new double[] {3, 3, 3}, read(11, "  3  3 0A-     ", "  3  3 0A+     "));
    }

    @Test
    void linearBranchesGiveUpperJ() {
        assertArrayEquals(new double[] {9, 10, Double.NaN}, read(5, "               ", "     P 10      "));
        assertArrayEquals(new double[] {11, 10, Double.NaN}, read(2, "               ", "     R 10e     "));
        assertArrayEquals(new double[] {10, 10, Double.NaN}, read(4, "               ", "     Q 10f     "));
        assertArrayEquals(new double[] {8, 10, Double.NaN}, read(22, "               ", "     O 10      "));
        // P(0) does not exist: J' unreadable, J'' kept
        assertArrayEquals(new double[] {Double.NaN, 0, Double.NaN}, read(5, "               ", "     P  0      "));
    }

    @Test
    void unreadableQuantaGiveNaN() {
        double[] nan = {Double.NaN, Double.NaN, Double.NaN};
        assertArrayEquals(nan, read(5, "               ", "     R  x      "));
        assertArrayEquals(nan, read(1, "               ", "               "));
        assertArrayEquals(nan, read(7, "  5  2  3      ", "  4  1  4      "), "O2 (7) has no class here");
        assertArrayEquals(nan, read(0, "  5  2  3      ", "  4  1  4      "));
    }
}
