package org.linewright.cli;

/**
 * The options every command accepts ({@code --debug}, {@code --quiet}), declared once on the root command and
 * inherited by the subcommands; whichever command they are written after, they land here.
 */
public final class GlobalOptions {
    private boolean debug;
    private boolean quiet;

    /** @return true when stack traces should be shown with error messages */
    public boolean debug() {
        return debug;
    }

    /** @return true when progress bars and informational messages should be suppressed */
    public boolean quiet() {
        return quiet;
    }

    void setDebug(boolean debug) {
        this.debug = debug;
    }

    void setQuiet(boolean quiet) {
        this.quiet = quiet;
    }
}
