package dev.numafit.plan;

import dev.numafit.diag.Diagnostic;
import dev.numafit.resource.Resources;
import dev.numafit.shape.WorkerShape;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedMap;

/**
 * The sizing result for one host profile (or one --worker shape).
 *
 * @param hostProfile the profile's name, empty for a bare --worker run
 * @param worker the worker shape the workload is packed onto
 * @param allocatable the kubelet's allocatable for that shape, before DaemonSets ({@code pods}
 *     included)
 * @param perWorkerDemand DaemonSet pods plus --per-worker demand, taken from every worker
 * @param room what is left for packed pods on each worker, after --max-utilization scaling
 * @param workersPerHost workers of this shape one host carries; empty without a host profile
 * @param workersNeeded workers the packing used
 * @param lowerBound no packing can use fewer workers than this
 * @param hostsNeeded hosts for those workers, sized to survive the failures asked for; empty
 *     without a host profile
 * @param utilization per resource, requested / allocatable over all workers, 4 decimals
 * @param bindingResource the resource that runs out first
 * @param placement workers and their pods, only when asked for
 * @param unchecked resources requested but with no capacity given, so not checked
 * @param notes human-readable remarks (what larger nodes leave unused, split advice)
 * @param warnings diagnostics raised while planning
 * @param hostsNeededWithoutFailures hosts needed when no host or zone is lost; present only when
 *     the plan was sized for failures ({@code hostsNeeded} then includes the headroom)
 * @param exact how the exact search ended, present only for {@code plan --exact}; then {@code
 *     workersNeeded} is its best packing and {@code lowerBound} its bound
 */
public record Plan(
    Optional<String> hostProfile,
    WorkerShape worker,
    Resources allocatable,
    Resources perWorkerDemand,
    Resources room,
    OptionalInt workersPerHost,
    int workersNeeded,
    int lowerBound,
    OptionalInt hostsNeeded,
    List<Oversize> oversize,
    SortedMap<String, Double> utilization,
    String bindingResource,
    Optional<List<WorkerPlacement>> placement,
    List<String> unchecked,
    List<String> notes,
    List<Diagnostic> warnings,
    OptionalInt hostsNeededWithoutFailures,
    Optional<ExactSearch> exact) {
  public Plan {
    java.util.Objects.requireNonNull(hostsNeededWithoutFailures, "hostsNeededWithoutFailures");
    java.util.Objects.requireNonNull(exact, "exact");
    oversize = List.copyOf(oversize);
    utilization = java.util.Collections.unmodifiableSortedMap(new java.util.TreeMap<>(utilization));
    placement = placement.map(List::copyOf);
    unchecked = List.copyOf(unchecked);
    notes = List.copyOf(notes);
    warnings = List.copyOf(warnings);
  }

}
