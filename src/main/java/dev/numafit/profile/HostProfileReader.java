package dev.numafit.profile;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import dev.numafit.host.ByteUnits;
import dev.numafit.host.HostFacts;
import dev.numafit.host.HostProfile;
import dev.numafit.host.MemoryChannel;
import dev.numafit.host.NumaNode;
import dev.numafit.host.Slit;
import dev.numafit.profile.YamlTree.Entry;
import dev.numafit.profile.YamlTree.ListNode;
import dev.numafit.profile.YamlTree.MapNode;
import dev.numafit.profile.YamlTree.Node;
import dev.numafit.profile.YamlTree.Scalar;
import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.Quantity;
import java.io.IOException;
import java.math.BigDecimal;
import java.nio.charset.CharacterCodingException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.Set;
import java.util.TreeMap;
import tools.jackson.core.JsonToken;

/**
 * Reads a host profile file ({@code apiVersion: numafit.dev/v1alpha1}, {@code kind: HostProfile};
 * the format is in docs/host-profile.md) into a {@link HostProfile}.
 *
 * <p>Every problem in the file is reported at once, each as {@code file:line: error: field.path:
 * expected ..., got ...}; warnings (an empty or unequal memory channel, an unconfirmed channel
 * population, a speed outside the JEDEC range, more than 8 NUMA nodes) come back beside the
 * profile.
 */
public final class HostProfileReader {
  /**
   * Largest size the reader accepts for one amount of memory (a DIMM, a node, a reserve, the
   * hugepages of one size): 1Pi. Far above any host's, and small enough that up to 8,192 such
   * amounts add up within a long (the sums over DIMMs, channels and nodes).
   */
  static final long MAX_SIZE_BYTES = 1L << 50;

  /**
   * Most NUMA nodes a profile may describe in all: 1,024, the largest node count a common Linux
   * kernel build supports (NODES_SHIFT 10; from memory), so a typing slip cannot make the reader
   * build millions of nodes.
   */
  static final int MAX_NODES = 1_024;

  /** The only apiVersion this reader accepts. */
  public static final String API_VERSION = "numafit.dev/v1alpha1";

  /** The kind of a host profile document. */
  public static final String KIND = "HostProfile";

  private static final Set<String> ROOT_KEYS = keys("apiVersion", "kind", "metadata", "spec");
  private static final Set<String> METADATA_KEYS = keys("name", "description");
  private static final Set<String> SPEC_KEYS =
      keys(
          "sockets", "nodesPerSocket", "threadsPerCore", "memoryType", "memorySpeedMTs", "node",
          "nodes", "distances", "hypervisor", "relativeCost", "ephemeralStoragePerWorker");
  private static final Set<String> NODE_KEYS =
      keys("cores", "channels", "memory", "hugepages", "devices");
  private static final Set<String> EXCEPTION_KEYS =
      keys("id", "cores", "channels", "memory", "hugepages", "devices");
  private static final Set<String> HYPERVISOR_KEYS =
      keys("reservedMemory", "reservedCores", "perVmOverhead");

  /** JEDEC speed ranges in MT/s (FACTS B1): DDR4-1600 to DDR4-3200, DDR5-4800 to DDR5-8800. */
  private static final Map<String, int[]> JEDEC_SPEEDS =
      new TreeMap<>(Map.of("DDR4", new int[] {1600, 3200}, "DDR5", new int[] {4800, 8800}));

  /**
   * The whole of {@code file} as UTF-8 text; a missing, unreadable or undecodable file is one
   * error at line 0 of {@code name}. Shared by the readers of this package's files.
   */
  static String readText(Path file, String name) throws InputException {
    try {
      return Files.readString(file);
    } catch (NoSuchFileException e) {
      throw new InputException(Diagnostic.error(new SourceRef(name, 0), "no such file"));
    } catch (CharacterCodingException e) {
      throw new InputException(
          Diagnostic.error(new SourceRef(name, 0), "expected UTF-8 text, got undecodable bytes"));
    } catch (IOException e) {
      throw new InputException(
          Diagnostic.error(new SourceRef(name, 0), "cannot read the file: " + e.getMessage()));
    }
  }

