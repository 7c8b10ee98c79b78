package dev.numafit.shape;

import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * A worker VM's size before the kubelet takes its share.
 *
 * @param workersPerNode k for {@link ShapeKind#SPLIT_NODE}, 1 otherwise
 * @param nodesSpanned NUMA nodes the VM covers (1 for a one-node or split worker)
 * @param vcpus virtual CPUs
 * @param memoryBytes configured VM memory
 * @param extraCapacity hugepages (bytes), devices (counts), ephemeral-storage (bytes) the worker
 *     has; a resource absent here is not checked
 */
public record WorkerShape(
    ShapeKind kind,
    int workersPerNode,
    int nodesSpanned,
    long vcpus,
    long memoryBytes,
    Resources extraCapacity) {
  public WorkerShape {
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(extraCapacity, "extraCapacity");
    if (vcpus < 0 || memoryBytes < 0) {
      throw new IllegalArgumentException("worker size must be >= 0");
    }
  }

  /** Capacity as the kubelet reports it: cpu in millicores, memory in bytes, plus extras. */
  public Resources capacity() {
    return extraCapacity
        .with(Resources.CPU, Math.multiplyExact(vcpus, 1000L))
        .with(Resources.MEMORY, memoryBytes);
  }
}
