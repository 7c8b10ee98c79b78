package dev.numafit.cli;

import dev.numafit.demand.PlacementRules;
import dev.numafit.plan.PlacementOptions;
import dev.numafit.report.ReportFormat;
import dev.numafit.resource.Resources;
import dev.numafit.shape.KubeletReserve;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;

/**
 * The options of {@code numafit plan} after every cross-option rule was checked (see {@link
 * #check}). Amounts are integers in Kubernetes units: cpu in millicores, the rest in bytes or
 * counts.
 *
 * @param files manifest paths as given ({@code -} is standard input)
 * @param hostProfiles host-profile files, one plan each
 * @param worker the --worker capacity (cpu, memory and extras), when given
 * @param reserve what the kubelet keeps on each worker
 * @param perWorker --per-worker demand on every worker
 * @param maxUtilizationPct 1..100, the share of the room the packing may fill
 * @param growth factor ≥ 1 applied to replica counts
 * @param cpuOvercommit vCPUs per physical core (or thread), ≥ 1
 * @param kubeletConfigDir where to write KubeletConfiguration files, when asked
 * @param out the report file, when not standard output
 * @param placementOptions --zones, --zone-failures and --spread-replicas-across
 * @param effort --effort: the packer's step budget in multiples of the default, 0..1000 (with
 *     --exact, also the search-node limit in multiples of its default)
 * @param pools --pools: the WorkerPools file, when given
 * @param exact --exact: prove the minimum worker count (rule-free inputs, at most {@link
 *     dev.numafit.plan.Planner#EXACT_MAX_PODS} pods to pack)
 */
