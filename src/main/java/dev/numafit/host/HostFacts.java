package dev.numafit.host;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalLong;
import java.util.TreeSet;

/**
 * Facts derived from a {@link HostProfile}: per node cores, threads, memory and peak memory
 * bandwidth, the host totals, and the advice-level findings (empty or unequal channels, unconfirmed
 * population, too many NUMA nodes for the kubelet's Topology Manager).
 *
 * @param nodes one entry per NUMA node, by id
 * @param totalCores physical cores of the host
 * @param totalThreads hardware threads of the host
 * @param totalMemoryBytes installed memory of the host in bytes
 * @param totalBandwidthBytesPerSecond sum of the nodes' peak bandwidths; empty when any is unknown
 */
public record HostFacts(
    List<NodeFacts> nodes,
    int totalCores,
    int totalThreads,
    long totalMemoryBytes,
    OptionalLong totalBandwidthBytesPerSecond) {

  /**
   * The Topology Manager does not run on a node with more NUMA nodes than this unless
   * {@code max-allowable-numa-nodes} is raised (FACTS A5, K14).
   */
  public static final int TOPOLOGY_MANAGER_MAX_NUMA_NODES = 8;

  public HostFacts {
    nodes = List.copyOf(nodes);
  }

  /**
   * A finding about a node (or the host when {@code node} is -1), worded for the user.
   *
   * @param node the node concerned, -1 for the whole host
   * @param message the finding, naming the node and the consequence
   */
  public record Finding(int node, String message) {}

  /**
   * Peak transfer rate of one 64-bit memory channel in bytes per second: MT/s × 8 bytes (FACTS B1:
   * DDR4-3200 → 25.6 GB/s).
   */
  public static long channelBytesPerSecond(int megaTransfersPerSecond) {
    return Math.multiplyExact((long) megaTransfersPerSecond, 8_000_000L);
  }

  /** Derives the facts of every node and the host totals. */
  public static HostFacts of(HostProfile profile) {
    List<NodeFacts> out = new ArrayList<>();
    int cores = 0;
    int threads = 0;
    long memory = 0;
    long bandwidth = 0;
    boolean bandwidthKnown = true;
    for (NumaNode n : profile.nodes()) {
      int populated = (int) n.populatedChannels();
      OptionalLong bw =
          profile.memorySpeedMts() > 0 && n.channelsConfirmed()
              ? OptionalLong.of(
                  Math.multiplyExact(populated, channelBytesPerSecond(profile.memorySpeedMts())))
              : OptionalLong.empty();
      out.add(
          new NodeFacts(
              n.id(), n.socket(), n.cores(), n.threads(), n.memoryBytes(), n.channels().size(),
              populated, bw));
      cores += n.cores();
      threads += n.threads();
      memory = Math.addExact(memory, n.memoryBytes());
      if (bw.isPresent()) {
        bandwidth += bw.getAsLong();
      } else {
        bandwidthKnown = false;
      }
    }
    return new HostFacts(
        out,
        cores,
        threads,
        memory,
        bandwidthKnown && !out.isEmpty() ? OptionalLong.of(bandwidth) : OptionalLong.empty());
  }

  /**
   * Findings that do not make the profile invalid but change what a worker gets, by node: an
   * unpopulated channel, unequal memory across a node's channels, a channel population that was not
   * confirmed, and more NUMA nodes than the Topology Manager handles by default.
   */
  public static List<Finding> findings(HostProfile profile) {
    List<Finding> out = new ArrayList<>();
    for (NumaNode n : profile.nodes()) {
      if (!n.channelsConfirmed()) {
        out.add(
            new Finding(
                n.id(),
                "node "
                    + n.id()
                    + " memory given directly ("
                    + ByteUnits.format(n.memoryBytes())
                    + "): channel population unconfirmed, so its bandwidth is unknown; list the"
                    + " channels and DIMMs to check it"));
        continue;
      }
      int total = n.channels().size();
      int populated = (int) n.populatedChannels();
      if (populated < total) {
        out.add(
            new Finding(
                n.id(),
                "node " + n.id() + " uses " + populated + " of " + total + " channels: "
                    + bandwidthShare(populated, total)));
      }
      TreeSet<Long> sizes = new TreeSet<>();
      for (MemoryChannel c : n.channels()) {
        if (c.populated()) {
          sizes.add(c.totalBytes());
        }
      }
      if (sizes.size() > 1) {
        StringBuilder per = new StringBuilder();
        for (MemoryChannel c : n.channels()) {
          if (c.populated()) {
            per.append(per.length() == 0 ? "" : ", ").append(c.name()).append(": ")
                .append(ByteUnits.format(c.totalBytes()));
          }
        }
        out.add(
            new Finding(
                n.id(),
                "node " + n.id() + " has unequal DIMMs across its channels (" + per
                    + "): memory beyond the smallest channel is not interleaved over all"
                    + " channels and runs at lower bandwidth"));
      }
    }
    if (profile.nodes().size() > TOPOLOGY_MANAGER_MAX_NUMA_NODES) {
      out.add(
          new Finding(
              -1,
              profile.nodes().size()
                  + " NUMA nodes: the kubelet's Topology Manager does not run on more than 8"
                  + " unless max-allowable-numa-nodes is set; a worker spanning them gets no NUMA"
                  + " alignment"));
    }
    return out;
  }

  private static String bandwidthShare(int populated, int total) {
    if (populated == 0) {
      return "no local bandwidth";
    }
    if (populated * 2 == total) {
      return "half the bandwidth";
    }
    return (populated * 100 / total) + "% of the bandwidth";
  }
}
