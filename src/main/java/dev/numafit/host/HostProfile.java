package dev.numafit.host;

import dev.numafit.diag.SourceRef;
import java.math.BigDecimal;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalLong;

/**
 * A hypervisor host's topology and what the hypervisor keeps for itself. Built and validated by the
 * profile reader; the core only reads it.
 *
 * @param name the profile's {@code metadata.name}
 * @param memoryType DRAM generation such as {@code DDR4} or {@code DDR5}, empty when unknown
 * @param memorySpeedMts transfer rate in MT/s, 0 when unknown
 * @param nodes all NUMA nodes, sorted by id
 * @param distances SLIT-form distance matrix (diagonal 10, 255 unreachable), empty when not given
 * @param hypervisorMemoryBytes memory the hypervisor keeps on the whole host, split equally over
 *     the nodes
 * @param hypervisorCores whole cores the hypervisor keeps, taken from node 0 upward
 * @param perVmOverheadBytes memory the hypervisor spends on each VM beyond its configured memory
 * @param relativeCost cost of one host relative to the others compared, when given
 * @param ephemeralStoragePerWorker local storage each worker gets, in bytes, when given
 */
public record HostProfile(
    String name,
    SourceRef source,
    int sockets,
    int nodesPerSocket,
    String memoryType,
    int memorySpeedMts,
    List<NumaNode> nodes,
    Optional<List<List<Integer>>> distances,
    long hypervisorMemoryBytes,
    int hypervisorCores,
    long perVmOverheadBytes,
    Optional<BigDecimal> relativeCost,
    OptionalLong ephemeralStoragePerWorker) {
  public HostProfile {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(memoryType, "memoryType");
    nodes = List.copyOf(nodes);
    distances = distances.map(d -> d.stream().map(List::copyOf).toList());
  }
}
