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
 */
public record Workload(
    WorkloadId id,
    SourceRef source,
    Replicas replicas,
    EffectivePod pod,
    boolean perWorker,
    boolean guess,
    List<String> flags) {
  public Workload {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(replicas, "replicas");
    Objects.requireNonNull(pod, "pod");
    flags = List.copyOf(flags);
  }
}
