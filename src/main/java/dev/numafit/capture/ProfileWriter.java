package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Writes a captured host as a host profile YAML ({@code numafit.dev/v1alpha1}, the format in
 * docs/host-profile.md), with a comment on each value saying where it came from: "measured" for
 * what was read from the host, "to confirm" for a default or an assumption. The warnings head the
 * file as comments. Same capture, same bytes: nothing depends on time or map order.
 */
public final class ProfileWriter {
  private static final long GIB = 1L << 30;

  /** Profile memory types the format accepts; others are left out with a comment. */
  private static final Set<String> MEMORY_TYPES = Set.of("DDR4", "DDR5");

  private ProfileWriter() {}

  /**
   * The profile text.
   *
   * @param host the captured host
   * @param name the profile's {@code metadata.name}
   * @throws IllegalArgumentException when the host cannot be written in the profile format
   *     (sockets with different numbers of NUMA nodes); the message says what to do
   */
  public static String write(CapturedHost host, String name) {
    Objects.requireNonNull(name, "name");
    SortedMap<Integer, Integer> perSocket = new TreeMap<>();
    host.nodes().forEach(n -> perSocket.merge(n.socket(), 1, Integer::sum));
    if (perSocket.values().stream().distinct().count() > 1) {
      throw new IllegalArgumentException(
          "the sockets have different numbers of NUMA nodes " + perSocket + " (socket=nodes): a"
              + " host profile needs the same number on every socket; write the profile by hand");
    }
    Lines out = new Lines();
    out.raw("# Host profile captured by numafit profile capture.");
    out.raw("# CPUs and NUMA nodes: " + host.cpuSource());
    out.raw(
        "# Memory modules: "
            + host.memorySource().map(s -> "SMBIOS type 17 (dmidecode -t 17) from " + s)
                .orElse("none given (no --dmidecode)"));
    out.raw("# \"measured\" marks a value read from the host; \"to confirm\" marks a default or an");
    out.raw("# assumption to check before planning. Verify the profile against your hardware's");
    out.raw("# documentation and a load test; follow your organisation's change practice.");
    if (!host.warnings().isEmpty()) {
      out.raw("#");
      out.raw("# Warnings:");
      for (Diagnostic w : host.warnings()) {
        out.raw("#   - " + w.message());
      }
    }
    out.raw("apiVersion: numafit.dev/v1alpha1");
    out.raw("kind: HostProfile");
    out.raw("metadata:");
    out.raw("  name: " + name);
    out.raw(
        "  description: Captured host, " + host.sockets() + " socket(s), " + host.nodesPerSocket()
            + " NUMA node(s) per socket, " + host.coreCount() + " cores, " + gib(host.memoryBytes()));
    out.raw("spec:");
    out.line(2, "sockets: " + host.sockets(), "measured: sockets with online CPUs");
    out.line(2, "nodesPerSocket: " + host.nodesPerSocket(), "measured: NUMA nodes per socket");
    out.line(
        2,
        "threadsPerCore: " + host.threadsPerCore(),
        "measured: fewest online threads of any core");
    if (!host.memoryType().isEmpty() && MEMORY_TYPES.contains(host.memoryType())) {
      out.line(2, "memoryType: " + host.memoryType(), "measured: SMBIOS Type of the modules");
    } else if (!host.memoryType().isEmpty()) {
      out.raw("  # memoryType " + host.memoryType() + " left out: the format knows DDR4 and DDR5");
    } else {
      out.raw("  # memoryType: unknown without SMBIOS data (to confirm: DDR4 or DDR5)");
    }
    if (host.memorySpeedMts() > 0) {
      out.line(
          2,
          "memorySpeedMTs: " + host.memorySpeedMts(),
          "measured: lowest configured speed of the installed modules");
    } else {
      out.raw("  # memorySpeedMTs: unknown without SMBIOS data (to confirm)");
    }

    CapturedNode first = host.nodes().get(0);
    out.raw("  node:");
    out.raw("    # every node as node 0 (" + describe(first) + "); spec.nodes lists the differences");
    out.line(4, "cores: " + first.cores(), "measured: physical cores with an online thread");
    memory(out, 4, first);
    hugepages(out, 4, first.hugepages(), false);

    if (host.nodes().size() > 1) {
      out.raw("  nodes:");
      for (CapturedNode n : host.nodes().subList(1, host.nodes().size())) {
        out.line(4, "- id: " + n.id(), describe(n));
        if (n.cores() != first.cores()) {
          out.line(6, "cores: " + n.cores(), "measured");
        }
        if (!sameMemory(n, first)) {
          memory(out, 6, n);
        }
        if (!n.hugepages().entrySet().stream()
            .filter(e -> e.getValue() > 0)
            .toList()
            .equals(first.hugepages().entrySet().stream().filter(e -> e.getValue() > 0).toList())) {
          hugepages(out, 6, n.hugepages(), true);
        }
      }
    }

    host.distances()
        .ifPresent(
            d -> {
              out.line(2, "distances:", "measured: sysfs nodeN/distance (SLIT), in node order");
              for (List<Integer> row : d) {
                StringBuilder b = new StringBuilder("- [");
                for (int j = 0; j < row.size(); j++) {
                  b.append(j == 0 ? "" : ", ").append(row.get(j));
                }
                out.line(4, b.append(']').toString(), null);
              }
            });

    out.raw("  hypervisor:");
    long reserve = CaptureDefaults.reservedMemoryBytes(host.memoryBytes());
    out.line(
        4,
        "reservedMemory: " + quantity(reserve),
        "to confirm: default 2% of host memory rounded up to a whole GiB, at least 1Gi"
            + " (placeholder, from memory)");
    out.line(
        4,
        "reservedCores: " + CaptureDefaults.RESERVED_CORES,
        "to confirm: default none; cores your hypervisor keeps for itself");
    out.line(
        4,
        "perVmOverhead: " + quantity(CaptureDefaults.PER_VM_OVERHEAD_BYTES),
        "to confirm: default (placeholder, from memory); see your hypervisor's documentation");
    return out.toString();
  }

