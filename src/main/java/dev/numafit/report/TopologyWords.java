package dev.numafit.report;

import dev.numafit.host.HostProfile;
import dev.numafit.host.MemoryChannel;
import dev.numafit.host.NumaNode;
import dev.numafit.shape.HostLayout;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;

/** The host topology in words, shared by the HTML, Markdown and text reports. */
public final class TopologyWords {
  private TopologyWords() {}

  /** Sockets, nodes, memory type, and what the hypervisor keeps. */
  public static String summary(HostProfile hp) {
    return hp.sockets() + (hp.sockets() == 1 ? " socket, " : " sockets, ")
        + hp.nodes().size() + " NUMA nodes"
        + (hp.memoryType().isEmpty() ? "" : ", " + hp.memoryType())
        + (hp.memorySpeedMts() > 0 ? "-" + hp.memorySpeedMts() : "")
        + ". Hypervisor keeps " + Units.bytes(hp.hypervisorMemoryBytes())
        + " of memory (split equally over the nodes) and " + hp.hypervisorCores()
        + (hp.hypervisorCores() == 1 ? " core" : " cores")
        + " (from node 0 up); each VM costs " + Units.bytes(hp.perVmOverheadBytes()) + " more.";
  }

  /** A node's DIMMs channel by channel: {@code 32GiB | 32GiB | empty}. */
  public static String dimms(NumaNode node) {
    if (!node.channelsConfirmed() || node.channels().isEmpty()) {
      return "not listed";
    }
    List<String> parts = new ArrayList<>();
    for (MemoryChannel c : node.channels()) {
      parts.add(c.populated()
          ? String.join(" + ", c.dimmBytes().stream().map(Units::bytes).toList())
          : "empty");
    }
    return String.join(" · ", parts);
  }

  /** Decimal GB/s, as memory bandwidth is quoted (FACTS B1: DDR4-3200 is 25.6 GB/s a channel). */
  public static String gbps(long bytesPerSecond) {
    return BigDecimal.valueOf(bytesPerSecond)
            .divide(BigDecimal.valueOf(1_000_000_000L), 1, RoundingMode.HALF_UP)
            .toPlainString()
        + " GB/s";
  }

  /** Workers on a node: a count, or the count split over the node's group. */
  public static String workers(HostLayout layout, int node) {
    HostLayout.Group g = layout.groupOf(node);
    return g.nodes().size() == 1
        ? Integer.toString(g.workers())
        : g.workers() + " split over nodes " + g.nodes();
  }
}
