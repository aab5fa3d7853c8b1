package org.linewright.ingest.testsupport;

import java.util.Locale;
import java.util.Random;
import org.linewright.ingest.line.LineBatch;

/**
 * Synthetic, invented lines for benchmarks (never for checks of physics): a block of varied CO-like lines
 * (molecule 5, isotopologues 1–6; S(296 K) 10⁻³⁰–10⁻²⁰ cm/molecule, A 10⁻³–1 s⁻¹, air width 0–0.1 cm⁻¹/atm, self
 * width 0–1 cm⁻¹/atm, E″ 0–10,000 cm⁻¹, n 0–0.99, shift 0 to −0.01 cm⁻¹/atm, P/R branches with J″ 1–60). Every value
 * is rounded to what a 160-character record holds, so a block written as records and read back is the same block.
 * Wavenumbers are left at zero: each benchmark lays out its own positions. Deterministic for a given seed.
 */
public final class SyntheticRecords {
    private SyntheticRecords() {
    }

    /** A block of {@code size} lines, {@code batch.size} set. */
    public static LineBatch block(int size, long seed) {
        Random random = new Random(seed);
        LineBatch b = new LineBatch(size);
        for (int i = 0; i < size; i++) {
            b.clearOptional(i);
            b.moleculeId[i] = 5;
            b.isotopologue[i] = 1 + random.nextInt(6);
            b.intensityCmPerMolecule[i] = Double.parseDouble(String.format(Locale.ROOT, "%.3E",
                    Math.pow(10, -20 - 10 * random.nextDouble())));
            b.einsteinAS1[i] = Double.parseDouble(String.format(Locale.ROOT, "%.3E",
                    Math.pow(10, -3 + 3 * random.nextDouble())));
            b.airWidthCm1PerAtm[i] = random.nextInt(1000) / 1e4;
            b.selfWidthCm1PerAtm[i] = random.nextInt(1000) / 1e3;
            b.lowerEnergyCm1[i] = random.nextInt(100_000_000) / 1e4;
            b.airWidthExponent[i] = random.nextInt(100) / 1e2;
            b.airShiftCm1PerAtm[i] = -random.nextInt(10_000) / 1e6;
            b.upperDegeneracy[i] = 2 * random.nextInt(100) + 1;
            b.lowerDegeneracy[i] = 2 * random.nextInt(100) + 1;
            boolean rBranch = random.nextBoolean();
            int j = 1 + random.nextInt(60);
            b.lowerJ[i] = j;
            b.upperJ[i] = rBranch ? j + 1 : j - 1;
            b.sourceLine[i] = i + 1;
            b.upperGlobalQuanta.append("              1");
            b.lowerGlobalQuanta.append("              0");
            b.upperLocalQuanta.append("               ");
            b.lowerLocalQuanta.append(String.format(Locale.ROOT, "     %s%3d      ", rBranch ? "R" : "P", j));
            b.uncertaintyCodes.append("475663");
            b.referenceCodes.append(" 5 8 5 5 1 8");
            b.lineMixingFlag.append(" ");
        }
        b.size = size;
        return b;
    }
}
