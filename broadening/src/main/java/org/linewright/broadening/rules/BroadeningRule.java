package org.linewright.broadening.rules;

import java.util.Arrays;

import org.linewright.broadening.background.BackgroundGas;

/**
 * One published quantum-number rule: the width γ(296 K) in cm⁻¹/atm, or the temperature exponent n, of one
 * molecule broadened by one background gas, as a function of the line's quantum numbers.
 *
 * <p>The rule variable x is |m| ({@link Variable#M}, see {@link RunningIndex}) or J'' ({@link Variable#LOWER_J});
 * it is clamped to {@code clamp} (x → min(x, clamp)) before evaluation; when {@code beyondLimit} is finite the
 * rule returns {@code beyondValue} for x &gt; beyondLimit (piecewise rules). {@link RuleForm#POLY_MK} also
 * uses K'a (the line model's {@code upperK}), clamped to {@code clampK}. Evaluation is a handful of
 * multiplications (Horner's scheme); its accuracy is that of the published coefficients.
 */
public final class BroadeningRule {
    /** The quantity a rule gives. */
    public enum Quantity { WIDTH, EXPONENT }

    /** The quantum-number variable of a rule. */
    public enum Variable { M, LOWER_J }

    private final int moleculeId;
    private final BackgroundGas gas;
    private final Quantity quantity;
    private final RuleForm form;
    private final Variable variable;
    private final double clamp;
    private final double clampK;
    private final double beyondLimit;
    private final double beyondValue;
    private final double[] c;

    /**
     * @param clamp upper bound of the variable (+∞ for none)
     * @param clampK upper bound of K'a for {@link RuleForm#POLY_MK} (+∞ for none)
     * @param beyondLimit above this value of the variable the rule returns {@code beyondValue} (NaN for none)
     */
    public BroadeningRule(int moleculeId, BackgroundGas gas, Quantity quantity, RuleForm form, Variable variable,
                          double clamp, double clampK, double beyondLimit, double beyondValue,
                          double[] coefficients) {
        if (coefficients.length != form.coefficientCount()) {
            throw new IllegalArgumentException(form.label() + " takes " + form.coefficientCount()
                    + " coefficients, got " + coefficients.length);
        }
        this.moleculeId = moleculeId;
        this.gas = gas;
        this.quantity = quantity;
        this.form = form;
        this.variable = variable;
        this.clamp = clamp;
        this.clampK = clampK;
        this.beyondLimit = beyondLimit;
        this.beyondValue = beyondValue;
        this.c = coefficients.clone();
    }

    /**
     * Evaluates the rule for one line.
     *
     * @return the value, or NaN when a quantum number the rule needs is unknown
     */
    public double evaluate(double lowerJ, double upperJ, double upperK) {
        if (form == RuleForm.CONSTANT) {
            return c[0];
        }
        double x = variable == Variable.M ? RunningIndex.absoluteM(lowerJ, upperJ) : lowerJ;
        if (Double.isNaN(x)) {
            return Double.NaN;
        }
        if (x > beyondLimit) { // false for NaN limit
            return beyondValue;
        }
        x = Math.min(x, clamp);
        switch (form) {
            case PADE:
                return (c[0] + x * (c[1] + x * (c[2] + x * c[3])))
                        / (1.0 + x * (c[4] + x * (c[5] + x * (c[6] + x * c[7]))));
            case LINEAR:
                return c[0] + c[1] * x;
            case POLY_MK: {
                if (Double.isNaN(upperK)) {
                    return Double.NaN;
                }
                double k = Math.min(upperK, clampK);
                return c[0] + c[1] * x + c[2] * k + c[3] * x * x + c[4] * k * k + c[5] * x * k
                        + c[6] * x * x * x + c[7] * k * k * k + c[8] * x * x * k + c[9] * x * k * k;
            }
            default:
                throw new AssertionError(form);
        }
    }

    public int moleculeId() { return moleculeId; }
    public BackgroundGas gas() { return gas; }
    public Quantity quantity() { return quantity; }
    public RuleForm form() { return form; }
    public Variable variable() { return variable; }
    public double clamp() { return clamp; }
    public double clampK() { return clampK; }
    public double beyondLimit() { return beyondLimit; }
    public double beyondValue() { return beyondValue; }
    public double[] coefficients() { return c.clone(); }

    @Override
    public String toString() {
        return "molecule " + moleculeId + " " + gas.label() + " " + quantity.name().toLowerCase() + " "
                + form.label() + " " + Arrays.toString(c);
    }
}
