package org.linewright.broadening.voigt;

import java.util.Locale;
import org.linewright.ingest.text.OffendingText;

/**
 * The selectable line shapes: Voigt (Doppler and pressure broadening), Doppler only, Lorentz only, and the
 * Van Vleck–Weisskopf shape for every line. With Voigt or Lorentz the cross-section calculator still gives the
 * Van Vleck–Weisskopf shape to the lines {@link VanVleckWeisskopfProfile#chosenFor} picks (low-frequency lines
 * whose pressure width is not negligible against ν₀).
 */
public enum LineShapeKind implements LineShape {
    /** Voigt profile, see {@link VoigtProfile}. */
    VOIGT {
        @Override
        public double value(double detuningCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return VoigtProfile.value(detuningCm1, dopplerHwhmCm1, lorentzHwhmCm1);
        }

        @Override
        public void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                               double lorentzHwhmCm1, double strength, double baselineCm, double[] out) {
            VoigtProfile.addProfile(gridCm1, from, to, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, baselineCm, out);
        }

        @Override
        public double hwhmCm1(double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return VoigtWidth.hwhmCm1(dopplerHwhmCm1, lorentzHwhmCm1);
        }
    },
    /** Gaussian (Doppler) profile, see {@link DopplerProfile}; the Lorentz width is ignored. */
    DOPPLER {
        @Override
        public double value(double detuningCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return DopplerProfile.value(detuningCm1, dopplerHwhmCm1);
        }

        @Override
        public void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                               double lorentzHwhmCm1, double strength, double baselineCm, double[] out) {
            DopplerProfile.addProfile(gridCm1, from, to, centerCm1, dopplerHwhmCm1, strength, baselineCm, out);
        }

        @Override
        public double hwhmCm1(double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return dopplerHwhmCm1;
        }
    },
    /**
     * Van Vleck–Weisskopf shape for every line, see {@link VanVleckWeisskopfProfile}: the shape depends on the
     * line centre ν₀ as well as on the detuning, so {@link #addProfile} (which has the centre) gives the full
     * shape, while {@link #value} and {@link #hwhmCm1}, which have the detuning only, give those of the +ν₀
     * resonance, the Voigt profile (the ν₀ → ∞ limit). Engines apply it per line through the line's flag.
     */
    VAN_VLECK_WEISSKOPF {
        @Override
        public double value(double detuningCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return VoigtProfile.value(detuningCm1, dopplerHwhmCm1, lorentzHwhmCm1);
        }

        @Override
        public void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                               double lorentzHwhmCm1, double strength, double baselineCm, double[] out) {
            VanVleckWeisskopfProfile.addProfile(gridCm1, from, to, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1,
                    strength, baselineCm, out);
        }

        @Override
        public double hwhmCm1(double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return VoigtWidth.hwhmCm1(dopplerHwhmCm1, lorentzHwhmCm1);
        }

        @Override
        public String label() {
            return "van-vleck-weisskopf";
        }
    },
    /** Lorentz (pressure) profile, see {@link LorentzProfile}; the Doppler width is ignored. */
    LORENTZ {
        @Override
        public double value(double detuningCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return LorentzProfile.value(detuningCm1, lorentzHwhmCm1);
        }

        @Override
        public void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                               double lorentzHwhmCm1, double strength, double baselineCm, double[] out) {
            LorentzProfile.addProfile(gridCm1, from, to, centerCm1, lorentzHwhmCm1, strength, baselineCm, out);
        }

        @Override
        public double hwhmCm1(double dopplerHwhmCm1, double lorentzHwhmCm1) {
            return lorentzHwhmCm1;
        }
    };

    /**
     * Parses a shape name, case-insensitively ("voigt", "doppler", "lorentz", "vvw"; "gauss"/"gaussian",
     * "lorentzian" and "van-vleck-weisskopf" are accepted as synonyms).
     *
     * @param name the name
     * @return the kind
     * @throws IllegalArgumentException naming the accepted values if {@code name} is unknown
     */
    public static LineShapeKind parse(String name) {
        String n = name.trim().toLowerCase(Locale.ROOT);
        switch (n) {
            case "voigt":
                return VOIGT;
            case "doppler":
            case "gauss":
            case "gaussian":
                return DOPPLER;
            case "lorentz":
            case "lorentzian":
                return LORENTZ;
            case "vvw":
            case "van-vleck-weisskopf":
                return VAN_VLECK_WEISSKOPF;
            default:
                throw new IllegalArgumentException(
                        "unknown line shape " + OffendingText.quote(name) + ": expected voigt, doppler, lorentz or vvw");
        }
    }

    /** @return the lower-case name used in metadata ("voigt", "doppler", "lorentz", "van-vleck-weisskopf") */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }
}
