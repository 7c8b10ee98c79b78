package dev.numafit.shape;

import dev.numafit.diag.Diagnostic;
import dev.numafit.host.ByteUnits;
import dev.numafit.host.HostProfile;
import dev.numafit.host.NumaNode;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Derives worker shapes from a host profile (see docs/shapes.md).
 *
 * <p>The rule of the trade is that a worker VM fits inside one NUMA node: its vCPUs on that node's
 * cores and its memory from that node's DIMMs. So the one-node worker of a node has the node's
 * physical cores (threads with {@code vcpuPerThread}) less the hypervisor's reserved cores on it
 * (whole cores taken from node 0 upward), times the overcommit ratio, rounded down; and the node's
 * memory less its equal share of the hypervisor memory reserve and less one per-VM overhead,
 * rounded down to a whole GiB. The pool shape is the minimum over the nodes in each dimension, so
 * one shape fits every node.
 */
public final class ShapeDeriver {
  private static final long GIB = ByteUnits.GIB;

  /** Worker counts per node compared against the one-node worker. */
  public static final List<Integer> SPLIT_COUNTS = List.of(2, 4);

  private final ShapeOptions options;

  public ShapeDeriver(ShapeOptions options) {
    this.options = Objects.requireNonNull(options, "options");
  }

  /** Whole cores the hypervisor keeps on each node: the reserve taken from node 0 upward. */
  public static int[] reservedCoresPerNode(HostProfile profile) {
    int[] out = new int[profile.nodes().size()];
    int left = profile.hypervisorCores();
    for (int i = 0; i < out.length && left > 0; i++) {
      out[i] = Math.min(left, profile.nodes().get(i).cores());
      left -= out[i];
    }
    return out;
  }

  /** vCPUs a node hands to workers: counted cores or threads less reserved cores, × overcommit. */
  public long nodeVcpus(HostProfile profile, int nodeIndex) {
    NumaNode n = profile.nodes().get(nodeIndex);
    long cores = n.cores() - reservedCoresPerNode(profile)[nodeIndex];
    long counted = options.vcpuPerThread() ? cores * n.threadsPerCore() : cores;
    return BigDecimal.valueOf(counted)
        .multiply(options.cpuOvercommit())
        .setScale(0, RoundingMode.FLOOR)
        .longValueExact();
  }

  /**
   * Memory of {@code nodeCount} nodes with {@code totalBytes} installed, less their share of the
   * hypervisor reserve and {@code vms} per-VM overheads, divided among {@code vms} workers and
   * rounded down to a whole GiB. Exact: the reserve share is never rounded on its own.
   */
  private static long workerMemory(HostProfile p, long totalBytes, int nodeCount, int vms) {
    int n = p.nodes().size();
    // (total − reserve × nodeCount / n − vms × overhead) / vms, floored to GiB, in integers.
    BigInteger numerator =
        BigInteger.valueOf(totalBytes)
            .multiply(BigInteger.valueOf(n))
            .subtract(
                BigInteger.valueOf(p.hypervisorMemoryBytes()).multiply(BigInteger.valueOf(nodeCount)))
            .subtract(
                BigInteger.valueOf(p.perVmOverheadBytes())
                    .multiply(BigInteger.valueOf((long) vms * n)));
    if (numerator.signum() <= 0) {
      return 0;
    }
    BigInteger denominator = BigInteger.valueOf((long) vms * n).multiply(BigInteger.valueOf(GIB));
    return numerator.divide(denominator).longValueExact() * GIB;
  }

  /** Memory of a node left to workers after its share of the hypervisor reserve, floored bytes. */
  private static long nodeMemoryForWorkers(HostProfile p, int nodeIndex) {
    int n = p.nodes().size();
    long num =
        Math.subtractExact(
            Math.multiplyExact(p.nodes().get(nodeIndex).memoryBytes(), n),
            p.hypervisorMemoryBytes());
    return Math.max(0, Math.floorDiv(num, n));
  }

  private static Resources withEphemeral(HostProfile p, Resources extra) {
    OptionalLong eph = p.ephemeralStoragePerWorker();
    return eph.isPresent() ? extra.with(Resources.EPHEMERAL_STORAGE, eph.getAsLong()) : extra;
  }

  /** The largest one-node worker of each node. */
  public List<NodeWorker> perNode(HostProfile profile) {
    List<NodeWorker> out = new ArrayList<>();
    for (int i = 0; i < profile.nodes().size(); i++) {
      NumaNode n = profile.nodes().get(i);
      out.add(
          new NodeWorker(
              n.id(),
              nodeVcpus(profile, i),
              workerMemory(profile, n.memoryBytes(), 1, 1),
              withEphemeral(profile, n.extraCapacity())));
    }
    return out;
  }

