package dev.numafit.plan;

import dev.numafit.diag.Diagnostic;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.resource.Resources;
import dev.numafit.shape.WorkerShape;
import java.math.BigDecimal;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * Everything {@link Planner} needs besides the demand: the worker shape and its kubelet
 * allocatable (already computed by the caller), how many such workers one host carries, the
 * spanning shapes used to size oversize pods, and the user's planning options.
 *
 * @param hostProfile the host profile's name; empty for a bare {@code --worker} run
 * @param worker the worker shape pods are packed onto
 * @param allocatable the kubelet's allocatable for that shape before DaemonSets: cpu in
 *     millicores, memory and storage in bytes, {@code pods} = maxPods, extended resources in
 *     counts. A resource absent here has no capacity and is not checked.
 * @param workersPerHost workers of this shape one host carries; empty without a host profile
 * @param spanning larger shapes, smallest first, each with its allocatable (labels {@code
 *     2-nodes}, {@code socket}, {@code host})
 * @param perWorkerExtra demand on every worker that is not in the manifests ({@code
 *     --per-worker}); a {@code pods} amount counts against maxPods
 * @param hostFailures hosts whose loss the plan must survive ({@code --host-failures}): the
 *     worst case over every set of that many hosts
 * @param maxUtilizationPct 1..100: the share of each allocatable amount (except {@code pods}) that
 *     may be used ({@code --max-utilization})
 * @param growth at least 1: multiplies each workload's peak replica count, rounded up ({@code
 *     --growth}); per-pod requests are not scaled
 * @param placement whether to list which pods go on which worker
 * @param notes remarks carried into the plan (what larger nodes leave unused, split advice)
 * @param warnings diagnostics carried into the plan
 * @param placementOptions zones, zone failures and added spread ({@link PlacementOptions#NONE}
 *     for none)
 */
public record PlanInput(
    Optional<String> hostProfile,
    WorkerShape worker,
    Resources allocatable,
    OptionalInt workersPerHost,
    List<SpanningRoom> spanning,
    Resources perWorkerExtra,
    int hostFailures,
    int maxUtilizationPct,
    BigDecimal growth,
    boolean placement,
    List<String> notes,
    List<Diagnostic> warnings,
    PlacementOptions placementOptions) {
  public PlanInput {
    Objects.requireNonNull(placementOptions, "placementOptions");
    Objects.requireNonNull(hostProfile, "hostProfile");
    Objects.requireNonNull(worker, "worker");
    Objects.requireNonNull(allocatable, "allocatable");
    Objects.requireNonNull(workersPerHost, "workersPerHost");
    Objects.requireNonNull(perWorkerExtra, "perWorkerExtra");
    Objects.requireNonNull(growth, "growth");
    spanning = List.copyOf(spanning);
    notes = List.copyOf(notes);
    warnings = List.copyOf(warnings);
    if (workersPerHost.isPresent() && workersPerHost.getAsInt() < 1) {
      throw new IllegalArgumentException(
          "workersPerHost must be >= 1, was " + workersPerHost.getAsInt());
    }
    if (hostFailures < 0) {
      throw new IllegalArgumentException("hostFailures must be >= 0, was " + hostFailures);
    }
    if (maxUtilizationPct < 1 || maxUtilizationPct > 100) {
      throw new IllegalArgumentException(
          "maxUtilizationPct must be 1..100, was " + maxUtilizationPct);
    }
    if (growth.compareTo(BigDecimal.ONE) < 0) {
      throw new IllegalArgumentException("growth must be >= 1, was " + growth.toPlainString());
    }
    for (var e : allocatable.asMap().entrySet()) {
      if (e.getValue() < 0) {
        throw new IllegalArgumentException("allocatable " + e.getKey() + " is negative");
      }
    }
  }

  /** An input without zones, zone failures or added spread. */
  public PlanInput(
      Optional<String> hostProfile,
      WorkerShape worker,
      Resources allocatable,
      OptionalInt workersPerHost,
      List<SpanningRoom> spanning,
      Resources perWorkerExtra,
      int hostFailures,
      int maxUtilizationPct,
      BigDecimal growth,
      boolean placement,
      List<String> notes,
      List<Diagnostic> warnings) {
    this(hostProfile, worker, allocatable, workersPerHost, spanning, perWorkerExtra, hostFailures,
        maxUtilizationPct, growth, placement, notes, warnings, PlacementOptions.NONE);
  }

  /** This input with other placement options. */
  public PlanInput withPlacementOptions(PlacementOptions options) {
    return new PlanInput(hostProfile, worker, allocatable, workersPerHost, spanning, perWorkerExtra,
        hostFailures, maxUtilizationPct, growth, placement, notes, warnings, options);
  }

  /**
   * A bare-worker input with defaults: no host profile, no spanning shapes, no per-worker extra,
   * no host failures, 100% utilization, growth 1, no placement.
   */
  public static PlanInput of(WorkerShape worker, Resources allocatable) {
    return new PlanInput(
        Optional.empty(),
        worker,
        allocatable,
        OptionalInt.empty(),
        List.of(),
        Resources.EMPTY,
        0,
        100,
        BigDecimal.ONE,
        false,
        List.of(),
        List.of());
  }
}
