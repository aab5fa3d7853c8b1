package org.linewright.reference.report;

/** Escaping and number formatting shared by the report writers (CSV after RFC 4180, JSON after RFC 8259). */
final class Cells {
    private Cells() {
    }

    /** A number as Java prints it (shortest round-trip form); empty for NaN. */
    static String csvNumber(double v) {
        return Double.isNaN(v) ? "" : Double.toString(v);
    }

    /** A CSV field, quoted when it holds a comma, quote or line break (RFC 4180). */
    static String csv(String s) {
        if (s == null) {
            return "";
        }
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }

    /** A JSON number; NaN and infinities (not representable in JSON) become null. */
    static String jsonNumber(double v) {
        return Double.isNaN(v) || Double.isInfinite(v) ? "null" : Double.toString(v);
    }

    /** A JSON string literal (RFC 8259 escaping). */
    static String json(String s) {
        if (s == null) {
            return "null";
        }
        StringBuilder b = new StringBuilder(s.length() + 2).append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> b.append("\\\"");
                case '\\' -> b.append("\\\\");
                case '\n' -> b.append("\\n");
                case '\r' -> b.append("\\r");
                case '\t' -> b.append("\\t");
                default -> {
                    if (c < 0x20) {
                        b.append(String.format("\\u%04x", (int) c));
                    } else {
                        b.append(c);
                    }
                }
            }
        }
        return b.append('"').toString();
    }
}
