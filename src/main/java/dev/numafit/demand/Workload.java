package dev.numafit.demand;

import dev.numafit.diag.SourceRef;
import java.util.List;
import java.util.Objects;

/**
 * One pod-bearing object of the input and the pods it runs.
 *
 * @param perWorker true for a DaemonSet: one pod on every worker instead of a replica count
 * @param guess true for a custom resource sized from an embedded pod template (--include-custom)
 * @param flags workload-level remarks ({@code no request for cpu}, {@code overhead unknown:
 *     RuntimeClass x not in input})
 * @param rules where the pods may run relative to each other ({@link PlacementRules#NONE} when
 *     the manifest declares nothing the plan enforces)
 */
public record Workload(
    WorkloadId id,
    SourceRef source,
    Replicas replicas,
    EffectivePod pod,
    boolean perWorker,
    boolean guess,
    List<String> flags,
    PlacementRules rules) {
  public Workload {
    Objects.requireNonNull(rules, "rules");
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(replicas, "replicas");
    Objects.requireNonNull(pod, "pod");
    flags = List.copyOf(flags);
  }

  /** A workload without placement rules. */
  public Workload(
      WorkloadId id,
      SourceRef source,
      Replicas replicas,
      EffectivePod pod,
      boolean perWorker,
      boolean guess,
      List<String> flags) {
    this(id, source, replicas, pod, perWorker, guess, flags, PlacementRules.NONE);
  }

  /** This workload with other placement rules. */
  public Workload withRules(PlacementRules newRules) {
    return new Workload(id, source, replicas, pod, perWorker, guess, flags, newRules);
  }
}
