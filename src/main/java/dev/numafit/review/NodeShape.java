package dev.numafit.review;

import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * The shape of the pool's nodes after the resize.
 *
 * @param label how the user named it ({@code cpu=16,memory=64Gi}, {@code one-node})
 * @param capacity the worker's capacity: cpu in millicores, memory in bytes
 * @param allocatable what the kubelet leaves for pods, including the {@code pods} count (maxPods)
 */
public record NodeShape(String label, Resources capacity, Resources allocatable) {
  public NodeShape {
    Objects.requireNonNull(label, "label");
    Objects.requireNonNull(capacity, "capacity");
    Objects.requireNonNull(allocatable, "allocatable");
  }
}
