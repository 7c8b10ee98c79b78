package dev.numafit.review;

import dev.numafit.cluster.model.BudgetRecord;
import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.cluster.model.NodeRecord;
import dev.numafit.cluster.model.PodRecord;
import dev.numafit.cluster.model.Taint;
import dev.numafit.cluster.model.WorkloadRecord;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.VectorPacker;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Reviews a node-pool resize on a {@link ClusterModel}. Deterministic: nodes are taken in name
 * order, pods by size then id, so the same model and request give the same review.
 *
 * <p>Under {@code --from running} pods stay where they run unless their node goes: a scale-down
 * removes nodes one at a time, fewest pods to move first, and never a node whose pods cannot go
 * elsewhere while another choice is left; its pods (and the pods pending today that the pool
 * would take) are then placed like a scheduler would place them. A shape change replaces every
 * node, so every pod is placed anew. Under {@code --from declared} the workloads' pods are placed
 * from scratch.
 */
public final class Reviewer {
  /** Candidates tried per removal before an unsafe one is accepted (bounds the search). */
  static final int MAX_TRIALS = 64;

  private static final String HOSTNAME = "kubernetes.io/hostname";

  /**
   * @throws IllegalArgumentException when no node matches the pool selector
   */
  public Review review(ClusterModel m, ResizeRequest r) {
    List<NodeRecord> pool = m.nodes().stream()
        .filter(n -> r.poolValue().equals(n.labels().get(r.poolKey()))).toList();
    if (pool.isEmpty()) {
      throw new IllegalArgumentException("--pool " + r.pool() + ": no node has this label ("
          + m.nodes().size() + " nodes read)");
    }
    List<String> warnings = new ArrayList<>();
    m.missing().forEach(x -> warnings.add("not read: " + x));
    m.namespace().ifPresent(ns -> warnings.add("the read was limited to namespace " + ns
        + ": pods of other namespaces on the pool's nodes are not counted"));
    m.warnings().forEach(warnings::add);

    Set<String> poolNames = new HashSet<>();
    pool.forEach(n -> poolNames.add(n.name()));
    int before = pool.size();
    int after = r.nodes().orElse(before);

    List<SpanningNode> spanning = spanning(pool, r.oneNodeWorker());
    r.shape().ifPresent(s -> r.oneNodeWorker().ifPresent(one -> {
      if (s.capacity().get(Resources.CPU) > one.get(Resources.CPU)
          || s.capacity().get(Resources.MEMORY) > one.get(Resources.MEMORY)) {
        warnings.add("the new shape " + s.label() + " is larger than the host's one-node worker:"
            + " it spans NUMA nodes");
      }
    }));

    String[] dims = dimensions(pool, m, r);
    PoolState today = new PoolState(dims);
    Map<String, PoolState.Node> byName = new HashMap<>();
    for (NodeRecord n : pool) {
      byName.put(n.name(), today.add(n.name(), n.labels(), n.taints(), n.unschedulable(),
          n.allocatable()));
    }
    List<PodItem> poolPods = new ArrayList<>();
    Map<String, PodItem> daemons = new TreeMap<>();
    for (PodRecord p : m.pods()) {
      if (p.scheduled() && poolNames.contains(p.node())) {
        PodItem item = item(today, p);
        PoolState.bind(byName.get(p.node()), item);
        if (p.daemon()) {
          daemons.merge(p.workload().toString(), item,
              (a, b) -> today.size(a, today.nodes.get(0).alloc)
                  >= today.size(b, today.nodes.get(0).alloc) ? a : b);
        } else {
          poolPods.add(item);
        }
      }
    }
    SortedMap<String, Double> utilBefore = today.utilization();
    List<NodeFill> fillBefore = today.fill();
    NodeRecord template = template(pool);
    Map<String, String> commonLabels = commonLabels(pool);
    List<Taint> commonTaints = commonTaints(pool);
    Resources newAlloc = r.shape().map(NodeShape::allocatable).orElse(template.allocatable());

    List<PendingPod> pending = new ArrayList<>();
    List<PodItem> unplaced = new ArrayList<>();
    List<Removal> removals = new ArrayList<>();
    DrainPlan drain = DrainPlan.NONE;
    PoolState state;
    List<PodItem> considered = new ArrayList<>();
    if (r.from() == DemandSource.RUNNING) {
      List<PodItem> waiting = new ArrayList<>();
      for (PodRecord p : m.pods()) {
        if (!p.scheduled() && !p.daemon() && admitsAny(today, item(today, p))) {
          waiting.add(item(today, p));
        }
      }
      considered.addAll(poolPods);
      considered.addAll(waiting);
      if (r.shape().isPresent()) {
        state = new PoolState(dims);
        addNew(state, after, commonLabels, commonTaints, newAlloc, daemons, pending);
        List<PodItem> all = new ArrayList<>(poolPods);
        all.addAll(waiting);
        placeAll(state, all, unplaced);
        List<PodItem> evict = new ArrayList<>(poolPods);
        drain = drain(evict, m, unplaced);
      } else {
        state = today;
        if (after > before) {
          addNew(state, after - before, commonLabels, commonTaints, newAlloc, daemons, pending);
        }
        List<PodItem> evicted = new ArrayList<>();
        if (after < before) {
          scaleDown(state, before - after, removals, evicted, unplaced);
        }
        placeAll(state, waiting, unplaced);
        drain = drain(evicted, m, unplaced);
      }
    } else {
      state = new PoolState(dims);
      List<NodeRecord> kept = r.shape().isPresent() ? List.of()
          : pool.subList(0, Math.min(after, pool.size()));
      for (NodeRecord n : kept) {
        PoolState.Node x = state.add(n.name(), n.labels(), n.taints(), n.unschedulable(),
            n.allocatable());
        bindDaemons(state, x, declaredDaemons(state, m, poolNames, today), pending);
      }
      addNew(state, after - kept.size(), commonLabels, commonTaints, newAlloc,
          declaredDaemons(state, m, poolNames, today), pending);
      List<PodItem> pods = declaredPods(state, m, r.replicas(), poolNames, today);
      considered.addAll(pods);
      placeAll(state, pods, unplaced);
    }
    for (PodItem p : unplaced) {
      pending.add(new PendingPod(p.id(), p.workload(), state.why(p)));
    }
    SortedMap<String, Double> utilAfter = state.utilization();
    List<NodeFill> fillAfter = state.fill();

    // Nodes of the after-shape the same pods need, packed tight by the plan's packer.
    long[] room = state.vector(newAlloc, false);
    for (PodItem d : daemons.values()) {
      for (int i = 0; i < room.length; i++) {
        room[i] = Math.max(0, room[i] - d.req()[i]);
      }
    }
    List<long[]> items = new ArrayList<>();
    TreeSet<String> tooLarge = new TreeSet<>();
    for (PodItem p : considered) {
      if (VectorPacker.fitsEmptyBin(p.req(), room)) {
        items.add(p.req());
      } else {
        tooLarge.add(p.workload());
      }
    }
    OptionalInt needed = OptionalInt.empty();
    OptionalInt lower = OptionalInt.empty();
    if (!items.isEmpty()) {
      long[][] arr = items.toArray(long[][]::new);
      Packing packing = new VectorPacker().pack(arr, room);
      needed = OptionalInt.of(packing.bins());
      lower = OptionalInt.of(LowerBound.of(arr, room));
    }

    Optional<HostFailureCheck> hostCheck = Optional.empty();
    if (r.hostFailures() > 0) {
      hostCheck = Optional.of(hostFailures(state, r));
    }
    pending.sort(Comparator.comparing(PendingPod::pod));
    boolean fits = pending.isEmpty() && drain.blocked().isEmpty()
        && hostCheck.map(HostFailureCheck::fits).orElse(true);
    TreeMap<String, Long> roomMap = new TreeMap<>();
    for (int i = 0; i < dims.length; i++) {
      roomMap.put(i == dims.length - 1 ? Resources.PODS : dims[i], room[i]);
    }
    return new Review(r.pool(), r.from(), before, after, r.shape().map(NodeShape::label),
        r.hostProfile(), fits, pending, spanning, utilBefore, utilAfter, removals, drain, needed,
        lower, new ArrayList<>(tooLarge), hostCheck, considered.size(), Resources.of(roomMap),
        warnings, fillBefore, fillAfter);
  }