  /** Reads and validates one profile file. */
  public ProfileLoad read(Path file) throws InputException {
    String name = file.toString();
    String text = readText(file, name);
    return parse(name, text);
  }

  /** Reads and validates a profile given as text; {@code file} names it in messages. */
  public ProfileLoad parse(String file, String text) throws InputException {
    Node root = YamlTree.parse(file, text);
    return new Run(file).profile(root);
  }

  private static Set<String> keys(String... names) {
    return new LinkedHashSet<>(List.of(names));
  }

  /** One node's definition: the template or an exception; null fields are not given. */
  private static final class NodeDef {
    int line;
    Integer cores;
    List<MemoryChannel> channels;
    int channelsLine;
    Long memory;
    int memoryLine;
    Resources hugepages;
    int hugepagesLine;
    String hugepagesPath;
    Resources devices;
  }

  /** The state of one read: the file name and the diagnostics so far. */
  private static final class Run {
    private final String file;
    private final List<Diagnostic> errors = new ArrayList<>();
    private final List<Diagnostic> warnings = new ArrayList<>();

    Run(String file) {
      this.file = file;
    }

    private SourceRef at(int line) {
      return new SourceRef(file, line);
    }

    private void error(int line, String path, String message) {
      errors.add(Diagnostic.error(at(line), path + ": " + message));
    }

    private void warn(int line, String message) {
      warnings.add(Diagnostic.warning(at(line), message));
    }

