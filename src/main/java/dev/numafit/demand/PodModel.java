package dev.numafit.demand;

import java.math.BigDecimal;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A pod template reduced to what the request arithmetic needs, free of any Kubernetes client type.
 * Amounts are exact, in base units (see {@link ContainerSpec}).
 *
 * @param initContainers init containers in spec order, sidecars ({@link ContainerRole#SIDECAR})
 *     among them where they were declared: order matters (FACTS A1)
 * @param containers app containers
 * @param overhead {@code spec.overhead} as written in the pod (empty when absent)
 * @param podRequests pod-level {@code spec.resources.requests} (empty when absent)
 * @param podLimits pod-level {@code spec.resources.limits} (empty when absent)
 * @param runtimeClassName {@code spec.runtimeClassName}, when set
 */
public record PodModel(
    List<ContainerSpec> initContainers,
    List<ContainerSpec> containers,
    SortedMap<String, BigDecimal> overhead,
    SortedMap<String, BigDecimal> podRequests,
    SortedMap<String, BigDecimal> podLimits,
    Optional<String> runtimeClassName) {
  public PodModel {
    initContainers = List.copyOf(initContainers);
    containers = List.copyOf(containers);
    overhead = Collections.unmodifiableSortedMap(new TreeMap<>(overhead));
    podRequests = Collections.unmodifiableSortedMap(new TreeMap<>(podRequests));
    podLimits = Collections.unmodifiableSortedMap(new TreeMap<>(podLimits));
    runtimeClassName = runtimeClassName == null ? Optional.empty() : runtimeClassName;
  }
}
