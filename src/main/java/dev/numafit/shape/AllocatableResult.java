package dev.numafit.shape;

import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Objects;

/**
 * Allocatable of a worker and the parts taken to get there; every amount in Kubernetes units
 * (cpu in millicores, memory and storage in bytes, hugepages in bytes, devices and pods in counts).
 *
 * @param capacity what the worker reports as capacity, {@code pods} included (= maxPods)
 * @param kubeReserved kube-reserved as applied (the tiered default when none was given)
 * @param systemReserved system-reserved as applied
 * @param eviction hard eviction thresholds as amounts (percentages already applied to capacity)
 * @param allocatable capacity − kube-reserved − system-reserved − eviction (memory also less the
 *     hugepages), never below zero
 * @param warnings why an amount was clamped at zero, one sentence each
 */
public record AllocatableResult(
    Resources capacity,
    Resources kubeReserved,
    Resources systemReserved,
    Resources eviction,
    Resources allocatable,
    List<String> warnings) {
  public AllocatableResult {
    Objects.requireNonNull(capacity, "capacity");
    Objects.requireNonNull(kubeReserved, "kubeReserved");
    Objects.requireNonNull(systemReserved, "systemReserved");
    Objects.requireNonNull(eviction, "eviction");
    Objects.requireNonNull(allocatable, "allocatable");
    warnings = List.copyOf(warnings);
  }
}
