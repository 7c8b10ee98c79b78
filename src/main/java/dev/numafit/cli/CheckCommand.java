package dev.numafit.cli;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/**
 * {@code numafit check}: the pre-merge gate. picocli wiring only; the rules between options are in
 * {@link CheckSettings}, the work in {@link CheckRun}.
 */
@Command(
    name = "check",
    sortOptions = false,
    usageHelpAutoWidth = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {
      "Checks manifests against the one-node worker (from a host profile, or --worker): pods too"
          + " big for it or for any worker on the host, exclusive CPUs and hugepages beyond it,"
          + " containers without requests, limits far above requests, and the fleet size. With a"
          + " baseline it reports what the change introduced and the change in workers and hosts.",
      "Options may also come from numafit.yaml in the current folder or --config FILE; flags"
          + " given here override them."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit check -f manifests-examples/parcel-delivery/ \\",
      "      --host-profile host-profiles/two-socket-one-node-per-socket.yaml",
      "  numafit check -f rendered/ --worker cpu=16,memory=64Gi --baseline-git origin/main",
      "  numafit check -f rendered/ --host-profile hosts.yaml --fleet-hosts 12 \\",
      "      --host-failures 1 --baseline old-rendered/ -o sarif --out numafit.sarif",
      "",
      "Rules (docs/check-rules.md): pod-exceeds-worker, pod-exceeds-host,"
          + " exclusive-cpus-exceed-worker, hugepages-exceed-worker, missing-request,"
          + " limit-request-ratio, fleet-capacity.",
      "Exit codes: 0 no failing finding, 1 failing findings, 2 usage or input error, 3 internal"
          + " error."
    })
public final class CheckCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Mixin ManifestOptions manifests = new ManifestOptions();

  @Option(
      names = "--host-profile",
      paramLabel = "FILE",
      description = "Host profile whose one-node worker is checked against (docs/host-profile.md).")
  List<Path> hostProfiles = new ArrayList<>();

  @Option(
      names = "--worker",
      paramLabel = "cpu=N,memory=Q[,res=Q...]",
      description = "Worker capacity given directly, e.g. cpu=16,memory=64Gi.")
  String worker;

  @Mixin KubeletOptions kubelet = new KubeletOptions();

  @Option(names = "--host-failures", paramLabel = "K",
      description = "Add K whole hosts of headroom (default: 0).")
  int hostFailures;

  @Option(names = "--max-utilization", paramLabel = "PCT",
      description = "Fill each worker's room only to PCT percent (default: 100).")
  int maxUtilization = 100;

  @Option(names = "--cpu-overcommit", paramLabel = "R",
      description = "Let a host carry R vCPUs per core (default: 1).")
  BigDecimal cpuOvercommit = BigDecimal.ONE;

  @Option(names = "--vcpu-per-thread", description = "Count hardware threads, not cores, as vCPUs.")
  boolean vcpuPerThread;

  @Option(names = "--include-custom",
      description = "Check custom resources that embed pod templates too (a guess, flagged).")
  boolean includeCustom;

  @Option(names = "--fleet-hosts", paramLabel = "N",
      description = "Hosts the fleet has; more needed is a fleet-capacity finding.")
  Integer fleetHosts;

  @Option(names = "--fail-on", paramLabel = "RULE[,RULE...]", split = ",",
      description = "Rules whose findings fail the gate, or none (default: the oversize and"
          + " unschedulable rules, and fleet-capacity when --fleet-hosts is given).")
  List<String> failOn;

  @Option(names = "--fail-on-existing",
      description = "Fail on findings already present in the baseline too, not only new ones.")
  boolean failOnExisting;

  @Option(names = "--limit-ratio", paramLabel = "R",
      description = "Warn when a limit is more than R times its request (default: 4).")
  BigDecimal limitRatio;

  @Option(names = "--baseline", paramLabel = "PATH",
      description = "The same manifests before the change (file or folder). Repeatable.")
  List<String> baseline = new ArrayList<>();

  @Option(names = "--baseline-git", paramLabel = "REV",
      description = "Read the -f paths as they were at git revision REV as the baseline.")
  String baselineGit;

  @Option(names = {"-o", "--output"}, paramLabel = "FORMAT",
      description = "Output format: text, json, markdown, sarif, junit or html (default: text).")
  String output = "text";

  @Option(names = "--out", paramLabel = "FILE",
      description = "Write the report to FILE (via a temporary file, then renamed).")
  Path out;

  @Option(names = "--config", paramLabel = "FILE",
      description = "Read options from FILE (default: numafit.yaml in the current folder).")
  Path config;

  @Option(names = "--verbose", description = "Print a stack trace with an internal error.")
  boolean verbose;

  @Override
  public Integer call() throws Exception {
    CheckSettings settings = CheckSettings.check(this);
    return CheckRun.run(settings, root.console());
  }
}