    ProfileLoad profile(Node rootNode) throws InputException {
      if (!(rootNode instanceof MapNode root)) {
        throw new InputException(
            Diagnostic.error(
                at(rootNode.line()),
                "expected a HostProfile mapping with apiVersion, kind, metadata and spec, got "
                    + rootNode.shown()));
      }
      checkKeys(root, "");
      expectText(root, "", "apiVersion", API_VERSION, 1);
      expectText(root, "", "kind", KIND, 1);
      String name = "";
      MapNode metadata = mapping(root, "", "metadata", 1, true);
      if (metadata != null) {
        checkKeys(metadata, "metadata");
        Entry n = metadata.entries().get("name");
        if (n == null) {
          error(root.entries().get("metadata").keyLine(), "metadata.name",
              "missing; expected the profile's name");
        } else if (!(n.value() instanceof Scalar s) || s.isNull() || s.text().isBlank()) {
          error(n.keyLine(), "metadata.name", "expected a name, got " + n.value().shown());
        } else {
          name = s.text();
        }
        Entry d = metadata.entries().get("description");
        if (d != null && !(d.value() instanceof Scalar)) {
          error(d.keyLine(), "metadata.description", "expected text, got " + d.value().shown());
        }
      }
      MapNode spec = mapping(root, "", "spec", 1, true);
      if (spec == null) {
        throw new InputException(sorted(errors));
      }
      checkKeys(spec, "spec");
      int specLine = root.entries().get("spec").keyLine();
      Integer sockets = whole(spec, "spec", "sockets", 1, specLine, true);
      Integer nps = whole(spec, "spec", "nodesPerSocket", 1, specLine, true);
      Integer tpc = whole(spec, "spec", "threadsPerCore", 1, specLine, false);
      int threadsPerCore = tpc == null ? 1 : tpc;

      String memoryType = "";
      Entry mt = spec.entries().get("memoryType");
      if (mt != null) {
        if (mt.value() instanceof Scalar s && JEDEC_SPEEDS.containsKey(s.text())) {
          memoryType = s.text();
        } else {
          error(mt.keyLine(), "spec.memoryType", "expected DDR4 or DDR5, got " + mt.value().shown());
        }
      }
      Integer speed = whole(spec, "spec", "memorySpeedMTs", 1, specLine, false);
      if (speed != null && !memoryType.isEmpty()) {
        int[] range = JEDEC_SPEEDS.get(memoryType);
        if (speed < range[0] || speed > range[1]) {
          warn(spec.entries().get("memorySpeedMTs").keyLine(),
              "spec.memorySpeedMTs: " + speed + " MT/s is outside the JEDEC range for "
                  + memoryType + " (" + range[0] + " to " + range[1] + " MT/s)");
        }
      }

      // The template every node starts from.
      NodeDef template = null;
      MapNode nodeMap = mapping(spec, "spec", "node", specLine, true);
      if (nodeMap != null) {
        template = nodeDef(nodeMap, "spec.node", spec.entries().get("node").keyLine(), false);
      }

      int nodeCount = -1;
      if (sockets != null && nps != null) {
        long count = (long) sockets * nps;
        if (count > MAX_NODES) {
          error(spec.entries().get("nodesPerSocket").keyLine(), "spec.nodesPerSocket",
              "expected at most " + MAX_NODES
              + " NUMA nodes in all (sockets × nodesPerSocket), got " + sockets + " × " + nps
              + " = " + count);
        } else {
          nodeCount = (int) count;
        }
      }
      Map<Integer, NodeDef> exceptions = new TreeMap<>();
      Entry nodesEntry = spec.entries().get("nodes");
      if (nodesEntry != null) {
        if (!(nodesEntry.value() instanceof ListNode list)) {
          error(nodesEntry.keyLine(), "spec.nodes",
              "expected a list of per-node exceptions, got " + nodesEntry.value().shown());
        } else {
          Map<Integer, Integer> seenAt = new HashMap<>();
          for (int i = 0; i < list.items().size(); i++) {
            String path = "spec.nodes[" + i + "]";
            Node item = list.items().get(i);
            if (!(item instanceof MapNode m)) {
              error(item.line(), path, "expected a mapping with id and the fields that differ, got "
                  + item.shown());
              continue;
            }
            checkKeys(m, path);
            Integer id = whole(m, path, "id", 0, item.line(), true);
            NodeDef def = nodeDef(m, path, item.line(), true);
            if (id == null) {
              continue;
            }
            if (nodeCount > 0 && id >= nodeCount) {
              error(m.entries().get("id").keyLine(), path + ".id",
                  "expected a node id from 0 to " + (nodeCount - 1) + ", got " + id);
            } else if (seenAt.containsKey(id)) {
              error(m.entries().get("id").keyLine(), path + ".id",
                  "node " + id + " already has an exception at spec.nodes[" + seenAt.get(id) + "]");
            } else {
              seenAt.put(id, i);
              exceptions.put(id, def);
            }
          }
        }
      }

      // Hypervisor reserve.
      long reservedMemory = 0;
      int reservedCores = 0;
      long overhead = 0;
      int reservedMemoryLine = 0;
      int reservedCoresLine = 0;
      MapNode hv = mapping(spec, "spec", "hypervisor", specLine, false);
      if (hv != null) {
        checkKeys(hv, "spec.hypervisor");
        int hvLine = spec.entries().get("hypervisor").keyLine();
        Long rm = sizeField(hv, "spec.hypervisor", "reservedMemory");
        if (rm != null) {
          reservedMemory = rm;
          reservedMemoryLine = hv.entries().get("reservedMemory").keyLine();
        }
        Integer rc = whole(hv, "spec.hypervisor", "reservedCores", 0, hvLine, false);
        if (rc != null) {
          reservedCores = rc;
          reservedCoresLine = hv.entries().get("reservedCores").keyLine();
        }
        Long ov = sizeField(hv, "spec.hypervisor", "perVmOverhead");
        if (ov != null) {
          overhead = ov;
        }
      }

      Optional<BigDecimal> cost = Optional.empty();
      Entry costEntry = spec.entries().get("relativeCost");
      if (costEntry != null) {
        BigDecimal c = null;
        if (costEntry.value() instanceof Scalar s
            && (s.token() == JsonToken.VALUE_NUMBER_INT
                || s.token() == JsonToken.VALUE_NUMBER_FLOAT)) {
          try {
            c = new BigDecimal(s.text());
          } catch (NumberFormatException e) {
            c = null;
          }
        }
        if (c == null || c.signum() <= 0) {
          error(costEntry.keyLine(), "spec.relativeCost",
              "expected a number > 0, got " + costEntry.value().shown());
        } else {
          cost = Optional.of(c);
        }
      }
      OptionalLong ephemeral = OptionalLong.empty();
      Long eph = sizeField(spec, "spec", "ephemeralStoragePerWorker");
      if (eph != null) {
        ephemeral = OptionalLong.of(eph);
      }

      // Assemble the nodes.
      List<NumaNode> nodes = new ArrayList<>();
      Map<Integer, Integer> definitionLine = new HashMap<>();
      if (nodeCount > 0 && template != null) {
        for (int id = 0; id < nodeCount; id++) {
          NodeDef ex = exceptions.get(id);
          int cores = ex != null && ex.cores != null ? ex.cores : nz(template.cores);
          List<MemoryChannel> channels;
          long memory;
          boolean confirmed;
          int memLine;
          NodeDef memFrom = ex != null && (ex.channels != null || ex.memory != null) ? ex : template;
          if (memFrom.channels != null) {
            channels = memFrom.channels;
            memory = channels.stream().mapToLong(MemoryChannel::totalBytes).sum();
            confirmed = true;
            memLine = memFrom.channelsLine;
          } else {
            channels = List.of();
            memory = memFrom.memory == null ? 0 : memFrom.memory;
            confirmed = false;
            memLine = memFrom.memoryLine;
          }
          NodeDef hpFrom = ex != null && ex.hugepages != null ? ex : template;
          Resources hugepages = hpFrom.hugepages == null ? Resources.EMPTY : hpFrom.hugepages;
          long hpBytes = hugepages.asMap().values().stream().mapToLong(Long::longValue).sum();
          if (hpBytes > memory && memory > 0) {
            error(hpFrom.hugepagesLine, hpFrom.hugepagesPath,
                "expected hugepages within node " + id + "'s memory (" + ByteUnits.format(memory)
                    + "), got " + ByteUnits.format(hpBytes));
          }
          Resources devices =
              ex != null && ex.devices != null
                  ? ex.devices
                  : template.devices == null ? Resources.EMPTY : template.devices;
          definitionLine.put(id, memLine);
          nodes.add(
              new NumaNode(id, id / nps, cores, threadsPerCore, memory, channels, confirmed,
                  hugepages.plus(devices)));
        }
      }

      // Distances.
      Optional<List<List<Integer>>> distances = Optional.empty();
      Entry dist = spec.entries().get("distances");
      if (dist != null) {
        distances = distances(dist, nodeCount);
      }

      // Reserve against the host.
      if (!nodes.isEmpty()) {
        long totalMemory = nodes.stream().mapToLong(NumaNode::memoryBytes).sum();
        int totalCores = nodes.stream().mapToInt(NumaNode::cores).sum();
        if (reservedMemory > 0 && reservedMemory >= totalMemory && totalMemory > 0) {
          error(reservedMemoryLine, "spec.hypervisor.reservedMemory",
              "expected less than the host's memory (" + ByteUnits.format(totalMemory) + "), got "
                  + ByteUnits.format(reservedMemory));
        }
        if (reservedCores > 0 && reservedCores >= totalCores && totalCores > 0) {
          error(reservedCoresLine, "spec.hypervisor.reservedCores",
              "expected fewer than the host's " + totalCores + " cores, got " + reservedCores);
        }
      }

      if (!errors.isEmpty()) {
        throw new InputException(sorted(errors));
      }
      HostProfile profile =
          new HostProfile(
              name, at(1), sockets, nps, memoryType, speed == null ? 0 : speed, nodes, distances,
              reservedMemory, reservedCores, overhead, cost, ephemeral);
      for (HostFacts.Finding f : HostFacts.findings(profile)) {
        int line = f.node() >= 0 ? definitionLine.getOrDefault(f.node(), 0) : specLine;
        warn(line, f.message());
      }
      return new ProfileLoad(profile, warnings);
    }

