package org.linewright.grid.calc;

import java.util.Objects;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;

/**
 * One cross section to compute: the thermodynamic state, the background gas, the grid, and the choices of line
 * shape, wings, intensity threshold, species, width sources and intensity convention. Pressure is in atm (convert
 * at the edge). Immutable: one calculator serves requests of different conventions and abundances, also at once.
 *
 * @param temperatureK                    temperature in K, positive and finite
 * @param pressureAtm                     total pressure in atm, non-negative and finite
 * @param composition                     mole fractions of the background gases
 * @param grid                            the wavenumber grid σ is computed on
 * @param wings                           cutoff, pedestal and χ-factor treatment
 * @param shape                           line shape: Voigt, Doppler only, Lorentz only or Van Vleck–Weisskopf
 *                                        for every line (Voigt and Lorentz give it to low-frequency lines by a rule)
 * @param intensityThresholdCmPerMolecule lines with S(T) below this are left out (0 keeps every line)
 * @param selection                       species filter ({@link LineSelection#ALL} for every line)
 * @param widths                          width source options ({@link WidthOptions#DEFAULTS})
 * @param intensityScaling                intensity convention and user isotopologue abundances applied to S(T) of
 *                                        every line ({@link IntensityScaling#NATURAL} when null; docs/physics.md,
 *                                        "Per molecule of what")
 */
public record CrossSectionRequest(double temperatureK, double pressureAtm, Composition composition,
                                  WavenumberGrid grid, WingTreatment wings, LineShapeKind shape,
                                  double intensityThresholdCmPerMolecule, LineSelection selection,
                                  WidthOptions widths, IntensityScaling intensityScaling) {

    /**
     * @throws InputException for a temperature, pressure or threshold out of range, or a Lorentz-only shape at
     *                        zero pressure (a line of zero width)
     */
    public CrossSectionRequest {
        Objects.requireNonNull(composition, "composition");
        Objects.requireNonNull(grid, "grid");
        Objects.requireNonNull(wings, "wings");
        Objects.requireNonNull(shape, "shape");
        selection = selection == null ? LineSelection.ALL : selection;
        widths = widths == null ? WidthOptions.DEFAULTS : widths;
        intensityScaling = intensityScaling == null ? IntensityScaling.NATURAL : intensityScaling;
        if (!(temperatureK > 0) || Double.isInfinite(temperatureK)) {
            throw new InputException("temperature: " + temperatureK + " K (expected a positive finite value)");
        }
        if (!(pressureAtm >= 0) || Double.isInfinite(pressureAtm)) {
            throw new InputException("pressure: " + pressureAtm + " atm (expected a non-negative finite value)");
        }
        if (!(intensityThresholdCmPerMolecule >= 0) || Double.isInfinite(intensityThresholdCmPerMolecule)) {
            throw new InputException("intensity threshold: " + intensityThresholdCmPerMolecule
                    + " cm/molecule (expected a non-negative finite value)");
        }
        if (shape == LineShapeKind.LORENTZ && pressureAtm == 0) {
            throw new InputException("line shape lorentz at zero pressure: every line would have zero width "
                    + "(expected a positive pressure, or the voigt or doppler shape)");
        }
    }

    /** A request with the stored intensities unchanged (natural abundances of the registry). */
    public CrossSectionRequest(double temperatureK, double pressureAtm, Composition composition, WavenumberGrid grid,
                               WingTreatment wings, LineShapeKind shape, double intensityThresholdCmPerMolecule,
                               LineSelection selection, WidthOptions widths) {
        this(temperatureK, pressureAtm, composition, grid, wings, shape, intensityThresholdCmPerMolecule, selection,
                widths, IntensityScaling.NATURAL);
    }

    /** The same request at another (p, T). */
    public CrossSectionRequest at(double newPressureAtm, double newTemperatureK) {
        return new CrossSectionRequest(newTemperatureK, newPressureAtm, composition, grid, wings, shape,
                intensityThresholdCmPerMolecule, selection, widths, intensityScaling);
    }

    /** The same request over another species selection. */
    public CrossSectionRequest withSelection(LineSelection newSelection) {
        return new CrossSectionRequest(temperatureK, pressureAtm, composition, grid, wings, shape,
                intensityThresholdCmPerMolecule, newSelection, widths, intensityScaling);
    }

    /** The same request with another intensity convention and user abundances. */
    public CrossSectionRequest withIntensityScaling(IntensityScaling newScaling) {
        return new CrossSectionRequest(temperatureK, pressureAtm, composition, grid, wings, shape,
                intensityThresholdCmPerMolecule, selection, widths, newScaling);
    }
}
