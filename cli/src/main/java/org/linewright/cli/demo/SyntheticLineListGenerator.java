package org.linewright.cli.demo;

import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorOutputStream;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Generates the <b>synthetic</b> line lists of the linewright demo — invented data for the fictional warm
 * sub-Neptune "Caldera Minor", never to be mistaken for measurements — from simple published molecular models:
 * <ul>
 *   <li>CO, HITRAN molecule 5, isotopologues 1 (¹²C¹⁶O) and 2 (¹³C¹⁶O): the fundamental (v = 1 ← 0) and the
 *       first hot band (v = 2 ← 1), P and R branches, J″ = 0 … {@value #CO_MAX_LOWER_J}; term values from
 *       Dunham-type constants ({@link DiatomicConstants}), ¹³C¹⁶O by isotopic mass scaling.</li>
 *   <li>CO2, HITRAN molecule 2, isotopologue 1 (¹²C¹⁶O₂): the ν3 band (00011 ← 00001), P and R branches with
 *       even J″ only (the odd-J levels of the ground state do not exist for ¹⁶O nuclei of spin 0),
 *       J″ ≤ {@value #CO2_MAX_LOWER_J}.</li>
 * </ul>
 * Line intensities at 296 K follow from Einstein A coefficients:
 * {@code S = Iₐ A g′ / (8π c ν̃²) · exp(−c₂E″/T) · (1 − exp(−c₂ν̃/T)) / Q(T)}
 * (M. Šimečková et al., JQSRT 98 (2006) 130, eq. 20), with rotational line strengths from the Hönl–London
 * factors of a ¹Σ–¹Σ transition (R: A = A_band J′/(2J′+1); P: A = A_band (J′+1)/(2J′+1)), Boltzmann populations
 * and a rigid-rotor × harmonic-oscillator partition sum. Band Einstein coefficients are of the right order, not
 * fitted; Herman–Wallis factors are neglected. Pressure-broadening parameters are invented but plausible: half
 * widths that fall with |m| and temperature exponents near 0.7. Output is deterministic (no randomness).
 *
 * <p>Regenerate the committed files with (from the repository root, after a build):
 * {@code java -cp "cli/target/classes:cli/target/lib/*" org.linewright.cli.demo.SyntheticLineListGenerator demo/data}
 */
public final class SyntheticLineListGenerator {
    /** Reference temperature of HITRAN intensities and widths, K. */
    public static final double REFERENCE_TEMPERATURE_K = 296.0;
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

    /** Atomic masses, u (AME 2016, from memory): ¹²C exactly 12, ¹³C, ¹⁶O. */
    private static final double MASS_12C_U = 12.0;
    private static final double MASS_13C_U = 13.00335483507;
    private static final double MASS_16O_U = 15.99491461957;

    /** ¹³C¹⁶O constants by isotopic scaling of the ¹²C¹⁶O ones. */
    static final DiatomicConstants CO_13C16O = CO_12C16O.isotopicVariant(
            Math.sqrt(reducedMass(MASS_12C_U, MASS_16O_U) / reducedMass(MASS_13C_U, MASS_16O_U)));

    /**
     * Natural abundances of ¹²C¹⁶O and ¹³C¹⁶O (HITRAN isotopologue metadata, from memory), the weights
     * included in HITRAN intensities.
     */
    private static final double[] CO_ABUNDANCE = {Double.NaN, 0.986544, 0.011083};
    /**
     * State-independent nuclear-spin weights of the HITRAN degeneracy convention: 1 for ¹²C¹⁶O, 2 for ¹³C¹⁶O
     * (¹³C has spin ½).
     */
    private static final double[] CO_NUCLEAR_SPIN_WEIGHT = {Double.NaN, 1.0, 2.0};
    /**
     * Band Einstein A of CO v = 1 → 0, s⁻¹: the right order (the v = 1 radiative lifetime of CO is about
     * 30 ms, from memory), not a fitted value.
     */
    private static final double CO_BAND_A10_S1 = 35.0;

    /** ¹²C¹⁶O₂ ν3 band centre, cm⁻¹ (from memory). */
    static final double CO2_NU3_BAND_CENTRE_CM1 = 2349.14291;
    /** ¹²C¹⁶O₂ ground-state rotational and distortion constants B″, D″, cm⁻¹ (from memory). */
    static final double CO2_GROUND_B_CM1 = 0.39021894;
    static final double CO2_GROUND_D_CM1 = 1.3338e-7;
    /** ¹²C¹⁶O₂ 00011 rotational and distortion constants B′, D′, cm⁻¹ (from memory). */
    static final double CO2_NU3_B_CM1 = 0.38714140;
    static final double CO2_NU3_D_CM1 = 1.3291e-7;
    /** ¹²C¹⁶O₂ natural abundance (HITRAN isotopologue metadata, from memory). */
    private static final double CO2_ABUNDANCE = 0.984204;
    /**
     * Band Einstein A of the CO2 ν3 fundamental, s⁻¹: the right order (band intensity near 9×10⁻¹⁷ cm/molecule
     * at 296 K, from memory), not a fitted value.
     */
    private static final double CO2_NU3_BAND_A_S1 = 424.0;
    /**
     * CO2 harmonic-model vibrational wavenumbers for the partition sum, cm⁻¹ (from memory; ν1 is the mean of
     * the Fermi dyad): ν1 1333, ν2 667.4 (doubly degenerate), ν3 2349.1.
     */
    private static final double CO2_NU1_CM1 = 1333.0;
    private static final double CO2_NU2_CM1 = 667.4;
    /** Symmetry number of a centrosymmetric linear molecule. */
    private static final double CO2_SYMMETRY_NUMBER = 2.0;

    private SyntheticLineListGenerator() {
    }

    /** Writes {@value #CO_FILE} and {@value #CO2_FILE} into the folder named by the first argument. */
    public static void main(String[] args) throws IOException {
        Path dir = Paths.get(args.length > 0 ? args[0] : "demo/data");
        Files.createDirectories(dir);
        writeBzip2(dir.resolve(CO_FILE), carbonMonoxideLines());
        writeBzip2(dir.resolve(CO2_FILE), carbonDioxideLines());
    }

    /**
     * The synthetic CO lines of both isotopologues and both bands, sorted by wavenumber.
     */
    public static List<SyntheticLine> carbonMonoxideLines() {
        List<SyntheticLine> lines = new ArrayList<>();
        for (int iso = 1; iso <= 2; iso++) {
            for (int vLower = 0; vLower <= 1; vLower++) {
                addCarbonMonoxideBand(lines, iso, vLower + 1, vLower);
            }
        }
        lines.sort(ORDER);
        return lines;
    }

    /** The synthetic CO2 ν3 lines, sorted by wavenumber. */
    public static List<SyntheticLine> carbonDioxideLines() {
        List<SyntheticLine> lines = new ArrayList<>();
        double q = carbonDioxidePartitionSum(REFERENCE_TEMPERATURE_K);
        for (int jLower = 0; jLower <= CO2_MAX_LOWER_J; jLower += 2) {
            for (char branch : new char[] {'P', 'R'}) {
                int jUpper = branch == 'R' ? jLower + 1 : jLower - 1;
                if (jUpper < 0) {
                    continue;
                }
                double lowerE = carbonDioxideLevelEnergyCm1(0, jLower);
                double nu = carbonDioxideLevelEnergyCm1(1, jUpper) - lowerE;
                double a = CO2_NU3_BAND_A_S1 * honlLondonFraction(branch, jUpper);
                double gUpper = 2 * jUpper + 1;
                double gLower = 2 * jLower + 1;
                int m = branch == 'R' ? jLower + 1 : -jLower;
                double airWidth = 0.060 + 0.022 * Math.exp(-Math.abs(m) / 25.0);
                lines.add(new SyntheticLine(CO2_MOLECULE, 1, nu,
                        intensity(CO2_ABUNDANCE, a, gUpper, nu, lowerE, q), a,
                        airWidth, 1.30 * airWidth, lowerE,
                        0.68 + 0.08 * Math.exp(-Math.abs(m) / 30.0),
                        -0.0020 - 0.0040 * Math.abs(m) / (Math.abs(m) + 20.0),
                        "       0 0 0 11", "       0 0 0 01", branch, jLower, 'e', gUpper, gLower));
            }
        }
        lines.sort(ORDER);
        return lines;
    }

    /**
     * Term value of a CO level above the lowest level (v = 0, J = 0), cm⁻¹ — the zero of HITRAN lower-state
     * energies.
     *
     * @param isotopologue 1 (¹²C¹⁶O) or 2 (¹³C¹⁶O)
     */
    public static double carbonMonoxideLevelEnergyCm1(int isotopologue, int v, int j) {
        DiatomicConstants c = coConstants(isotopologue);
        return c.termCm1(v, j) - c.termCm1(0, 0);
    }

    /**
     * Term value of a ¹²C¹⁶O₂ level of the ground state (v3 = 0) or of 00011 (v3 = 1) above the lowest level,
     * cm⁻¹: {@code G + B J(J+1) − D J²(J+1)²}.
     */
    public static double carbonDioxideLevelEnergyCm1(int v3, int j) {
        double jj = (double) j * (j + 1);
        if (v3 == 0) {
            return CO2_GROUND_B_CM1 * jj - CO2_GROUND_D_CM1 * jj * jj;
        }
        if (v3 == 1) {
            return CO2_NU3_BAND_CENTRE_CM1 + CO2_NU3_B_CM1 * jj - CO2_NU3_D_CM1 * jj * jj;
        }
        throw new IllegalArgumentException("v3 = " + v3 + " is not in the model");
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
     * Rigid-rotor × harmonic-oscillator partition sum of ¹²C¹⁶O₂:
     * {@code Q = (T/(c₂B″) + 1/3)/σ · Π (1 − exp(−c₂ωᵢ/T))^(−dᵢ)}, σ = 2, with ω₁, ω₂ (d = 2) and ω₃.
     */
    public static double carbonDioxidePartitionSum(double temperatureK) {
        double c2 = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;
        double rotational = (temperatureK / (c2 * CO2_GROUND_B_CM1) + 1.0 / 3.0) / CO2_SYMMETRY_NUMBER;
        // -expm1(-x) = 1 - exp(-x) without cancellation when x is small (high temperature)
        double bend = -Math.expm1(-c2 * CO2_NU2_CM1 / temperatureK);
        double vibrational = 1.0 / (-Math.expm1(-c2 * CO2_NU1_CM1 / temperatureK) * bend * bend
                * -Math.expm1(-c2 * CO2_NU3_BAND_CENTRE_CM1 / temperatureK));
        return rotational * vibrational;
    }

    /** The HITRAN records of the lines, one per line, each terminated by '\n'. */
    public static String toRecords(List<SyntheticLine> lines) {
        StringBuilder sb = new StringBuilder(lines.size() * (HitranRecordWriter.RECORD_LENGTH + 1));
        for (SyntheticLine line : lines) {
            sb.append(HitranRecordWriter.format(line)).append('\n');
        }
        return sb.toString();
    }

    /** Writes the records bzip2-compressed, under a temporary name renamed when complete. */
    public static void writeBzip2(Path file, List<SyntheticLine> lines) throws IOException {
        Path tmp = file.resolveSibling(file.getFileName() + ".tmp");
        try (OutputStream raw = Files.newOutputStream(tmp);
             BZip2CompressorOutputStream bz = new BZip2CompressorOutputStream(raw);
             Writer w = new OutputStreamWriter(bz, StandardCharsets.US_ASCII)) {
            w.write(toRecords(lines));
        }
        Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
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
                        String.format(Locale.ROOT, "%15d", vUpper), String.format(Locale.ROOT, "%15d", vLower),
                        branch, jLower, ' ', gUpper, gLower));
            }
        }
    }

    /**
     * Fraction of the band Einstein A carried by one line from upper level J′: the Hönl–London factor of a
     * ¹Σ–¹Σ transition over (2J′+1); the R and P lines from one J′ sum to one.
     */
    static double honlLondonFraction(char branch, int jUpper) {
        return branch == 'R' ? jUpper / (2.0 * jUpper + 1.0) : (jUpper + 1.0) / (2.0 * jUpper + 1.0);
    }

    /** Line intensity at 296 K from the Einstein A (Šimečková et al. 2006, eq. 20), cm/molecule. */
    private static double intensity(double abundance, double einsteinA, double gUpper, double nu, double lowerE,
                                    double q) {
        double c2OverT = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K / REFERENCE_TEMPERATURE_K;
        return abundance * einsteinA * gUpper / (8.0 * Math.PI * PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S * nu * nu)
                * Math.exp(-c2OverT * lowerE) * -Math.expm1(-c2OverT * nu) / q;
    }

    private static DiatomicConstants coConstants(int isotopologue) {
        return switch (isotopologue) {
            case 1 -> CO_12C16O;
            case 2 -> CO_13C16O;
            default -> throw new IllegalArgumentException("CO isotopologue " + isotopologue + " is not in the model");
        };
    }

    private static double reducedMass(double m1, double m2) {
        return m1 * m2 / (m1 + m2);
    }

    /** Wavenumber, then isotopologue, branch and J″, so equal positions still sort the same way every time. */
    private static final Comparator<SyntheticLine> ORDER = Comparator
            .comparingDouble(SyntheticLine::wavenumberCm1)
            .thenComparingInt(SyntheticLine::isotopologue)
            .thenComparing(SyntheticLine::lowerVibration)
            .thenComparingInt(SyntheticLine::branch)
            .thenComparingInt(SyntheticLine::lowerJ);
}
