package dev.numafit.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code numafit profile}: host profiles from real hardware, checked and explained. */
@Command(
    name = "profile",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    usageHelpAutoWidth = false,
    description = {
      "Captures a host profile from the running host (or from text its tools printed), validates"
          + " profiles, and shows the facts derived from one."
    },
    subcommands = {
      ProfileCaptureCommand.class,
      ProfileValidateCommand.class,
      ProfileShowCommand.class
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit profile capture --out host-profiles/rack-a.yaml",
      "  sudo dmidecode -t 17 | numafit profile capture --dmidecode - --out rack-a.yaml",
      "  numafit profile validate host-profiles/*.yaml",
      "  numafit profile show host-profiles/rack-a.yaml -o json",
      "",
      "Exit codes: 0 done, 2 usage or input error, 3 internal error."
    })
public final class ProfileCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Spec CommandSpec spec;

  Console console() {
    return root.console();
  }

  @Override
  public Integer call() {
    throw new CommandLine.ParameterException(
        spec.commandLine(), "missing command (expected one of: capture, validate, show)");
  }
}
