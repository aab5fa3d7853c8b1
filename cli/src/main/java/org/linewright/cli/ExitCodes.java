package org.linewright.cli;

/** The exit codes of the {@code linewright} command, shown in its help. */
public final class ExitCodes {
    /** The command did what was asked. */
    public static final int OK = 0;
    /** A check ran and found problems (for example a verification that a line list fails). */
    public static final int CHECK_FOUND_PROBLEMS = 1;
    /**
     * Bad input: a malformed file, a bad option value, an unknown option, a file that is missing or cannot be
     * read or written.
     */
    public static final int BAD_INPUT = 2;
    /** A fault of the program itself; please report it with the output of {@code --debug}. */
    public static final int INTERNAL_ERROR = 3;

    private ExitCodes() {
    }
}
