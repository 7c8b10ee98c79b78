package dev.numafit.cli;

import java.util.concurrent.Callable;
import picocli.AutoComplete;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code numafit completion}: prints the bash completion script picocli generates. */
@Command(
    name = "completion",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = "Prints a bash (and zsh) completion script for numafit.",
    footerHeading = "%nExamples:%n",
    footer = {
      "  source <(numafit completion)",
      "  numafit completion > /etc/bash_completion.d/numafit"
    })
public final class CompletionCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    root.console().out().print(AutoComplete.bash("numafit", spec.root().commandLine()));
    return ExitCode.OK.code();
  }
}
