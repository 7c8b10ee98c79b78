package dev.numafit.pack;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.HashSet;
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
 * <p>Speed: the workers where a pod fits are found through a tree of the largest free room per
 * dimension over ranges of workers, not by scanning every worker, and the pod counts of the group
 * being placed live in plain arrays; the choices are the same as a worker-by-worker scan makes.
 *
 * <p>{@link #hostsToSurvive} sizes for losing hosts or a zone: pods on lost hosts must be
 * rescheduled, under the same rules, into the room left on surviving workers or onto new workers
 * in free slots of surviving hosts; running pods are not moved (the scheduler does not move
 * them). Lost pods are re-placed largest first, each by best fit: a heuristic, so the host count
 * it finds can be higher than the fewest that would do, never lower.
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
      Layout l = new Layout(groups, capacity, topo, false, true);
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
    Layout strict = new Layout(groups, capacity, topo, true, true);
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
   * <p>The layout is built once. For each failure set only the lost hosts' pods move: they are
   * taken off, re-placed one by one into the room left on the surviving workers (or onto new
   * workers in free slots of surviving hosts), and every change is then undone. Re-placement is
   * a heuristic: largest pods first, each onto the allowed worker it fills most tightly in its
   * largest dimension (best fit). It can fail where a cleverer arrangement would succeed, so the
   * host count found can only be too high, never too low, for the layout given.
   *
   * <p>Adding an empty host changes nothing for a failure set that already survived (the
   * re-placement makes the same choices and never needs the new host), so each failure set is
   * checked until it survives, and never again at a larger count.
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
    Survival survival = null;
    Set<String> survived = new HashSet<>();
    boolean exhaustive = true;
    boolean visited = false;
    int last = layout.hosts() + maxExtra;
    int hosts = Math.max(1, layout.hosts());
    while (hosts <= last) {
      if (hosts - hostFailures < 1 || (zoneFailure && topo.zones() < 2)) {
        hosts++;
        continue;
      }
      visited = true;
      if (survival == null) {
        survival = new Survival(groups, capacity, topo, layout);
      }
      if (hostFailures > 0 && choose(hosts, hostFailures) > MAX_FAILURE_SETS) {
        exhaustive = false;
      }
      FailureSet failed = null;
      List<FailureSet> sets =
          failureSets(groups, capacity, topo, layout, hosts, hostFailures, zoneFailure);
      long checked = 0;
      for (FailureSet set : sets) {
        progress.update(Progress.Phase.FAILURES, ++checked, sets.size());
        if (survived.contains(set.key())) {
          continue;
        }
        if (!survival.survives(hosts, set.hosts())) {
          failed = set;
          break;
        }
        survived.add(set.key());
      }
      if (failed == null) {
        return new FailureResult(hosts, true, exhaustive);
      }
      hosts =
          nextSurviving(
              survival, failed.key(), hosts, last, groups, capacity, topo, layout, hostFailures,
              zoneFailure);
    }
    if (visited && hostFailures > 0 && choose(last, hostFailures) > MAX_FAILURE_SETS) {
      exhaustive = false; // the counts jumped over would have said so
    }
    return new FailureResult(last, false, exhaustive);
  }

  /**
   * The failure sets checked with {@code hosts} hosts: every set of K hosts (or, when there are
   * more than {@link #MAX_FAILURE_SETS}, the K hosts carrying the most demand), then each zone.
   */
  private static List<FailureSet> failureSets(
      List<Group> groups,
      long[] capacity,
      Topology topo,
      Result layout,
      int hosts,
      int hostFailures,
      boolean zoneFailure) {
    List<FailureSet> sets = new ArrayList<>();
    if (hostFailures > 0) {
      if (choose(hosts, hostFailures) <= MAX_FAILURE_SETS) {
        List<int[]> subsets = new ArrayList<>();
        subsets(hosts, hostFailures, new int[hostFailures], 0, 0, subsets);
        for (int[] s : subsets) {
          sets.add(new FailureSet(Arrays.toString(s), s));
        }
      } else {
        int[] s = heaviest(groups, capacity, layout, hosts, hostFailures);
        sets.add(new FailureSet(Arrays.toString(s), s));
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
        // Keyed by zone: the hosts added at a larger count are empty and unusable either way.
        sets.add(
            new FailureSet("zone " + z, inZone.stream().mapToInt(Integer::intValue).toArray()));
      }
    }
    return sets;
  }

  /**
   * After the set {@code key} failed with {@code failedAt} hosts: the next count worth checking
   * every set at. Survival of one set only improves with more hosts, so the smallest count at
   * which this set survives is found by doubling the step and then halving the interval (a lost
   * zone may need hundreds of extra hosts; one count after another would re-place its pods at
   * each). Every count in between fails with this set, so none of them can be the answer. When
   * the set is not among those checked at some count probed (the sets of K hosts give way to the
   * heaviest ones), the search stops and the count after the last failing one is returned for a
   * plain check.
   */
  private static int nextSurviving(
      Survival survival,
      String key,
      int failedAt,
      int last,
      List<Group> groups,
      long[] capacity,
      Topology topo,
      Result layout,
      int hostFailures,
      boolean zoneFailure) {
    int lo = failedAt;
    int hi = -1;
    for (int step = 1; hi < 0; step *= 2) {
      if (lo >= last) {
        return last + 1;
      }
      int probe = (int) Math.min((long) lo + step, last);
      FailureSet s = find(failureSets(groups, capacity, topo, layout, probe, hostFailures,
          zoneFailure), key);
      if (s == null) {
        return lo + 1;
      }
      if (survival.survives(probe, s.hosts())) {
        hi = probe;
      } else {
        lo = probe;
      }
    }
    while (hi - lo > 1) {
      int mid = (lo + hi) >>> 1;
      FailureSet s = find(failureSets(groups, capacity, topo, layout, mid, hostFailures,
          zoneFailure), key);
      if (s == null) {
        return lo + 1;
      }
      if (survival.survives(mid, s.hosts())) {
        hi = mid;
      } else {
        lo = mid;
      }
    }
    return hi;
  }

  private static FailureSet find(List<FailureSet> sets, String key) {
    for (FailureSet s : sets) {
      if (s.key().equals(key)) {
        return s;
      }
    }
    return null;
  }

  /** Hosts lost together; {@code key} names the set across host counts. */
  private record FailureSet(String key, int[] hosts) {}

  /**
   * Every hard rule a layout breaks, in words; empty when it breaks none: capacity per worker,
   * workers per host, anti-affinity, and spread over the domains that have workers.
   */
  public static List<String> violations(
      List<Group> groups, long[] capacity, Topology topo, Result r) {
    List<String> out = new ArrayList<>();
    int d = capacity.length;
    int bins = r.bins();
    long[] load = new long[bins * d];
    int[] perHost = new int[Math.max(r.hosts(), 1)];
    for (int b = 0; b < bins; b++) {
      perHost[r.hostOfBin[b]]++;
    }
    int hostsPresent = 0;
    for (int h = 0; h < perHost.length; h++) {
      if (perHost[h] > topo.workersPerHost()) {
        out.add("host " + h + " carries " + perHost[h] + " workers");
      }
      if (perHost[h] > 0) {
        hostsPresent++;
      }
    }
    boolean[] zoneUsed = new boolean[topo.zones()];
    for (int b = 0; b < bins; b++) {
      zoneUsed[topo.zoneOf(r.hostOfBin[b])] = true;
    }
    int zonesPresent = 0;
    for (boolean u : zoneUsed) {
      zonesPresent += u ? 1 : 0;
    }
    int[] present = {bins, hostsPresent, zonesPresent};
    int item = 0;
    for (int g = 0; g < groups.size(); g++) {
      Group gr = groups.get(g);
      int[] placed = new int[gr.count];
      int n = 0;
      for (int j = 0; j < gr.count; j++, item++) {
        int b = r.binOfItem[item];
        if (b < 0) {
          continue;
        }
        for (int k = 0; k < d; k++) {
          load[b * d + k] += gr.demand[k];
        }
        placed[n++] = b;
      }
      if (!gr.ruled()) {
        continue;
      }
      // Counts per domain from the sorted domain numbers of the group's pods: only domains that
      // hold a pod are visited, the others count 0.
      int[] idx = new int[n];
      for (Domain dom : Domain.values()) {
        if (!gr.antiAffinity.contains(dom) && !gr.maxSkew.containsKey(dom)) {
          continue;
        }
        for (int i = 0; i < n; i++) {
          int b = placed[i];
          idx[i] = switch (dom) {
            case WORKER -> b;
            case HOST -> r.hostOfBin[b];
            case ZONE -> topo.zoneOf(r.hostOfBin[b]);
          };
        }
        Arrays.sort(idx);
        int max = 0;
        int minHeld = Integer.MAX_VALUE;
        int held = 0;
        for (int i = 0; i < n; ) {
          int e = i;
          while (e < n && idx[e] == idx[i]) {
            e++;
          }
          max = Math.max(max, e - i);
          minHeld = Math.min(minHeld, e - i);
          held++;
          i = e;
        }
        int domains = present[dom.ordinal()];
        if (gr.antiAffinity.contains(dom) && max > 1) {
          out.add("group " + g + ": " + max + " pods in one " + dom + " despite anti-affinity");
        }
        Integer skew = gr.maxSkew.get(dom);
        if (skew != null && domains > 0) {
          int min = held < domains ? 0 : minHeld;
          if (max - min > skew) {
            out.add("group " + g + ": " + dom + " skew " + (max - min) + " > " + skew);
          }
        }
      }
    }
    for (int b = 0; b < bins; b++) {
      for (int k = 0; k < d; k++) {
        if (load[b * d + k] > capacity[k]) {
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

  /** The dimension where a pod asks the largest share of a worker; ties to the lower one. */
  static int dominant(long[] demand, long[] capacity) {
    int best = 0;
    double m = -1;
    for (int k = 0; k < capacity.length; k++) {
      if (capacity[k] > 0) {
        double s = (double) demand[k] / capacity[k];
        if (s > m) {
          m = s;
          best = k;
        }
      }
    }
    return best;
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

  /**
   * Pod counts per (group, domain kind, domain number): an open-addressing table of primitive
   * keys and values (a boxed map spent most of the packing time on lookups). Entries that drop to
   * 0 stay; a missing key counts 0. Never iterated, so its layout cannot leak into results.
   */
  private static final class Counts {
    private long[] keys = new long[1 << 10];
    private int[] vals = new int[1 << 10];
    private int used;

    private static long key(int g, Domain dom, int idx) {
      // Stored plus one: 0 marks an empty slot.
      return (((long) g << 34) | ((long) dom.ordinal() << 32) | (idx & 0xffffffffL)) + 1;
    }

    private int slot(long k, long[] ks) {
      // Multiplying by an odd constant spreads group and index bits over the slot number.
      int mask = ks.length - 1;
      int i = (int) ((k * 0x9E3779B97F4A7C15L) >>> 40) & mask;
      while (ks[i] != 0 && ks[i] != k) {
        i = (i + 1) & mask;
      }
      return i;
    }

    int get(int g, Domain dom, int idx) {
      long k = key(g, dom, idx);
      int i = slot(k, keys);
      return keys[i] == k ? vals[i] : 0;
    }

    /** Adds {@code delta}; returns the new count. */
    int add(int g, Domain dom, int idx, int delta) {
      long k = key(g, dom, idx);
      int i = slot(k, keys);
      if (keys[i] != k) {
        if (2 * (used + 1) > keys.length) {
          grow();
          i = slot(k, keys);
        }
        keys[i] = k;
        used++;
      }
      vals[i] += delta;
      return vals[i];
    }

    private void grow() {
      long[] ok = keys;
      int[] ov = vals;
      keys = new long[ok.length * 2];
      vals = new int[ok.length * 2];
      for (int i = 0; i < ok.length; i++) {
        if (ok[i] != 0) {
          int j = slot(ok[i], keys);
          keys[j] = ok[i];
          vals[j] = ov[i];
        }
      }
    }
  }

  /**
   * A layout being built. Beside the flat loads it keeps a segment tree over the workers holding,
   * per node and dimension, the largest and smallest free room of the workers below: the first
   * worker from a given number where a pod fits is found by descending only into nodes with
   * enough room in every dimension, instead of scanning the workers one by one (each workload's
   * first pod used to scan from worker 0, a cost of workloads × workers). Workers that are lost
   * (failure check) or not open hold room -1, so they never fit.
   */
  private static final class Layout {
    final List<Group> groups;
    final long[] cap;
    final int d;
    final Topology topo;
    /** At most maxSkew pods per worker or host: always satisfies spread, may use more workers. */
    final boolean strict;
    /** Per group: demand, whether ruled, anti-affinity and maxSkew (0 for none) per domain. */
    final long[][] demand;
    final boolean[] ruled;
    final boolean[][] anti;
    final int[][] skew;
    /** Loads flat, {@code loads[b * d + k]}, and the host of each worker: no per-worker objects. */
    long[] loads;
    int[] hostOf;
    boolean[] lostBin;
    int nBins;
    int lostBins;
    int[] workersOnHost = new int[16];
    int hostsSeen;
    /**
     * Pod counts per group and domain. Packing places one group's pods after another and only
     * asks about the group it is placing, so it keeps that group's counts in plain arrays (the
     * table's lookups were most of the packing time); the failure check asks about any group and
     * uses the table.
     */
    final boolean dense;
    final Counts counts;
    int current = -1;
    int[] currentOnWorker = new int[0];
    int[] currentOnHost = new int[16];
    final int[] currentInZone;
    /** Per group and domain: how many domains hold at least one pod of the group. */
    final int[][] occupied;
    final int[] starts;
    final int[] binOfItem;
    /** Per group, the worker to start looking from (see {@link #place}). */
    final int[] resume;
    /** Hosts that have (surviving) workers, and per zone; zones with such hosts. */
    int hostsWithWorkers;
    int zonesWithWorkers;
    final int[] hostsInZone;
    /** Every host below this one has no free worker slot. */
    int fullBelow;
    /** When set, no host at or beyond this number may be used, and lost hosts not at all. */
    int hostLimit = Integer.MAX_VALUE;
    boolean[] lostHost = new boolean[16];
    long steps;
    /** Segment tree: leaves from {@code size}; node {@code i} dimension {@code k} at i*d+k. */
    int size;
    long[] maxFree;
    long[] minFree;
    /** Best-fit search state. */
    private int bestBin;
    private long bestFree;

    Layout(List<Group> groups, long[] cap, Topology topo, boolean strict, boolean dense) {
      this.dense = dense;
      this.counts = dense ? null : new Counts();
      this.currentInZone = new int[topo.zones()];
      this.groups = groups;
      this.cap = cap;
      this.d = cap.length;
      this.topo = topo;
      this.strict = strict;
      int n = groups.size();
      this.occupied = new int[n][3];
      this.starts = new int[n];
      this.demand = new long[n][];
      this.ruled = new boolean[n];
      this.anti = new boolean[n][3];
      this.skew = new int[n][3];
      int items = 0;
      for (int g = 0; g < n; g++) {
        Group gr = groups.get(g);
        starts[g] = items;
        items += gr.count;
        demand[g] = gr.demand;
        ruled[g] = gr.ruled();
        for (Domain dom : Domain.values()) {
          anti[g][dom.ordinal()] = gr.antiAffinity.contains(dom);
          skew[g][dom.ordinal()] = gr.maxSkew.getOrDefault(dom, 0);
        }
      }
      this.binOfItem = new int[items];
      Arrays.fill(binOfItem, -1);
      this.resume = new int[n];
      this.hostsInZone = new int[topo.zones()];
      allocate(16);
    }

    int bins() {
      return nBins;
    }

    /** (Re)allocates per-worker arrays and the tree for {@code n} workers, keeping the state. */
    private void allocate(int n) {
      size = n;
      loads = loads == null ? new long[n * d] : Arrays.copyOf(loads, n * d);
      hostOf = hostOf == null ? new int[n] : Arrays.copyOf(hostOf, n);
      lostBin = lostBin == null ? new boolean[n] : Arrays.copyOf(lostBin, n);
      currentOnWorker = Arrays.copyOf(currentOnWorker, n);
      maxFree = new long[2 * n * d];
      minFree = dense ? null : new long[2 * n * d];
      for (int b = 0; b < n; b++) {
        writeLeaf(b);
      }
      for (int i = n - 1; i >= 1; i--) {
        pull(i);
      }
    }

    private void writeLeaf(int b) {
      int at = (size + b) * d;
      boolean open = b < nBins && !lostBin[b];
      for (int k = 0; k < d; k++) {
        long free = cap[k] - loads[b * d + k];
        maxFree[at + k] = open ? free : -1;
        if (!dense) {
          minFree[at + k] = open ? free : Long.MAX_VALUE;
        }
      }
    }

    /** Recomputes node i from its children; returns whether it changed. */
    private boolean pull(int i) {
      int l = 2 * i * d;
      int r = l + d;
      int at = i * d;
      boolean changed = false;
      for (int k = 0; k < d; k++) {
        long mx = Math.max(maxFree[l + k], maxFree[r + k]);
        changed |= mx != maxFree[at + k];
        maxFree[at + k] = mx;
      }
      if (dense) {
        return changed; // packing never asks for the smallest room (best fit does)
      }
      for (int k = 0; k < d; k++) {
        long mn = Math.min(minFree[l + k], minFree[r + k]);
        changed |= mn != minFree[at + k];
        minFree[at + k] = mn;
      }
      return changed;
    }

    /** Refreshes worker {@code b}'s leaf and the nodes above it, as far as they change. */
    void refresh(int b) {
      writeLeaf(b);
      for (int i = (size + b) >> 1; i >= 1 && pull(i); i >>= 1) {
        // nodes further up see no change once one does not
      }
    }

    private boolean roomFor(int node, long[] w) {
      int at = node * d;
      for (int k = 0; k < d; k++) {
        if (maxFree[at + k] < w[k]) {
          return false;
        }
      }
      return true;
    }

    /**
     * The first open, not lost worker at or after {@code from} where {@code w} fits; or -1. Climbs
     * from the leaf before {@code from} and descends into the first right-hand subtree with room,
     * so enumerating the workers that fit, one after another, costs about the distance between
     * them rather than a descent from the root each time.
     */
    int firstFit(int from, long[] w) {
      if (from >= nBins) {
        return -1;
      }
      if (from == 0) {
        return firstIn(1, w);
      }
      for (int i = size + from - 1; i > 1; i >>= 1) {
        if ((i & 1) == 0) {
          int r = firstIn(i + 1, w);
          if (r >= 0) {
            return r;
          }
        }
      }
      return -1;
    }

    /** The first leaf under {@code node} where {@code w} fits, as a worker number; or -1. */
    private int firstIn(int node, long[] w) {
      steps++;
      if (!roomFor(node, w)) {
        return -1;
      }
      if (node >= size) {
        return node - size; // a leaf holds its own room: it fits
      }
      // Each dimension's largest room may sit under a different child: look left, then right.
      int r = firstIn(2 * node, w);
      return r >= 0 ? r : firstIn(2 * node + 1, w);
    }

    /**
     * The allowed worker where a pod of group g fits leaving the least free room in dimension
     * {@code p}; ties to the lower number; -1 when none. Branch and bound over the tree: a node
     * whose smallest room in {@code p} is no better than the best found is skipped.
     */
    int bestFit(int g, int p) {
      bestBin = -1;
      bestFree = Long.MAX_VALUE;
      if (nBins > 0) {
        bestFit(1, 0, size, g, demand[g], p);
      }
      return bestBin;
    }

    private void bestFit(int node, int lo, int hi, int g, long[] w, int p) {
      steps++;
      if (minFree[node * d + p] >= bestFree || !roomFor(node, w)) {
        return;
      }
      if (hi - lo == 1) {
        if (allowed(g, lo, -1)) {
          bestBin = lo;
          bestFree = maxFree[node * d + p];
        }
        return;
      }
      int mid = (lo + hi) >>> 1;
      bestFit(2 * node, lo, mid, g, w, p);
      bestFit(2 * node + 1, mid, hi, g, w, p);
    }

    private void ensureHost(int h) {
      if (h >= workersOnHost.length) {
        int n = Math.max(h + 1, workersOnHost.length * 2);
        workersOnHost = Arrays.copyOf(workersOnHost, n);
        lostHost = Arrays.copyOf(lostHost, n);
        currentOnHost = Arrays.copyOf(currentOnHost, n);
      }
      hostsSeen = Math.max(hostsSeen, h + 1);
    }

    int openWorker(int h) {
      ensureHost(h);
      int before = workersOnHost[h]++;
      if (before == 0) {
        hostsWithWorkers++;
        if (hostsInZone[topo.zoneOf(h)]++ == 0) {
          zonesWithWorkers++;
        }
      }
      if (nBins == size) {
        allocate(size * 2);
      }
      int b = nBins++;
      hostOf[b] = h;
      Arrays.fill(loads, b * d, b * d + d, 0);
      lostBin[b] = false;
      refresh(b);
      return b;
    }

    /** Undoes the last {@link #openWorker}, which must hold no pods. */
    void closeLastWorker() {
      int b = --nBins;
      int h = hostOf[b];
      if (--workersOnHost[h] == 0) {
        hostsWithWorkers--;
        if (--hostsInZone[topo.zoneOf(h)] == 0) {
          zonesWithWorkers--;
        }
      }
      refresh(b);
    }

    /** Pods of group g in the domain {@code idx} of kind {@code dom}. */
    int count(int g, Domain dom, int idx) {
      if (!dense) {
        return counts.get(g, dom, idx);
      }
      if (g != current) {
        return 0; // a group not yet placed
      }
      return switch (dom) {
        case WORKER -> currentOnWorker[idx];
        case HOST -> idx < currentOnHost.length ? currentOnHost[idx] : 0;
        case ZONE -> currentInZone[idx];
      };
    }

    /** Makes g the group whose counts the arrays hold, clearing the previous group's. */
    private void switchTo(int g) {
      if (g == current) {
        return;
      }
      if (current >= 0) {
        for (int i = starts[current], e = i + groups.get(current).count; i < e; i++) {
          int b = binOfItem[i];
          if (b >= 0) {
            currentOnWorker[b] = 0;
            currentOnHost[hostOf[b]] = 0;
            currentInZone[topo.zoneOf(hostOf[b])] = 0;
          }
        }
      }
      current = g;
    }

    private void bump(int g, Domain dom, int idx, int delta) {
      int c;
      if (dense) {
        switchTo(g);
        int[] a = switch (dom) {
          case WORKER -> currentOnWorker;
          case HOST -> currentOnHost;
          case ZONE -> currentInZone;
        };
        c = a[idx] += delta;
      } else {
        c = counts.add(g, dom, idx, delta);
      }
      if (delta > 0 && c == 1) {
        occupied[g][dom.ordinal()]++;
      } else if (delta < 0 && c == 0) {
        occupied[g][dom.ordinal()]--;
      }
    }

    /** Counts a pod of group g on worker b, or with {@code delta} -1 takes it off again. */
    private void countPod(int g, int b, int delta) {
      if (ruled[g]) {
        int h = hostOf[b];
        bump(g, Domain.WORKER, b, delta);
        bump(g, Domain.HOST, h, delta);
        bump(g, Domain.ZONE, topo.zoneOf(h), delta);
      }
    }

    void add(int g, int b) {
      long[] w = demand[g];
      int at = b * d;
      for (int k = 0; k < d; k++) {
        loads[at + k] += w[k];
      }
      refresh(b);
      countPod(g, b, 1);
    }

    void remove(int g, int b) {
      long[] w = demand[g];
      int at = b * d;
      for (int k = 0; k < d; k++) {
        loads[at + k] -= w[k];
      }
      refresh(b);
      countPod(g, b, -1);
    }

    /** Domains of each kind that have (surviving) workers now (the scheduler's domains). */
    private int domains(Domain dom) {
      return switch (dom) {
        case WORKER -> nBins - lostBins;
        case HOST -> hostsWithWorkers;
        case ZONE -> zonesWithWorkers;
      };
    }

    /** The smallest count of the group's pods over the domains that have workers. */
    private int minCount(int g, Domain dom) {
      if (occupied[g][dom.ordinal()] < domains(dom)) {
        return 0;
      }
      // Every domain holds a pod: lost ones hold none and are skipped with the empty numbers.
      int min = Integer.MAX_VALUE;
      int n = dom == Domain.WORKER ? nBins : dom == Domain.HOST ? hostsSeen : topo.zones();
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
      int c = count(g, dom, idx);
      if (anti[g][dom.ordinal()] && c > 0) {
        return false;
      }
      int s = skew[g][dom.ordinal()];
      if (s == 0) {
        return true;
      }
      if (strict && dom != Domain.ZONE) {
        return c + 1 <= s;
      }
      return c + 1 - minCount(g, dom) <= s;
    }

    boolean allowed(int g, int b, int zone) {
      if (!ruled[g]) {
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
      if (h >= hostLimit || (h < lostHost.length && lostHost[h])) {
        return false;
      }
      int on = h < workersOnHost.length ? workersOnHost[h] : 0;
      if (on >= topo.workersPerHost()) {
        return false;
      }
      int z = topo.zoneOf(h);
      if (zone >= 0 && z != zone) {
        return false;
      }
      if (!ruled[g]) {
        return true;
      }
      // A new worker holds none of the group's pods, so worker rules allow it; its host and
      // zone are checked as they are.
      boolean newHost = on == 0;
      int h1 = Domain.HOST.ordinal();
      if (anti[g][h1] && count(g, Domain.HOST, h) > 0) {
        return false;
      }
      if (skew[g][h1] > 0) {
        int c = count(g, Domain.HOST, h);
        int min = newHost ? 0 : minCount(g, Domain.HOST);
        int limit = skew[g][h1];
        if (strict ? c + 1 > limit : c + 1 - min > limit) {
          return false;
        }
      }
      int z1 = Domain.ZONE.ordinal();
      if (anti[g][z1] && count(g, Domain.ZONE, z) > 0) {
        return false;
      }
      if (zone < 0 && skew[g][z1] > 0) {
        int c = count(g, Domain.ZONE, z);
        return c + 1 - minCount(g, Domain.ZONE) <= skew[g][z1];
      }
      return true;
    }

    /** The first host below {@code limit} where a new worker may take a pod of g; or -1. */
    private int newWorkerHost(int g, int zone, int limit) {
      int h = fullBelow;
      while (h < limit && !hostAllowed(g, h, zone)) {
        steps++;
        h++;
      }
      return h < limit ? h : -1;
    }

    private int openFor(int h) {
      int b = openWorker(h);
      while (fullBelow < hostsSeen && workersOnHost[fullBelow] >= topo.workersPerHost()) {
        fullBelow++;
      }
      return b;
    }

    void placeAll(int[] order) {
      for (int g : order) {
        Group gr = groups.get(g);
        for (int j = 0; j < gr.count; j++) {
          place(g, j);
        }
      }
    }

    /** Places pod j of group g while packing; returns its worker or -1. */
    int place(int g, int j) {
      long[] w = demand[g];
      int[] s = skew[g];
      int zone = -1;
      if (s[Domain.ZONE.ordinal()] > 0) {
        // Zones in turn: counts differ by at most one, whatever the final layout.
        zone = j % topo.zones();
      }
      boolean spread = s[Domain.WORKER.ordinal()] > 0 || s[Domain.HOST.ordinal()] > 0;
      int best = -1;
      long bestKey = Long.MAX_VALUE;
      // Loads and counts only grow while packing, so a worker that could not take a pod of this
      // group (no room, or already one under anti-affinity) cannot later: later pods of the group
      // start where the last one was placed. Spread and zone turns can re-allow a worker, so
      // they scan from the start.
      boolean monotone = !spread && s[Domain.ZONE.ordinal()] == 0;
      // With spread over workers or hosts, the first worker that fits and whose worker and host
      // hold none of the group's pods is the best choice; workers before the last such one had
      // pods of the group (on them or their host) or no room, and still do, since counts and
      // loads only grow. When none is found from there, the whole list is scanned for the fewest.
      int from = monotone || spread ? resume[g] : 0;
      while (true) {
        for (int b = firstFit(from, w); b >= 0; b = firstFit(b + 1, w)) {
          if (!allowed(g, b, zone)) {
            continue;
          }
          if (!spread) {
            best = b;
            break;
          }
          long k = 0;
          if (s[Domain.WORKER.ordinal()] > 0) {
            k += count(g, Domain.WORKER, b);
          }
          if (s[Domain.HOST.ordinal()] > 0) {
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
        if (spread && from > 0 && bestKey != 0) {
          from = 0;
          continue;
        }
        break;
      }
      if (best < 0) {
        // Hosts beyond those with workers are alike but for their zone: one round of zones is
        // enough.
        int h = newWorkerHost(g, zone, hostsSeen + topo.zones() + 1);
        if (h < 0) {
          return -1;
        }
        best = openFor(h);
      }
      add(g, best);
      binOfItem[starts[g] + j] = best;
      if (monotone || (spread && bestKey == 0)) {
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

  /**
   * The failure check over one layout: the layout's workers and pods are loaded once; {@link
   * #survives} takes the lost hosts' pods off, re-places them, and undoes every change (an undo
   * log of placements and opened workers), so each failure set costs about its own pods, not the
   * whole layout.
   */
  private static final class Survival {
    final Layout l;
    final Topology topo;
    /** Workers of each host of the layout, and the groups of each worker's pods. */
    final int[][] binsOfHost;
    final int[][] groupsOfBin;
    final int[] rank;
    final int[] dominant;

    Survival(List<Group> groups, long[] capacity, Topology topo, Result layout) {
      this.topo = topo;
      this.l = new Layout(groups, capacity, topo, false, false);
      int bins = layout.bins();
      int[] perHost = new int[Math.max(layout.hosts(), 1)];
      for (int b = 0; b < bins; b++) {
        l.openWorker(layout.hostOfBin[b]);
        perHost[layout.hostOfBin[b]]++;
      }
      binsOfHost = new int[perHost.length][];
      for (int h = 0; h < perHost.length; h++) {
        binsOfHost[h] = new int[perHost[h]];
        perHost[h] = 0;
      }
      for (int b = 0; b < bins; b++) {
        int h = layout.hostOfBin[b];
        binsOfHost[h][perHost[h]++] = b;
      }
      int[] perBin = new int[bins];
      for (int b : layout.binOfItem) {
        if (b >= 0) {
          perBin[b]++;
        }
      }
      groupsOfBin = new int[bins][];
      for (int b = 0; b < bins; b++) {
        groupsOfBin[b] = new int[perBin[b]];
        perBin[b] = 0;
      }
      int item = 0;
      for (int g = 0; g < groups.size(); g++) {
        for (int j = 0; j < groups.get(g).count; j++, item++) {
          int b = layout.binOfItem[item];
          if (b >= 0) {
            groupsOfBin[b][perBin[b]++] = g;
            l.add(g, b);
          }
        }
      }
      int[] order = order(groups, capacity);
      rank = new int[groups.size()];
      for (int i = 0; i < order.length; i++) {
        rank[order[i]] = i;
      }
      dominant = new int[groups.size()];
      for (int g = 0; g < groups.size(); g++) {
        dominant[g] = RulePacker.dominant(groups.get(g).demand, capacity);
      }
      for (int h = 0; h < l.hostsSeen; h++) {
        // Hosts of the layout are as full as it left them; later ones are empty.
        if (l.workersOnHost[h] < topo.workersPerHost()) {
          break;
        }
        l.fullBelow = h + 1;
      }
    }

    /**
     * Whether the pods of the failed hosts can be rescheduled on the others, with {@code hosts}
     * hosts in all (those beyond the layout's are empty). Leaves the layout as it found it.
     */
    boolean survives(int hosts, int[] failed) {
      l.hostLimit = hosts;
      l.ensureHost(hosts - 1);
      int fullBelow = l.fullBelow;
      int lostPods = 0;
      for (int h : failed) {
        lose(h);
        if (h < binsOfHost.length) {
          for (int b : binsOfHost[h]) {
            lostPods += groupsOfBin[b].length;
          }
        }
      }
      // Largest pods first (the packing's group order), as the packing placed them.
      Integer[] displaced = new Integer[lostPods];
      int n = 0;
      for (int h : failed) {
        if (h < binsOfHost.length) {
          for (int b : binsOfHost[h]) {
            for (int g : groupsOfBin[b]) {
              displaced[n++] = g;
            }
          }
        }
      }
      Arrays.sort(displaced, (a, b) -> Integer.compare(rank[a], rank[b]));
      int[] placedOn = new int[lostPods];
      int placed = 0;
      int opened = 0;
      boolean ok = true;
      for (int g : displaced) {
        int b = l.bestFit(g, dominant[g]);
        if (b < 0) {
          int h = l.newWorkerHost(g, -1, hosts);
          if (h < 0) {
            ok = false;
            break;
          }
          b = l.openFor(h);
          opened++;
        }
        l.add(g, b);
        placedOn[placed++] = b;
      }
      // Undo, newest first: placements, opened workers, lost hosts.
      for (int i = placed - 1; i >= 0; i--) {
        l.remove(displaced[i], placedOn[i]);
      }
      for (int i = 0; i < opened; i++) {
        l.closeLastWorker();
      }
      for (int i = failed.length - 1; i >= 0; i--) {
        restore(failed[i]);
      }
      l.fullBelow = fullBelow;
      return ok;
    }

    /** Takes host h's workers out: their pods leave the counts, their room is unusable. */
    private void lose(int h) {
      l.lostHost[h] = true;
      if (h >= binsOfHost.length || binsOfHost[h].length == 0) {
        return;
      }
      for (int b : binsOfHost[h]) {
        for (int g : groupsOfBin[b]) {
          l.countPod(g, b, -1);
        }
        l.lostBin[b] = true;
        l.lostBins++;
        l.refresh(b);
      }
      l.hostsWithWorkers--;
      if (--l.hostsInZone[topo.zoneOf(h)] == 0) {
        l.zonesWithWorkers--;
      }
    }

    private void restore(int h) {
      l.lostHost[h] = false;
      if (h >= binsOfHost.length || binsOfHost[h].length == 0) {
        return;
      }
      for (int b : binsOfHost[h]) {
        l.lostBin[b] = false;
        l.lostBins--;
        l.refresh(b);
        for (int g : groupsOfBin[b]) {
          l.countPod(g, b, 1);
        }
      }
      l.hostsWithWorkers++;
      if (l.hostsInZone[topo.zoneOf(h)]++ == 0) {
        l.zonesWithWorkers++;
      }
    }
  }
}
