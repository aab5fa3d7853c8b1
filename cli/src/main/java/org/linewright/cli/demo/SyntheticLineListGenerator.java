package org.linewright.cli.demo;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorOutputStream;
import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.hitran.HitranRecordWriter;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.units.PhysicalConstants;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Generates the <b>synthetic</b> line lists of the linewright demo — invented data for the fictional warm
 * sub-Neptune "Caldera Minor", never to be mistaken for measurements — from simple published molecular models:
 * <ul>
 *   <li>CO, HITRAN molecule 5: ¹²C¹⁶O (isotopologue 1) bands v = 1←0, 2←1 and 3←2; ¹³C¹⁶O (2) and ¹²C¹⁸O (3)
 *       bands 1←0 and 2←1; P and R branches, J″ = 0 … {@value #CO_MAX_LOWER_J}. Term values from Dunham-type
 *       constants ({@link DiatomicConstants}), the minor isotopologues by isotopic mass scaling.</li>
 *   <li>CO2, HITRAN molecule 2: the ν3 fundamental 00011←00001 of ¹²C¹⁶O₂ (isotopologue 1) and ¹³C¹⁶O₂ (2),
 *       P and R branches with even J″ only (the odd-J levels of the ground state do not exist for ¹⁶O nuclei of
 *       spin 0); and the ¹²C¹⁶O₂ ν3 hot band 01111←01101 (a Π–Π band: P, Q and R branches, J″ ≥ 1, one e/f
 *       component per J). All J″ ≤ {@value #CO2_MAX_LOWER_J}. The l-type doubling of the bending levels is
 *       ignored: both components of a J share one term value, B being the mean of the e and f values.</li>
 * </ul>
 * Line intensities at 296 K follow from Einstein A coefficients:
 * {@code S = Iₐ A g′ / (8π c ν̃²) · exp(−c₂E″/T) · (1 − exp(−c₂ν̃/T)) / Q(T)}
 * (M. Šimečková et al., JQSRT 98 (2006) 130, eq. 20), with rotational line strengths from Hönl–London factors
 * (G. Herzberg, "Spectra of Diatomic Molecules", 1950, ch. IV; {@link #honlLondonFraction(char, int, int)}),
 * Boltzmann populations and rigid-rotor × harmonic-oscillator partition sums. Band Einstein coefficients are of
 * the right order, not fitted; Herman–Wallis factors are neglected. Pressure-broadening parameters are invented
 * but plausible: half widths that fall with |m| and temperature exponents near 0.7. Output is deterministic
 * (no randomness). Records are written by the ingest module's {@link HitranRecordWriter} from a
 * {@link LineBatch} whose values are first rounded to the precision of their fields.
 *
 * <p>Regenerate the committed files with (from the repository root, after a build):
 * {@code java -cp "cli/target/classes:cli/target/lib/*" org.linewright.cli.demo.SyntheticLineListGenerator demo/data}
 */
public final class SyntheticLineListGenerator {
    /** Reference temperature of HITRAN intensities and widths, K. */
    public static final double REFERENCE_TEMPERATURE_K = LineBatch.REFERENCE_TEMPERATURE_K;
    /** Highest lower-state J of the CO lines. */
    public static final int CO_MAX_LOWER_J = 100;
    /** Highest lower-state J of the CO2 lines. */
    public static final int CO2_MAX_LOWER_J = 160;
    /** File name of the CO list inside the demo data folder. */
    public static final String CO_FILE = "synthetic-co.par.bz2";
    /** File name of the CO2 list inside the demo data folder. */
    public static final String CO2_FILE = "synthetic-co2.par.bz2";

    /** HITRAN molecule number of CO. */
    static final int CO_MOLECULE = 5;
    /** HITRAN molecule number of CO2. */
    static final int CO2_MOLECULE = 2;

    /**
     * ¹²C¹⁶O X¹Σ⁺ equilibrium constants, cm⁻¹ (K.P. Huber and G. Herzberg, "Constants of Diatomic Molecules",
     * Van Nostrand Reinhold 1979; values from memory): ωe 2169.81358, ωexe 13.28831, ωeye 0.01051,
     * Be 1.93128087, αe 0.01750441, De 6.12147e-6.
     */
    static final DiatomicConstants CO_12C16O =
            new DiatomicConstants(2169.81358, 13.28831, 0.01051, 1.93128087, 0.01750441, 6.12147e-6);

    /** Atomic masses, u (AME 2016, from memory): ¹²C exactly 12, ¹³C, ¹⁶O, ¹⁸O. */
    private static final double MASS_12C_U = 12.0;
    private static final double MASS_13C_U = 13.00335483507;
    private static final double MASS_16O_U = 15.99491461957;
    private static final double MASS_18O_U = 17.99915961286;

    /** ¹³C¹⁶O constants by isotopic scaling of the ¹²C¹⁶O ones. */
    static final DiatomicConstants CO_13C16O = CO_12C16O.isotopicVariant(
            Math.sqrt(reducedMass(MASS_12C_U, MASS_16O_U) / reducedMass(MASS_13C_U, MASS_16O_U)));
    /** ¹²C¹⁸O constants by isotopic scaling of the ¹²C¹⁶O ones. */
    static final DiatomicConstants CO_12C18O = CO_12C16O.isotopicVariant(
            Math.sqrt(reducedMass(MASS_12C_U, MASS_16O_U) / reducedMass(MASS_12C_U, MASS_18O_U)));

    /**
     * Natural abundances of ¹²C¹⁶O, ¹³C¹⁶O and ¹²C¹⁸O (HITRAN isotopologue metadata, from memory; the same
     * values as the ingest registry), the weights included in HITRAN intensities. Index = isotopologue.
     */
    private static final double[] CO_ABUNDANCE = {Double.NaN, 0.986544, 0.011083, 1.97822e-3};
    /**
     * State-independent nuclear-spin weights of the HITRAN degeneracy convention: 1 for ¹²C¹⁶O and ¹²C¹⁸O
     * (spin-0 nuclei), 2 for ¹³C¹⁶O (¹³C has spin ½).
     */
    private static final double[] CO_NUCLEAR_SPIN_WEIGHT = {Double.NaN, 1.0, 2.0, 1.0};
    /** Highest upper vibrational level of the CO bands of each isotopologue (bands v ← v−1 from v = 1). */
    private static final int[] CO_HIGHEST_UPPER_V = {0, 3, 2, 2};
    /**
     * Band Einstein A of CO v = 1 → 0, s⁻¹: the right order (the v = 1 radiative lifetime of CO is about
     * 30 ms, from memory), not a fitted value.
     */
    private static final double CO_BAND_A10_S1 = 35.0;

    /** ¹²C¹⁶O₂ ground state 00001, cm⁻¹ (constants from memory). */
    public static final LinearLevel CO2_626_00001 = new LinearLevel("       0 0 0 01", 0.0, 0.39021894, 1.3338e-7);
    /** ¹²C¹⁶O₂ 00011 (ν3), cm⁻¹ (from memory): band centre 2349.14291, B 0.38714140, D 1.3291e-7. */
    public static final LinearLevel CO2_626_00011 =
            new LinearLevel("       0 0 0 11", 2349.14291, 0.38714140, 1.3291e-7);
    /**
     * ¹²C¹⁶O₂ 01101 (ν2), cm⁻¹ (from memory): origin 667.37998 in the convention G + B J(J+1), B 0.39063900,
     * D 1.3535e-7; l-type doubling ignored.
     */
    public static final LinearLevel CO2_626_01101 =
            new LinearLevel("       0 1 1 01", 667.37998, 0.39063900, 1.3535e-7);
    /**
     * ¹²C¹⁶O₂ 01111 (ν2 + ν3), cm⁻¹: origin 3004.01223 (from memory; the hot band 01111←01101 is centred at
     * 2336.63), B 0.38789 the mean of the e and f effective values (not recalled: estimated from published
     * level energies), D 1.35e-7; l-type doubling ignored.
     */
    public static final LinearLevel CO2_626_01111 =
            new LinearLevel("       0 1 1 11", 3004.01223, 0.38789, 1.35e-7);
    /**
     * ¹³C¹⁶O₂ ground state, cm⁻¹ (from memory): B 0.39023623 — nearly that of ¹²C¹⁶O₂, since the central carbon
     * atom does not contribute to the moment of inertia — D 1.3340e-7.
     */
    public static final LinearLevel CO2_636_00001 = new LinearLevel("       0 0 0 01", 0.0, 0.39023623, 1.3340e-7);
    /**
     * ¹³C¹⁶O₂ 00011, cm⁻¹: band centre 2283.48712 and D 1.333e-7 from memory, B 0.38727 not recalled but
     * estimated from published level energies.
     */
    public static final LinearLevel CO2_636_00011 = new LinearLevel("       0 0 0 11", 2283.48712, 0.38727, 1.333e-7);

    /** Natural abundances of ¹²C¹⁶O₂ and ¹³C¹⁶O₂ (HITRAN isotopologue metadata, from memory). */
    private static final double CO2_626_ABUNDANCE = 0.984204;
    private static final double CO2_636_ABUNDANCE = 0.011057;
    /**
     * Band Einstein A of the ¹²C¹⁶O₂ ν3 fundamental, s⁻¹: the right order (band intensity near
     * 9×10⁻¹⁷ cm/molecule at 296 K, from memory), not a fitted value. The ¹³C¹⁶O₂ ν3 band and the ν3 hot band
     * take the same transition dipole (harmonic approximation), hence A scaled by ν̃³.
     */
    private static final double CO2_NU3_BAND_A_S1 = 424.0;
    /**
     * Harmonic-model vibrational wavenumbers for the partition sums, cm⁻¹ (from memory; ν1 is the mean of the
     * Fermi dyad): ¹²C¹⁶O₂ ν1 1333, ν2 667.4 (doubly degenerate); ¹³C¹⁶O₂ ν1 1318, ν2 648.5. ν3 is the 00011
     * origin.
     */
    private static final double CO2_626_NU1_CM1 = 1333.0;
    private static final double CO2_626_NU2_CM1 = 667.4;
    private static final double CO2_636_NU1_CM1 = 1318.0;
    private static final double CO2_636_NU2_CM1 = 648.5;
    /** Symmetry number of a centrosymmetric linear molecule. */
    private static final double CO2_SYMMETRY_NUMBER = 2.0;
    /** Nuclear-spin weights of the HITRAN degeneracy convention: 1 for ¹²C¹⁶O₂, 2 for ¹³C¹⁶O₂. */
    private static final double CO2_626_NUCLEAR_SPIN_WEIGHT = 1.0;
    private static final double CO2_636_NUCLEAR_SPIN_WEIGHT = 2.0;

    /** Uncertainty codes: 0 = unreported, as befits invented values. */
    private static final String UNCERTAINTY_CODES = "000000";
    /** Reference codes: none. */
    private static final String REFERENCE_CODES = " 0 0 0 0 0 0";

    /**
     * A vibrational level of a linear molecule with term values {@code T(J) = G + B J(J+1) − D J²(J+1)²},
     * measured from the lowest level of the molecule.
     *
     * @param globalQuanta the level's label in the record's global-quanta field
     * @param originCm1    G, cm⁻¹
     * @param bCm1         rotational constant B, cm⁻¹
     * @param dCm1         centrifugal distortion constant D, cm⁻¹
     */
    public record LinearLevel(String globalQuanta, double originCm1, double bCm1, double dCm1) {
        /** @return the term value of rotational level J, cm⁻¹ */
        public double termCm1(int j) {
            double jj = (double) j * (j + 1);
            return originCm1 + bCm1 * jj - dCm1 * jj * jj;
        }
    }

    private SyntheticLineListGenerator() {
    }

    /** Writes {@value #CO_FILE} and {@value #CO2_FILE} into the folder named by the first argument. */
    public static void main(String[] args) throws IOException {
        Path dir = Paths.get(args.length > 0 ? args[0] : "demo/data");
        Files.createDirectories(dir);
        writeBzip2(dir.resolve(CO_FILE), carbonMonoxideLines());
        writeBzip2(dir.resolve(CO2_FILE), carbonDioxideLines());
    }

    /** The synthetic CO lines of every isotopologue and band, sorted by wavenumber. */
    public static List<SyntheticLine> carbonMonoxideLines() {
        List<SyntheticLine> lines = new ArrayList<>();
        for (int iso = 1; iso < CO_HIGHEST_UPPER_V.length; iso++) {
            for (int vUpper = 1; vUpper <= CO_HIGHEST_UPPER_V[iso]; vUpper++) {
                addCarbonMonoxideBand(lines, iso, vUpper, vUpper - 1);
            }
        }
        lines.sort(ORDER);
        return lines;
    }

    /** The synthetic CO2 lines (¹²C¹⁶O₂ and ¹³C¹⁶O₂ ν3, ¹²C¹⁶O₂ ν3 hot band), sorted by wavenumber. */
    public static List<SyntheticLine> carbonDioxideLines() {
        List<SyntheticLine> lines = new ArrayList<>();
        double q626 = carbonDioxidePartitionSum(1, REFERENCE_TEMPERATURE_K);
        double q636 = carbonDioxidePartitionSum(2, REFERENCE_TEMPERATURE_K);
        double nu3 = CO2_626_00011.originCm1() - CO2_626_00001.originCm1();
        addCarbonDioxideBand(lines, 1, CO2_626_00011, CO2_626_00001, 0, CO2_NU3_BAND_A_S1,
                CO2_626_ABUNDANCE, CO2_626_NUCLEAR_SPIN_WEIGHT, q626);
        double nu3Hot = CO2_626_01111.originCm1() - CO2_626_01101.originCm1();
        addCarbonDioxideBand(lines, 1, CO2_626_01111, CO2_626_01101, 1,
                CO2_NU3_BAND_A_S1 * Math.pow(nu3Hot / nu3, 3), CO2_626_ABUNDANCE, CO2_626_NUCLEAR_SPIN_WEIGHT, q626);
        double nu3Of636 = CO2_636_00011.originCm1() - CO2_636_00001.originCm1();
        addCarbonDioxideBand(lines, 2, CO2_636_00011, CO2_636_00001, 0,
                CO2_NU3_BAND_A_S1 * Math.pow(nu3Of636 / nu3, 3), CO2_636_ABUNDANCE, CO2_636_NUCLEAR_SPIN_WEIGHT, q636);
        lines.sort(ORDER);
        return lines;
    }

    /**
     * Term value of a CO level above the lowest level (v = 0, J = 0), cm⁻¹ — the zero of HITRAN lower-state
     * energies.
     *
     * @param isotopologue 1 (¹²C¹⁶O), 2 (¹³C¹⁶O) or 3 (¹²C¹⁸O)
     */
    public static double carbonMonoxideLevelEnergyCm1(int isotopologue, int v, int j) {
        DiatomicConstants c = coConstants(isotopologue);
        return c.termCm1(v, j) - c.termCm1(0, 0);
    }

    /**
     * Rigid-rotor × harmonic-oscillator partition sum of CO in the HITRAN convention (nuclear-spin weight
     * included): {@code Q = g_ns (T/(c₂B₀) + 1/3 + c₂B₀/(15T)) / (1 − exp(−c₂ν₀/T))}, the rotational part being
     * Mulliken's high-temperature expansion (R.S. Mulliken, Rev. Mod. Phys. 3 (1931) 89), B₀ the v = 0
     * rotational constant and ν₀ the fundamental band origin. Within 0.1 % of tabulated values at 296 K.
     */
    public static double carbonMonoxidePartitionSum(int isotopologue, double temperatureK) {
        DiatomicConstants c = coConstants(isotopologue);
        double c2 = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;
        double b0 = c.rotationalConstantCm1(0);
        double rotational = temperatureK / (c2 * b0) + 1.0 / 3.0 + c2 * b0 / (15.0 * temperatureK);
        double nu0 = c.vibrationalTermCm1(1) - c.vibrationalTermCm1(0);
        return CO_NUCLEAR_SPIN_WEIGHT[isotopologue] * rotational / -Math.expm1(-c2 * nu0 / temperatureK);
    }

    /**
     * Rigid-rotor × harmonic-oscillator partition sum of ¹²C¹⁶O₂ (isotopologue 1) or ¹³C¹⁶O₂ (2) in the HITRAN
     * convention: {@code Q = g_ns (T/(c₂B″) + 1/3)/σ · Π (1 − exp(−c₂ωᵢ/T))^(−dᵢ)}, σ = 2, with ω₁, ω₂ (d = 2)
     * and ω₃; g_ns = 2 for ¹³C¹⁶O₂.
     */
    public static double carbonDioxidePartitionSum(int isotopologue, double temperatureK) {
        LinearLevel ground;
        LinearLevel nu3;
        double nu1;
        double nu2;
        double gNs;
        switch (isotopologue) {
            case 1 -> {
                ground = CO2_626_00001;
                nu3 = CO2_626_00011;
                nu1 = CO2_626_NU1_CM1;
                nu2 = CO2_626_NU2_CM1;
                gNs = CO2_626_NUCLEAR_SPIN_WEIGHT;
            }
            case 2 -> {
                ground = CO2_636_00001;
                nu3 = CO2_636_00011;
                nu1 = CO2_636_NU1_CM1;
                nu2 = CO2_636_NU2_CM1;
                gNs = CO2_636_NUCLEAR_SPIN_WEIGHT;
            }
            default -> throw new IllegalArgumentException("CO2 isotopologue " + isotopologue + " is not in the model");
        }
        double c2 = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;
        double rotational = gNs * (temperatureK / (c2 * ground.bCm1()) + 1.0 / 3.0) / CO2_SYMMETRY_NUMBER;
        // -expm1(-x) = 1 - exp(-x) without cancellation when x is small (high temperature)
        double bend = -Math.expm1(-c2 * nu2 / temperatureK);
        double vibrational = 1.0 / (-Math.expm1(-c2 * nu1 / temperatureK) * bend * bend
                * -Math.expm1(-c2 * (nu3.originCm1() - ground.originCm1()) / temperatureK));
        return rotational * vibrational;
    }

    /**
     * The lines as a {@link LineBatch}, each value rounded to the precision of its field in the 160-character
     * format (so the batch holds exactly what a reader of the written records gets back), row order kept;
     * {@code sourceLine} is the 1-based record number, J′ and J″ are set, the other optional columns are NaN.
     */
    public static LineBatch toBatch(List<SyntheticLine> lines) {
        LineBatch b = new LineBatch(Math.max(1, lines.size()));
        for (SyntheticLine l : lines) {
            int row = b.size;
            b.clearOptional(row);
            b.moleculeId[row] = l.moleculeId();
            b.isotopologue[row] = l.isotopologue();
            b.wavenumberCm1[row] = roundToDecimals(l.wavenumberCm1(), 6);
            b.intensityCmPerMolecule[row] = roundToFourDigits(l.intensityCmPerMolecule());
            b.einsteinAS1[row] = roundToFourDigits(l.einsteinAS1());
            b.airWidthCm1PerAtm[row] = roundToDecimals(l.airWidthCm1PerAtm(), 4);
            b.selfWidthCm1PerAtm[row] = roundToDecimals(l.selfWidthCm1PerAtm(), 3);
            b.lowerEnergyCm1[row] = roundToDecimals(l.lowerEnergyCm1(), 4);
            b.airWidthExponent[row] = roundToDecimals(l.airWidthExponent(), 2);
            b.airShiftCm1PerAtm[row] = roundToDecimals(l.airShiftCm1PerAtm(), 6);
            b.upperDegeneracy[row] = l.upperDegeneracy();
            b.lowerDegeneracy[row] = l.lowerDegeneracy();
            b.upperJ[row] = l.upperJ();
            b.lowerJ[row] = l.lowerJ();
            b.sourceLine[row] = row + 1L;
            b.upperGlobalQuanta.append(l.upperVibration());
            b.lowerGlobalQuanta.append(l.lowerVibration());
            b.upperLocalQuanta.appendEmpty();
            b.lowerLocalQuanta.append(l.lowerLocalQuanta());
            b.uncertaintyCodes.append(UNCERTAINTY_CODES);
            b.referenceCodes.append(REFERENCE_CODES);
            b.lineMixingFlag.appendEmpty();
            b.size++;
        }
        return b;
    }

    /** The HITRAN records of the lines, one per line, each terminated by '\n'. */
    public static String toRecords(List<SyntheticLine> lines) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(lines.size() * 161);
        try {
            new HitranRecordWriter().write(toBatch(lines), out);
        } catch (IOException e) {
            throw new AssertionError("a byte array stream does not fail", e);
        }
        return out.toString(StandardCharsets.US_ASCII);
    }

    /** Writes the records bzip2-compressed, under a temporary name renamed when complete. */
    public static void writeBzip2(Path file, List<SyntheticLine> lines) throws IOException {
        AtomicFile.write(file, tmp -> {
            try (OutputStream raw = Files.newOutputStream(tmp);
                 BZip2CompressorOutputStream bz = new BZip2CompressorOutputStream(raw)) {
                new HitranRecordWriter().write(toBatch(lines), bz);
            }
        });
    }

    private static void addCarbonMonoxideBand(List<SyntheticLine> lines, int iso, int vUpper, int vLower) {
        DiatomicConstants c = coConstants(iso);
        double q = carbonMonoxidePartitionSum(iso, REFERENCE_TEMPERATURE_K);
        double bandOrigin = c.vibrationalTermCm1(vUpper) - c.vibrationalTermCm1(vLower);
        double parentNu10 = CO_12C16O.vibrationalTermCm1(1) - CO_12C16O.vibrationalTermCm1(0);
        double rho = c.omegaECm1() / CO_12C16O.omegaECm1();
        // harmonic oscillator: |<v-1|x|v>|^2 grows as v/(mu*omega), i.e. as v*rho for a variant, and A as nu^3
        double bandA = CO_BAND_A10_S1 * vUpper * Math.pow(bandOrigin / parentNu10, 3) * rho;
        double gNs = CO_NUCLEAR_SPIN_WEIGHT[iso];
        String upperLabel = String.format(Locale.ROOT, "%15d", vUpper);
        String lowerLabel = String.format(Locale.ROOT, "%15d", vLower);
        for (int jLower = 0; jLower <= CO_MAX_LOWER_J; jLower++) {
            for (char branch : new char[] {'P', 'R'}) {
                int jUpper = branch == 'R' ? jLower + 1 : jLower - 1;
                if (jUpper < 0) {
                    continue;
                }
                double lowerE = carbonMonoxideLevelEnergyCm1(iso, vLower, jLower);
                double nu = carbonMonoxideLevelEnergyCm1(iso, vUpper, jUpper) - lowerE;
                double a = bandA * honlLondonFraction(branch, jUpper);
                double gUpper = gNs * (2 * jUpper + 1);
                double gLower = gNs * (2 * jLower + 1);
                int m = branch == 'R' ? jLower + 1 : -jLower;
                double airWidth = 0.047 + 0.033 * Math.exp(-Math.abs(m) / 9.0);
                lines.add(new SyntheticLine(CO_MOLECULE, iso, nu,
                        intensity(CO_ABUNDANCE[iso], a, gUpper, nu, lowerE, q), a,
                        airWidth, 1.08 * airWidth + 0.002, lowerE,
                        0.66 + 0.10 * Math.exp(-Math.abs(m) / 20.0),
                        -0.0010 - 0.0030 * Math.abs(m) / (Math.abs(m) + 8.0),
                        upperLabel, lowerLabel, branch, jLower, ' ', gUpper, gLower));
            }
        }
    }

    /**
     * Adds one parallel band of CO2 with vibrational angular momentum {@code l} in both levels: l = 0 (Σ–Σ, the
     * ν3 fundamentals) takes even J″ only, labelled e, with P and R branches; l = 1 (Π–Π, the hot band) takes
     * every J″ ≥ 1 with the one e/f component that exists for symmetric ¹⁶O nuclei in a Πu level (e for odd J,
     * f for even J), P and R branches (e↔e, f↔f) and a Q branch (e→f, odd J″).
     */
    private static void addCarbonDioxideBand(List<SyntheticLine> lines, int iso, LinearLevel upper, LinearLevel lower,
                                             int l, double bandA, double abundance, double gNs, double q) {
        for (int jLower = l; jLower <= CO2_MAX_LOWER_J; jLower++) {
            char parity = l == 0 ? 'e' : (jLower % 2 == 1 ? 'e' : 'f');
            if (l == 0 && jLower % 2 != 0) {
                continue;
            }
            for (char branch : new char[] {'P', 'Q', 'R'}) {
                if (branch == 'Q' && (l == 0 || parity != 'e')) {
                    continue;
                }
                int jUpper = branch == 'R' ? jLower + 1 : branch == 'Q' ? jLower : jLower - 1;
                if (jUpper < l) {
                    continue;
                }
                double lowerE = lower.termCm1(jLower);
                double nu = upper.termCm1(jUpper) - lowerE;
                double a = bandA * honlLondonFraction(branch, jUpper, l);
                double gUpper = gNs * (2 * jUpper + 1);
                double gLower = gNs * (2 * jLower + 1);
                int m = branch == 'R' ? jLower + 1 : branch == 'Q' ? jLower : -jLower;
                double airWidth = 0.060 + 0.022 * Math.exp(-Math.abs(m) / 25.0);
                lines.add(new SyntheticLine(CO2_MOLECULE, iso, nu,
                        intensity(abundance, a, gUpper, nu, lowerE, q), a,
                        airWidth, 1.30 * airWidth, lowerE,
                        0.68 + 0.08 * Math.exp(-Math.abs(m) / 30.0),
                        -0.0020 - 0.0040 * Math.abs(m) / (Math.abs(m) + 20.0),
                        upper.globalQuanta(), lower.globalQuanta(), branch, jLower, parity, gUpper, gLower));
            }
        }
    }

    /**
     * Fraction of the band Einstein A carried by one line of a ¹Σ–¹Σ band from upper level J′ (see
     * {@link #honlLondonFraction(char, int, int)} with Λ = 0).
     */
    static double honlLondonFraction(char branch, int jUpper) {
        return honlLondonFraction(branch, jUpper, 0);
    }

    /**
     * Fraction of the band Einstein A carried by one line from upper level J′ of a parallel band (ΔΛ = 0, or
     * Δl = 0 for the vibrational angular momentum of a linear polyatomic): the Hönl–London factor over (2J′+1),
     * with the factors (Herzberg 1950, ch. IV, in terms of J′)
     * R: (J′+Λ)(J′−Λ)/J′, Q: Λ²(2J′+1)/(J′(J′+1)), P: (J′+1+Λ)(J′+1−Λ)/(J′+1).
     * The lines from one J′ sum to one.
     */
    static double honlLondonFraction(char branch, int jUpper, int lambda) {
        double j = jUpper;
        double l2 = (double) lambda * lambda;
        double factor = switch (branch) {
            case 'R' -> (j * j - l2) / j;
            case 'Q' -> l2 * (2 * j + 1) / (j * (j + 1));
            case 'P' -> ((j + 1) * (j + 1) - l2) / (j + 1);
            default -> throw new IllegalArgumentException("branch " + branch);
        };
        return factor / (2 * j + 1);
    }

    /** Line intensity at 296 K from the Einstein A: ingest's relation (Šimečková et al. 2006, eq. 20), cm/molecule. */
    private static double intensity(double abundance, double einsteinA, double gUpper, double nu, double lowerE,
                                    double q) {
        return EinsteinCoefficients.intensityFromEinsteinA(einsteinA, nu, gUpper, lowerE, REFERENCE_TEMPERATURE_K, q,
                abundance);
    }

    /** The double nearest to {@code value} rounded to {@code decimals} decimals (an exact quotient of two doubles). */
    private static double roundToDecimals(double value, int decimals) {
        double scale = Math.pow(10, decimals);
        return Math.round(value * scale) / scale;
    }

    /** The double nearest to {@code value} rounded to four significant digits, as an E10.3 field holds it. */
    private static double roundToFourDigits(double value) {
        return Double.parseDouble(String.format(Locale.ROOT, "%.3E", value));
    }

    private static DiatomicConstants coConstants(int isotopologue) {
        return switch (isotopologue) {
            case 1 -> CO_12C16O;
            case 2 -> CO_13C16O;
            case 3 -> CO_12C18O;
            default -> throw new IllegalArgumentException("CO isotopologue " + isotopologue + " is not in the model");
        };
    }

    private static double reducedMass(double m1, double m2) {
        return m1 * m2 / (m1 + m2);
    }

    /** Wavenumber, then isotopologue, bands, branch and J″, so equal positions still sort the same way every time. */
    private static final Comparator<SyntheticLine> ORDER = Comparator
            .comparingDouble(SyntheticLine::wavenumberCm1)
            .thenComparingInt(SyntheticLine::isotopologue)
            .thenComparing(SyntheticLine::lowerVibration)
            .thenComparing(SyntheticLine::upperVibration)
            .thenComparingInt(SyntheticLine::branch)
            .thenComparingInt(SyntheticLine::lowerJ);
}