  /** Resource order: every resource the pool allocates or a pod requests, then {@code pods}. */
  private static String[] dimensions(List<NodeRecord> pool, ClusterModel m, ResizeRequest r) {
    TreeSet<String> names = new TreeSet<>();
    pool.forEach(n -> names.addAll(n.allocatable().names()));
    r.shape().ifPresent(s -> names.addAll(s.allocatable().names()));
    Set<Resources> seen = new HashSet<>();
    for (PodRecord p : m.pods()) {
      if (seen.add(p.requests())) {
        names.addAll(p.requests().names());
      }
    }
    m.workloads().forEach(w -> names.addAll(w.requests().names()));
    names.remove(Resources.PODS);
    List<String> out = new ArrayList<>(names);
    out.add(Resources.PODS);
    return out.toArray(String[]::new);
  }

  private static PodItem item(PoolState s, PodRecord p) {
    return new PodItem(p.id(), p.workload().toString(), s.vector(p.requests(), true),
        p.placement(), p.budgets(), p.healthy(), p.daemon());
  }

  private static boolean admitsAny(PoolState s, PodItem p) {
    for (PoolState.Node n : s.nodes) {
      if (PoolState.admits(n, p)) {
        return true;
      }
    }
    return false;
  }

  /** Today's nodes larger than the one-node worker, with the resources and amounts over. */
  private static List<SpanningNode> spanning(List<NodeRecord> pool, Optional<Resources> one) {
    List<SpanningNode> out = new ArrayList<>();
    if (one.isEmpty()) {
      return out;
    }
    for (NodeRecord n : pool) {
      List<SpanningNode.Excess> over = new ArrayList<>();
      for (String res : List.of(Resources.CPU, Resources.MEMORY)) {
        long cap = n.capacity().get(res);
        long limit = one.get().get(res);
        if (cap > limit) {
          over.add(new SpanningNode.Excess(res, cap, limit, cap - limit));
        }
      }
      if (!over.isEmpty()) {
        out.add(new SpanningNode(n.name(), over));
      }
    }
    return out;
  }

