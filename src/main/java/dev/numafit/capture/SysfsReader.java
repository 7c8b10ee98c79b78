package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import dev.numafit.host.Slit;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Reads a host's CPU and NUMA topology from sysfs under a root folder (default {@code /}), the
 * files Linux documents in {@code Documentation/ABI/stable/sysfs-devices-node} and
 * {@code sysfs-devices-system-cpu} (FACTS B3):
 *
 * <ul>
 *   <li>{@code sys/devices/system/node/nodeN/cpulist}, {@code meminfo} (the {@code MemTotal}
 *       line), {@code distance} and {@code hugepages/hugepages-<kB>kB/nr_hugepages};
 *   <li>{@code sys/devices/system/cpu/online} and {@code present};
 *   <li>{@code sys/devices/system/cpu/cpuN/topology/physical_package_id}, {@code die_id},
 *       {@code core_id} and {@code core_cpus_list} (or the older {@code thread_siblings_list}).
 * </ul>
 *
 * <p>A different root lets a tree copied from another host (or a test fixture) be read. Every
 * problem is collected and reported as {@code file:line: error: ...}; nothing is guessed.
 */
public final class SysfsReader {
  private static final Pattern NODE_DIR = Pattern.compile("node(\\d+)");
  private static final Pattern CPU_DIR = Pattern.compile("cpu(\\d+)");
  private static final Pattern HUGE_DIR = Pattern.compile("hugepages-(\\d+)kB");
  private static final Pattern MEMTOTAL =
      Pattern.compile("Node\\s+(\\d+)\\s+MemTotal:\\s+(\\d+)\\s+kB\\s*");

  private final Path root;

  /** A reader for the sysfs tree below {@code root} ({@code /} on the live host). */
  public SysfsReader(Path root) {
    this.root = Objects.requireNonNull(root, "root");
  }

  /** The folder holding the NUMA node directories under this reader's root. */
  public Path nodeDirectory() {
    return root.resolve("sys/devices/system/node");
  }

  /** The folder holding the CPU directories under this reader's root. */
  public Path cpuDirectory() {
    return root.resolve("sys/devices/system/cpu");
  }

  /**
   * Reads nodes and CPUs.
   *
   * @throws InputException with every problem found, each naming file and line
   */
  public CapturedTopology read() throws InputException {
    List<Diagnostic> errors = new ArrayList<>();
    List<NodeEntry> nodes = readNodes(errors);
    // A node that could not be read leaves its CPUs without a node: say so only when all were read.
    boolean nodesComplete = errors.isEmpty();
    Map<Integer, Integer> nodeOfCpu = new TreeMap<>();
    for (NodeEntry n : nodes) {
      for (int c : n.cpus()) {
        Integer before = nodeOfCpu.put(c, n.id());
        if (before != null) {
          errors.add(
              Diagnostic.error(
                  at(n.source().file() + "/cpulist", 1),
                  "CPU " + c + " is listed by node" + before + " and node" + n.id()
                      + ": expected each CPU in one node"));
        }
      }
    }
    List<CpuEntry> cpus = new ArrayList<>();
    List<Integer> offline = new ArrayList<>();
    readCpus(nodeOfCpu, nodesComplete, cpus, offline, errors);
    if (!errors.isEmpty()) {
      errors.sort(null);
      throw new InputException(errors);
    }
    return new CapturedTopology("sysfs " + cpuDirectory(), cpus, offline, nodes);
  }

