package org.linewright.cli;

import java.util.List;
import java.util.Locale;

import org.linewright.cli.units.QuantityParser;
import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;
import picocli.CommandLine.Option;

/**
 * {@code --between LOW HIGH} and {@code --unit}, shared by the commands that work on a spectral window (a picocli
 * argument group: {@code @ArgGroup(exclusive = false, multiplicity = "1")} where the window is required,
 * {@code "0..1"} where it is optional). The bounds are positions in {@code --unit} unless they carry their own
 * unit; a wavelength window reverses in wavenumber, so the bounds are sorted.
 */
public final class SpectralWindowOptions {
    @Option(names = "--between", arity = "2", required = true, paramLabel = "LOW HIGH", hideParamSyntax = true,
            description = "Spectral window (inclusive): two positions in --unit unless they carry their own unit, "
                    + "e.g. 2000 2100, 4.3um 4.6um or 60GHz 70GHz.")
    private List<String> between;

    @Option(names = "--unit", paramLabel = "UNIT", defaultValue = "cm-1",
            description = "Unit of bare numbers in --between (and in --step, with GHz): cm-1, um or GHz "
                    + "(default: ${DEFAULT-VALUE}).")
    private String unit = "cm-1";

    /** The unit of bare numbers, checked: {@code cm-1}, {@code um} or {@code GHz} as written by the user. */
    public String unit() {
        String u = unit.trim();
        String lower = u.toLowerCase(Locale.ROOT);
        if (!lower.equals("cm-1") && !lower.equals("um") && !lower.equals("ghz")) {
            throw new InputException("--unit " + OffendingText.quote(unit) + ": unknown (expected cm-1, um or GHz)");
        }
        return u;
    }

    /** True when the unit of bare numbers is GHz. */
    public boolean gigahertz() {
        return unit().equalsIgnoreCase("ghz");
    }

    /** The window {low, high} in cm⁻¹, low ≤ high. */
    public double[] rangeCm1() {
        if (between.size() != 2) {
            // picocli collects a repeated --between into one list: say so rather than use the first pair
            throw new InputException("--between given " + between.size() / 2 + " times (expected one window LOW HIGH)");
        }
        String u = unit();
        double a = positionCm1(between.get(0), u);
        double b = positionCm1(between.get(1), u);
        return new double[] {Math.min(a, b), Math.max(a, b)};
    }

    /** The bounds as written, for messages. */
    public String asWritten() {
        return OffendingText.escape(between.get(0)) + " " + OffendingText.escape(between.get(1));
    }

    private static double positionCm1(String text, String unit) {
        String t = text.strip();
        if (!hasUnit(t)) {
            double v;
            try {
                v = Double.parseDouble(t);
            } catch (NumberFormatException e) {
                throw new InputException("--between: " + OffendingText.quote(t) + " is not a number (expected a "
                        + "position such as 2100 or 4.5um)");
            }
            if (v == 0.0) {
                // 0 is the bottom of every spectrum whatever the unit (0 um would be an infinite wavenumber)
                return 0.0;
            }
            t = t + " " + unit;
        }
        return QuantityParser.parseWavenumber(t).cm1();
    }

    /** Appends nothing when the value names its own unit: a letter other than an exponent 'e' between digits. */
    static boolean hasUnit(String v) {
        for (int i = 0; i < v.length(); i++) {
            char c = v.charAt(i);
            if (Character.isLetter(c) && !((c == 'e' || c == 'E') && i > 0 && i + 1 < v.length())) {
                return true;
            }
        }
        return false;
    }

    /** {@code value} with {@code unit} appended when it carries none. */
    public static String withUnit(String value, String unit) {
        String v = value.trim();
        return hasUnit(v) ? v : v + " " + unit;
    }
}
