package dev.numafit.capture;

import java.util.List;
import java.util.Objects;

/**
 * What a CPU and NUMA source reported, before anything is derived from it.
 *
 * @param cpuSource where the CPU facts came from, in words ({@code sysfs /sys/devices/system/cpu}
 *     or {@code lscpu -p file x})
 * @param cpus online CPUs sorted by number
 * @param offlineCpus CPUs present but offline: their cores are not counted
 * @param nodes NUMA nodes sorted by id; empty when the source has no per-node memory (lscpu)
 */
public record CapturedTopology(
    String cpuSource, List<CpuEntry> cpus, List<Integer> offlineCpus, List<NodeEntry> nodes) {
  public CapturedTopology {
    Objects.requireNonNull(cpuSource, "cpuSource");
    cpus = List.copyOf(cpus);
    offlineCpus = List.copyOf(offlineCpus);
    nodes = List.copyOf(nodes);
  }
}
