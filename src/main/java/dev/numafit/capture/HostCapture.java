package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Derives a host's profile facts from what was captured: sockets, nodes per socket, cores and
 * threads per node, memory per node, the distance matrix, and the memory channel population when
 * SMBIOS slot data allows it. Pure: works on values only.
 */
public final class HostCapture {
  private static final long GIB = 1L << 30;

  private HostCapture() {}

  /** A node with CPUs, before it gets its profile number. */
  private record Pending(int sourceId, int socket, List<CpuEntry> cpus) {}

  /**
   * Derives the host.
   *
   * @param topology CPUs and, from sysfs, nodes with memory and distances
   * @param dimmSource the name of the dmidecode text, empty without SMBIOS data
   * @param dimms the slots read from it (empty without SMBIOS data)
   * @throws IllegalArgumentException when no node has CPUs, or memory per node is unknown (lscpu
   *     without SMBIOS data); the message says which input to add
   */
  public static CapturedHost derive(
      CapturedTopology topology, Optional<String> dimmSource, List<MemoryDevice> dimms) {
    List<Diagnostic> warnings = new ArrayList<>();
    Map<Integer, NodeEntry> sysNodes = new TreeMap<>();
    topology.nodes().forEach(n -> sysNodes.put(n.id(), n));
    SortedMap<Integer, List<CpuEntry>> cpusByNode = new TreeMap<>();
    for (CpuEntry c : topology.cpus()) {
      cpusByNode.computeIfAbsent(c.node(), k -> new ArrayList<>()).add(c);
    }
    TreeSet<Integer> allNodeIds = new TreeSet<>(sysNodes.keySet());
    allNodeIds.addAll(cpusByNode.keySet());

    // Sockets are numbered 0.. in package-id order.
    TreeSet<Integer> packages = new TreeSet<>();
    topology.cpus().forEach(c -> packages.add(c.socket()));
    List<Integer> packageOrder = List.copyOf(packages);

    List<Pending> pending = new ArrayList<>();
    for (int id : allNodeIds) {
      List<CpuEntry> cpus = cpusByNode.getOrDefault(id, List.of());
      NodeEntry sys = sysNodes.get(id);
      if (cpus.isEmpty()) {
        warnings.add(
            Diagnostic.warning(
                sys == null ? null : sys.source(),
                "node " + id + " has no online CPUs"
                    + (sys != null && sys.memoryBytes() > 0
                        ? " (a memory-only node with " + gib(sys.memoryBytes()) + ")"
                        : "")
                    + ": left out of the profile, no worker can run on it"));
        continue;
      }
      TreeSet<Integer> sockets = new TreeSet<>();
      cpus.forEach(c -> sockets.add(c.socket()));
      if (sockets.size() > 1) {
        warnings.add(
            Diagnostic.warning(
                sys == null ? null : sys.source(),
                "node " + id + " has CPUs on sockets " + sockets
                    + ": counted on the first; check the host's firmware settings"));
      }
      pending.add(new Pending(id, packageOrder.indexOf(sockets.first()), cpus));
    }
    if (pending.isEmpty()) {
      throw new IllegalArgumentException("no NUMA node with online CPUs was found");
    }
    pending.sort(Comparator.comparingInt(Pending::socket).thenComparingInt(Pending::sourceId));

    int sockets = (int) pending.stream().mapToInt(Pending::socket).distinct().count();
    SortedMap<Integer, Integer> nodesOnSocket = new TreeMap<>();
    pending.forEach(p -> nodesOnSocket.merge(p.socket(), 1, Integer::sum));
    int nodesPerSocket = nodesOnSocket.values().stream().mapToInt(Integer::intValue).max().orElse(1);
    if (nodesOnSocket.values().stream().distinct().count() > 1) {
      warnings.add(
          Diagnostic.warning(
              null,
              "sockets have different numbers of NUMA nodes " + nodesOnSocket
                  + " (socket=nodes): the profile says " + nodesPerSocket + " per socket; check"
                  + " the firmware's NUMA settings"));
    }

    if (!topology.offlineCpus().isEmpty()) {
      warnings.add(
          Diagnostic.warning(
              null,
              "CPUs " + CpuLists.format(topology.offlineCpus()) + " are offline: their cores are"
                  + " not counted; bring them online and capture again, or confirm the core"
                  + " counts"));
    }

    // Cores and threads per node.
    List<int[]> coreThreads = new ArrayList<>();
    int hostThreads = Integer.MAX_VALUE;
    int hostThreadsMax = 0;
    for (Pending p : pending) {
      SortedMap<Integer, Integer> perCore = new TreeMap<>();
      p.cpus().forEach(c -> perCore.merge(c.core(), 1, Integer::sum));
      int minT = perCore.values().stream().mapToInt(Integer::intValue).min().orElse(1);
      int maxT = perCore.values().stream().mapToInt(Integer::intValue).max().orElse(1);
      coreThreads.add(new int[] {perCore.size(), minT});
      hostThreads = Math.min(hostThreads, minT);
      hostThreadsMax = Math.max(hostThreadsMax, maxT);
    }
    if (hostThreadsMax != hostThreads) {
      warnings.add(
          Diagnostic.warning(
              null,
              "cores have between " + hostThreads + " and " + hostThreadsMax + " online threads:"
                  + " the profile counts " + hostThreads + " per core"));
    }

    // Memory channels from SMBIOS slots, when their locators can be read.
    List<List<CapturedChannel>> channels = new ArrayList<>();
    pending.forEach(p -> channels.add(List.of()));
    boolean mapped = false;
    boolean installedKnown = dimms.stream().allMatch(d -> !d.installed() || d.sizeBytes().isPresent());
    if (dimmSource.isPresent()) {
      Optional<List<SlotPosition>> positions = SlotMapper.map(dimms);
      if (positions.isPresent() && installedKnown) {
        mapped = mapChannels(pending.size(), socketsOf(pending), dimms, positions.get(), channels,
            warnings);
      }
      if (!mapped) {
        MemoryDevice first = dimms.isEmpty() ? null : dimms.get(0);
        long installed = dimms.stream().filter(MemoryDevice::installed).count();
        long total = dimms.stream().mapToLong(d -> d.sizeBytes().orElse(0L)).sum();
        warnings.add(
            Diagnostic.warning(
                first == null ? null : first.source(),
                "channel population to confirm: the slot locators"
                    + (first == null ? "" : " (such as \"" + first.label() + "\")")
                    + " do not map to sockets and channels" + (installedKnown ? "" : " or a size"
                    + " is Unknown") + "; found " + dimms.size() + " slots, " + installed
                    + " installed, " + gib(total) + " in all; write each node's channels into the"
                    + " profile by hand"));
      } else if (nodesPerSocket > 1) {
        warnings.add(
            Diagnostic.warning(
                null,
                "channels of each socket are split evenly over its " + nodesPerSocket
                    + " nodes in locator order: to confirm against the host's documentation"));
      }
      dimmWarnings(dimms, warnings);
    } else {
      warnings.add(
          Diagnostic.warning(
              null,
              "no SMBIOS memory data (--dmidecode): memory type, speed and channel population are"
                  + " unknown; memory per node comes from the kernel; channels to confirm"));
    }

    // Memory per node.
    long dimmTotal = dimms.stream().mapToLong(d -> d.sizeBytes().orElse(0L)).sum();
    List<CapturedNode> nodes = new ArrayList<>();
    for (int i = 0; i < pending.size(); i++) {
      Pending p = pending.get(i);
      NodeEntry sys = sysNodes.get(p.sourceId());
      List<CapturedChannel> ch = channels.get(i);
      long memory;
      String memorySource;
      if (mapped) {
        memory = ch.stream().flatMap(c -> c.dimmBytes().stream()).mapToLong(Long::longValue).sum();
        memorySource = "sum of the modules in the node's channels (" + dimmSource.get() + ")";
        if (sys != null) {
          checkAgainstKernel(i, sys, memory, warnings);
        }
      } else if (sys != null) {
        memory = sys.memoryBytes();
        memorySource = "MemTotal in " + sys.source().file() + "/meminfo";
      } else if (dimmSource.isPresent() && dimmTotal > 0) {
        memory = dimmTotal / pending.size();
        memorySource = "an equal share of all modules (" + dimmSource.get() + "): to confirm";
      } else {
        throw new IllegalArgumentException(
            "memory per node is unknown: lscpu gives none; add --dmidecode FILE or --sysfs-root"
                + " DIR");
      }
      if (memory == 0) {
        warnings.add(
            Diagnostic.warning(
                sys == null ? null : new SourceRef(sys.source().file() + "/meminfo", 1),
                "node " + p.sourceId() + " has " + p.cpus().size() + " CPUs but no memory: a"
                    + " worker there would run on another node's memory, so it cannot hold a"
                    + " one-node worker; left out of the profile with its "
                    + coreThreads.get(i)[0] + " cores"));
      }
      nodes.add(
          new CapturedNode(
              i,
              p.sourceId(),
              p.socket(),
              p.cpus().stream().map(CpuEntry::cpu).toList(),
              coreThreads.get(i)[0],
              coreThreads.get(i)[1],
              memory,
              memorySource,
              sys == null ? new TreeMap<>() : sys.hugepages(),
              ch,
              mapped && nodesPerSocket == 1));
    }

    // A node with CPUs but no memory cannot hold a one-node worker, and a profile node needs
    // memory: leave it out, renumbering the rest, and say so.
    List<Integer> kept = new ArrayList<>();
    for (int i = 0; i < nodes.size(); i++) {
      if (nodes.get(i).memoryBytes() > 0) {
        kept.add(i);
      }
    }
    if (kept.isEmpty()) {
      throw new IllegalArgumentException(
          "no NUMA node with CPUs has memory: nothing a worker could run on");
    }
    if (kept.size() < nodes.size()) {
      List<CapturedNode> renumbered = new ArrayList<>();
      List<Pending> keptPending = new ArrayList<>();
      for (int i : kept) {
        CapturedNode n = nodes.get(i);
        renumbered.add(
            new CapturedNode(renumbered.size(), n.sourceId(), n.socket(), n.cpus(), n.cores(),
                n.threadsPerCore(), n.memoryBytes(), n.memorySource(), n.hugepages(), n.channels(),
                n.channelsConfirmed()));
        keptPending.add(pending.get(i));
      }
      nodes = renumbered;
      pending = keptPending;
      // Sockets are renumbered 0.. over the nodes kept.
      List<Integer> socketIds = nodes.stream().map(CapturedNode::socket).distinct().sorted().toList();
      List<CapturedNode> resocketed = new ArrayList<>();
      for (CapturedNode n : nodes) {
        resocketed.add(
            new CapturedNode(n.id(), n.sourceId(), socketIds.indexOf(n.socket()), n.cpus(),
                n.cores(), n.threadsPerCore(), n.memoryBytes(), n.memorySource(), n.hugepages(),
                n.channels(), n.channelsConfirmed()));
      }
      nodes = resocketed;
      sockets = socketIds.size();
      SortedMap<Integer, Integer> perSocket = new TreeMap<>();
      nodes.forEach(n -> perSocket.merge(n.socket(), 1, Integer::sum));
      nodesPerSocket = perSocket.values().stream().mapToInt(Integer::intValue).max().orElse(1);
      int threads = nodes.stream().mapToInt(CapturedNode::threadsPerCore).min().orElse(1);
      hostThreads = threads;
    }

    Optional<List<List<Integer>>> distances = Optional.empty();
    if (!sysNodes.isEmpty()
        && pending.stream().allMatch(p -> sysNodes.containsKey(p.sourceId()))
        && sysNodes.values().stream().allMatch(n -> n.distances().size() == sysNodes.size())) {
      List<Integer> order = List.copyOf(sysNodes.keySet());
      List<List<Integer>> m = new ArrayList<>();
      for (Pending p : pending) {
        List<Integer> row = sysNodes.get(p.sourceId()).distances();
        List<Integer> out = new ArrayList<>();
        for (Pending q : pending) {
          out.add(row.get(order.indexOf(q.sourceId())));
        }
        m.add(out);
      }
      distances = Optional.of(m);
    }

    String type = "";
    TreeSet<String> types = new TreeSet<>();
    dimms.stream().filter(MemoryDevice::installed).filter(d -> !d.type().isEmpty())
        .forEach(d -> types.add(d.type()));
    if (types.size() == 1) {
      type = types.first();
    } else if (types.size() > 1) {
      warnings.add(
          Diagnostic.warning(
              null, "modules of different types " + types + ": memory type left unknown"));
    }
    int speed =
        dimms.stream()
            .filter(MemoryDevice::installed)
            .mapToInt(d -> d.configuredSpeedMts() > 0 ? d.configuredSpeedMts() : d.speedMts())
            .filter(s -> s > 0)
            .min()
            .orElse(0);

    warnings.add(
        Diagnostic.warning(
            null,
            "hypervisor reserve to confirm: a capture cannot read it; the profile holds the"
                + " default reservedMemory "
                + gib(CaptureDefaults.reservedMemoryBytes(
                    nodes.stream().mapToLong(CapturedNode::memoryBytes).sum()))
                + " and reservedCores " + CaptureDefaults.RESERVED_CORES));
    warnings.add(
        Diagnostic.warning(
            null,
            "per-VM overhead to confirm: a capture cannot read it; the profile holds the default "
                + gib(CaptureDefaults.PER_VM_OVERHEAD_BYTES)));
    return new CapturedHost(
        sockets,
        nodesPerSocket,
        hostThreads,
        nodes,
        distances,
        type,
        speed,
        topology.cpuSource(),
        dimmSource,
        dimms,
        warnings);
  }