    private static int nz(Integer v) {
      return v == null ? 0 : v;
    }

    private static List<Diagnostic> sorted(List<Diagnostic> list) {
      return list.stream().sorted().toList();
    }

    private void checkKeys(MapNode m, String path) {
      Set<String> allowed = allowedKeys(path);
      for (Entry e : m.entries().values()) {
        if (!allowed.contains(e.key())) {
          error(e.keyLine(), join(path, e.key()),
              "unknown field; expected one of " + String.join(", ", allowed));
        }
      }
    }

    private static Set<String> allowedKeys(String path) {
      if (path.isEmpty()) {
        return ROOT_KEYS;
      }
      if (path.equals("metadata")) {
        return METADATA_KEYS;
      }
      if (path.equals("spec")) {
        return SPEC_KEYS;
      }
      if (path.equals("spec.node")) {
        return NODE_KEYS;
      }
      if (path.equals("spec.hypervisor")) {
        return HYPERVISOR_KEYS;
      }
      return EXCEPTION_KEYS;
    }

    private static String join(String path, String key) {
      return path.isEmpty() ? key : path + "." + key;
    }

    private void expectText(MapNode m, String path, String key, String expected, int line) {
      Entry e = m.entries().get(key);
      if (e == null) {
        error(line, join(path, key), "missing; expected " + expected);
      } else if (!(e.value() instanceof Scalar s) || !s.text().equals(expected)) {
        error(e.keyLine(), join(path, key), "expected " + expected + ", got " + e.value().shown());
      }
    }

