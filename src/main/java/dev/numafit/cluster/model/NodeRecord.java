package dev.numafit.cluster.model;

import dev.numafit.resource.Resources;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One node as read from {@code status} and {@code spec}.
 *
 * @param capacity {@code status.capacity}: cpu in millicores, memory in bytes, pods as a count
 * @param allocatable {@code status.allocatable}, same units; what the scheduler fits pods into
 * @param unschedulable {@code spec.unschedulable} (cordoned)
 */
public record NodeRecord(
    String name,
    Resources capacity,
    Resources allocatable,
    SortedMap<String, String> labels,
    List<Taint> taints,
    boolean unschedulable) {
  public NodeRecord {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(capacity, "capacity");
    Objects.requireNonNull(allocatable, "allocatable");
    labels = Collections.unmodifiableSortedMap(new TreeMap<>(labels));
    taints = List.copyOf(taints);
  }
}