public record PlanOptions(
    List<String> files,
    List<Path> hostProfiles,
    Optional<Resources> worker,
    KubeletReserve reserve,
    Resources perWorker,
    ReplicasOption replicas,
    int hostFailures,
    int maxUtilizationPct,
    BigDecimal growth,
    BigDecimal cpuOvercommit,
    boolean vcpuPerThread,
    boolean placement,
    boolean includeCustom,
    boolean skipInvalid,
    Optional<Path> kubeletConfigDir,
    ReportFormat format,
    Optional<Path> out,
    PlacementOptions placementOptions,
    int effort,
    Optional<Path> pools,
    boolean exact) {
  public PlanOptions {
    Objects.requireNonNull(pools, "pools");
    Objects.requireNonNull(placementOptions, "placementOptions");
    files = List.copyOf(files);
    hostProfiles = List.copyOf(hostProfiles);
    Objects.requireNonNull(worker, "worker");
    Objects.requireNonNull(reserve, "reserve");
    Objects.requireNonNull(perWorker, "perWorker");
    Objects.requireNonNull(replicas, "replicas");
    Objects.requireNonNull(growth, "growth");
    Objects.requireNonNull(cpuOvercommit, "cpuOvercommit");
    Objects.requireNonNull(kubeletConfigDir, "kubeletConfigDir");
    Objects.requireNonNull(format, "format");
    Objects.requireNonNull(out, "out");
  }

  /**
   * Checks every rule that involves more than one option, or a value picocli cannot judge, and
   * builds the options. All broken rules are reported together.
   *
   * @throws UsageException naming each broken rule in one sentence
   */
  static PlanOptions check(PlanCommand c) {
    List<String> problems = new ArrayList<>();
    if (c.manifests.files.isEmpty()) {
      problems.add("plan needs at least one -f/--filename (a file, a folder, or - for standard"
          + " input)");
    }
    if (c.manifests.files.stream().filter("-"::equals).count() > 1) {
      problems.add("-f - (standard input) can be given only once");
    }
    boolean pools = c.pools != null;
    if (c.hostProfiles.isEmpty() && c.worker == null && !pools) {
      problems.add("plan needs --host-profile or --worker");
    }
    if (pools && c.hostProfiles.size() > 1) {
      problems.add("--pools takes at most one --host-profile (the pools' default); name other"
          + " host profiles in the pools file");
    }
    Optional<Resources> worker = Optional.empty();
    if (c.worker != null) {
      worker = parse("--worker", c.worker, problems, false);
      worker.ifPresent(
          w -> {
            if (w.get(Resources.CPU) <= 0 || w.get(Resources.MEMORY) <= 0) {
              problems.add("--worker needs cpu= and memory= above zero, e.g. --worker"
                  + " cpu=16,memory=64Gi");
            } else if (w.get(Resources.CPU) % 1000 != 0) {
              problems.add("--worker cpu= must be whole vCPUs, e.g. cpu=16");
            }
            if (w.get(Resources.PODS) != 0) {
              problems.add("--worker takes no pods=; use --max-pods");
            }
          });
    }
    boolean noReserve = false;
    if (c.kubelet.kubeletReserve != null) {
      if (c.kubelet.kubeletReserve.equals("none")) {
        noReserve = true;
      } else if (!c.kubelet.kubeletReserve.equals("default")) {
        problems.add("--kubelet-reserve takes none or default, not \"" + c.kubelet.kubeletReserve + "\"");
      }
    }
    if (noReserve
        && (c.kubelet.kubeReserved != null || c.kubelet.systemReserved != null || c.kubelet.evictionHard != null)) {
      problems.add("--kubelet-reserve none cannot be combined with --kube-reserved,"
          + " --system-reserved or --eviction-hard");
    }
    Optional<Resources> kube =
        c.kubelet.kubeReserved == null
            ? Optional.empty()
            : parse("--kube-reserved", c.kubelet.kubeReserved, problems, false);
    Resources system =
        c.kubelet.systemReserved == null
            ? Resources.EMPTY
            : parse("--system-reserved", c.kubelet.systemReserved, problems, false)
                .orElse(Resources.EMPTY);
    // The kubelet's defaults (memory.available 100Mi, nodefs.available 10%) hold until
    // --eviction-hard is given; then, as in the kubelet, only the thresholds given apply (K12).
    KubeletReserve defaults = KubeletReserve.defaults();
    Resources eviction = defaults.evictionHard();
    SortedMap<String, BigDecimal> evictionPercent = defaults.evictionHardPercent();
    if (c.kubelet.evictionHard != null) {
      try {
        ResourceArgs.Eviction e = ResourceArgs.parseEviction(c.kubelet.evictionHard);
        eviction = e.amounts();
        evictionPercent = e.percent();
      } catch (IllegalArgumentException ex) {
        problems.add("--eviction-hard " + ex.getMessage());
      }
    }
    int maxPods = KubeletReserve.DEFAULT_MAX_PODS;
    if (c.kubelet.maxPods != null) {
      if (c.kubelet.maxPods < 1) {
        problems.add("--max-pods must be at least 1, got " + c.kubelet.maxPods);
      } else {
        maxPods = c.kubelet.maxPods;
      }
    }
    KubeletReserve reserve =
        noReserve
            ? KubeletReserve.none(maxPods)
            : new KubeletReserve(kube, system, eviction, maxPods, evictionPercent);
    Resources perWorker =
        c.kubelet.perWorker == null
            ? Resources.EMPTY
            : parse("--per-worker", c.kubelet.perWorker, problems, true).orElse(Resources.EMPTY);
    if (c.hostFailures < 0) {
      problems.add("--host-failures must be 0 or more, got " + c.hostFailures);
    }
    if (c.hostFailures > 0 && c.hostProfiles.isEmpty() && !pools) {
      problems.add("--host-failures needs --host-profile (without one, plan counts workers,"
          + " not hosts)");
    }
    if (c.effort < 0 || c.effort > 1000) {
      problems.add("--effort must be from 0 to 1000 (multiples of the default step budget), got "
          + c.effort);
    }
    if (c.zones < 1) {
      problems.add("--zones must be 1 or more, got " + c.zones);
    }
    if (c.zoneFailures < 0 || c.zoneFailures > 1) {
      problems.add("--zone-failures takes 0 or 1, got " + c.zoneFailures);
    } else if (c.zoneFailures == 1 && c.zones < 2) {
      problems.add("--zone-failures 1 needs --zones 2 or more");
    }
    if (c.zoneFailures > 0 && c.hostProfiles.isEmpty() && !pools) {
      problems.add("--zone-failures needs --host-profile (without one, plan counts workers,"
          + " not hosts)");
    }
    Optional<String> spreadKey = Optional.empty();
    if (c.spreadReplicasAcross != null) {
      switch (c.spreadReplicasAcross) {
        case "hosts" -> spreadKey = Optional.of(PlacementRules.HOST_KEY);
        case "workers" -> spreadKey = Optional.of(PlacementRules.HOSTNAME_KEY);
        case "zones" -> spreadKey = Optional.of(PlacementRules.ZONE_KEY);
        default -> problems.add("--spread-replicas-across takes hosts, workers or zones, not \""
            + c.spreadReplicasAcross + "\"");
      }
    }
    if (c.maxUtilization < 1 || c.maxUtilization > 100) {
      problems.add("--max-utilization must be a percentage from 1 to 100, got "
          + c.maxUtilization);
    }
    if (c.growth.compareTo(BigDecimal.ONE) < 0) {
      problems.add("--growth must be 1 or more (it multiplies replica counts), got "
          + c.growth.toPlainString());
    }
    if (c.cpuOvercommit.compareTo(BigDecimal.ONE) < 0) {
      problems.add("--cpu-overcommit must be 1 or more (vCPUs per core), got "
          + c.cpuOvercommit.toPlainString());
    }
    if (c.hostProfiles.isEmpty() && !pools
        && (c.vcpuPerThread || c.cpuOvercommit.compareTo(BigDecimal.ONE) != 0)) {
      problems.add("--vcpu-per-thread and --cpu-overcommit need --host-profile (they change how"
          + " a host's cores become vCPUs)");
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
    return new PlanOptions(
        c.manifests.files,
        c.hostProfiles,
        worker,
        reserve,
        perWorker,
        c.manifests.replicas,
        c.hostFailures,
        c.maxUtilization,
        c.growth,
        c.cpuOvercommit,
        c.vcpuPerThread,
        c.placement,
        c.includeCustom,
        c.skipInvalid,
        Optional.ofNullable(c.kubeletConfig),
        c.common.output,
        Optional.ofNullable(c.common.out),
        new PlacementOptions(
            c.zones, c.zoneFailures == 1 && c.zones >= 2 ? 1 : 0, spreadKey),
        c.effort,
        Optional.ofNullable(c.pools),
        c.exact);
  }

  private static Optional<Resources> parse(
      String option, String value, List<String> problems, boolean podsAllowed) {
    try {
      Resources r = ResourceArgs.parse(value);
      if (!podsAllowed && r.get(Resources.PODS) != 0 && !option.equals("--worker")) {
        problems.add(option + " takes no pods=");
      }
      return Optional.of(r);
    } catch (IllegalArgumentException ex) {
      problems.add(option + " " + ex.getMessage());
      return Optional.empty();
    }
  }
}