  /** The pool shape: one worker per node, the minimum over the nodes in each dimension. */
  public WorkerShape oneNode(HostProfile profile) {
    return split(profile, 1);
  }

  /**
   * {@code k} workers per node: vCPUs = floor(node vCPUs / k), memory = (node memory − reserve share
   * − k × overhead) / k rounded down to a whole GiB, hugepages (whole pages) and devices divided by
   * k and rounded down; ephemeral storage stays per worker as the profile gives it. The minimum
   * over the nodes in each dimension.
   */
  public WorkerShape split(HostProfile profile, int k) {
    if (k < 1) {
      throw new IllegalArgumentException("workers per node must be >= 1, was " + k);
    }
    long vcpus = Long.MAX_VALUE;
    long memory = Long.MAX_VALUE;
    List<Resources> extras = new ArrayList<>();
    for (int i = 0; i < profile.nodes().size(); i++) {
      NumaNode n = profile.nodes().get(i);
      vcpus = Math.min(vcpus, nodeVcpus(profile, i) / k);
      memory = Math.min(memory, workerMemory(profile, n.memoryBytes(), 1, k));
      extras.add(divide(n.extraCapacity(), k));
    }
    return new WorkerShape(
        k == 1 ? ShapeKind.ONE_NODE : ShapeKind.SPLIT_NODE,
        k,
        1,
        vcpus,
        memory,
        withEphemeral(profile, minimum(extras)));
  }

  /**
   * A spanning shape: {@code 2-nodes} (two neighbouring nodes of a socket, only with two or more
   * nodes per socket), {@code socket} or {@code host}; the minimum over the possible placements.
   * Empty for other kinds and for 2-nodes on a host with one node per socket.
   */
  public Optional<WorkerShape> spanning(HostProfile profile, ShapeKind kind) {
    List<List<Integer>> groups = new ArrayList<>();
    int nps = profile.nodesPerSocket();
    switch (kind) {
      case TWO_NODES -> {
        if (nps < 2) {
          return Optional.empty();
        }
        for (int s = 0; s < profile.sockets(); s++) {
          for (int j = 0; j + 1 < nps; j++) {
            groups.add(List.of(s * nps + j, s * nps + j + 1));
          }
        }
      }
      case SOCKET -> {
        for (int s = 0; s < profile.sockets(); s++) {
          List<Integer> g = new ArrayList<>();
          for (int j = 0; j < nps; j++) {
            g.add(s * nps + j);
          }
          groups.add(g);
        }
      }
      case HOST -> {
        List<Integer> g = new ArrayList<>();
        for (int i = 0; i < profile.nodes().size(); i++) {
          g.add(i);
        }
        groups.add(g);
      }
      default -> {
        return Optional.empty();
      }
    }
    long vcpus = Long.MAX_VALUE;
    long memory = Long.MAX_VALUE;
    List<Resources> extras = new ArrayList<>();
    int spanned = groups.get(0).size();
    for (List<Integer> g : groups) {
      long v = 0;
      long mem = 0;
      Resources extra = Resources.EMPTY;
      for (int i : g) {
        v += nodeVcpus(profile, i);
        mem = Math.addExact(mem, profile.nodes().get(i).memoryBytes());
        extra = extra.plus(profile.nodes().get(i).extraCapacity());
      }
      vcpus = Math.min(vcpus, v);
      memory = Math.min(memory, workerMemory(profile, mem, g.size(), 1));
      extras.add(extra);
    }
    return Optional.of(
        new WorkerShape(kind, 1, spanned, vcpus, memory, withEphemeral(profile, minimum(extras))));
  }

