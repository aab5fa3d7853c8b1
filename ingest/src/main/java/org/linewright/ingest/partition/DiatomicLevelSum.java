package org.linewright.ingest.partition;

import java.util.Arrays;
import org.linewright.ingest.registry.AtomicMasses;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Q(T) of one diatomic isotopologue by direct summation over its bound rovibrational levels:
 * <pre>
 * Q(T) = Σ_levels g · exp(−c2·(E − E_lowest)/T)
 * E(v, J) = T_e + Σ_kl Y_kl(iso) (v + ½)^k [J(J+1)]^l,   Y_kl(iso) = Y_kl(ref) · ρ^(k+2l),  ρ = √(μ_ref/μ_iso)
 * </pre>
 * (Dunham expansion and its isotopic mass scaling, J.L. Dunham, Phys. Rev. 41 (1932) 721; Born–Oppenheimer
 * breakdown terms neglected, ~10⁻⁴ relative on the constants). Levels: v while G(v) increases and stays below the
 * dissociation energy D0, and for each v, J while E(v, J) increases with J and stays below D0 (no quasi-bound
 * levels). ²Π states use the Hill–Van Vleck energies F±(J) = B_v[(J+½)² − 1 ± ½√(4(J+½)² + Y(Y−4))] with
 * Y = A/B_v (E.L. Hill and J.H. Van Vleck, Phys. Rev. 32 (1928) 250), centrifugal terms in [(J+½)² − 1]^l, both
 * Λ components counted. The weight g is (2J+1) times the nuclear-spin degeneracy (Π(2I+1) for heteronuclear
 * molecules; for homonuclear ones (2I+1)(I+1) or (2I+1)I by the exchange symmetry of the level, Bose or Fermi
 * statistics; e.g. G. Herzberg, <i>Spectra of Diatomic Molecules</i>, 1950, ch. III) — the convention of the
 * tabulated Q(296 K), which counts every nuclear-spin state. Energies are referred to the lowest level, as the
 * lower-state energies of the line lists are.
 *
 * <p>Accuracy: that of the constants (Huber & Herzberg 1979 and Guelachvili et al. 1983, from memory) and of the
 * Dunham series at high v and J; for ¹²C¹⁶O and ¹³C¹⁶O it agrees with an independent numpy summation from the
 * same constants to 10⁻⁶ and with the tabulated Q(296 K) to 10⁻⁴ (see the tests). The spin multiplet of O2 is
 * put at its centroid (≤ 0.3 % at 50 K, decreasing as 1/T).
 *
 * <p>The levels are computed once per isotopologue ({@link #of}); {@link #partitionSum} is then one pass over
 * primitive arrays. Immutable and thread-safe.
 */
final class DiatomicLevelSum {
    private static final double C2_CM_K = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;

    private final double[] energyCm1;
    private final double[] weight;

    private DiatomicLevelSum(double[] energyCm1, double[] weight) {
        this.energyCm1 = energyCm1;
        this.weight = weight;
    }

    /** Number of levels summed. */
    int levelCount() {
        return energyCm1.length;
    }

    /** Q(T) = Σ g·exp(−c2·E/T) over the levels (E from the lowest level). */
    double partitionSum(double temperatureK) {
        double beta = C2_CM_K / temperatureK;
        double sum = 0;
        for (int i = 0; i < energyCm1.length; i++) {
            sum += weight[i] * Math.exp(-beta * energyCm1[i]);
        }
        return sum;
    }

    /**
     * The levels of the isotopologue made of {@code nuclideA} and {@code nuclideB} (in either order).
     *
     * @throws IllegalArgumentException when a nuclide's mass or spin is not tabulated
     */
    static DiatomicLevelSum of(DiatomicConstants c, String nuclideA, String nuclideB) {
        double rho = Math.sqrt(reducedMass(c.nuclide1(), c.nuclide2()) / reducedMass(nuclideA, nuclideB));
        int tA = NuclearSpins.twiceSpin(nuclideA);
        int tB = NuclearSpins.twiceSpin(nuclideB);
        if (tA < 0 || tB < 0) {
            throw new IllegalArgumentException("no nuclear spin tabulated for " + (tA < 0 ? nuclideA : nuclideB));
        }
        boolean homonuclear = nuclideA.equals(nuclideB);
        int gSym;
        int gAnti;
        if (homonuclear) {
            // (t+1)(t+2)/2 and (t+1)t/2 with t = 2I: integers for every t (one factor is even).
            int more = (tA + 1) * (tA + 2) / 2;
            int fewer = (tA + 1) * tA / 2;
            boolean boson = tA % 2 == 0;
            gSym = boson ? more : fewer;
            gAnti = boson ? fewer : more;
        } else {
            gSym = (tA + 1) * (tB + 1);
            gAnti = gSym;
        }
        Levels levels = new Levels();
        addState(levels, scaled(c.dunhamCm1(), rho), 0.0, c.ground(), homonuclear, gSym, gAnti, c.dissociationCm1());
        // An N = 0 lowest level (heteronuclear O2) has one fine-structure level: no centroid offset then.
        boolean lowestIsRotationless = !homonuclear || c.ground().evenSymmetric();
        double lowest = levels.minimum() - (lowestIsRotationless ? 0.0 : c.ground().lowestBelowCentroidCm1());
        for (DiatomicConstants.ExcitedState s : c.excited()) {
            addState(levels, scaled(s.dunhamCm1(), rho), s.termCm1(), s.state(), homonuclear, gSym, gAnti,
                    c.dissociationCm1());
        }
        double[] e = Arrays.copyOf(levels.energy, levels.n);
        for (int i = 0; i < e.length; i++) {
            e[i] -= lowest;
        }
        return new DiatomicLevelSum(e, Arrays.copyOf(levels.weight, levels.n));
    }

    private static double reducedMass(String a, String b) {
        double ma = AtomicMasses.massU(a);
        double mb = AtomicMasses.massU(b);
        if (!(ma > 0) || !(mb > 0)) {
            throw new IllegalArgumentException("no nuclide mass tabulated for " + (ma > 0 ? b : a));
        }
        return ma * mb / (ma + mb);
    }

    private static double[][] scaled(double[][] y, double rho) {
        double[][] out = new double[y.length][];
        for (int k = 0; k < y.length; k++) {
            out[k] = new double[y[k].length];
            for (int l = 0; l < y[k].length; l++) {
                out[k][l] = y[k][l] * Math.pow(rho, k + 2 * l);
            }
        }
        return out;
    }

    /** Σ_k y[k][l] (v+½)^k. */
    private static double coefficient(double[][] y, int l, double vHalf) {
        double sum = 0;
        double p = 1;
        for (double[] row : y) {
            if (l < row.length) {
                sum += row[l] * p;
            }
            p *= vHalf;
        }
        return sum;
    }

    private static void addState(Levels out, double[][] y, double termCm1, DiatomicConstants.State state,
                                 boolean homonuclear, int gSym, int gAnti, double d0Cm1) {
        int maxL = 0;
        for (double[] row : y) {
            maxL = Math.max(maxL, row.length - 1);
        }
        double[] yl = new double[maxL + 1];
        double g0 = coefficient(y, 0, 0.5);
        double previousG = Double.NEGATIVE_INFINITY;
        for (int v = 0; ; v++) {
            double vHalf = v + 0.5;
            double gv = coefficient(y, 0, vHalf) - g0;
            if (gv <= previousG || termCm1 + gv >= d0Cm1) {
                break;
            }
            previousG = gv;
            for (int l = 1; l <= maxL; l++) {
                yl[l] = coefficient(y, l, vHalf);
            }
            double base = termCm1 + gv;
            if (state.lambda() == 1 && state.spinOrbitCm1() != 0) {
                addPiLadder(out, yl, base, state.spinOrbitCm1(), gSym, d0Cm1, true);
                addPiLadder(out, yl, base, state.spinOrbitCm1(), gSym, d0Cm1, false);
            } else {
                addSigmaOrDeltaLadder(out, yl, base, state, homonuclear, gSym, gAnti, d0Cm1);
            }
        }
    }

    private static void addSigmaOrDeltaLadder(Levels out, double[] yl, double base, DiatomicConstants.State state,
                                              boolean homonuclear, int gSym, int gAnti, double d0Cm1) {
        double previous = Double.NEGATIVE_INFINITY;
        for (int r = state.lambda(); ; r++) {
            double x = (double) r * (r + 1);
            double f = 0;
            double p = x;
            for (int l = 1; l < yl.length; l++) {
                f += yl[l] * p;
                p *= x;
            }
            if (f <= previous || base + f >= d0Cm1) {
                return;
            }
            previous = f;
            int nuclear;
            if (state.lambda() > 0) {
                // Both Λ components: one of each exchange symmetry (homonuclear), or twice Π(2I+1).
                nuclear = homonuclear ? gSym + gAnti : 2 * gSym;
            } else if (homonuclear) {
                nuclear = ((r % 2 == 0) == state.evenSymmetric()) ? gSym : gAnti;
            } else {
                nuclear = gSym;
            }
            if (nuclear > 0) {
                out.add(base + f, (double) nuclear * state.multiplicity() * (2 * r + 1));
            }
        }
    }

    /** One spin–orbit ladder of a ²Π state (heteronuclear molecules only); lower = the F− energies. */
    private static void addPiLadder(Levels out, double[] yl, double base, double spinOrbitCm1, int gNuclear,
                                    double d0Cm1, boolean lower) {
        double b = yl[1];
        double y = spinOrbitCm1 / b;
        double previous = Double.NEGATIVE_INFINITY;
        for (int twiceJ = 1; ; twiceJ += 2) {
            double jHalf = (twiceJ + 1) / 2.0;
            // J = ½ exists only in the Ω = ½ component: F− for a regular (A > 0), F+ for an inverted state.
            if (twiceJ == 1 && lower != (spinOrbitCm1 > 0)) {
                continue;
            }
            double x = jHalf * jHalf - 1;
            double root = Math.sqrt(4 * jHalf * jHalf + y * (y - 4));
            double f = b * (x + (lower ? -0.5 : 0.5) * root);
            double p = x * x;
            for (int l = 2; l < yl.length; l++) {
                f += yl[l] * p;
                p *= x;
            }
            if (f <= previous || base + f >= d0Cm1) {
                return;
            }
            previous = f;
            out.add(base + f, 2.0 * gNuclear * (twiceJ + 1));
        }
    }

    /** Growing primitive arrays of levels. */
    private static final class Levels {
        double[] energy = new double[1024];
        double[] weight = new double[1024];
        int n;

        void add(double e, double g) {
            if (n == energy.length) {
                energy = Arrays.copyOf(energy, 2 * n);
                weight = Arrays.copyOf(weight, 2 * n);
            }
            energy[n] = e;
            weight[n] = g;
            n++;
        }

        double minimum() {
            double m = Double.POSITIVE_INFINITY;
            for (int i = 0; i < n; i++) {
                m = Math.min(m, energy[i]);
            }
            return m;
        }
    }
}
