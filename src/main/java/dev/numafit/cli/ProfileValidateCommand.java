package dev.numafit.cli;

import dev.numafit.diag.InputException;
import dev.numafit.profile.HostProfileReader;
import dev.numafit.profile.ProfileLoad;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code numafit profile validate}: the same checks {@code plan} applies to a host profile, as a
 * command for CI. Every file is checked; exit 0 when all are valid, 2 when any is not.
 */
@Command(
    name = "validate",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    usageHelpAutoWidth = false,
    description = {
      "Checks host profiles as plan reads them. Prints \"FILE: valid\" per valid file on standard"
          + " output; errors and warnings as file:line: messages on standard error."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit profile validate host-profiles/*.yaml",
      "",
      "Exit codes: 0 every file valid (warnings allowed), 2 any file invalid or a usage error."
    })
public final class ProfileValidateCommand implements Callable<Integer> {
  @ParentCommand ProfileCommand parent;

  @Parameters(arity = "1..*", paramLabel = "FILE", description = "Host profile files.")
  List<Path> files;

  @Option(names = "--verbose", description = "Print a stack trace with an internal error.")
  boolean verbose;

  @Override
  public Integer call() {
    Console console = parent.console();
    boolean allValid = true;
    for (Path file : files) {
      try {
        ProfileLoad load = new HostProfileReader().read(file);
        load.warnings().forEach(console::report);
        console.out().println(
            file + ": valid"
                + (load.warnings().isEmpty()
                    ? ""
                    : " (" + load.warnings().size()
                        + (load.warnings().size() == 1 ? " warning)" : " warnings)")));
      } catch (InputException e) {
        e.diagnostics().forEach(console::report);
        console.out().println(file + ": invalid");
        allValid = false;
      }
    }
    console.out().flush();
    return allValid ? ExitCode.OK.code() : ExitCode.USAGE_OR_INPUT.code();
  }
}
