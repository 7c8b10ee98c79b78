package dev.numafit.pack;

import dev.numafit.pack.RulePacker.Domain;
import dev.numafit.pack.RulePacker.FailureResult;
import dev.numafit.pack.RulePacker.Group;
import dev.numafit.pack.RulePacker.Result;
import dev.numafit.pack.RulePacker.Topology;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * A plain reference for {@link RulePacker#hostsToSurvive}: for every host count and every failure
 * set it rebuilds the surviving layout from scratch with plain arrays and linear scans, and
 * re-places the lost pods by the documented rule (largest first; each onto the allowed worker
 * that leaves the least free room in the pod's largest dimension, ties to the lower worker; else
 * a new worker on the first allowed host). No undo log, no tree, no memo across host counts: the
 * fast check must agree with it.
 */
final class FailureReference {
  private FailureReference() {}

  static FailureResult hostsToSurvive(
      List<Group> groups,
      long[] cap,
      Topology topo,
      Result layout,
      int k,
      boolean zoneFailure,
      int maxExtra) {
    if (k == 0 && !zoneFailure) {
      return new FailureResult(layout.hosts(), true, true);
    }
    boolean exhaustive = true;
    for (int hosts = Math.max(1, layout.hosts()); hosts <= layout.hosts() + maxExtra; hosts++) {
      if (hosts - k < 1 || (zoneFailure && topo.zones() < 2)) {
        continue;
      }
      List<int[]> sets = new ArrayList<>();
      if (k > 0) {
        List<int[]> all = new ArrayList<>();
        subsets(hosts, k, new int[k], 0, 0, all);
        if (all.size() <= RulePacker.MAX_FAILURE_SETS) {
          sets.addAll(all);
        } else {
          exhaustive = false;
          sets.add(heaviest(groups, cap, layout, hosts, k));
        }
      }
      if (zoneFailure) {
        for (int z = 0; z < topo.zones(); z++) {
          List<Integer> in = new ArrayList<>();
          for (int h = 0; h < hosts; h++) {
            if (h % topo.zones() == z) {
              in.add(h);
            }
          }
          sets.add(in.stream().mapToInt(Integer::intValue).toArray());
        }
      }
      boolean ok = true;
      for (int[] set : sets) {
        if (!survives(groups, cap, topo, layout, hosts, set)) {
          ok = false;
          break;
        }
      }
      if (ok) {
        return new FailureResult(hosts, true, exhaustive);
      }
    }
    return new FailureResult(layout.hosts() + maxExtra, false, exhaustive);
  }

  private static void subsets(int n, int k, int[] cur, int pos, int from, List<int[]> out) {
    if (pos == k) {
      out.add(cur.clone());
      return;
    }
    for (int h = from; h < n; h++) {
      cur[pos] = h;
      subsets(n, k, cur, pos + 1, h + 1, out);
    }
  }

  private static int[] heaviest(List<Group> groups, long[] cap, Result layout, int hosts, int k) {
    double[] weight = new double[hosts];
    int item = 0;
    for (Group g : groups) {
      double w = 0;
      for (int x = 0; x < cap.length; x++) {
        w += cap[x] > 0 ? (double) g.demand()[x] / cap[x] : 0;
      }
      for (int j = 0; j < g.count(); j++, item++) {
        int b = layout.binOfItem()[item];
        if (b >= 0) {
          weight[layout.hostOfBin()[b]] += w;
        }
      }
    }
    boolean[] taken = new boolean[hosts];
    int[] out = new int[k];
    for (int i = 0; i < k; i++) {
      int best = -1;
      for (int h = 0; h < hosts; h++) {
        if (!taken[h] && (best < 0 || weight[h] > weight[best])) {
          best = h;
        }
      }
      taken[best] = true;
      out[i] = best;
    }
    Arrays.sort(out);
    return out;
  }

  /** Largest share of a worker in any dimension. */
  private static double share(long[] w, long[] cap) {
    double m = 0;
    for (int x = 0; x < cap.length; x++) {
      if (cap[x] > 0) {
        m = Math.max(m, (double) w[x] / cap[x]);
      }
    }
    return m;
  }

  /** The survivors, rebuilt for one failure set. */
  private static final class Rebuilt {
    final List<Group> groups;
    final long[] cap;
    final Topology topo;
    final int hosts;
    final boolean[] lost;
    final List<long[]> load = new ArrayList<>();
    final List<Integer> hostOf = new ArrayList<>();
    final int[] workersOn;
    /** Per group: pods per worker (list), per host, per zone. */
    final List<List<Integer>> onWorker = new ArrayList<>();
    final int[][] onHost;
    final int[][] inZone;

    Rebuilt(List<Group> groups, long[] cap, Topology topo, int hosts, boolean[] lost) {
      this.groups = groups;
      this.cap = cap;
      this.topo = topo;
      this.hosts = hosts;
      this.lost = lost;
      this.workersOn = new int[hosts];
      this.onHost = new int[groups.size()][hosts];
      this.inZone = new int[groups.size()][topo.zones()];
      for (int g = 0; g < groups.size(); g++) {
        onWorker.add(new ArrayList<>());
      }
    }

    int open(int h) {
      load.add(new long[cap.length]);
      hostOf.add(h);
      for (List<Integer> l : onWorker) {
        l.add(0);
      }
      return load.size() - 1;
    }

    void add(int g, int w) {
      for (int x = 0; x < cap.length; x++) {
        load.get(w)[x] += groups.get(g).demand()[x];
      }
      int h = hostOf.get(w);
      onWorker.get(g).set(w, onWorker.get(g).get(w) + 1);
      onHost[g][h]++;
      inZone[g][h % topo.zones()]++;
    }

    boolean fits(int g, int w) {
      for (int x = 0; x < cap.length; x++) {
        if (load.get(w)[x] + groups.get(g).demand()[x] > cap[x]) {
          return false;
        }
      }
      return true;
    }

    boolean hostHasWorker(int h) {
      return hostOf.contains(h);
    }

    /** Smallest count over the domains that have workers (0 when there are none). */
    int min(int g, Domain dom) {
      int min = Integer.MAX_VALUE;
      switch (dom) {
        case WORKER -> {
          for (int w = 0; w < load.size(); w++) {
            min = Math.min(min, onWorker.get(g).get(w));
          }
        }
        case HOST -> {
          for (int h = 0; h < hosts; h++) {
            if (hostHasWorker(h)) {
              min = Math.min(min, onHost[g][h]);
            }
          }
        }
        case ZONE -> {
          for (int z = 0; z < topo.zones(); z++) {
            boolean has = false;
            for (int h : hostOf) {
              has |= h % topo.zones() == z;
            }
            if (has) {
              min = Math.min(min, inZone[g][z]);
            }
          }
        }
      }
      return min == Integer.MAX_VALUE ? 0 : min;
    }

    boolean allowedIn(int g, Domain dom, int c) {
      Group gr = groups.get(g);
      if (gr.antiAffinity().contains(dom) && c > 0) {
        return false;
      }
      Integer skew = gr.maxSkew().get(dom);
      return skew == null || c + 1 - min(g, dom) <= skew;
    }

    boolean allowed(int g, int w) {
      if (!groups.get(g).ruled()) {
        return true;
      }
      int h = hostOf.get(w);
      return allowedIn(g, Domain.WORKER, onWorker.get(g).get(w))
          && allowedIn(g, Domain.HOST, onHost[g][h])
          && allowedIn(g, Domain.ZONE, inZone[g][h % topo.zones()]);
    }

    /** A new worker on host h: it holds none of the group; its host and zone as they are. */
    boolean hostAllowed(int g, int h) {
      if (lost[h] || workersOn[h] >= topo.workersPerHost()) {
        return false;
      }
      Group gr = groups.get(g);
      if (!gr.ruled()) {
        return true;
      }
      int c = onHost[g][h];
      if (gr.antiAffinity().contains(Domain.HOST) && c > 0) {
        return false;
      }
      Integer hs = gr.maxSkew().get(Domain.HOST);
      if (hs != null && c + 1 - (workersOn[h] == 0 ? 0 : min(g, Domain.HOST)) > hs) {
        return false;
      }
      int zc = inZone[g][h % topo.zones()];
      if (gr.antiAffinity().contains(Domain.ZONE) && zc > 0) {
        return false;
      }
      Integer zs = gr.maxSkew().get(Domain.ZONE);
      return zs == null || zc + 1 - min(g, Domain.ZONE) <= zs;
    }
  }

  static boolean survives(
      List<Group> groups, long[] cap, Topology topo, Result layout, int hosts, int[] failed) {
    boolean[] lost = new boolean[hosts];
    for (int h : failed) {
      lost[h] = true;
    }
    Rebuilt r = new Rebuilt(groups, cap, topo, hosts, lost);
    int[] newIndex = new int[layout.bins()];
    for (int b = 0; b < layout.bins(); b++) {
      int h = layout.hostOfBin()[b];
      r.workersOn[h]++;
      newIndex[b] = lost[h] ? -1 : r.open(h);
    }
    List<Integer> displaced = new ArrayList<>();
    int item = 0;
    for (int g = 0; g < groups.size(); g++) {
      for (int j = 0; j < groups.get(g).count(); j++, item++) {
        int b = layout.binOfItem()[item];
        if (b < 0) {
          continue;
        }
        if (newIndex[b] < 0) {
          displaced.add(g);
        } else {
          r.add(g, newIndex[b]);
        }
      }
    }
    // Largest share first, ties by group number (a stable sort keeps item order).
    displaced.sort(
        (a, b) -> {
          int c =
              Double.compare(share(groups.get(b).demand(), cap), share(groups.get(a).demand(), cap));
          return c != 0 ? c : Integer.compare(a, b);
        });
    for (int g : displaced) {
      long[] w = groups.get(g).demand();
      int p = 0;
      double top = -1;
      for (int x = 0; x < cap.length; x++) {
        if (cap[x] > 0 && (double) w[x] / cap[x] > top) {
          top = (double) w[x] / cap[x];
          p = x;
        }
      }
      int best = -1;
      long bestFree = Long.MAX_VALUE;
      for (int i = 0; i < r.load.size(); i++) {
        if (r.fits(g, i) && r.allowed(g, i)) {
          long free = cap[p] - r.load.get(i)[p];
          if (free < bestFree) {
            bestFree = free;
            best = i;
          }
        }
      }
      if (best < 0) {
        for (int h = 0; h < hosts && best < 0; h++) {
          if (r.hostAllowed(g, h)) {
            r.workersOn[h]++;
            best = r.open(h);
          }
        }
      }
      if (best < 0) {
        return false;
      }
      r.add(g, best);
    }
    return true;
  }
}
