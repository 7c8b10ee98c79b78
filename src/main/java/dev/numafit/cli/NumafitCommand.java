package dev.numafit.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/** The root command: {@code --help}, {@code --version} and the subcommands. */
@Command(
    name = "numafit",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    usageHelpAutoWidth = false,
    description = {
      "Sizes Kubernetes worker VMs so each fits one NUMA node of its host, from the workload's"
          + " manifests and a host profile."
    },
    subcommands = {
      DemandCommand.class,
      PlanCommand.class,
      CheckCommand.class,
      SnapshotCommand.class,
      ReviewCommand.class,
      CompletionCommand.class,
      ProfileCommand.class,
      CommandLine.HelpCommand.class
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit plan -f manifests-examples/parcel-delivery/ \\",
      "      --host-profile host-profiles/two-socket-one-node-per-socket.yaml",
      "  numafit demand -f manifests-examples/ticket-office/ -o json",
      "  numafit help plan",
      "",
      "Exit codes: 0 done, 2 usage or input error, 3 internal error (see docs/exit-codes.md).",
      "Sizing comes from declared requests: verify a plan against your hardware's documentation"
          + " and a load test."
    })
public final class NumafitCommand implements Callable<Integer> {
  private final Console console;

  @Spec CommandSpec spec;

  NumafitCommand(Console console) {
    this.console = console;
  }

  Console console() {
    return console;
  }

  @Override
  public Integer call() {
    throw new CommandLine.ParameterException(
        spec.commandLine(),
        "missing command (expected one of: "
            + String.join(", ", spec.subcommands().keySet())
            + ")");
  }
}