    private MapNode mapping(MapNode m, String path, String key, int line, boolean required) {
      Entry e = m.entries().get(key);
      if (e == null) {
        if (required) {
          error(line, join(path, key), "missing; expected a mapping");
        }
        return null;
      }
      if (!(e.value() instanceof MapNode child)) {
        error(e.keyLine(), join(path, key), "expected a mapping, got " + e.value().shown());
        return null;
      }
      return child;
    }

    /** A whole number ≥ min from a key; null (after an error, if required) when unusable. */
    private Integer whole(MapNode m, String path, String key, int min, int line, boolean required) {
      Entry e = m.entries().get(key);
      String where = join(path, key);
      String expected = "expected a whole number " + (min == 0 ? ">= 0" : "> " + (min - 1));
      if (e == null) {
        if (required) {
          error(line, where, "missing; " + expected);
        }
        return null;
      }
      return wholeValue(e.value(), where, min, expected, e.keyLine());
    }

    private Integer wholeValue(Node n, String where, int min, String expected, int line) {
      if (n instanceof Scalar s && s.token() == JsonToken.VALUE_NUMBER_INT) {
        try {
          int v = Integer.parseInt(s.text());
          if (v >= min) {
            return v;
          }
        } catch (NumberFormatException e) {
          // falls through to the error below
        }
      }
      error(line, where, expected + ", got " + n.shown());
      return null;
    }

    private Long sizeField(MapNode m, String path, String key) {
      Entry e = m.entries().get(key);
      if (e == null) {
        return null;
      }
      return size(e.value(), join(path, key), e.keyLine());
    }

    /** A size in bytes from a Kubernetes quantity ({@code 64Gi}) or a plain number of bytes. */
    private Long size(Node n, String where, int line) {
      if (n instanceof Scalar s && !s.isNull()
          && (s.token() == JsonToken.VALUE_STRING || s.token() == JsonToken.VALUE_NUMBER_INT)) {
        BigDecimal bytes;
        try {
          bytes = Quantity.getAmountInBytes(Quantity.parse(s.text()));
        } catch (RuntimeException e) {
          // Quantity parses leniently and fails only when the amount is read (LIBRARIES.md).
          bytes = null;
        }
        if (bytes != null) {
          if (bytes.signum() < 0) {
            error(line, where, "expected a size >= 0 such as 64Gi, got " + s.text());
            return null;
          }
          if (bytes.compareTo(BigDecimal.valueOf(MAX_SIZE_BYTES)) > 0) {
            error(line, where, "expected a size of at most 1Pi, got " + s.text());
            return null;
          }
          try {
            return bytes.longValueExact();
          } catch (ArithmeticException e) {
            error(line, where, "expected a whole number of bytes, got " + s.text());
            return null;
          }
        }
      }
      error(line, where, "expected a size such as 64Gi, got " + n.shown());
      return null;
    }

