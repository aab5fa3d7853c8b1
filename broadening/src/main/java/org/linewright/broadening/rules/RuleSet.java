package org.linewright.broadening.rules;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.linewright.broadening.background.BackgroundGas;
import org.linewright.ingest.source.LineFormatException;

/**
 * Quantum-number broadening rules read from rule files, looked up by (molecule, background gas, quantity).
 *
 * <p>Rule-file format (text, UTF-8, one item per line; {@code #} starts a comment line):
 * <pre>
 * source Y. Tan et al., ApJS 262 (2022) 40
 * molecule=5 gas=h2 quantity=width form=pade of=m coefficients=0.08228,-0.07411,...
 * molecule=2 gas=he quantity=exponent form=linear of=m beyond=20:0.58 coefficients=0.7207695,-0.0068858
 * molecule=28 gas=h2 quantity=width form=poly-mk clamp=22 clamp-k=22 coefficients=c0,...,c9
 * </pre>
 * Keys: {@code molecule} (molecule number), {@code gas} (a {@link BackgroundGas} name), {@code quantity}
 * ({@code width} | {@code exponent}), {@code form} (a {@link RuleForm} name), {@code of} ({@code m} = |m|, the
 * default, or {@code jlower} = J''), {@code clamp}, {@code clamp-k}, {@code beyond=limit:value},
 * {@code coefficients}. Every file names its published source with one {@code source} line before its rules.
 * A later rule for the same (molecule, gas, quantity) replaces an earlier one, so a user file loaded after the
 * built-in one overrides it.
 */
public final class RuleSet {
    /** Resource holding the built-in rules of Tan et al. 2022. */
    public static final String BUILT_IN_RESOURCE = "tan2022-h2-he-co2.rules";

    private final Map<Long, BroadeningRule> rules;
    private final List<String> sources;

    private RuleSet(Map<Long, BroadeningRule> rules, List<String> sources) {
        this.rules = rules;
        this.sources = sources;
    }

    /** No rules. */
    public static RuleSet empty() {
        return new RuleSet(Map.of(), List.of());
    }