  private List<NodeEntry> readNodes(List<Diagnostic> errors) {
    Path dir = nodeDirectory();
    List<Integer> ids = numberedDirs(dir, NODE_DIR);
    if (ids.isEmpty()) {
      errors.add(
          Diagnostic.error(
              at(dir.toString(), 0),
              "expected NUMA node folders node0, node1, ... (a kernel without NUMA support has"
                  + " none: give --lscpu and --dmidecode instead)"));
      return List.of();
    }
    List<NodeEntry> nodes = new ArrayList<>();
    for (int id : ids) {
      Path nd = dir.resolve("node" + id);
      Optional<List<Integer>> cpus = readCpuList(nd.resolve("cpulist"), true, errors);
      Optional<Long> mem = readMemTotal(nd.resolve("meminfo"), id, errors);
      Optional<List<Integer>> dist = readDistances(nd.resolve("distance"), errors);
      SortedMap<Long, Long> huge = readHugepages(nd.resolve("hugepages"), errors);
      if (cpus.isPresent() && mem.isPresent() && dist.isPresent()) {
        nodes.add(new NodeEntry(id, cpus.get(), mem.get(), huge, dist.get(), at(nd.toString(), 0)));
      }
    }
    if (nodes.size() == ids.size()) {
      checkDistances(dir, nodes, errors);
    }
    return nodes;
  }

  /** Each row has one value per node; SLIT rules (FACTS B2) as {@link Slit} checks them. */
  private void checkDistances(Path dir, List<NodeEntry> nodes, List<Diagnostic> errors) {
    int n = nodes.size();
    for (int i = 0; i < n; i++) {
      NodeEntry node = nodes.get(i);
      SourceRef where = at(dir.resolve("node" + node.id()).resolve("distance").toString(), 1);
      List<Integer> row = node.distances();
      if (row.size() != n) {
        errors.add(
            Diagnostic.error(
                where,
                "expected " + n + " distances (one per node: " + nodeNames(nodes) + "), got "
                    + row.size() + ": \"" + joined(row) + "\""));
        continue;
      }
      for (int j = 0; j < n; j++) {
        final int column = j;
        Slit.checkEntry(i, j, row.get(j))
            .ifPresent(
                p ->
                    errors.add(
                        Diagnostic.error(
                            where,
                            "distance to node" + nodes.get(column).id() + ": " + p.message())));
      }
    }
  }

  private static String nodeNames(List<NodeEntry> nodes) {
    StringBuilder b = new StringBuilder();
    for (NodeEntry e : nodes) {
      b.append(b.length() == 0 ? "" : ", ").append("node").append(e.id());
    }
    return b.toString();
  }

  private static String joined(List<Integer> row) {
    StringBuilder b = new StringBuilder();
    for (int v : row) {
      b.append(b.length() == 0 ? "" : " ").append(v);
    }
    return b.toString();
  }

  private Optional<List<Integer>> readCpuList(
      Path file, boolean emptyLineAllowed, List<Diagnostic> errors) {
    TextFile t;
    try {
      t = TextFile.read(file);
    } catch (TextFile.ReadFailure f) {
      errors.add(f.diagnostic());
      return Optional.empty();
    }
    if (t.lines().isEmpty()) {
      errors.add(
          Diagnostic.error(
              t.at(1),
              "empty file: expected a CPU list such as 0-3,8-11"
                  + (emptyLineAllowed ? " (or an empty line for a node without CPUs)" : "")));
      return Optional.empty();
    }
    try {
      return Optional.of(CpuLists.parse(t.lines().get(0)));
    } catch (IllegalArgumentException e) {
      errors.add(Diagnostic.error(t.at(1), e.getMessage()));
      return Optional.empty();
    }
  }