    /** Reads {@code spec.node} or one exception of {@code spec.nodes}. */
    private NodeDef nodeDef(MapNode m, String path, int line, boolean exception) {
      if (!exception) {
        checkKeys(m, path);
      }
      NodeDef def = new NodeDef();
      def.line = line;
      def.cores = whole(m, path, "cores", 1, line, !exception);
      Entry ch = m.entries().get("channels");
      Entry mem = m.entries().get("memory");
      if (ch != null && mem != null) {
        error(mem.keyLine(), path + ".memory",
            "expected either channels or memory, not both (memory comes from the DIMMs when"
                + " channels are given)");
      } else if (ch == null && mem == null && !exception) {
        error(line, path + ".channels",
            "missing; expected the memory channels with their DIMM sizes, or memory per node");
      }
      if (ch != null) {
        def.channels = channels(ch, path + ".channels");
        def.channelsLine = ch.keyLine();
      } else if (mem != null) {
        Long bytes = size(mem.value(), path + ".memory", mem.keyLine());
        if (bytes != null && bytes == 0) {
          error(mem.keyLine(), path + ".memory", "expected a size > 0 such as 256Gi, got "
              + mem.value().shown());
        }
        def.memory = bytes;
        def.memoryLine = mem.keyLine();
      }
      Entry hp = m.entries().get("hugepages");
      if (hp != null) {
        def.hugepages = hugepages(hp, path + ".hugepages");
        def.hugepagesLine = hp.keyLine();
        def.hugepagesPath = path + ".hugepages";
      }
      Entry dev = m.entries().get("devices");
      if (dev != null) {
        def.devices = devices(dev, path + ".devices");
      }
      return def;
    }

    private List<MemoryChannel> channels(Entry e, String path) {
      if (!(e.value() instanceof ListNode list) || list.items().isEmpty()) {
        error(e.keyLine(), path,
            "expected a list of channels, each a list of DIMM sizes such as [32Gi], got "
                + e.value().shown());
        return null;
      }
      List<MemoryChannel> out = new ArrayList<>();
      boolean ok = true;
      long total = 0;
      for (int i = 0; i < list.items().size(); i++) {
        Node c = list.items().get(i);
        String cp = path + "[" + i + "]";
        if (!(c instanceof ListNode dimms)) {
          error(c.line(), cp, "expected a list of DIMM sizes such as [32Gi] ([] for an empty"
              + " channel), got " + c.shown());
          ok = false;
          continue;
        }
        List<Long> sizes = new ArrayList<>();
        for (int j = 0; j < dimms.items().size(); j++) {
          Node d = dimms.items().get(j);
          Long b = size(d, cp + "[" + j + "]", d.line());
          if (b == null) {
            ok = false;
          } else if (b == 0) {
            error(d.line(), cp + "[" + j + "]",
                "expected a DIMM size > 0 such as 32Gi, got " + d.shown()
                    + " (leave the channel's list empty for no DIMM)");
            ok = false;
          } else {
            sizes.add(b);
            total += b;
          }
        }
        out.add(new MemoryChannel("channel " + i, sizes));
      }
      if (ok && total == 0) {
        error(e.keyLine(), path, "expected at least one DIMM on the node, got only empty channels");
        return null;
      }
      return ok ? out : null;
    }