    /** The rules shipped with linewright (Tan et al. 2022, ApJS 262, 40: H2, He and CO2 for CO, CO2, N2O, PH3). */
    public static RuleSet builtIn() {
        try (InputStream in = RuleSet.class.getResourceAsStream(BUILT_IN_RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("missing resource " + BUILT_IN_RESOURCE);
            }
            return parse(in, BUILT_IN_RESOURCE);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Reads a rule file. @throws LineFormatException one located line for a malformed item */
    public static RuleSet load(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            return parse(in, file.toString());
        }
    }

    /** Reads rules from a stream named {@code fileName} in error messages. */
    public static RuleSet parse(InputStream in, String fileName) throws IOException {
        Map<Long, BroadeningRule> rules = new HashMap<>();
        List<String> sources = new ArrayList<>();
        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
        String line;
        long lineNumber = 0;
        while ((line = reader.readLine()) != null) {
            lineNumber++;
            String trimmed = line.strip();
            if (trimmed.isEmpty() || trimmed.startsWith("#")) {
                continue;
            }
            if (trimmed.startsWith("source ") || trimmed.equals("source")) {
                String text = trimmed.substring("source".length()).strip();
                if (text.isEmpty()) {
                    throw new LineFormatException(fileName, lineNumber, 1, line.length(), "source", line,
                            "the published source of the rules after 'source'");
                }
                sources.add(text);
                continue;
            }
            if (sources.isEmpty()) {
                throw new LineFormatException(fileName, lineNumber, 1, line.length(), null, trimmed,
                        "a 'source' line naming the publication before the first rule");
            }
            BroadeningRule rule = parseRule(line, fileName, lineNumber);
            rules.put(key(rule.moleculeId(), rule.gas(), rule.quantity()), rule);
        }
        return new RuleSet(rules, sources);
    }

    /** This set with {@code other}'s rules added, {@code other} winning where both have a rule. */
    public RuleSet overriddenBy(RuleSet other) {
        Map<Long, BroadeningRule> merged = new HashMap<>(rules);
        merged.putAll(other.rules);
        List<String> s = new ArrayList<>(sources);
        s.addAll(other.sources);
        return new RuleSet(merged, s);
    }

    /** The rule for (molecule, gas, quantity), or null. */
    public BroadeningRule rule(int moleculeId, BackgroundGas gas, BroadeningRule.Quantity quantity) {
        return rules.get(key(moleculeId, gas, quantity));
    }

    /** Number of rules. */
    public int size() {
        return rules.size();
    }

    /** The published sources named by the files read. */
    public List<String> sources() {
        return Collections.unmodifiableList(sources);
    }

    private static long key(int moleculeId, BackgroundGas gas, BroadeningRule.Quantity quantity) {
        return ((long) moleculeId << 16) | ((long) gas.ordinal() << 4) | quantity.ordinal();
    }

    private static BroadeningRule parseRule(String line, String file, long lineNumber) {
        Integer molecule = null;
        BackgroundGas gas = null;
        BroadeningRule.Quantity quantity = null;
        RuleForm form = null;
        BroadeningRule.Variable variable = BroadeningRule.Variable.M;
        double clamp = Double.POSITIVE_INFINITY;
        double clampK = Double.POSITIVE_INFINITY;
        double beyondLimit = Double.NaN;
        double beyondValue = Double.NaN;
        double[] coefficients = null;
        int pos = 0;
        int n = line.length();
        while (pos < n) {
            while (pos < n && Character.isWhitespace(line.charAt(pos))) {
                pos++;
            }
            if (pos >= n) {
                break;
            }
            int start = pos;
            while (pos < n && !Character.isWhitespace(line.charAt(pos))) {
                pos++;
            }
            String token = line.substring(start, pos);
            int c0 = start + 1;
            int c1 = pos;
            int eq = token.indexOf('=');
            if (eq <= 0) {
                throw new LineFormatException(file, lineNumber, c0, c1, null, token, "key=value");
            }
            String k = token.substring(0, eq);
            String v = token.substring(eq + 1);
            switch (k) {
                case "molecule":
                    molecule = (int) number(v, file, lineNumber, c0, c1, k, "a molecule number");
                    break;
                case "gas":
                    gas = BackgroundGas.byName(v);
                    if (gas == null) {
                        throw new LineFormatException(file, lineNumber, c0, c1, k, v,
                                "a background gas: air, h2, he, co2, n2, o2, h2o, self");
                    }
                    break;
                case "quantity":
                    if (v.equals("width")) {
                        quantity = BroadeningRule.Quantity.WIDTH;
                    } else if (v.equals("exponent")) {
                        quantity = BroadeningRule.Quantity.EXPONENT;
                    } else {
                        throw new LineFormatException(file, lineNumber, c0, c1, k, v, "width or exponent");
                    }
                    break;
                case "form":
                    form = RuleForm.byLabel(v.toLowerCase(Locale.ROOT));
                    if (form == null) {
                        throw new LineFormatException(file, lineNumber, c0, c1, k, v,
                                "pade, linear, constant or poly-mk");
                    }
                    break;
                case "of":
                    if (v.equals("m")) {
                        variable = BroadeningRule.Variable.M;
                    } else if (v.equals("jlower")) {
                        variable = BroadeningRule.Variable.LOWER_J;
                    } else {
                        throw new LineFormatException(file, lineNumber, c0, c1, k, v, "m or jlower");
                    }
                    break;
                case "clamp":
                    clamp = number(v, file, lineNumber, c0, c1, k, "the largest value of the variable");
                    break;
                case "clamp-k":
                    clampK = number(v, file, lineNumber, c0, c1, k, "the largest value of K'a");
                    break;
                case "beyond": {
                    int colon = v.indexOf(':');
                    if (colon < 0) {
                        throw new LineFormatException(file, lineNumber, c0, c1, k, v, "limit:value");
                    }
                    beyondLimit = number(v.substring(0, colon), file, lineNumber, c0, c1, k, "limit:value");
                    beyondValue = number(v.substring(colon + 1), file, lineNumber, c0, c1, k, "limit:value");
                    break;
                }
                case "coefficients": {
                    String[] parts = v.split(",", -1);
                    coefficients = new double[parts.length];
                    for (int i = 0; i < parts.length; i++) {
                        coefficients[i] = number(parts[i], file, lineNumber, c0, c1, k,
                                "comma-separated numbers");
                    }
                    break;
                }
                default:
                    throw new LineFormatException(file, lineNumber, c0, c1, null, k,
                            "one of molecule, gas, quantity, form, of, clamp, clamp-k, beyond, coefficients");
            }
        }
        String missing = molecule == null ? "molecule" : gas == null ? "gas" : quantity == null ? "quantity"
                : form == null ? "form" : coefficients == null ? "coefficients" : null;
        if (missing != null) {
            throw new LineFormatException(file, lineNumber, 1, line.length(), missing, line.strip(),
                    "a rule with molecule, gas, quantity, form and coefficients");
        }
        if (coefficients.length != form.coefficientCount()) {
            throw new LineFormatException(file, lineNumber, 1, line.length(), "coefficients", line.strip(),
                    form.coefficientCount() + " coefficients for form " + form.label());
        }
        return new BroadeningRule(molecule, gas, quantity, form, variable, clamp, clampK, beyondLimit, beyondValue,
                coefficients);
    }

    private static double number(String text, String file, long line, int c0, int c1, String key, String expected) {
        try {
            double v = Double.parseDouble(text);
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new LineFormatException(file, line, c0, c1, key, text, expected);
        }
    }
}