  private Optional<Long> readMemTotal(Path file, int id, List<Diagnostic> errors) {
    TextFile t;
    try {
      t = TextFile.read(file);
    } catch (TextFile.ReadFailure f) {
      errors.add(f.diagnostic());
      return Optional.empty();
    }
    String expected = "\"Node " + id + " MemTotal: <number> kB\"";
    if (t.isEmpty()) {
      errors.add(Diagnostic.error(t.at(1), "empty file: expected a line " + expected));
      return Optional.empty();
    }
    for (int i = 0; i < t.lines().size(); i++) {
      String line = t.lines().get(i);
      if (!line.contains("MemTotal")) {
        continue;
      }
      Matcher m = MEMTOTAL.matcher(line.strip());
      if (!m.matches()) {
        errors.add(
            Diagnostic.error(
                t.at(i + 1), "expected a line " + expected + ", got \"" + line.strip() + "\""));
        return Optional.empty();
      }
      if (Integer.parseInt(m.group(1)) != id) {
        errors.add(
            Diagnostic.error(
                t.at(i + 1),
                "expected the MemTotal of node " + id + ", got the line for node " + m.group(1)));
        return Optional.empty();
      }
      try {
        // meminfo's "kB" is KiB (FACTS B3, check value 23).
        return Optional.of(Math.multiplyExact(Long.parseLong(m.group(2)), 1024L));
      } catch (ArithmeticException | NumberFormatException e) {
        errors.add(Diagnostic.error(t.at(i + 1), "MemTotal " + m.group(2) + " kB is too large"));
        return Optional.empty();
      }
    }
    errors.add(
        Diagnostic.error(
            t.at(t.lines().size()),
            "file ends after " + t.lines().size() + (t.lines().size() == 1 ? " line" : " lines") + " without " + expected
                + " (truncated?)"));
    return Optional.empty();
  }

  private Optional<List<Integer>> readDistances(Path file, List<Diagnostic> errors) {
    TextFile t;
    try {
      t = TextFile.read(file);
    } catch (TextFile.ReadFailure f) {
      errors.add(f.diagnostic());
      return Optional.empty();
    }
    if (t.isEmpty()) {
      errors.add(
          Diagnostic.error(
              t.at(1), "empty file: expected one distance per node separated by spaces, e.g. 10 21"));
      return Optional.empty();
    }
    List<Integer> row = new ArrayList<>();
    for (String tok : t.lines().get(0).strip().split("\\s+")) {
      if (!tok.chars().allMatch(Character::isDigit) || tok.length() > 9) {
        errors.add(
            Diagnostic.error(
                t.at(1),
                "expected whole-number distances separated by spaces, e.g. 10 21, got \"" + tok
                    + "\""));
        return Optional.empty();
      }
      row.add(Integer.parseInt(tok));
    }
    return Optional.of(row);
  }

  private SortedMap<Long, Long> readHugepages(Path dir, List<Diagnostic> errors) {
    SortedMap<Long, Long> pages = new TreeMap<>();
    for (Path sizeDir : list(dir)) {
      Matcher m = HUGE_DIR.matcher(sizeDir.getFileName().toString());
      if (!m.matches()) {
        continue;
      }
      Optional<Long> count = readLong(sizeDir.resolve("nr_hugepages"), "a page count", errors);
      count.ifPresent(c -> pages.put(Long.parseLong(m.group(1)), c));
    }
    return pages;
  }