  private static List<Integer> socketsOf(List<Pending> pending) {
    return pending.stream().map(Pending::socket).toList();
  }

  /**
   * Fills each node's channels from the slot positions. A socket's channels, in name order, are
   * split evenly over its nodes in node order.
   *
   * @return false (with a warning) when the slots do not fit the CPU topology
   */
  private static boolean mapChannels(
      int nodeCount,
      List<Integer> socketOfNode,
      List<MemoryDevice> dimms,
      List<SlotPosition> positions,
      List<List<CapturedChannel>> channels,
      List<Diagnostic> warnings) {
    int socketsFromCpus = (int) socketOfNode.stream().distinct().count();
    int socketsFromSlots = positions.stream().mapToInt(SlotPosition::socket).max().orElse(0) + 1;
    if (socketsFromSlots != socketsFromCpus) {
      warnings.add(
          Diagnostic.warning(
              dimms.get(0).source(),
              "the slot locators name " + socketsFromSlots + " sockets but the CPUs are on "
                  + socketsFromCpus));
      return false;
    }
    for (int s = 0; s < socketsFromCpus; s++) {
      final int socket = s;
      TreeMap<String, List<Integer>> slotsByChannel = new TreeMap<>(CHANNEL_ORDER);
      for (int d = 0; d < dimms.size(); d++) {
        if (positions.get(d).socket() == socket) {
          slotsByChannel.computeIfAbsent(positions.get(d).channel(), k -> new ArrayList<>()).add(d);
        }
      }
      List<Integer> nodesHere = new ArrayList<>();
      for (int n = 0; n < nodeCount; n++) {
        if (socketOfNode.get(n) == socket) {
          nodesHere.add(n);
        }
      }
      int k = nodesHere.size();
      if (slotsByChannel.isEmpty() || slotsByChannel.size() % k != 0) {
        warnings.add(
            Diagnostic.warning(
                dimms.get(0).source(),
                "socket " + socket + " has " + slotsByChannel.size() + " channels in the slot"
                    + " locators, which do not split evenly over its " + k + " nodes"));
        return false;
      }
      int perNode = slotsByChannel.size() / k;
      List<String> names = List.copyOf(slotsByChannel.keySet());
      for (int j = 0; j < k; j++) {
        List<CapturedChannel> list = new ArrayList<>();
        for (String name : names.subList(j * perNode, (j + 1) * perNode)) {
          List<Integer> slotIdx = new ArrayList<>(slotsByChannel.get(name));
          slotIdx.sort(Comparator.comparingInt(d -> positions.get(d).slot()));
          List<Long> sizes = new ArrayList<>();
          List<String> labels = new ArrayList<>();
          for (int d : slotIdx) {
            labels.add(dimms.get(d).label());
            dimms.get(d).sizeBytes().ifPresent(sizes::add);
          }
          list.add(new CapturedChannel(name, sizes, labels));
        }
        channels.set(nodesHere.get(j), list);
      }
    }
    for (int n = 0; n < nodeCount; n++) {
      List<CapturedChannel> list = channels.get(n);
      long populated = list.stream().filter(c -> !c.dimmBytes().isEmpty()).count();
      for (CapturedChannel c : list) {
        if (c.dimmBytes().isEmpty()) {
          warnings.add(
              Diagnostic.warning(
                  null,
                  "node " + n + " channel " + c.name() + " has no module (slots "
                      + String.join(", ", c.slots()) + "): " + populated + " of " + list.size()
                      + " channels populated, the node loses that channel's share of bandwidth"));
        }
      }
      TreeSet<Long> sizes = new TreeSet<>();
      list.forEach(c -> sizes.add(c.dimmBytes().stream().mapToLong(Long::longValue).sum()));
      sizes.remove(0L);
      if (sizes.size() > 1) {
        List<String> shown = sizes.stream().map(HostCapture::gib).toList();
        warnings.add(
            Diagnostic.warning(
                null,
                "node " + n + " has unequal memory per channel (" + String.join(", ", shown)
                    + "): interleaving is uneven and bandwidth lower than the channel count"
                    + " suggests"));
      }
    }
    return true;
  }

