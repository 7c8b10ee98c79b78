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

/** {@code numafit plan}: picocli wiring only; rules in {@link PlanOptions}, work in {@link Pipeline}. */
@Command(
    name = "plan",
    sortOptions = false,
    usageHelpAutoWidth = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {
      "Sizes worker VMs that fit one NUMA node of each host profile, packs the workload's pods at"
          + " peak onto them, and reports workers and hosts needed, oversize pods and"
          + " utilization.",
      "Options may also come from numafit.yaml in the current folder or --config FILE; flags"
          + " given here override them."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit plan -f manifests-examples/parcel-delivery/ \\",
      "      --host-profile host-profiles/two-socket-one-node-per-socket.yaml",
      "  numafit plan -f app.yaml -f infra/ --worker cpu=16,memory=64Gi -o json",
      "  render-manifests | numafit plan -f - --worker cpu=8,memory=32Gi",
      "  numafit plan -f manifests/ --host-profile a.yaml --host-profile b.yaml \\",
      "      --host-failures 1 --max-utilization 80 --kubelet-config out/",
      "  numafit plan -f manifests-examples/cold-chain/manifests/ \\",
      "      --pools manifests-examples/cold-chain/pools.yaml",
      "",
      "Exit codes: 0 done (oversize pods are listed, not an error), 2 usage or input"
          + " error, 3 internal error."
    })
public final class PlanCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Mixin CommonOptions common = new CommonOptions();

  @Mixin ManifestOptions manifests = new ManifestOptions();

  @Option(
      names = "--host-profile",
      paramLabel = "FILE",
      description = "Host profile (see docs/host-profile.md). Repeatable: one plan each, compared.")
  List<Path> hostProfiles = new ArrayList<>();

  @Option(
      names = "--pools",
      paramLabel = "FILE",
      description =
          "Worker pools with labels, taints and shapes (see docs/pools.md): workloads go to the"
              + " first pool their nodeSelector, node affinity and tolerations allow; one plan per"
              + " pool.")
  Path pools;

  @Option(
      names = "--worker",
      paramLabel = "cpu=N,memory=Q[,res=Q...]",
      description =
          "Worker capacity given directly, e.g. cpu=16,memory=64Gi. With --host-profile it is"
              + " placed on that host; without, the plan counts workers, not hosts.")
  String worker;

  @Mixin KubeletOptions kubelet = new KubeletOptions();

  @Option(
      names = "--host-failures",
      paramLabel = "K",
      description =
          "Size so that losing any K hosts (the worst K) leaves room for every pod"
              + " (default: 0).")
  int hostFailures;

  @Option(
      names = "--effort",
      paramLabel = "N",
      description =
          "Packing effort: N times the default step budget; 0 runs only the first"
              + " first-fit-decreasing pass (default: 1). With --exact, also N times the"
              + " default search-node limit (2,000,000). Same input and N, same plan.")
  int effort = 1;

  @Option(
      names = "--exact",
      description =
          "Search for the fewest workers and prove it, or say the effort limit ran out first."
              + " Rule-free inputs of at most 500 pods to pack only (see"
              + " docs/how-numbers-are-computed.md).")
  boolean exact;

  @Option(
      names = "--zones",
      paramLabel = "Z",
      description = "Spread hosts evenly over Z zones; workers carry the zone label (default: 1).")
  int zones = 1;

  @Option(
      names = "--zone-failures",
      paramLabel = "0|1",
      description = "1: size so that losing a whole zone leaves room for every pod (default: 0).")
  int zoneFailures;

  @Option(
      names = "--spread-replicas-across",
      paramLabel = "hosts|workers|zones",
      description =
          "Spread the replicas of every workload evenly (maxSkew 1) across physical hosts,"
              + " workers or zones.")
  String spreadReplicasAcross;

  @Option(
      names = "--max-utilization",
      paramLabel = "PCT",
      description = "Fill each worker's room only to PCT percent (default: 100).")
  int maxUtilization = 100;

  @Option(
      names = "--growth",
      paramLabel = "FACTOR",
      description = "Multiply replica counts by FACTOR, rounded up (default: 1).")
  BigDecimal growth = BigDecimal.ONE;

  @Option(
      names = "--cpu-overcommit",
      paramLabel = "R",
      description =
          "Let a host carry R vCPUs per core (default: 1; above 1 NUMA locality suffers).")
  BigDecimal cpuOvercommit = BigDecimal.ONE;

  @Option(
      names = "--vcpu-per-thread",
      description = "Count hardware threads, not cores, as vCPUs.")
  boolean vcpuPerThread;

  @Option(
      names = "--placement",
      description = "List which pods go on which worker.")
  boolean placement;

  @Option(
      names = "--include-custom",
      description = "Size custom resources that embed pod templates (a guess, flagged).")
  boolean includeCustom;

  @Option(
      names = "--skip-invalid",
      description = "Skip invalid documents (listed) instead of failing with exit code 2.")
  boolean skipInvalid;

  @Option(
      names = "--kubelet-config",
      paramLabel = "DIR",
      description = "Write a KubeletConfiguration per plan into DIR, matching what it assumed.")
  Path kubeletConfig;

  @Option(
      names = "--config",
      paramLabel = "FILE",
      description = "Read options from FILE (default: numafit.yaml in the current folder).")
  Path config;

  @Override
  public Integer call() throws Exception {
    PlanOptions options = PlanOptions.check(this);
    return Pipeline.plan(options, root.console());
  }
}
