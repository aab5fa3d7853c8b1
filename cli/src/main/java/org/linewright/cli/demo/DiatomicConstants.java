package org.linewright.cli.demo;

/**
 * Vibration–rotation term values of a diatomic molecule in a ¹Σ state from its equilibrium constants
 * (G. Herzberg, "Molecular Spectra and Molecular Structure I. Spectra of Diatomic Molecules", 2nd ed. 1950,
 * ch. III–IV):
 * <pre>
 *   G(v)    = ωe(v+½) − ωexe(v+½)² + ωeye(v+½)³
 *   B_v     = Be − αe(v+½)
 *   F_v(J)  = B_v J(J+1) − De J²(J+1)²
 *   T(v, J) = G(v) + F_v(J)
 * </pre>
 * The series is truncated after the terms above (γe, βe and higher neglected), which for CO reproduces the
 * observed low-J lines of the fundamental to about 10⁻³ cm⁻¹ — ample for synthetic demo data.
 *
 * @param omegaECm1  harmonic wavenumber ωe, cm⁻¹
 * @param omegaEXeCm1 first anharmonicity ωexe, cm⁻¹
 * @param omegaEYeCm1 second anharmonicity ωeye, cm⁻¹
 * @param bECm1      equilibrium rotational constant Be, cm⁻¹
 * @param alphaECm1  vibration–rotation constant αe, cm⁻¹
 * @param dECm1      centrifugal distortion constant De, cm⁻¹
 */
public record DiatomicConstants(double omegaECm1, double omegaEXeCm1, double omegaEYeCm1, double bECm1,
                                double alphaECm1, double dECm1) {

    /** @return the vibrational term G(v), cm⁻¹, measured from the minimum of the potential */
    public double vibrationalTermCm1(int v) {
        double x = v + 0.5;
        return omegaECm1 * x - omegaEXeCm1 * x * x + omegaEYeCm1 * x * x * x;
    }

    /** @return the rotational constant B_v of level v, cm⁻¹ */
    public double rotationalConstantCm1(int v) {
        return bECm1 - alphaECm1 * (v + 0.5);
    }

    /** @return the term value T(v, J), cm⁻¹, measured from the minimum of the potential */
    public double termCm1(int v, int j) {
        double jj = (double) j * (j + 1);
        return vibrationalTermCm1(v) + rotationalConstantCm1(v) * jj - dECm1 * jj * jj;
    }

    /**
     * The constants of an isotopic variant under the Born–Oppenheimer mass scaling (Herzberg 1950, ch. III.2):
     * with ρ = √(μ/μᵢ), ωe → ρωe, ωexe → ρ²ωexe, ωeye → ρ³ωeye, Be → ρ²Be, αe → ρ³αe, De → ρ⁴De.
     *
     * @param rho √(μ/μᵢ), the square root of the ratio of the reduced masses (parent over variant)
     */
    public DiatomicConstants isotopicVariant(double rho) {
        double rho2 = rho * rho;
        return new DiatomicConstants(omegaECm1 * rho, omegaEXeCm1 * rho2, omegaEYeCm1 * rho2 * rho,
                bECm1 * rho2, alphaECm1 * rho2 * rho, dECm1 * rho2 * rho2);
    }
}
