package dev.numafit.cli;

import dev.numafit.profile.HostProfileReader;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.report.ReportFormat;
import dev.numafit.report.profile.ProfileFacts;
import dev.numafit.report.profile.ProfileFactsWriter;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code numafit profile show}: the facts derived from one host profile, per node, and the
 * one-node worker with the kubelet's default reservations.
 */
@Command(
    name = "show",
    sortOptions = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    usageHelpAutoWidth = false,
    description = {
      "Shows what numafit derives from a host profile: per node cores, threads, memory, peak"
          + " memory bandwidth and distances; the hypervisor reserve; the one-node worker and its"
          + " allocatable with default kubelet reservations."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit profile show host-profiles/two-socket-one-node-each.yaml",
      "  numafit profile show rack-a.yaml -o json --out rack-a.json",
      "",
      "Exit codes: 0 done, 2 usage or input error."
    })
public final class ProfileShowCommand implements Callable<Integer> {
  @ParentCommand ProfileCommand parent;

  @Mixin CommonOptions common = new CommonOptions();

  @Parameters(index = "0", paramLabel = "FILE", description = "The host profile to show.")
  Path file;

  @Override
  public Integer call() throws Exception {
    common.requireFormat("profile show", ReportFormat.TEXT, ReportFormat.JSON);
    Console console = parent.console();
    ProfileLoad load = new HostProfileReader().read(file);
    ProfileFacts facts = ProfileFacts.of(file.toString(), load);
    String report;
    if (common.output == ReportFormat.JSON) {
      report = ProfileFactsWriter.json(facts);
    } else {
      load.warnings().forEach(console::report);
      report = ProfileFactsWriter.text(facts);
    }
    ReportOutput.write(report, Optional.ofNullable(common.out), console);
    return ExitCode.OK.code();
  }
}
