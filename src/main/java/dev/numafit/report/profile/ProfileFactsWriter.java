package dev.numafit.report.profile;

import dev.numafit.diag.Diagnostic;
import dev.numafit.host.NodeFacts;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import tools.jackson.core.util.DefaultIndenter;
import tools.jackson.core.util.DefaultPrettyPrinter;
import tools.jackson.databind.ObjectWriter;
import tools.jackson.databind.SerializationFeature;
import tools.jackson.databind.json.JsonMapper;

/**
 * Renders {@link ProfileFacts} as text (a table per node for an 80-column terminal, binary memory
 * units, decimal GB/s for bandwidth as memory makers state it) or as JSON (sorted keys, integers in
 * bytes, bytes per second and millicores). Same facts, same bytes.
 */
public final class ProfileFactsWriter {
  /** The version of the JSON document's layout, at its root. */
  public static final int SCHEMA_VERSION = 1;

  private static final long GIB = 1L << 30;
  private static final long MIB = 1L << 20;
  private static final ObjectWriter JSON;

  static {
    JsonMapper mapper =
        JsonMapper.builder().enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS).build();
    DefaultIndenter lf = new DefaultIndenter("  ", "\n");
    JSON =
        mapper.writer()
            .with(new DefaultPrettyPrinter().withObjectIndenter(lf).withArrayIndenter(lf));
  }

  /** The short caution every report carries. */
  public static final String CAUTION =
      "Caution: derived from the profile as written; verify it against your hardware's\n"
          + "documentation and a load test, and follow your organisation's change practice.";

  private ProfileFactsWriter() {}

  /** The text report; warnings are not included (the CLI prints them on standard error). */
  public static String text(ProfileFacts f) {
    StringBuilder b = new StringBuilder();
    var p = f.profile();
    b.append("host profile ").append(p.name()).append(" (").append(f.file()).append(")\n");
    b.append(p.sockets()).append(p.sockets() == 1 ? " socket" : " sockets")
        .append(" x ").append(p.nodesPerSocket())
        .append(p.nodesPerSocket() == 1 ? " NUMA node" : " NUMA nodes").append(" per socket, ")
        .append(f.facts().totalCores()).append(" cores, ")
        .append(f.facts().totalThreads()).append(" threads, ")
        .append(gib(f.facts().totalMemoryBytes()));
    if (!p.memoryType().isEmpty() || p.memorySpeedMts() > 0) {
      b.append(", ").append(p.memoryType().isEmpty() ? "memory" : p.memoryType())
          .append(p.memorySpeedMts() > 0 ? "-" + p.memorySpeedMts() : "");
    }
    b.append("\n\n");
    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"node", "socket", "cores", "threads", "memory", "channels",
        "bandwidth", "distances"});
    for (int i = 0; i < f.nodes().size(); i++) {
      NodeFacts n = f.nodes().get(i);
      rows.add(
          new String[] {
            Integer.toString(n.node()),
            Integer.toString(n.socket()),
            Integer.toString(n.cores()),
            Integer.toString(n.threads()),
            gib(n.memoryBytes()),
            f.channelsConfirmed(i) ? n.populatedChannels() + "/" + n.channels() : "unconfirmed",
            n.peakBandwidthBytesPerSecond().isPresent()
                ? gbPerSecond(n.peakBandwidthBytesPerSecond().getAsLong())
                : "unknown",
            f.distances(i).map(ProfileFactsWriter::joined).orElse("-")
          });
    }
    table(b, rows);
    boolean extras = false;
    for (int i = 0; i < f.nodes().size(); i++) {
      Resources x = f.extraCapacity(i);
      if (!x.isEmpty()) {
        if (!extras) {
          b.append('\n');
          extras = true;
        }
        b.append("node ").append(i).append(" also offers: ").append(extras(x)).append('\n');
      }
    }
    b.append('\n');
    b.append("hypervisor: reserved memory ").append(gib(p.hypervisorMemoryBytes()))
        .append(", reserved cores ").append(p.hypervisorCores())
        .append(", per-VM overhead ").append(mib(p.perVmOverheadBytes())).append('\n');
    b.append("one-node worker: ").append(f.worker().vcpus()).append(" vCPU, ")
        .append(gib(f.worker().memoryBytes())).append(" memory (one vCPU per core)\n");
    Resources a = f.allocatable().allocatable();
    b.append("  allocatable with default reservations: cpu ")
        .append(cores(a.get(Resources.CPU))).append(", memory ")
        .append(gib(a.get(Resources.MEMORY))).append(", pods ").append(a.get(Resources.PODS))
        .append('\n');
    b.append("  (kube-reserved ").append(f.allocatable().kubeReserved().get(Resources.CPU))
        .append("m cpu and ").append(mib(f.allocatable().kubeReserved().get(Resources.MEMORY)))
        .append(" by the tiered default; eviction ")
        .append(mib(f.allocatable().eviction().get(Resources.MEMORY))).append(")\n");
    b.append('\n').append(CAUTION).append('\n');
    return b.toString();
  }

  /** The JSON report, warnings included. */
  public static String json(ProfileFacts f) {
    var p = f.profile();
    Map<String, Object> root = new TreeMap<>();
    root.put("schemaVersion", SCHEMA_VERSION);
    Map<String, Object> prof = new TreeMap<>();
    prof.put("name", p.name());
    prof.put("file", f.file());
    root.put("profile", prof);
    root.put("sockets", p.sockets());
    root.put("nodesPerSocket", p.nodesPerSocket());
    root.put("memoryType", p.memoryType().isEmpty() ? null : p.memoryType());
    root.put("memorySpeedMTs", p.memorySpeedMts() > 0 ? p.memorySpeedMts() : null);
    List<Object> nodes = new ArrayList<>();
    for (int i = 0; i < f.nodes().size(); i++) {
      NodeFacts n = f.nodes().get(i);
      Map<String, Object> m = new TreeMap<>();
      m.put("id", n.node());
      m.put("socket", n.socket());
      m.put("cores", n.cores());
      m.put("threads", n.threads());
      m.put("memoryBytes", n.memoryBytes());
      m.put("channels", n.channels());
      m.put("populatedChannels", n.populatedChannels());
      m.put("channelsConfirmed", f.channelsConfirmed(i));
      m.put(
          "peakBandwidthBytesPerSecond",
          n.peakBandwidthBytesPerSecond().isPresent()
              ? n.peakBandwidthBytesPerSecond().getAsLong()
              : null);
      m.put("distances", f.distances(i).orElse(null));
      m.put("extraCapacity", new TreeMap<>(f.extraCapacity(i).asMap()));
      nodes.add(m);
    }
    root.put("nodes", nodes);
    Map<String, Object> hv = new TreeMap<>();
    hv.put("reservedMemoryBytes", p.hypervisorMemoryBytes());
    hv.put("reservedCores", p.hypervisorCores());
    hv.put("perVmOverheadBytes", p.perVmOverheadBytes());
    root.put("hypervisor", hv);
    Map<String, Object> w = new TreeMap<>();
    w.put("vcpus", f.worker().vcpus());
    w.put("memoryBytes", f.worker().memoryBytes());
    w.put("capacity", new TreeMap<>(f.allocatable().capacity().asMap()));
    w.put("kubeReserved", new TreeMap<>(f.allocatable().kubeReserved().asMap()));
    w.put("eviction", new TreeMap<>(f.allocatable().eviction().asMap()));
    w.put("allocatable", new TreeMap<>(f.allocatable().allocatable().asMap()));
    root.put("oneNodeWorker", w);
    List<Object> warnings = new ArrayList<>();
    for (Diagnostic d : f.warnings()) {
      Map<String, Object> m = new TreeMap<>();
      m.put("severity", d.severity().label());
      m.put("file", d.source().map(s -> s.file()).orElse(null));
      m.put("line", d.source().map(s -> s.line() > 0 ? (Object) s.line() : null).orElse(null));
      m.put("message", d.message());
      warnings.add(m);
    }
    root.put("warnings", warnings);
    return JSON.writeValueAsString(root) + "\n";
  }

  private static void table(StringBuilder b, List<String[]> rows) {
    int cols = rows.get(0).length;
    int[] width = new int[cols];
    for (String[] r : rows) {
      for (int c = 0; c < cols; c++) {
        width[c] = Math.max(width[c], r[c].length());
      }
    }
    for (String[] r : rows) {
      StringBuilder line = new StringBuilder();
      for (int c = 0; c < cols; c++) {
        line.append(r[c]);
        if (c < cols - 1) {
          line.append(" ".repeat(width[c] - r[c].length() + 2));
        }
      }
      b.append(line.toString().stripTrailing()).append('\n');
    }
  }

  private static String joined(List<Integer> row) {
    StringBuilder b = new StringBuilder();
    for (int v : row) {
      b.append(b.length() == 0 ? "" : " ").append(v);
    }
    return b.toString();
  }

  private static String extras(Resources x) {
    List<String> parts = new ArrayList<>();
    x.asMap().forEach(
        (k, v) -> parts.add(k + " " + (Resources.isHugepages(k) ? gib(v) : Long.toString(v))));
    return String.join(", ", parts);
  }

  static String gib(long bytes) {
    return decimal(bytes, GIB) + " GiB";
  }

  static String mib(long bytes) {
    return decimal(bytes, MIB) + " MiB";
  }

  private static String cores(long millicores) {
    return decimal(millicores, 1000);
  }

  private static String gbPerSecond(long bytesPerSecond) {
    // Decimal gigabytes, as DRAM bandwidth is stated (FACTS B1: DDR4-3200 → 25.6 GB/s).
    return decimal(bytesPerSecond, 1_000_000_000L) + " GB/s";
  }

  private static String decimal(long value, long unit) {
    return new BigDecimal(value)
        .divide(BigDecimal.valueOf(unit), 2, RoundingMode.DOWN)
        .stripTrailingZeros()
        .toPlainString();
  }
}
