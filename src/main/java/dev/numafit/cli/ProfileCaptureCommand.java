package dev.numafit.cli;

import dev.numafit.capture.CapturedHost;
import dev.numafit.capture.ProfileCapture;
import dev.numafit.capture.ProfileWriter;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/**
 * {@code numafit profile capture}: reads the host's topology from sysfs (or an lscpu -p file) and
 * its memory modules from dmidecode text, and writes a host profile with the source of every
 * value and what is to be confirmed.
 */
@Command(
    name = "capture",
    sortOptions = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    usageHelpAutoWidth = false,
    description = {
      "Writes a host profile from the host itself: NUMA nodes, CPUs, memory per node, distances"
          + " and hugepages from sysfs; memory modules from the output of dmidecode -t 17."
          + " Values a capture cannot know (hypervisor reserve, per-VM overhead, and the channel"
          + " population without SMBIOS data) get a documented default marked \"to confirm\"."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit profile capture --out rack-a.yaml",
      "  sudo dmidecode -t 17 > dimms.txt; numafit profile capture --dmidecode dimms.txt",
      "  numafit profile capture --sysfs-root /mnt/copy-of-host --dmidecode dimms.txt",
      "  numafit profile capture --lscpu cpus.txt --dmidecode dimms.txt",
      "",
      "Exit codes: 0 done (warnings on standard error), 2 usage or input error."
    })
public final class ProfileCaptureCommand implements Callable<Integer> {
  @ParentCommand ProfileCommand parent;

  @Option(
      names = "--sysfs-root",
      paramLabel = "DIR",
      description =
          "Read sys/devices/system/{node,cpu} under DIR (default: /, the running host).")
  Path sysfsRoot;

  @Option(
      names = "--dmidecode",
      paramLabel = "FILE|-",
      description =
          "Output of dmidecode -t 17 (SMBIOS memory devices), or - for standard input.")
  String dmidecode;

  @Option(
      names = "--lscpu",
      paramLabel = "FILE",
      description =
          "Output of lscpu -p, used for the CPUs instead of sysfs (memory then comes from"
              + " --dmidecode, or from --sysfs-root when given).")
  Path lscpu;

  @Option(
      names = "--name",
      paramLabel = "NAME",
      description = "The profile's metadata.name (default: captured-host).")
  String name = "captured-host";

  @Option(
      names = "--out",
      paramLabel = "FILE",
      description =
          "Write the profile to FILE instead of standard output (via a temporary file, then"
              + " renamed).")
  Path out;

  @Option(names = "--verbose", description = "Print a stack trace with an internal error.")
  boolean verbose;

  @Override
  public Integer call() throws Exception {
    List<String> problems = new ArrayList<>();
    if (name.isBlank() || !name.matches("[A-Za-z0-9][A-Za-z0-9._-]*")) {
      problems.add(
          "--name must be letters, digits, '.', '_' or '-', starting with a letter or digit; got \""
              + name + "\"");
    }
    if (dmidecode != null && dmidecode.isBlank()) {
      problems.add("--dmidecode needs a file name or - for standard input");
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
    Console console = parent.console();
    CapturedHost host =
        ProfileCapture.capture(
            new ProfileCapture.Request(
                Optional.ofNullable(sysfsRoot),
                Optional.ofNullable(dmidecode),
                Optional.ofNullable(lscpu)),
            console.in());
    String text;
    try {
      text = ProfileWriter.write(host, name);
    } catch (IllegalArgumentException e) {
      throw new InputException(Diagnostic.error(null, e.getMessage()));
    }
    host.warnings().forEach(console::report);
    ReportOutput.write(text, Optional.ofNullable(out), console);
    return ExitCode.OK.code();
  }
}
