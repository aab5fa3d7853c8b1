package org.linewright.ingest.units;

/**
 * Physical constants, CODATA 2018 recommended values (E. Tiesinga, P.J. Mohr, D.B. Newell, B.N. Taylor,
 * "CODATA recommended values of the fundamental physical constants: 2018", Rev. Mod. Phys. 93 (2021) 025010).
 * The only place in linewright where these numbers are written.
 */
public final class PhysicalConstants {
    /** Speed of light in vacuum, exact, in cm/s. */
    public static final double SPEED_OF_LIGHT_CM_PER_S = 2.99792458e10;
    /** Speed of light in vacuum, exact, in m/s. */
    public static final double SPEED_OF_LIGHT_M_PER_S = 2.99792458e8;
    /** Planck constant, exact, in J·s. */
    public static final double PLANCK_J_S = 6.62607015e-34;
    /** Boltzmann constant, exact, in J/K. */
    public static final double BOLTZMANN_J_PER_K = 1.380649e-23;
    /** Avogadro constant, exact, in 1/mol. */
    public static final double AVOGADRO_PER_MOL = 6.02214076e23;
    /** One electronvolt as a wavenumber, e/(hc) in cm⁻¹ (CODATA 2018: 8065.543937... cm⁻¹ per eV). */
    public static final double ELECTRON_VOLT_CM1 = 8065.543937;
    /** Second radiation constant c2 = hc/k in cm·K (CODATA 2018: 1.438776877...×10⁻² m·K). */
    public static final double SECOND_RADIATION_CONSTANT_CM_K = 1.438776877;
    /** Atomic mass constant m_u in kg (CODATA 2018, relative uncertainty 3.0×10⁻¹⁰). */
    public static final double ATOMIC_MASS_CONSTANT_KG = 1.66053906660e-27;
    /** Standard atmosphere in Pa, exact by definition. */
    public static final double STANDARD_ATMOSPHERE_PA = 101_325.0;
    /** Loschmidt-type number density of an ideal gas at 296 K and 1 atm, p/(kT), in molecules/cm³. */
    public static final double NUMBER_DENSITY_296K_1ATM_PER_CM3 =
            STANDARD_ATMOSPHERE_PA / (BOLTZMANN_J_PER_K * 296.0) * 1e-6;

    private PhysicalConstants() {
    }
}
