package dev.numafit.shape;

import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * The largest one-node worker a single NUMA node can hold.
 *
 * @param node node id
 * @param vcpus vCPUs after reserved cores and overcommit
 * @param memoryBytes node memory − the node's share of the hypervisor reserve − the per-VM
 *     overhead, rounded down to a whole GiB
 * @param extraCapacity hugepages (bytes), devices (counts) and ephemeral-storage (bytes)
 */
public record NodeWorker(int node, long vcpus, long memoryBytes, Resources extraCapacity) {
  public NodeWorker {
    Objects.requireNonNull(extraCapacity, "extraCapacity");
  }
}