  /** The node whose allocatable most pool nodes share (ties: first by name). */
  private static NodeRecord template(List<NodeRecord> pool) {
    Map<Resources, Integer> counts = new LinkedHashMap<>();
    pool.forEach(n -> counts.merge(n.allocatable(), 1, Integer::sum));
    int best = counts.values().stream().mapToInt(Integer::intValue).max().orElse(0);
    for (NodeRecord n : pool) {
      if (counts.get(n.allocatable()) == best) {
        return n;
      }
    }
    return pool.get(0);
  }

  private static Map<String, String> commonLabels(List<NodeRecord> pool) {
    Map<String, String> common = new TreeMap<>(pool.get(0).labels());
    for (NodeRecord n : pool) {
      common.entrySet().removeIf(e -> !e.getValue().equals(n.labels().get(e.getKey())));
    }
    common.remove(HOSTNAME);
    return common;
  }

  private static List<Taint> commonTaints(List<NodeRecord> pool) {
    List<Taint> common = new ArrayList<>(pool.get(0).taints());
    for (NodeRecord n : pool) {
      common.retainAll(n.taints());
    }
    return common;
  }

  /** Adds {@code count} new nodes named new-01… with the pool's common labels and DaemonSets. */
  private static void addNew(PoolState s, int count, Map<String, String> labels,
      List<Taint> taints, Resources alloc, Map<String, PodItem> daemons,
      List<PendingPod> pending) {
    int width = Math.max(2, String.valueOf(count).length());
    for (int i = 1; i <= count; i++) {
      PoolState.Node n = s.add(String.format("new-%0" + width + "d", i), labels, taints, false,
          alloc);
      bindDaemons(s, n, daemons, pending);
    }
  }

  private static void bindDaemons(PoolState s, PoolState.Node n, Map<String, PodItem> daemons,
      List<PendingPod> pending) {
    for (PodItem d : daemons.values()) {
      if (!PoolState.admits(n, d)) {
        continue;
      }
      PodItem copy = new PodItem(d.workload() + "@" + n.name, d.workload(), d.req(),
          d.placement(), d.budgets(), true, true);
      if (s.fits(n, copy)) {
        PoolState.bind(n, copy);
      } else {
        pending.add(new PendingPod(copy.id(), copy.workload(),
            String.join(", ", s.reasons(n, copy)) + " (DaemonSet pod on " + n.name + ")"));
      }
    }
  }

