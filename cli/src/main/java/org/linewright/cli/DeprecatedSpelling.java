package org.linewright.cli;

import picocli.CommandLine.Model.CommandSpec;

/**
 * The one wording of the note a renamed option's old spelling prints (DEVELOPERS.md, "Naming"): one line on the
 * command's error stream, so that it reaches the same place as the command's other messages.
 */
final class DeprecatedSpelling {
    private DeprecatedSpelling() {
    }

    /**
     * @param spec        the command (or, in a mixin, the command it is mixed into)
     * @param oldSpelling the option as the user wrote it, e.g. {@code --tolerance}
     * @param replacement the option to write instead
     */
    static void note(CommandSpec spec, String oldSpelling, String replacement) {
        spec.commandLine().getErr().println("note: " + oldSpelling + " is deprecated, write " + replacement);
        spec.commandLine().getErr().flush();
    }
}