    private Resources hugepages(Entry e, String path) {
      if (!(e.value() instanceof MapNode m)) {
        error(e.keyLine(), path,
            "expected a mapping of page size to page count such as 2Mi: 1024, got "
                + e.value().shown());
        return null;
      }
      Map<String, Long> out = new TreeMap<>();
      for (Entry pe : m.entries().values()) {
        String where = path + "." + pe.key();
        OptionalLong pageSize = ByteUnits.parseSimple(pe.key());
        if (pageSize.isEmpty() || pageSize.getAsLong() <= 0) {
          error(pe.keyLine(), where, "expected a page size such as 2Mi or 1Gi, got " + pe.key());
          continue;
        }
        Integer count = wholeValue(pe.value(), where, 0, "expected a whole number >= 0 of pages",
            pe.keyLine());
        if (count != null) {
          long size = pageSize.getAsLong();
          if (count > 0 && size > MAX_SIZE_BYTES / count) {
            error(pe.keyLine(), where, "expected pages adding up to at most 1Pi, got " + count
                + " pages of " + pe.key());
            continue;
          }
          out.put("hugepages-" + pe.key(), size * count);
        }
      }
      return Resources.of(out);
    }

    private Resources devices(Entry e, String path) {
      if (!(e.value() instanceof MapNode m)) {
        error(e.keyLine(), path,
            "expected a mapping of extended resource name to count such as"
                + " example.com/accelerator: 2, got " + e.value().shown());
        return null;
      }
      Map<String, Long> out = new TreeMap<>();
      for (Entry de : m.entries().values()) {
        String where = path + "." + de.key();
        int slash = de.key().indexOf('/');
        if (slash <= 0 || slash == de.key().length() - 1 || de.key().indexOf('/', slash + 1) >= 0) {
          error(de.keyLine(), where,
              "expected an extended resource name such as example.com/accelerator, got "
                  + de.key());
          continue;
        }
        Integer count = wholeValue(de.value(), where, 0, "expected a whole number >= 0",
            de.keyLine());
        if (count != null) {
          out.put(de.key(), (long) count);
        }
      }
      return Resources.of(out);
    }

    private Optional<List<List<Integer>>> distances(Entry e, int nodeCount) {
      String path = "spec.distances";
      if (!(e.value() instanceof ListNode rows)) {
        error(e.keyLine(), path, "expected a list of rows of distances, got " + e.value().shown());
        return Optional.empty();
      }
      List<List<Integer>> matrix = new ArrayList<>();
      List<int[]> lines = new ArrayList<>();
      boolean ok = true;
      for (int i = 0; i < rows.items().size(); i++) {
        Node r = rows.items().get(i);
        if (!(r instanceof ListNode row)) {
          error(r.line(), path + "[" + i + "]",
              "expected a list of distances such as [10, 21], got " + r.shown());
          ok = false;
          matrix.add(List.of());
          lines.add(null);
          continue;
        }
        List<Integer> values = new ArrayList<>();
        int[] rowLines = new int[row.items().size()];
        for (int j = 0; j < row.items().size(); j++) {
          Node v = row.items().get(j);
          rowLines[j] = v.line();
          Integer d =
              wholeValue(v, path + "[" + i + "][" + j + "]", 0,
                  "expected a whole number from 10 to 255", v.line());
          if (d == null) {
            ok = false;
            rowLines[j] = -1;
            values.add(i == j ? Slit.LOCAL : Slit.UNREACHABLE);
          } else {
            values.add(d);
          }
        }
        matrix.add(values);
        lines.add(rowLines);
      }
      if (nodeCount <= 0) {
        return Optional.empty();
      }
      for (Slit.Problem p : Slit.validate(matrix, nodeCount)) {
        if (p.row() >= 0 && (lines.get(p.row()) == null
            || (p.column() >= 0 && lines.get(p.row())[p.column()] < 0))) {
          continue; // already reported as not a list or not a number
        }
        ok = false;
        if (p.row() < 0) {
          error(e.keyLine(), path, p.message());
        } else if (p.column() < 0) {
          error(rows.items().get(p.row()).line(), path + "[" + p.row() + "]", p.message());
        } else {
          error(lines.get(p.row())[p.column()], path + "[" + p.row() + "][" + p.column() + "]",
              p.message());
        }
      }
      return ok ? Optional.of(matrix) : Optional.empty();
    }
  }
}