  /** Every shape of the profile, with notes and warnings. */
  public ShapeSet derive(HostProfile profile) {
    List<NodeWorker> perNode = perNode(profile);
    WorkerShape pool = oneNode(profile);
    List<WorkerShape> splits = new ArrayList<>();
    for (int k : SPLIT_COUNTS) {
      splits.add(split(profile, k));
    }
    List<WorkerShape> spanning = new ArrayList<>();
    int lastSpan = 1;
    for (ShapeKind kind : List.of(ShapeKind.TWO_NODES, ShapeKind.SOCKET, ShapeKind.HOST)) {
      Optional<WorkerShape> s = spanning(profile, kind);
      if (s.isPresent() && s.get().nodesSpanned() > lastSpan) {
        spanning.add(s.get());
        lastSpan = s.get().nodesSpanned();
      }
    }
    List<String> notes = new ArrayList<>(unusedNotes(perNode, pool));
    notes.add(topologyAdvice(pool));
    List<Diagnostic> warnings = new ArrayList<>();
    if (options.overcommitted()) {
      warnings.add(
          Diagnostic.warning(
              profile.source(),
              "cpu overcommit " + options.cpuOvercommit().stripTrailingZeros().toPlainString()
                  + ": workers get more vCPUs than the node has "
                  + (options.vcpuPerThread() ? "threads" : "cores")
                  + "; NUMA locality and consistent performance suffer"));
    }
    if (pool.vcpus() == 0 || pool.memoryBytes() == 0) {
      warnings.add(
          Diagnostic.warning(
              profile.source(),
              "the smallest node leaves no room for a worker after the hypervisor's reserve ("
                  + pool.vcpus() + " vCPUs, " + ByteUnits.format(pool.memoryBytes()) + ")"));
    }
    return new ShapeSet(perNode, pool, splits, spanning, notes, warnings);
  }

  /** What each node larger than the pool shape leaves unused, one note per such node. */
  static List<String> unusedNotes(List<NodeWorker> perNode, WorkerShape pool) {
    List<String> notes = new ArrayList<>();
    TreeSet<String> partial = new TreeSet<>();
    for (NodeWorker w : perNode) {
      List<String> parts = new ArrayList<>();
      if (w.vcpus() > pool.vcpus()) {
        parts.add(vcpus(w.vcpus() - pool.vcpus()));
      }
      if (w.memoryBytes() > pool.memoryBytes()) {
        parts.add(ByteUnits.format(w.memoryBytes() - pool.memoryBytes()) + " of memory");
      }
      for (String r : w.extraCapacity().names()) {
        long more = w.extraCapacity().get(r) - pool.extraCapacity().get(r);
        if (more > 0) {
          parts.add(describe(r, more));
        }
        if (pool.extraCapacity().get(r) == 0) {
          partial.add(r);
        }
      }
      if (!parts.isEmpty()) {
        notes.add("node " + w.node() + " leaves " + String.join(", ", parts)
            + " unused by a pool-shaped worker");
      }
    }
    for (String r : partial) {
      notes.add(r + " is not on every node: a pool-shaped worker cannot count on it");
    }
    return notes;
  }

  /** The advice for the VM's virtual topology. */
  public static String topologyAdvice(WorkerShape shape) {
    if (shape.nodesSpanned() <= 1) {
      return "give each worker VM one virtual socket with all its " + shape.vcpus()
          + " vCPUs, so the guest sees one NUMA node that matches the physical one";
    }
    return "a worker VM of " + shape.vcpus() + " vCPUs spans " + shape.nodesSpanned()
        + " NUMA nodes: give it " + shape.nodesSpanned()
        + " virtual NUMA nodes matching the physical ones, so the guest's kubelet can align pods"
        + " to one of them";
  }

  /**
   * How many workers of {@code shape} one host carries, by vCPUs and memory (each worker also costs
   * the per-VM overhead). A shape that fits a node is counted node by node; a shape wider than every
   * node is a spanning worker, counted over groups of as many neighbouring nodes as it needs.
   */
  public HostFit workersPerHost(HostProfile profile, WorkerShape shape) {
    return fitOf(profile, shape);
  }

  /**
   * Where {@code shape}'s workers sit on one host: node by node when the shape fits a node, else in
   * groups of as many neighbouring nodes as a spanning worker needs (the same count as {@link
   * #workersPerHost}).
   */
  public HostLayout layout(HostProfile profile, WorkerShape shape) {
    if (shape.vcpus() <= 0) {
      throw new IllegalArgumentException("a worker needs at least one vCPU");
    }
    long need = Math.addExact(shape.memoryBytes(), profile.perVmOverheadBytes());
    int nodes = profile.nodes().size();
    long[] v = new long[nodes];
    long[] m = new long[nodes];
    long maxV = 0;
    long maxM = 0;
    int total = 0;
    List<HostLayout.Group> single = new ArrayList<>();
    for (int i = 0; i < nodes; i++) {
      v[i] = nodeVcpus(profile, i);
      m[i] = nodeMemoryForWorkers(profile, i);
      maxV = Math.max(maxV, v[i]);
      maxM = Math.max(maxM, m[i]);
      int fit = (int) Math.min(v[i] / shape.vcpus(), need == 0 ? Long.MAX_VALUE : m[i] / need);
      total += fit;
      single.add(new HostLayout.Group(List.of(profile.nodes().get(i).id()), fit));
    }
    if (total > 0 || maxV == 0 || maxM == 0) {
      return new HostLayout(single, false);
    }
    int span = SpanningSplit.of(shape.vcpus(), need, maxV, maxM).nodes();
    List<HostLayout.Group> groups = new ArrayList<>();
    for (int start = 0; start < nodes; start += span) {
      long gv = 0;
      long gm = 0;
      List<Integer> ids = new ArrayList<>();
      for (int i = start; i < Math.min(nodes, start + span); i++) {
        gv += v[i];
        gm += m[i];
        ids.add(profile.nodes().get(i).id());
      }
      groups.add(new HostLayout.Group(ids, (int) Math.min(gv / shape.vcpus(), gm / need)));
    }
    return new HostLayout(groups, true);
  }