  /** Places pods, largest first, each on the node a scheduler would favour. */
  private static void placeAll(PoolState s, List<PodItem> pods, List<PodItem> unplaced) {
    if (s.nodes.isEmpty()) {
      unplaced.addAll(pods);
      return;
    }
    long[] ref = s.nodes.get(0).alloc;
    List<PodItem> order = new ArrayList<>(pods);
    Map<PodItem, Double> size = new HashMap<>();
    order.forEach(p -> size.put(p, s.size(p, ref)));
    order.sort(Comparator.<PodItem>comparingDouble(size::get).reversed()
        .thenComparing(PodItem::id));
    for (PodItem p : order) {
      Optional<PoolState.Node> n = s.choose(p, null);
      if (n.isPresent()) {
        PoolState.bind(n.get(), p);
      } else {
        unplaced.add(p);
      }
    }
  }

  /**
   * Removes {@code count} nodes one at a time. Among the nodes left, fewest pods to move first
   * (ties by name), the first whose pods all fit elsewhere goes. When none is safe, the node whose
   * removal strands the fewest pods goes (then fewest moves, then name), and its stranded pods
   * are pending.
   */
  private static void scaleDown(PoolState s, int count, List<Removal> removals,
      List<PodItem> evicted, List<PodItem> unplaced) {
    Set<String> evictedIds = new HashSet<>();
    long[] ref = s.nodes.get(0).alloc;
    for (int k = 0; k < count; k++) {
      List<PoolState.Node> candidates = new ArrayList<>();
      for (PoolState.Node n : s.nodes) {
        if (!n.removed) {
          candidates.add(n);
        }
      }
      Map<PoolState.Node, Integer> moves = new java.util.IdentityHashMap<>();
      candidates.forEach(n -> moves.put(n, movable(n).size()));
      candidates.sort(Comparator.<PoolState.Node>comparingInt(moves::get)
          .thenComparing(n -> n.name));
      PoolState.Node chosen = null;
      int bestStranded = Integer.MAX_VALUE;
      for (int t = 0; t < Math.min(MAX_TRIALS, candidates.size()); t++) {
        PoolState.Node c = candidates.get(t);
        List<PodItem> stranded = new ArrayList<>();
        List<PoolState.Node> dests = new ArrayList<>();
        List<PodItem> placed = new ArrayList<>();
        List<PodItem> moving = sorted(s, movable(c), ref);
        c.removed = true;
        for (PodItem p : moving) {
          Optional<PoolState.Node> d = s.choose(p, c);
          if (d.isEmpty()) {
            stranded.add(p);
          } else {
            PoolState.bind(d.get(), p);
            placed.add(p);
            dests.add(d.get());
          }
        }
        if (stranded.isEmpty()) {
          removals.add(new Removal(c.name, moving.size(), true, List.of()));
          moving.stream().filter(p -> evictedIds.add(p.id())).forEach(evicted::add);
          chosen = c;
          break;
        }
        for (int i = placed.size() - 1; i >= 0; i--) {
          PoolState.unbindFrom(dests.get(i), placed.get(i));
        }
        c.removed = false;
        if (stranded.size() < bestStranded) {
          bestStranded = stranded.size();
          chosen = c;
        }
      }
      if (chosen != null && !chosen.removed) {
        PoolState.Node c = chosen;
        List<PodItem> moving = sorted(s, movable(c), ref);
        c.removed = true;
        List<String> ids = new ArrayList<>();
        for (PodItem p : moving) {
          Optional<PoolState.Node> d = s.choose(p, c);
          if (d.isPresent()) {
            PoolState.bind(d.get(), p);
          } else {
            ids.add(p.id());
            unplaced.add(p);
          }
        }
        removals.add(new Removal(c.name, moving.size(), false, ids));
        moving.stream().filter(p -> evictedIds.add(p.id())).forEach(evicted::add);
      }
    }
  }

