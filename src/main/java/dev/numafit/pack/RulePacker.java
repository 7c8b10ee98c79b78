package dev.numafit.pack;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Packs pods onto workers that sit on hosts in zones, under the hard rules a scheduler enforces
 * between pods of one workload: required anti-affinity (at most one pod per worker, host or zone)
 * and topology spread with {@code whenUnsatisfiable: DoNotSchedule} (pod counts of any two
 * domains differ by at most maxSkew).
 *
 * <p>The model: each worker is on one host; a host carries at most {@code workersPerHost}
 * workers; host {@code h} is in zone {@code h mod zones}, so hosts are spread evenly over the
 * zones. A new worker goes on the first host with a free slot where the pod may run, else on a
 * new host.
 *
 * <p>The search: groups by first-fit-decreasing on the largest normalised demand; a pod with
 * spread constraints goes to the allowed worker whose domains hold the fewest pods of its group
 * (zones taken in turn). Spread is checked on the final layout,
 * since workers opened later are domains with no pods: when it fails, the packing is redone with
 * that many workers open from the start (a few rounds), and as a last resort with at most maxSkew
 * pods per worker or host, which always satisfies the constraint. Deterministic: no randomness,
 * effort in steps.
 *
 * <p>{@link #hostsToSurvive} sizes for losing hosts or a zone: pods on lost hosts must be
 * rescheduled, under the same rules, into the room left on surviving workers or onto new workers
 * in free slots of surviving hosts; running pods are not moved (the scheduler does not move
 * them).
 */
public final class RulePacker {
  /** A topology domain a rule is about. */
  public enum Domain {
    /** One worker ({@code kubernetes.io/hostname}). */
    WORKER,
    /** One physical host (our host label). */
    HOST,
    /** One zone. */
    ZONE
  }

  /**
   * The pods of one workload: identical demand, shared rules.
   *
   * @param demand per dimension, in the packer's units (millicores, bytes, counts)
   * @param count pods, at least 0
   * @param antiAffinity domains where at most one pod of the group may run
   * @param maxSkew per domain, the DoNotSchedule spread limit (at least 1)
   */
  public record Group(
      long[] demand, int count, Set<Domain> antiAffinity, Map<Domain, Integer> maxSkew) {
    public Group {
      demand = demand.clone();
      if (count < 0) {
        throw new IllegalArgumentException("count must be >= 0, was " + count);
      }
      antiAffinity =
          Collections.unmodifiableSet(
              antiAffinity.isEmpty() ? EnumSet.noneOf(Domain.class) : EnumSet.copyOf(antiAffinity));
      EnumMap<Domain, Integer> skew = new EnumMap<>(Domain.class);
      skew.putAll(maxSkew);
      for (var e : skew.entrySet()) {
        if (e.getValue() < 1) {
          throw new IllegalArgumentException("maxSkew must be >= 1 for " + e.getKey());
        }
      }
      maxSkew = Collections.unmodifiableMap(skew);
    }

    /** A group without rules. */
    public static Group plain(long[] demand, int count) {
      return new Group(demand, count, Set.of(), Map.of());
    }

    /** Whether the group has any rule. */
    public boolean ruled() {
      return !antiAffinity.isEmpty() || !maxSkew.isEmpty();
    }

    @Override
    public long[] demand() {
      return demand.clone();
    }
  }

  /**
   * Where workers go.
   *
   * @param workersPerHost at least 1
   * @param zones at least 1; host {@code h} is in zone {@code h mod zones}
   */
  public record Topology(int workersPerHost, int zones) {
    public Topology {
      if (workersPerHost < 1 || zones < 1) {
        throw new IllegalArgumentException("workersPerHost and zones must be >= 1");
      }
    }

    /** The zone of host {@code h}. */
    public int zoneOf(int host) {
      return host % zones;
    }
  }

  /**
   * A layout. Items are numbered group by group in the order given: group 0's pods first.
   *
   * @param binOfItem the worker of each item, -1 for an item that could not be placed
   * @param hostOfBin the host of each worker
   * @param hosts hosts used (one more than the largest host number)
   * @param steps effort spent
   */
  public record Result(int[] binOfItem, int[] hostOfBin, int hosts, long steps) {
    public Result {
      binOfItem = binOfItem.clone();
      hostOfBin = hostOfBin.clone();
    }

    /** Workers used. */
    public int bins() {
      return hostOfBin.length;
    }

    /** Items that could not be placed under the rules. */
    public List<Integer> unplaced() {
      List<Integer> out = new ArrayList<>();
      for (int i = 0; i < binOfItem.length; i++) {
        if (binOfItem[i] < 0) {
          out.add(i);
        }
      }
      return out;
    }

    @Override
    public int[] binOfItem() {
      return binOfItem.clone();
    }

    @Override
    public int[] hostOfBin() {
      return hostOfBin.clone();
    }
  }

  /**
   * The outcome of sizing for failures.
   *
   * @param hosts the smallest host count found that survives every failure checked
   * @param survives false when no count up to the search limit survived (then {@code hosts} is
   *     the limit)
   * @param exhaustive true when every set of K hosts was checked; false when there were too many
   *     and only the K hosts carrying the most demand were
   */
  public record FailureResult(int hosts, boolean survives, boolean exhaustive) {}

  /** Rounds of "redo with the workers open from the start" before the strict fallback. */
  private static final int SPREAD_ROUNDS = 4;

  /** Most failure sets checked per host count before only the worst one is checked. */
  static final long MAX_FAILURE_SETS = 2_000;

  private RulePacker() {}

  /**
   * Packs the groups.
   *
   * @throws IllegalArgumentException when a pod does not fit an empty worker or a demand row's
   *     length differs from the capacity's
   */
  public static Result pack(List<Group> groups, long[] capacity, Topology topo) {
    for (int g = 0; g < groups.size(); g++) {
      long[] d = groups.get(g).demand;
      if (d.length != capacity.length) {
        throw new IllegalArgumentException("group " + g + " has " + d.length + " dimensions");
      }
      if (!VectorPacker.fitsEmptyBin(d, capacity)) {
        throw new IllegalArgumentException("group " + g + " does not fit an empty worker");
      }
    }
    int[] order = order(groups, capacity);
    long steps = 0;
    int[] preopenHosts = new int[0];
    for (int round = 0; round <= SPREAD_ROUNDS; round++) {
      Layout l = new Layout(groups, capacity, topo, false);
      for (int h : preopenHosts) {
        l.openWorker(h);
      }
      l.placeAll(order);
      steps += l.steps;
      Result r = l.compact(steps);
      if (violations(groups, capacity, topo, r).isEmpty()) {
        return r;
      }
      if (round > 0 && l.bins() <= preopenHosts.length) {
        break; // opening the same workers again would give the same layout
      }
      preopenHosts = Arrays.copyOf(l.hostOf, l.nBins);
    }
    Layout strict = new Layout(groups, capacity, topo, true);
    strict.placeAll(order);
    return strict.compact(steps + strict.steps);
  }

  /**
   * Lays out an existing packing: worker {@code b} on host {@code b / workersPerHost}.
   *
   * @param binOfItem from a {@link Packing}, items numbered group by group
   */
  public static Result fromPacking(int[] binOfItem, int bins, Topology topo) {
    int[] hostOfBin = new int[bins];
    for (int b = 0; b < bins; b++) {
      hostOfBin[b] = b / topo.workersPerHost();
    }
    int hosts = bins == 0 ? 0 : (bins - 1) / topo.workersPerHost() + 1;
    return new Result(binOfItem, hostOfBin, hosts, 0);
  }

  /**
   * The smallest host count, from the layout's own count up, such that losing any {@code
   * hostFailures} hosts (and, when asked, any one whole zone) leaves room for every pod of the
   * lost hosts under the same rules. Extra hosts are empty: they offer free worker slots.
   *
   * @param maxExtra how many hosts beyond the layout's to try before giving up
   */
  public static FailureResult hostsToSurvive(
      List<Group> groups,
      long[] capacity,
      Topology topo,
      Result layout,
      int hostFailures,
      boolean zoneFailure,
      int maxExtra) {
    return hostsToSurvive(groups, capacity, topo, layout, hostFailures, zoneFailure, maxExtra,
        Progress.NONE);
  }

  /** {@link #hostsToSurvive} telling {@code progress} each failure set checked. */
  public static FailureResult hostsToSurvive(
      List<Group> groups,
      long[] capacity,
      Topology topo,
      Result layout,
      int hostFailures,
      boolean zoneFailure,
      int maxExtra,
      Progress progress) {
    if (hostFailures == 0 && !zoneFailure) {
      return new FailureResult(layout.hosts(), true, true);
    }
    boolean exhaustive = true;
    for (int hosts = Math.max(1, layout.hosts()); hosts <= layout.hosts() + maxExtra; hosts++) {
      if (hosts - hostFailures < 1 || (zoneFailure && topo.zones() < 2)) {
        continue;
      }
      List<int[]> sets = new ArrayList<>();
      if (hostFailures > 0) {
        if (choose(hosts, hostFailures) <= MAX_FAILURE_SETS) {
          subsets(hosts, hostFailures, new int[hostFailures], 0, 0, sets);
        } else {
          exhaustive = false;
          sets.add(heaviest(groups, capacity, layout, hosts, hostFailures));
        }
      }
      if (zoneFailure) {
        for (int z = 0; z < topo.zones(); z++) {
          List<Integer> inZone = new ArrayList<>();
          for (int h = 0; h < hosts; h++) {
            if (topo.zoneOf(h) == z) {
              inZone.add(h);
            }
          }
          sets.add(inZone.stream().mapToInt(Integer::intValue).toArray());
        }
      }
      boolean all = true;
      long checked = 0;
      for (int[] set : sets) {
        progress.update(Progress.Phase.FAILURES, ++checked, sets.size());
        if (!survives(groups, capacity, topo, layout, hosts, set)) {
          all = false;
          break;
        }
      }
      if (all) {
        return new FailureResult(hosts, true, exhaustive);
      }
    }
    return new FailureResult(layout.hosts() + maxExtra, false, exhaustive);
  }

  /**
   * Whether the pods of the failed hosts can be rescheduled on the others, with {@code hosts}
   * hosts in all (those beyond the layout's are empty).
   */
  static boolean survives(
      List<Group> groups, long[] capacity, Topology topo, Result layout, int hosts, int[] failed) {
    boolean[] lost = new boolean[hosts];
    for (int h : failed) {
      lost[h] = true;
    }
    Layout l = new Layout(groups, capacity, topo, false);
    l.hostLimit = hosts;
    l.lostHosts = lost;
    int[] newBin = new int[layout.bins()];
    for (int b = 0; b < layout.bins(); b++) {
      int h = layout.hostOfBin[b];
      // Keep lost workers' slots taken: a failed host's VMs do not free anything.
      newBin[b] = lost[h] ? -1 : l.openWorker(h);
    }
    int[] start = l.starts;
    List<int[]> displaced = new ArrayList<>();
    for (int g = 0; g < groups.size(); g++) {
      for (int j = 0; j < groups.get(g).count; j++) {
        int b = layout.binOfItem[start[g] + j];
        if (b < 0) {
          continue;
        }
        if (newBin[b] < 0) {
          displaced.add(new int[] {g, j});
        } else {
          l.add(g, newBin[b]);
        }
      }
    }
    int[] rank = new int[groups.size()];
    int[] order = order(groups, capacity);
    for (int i = 0; i < order.length; i++) {
      rank[order[i]] = i;
    }
    displaced.sort((a, b) -> a[0] != b[0] ? Integer.compare(rank[a[0]], rank[b[0]])
        : Integer.compare(a[1], b[1]));
    for (int[] p : displaced) {
      if (l.place(p[0], p[1], true) < 0) {
        return false;
      }
    }
    return true;
  }

  /**
   * Every hard rule a layout breaks, in words; empty when it breaks none: capacity per worker,
   * workers per host, anti-affinity, and spread over the domains that have workers.
   */
  public static List<String> violations(
      List<Group> groups, long[] capacity, Topology topo, Result r) {
    List<String> out = new ArrayList<>();
    int d = capacity.length;
    long[][] load = new long[r.bins()][d];
    int[] perHost = new int[Math.max(r.hosts(), 1)];
    for (int b = 0; b < r.bins(); b++) {
      perHost[r.hostOfBin[b]]++;
    }
    for (int h = 0; h < perHost.length; h++) {
      if (perHost[h] > topo.workersPerHost()) {
        out.add("host " + h + " carries " + perHost[h] + " workers");
      }
    }
    boolean[] zoneUsed = new boolean[topo.zones()];
    for (int b = 0; b < r.bins(); b++) {
      zoneUsed[topo.zoneOf(r.hostOfBin[b])] = true;
    }
    int item = 0;
    for (int g = 0; g < groups.size(); g++) {
      Group gr = groups.get(g);
      if (!gr.ruled()) {
        // No rule to break: only its load counts.
        for (int j = 0; j < gr.count; j++, item++) {
          int b = r.binOfItem[item];
          for (int k = 0; b >= 0 && k < d; k++) {
            load[b][k] += gr.demand[k];
          }
        }
        continue;
      }
      int[] perBin = new int[r.bins()];
      int[] perH = new int[perHost.length];
      int[] perZ = new int[topo.zones()];
      for (int j = 0; j < gr.count; j++, item++) {
        int b = r.binOfItem[item];
        if (b < 0) {
          continue;
        }
        for (int k = 0; k < d; k++) {
          load[b][k] += gr.demand[k];
        }
        perBin[b]++;
        perH[r.hostOfBin[b]]++;
        perZ[topo.zoneOf(r.hostOfBin[b])]++;
      }
      int[][] counts = {perBin, perH, perZ};
      boolean[][] present = {null, new boolean[perHost.length], zoneUsed};
      for (int h = 0; h < perHost.length; h++) {
        present[1][h] = perHost[h] > 0;
      }
      for (Domain dom : Domain.values()) {
        int[] c = counts[dom.ordinal()];
        int max = 0;
        int min = Integer.MAX_VALUE;
        for (int x = 0; x < c.length; x++) {
          if (present[dom.ordinal()] != null && !present[dom.ordinal()][x]) {
            continue;
          }
          max = Math.max(max, c[x]);
          min = Math.min(min, c[x]);
        }
        if (gr.antiAffinity.contains(dom) && max > 1) {
          out.add("group " + g + ": " + max + " pods in one " + dom + " despite anti-affinity");
        }
        Integer skew = gr.maxSkew.get(dom);
        if (skew != null && min != Integer.MAX_VALUE && max - min > skew) {
          out.add("group " + g + ": " + dom + " skew " + (max - min) + " > " + skew);
        }
      }
    }
    for (int b = 0; b < r.bins(); b++) {
      for (int k = 0; k < d; k++) {
        if (load[b][k] > capacity[k]) {
          out.add("worker " + b + " over capacity in dimension " + k);
        }
      }
    }
    return out;
  }

  // --- internals -----------------------------------------------------------------------------

  /**
   * Largest normalised demand first; ties by input order. (Placing spread groups first was
   * tried: on the 150,000-pod benchmark it used 6,405 workers against 5,449 in plain size order.)
   */
  static int[] order(List<Group> groups, long[] capacity) {
    Integer[] idx = new Integer[groups.size()];
    double[] key = new double[groups.size()];
    for (int g = 0; g < idx.length; g++) {
      idx[g] = g;
      double m = 0;
      for (int k = 0; k < capacity.length; k++) {
        if (capacity[k] > 0) {
          m = Math.max(m, (double) groups.get(g).demand[k] / capacity[k]);
        }
      }
      key[g] = m;
    }
    Arrays.sort(
        idx,
        (a, b) -> {
          int c = Double.compare(key[b], key[a]);
          return c != 0 ? c : Integer.compare(a, b);
        });
    return Arrays.stream(idx).mapToInt(Integer::intValue).toArray();
  }

  private static long choose(int n, int k) {
    long c = 1;
    for (int i = 0; i < k; i++) {
      c = c * (n - i) / (i + 1);
      if (c > MAX_FAILURE_SETS) {
        return c;
      }
    }
    return c;
  }

  private static void subsets(int n, int k, int[] cur, int pos, int from, List<int[]> out) {
    if (pos == k) {
      out.add(cur.clone());
      return;
    }
    for (int h = from; h <= n - (k - pos); h++) {
      cur[pos] = h;
      subsets(n, k, cur, pos + 1, h + 1, out);
    }
  }

  /** The K hosts whose pods add up to the most normalised demand; ties to the lower number. */
  private static int[] heaviest(
      List<Group> groups, long[] capacity, Result layout, int hosts, int k) {
    double[] weight = new double[hosts];
    int item = 0;
    for (Group g : groups) {
      double w = 0;
      for (int x = 0; x < capacity.length; x++) {
        if (capacity[x] > 0) {
          w += (double) g.demand[x] / capacity[x];
        }
      }
      for (int j = 0; j < g.count; j++, item++) {
        int b = layout.binOfItem[item];
        if (b >= 0) {
          weight[layout.hostOfBin[b]] += w;
        }
      }
    }
    Integer[] idx = new Integer[hosts];
    for (int h = 0; h < hosts; h++) {
      idx[h] = h;
    }
    Arrays.sort(idx, (a, b) -> {
      int c = Double.compare(weight[b], weight[a]);
      return c != 0 ? c : Integer.compare(a, b);
    });
    int[] out = new int[k];
    for (int i = 0; i < k; i++) {
      out[i] = idx[i];
    }
    Arrays.sort(out);
    return out;
  }

  /** A layout being built. Counts per (group, domain, index) live in one map, only looked up. */
  private static final class Layout {
    final List<Group> groups;
    final long[] cap;
    final int d;
    final Topology topo;
    /** At most maxSkew pods per worker or host: always satisfies spread, may use more workers. */
    final boolean strict;
    /** Loads flat, {@code loads[b * d + k]}, and the host of each worker: no per-worker objects. */
    long[] loads = new long[0];
    int[] hostOf = new int[0];
    int nBins;
    final List<Integer> workersOnHost = new ArrayList<>();
    final Map<Long, Integer> counts = new HashMap<>();
    /** Per group and domain: how many domains hold at least one pod of the group. */
    final int[][] occupied;
    final int[] starts;
    final int[] binOfItem;
    /** Per group, the worker to start looking from (see {@link #place}). */
    final int[] resume;
    int hostsWithWorkers;
    int zonesWithWorkers;
    final int[] hostsInZone;
    /** When set, no host at or beyond this number may be used, and lost hosts not at all. */
    int hostLimit = Integer.MAX_VALUE;
    boolean[] lostHosts;
    long steps;

    Layout(List<Group> groups, long[] cap, Topology topo, boolean strict) {
      this.groups = groups;
      this.cap = cap;
      this.d = cap.length;
      this.topo = topo;
      this.strict = strict;
      this.occupied = new int[groups.size()][3];
      this.starts = new int[groups.size()];
      int n = 0;
      for (int g = 0; g < groups.size(); g++) {
        starts[g] = n;
        n += groups.get(g).count;
      }
      this.binOfItem = new int[n];
      Arrays.fill(binOfItem, -1);
      this.resume = new int[groups.size()];
      this.hostsInZone = new int[topo.zones()];
    }

    int bins() {
      return nBins;
    }

    void ensureHost(int h) {
      while (workersOnHost.size() <= h) {
        workersOnHost.add(0);
      }
    }

    int openWorker(int h) {
      ensureHost(h);
      int before = workersOnHost.get(h);
      workersOnHost.set(h, before + 1);
      if (before == 0) {
        hostsWithWorkers++;
        if (hostsInZone[topo.zoneOf(h)]++ == 0) {
          zonesWithWorkers++;
        }
      }
      if (nBins == hostOf.length) {
        int cap = Math.max(16, nBins * 2);
        hostOf = Arrays.copyOf(hostOf, cap);
        loads = Arrays.copyOf(loads, cap * d);
      }
      hostOf[nBins] = h;
      return nBins++;
    }

    private static long key(int g, Domain dom, int idx) {
      // Multiplying by an odd constant is one-to-one, and spreads the bits Long.hashCode folds
      // together (group and index would otherwise collide in the map's buckets).
      return (((long) g << 34) | ((long) dom.ordinal() << 32) | (idx & 0xffffffffL))
          * 0x9E3779B97F4A7C15L;
    }

    int count(int g, Domain dom, int idx) {
      return counts.getOrDefault(key(g, dom, idx), 0);
    }

    private void bump(int g, Domain dom, int idx) {
      int c = counts.merge(key(g, dom, idx), 1, Integer::sum);
      if (c == 1) {
        occupied[g][dom.ordinal()]++;
      }
    }

    void add(int g, int b) {
      long[] w = groups.get(g).demand;
      int at = b * d;
      for (int k = 0; k < d; k++) {
        loads[at + k] += w[k];
      }
      if (groups.get(g).ruled()) {
        int h = hostOf[b];
        bump(g, Domain.WORKER, b);
        bump(g, Domain.HOST, h);
        bump(g, Domain.ZONE, topo.zoneOf(h));
      }
    }

    boolean fits(int g, int b) {
      long[] w = groups.get(g).demand;
      int at = b * d;
      for (int k = 0; k < d; k++) {
        if (loads[at + k] + w[k] > cap[k]) {
          return false;
        }
      }
      return true;
    }

    /** Domains of each kind that have workers now (the scheduler's domains). */
    private int domains(Domain dom) {
      return switch (dom) {
        case WORKER -> nBins;
        case HOST -> hostsWithWorkers;
        case ZONE -> zonesWithWorkers;
      };
    }

    /** The smallest count of the group's pods over the domains that have workers. */
    private int minCount(int g, Domain dom) {
      int domains = domains(dom);
      if (occupied[g][dom.ordinal()] < domains) {
        return 0;
      }
      int min = Integer.MAX_VALUE;
      int n = dom == Domain.WORKER ? nBins
          : dom == Domain.HOST ? workersOnHost.size() : topo.zones();
      for (int x = 0; x < n; x++) {
        int c = count(g, dom, x);
        if (c > 0) {
          min = Math.min(min, c);
        }
      }
      steps += n;
      return min == Integer.MAX_VALUE ? 0 : min;
    }

    /** Whether a pod of group g may run in the domain {@code idx} of kind {@code dom}. */
    private boolean allowedIn(int g, Domain dom, int idx) {
      Group gr = groups.get(g);
      int c = count(g, dom, idx);
      if (gr.antiAffinity.contains(dom) && c > 0) {
        return false;
      }
      Integer skew = gr.maxSkew.get(dom);
      if (skew == null) {
        return true;
      }
      if (strict && dom != Domain.ZONE) {
        return c + 1 <= skew;
      }
      return c + 1 - minCount(g, dom) <= skew;
    }

    boolean allowed(int g, int b, int zone) {
      if (!groups.get(g).ruled()) {
        return true;
      }
      int h = hostOf[b];
      int z = topo.zoneOf(h);
      return (zone < 0 || z == zone)
          && allowedIn(g, Domain.WORKER, b)
          && allowedIn(g, Domain.HOST, h)
          && allowedIn(g, Domain.ZONE, z);
    }

    /** Whether a new worker on host h may take a pod of group g. */
    private boolean hostAllowed(int g, int h, int zone) {
      if (h >= hostLimit || (lostHosts != null && h < lostHosts.length && lostHosts[h])) {
        return false;
      }
      int on = h < workersOnHost.size() ? workersOnHost.get(h) : 0;
      if (on >= topo.workersPerHost()) {
        return false;
      }
      int z = topo.zoneOf(h);
      if (zone >= 0 && z != zone) {
        return false;
      }
      if (!groups.get(g).ruled()) {
        return true;
      }
      Group gr = groups.get(g);
      // A new worker holds none of the group's pods, so worker rules allow it; its host and
      // zone are checked as they are.
      boolean newHost = on == 0;
      if (gr.antiAffinity.contains(Domain.HOST) && count(g, Domain.HOST, h) > 0) {
        return false;
      }
      if (gr.maxSkew.containsKey(Domain.HOST)) {
        int c = count(g, Domain.HOST, h);
        int min = newHost ? 0 : minCount(g, Domain.HOST);
        int limit = gr.maxSkew.get(Domain.HOST);
        if (strict ? c + 1 > limit : c + 1 - min > limit) {
          return false;
        }
      }
      if (gr.antiAffinity.contains(Domain.ZONE) && count(g, Domain.ZONE, z) > 0) {
        return false;
      }
      if (zone < 0 && gr.maxSkew.containsKey(Domain.ZONE)) {
        int c = count(g, Domain.ZONE, z);
        return c + 1 - minCount(g, Domain.ZONE) <= gr.maxSkew.get(Domain.ZONE);
      }
      return true;
    }

    void placeAll(int[] order) {
      for (int g : order) {
        Group gr = groups.get(g);
        for (int j = 0; j < gr.count; j++) {
          place(g, j, false);
        }
      }
    }

    /**
     * Places pod j of group g; returns its worker or -1. {@code rescheduling}: judge it as the
     * scheduler would, one pod at a time, without a planned zone.
     */
    int place(int g, int j, boolean rescheduling) {
      Group gr = groups.get(g);
      int zone = -1;
      if (!rescheduling && gr.maxSkew.containsKey(Domain.ZONE)) {
        // Zones in turn: counts differ by at most one, whatever the final layout.
        zone = j % topo.zones();
      }
      boolean spread =
          gr.maxSkew.containsKey(Domain.WORKER) || gr.maxSkew.containsKey(Domain.HOST);
      int best = -1;
      long bestKey = Long.MAX_VALUE;
      // Loads and counts only grow while packing, so a worker that could not take a pod of this
      // group (no room, or already one under anti-affinity) cannot later: later pods of the group
      // start where the last one was placed (also when rescheduling: the layout only fills up).
      // Spread and zone turns can re-allow a worker, so they scan from the start.
      boolean monotone = gr.maxSkew.isEmpty() && zone < 0;
      // With spread over workers or hosts, the first worker that fits and whose worker and host
      // hold none of the group's pods is the best choice; workers before the last such one had
      // pods of the group (on them or their host) or no room, and still do, since counts and
      // loads only grow. When none is found from there, the whole list is scanned for the fewest.
      boolean workerSpreadOnly = !rescheduling && spread;
      int from = monotone || workerSpreadOnly ? resume[g] : 0;
      while (true) {
        for (int b = from; b < nBins; b++) {
          steps++;
          if (lostHosts != null && lostHosts[hostOf[b]]) {
            continue;
          }
          if (!fits(g, b) || !allowed(g, b, zone)) {
            continue;
          }
          if (!spread || rescheduling) {
            best = b;
            break;
          }
          long k = 0;
          if (gr.maxSkew.containsKey(Domain.WORKER)) {
            k += count(g, Domain.WORKER, b);
          }
          if (gr.maxSkew.containsKey(Domain.HOST)) {
            k += count(g, Domain.HOST, hostOf[b]);
          }
          if (k < bestKey) {
            bestKey = k;
            best = b;
            if (k == 0) {
              break;
            }
          }
        }
        if (workerSpreadOnly && from > 0 && bestKey != 0) {
          from = 0;
          continue;
        }
        break;
      }
      if (best < 0) {
        int h = 0;
        // Hosts beyond those with workers are alike but for their zone: one round of zones is
        // enough. When sizing for failures, every host up to the limit is there to be used.
        int limit =
            hostLimit != Integer.MAX_VALUE
                ? hostLimit
                : workersOnHost.size() + topo.zones() + 1;
        while (h < limit && !hostAllowed(g, h, zone)) {
          steps++;
          h++;
        }
        if (h >= limit) {
          return -1;
        }
        best = openWorker(h);
      }
      add(g, best);
      if (!rescheduling) {
        binOfItem[starts[g] + j] = best;
      }
      if (monotone || (workerSpreadOnly && bestKey == 0)) {
        resume[g] = best;
      }
      return best;
    }

    /** Drops workers that ended up empty and trailing hosts without workers. */
    Result compact(long totalSteps) {
      int[] renumber = new int[nBins];
      List<Integer> hosts = new ArrayList<>();
      boolean[] used = new boolean[nBins];
      for (int b : binOfItem) {
        if (b >= 0) {
          used[b] = true;
        }
      }
      int n = 0;
      for (int b = 0; b < nBins; b++) {
        if (used[b]) {
          renumber[b] = n++;
          hosts.add(hostOf[b]);
        } else {
          renumber[b] = -1;
        }
      }
      int[] bins = new int[binOfItem.length];
      for (int i = 0; i < bins.length; i++) {
        bins[i] = binOfItem[i] < 0 ? -1 : renumber[binOfItem[i]];
      }
      int maxHost = -1;
      for (int h : hosts) {
        maxHost = Math.max(maxHost, h);
      }
      return new Result(
          bins, hosts.stream().mapToInt(Integer::intValue).toArray(), maxHost + 1, totalSteps);
    }
  }
}
