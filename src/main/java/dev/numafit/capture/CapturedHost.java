package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Everything a capture derived about a host: the topology a host profile needs, where each part
 * came from, and the warnings to show (including the values a capture cannot know).
 *
 * @param sockets sockets with at least one node that has CPUs
 * @param nodesPerSocket NUMA nodes per socket (the most any socket has)
 * @param threadsPerCore the fewest online threads any core has
 * @param nodes nodes with CPUs, numbered 0.. in socket order
 * @param distances SLIT distances between those nodes, in the same order; empty when the source
 *     had none (lscpu)
 * @param memoryType DRAM generation of the installed modules, empty when unknown
 * @param memorySpeedMts the speed the memory runs at: the lowest configured speed of the installed
 *     modules (their rated speed where no configured speed is printed), 0 when unknown
 * @param cpuSource where the CPU facts came from
 * @param memorySource where the module facts came from, empty without SMBIOS data
 * @param dimms every slot read, in file order
 * @param warnings what the user should look at, sorted
 */
public record CapturedHost(
    int sockets,
    int nodesPerSocket,
    int threadsPerCore,
    List<CapturedNode> nodes,
    Optional<List<List<Integer>>> distances,
    String memoryType,
    int memorySpeedMts,
    String cpuSource,
    Optional<String> memorySource,
    List<MemoryDevice> dimms,
    List<Diagnostic> warnings) {
  public CapturedHost {
    nodes = List.copyOf(nodes);
    distances = distances.map(d -> d.stream().map(List::copyOf).toList());
    Objects.requireNonNull(memoryType, "memoryType");
    Objects.requireNonNull(cpuSource, "cpuSource");
    Objects.requireNonNull(memorySource, "memorySource");
    dimms = List.copyOf(dimms);
    warnings = warnings.stream().sorted().toList();
  }

  /** Online CPUs over all nodes. */
  public int cpuCount() {
    return nodes.stream().mapToInt(n -> n.cpus().size()).sum();
  }

  /** Physical cores over all nodes. */
  public int coreCount() {
    return nodes.stream().mapToInt(CapturedNode::cores).sum();
  }

  /** Memory over all nodes, in bytes. */
  public long memoryBytes() {
    return nodes.stream().mapToLong(CapturedNode::memoryBytes).sum();
  }
}
