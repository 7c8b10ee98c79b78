package dev.numafit.fit;

import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * A worker that spans more than one NUMA node, used only to say how large an oversize pod's worker
 * would have to be.
 *
 * @param label {@code 2-nodes}, {@code socket} or {@code host}
 * @param allocatable the kubelet's allocatable for that spanning worker (cpu in millicores, memory
 *     in bytes, {@code pods} a count), before DaemonSets
 */
public record SpanningRoom(String label, Resources allocatable) {
  public SpanningRoom {
    Objects.requireNonNull(label, "label");
    Objects.requireNonNull(allocatable, "allocatable");
    if (label.isBlank()) {
      throw new IllegalArgumentException("spanning label must not be blank");
    }
  }
}
