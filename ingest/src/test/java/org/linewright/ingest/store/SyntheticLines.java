package org.linewright.ingest.store;

import java.util.Random;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;

/** Synthetic (invented) lines for store tests: every column filled from a seeded generator. */
final class SyntheticLines {
    private SyntheticLines() {
    }

    /**
     * Fills one row; each column's value is a function of {@code id} so a test can recompute it, and the
     * wavenumber is given. Text values: empty, long and non-ASCII texts appear.
     */
    static void fillRow(LineBatch b, int row, long id, double wavenumberCm1, int molecule, int iso) {
        Random r = new Random(id);
        b.moleculeId[row] = molecule;
        b.isotopologue[row] = iso;
        b.wavenumberCm1[row] = wavenumberCm1;
        b.intensityCmPerMolecule[row] = r.nextDouble() * 1e-20;
        b.einsteinAS1[row] = id % 7 == 0 ? Double.NaN : r.nextDouble();
        b.airWidthCm1PerAtm[row] = r.nextDouble() * 0.1;
        b.selfWidthCm1PerAtm[row] = r.nextDouble() * 0.1;
        b.airWidthExponent[row] = r.nextDouble();
        b.airShiftCm1PerAtm[row] = -r.nextDouble() * 0.01;
        b.lowerEnergyCm1[row] = r.nextDouble() * 5000;
        b.upperDegeneracy[row] = r.nextInt(100);
        b.lowerDegeneracy[row] = r.nextInt(100);
        b.clearOptional(row);
        for (Broadener br : Broadener.values()) {
            if ((id + br.ordinal()) % 3 != 0) {
                b.foreignWidthCm1PerAtm[br.ordinal()][row] = r.nextDouble();
                b.foreignWidthExponent[br.ordinal()][row] = r.nextDouble();
                b.foreignShiftCm1PerAtm[br.ordinal()][row] = r.nextDouble();
            }
        }
        b.upperEnergyCm1[row] = id % 2 == 0 ? Double.NaN : r.nextDouble() * 9000;
        b.upperJ[row] = r.nextInt(80);
        b.lowerJ[row] = r.nextInt(80);
        b.sourceLine[row] = id;
        b.upperGlobalQuanta.append(id % 5 == 0 ? "" : "v=" + (id % 11));
        b.lowerGlobalQuanta.append(id % 13 == 0 ? "x".repeat(300) : "g" + id);
        b.upperLocalQuanta.append(id % 17 == 0 ? "ÅΔJ≥" + id : "P" + (id % 40));
        b.lowerLocalQuanta.append("");
        b.uncertaintyCodes.append(Long.toString(100000 + id % 900000));
        b.referenceCodes.append(String.format("%012d", id));
        b.lineMixingFlag.append(id % 2 == 0 ? " " : "");
    }
}
