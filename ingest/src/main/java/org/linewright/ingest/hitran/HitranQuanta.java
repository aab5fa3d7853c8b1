package org.linewright.ingest.hitran;

/**
 * Reads the rotational quantum numbers J', J'' and K' from the local-quanta fields of a 160-character
 * record, by molecule class, following the common practice of the 2004 layout (Rothman et al., JQSRT 96
 * (2005) 139, table of local quanta formats):
 * <ul>
 *   <li>linear molecules (CO2, N2O, CO, HF, HCl, HBr, HI, OCS, N2, HCN, C2H2, CS, ...): the lower local
 *       quanta hold the branch letter in column 6 and J'' in columns 7–9; J' follows from the branch
 *       (O: J''−2, P: J''−1, Q: J'', R: J''+1, S: J''+2); there is no K.</li>
 *   <li>asymmetric tops (H2O, O3, SO2, H2CO, HOCl, H2O2, H2S, HCOOH, HOBr): J, Ka, Kc in columns 1–3, 4–6,
 *       7–9 of both local quanta; K' is Ka'.</li>
 *   <li>symmetric tops (NH3, CH3Cl, PH3, CH3Br, CH3I): J and K in columns 1–3 and 4–6 of both local quanta;
 *       K' is K'.</li>
 * </ul>
 * Anything unreadable (other molecules, blank or non-numeric fields) gives NaN; it is never an error.
 */
public final class HitranQuanta {
    /** Molecule classes of the local quanta. */
    public enum MoleculeClass { LINEAR, ASYMMETRIC_TOP, SYMMETRIC_TOP, OTHER }

    private static final MoleculeClass[] CLASS_BY_MOLECULE = new MoleculeClass[100];

    static {
        java.util.Arrays.fill(CLASS_BY_MOLECULE, MoleculeClass.OTHER);
        // HITRAN molecule numbers (common practice): 2 CO2, 4 N2O, 5 CO, 14 HF, 15 HCl, 16 HBr, 17 HI,
        // 19 OCS, 22 N2, 23 HCN, 26 C2H2, 36 NO+, 46 CS
        for (int m : new int[] {2, 4, 5, 14, 15, 16, 17, 19, 22, 23, 26, 36, 46}) {
            CLASS_BY_MOLECULE[m] = MoleculeClass.LINEAR;
        }
        // 1 H2O, 3 O3, 9 SO2, 20 H2CO, 21 HOCl, 25 H2O2, 31 H2S, 32 HCOOH, 37 HOBr
        for (int m : new int[] {1, 3, 9, 20, 21, 25, 31, 32, 37}) {
            CLASS_BY_MOLECULE[m] = MoleculeClass.ASYMMETRIC_TOP;
        }
        // 11 NH3, 24 CH3Cl, 28 PH3, 40 CH3Br
        for (int m : new int[] {11, 24, 28, 40}) {
            CLASS_BY_MOLECULE[m] = MoleculeClass.SYMMETRIC_TOP;
        }
    }

    /** Width of a local-quanta field. */
    public static final int FIELD_WIDTH = 15;

    private HitranQuanta() {
    }

    /** The class of molecule {@code moleculeId}'s local quanta. */
    public static MoleculeClass classOf(int moleculeId) {
        return moleculeId > 0 && moleculeId < CLASS_BY_MOLECULE.length ? CLASS_BY_MOLECULE[moleculeId] : MoleculeClass.OTHER;
    }

    /**
     * Reads J', J'' and K' into {@code out[0..2]} (NaN where unreadable) from the upper local quanta at
     * {@code rec[upperAt, upperAt+15)} and the lower local quanta at {@code rec[lowerAt, lowerAt+15)}.
     */
    public static void read(int moleculeId, byte[] rec, int upperAt, int lowerAt, double[] out) {
        out[0] = Double.NaN;
        out[1] = Double.NaN;
        out[2] = Double.NaN;
        switch (classOf(moleculeId)) {
            case LINEAR: {
                int jLower = integer(rec, lowerAt + 6, lowerAt + 9);
                if (jLower < 0) {
                    return;
                }
                int delta;
                switch (rec[lowerAt + 5]) {
                    case 'O': delta = -2; break;
                    case 'P': delta = -1; break;
                    case 'Q': delta = 0; break;
                    case 'R': delta = 1; break;
                    case 'S': delta = 2; break;
                    default: delta = Integer.MIN_VALUE;
                }
                out[1] = jLower;
                if (delta != Integer.MIN_VALUE && jLower + delta >= 0) {
                    out[0] = jLower + delta;
                }
                return;
            }
            case ASYMMETRIC_TOP:
            case SYMMETRIC_TOP: {
                int jUpper = integer(rec, upperAt, upperAt + 3);
                int kUpper = integer(rec, upperAt + 3, upperAt + 6);
                int jLower = integer(rec, lowerAt, lowerAt + 3);
                if (jUpper >= 0) {
                    out[0] = jUpper;
                }
                if (jLower >= 0) {
                    out[1] = jLower;
                }
                if (kUpper >= 0 && jUpper >= 0) {
                    out[2] = kUpper;
                }
                return;
            }
            default:
        }
    }

    /** A right-justified non-negative integer in {@code rec[from, to)}; -1 when blank or not digits. */
    private static int integer(byte[] rec, int from, int to) {
        int i = from;
        while (i < to && rec[i] == ' ') {
            i++;
        }
        if (i == to) {
            return -1;
        }
        int value = 0;
        for (; i < to; i++) {
            byte c = rec[i];
            if (c < '0' || c > '9') {
                return -1;
            }
            value = value * 10 + (c - '0');
        }
        return value;
    }
}
