package dev.numafit.report.kubelet;

import dev.numafit.host.ByteUnits;
import dev.numafit.resource.Resources;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.AllocatableResult;
import dev.numafit.shape.EvictionSignals;
import dev.numafit.shape.KubeletReserve;
import dev.numafit.shape.WorkerShape;
import java.io.IOException;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.yaml.YAMLMapper;
import tools.jackson.dataformat.yaml.YAMLWriteFeature;

/**
 * Writes the kubelet's own configuration file (KubeletConfiguration,
 * {@code kubelet.config.k8s.io/v1beta1}) for a worker shape, carrying exactly the reservations,
 * eviction thresholds and maxPods a plan assumed, so the plan and the workers agree.
 *
 * <p>For a worker spanning several NUMA nodes it also turns on NUMA alignment inside the guest
 * (FACTS A5): the static CPU manager, the {@code single-numa-node} Topology Manager policy in pod
 * scope, and the Static Memory Manager with a {@code reservedMemory} entry per NUMA node whose sum
 * equals kube-reserved + system-reserved + the memory.available eviction threshold (K16: the kubelet
 * refuses to start otherwise). Output is deterministic: fixed key order, no timestamps.
 */
public final class KubeletConfigWriter {
  /** The KubeletConfiguration apiVersion written. */
  public static final String API_VERSION = "kubelet.config.k8s.io/v1beta1";

  private final YAMLMapper mapper =
      YAMLMapper.builder()
          .disable(YAMLWriteFeature.WRITE_DOC_START_MARKER)
          .enable(YAMLWriteFeature.MINIMIZE_QUOTES)
          .build();

  /** The configuration as YAML text, ending in a newline. */
  public String render(WorkerShape shape, KubeletReserve reserve) {
    AllocatableResult a = Allocatable.computeDetailed(shape, reserve);
    ObjectNode root = mapper.createObjectNode();
    root.put("apiVersion", API_VERSION);
    root.put("kind", "KubeletConfiguration");
    root.set("kubeReserved", quantities(a.kubeReserved()));
    if (!a.systemReserved().isEmpty()) {
      root.set("systemReserved", quantities(a.systemReserved()));
    }
    // Sorted by signal name so the file reads the same whatever the resource order.
    TreeMap<String, String> signals = new TreeMap<>();
    for (String resource : a.eviction().names()) {
      Optional<String> signal = EvictionSignals.signalOf(resource);
      if (signal.isEmpty()) {
        continue;
      }
      BigDecimal pct = reserve.evictionHardPercent().get(resource);
      signals.put(
          signal.get(),
          pct != null
              ? pct.stripTrailingZeros().toPlainString() + "%"
              : quantity(resource, a.eviction().get(resource)));
    }
    ObjectNode eviction = mapper.createObjectNode();
    signals.forEach(eviction::put);
    if (!eviction.isEmpty()) {
      root.set("evictionHard", eviction);
    }
    root.put("maxPods", reserve.maxPods());
    int numaNodes = shape.nodesSpanned();
    if (numaNodes > 1) {
      root.put("cpuManagerPolicy", "static");
      root.put("topologyManagerPolicy", "single-numa-node");
      root.put("topologyManagerScope", "pod");
      if (numaNodes > 8) {
        // K14: the Topology Manager stays off on more than 8 NUMA nodes unless this is raised.
        ObjectNode options = mapper.createObjectNode();
        options.put("max-allowable-numa-nodes", Integer.toString(numaNodes));
        root.set("topologyManagerPolicyOptions", options);
      }
      root.put("memoryManagerPolicy", "Static");
      long total = reservedMemoryTotal(a);
      ArrayNode reserved = mapper.createArrayNode();
      long base = total / numaNodes;
      long rest = total - base * numaNodes;
      for (int i = 0; i < numaNodes; i++) {
        ObjectNode entry = mapper.createObjectNode();
        entry.put("numaNode", i);
        ObjectNode limits = mapper.createObjectNode();
        limits.put("memory", ByteUnits.format(i == 0 ? base + rest : base));
        entry.set("limits", limits);
        reserved.add(entry);
      }
      root.set("reservedMemory", reserved);
    }
    return header(shape, a) + mapper.writeValueAsString(root);
  }

  /**
   * The memory the Memory Manager must see reserved over all NUMA nodes: kube-reserved +
   * system-reserved + the memory.available hard eviction threshold (FACTS A5, K16).
   */
  public static long reservedMemoryTotal(AllocatableResult a) {
    return Math.addExact(
        Math.addExact(a.kubeReserved().get(Resources.MEMORY), a.systemReserved().get(Resources.MEMORY)),
        a.eviction().get(Resources.MEMORY));
  }

  /** Writes the configuration to {@code file} through a temporary file in the same folder. */
  public void write(Path file, WorkerShape shape, KubeletReserve reserve) throws IOException {
    Path dir = file.toAbsolutePath().getParent();
    Files.createDirectories(dir);
    Path tmp = Files.createTempFile(dir, ".kubelet-config", ".tmp");
    try {
      Files.writeString(tmp, render(shape, reserve), StandardCharsets.UTF_8);
      Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } finally {
      Files.deleteIfExists(tmp);
    }
  }

  private static String header(WorkerShape shape, AllocatableResult a) {
    StringBuilder h = new StringBuilder();
    h.append("# Kubelet configuration for a worker of ").append(shape.vcpus()).append(" vCPUs and ")
        .append(ByteUnits.format(shape.memoryBytes())).append(" (").append(shape.kind().label())
        .append(", ").append(shape.nodesSpanned())
        .append(shape.nodesSpanned() == 1 ? " NUMA node" : " NUMA nodes").append(").\n");
    h.append("# Merge into your kubelet configuration; verify against your hardware's documentation\n");
    h.append("# and a load test, and follow your organisation's change practice.\n");
    if (shape.nodesSpanned() > 1
        && a.kubeReserved().get(Resources.CPU) + a.systemReserved().get(Resources.CPU) == 0) {
      h.append("# The static CPU manager needs a CPU reservation greater than 0: set kubeReserved\n");
      h.append("# or systemReserved cpu before using this file.\n");
    }
    if (a.eviction().get(Resources.MEMORY) == 0) {
      h.append("# No memory eviction threshold was assumed; without evictionHard the kubelet\n");
      h.append("# applies its defaults (memory.available<100Mi).\n");
    }
    return h.toString();
  }

  private ObjectNode quantities(Resources r) {
    ObjectNode node = mapper.createObjectNode();
    for (Map.Entry<String, Long> e : r.asMap().entrySet()) {
      node.put(e.getKey(), quantity(e.getKey(), e.getValue()));
    }
    return node;
  }

  /** cpu as {@code 1500m} or whole cores, sizes with the largest exact binary suffix. */
  static String quantity(String resource, long amount) {
    if (resource.equals(Resources.CPU)) {
      return amount % 1000 == 0 ? Long.toString(amount / 1000) : amount + "m";
    }
    if (resource.equals(Resources.PODS) || resource.contains("/")) {
      return Long.toString(amount);
    }
    return ByteUnits.format(amount);
  }
}