  /** Pods that must move when the node goes: all but its DaemonSet pods. */
  private static List<PodItem> movable(PoolState.Node n) {
    List<PodItem> out = new ArrayList<>();
    for (PodItem p : n.pods) {
      if (!p.daemon()) {
        out.add(p);
      }
    }
    return out;
  }

  private static List<PodItem> sorted(PoolState s, List<PodItem> pods, long[] ref) {
    List<PodItem> order = new ArrayList<>(pods);
    order.sort(Comparator.<PodItem>comparingDouble(p -> -s.size(p, ref))
        .thenComparing(PodItem::id));
    return order;
  }

  /**
   * The drain in rounds. A budget's expected pods are the pods it covers in the model, its
   * healthy pods those bound and Running; each round evicts every pod (in removal order) whose
   * budgets all still allow a disruption. An evicted pod that found a new node counts as healthy
   * again in the next round; one left pending does not.
   */
  static DrainPlan drain(List<PodItem> evict, ClusterModel m, List<PodItem> pending) {
    if (evict.isEmpty()) {
      return DrainPlan.NONE;
    }
    Map<String, BudgetRecord> budgets = new HashMap<>();
    m.budgets().forEach(b -> budgets.put(b.id(), b));
    Map<String, Integer> expected = new HashMap<>();
    Map<String, Integer> healthy = new HashMap<>();
    for (PodRecord p : m.pods()) {
      for (String b : p.budgets()) {
        expected.merge(b, 1, Integer::sum);
        if (p.healthy()) {
          healthy.merge(b, 1, Integer::sum);
        }
      }
    }
    Set<String> pendingIds = new HashSet<>();
    pending.forEach(p -> pendingIds.add(p.id()));
    List<List<String>> rounds = new ArrayList<>();
    List<PodItem> remaining = new ArrayList<>(evict);
    while (!remaining.isEmpty()) {
      Map<String, Integer> usedThisRound = new HashMap<>();
      List<PodItem> round = new ArrayList<>();
      for (PodItem p : remaining) {
        boolean ok = true;
        if (p.healthy()) {
          for (String b : p.budgets()) {
            BudgetRecord rec = budgets.get(b);
            if (rec == null) {
              continue;
            }
            int allowed = rec.allowedDisruptions(expected.getOrDefault(b, 0),
                healthy.getOrDefault(b, 0));
            if (allowed - usedThisRound.getOrDefault(b, 0) <= 0) {
              ok = false;
              break;
            }
          }
        }
        if (ok) {
          round.add(p);
          if (p.healthy()) {
            p.budgets().forEach(b -> usedThisRound.merge(b, 1, Integer::sum));
          }
        }
      }
      if (round.isEmpty()) {
        break;
      }
      for (PodItem p : round) {
        if (p.healthy() && pendingIds.contains(p.id())) {
          p.budgets().forEach(b -> healthy.merge(b, -1, Integer::sum));
        }
      }
      rounds.add(round.stream().map(PodItem::id).toList());
      Set<PodItem> inRound = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
      inRound.addAll(round);
      remaining.removeIf(inRound::contains);
    }
    List<DrainPlan.Blocked> blocked = new ArrayList<>();
    for (PodItem p : remaining) {
      List<String> by = new ArrayList<>();
      for (String b : p.budgets()) {
        BudgetRecord rec = budgets.get(b);
        if (rec != null && rec.allowedDisruptions(expected.getOrDefault(b, 0),
            healthy.getOrDefault(b, 0)) <= 0) {
          by.add(b + " (" + rec.rule() + ")");
        }
      }
      blocked.add(new DrainPlan.Blocked(p.id(), p.workload(), by));
    }
    return new DrainPlan(rounds, blocked);
  }

  /** DaemonSets for a declared review: the perWorker workloads that admit a pool node. */
  private static Map<String, PodItem> declaredDaemons(PoolState s, ClusterModel m,
      Set<String> poolNames, PoolState today) {
    Map<String, PodItem> out = new TreeMap<>();
    for (WorkloadRecord w : m.workloads()) {
      if (!w.perWorker()) {
        continue;
      }
      PodItem p = new PodItem(w.id().toString(), w.id().toString(),
          s.vector(w.requests(), true), w.placement(), List.of(), true, true);
      if (admitsAny(today, p)) {
        out.put(w.id().toString(), p);
      }
    }
    return out;
  }

