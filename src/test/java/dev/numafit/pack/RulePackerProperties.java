package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.pack.RulePacker.Domain;
import dev.numafit.pack.RulePacker.Group;
import dev.numafit.pack.RulePacker.Topology;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * No layout the rule packer produces breaks a hard rule, checked here independently of the
 * packer's own check: capacity per worker, workers per host, required anti-affinity (at most one
 * pod of the group per domain) and DoNotSchedule spread (pod counts of any two domains that have
 * workers differ by at most maxSkew — the scheduler's definition, "Pod Topology Spread
 * Constraints", kubernetes.io).
 */
class RulePackerProperties {
  record Case(List<Group> groups, long[] capacity, Topology topo) {}

  @Provide
  Arbitrary<Case> cases() {
    long[] cap = {1000, 1000};
    Arbitrary<Group> group =
        Combinators.combine(
                Arbitraries.longs().between(1, 1000),
                Arbitraries.longs().between(0, 1000),
                Arbitraries.integers().between(1, 12),
                Arbitraries.of(Domain.class).set().ofMaxSize(2),
                Arbitraries.of(Domain.class).set().ofMaxSize(2),
                Arbitraries.integers().between(1, 3))
            .as(
                (a, b, n, anti, spread, skew) -> {
                  Map<Domain, Integer> m = new EnumMap<>(Domain.class);
                  for (Domain d : spread) {
                    m.put(d, skew);
                  }
                  Set<Domain> antiSet =
                      anti.isEmpty() ? EnumSet.noneOf(Domain.class) : EnumSet.copyOf(anti);
                  return new Group(new long[] {a, b}, n, antiSet, m);
                });
    return Combinators.combine(
            group.list().ofMinSize(1).ofMaxSize(6),
            Arbitraries.integers().between(1, 4),
            Arbitraries.integers().between(1, 3))
        .as((gs, w, z) -> new Case(gs, cap, new Topology(w, z)));
  }

  @Property(tries = 300)
  void pack_anyRules_noHardRuleBroken(@ForAll("cases") Case c) {
    RulePacker.Result r = RulePacker.pack(c.groups(), c.capacity(), c.topo());
    List<String> broken = check(c, r);
    assertTrue(broken.isEmpty(), broken.toString());
  }

  @Property(tries = 100)
  void hostsToSurvive_oneHostLost_atLeastCapacityBound(@ForAll("cases") Case c) {
    RulePacker.Result r = RulePacker.pack(c.groups(), c.capacity(), c.topo());
    RulePacker.FailureResult f =
        RulePacker.hostsToSurvive(c.groups(), c.capacity(), c.topo(), r, 1, false, 6);
    // Survivors must hold every placed pod: (hosts − 1) × workersPerHost workers of capacity.
    List<long[]> placed = new ArrayList<>();
    int item = 0;
    for (Group g : c.groups()) {
      for (int j = 0; j < g.count(); j++, item++) {
        if (r.binOfItem()[item] >= 0) {
          placed.add(g.demand());
        }
      }
    }
    int bound = LowerBound.continuous(placed.toArray(new long[0][]), c.capacity());
    int w = c.topo().workersPerHost();
    int minHosts = placed.isEmpty() ? 1 : 1 + (bound + w - 1) / w;
    if (f.survives()) {
      assertTrue(f.hosts() >= minHosts, f + " < " + minHosts);
      assertTrue(f.hosts() >= r.hosts(), f + " below the layout's " + r.hosts());
    }
  }

  /** An independent check of every hard rule. */
  static List<String> check(Case c, RulePacker.Result r) {
    List<String> out = new ArrayList<>();
    int bins = r.bins();
    int[] hostOf = r.hostOfBin();
    int[] binOf = r.binOfItem();
    int hosts = r.hosts();
    int zones = c.topo().zones();
    int[] workersOn = new int[hosts];
    for (int b = 0; b < bins; b++) {
      if (hostOf[b] < 0 || hostOf[b] >= hosts) {
        out.add("worker " + b + " on host " + hostOf[b] + " of " + hosts);
        return out;
      }
      workersOn[hostOf[b]]++;
    }
    for (int h = 0; h < hosts; h++) {
      if (workersOn[h] > c.topo().workersPerHost()) {
        out.add("host " + h + " has " + workersOn[h] + " workers");
      }
    }
    long[][] load = new long[bins][c.capacity().length];
    int item = 0;
    for (int g = 0; g < c.groups().size(); g++) {
      Group gr = c.groups().get(g);
      int[] perWorker = new int[bins];
      int[] perHost = new int[hosts];
      int[] perZone = new int[zones];
      for (int j = 0; j < gr.count(); j++, item++) {
        int b = binOf[item];
        if (b < 0) {
          continue;
        }
        for (int k = 0; k < c.capacity().length; k++) {
          load[b][k] += gr.demand()[k];
        }
        perWorker[b]++;
        perHost[hostOf[b]]++;
        perZone[hostOf[b] % zones]++;
      }
      boolean[] hostHas = new boolean[hosts];
      boolean[] zoneHas = new boolean[zones];
      for (int b = 0; b < bins; b++) {
        hostHas[hostOf[b]] = true;
        zoneHas[hostOf[b] % zones] = true;
      }
      boolean[] all = new boolean[bins];
      java.util.Arrays.fill(all, true);
      Map<Domain, int[]> counts = Map.of(Domain.WORKER, perWorker, Domain.HOST, perHost,
          Domain.ZONE, perZone);
      Map<Domain, boolean[]> present = Map.of(Domain.WORKER, all, Domain.HOST, hostHas,
          Domain.ZONE, zoneHas);
      for (Domain d : Domain.values()) {
        int[] cnt = counts.get(d);
        boolean[] p = present.get(d);
        int max = 0;
        int min = Integer.MAX_VALUE;
        for (int x = 0; x < cnt.length; x++) {
          if (p[x]) {
            max = Math.max(max, cnt[x]);
            min = Math.min(min, cnt[x]);
          }
        }
        if (gr.antiAffinity().contains(d) && max > 1) {
          out.add("group " + g + " anti-affinity " + d + " broken: " + max);
        }
        Integer skew = gr.maxSkew().get(d);
        if (skew != null && min != Integer.MAX_VALUE && max - min > skew) {
          out.add("group " + g + " spread " + d + " skew " + (max - min) + " > " + skew);
        }
      }
    }
    for (int b = 0; b < bins; b++) {
      for (int k = 0; k < c.capacity().length; k++) {
        if (load[b][k] > c.capacity()[k]) {
          out.add("worker " + b + " over capacity");
        }
      }
    }
    return out;
  }
}
