package org.linewright.ingest.text;

/**
 * The one place where offending text from the user's input is made fit for a one-line error message: every
 * character that is not printable — control characters (C0, DEL, C1), line and paragraph separators, format
 * characters, unpaired surrogates, unassigned code points — is written as an escape ({@code \n}, {@code \r},
 * {@code \t}, {@code \x01}, {@code \u2028}), so a message never spans lines nor moves the terminal's cursor; the
 * replacement character U+FFFD (what invalid UTF-8 bytes decode to) shows as {@code \uFFFD}. Long text is cut
 * after {@value #MAX_OFFENDING_CHARS} characters with a note of how much was left out.
 */
public final class OffendingText {
    /** Characters of offending text shown in a message before it is cut. */
    public static final int MAX_OFFENDING_CHARS = 80;

    private OffendingText() {
    }

    /** {@code text} escaped and cut to {@value #MAX_OFFENDING_CHARS} characters, in double quotes. */
    public static String quote(String text) {
        return '"' + escape(text, MAX_OFFENDING_CHARS) + '"';
    }

    /** {@code text} escaped and cut to {@value #MAX_OFFENDING_CHARS} characters ("null" for null). */
    public static String escape(String text) {
        return escape(text, MAX_OFFENDING_CHARS);
    }

    /**
     * {@code text} with every non-printable character escaped, cut after {@code maxChars} characters of the
     * original (an escape is never split) with "... (N more characters)" appended; "null" for null.
     */
    public static String escape(String text, int maxChars) {
        if (text == null) {
            return "null";
        }
        StringBuilder sb = new StringBuilder(Math.min(text.length(), maxChars) + 16);
        int shown = 0;
        int i = 0;
        while (i < text.length()) {
            if (shown >= maxChars) {
                sb.append("... (").append(text.codePointCount(i, text.length())).append(" more characters)");
                break;
            }
            int cp = text.codePointAt(i);
            i += Character.charCount(cp);
            shown++;
            appendEscaped(sb, cp);
        }
        return sb.toString();
    }

    /** True when {@code text} holds no character that {@link #escape} would change (length aside). */
    public static boolean isPrintable(String text) {
        return text.codePoints().allMatch(OffendingText::printable);
    }

    private static void appendEscaped(StringBuilder sb, int cp) {
        switch (cp) {
            case '\n' -> sb.append("\\n");
            case '\r' -> sb.append("\\r");
            case '\t' -> sb.append("\\t");
            case '\\' -> sb.append('\\');
            default -> {
                if (printable(cp)) {
                    sb.appendCodePoint(cp);
                } else if (cp < 0x100) {
                    sb.append(String.format("\\x%02X", cp));
                } else if (cp < 0x10000) {
                    sb.append(String.format("\\u%04X", cp));
                } else {
                    sb.append(String.format("\\U%08X", cp));
                }
            }
        }
    }

    private static boolean printable(int cp) {
        if (cp == 0xFFFD) {
            return false;
        }
        return switch (Character.getType(cp)) {
            case Character.CONTROL, Character.FORMAT, Character.LINE_SEPARATOR, Character.PARAGRAPH_SEPARATOR,
                    Character.SURROGATE, Character.UNASSIGNED, Character.PRIVATE_USE -> false;
            default -> true;
        };
    }
}