  private static String describe(CapturedNode n) {
    return "host node " + n.sourceId() + ", socket " + n.socket() + ", CPUs "
        + CpuLists.format(n.cpus());
  }

  private static boolean sameMemory(CapturedNode a, CapturedNode b) {
    if (a.channels().isEmpty() != b.channels().isEmpty()) {
      return false;
    }
    if (a.channels().isEmpty()) {
      return a.memoryBytes() == b.memoryBytes();
    }
    List<List<Long>> x = a.channels().stream().map(CapturedChannel::dimmBytes).toList();
    List<List<Long>> y = b.channels().stream().map(CapturedChannel::dimmBytes).toList();
    return x.equals(y) && a.channelsConfirmed() == b.channelsConfirmed();
  }

  private static void memory(Lines out, int indent, CapturedNode n) {
    if (n.channels().isEmpty()) {
      out.line(
          indent,
          "memory: " + quantity(n.memoryBytes()),
          "measured: " + n.memorySource() + " (" + gib(n.memoryBytes()) + "); channels to"
              + " confirm");
      return;
    }
    out.line(
        indent,
        "channels:",
        (n.channelsConfirmed() ? "measured: " : "to confirm: assumed split; ")
            + "SMBIOS slots by locator, one list of module sizes per channel");
    for (CapturedChannel c : n.channels()) {
      StringBuilder b = new StringBuilder("- [");
      for (int i = 0; i < c.dimmBytes().size(); i++) {
        b.append(i == 0 ? "" : ", ").append(quantity(c.dimmBytes().get(i)));
      }
      out.line(
          indent + 2,
          b.append(']').toString(),
          "channel " + c.name() + ": " + String.join(", ", c.slots()));
    }
  }

  private static void hugepages(
      Lines out, int indent, SortedMap<Long, Long> pages, boolean writeEmpty) {
    Map<Long, Long> nonZero = new TreeMap<>();
    pages.forEach(
        (k, v) -> {
          if (v > 0) {
            nonZero.put(k, v);
          }
        });
    if (nonZero.isEmpty()) {
      if (writeEmpty) {
        out.line(indent, "hugepages: {}", "measured: no pre-allocated hugepages");
      }
      return;
    }
    out.line(indent, "hugepages:", "measured: nr_hugepages per page size");
    nonZero.forEach((kib, count) -> out.line(indent + 2, pageSize(kib) + ": " + count, null));
  }

  /** A page size in KiB as the resource suffix Kubernetes uses ({@code 2Mi}, {@code 1Gi}). */
  static String pageSize(long kib) {
    return quantity(kib * 1024);
  }

  /** Bytes as a quantity with the largest binary suffix that divides them exactly. */
  static String quantity(long bytes) {
    String[] suffixes = {"Ti", "Gi", "Mi", "Ki"};
    int[] shifts = {40, 30, 20, 10};
    if (bytes != 0) {
      for (int i = 0; i < shifts.length; i++) {
        if (bytes % (1L << shifts[i]) == 0) {
          return (bytes >> shifts[i]) + suffixes[i];
        }
      }
    }
    return Long.toString(bytes);
  }

  private static String gib(long bytes) {
    return new BigDecimal(bytes)
            .divide(BigDecimal.valueOf(GIB), 2, RoundingMode.DOWN)
            .stripTrailingZeros()
            .toPlainString()
        + " GiB";
  }

  /** Profile lines with their comments aligned in one column where the line allows. */
  private static final class Lines {
    private static final int COMMENT_COLUMN = 28;
    private final List<String> lines = new ArrayList<>();

    void raw(String line) {
      lines.add(line);
    }

    void line(int indent, String text, String comment) {
      StringBuilder b = new StringBuilder(" ".repeat(indent)).append(text);
      if (comment != null) {
        b.append(" ".repeat(Math.max(1, COMMENT_COLUMN - b.length()))).append("# ").append(comment);
      }
      lines.add(b.toString());
    }

    @Override
    public String toString() {
      return String.join("\n", lines) + "\n";
    }
  }
}