  /** Channel names in a natural order: numbers numerically, letters alphabetically. */
  private static final Comparator<String> CHANNEL_ORDER =
      Comparator.<String>comparingInt(s -> s.chars().allMatch(Character::isDigit) ? 0 : 1)
          .thenComparingInt(s -> s.chars().allMatch(Character::isDigit) ? Integer.parseInt(s) : 0)
          .thenComparing(Comparator.naturalOrder());

  private static void dimmWarnings(List<MemoryDevice> dimms, List<Diagnostic> warnings) {
    TreeSet<Long> sizes = new TreeSet<>();
    dimms.forEach(d -> d.sizeBytes().ifPresent(sizes::add));
    if (sizes.size() > 1) {
      warnings.add(
          Diagnostic.warning(
              null,
              "modules differ in size (" + String.join(", ", sizes.stream().map(HostCapture::gib)
                  .toList()) + "): check that every channel holds the same amount"));
    }
    for (MemoryDevice d : dimms) {
      if (d.installed() && d.speedMts() > 0 && d.configuredSpeedMts() > 0
          && d.configuredSpeedMts() < d.speedMts()) {
        warnings.add(
            Diagnostic.warning(
                d.source(),
                "module " + d.label() + " runs at " + d.configuredSpeedMts() + " MT/s, below its"
                    + " rated " + d.speedMts() + " MT/s: bandwidth is computed at the lower"
                    + " speed"));
      }
    }
  }

  private static void checkAgainstKernel(
      int node, NodeEntry sys, long dimmBytes, List<Diagnostic> warnings) {
    // The kernel keeps some memory for itself, so MemTotal sits a little below the modules; more
    // than the modules, or far less, means the mapping put modules on the wrong node.
    if (sys.memoryBytes() > dimmBytes || sys.memoryBytes() < dimmBytes * 8 / 10) {
      warnings.add(
          Diagnostic.warning(
              new SourceRef(sys.source().file() + "/meminfo", 1),
              "node " + node + ": the kernel reports " + gib(sys.memoryBytes()) + " but the"
                  + " modules mapped to it total " + gib(dimmBytes) + ": channel mapping to"
                  + " confirm"));
    }
  }

  /** Bytes in GiB with up to two decimals, for messages. */
  static String gib(long bytes) {
    if (bytes % GIB == 0) {
      return (bytes / GIB) + " GiB";
    }
    return new java.math.BigDecimal(bytes)
            .divide(java.math.BigDecimal.valueOf(GIB), 2, java.math.RoundingMode.HALF_UP)
            .stripTrailingZeros()
            .toPlainString()
        + " GiB";
  }
}