  private void readCpus(
      Map<Integer, Integer> nodeOfCpu,
      boolean nodesComplete,
      List<CpuEntry> cpus,
      List<Integer> offline,
      List<Diagnostic> errors) {
    Path dir = cpuDirectory();
    List<Integer> dirs = numberedDirs(dir, CPU_DIR);
    List<Integer> online;
    if (Files.isRegularFile(dir.resolve("online"))) {
      Optional<List<Integer>> o = readCpuList(dir.resolve("online"), false, errors);
      if (o.isEmpty()) {
        return;
      }
      online = o.get();
    } else {
      online = new ArrayList<>();
      for (int c : dirs) {
        if (!Files.isRegularFile(dir.resolve("cpu" + c).resolve("online"))
            || readLong(dir.resolve("cpu" + c).resolve("online"), "0 or 1", errors).orElse(1L)
                != 0L) {
          online.add(c);
        }
      }
    }
    TreeSet<Integer> present = new TreeSet<>(dirs);
    if (Files.isRegularFile(dir.resolve("present"))) {
      readCpuList(dir.resolve("present"), false, errors).ifPresent(present::addAll);
    }
    present.removeAll(online);
    offline.addAll(present);

    // A core is named by the lowest CPU among its hardware threads (core_cpus_list); without that
    // file, by the lowest CPU sharing its package, die and core_id.
    Map<String, Integer> coreKeyByIds = new TreeMap<>();
    for (int c : online) {
      Path topo = dir.resolve("cpu" + c).resolve("topology");
      if (!Files.isDirectory(topo)) {
        errors.add(
            Diagnostic.error(
                at(topo.toString(), 0),
                "CPU " + c + " is online but has no topology folder: expected"
                    + " physical_package_id, core_id and core_cpus_list there"));
        continue;
      }
      Optional<Long> pkg = readLong(topo.resolve("physical_package_id"), "a package id", errors);
      Optional<Long> core = readLong(topo.resolve("core_id"), "a core id", errors);
      Optional<Long> die =
          Files.isRegularFile(topo.resolve("die_id"))
              ? readLong(topo.resolve("die_id"), "a die id", errors)
              : Optional.of(-1L);
      Path siblingsFile =
          Files.isRegularFile(topo.resolve("core_cpus_list"))
              ? topo.resolve("core_cpus_list")
              : topo.resolve("thread_siblings_list");
      Optional<List<Integer>> siblings =
          Files.isRegularFile(siblingsFile)
              ? readCpuList(siblingsFile, false, errors)
              : Optional.of(List.of());
      if (pkg.isEmpty() || core.isEmpty() || die.isEmpty() || siblings.isEmpty()) {
        continue;
      }
      int coreKey;
      if (!siblings.get().isEmpty()) {
        if (!siblings.get().contains(c)) {
          errors.add(
              Diagnostic.error(
                  at(siblingsFile.toString(), 1),
                  "expected the list of CPU " + c + "'s core to include CPU " + c + ", got "
                      + CpuLists.format(siblings.get())));
          continue;
        }
        coreKey = siblings.get().get(0);
      } else {
        coreKey = coreKeyByIds.computeIfAbsent(pkg.get() + "/" + die.get() + "/" + core.get(), k -> c);
      }
      Integer node = nodeOfCpu.get(c);
      if (node == null) {
        if (!nodesComplete) {
          continue;
        }
        errors.add(
            Diagnostic.error(
                at(nodeDirectory().toString(), 0),
                "CPU " + c + " is online but no node's cpulist names it: expected every online"
                    + " CPU in one node"));
        continue;
      }
      cpus.add(
          new CpuEntry(c, pkg.get().intValue(), die.get().intValue(), coreKey, node));
    }
  }

  private Optional<Long> readLong(Path file, String what, List<Diagnostic> errors) {
    TextFile t;
    try {
      t = TextFile.read(file);
    } catch (TextFile.ReadFailure f) {
      errors.add(f.diagnostic());
      return Optional.empty();
    }
    if (t.isEmpty()) {
      errors.add(Diagnostic.error(t.at(1), "empty file: expected " + what + " (a whole number)"));
      return Optional.empty();
    }
    String s = t.lines().get(0).strip();
    try {
      return Optional.of(Long.parseLong(s));
    } catch (NumberFormatException e) {
      errors.add(
          Diagnostic.error(t.at(1), "expected " + what + " (a whole number), got \"" + s + "\""));
      return Optional.empty();
    }
  }

  private static List<Integer> numberedDirs(Path dir, Pattern p) {
    TreeSet<Integer> ids = new TreeSet<>();
    for (Path child : list(dir)) {
      Matcher m = p.matcher(child.getFileName().toString());
      if (m.matches() && Files.isDirectory(child) && m.group(1).length() < 9) {
        ids.add(Integer.parseInt(m.group(1)));
      }
    }
    return List.copyOf(ids);
  }

  private static List<Path> list(Path dir) {
    if (!Files.isDirectory(dir)) {
      return List.of();
    }
    try (Stream<Path> s = Files.list(dir)) {
      return s.sorted().toList();
    } catch (IOException e) {
      return List.of();
    }
  }

  private static SourceRef at(String file, int line) {
    return new SourceRef(file, line);
  }
}