  /**
   * Declared pods that belong to the pool: workloads with a pod running on it today, and
   * workloads with no running pod whose template admits a pool node.
   */
  private static List<PodItem> declaredPods(PoolState s, ClusterModel m, ReplicaMode mode,
      Set<String> poolNames, PoolState today) {
    Set<String> onPool = new HashSet<>();
    Set<String> running = new HashSet<>();
    for (PodRecord p : m.pods()) {
      running.add(p.workload().toString());
      if (p.scheduled() && poolNames.contains(p.node())) {
        onPool.add(p.workload().toString());
      }
    }
    List<PodItem> out = new ArrayList<>();
    for (WorkloadRecord w : m.workloads()) {
      if (w.perWorker()) {
        continue;
      }
      String id = w.id().toString();
      PodItem probe = new PodItem(id, id, s.vector(w.requests(), true), w.placement(),
          List.of(), true, false);
      if (!onPool.contains(id) && (running.contains(id) || !admitsAny(today, probe))) {
        continue;
      }
      int n = mode == ReplicaMode.PEAK ? w.replicas().peak() : w.replicas().declared();
      for (int i = 0; i < n; i++) {
        out.add(new PodItem(id + "#" + i, id, probe.req(), w.placement(), List.of(), true,
            false));
      }
    }
    return out;
  }

  /**
   * Loses the K hosts carrying the most requested CPU (ties by name) and places their pods on the
   * rest. Hosts are the values of the host label, or runs of workers-per-host nodes by name.
   */
  private static HostFailureCheck hostFailures(PoolState s, ResizeRequest r) {
    Map<String, List<PoolState.Node>> hosts = new TreeMap<>();
    List<PoolState.Node> live = s.nodes.stream().filter(n -> !n.removed)
        .sorted(Comparator.comparing(n -> n.name)).toList();
    String grouping;
    if (r.hostLabel().isPresent()) {
      String key = r.hostLabel().get();
      grouping = "node label " + key;
      for (PoolState.Node n : live) {
        hosts.computeIfAbsent(n.labels.getOrDefault(key, "(no " + key + ": " + n.name + ")"),
            k -> new ArrayList<>()).add(n);
      }
    } else {
      grouping = r.workersPerHost() + " workers per host (one per NUMA node), in name order";
      for (int i = 0; i < live.size(); i++) {
        int h = i / r.workersPerHost();
        List<PoolState.Node> group = live.subList(h * r.workersPerHost(),
            Math.min(live.size(), (h + 1) * r.workersPerHost()));
        hosts.putIfAbsent(group.get(0).name + (group.size() > 1
            ? ".." + group.get(group.size() - 1).name : ""), group);
      }
    }
    List<Map.Entry<String, List<PoolState.Node>>> order = new ArrayList<>(hosts.entrySet());
    order.sort(Comparator.<Map.Entry<String, List<PoolState.Node>>>comparingLong(
        e -> -e.getValue().stream().mapToLong(n -> cpuOf(s, n)).sum())
        .thenComparing(Map.Entry::getKey));
    List<String> lost = new ArrayList<>();
    List<PodItem> moving = new ArrayList<>();
    for (int k = 0; k < Math.min(r.hostFailures(), order.size()); k++) {
      lost.add(order.get(k).getKey());
      for (PoolState.Node n : order.get(k).getValue()) {
        n.removed = true;
        moving.addAll(movable(n));
      }
    }
    List<PodItem> stranded = new ArrayList<>();
    placeAll(s, moving, stranded);
    List<PendingPod> pending = new ArrayList<>();
    for (PodItem p : stranded) {
      pending.add(new PendingPod(p.id(), p.workload(), s.why(p)));
    }
    pending.sort(Comparator.comparing(PendingPod::pod));
    return new HostFailureCheck(r.hostFailures(), grouping, lost, pending);
  }

  private static long cpuOf(PoolState s, PoolState.Node n) {
    int cpu = java.util.Arrays.asList(s.resources).indexOf(Resources.CPU);
    long sum = 0;
    for (PodItem p : movable(n)) {
      sum += cpu < 0 ? 0 : p.req()[cpu];
    }
    return sum;
  }
}
