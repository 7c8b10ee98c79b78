package dev.numafit.demand;

import dev.numafit.diag.SourceRef;
import java.util.Collections;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Where a workload is written, finer than {@link Workload#source()}, so a finding can point at the
 * line a reviewer has to change; and the pod as admission leaves it, container by container.
 *
 * @param podTemplate the line of the pod template ({@code template:}, or {@code spec:} of a bare
 *     Pod)
 * @param replicas the line that sets the replica count used for sizing: an autoscaler's {@code
 *     maxReplicas} at peak, else {@code spec.replicas} (a Job's {@code parallelism}); empty when
 *     the count is a default nobody wrote
 * @param containers per container name (init, sidecar and app), the line of its {@code resources:}
 *     key, or of the container itself when it has none
 * @param admitted the pod after limits-as-requests, LimitRange defaults and RuntimeClass overhead:
 *     what sizing sees, per container; amounts in base units as in {@link ContainerSpec}
 */
public record WorkloadSource(
    SourceRef podTemplate,
    Optional<SourceRef> replicas,
    SortedMap<String, SourceRef> containers,
    PodModel admitted) {
  public WorkloadSource {
    Objects.requireNonNull(podTemplate, "podTemplate");
    Objects.requireNonNull(replicas, "replicas");
    Objects.requireNonNull(admitted, "admitted");
    containers = Collections.unmodifiableSortedMap(new TreeMap<>(containers));
  }

  /** The line of a container's resources, else the pod template's. */
  public SourceRef container(String name) {
    return containers.getOrDefault(name, podTemplate);
  }
}
