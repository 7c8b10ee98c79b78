package dev.numafit.capture;

import dev.numafit.diag.SourceRef;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One NUMA node as sysfs describes it ({@code /sys/devices/system/node/nodeN}).
 *
 * @param id node number
 * @param cpus online CPUs of the node ({@code cpulist}), sorted
 * @param memoryBytes {@code MemTotal} from the node's {@code meminfo}, in bytes (kB there are
 *     KiB, FACTS B3)
 * @param hugepages pre-allocated hugepages: page size in KiB → page count ({@code nr_hugepages})
 * @param distances the node's SLIT row ({@code distance}), one entry per node in id order
 * @param source the node's directory, for messages
 */
public record NodeEntry(
    int id,
    List<Integer> cpus,
    long memoryBytes,
    SortedMap<Long, Long> hugepages,
    List<Integer> distances,
    SourceRef source) {
  public NodeEntry {
    cpus = List.copyOf(cpus);
    hugepages = Collections.unmodifiableSortedMap(new TreeMap<>(hugepages));
    distances = List.copyOf(distances);
    Objects.requireNonNull(source, "source");
    if (id < 0 || memoryBytes < 0) {
      throw new IllegalArgumentException("node id and memory must be >= 0");
    }
  }
}
