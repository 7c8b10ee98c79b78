package dev.numafit.shape;

import java.util.ArrayList;
import java.util.List;

/**
 * How a hypervisor splits a VM wider than one NUMA node into virtual NUMA nodes of equal size, one
 * per physical node it lands on (common practice; the usual worked example: a 16-vCPU VM on
 * 12-core nodes becomes two halves of 8).
 *
 * @param vcpus the VM's vCPUs
 * @param memoryBytes the VM's memory in bytes
 * @param vcpusPerNode vCPUs on each virtual NUMA node; sizes differ by at most one, larger first
 * @param memoryBytesPerNode memory on each virtual NUMA node, split the same way
 */
public record SpanningSplit(
    long vcpus, long memoryBytes, List<Long> vcpusPerNode, List<Long> memoryBytesPerNode) {
  public SpanningSplit {
    vcpusPerNode = List.copyOf(vcpusPerNode);
    memoryBytesPerNode = List.copyOf(memoryBytesPerNode);
    if (vcpusPerNode.isEmpty() || vcpusPerNode.size() != memoryBytesPerNode.size()) {
      throw new IllegalArgumentException("a split needs one vCPU and one memory part per node");
    }
  }

  /**
   * The split of a VM of {@code vcpus} and {@code memoryBytes} over nodes offering
   * {@code nodeVcpus} vCPUs and {@code nodeMemoryBytes} each: as few nodes as hold both, then equal
   * parts.
   */
  public static SpanningSplit of(long vcpus, long memoryBytes, long nodeVcpus, long nodeMemoryBytes) {
    if (vcpus <= 0 || nodeVcpus <= 0 || nodeMemoryBytes <= 0 || memoryBytes < 0) {
      throw new IllegalArgumentException("sizes must be > 0");
    }
    long nodes = Math.max(ceilDiv(vcpus, nodeVcpus), ceilDiv(memoryBytes, nodeMemoryBytes));
    return evenly(vcpus, memoryBytes, (int) Math.max(1, nodes));
  }

  /** A VM of {@code vcpus} and {@code memoryBytes} split evenly over {@code nodes} nodes. */
  public static SpanningSplit evenly(long vcpus, long memoryBytes, int nodes) {
    return new SpanningSplit(vcpus, memoryBytes, parts(vcpus, nodes), parts(memoryBytes, nodes));
  }

  /** Number of virtual NUMA nodes. */
  public int nodes() {
    return vcpusPerNode.size();
  }

  /** Whether the VM spans more than one node. */
  public boolean spans() {
    return nodes() > 1;
  }

  /**
   * One sentence for the plan: "a 16-vCPU worker on nodes of 12 vCPUs is split by the hypervisor
   * into 2 virtual NUMA nodes of 8 vCPUs each".
   */
  public String describe(long nodeVcpus) {
    StringBuilder sizes = new StringBuilder();
    boolean equal = vcpusPerNode.stream().distinct().count() == 1;
    if (equal) {
      sizes.append(vcpusPerNode.get(0)).append(" vCPUs each");
    } else {
      for (int i = 0; i < vcpusPerNode.size(); i++) {
        sizes.append(i == 0 ? "" : " + ").append(vcpusPerNode.get(i));
      }
      sizes.append(" vCPUs");
    }
    return "a " + vcpus + "-vCPU worker on nodes of " + nodeVcpus
        + " vCPUs is split by the hypervisor into " + nodes() + " virtual NUMA nodes of " + sizes
        + " (common practice); its memory is split the same way and a pod on it may reach"
        + " remote memory";
  }

  private static List<Long> parts(long total, int n) {
    List<Long> out = new ArrayList<>(n);
    long base = total / n;
    long rem = total % n;
    for (int i = 0; i < n; i++) {
      out.add(base + (i < rem ? 1 : 0));
    }
    return out;
  }

  private static long ceilDiv(long a, long b) {
    return -Math.floorDiv(-a, b);
  }
}
