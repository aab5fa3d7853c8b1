package org.linewright.cli;

import picocli.AutoComplete;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/** Prints a bash completion script for every command and option, generated from the command model. */
@Command(name = "completion",
        mixinStandardHelpOptions = true,
        description = "Print a bash (and zsh, via bashcompinit) completion script for linewright.",
        footer = {
            "",
            "Example (completion in the current shell, then permanently):",
            "  source <(./linewright completion)",
            "  ./linewright completion > ~/.local/share/bash-completion/completions/linewright"
        })
public final class CompletionCommand implements Runnable {
    @Spec
    private CommandSpec spec;

    @Override
    public void run() {
        String script = AutoComplete.bash("linewright", spec.root().commandLine());
        spec.commandLine().getOut().print(script);
        spec.commandLine().getOut().flush();
    }
}
