package org.linewright.broadening.rules;

/** Functional forms of quantum-number broadening rules, with their number of coefficients. */
public enum RuleForm {
    /**
     * Padé approximant f(x) = (a0 + a1·x + a2·x² + a3·x³)/(1 + b1·x + b2·x² + b3·x³ + b4·x⁴); coefficients
     * a0, a1, a2, a3, b1, b2, b3, b4.
     */
    PADE("pade", 8),
    /** f(x) = c0 + c1·x. */
    LINEAR("linear", 2),
    /** f = c0. */
    CONSTANT("constant", 1),
    /**
     * Cubic polynomial in m = |m| and K = K'a: c0 + c1·m + c2·K + c3·m² + c4·K² + c5·m·K + c6·m³ + c7·K³
     * + c8·m²·K + c9·m·K².
     */
    POLY_MK("poly-mk", 10);

    private final String label;
    private final int coefficientCount;

    RuleForm(String label, int coefficientCount) {
        this.label = label;
        this.coefficientCount = coefficientCount;
    }

    /** Name in rule files. */
    public String label() {
        return label;
    }

    /** Number of coefficients the form takes. */
    public int coefficientCount() {
        return coefficientCount;
    }

    /** Form by its rule-file name; null when unknown. */
    public static RuleForm byLabel(String label) {
        for (RuleForm f : values()) {
            if (f.label.equals(label)) {
                return f;
            }
        }
        return null;
    }
}