  private HostFit fitOf(HostProfile profile, WorkerShape shape) {
    if (shape.vcpus() <= 0) {
      throw new IllegalArgumentException("a worker needs at least one vCPU");
    }
    long need = Math.addExact(shape.memoryBytes(), profile.perVmOverheadBytes());
    int nodes = profile.nodes().size();
    long[] v = new long[nodes];
    long[] m = new long[nodes];
    int total = 0;
    List<String> notes = new ArrayList<>();
    long maxV = 0;
    long maxM = 0;
    for (int i = 0; i < nodes; i++) {
      v[i] = nodeVcpus(profile, i);
      m[i] = nodeMemoryForWorkers(profile, i);
      maxV = Math.max(maxV, v[i]);
      maxM = Math.max(maxM, m[i]);
      total += (int) Math.min(v[i] / shape.vcpus(), need == 0 ? Long.MAX_VALUE : m[i] / need);
    }
    if (total > 0) {
      for (int i = 0; i < nodes; i++) {
        long fit = Math.min(v[i] / shape.vcpus(), need == 0 ? Long.MAX_VALUE : m[i] / need);
        if (fit == 0) {
          notes.add("node " + profile.nodes().get(i).id() + " is too small for this worker ("
              + v[i] + " vCPUs, " + ByteUnits.format(m[i]) + " after the hypervisor's share)");
        }
      }
      return new HostFit(total, false, Optional.empty(), notes);
    }
    if (maxV == 0 || maxM == 0) {
      notes.add("no node has room for a worker after the hypervisor's reserve");
      return new HostFit(0, true, Optional.empty(), notes);
    }
    SpanningSplit split = SpanningSplit.of(shape.vcpus(), need, maxV, maxM);
    int span = split.nodes();
    int count = 0;
    for (int start = 0; start < nodes; start += span) {
      long gv = 0;
      long gm = 0;
      for (int i = start; i < Math.min(nodes, start + span); i++) {
        gv += v[i];
        gm += m[i];
      }
      count += (int) Math.min(gv / shape.vcpus(), gm / need);
    }
    SpanningSplit vmSplit = SpanningSplit.evenly(shape.vcpus(), shape.memoryBytes(), span);
    notes.add(vmSplit.describe(maxV));
    if (count == 0) {
      notes.add("this worker is larger than a whole host");
    }
    return new HostFit(count, true, Optional.of(vmSplit), notes);
  }

  /** Per-resource minimum over the nodes; a resource missing on any node is missing. */
  private static Resources minimum(List<Resources> all) {
    if (all.isEmpty()) {
      return Resources.EMPTY;
    }
    Map<String, Long> out = new TreeMap<>(all.get(0).asMap());
    for (Resources r : all) {
      out.replaceAll((k, val) -> Math.min(val, r.get(k)));
    }
    return Resources.of(out);
  }

  /** Hugepages divided in whole pages, devices in whole units, both rounded down. */
  private static Resources divide(Resources extra, int k) {
    if (k == 1) {
      return extra;
    }
    Map<String, Long> out = new TreeMap<>();
    for (Map.Entry<String, Long> e : extra.asMap().entrySet()) {
      OptionalLong page = ByteUnits.hugepageSize(e.getKey());
      if (page.isPresent() && page.getAsLong() > 0) {
        long pages = e.getValue() / page.getAsLong() / k;
        out.put(e.getKey(), pages * page.getAsLong());
      } else {
        out.put(e.getKey(), e.getValue() / k);
      }
    }
    return Resources.of(out);
  }

  private static String vcpus(long n) {
    return n + (n == 1 ? " vCPU" : " vCPUs");
  }

  private static String describe(String resource, long amount) {
    if (Resources.isHugepages(resource) || resource.equals(Resources.EPHEMERAL_STORAGE)) {
      return ByteUnits.format(amount) + " of " + resource;
    }
    return amount + " " + resource;
  }
}
