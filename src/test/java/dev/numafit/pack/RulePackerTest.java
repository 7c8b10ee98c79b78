package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.pack.RulePacker.Domain;
import dev.numafit.pack.RulePacker.Group;
import dev.numafit.pack.RulePacker.Topology;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * Small layouts whose only valid packing can be worked out by hand. The rules are the
 * scheduler's: required pod anti-affinity allows at most one matching pod per topology domain,
 * and a DoNotSchedule topology spread constraint keeps the pod counts of any two domains within
 * maxSkew ("Pod Topology Spread Constraints" and "Assigning Pods to Nodes", kubernetes.io
 * concepts pages). One dimension (cpu, millicores) unless said otherwise.
 */
class RulePackerTest {
  static final long[] CPU4 = {4000};

  @Test
  void pack_workerAntiAffinity_onePodPerWorker() {
    // Three 1000m replicas would share one 4000m worker; anti-affinity on the hostname forbids
    // it, so the only valid packing is one per worker.
    List<Group> g = List.of(new Group(new long[] {1000}, 3, Set.of(Domain.WORKER), Map.of()));
    RulePacker.Result r = RulePacker.pack(g, CPU4, new Topology(4, 1));
    assertEquals(3, r.bins());
    assertArrayEquals(new int[] {0, 1, 2}, r.binOfItem());
    // Four workers fit one host: all three workers on host 0.
    assertEquals(1, r.hosts());
  }

  @Test
  void pack_hostSpread_onlyValidPackingPairsSmallWithBig() {
    // One worker per host. Two 3000m pods need two workers (hosts). Two 1000m pods spread over
    // hosts with maxSkew 1: both on one host would leave the other host with 0 (skew 2), so the
    // only valid 2-worker packing puts one small pod beside each big one.
    List<Group> g =
        List.of(
            Group.plain(new long[] {3000}, 2),
            new Group(new long[] {1000}, 2, Set.of(), Map.of(Domain.HOST, 1)));
    RulePacker.Result r = RulePacker.pack(g, CPU4, new Topology(1, 1));
    assertEquals(2, r.bins());
    int[] b = r.binOfItem();
    assertTrue(b[0] != b[1], "big pods on different workers");
    assertTrue(b[2] != b[3], "small pods on different workers");
    assertEquals(List.of(), RulePacker.violations(g, CPU4, new Topology(1, 1), r));
  }

  @Test
  void pack_zoneSpread_twoPerZone() {
    // Two zones, one worker per host, four 1000m pods spread over zones with maxSkew 1: zones take
    // pods in turn, so each zone's single worker holds two.
    List<Group> g = List.of(new Group(new long[] {1000}, 4, Set.of(), Map.of(Domain.ZONE, 1)));
    Topology t = new Topology(1, 2);
    RulePacker.Result r = RulePacker.pack(g, CPU4, t);
    assertEquals(2, r.bins());
    int[] b = r.binOfItem();
    assertEquals(b[0], b[2]);
    assertEquals(b[1], b[3]);
    assertTrue(t.zoneOf(r.hostOfBin()[b[0]]) != t.zoneOf(r.hostOfBin()[b[1]]));
  }

  @Test
  void pack_zoneAntiAffinity_moreReplicasThanZones_restUnplaced() {
    // Anti-affinity on the zone with 3 zones allows 3 pods; the fourth cannot run anywhere (the
    // scheduler would leave it Pending).
    List<Group> g = List.of(new Group(new long[] {1000}, 4, Set.of(Domain.ZONE), Map.of()));
    RulePacker.Result r = RulePacker.pack(g, CPU4, new Topology(2, 3));
    assertEquals(List.of(3), r.unplaced());
    assertEquals(3, r.bins());
  }

  @Test
  void hostsToSurvive_plainPacking_oneMoreHost() {
    // Hand-worked: three 3000m pods on 4000m workers need 3 workers (no two share); two workers
    // per host makes 2 hosts: {w0, w1} and {w2, free slot}. Losing host 0 displaces two 3000m
    // pods: w2 has 1000m left and host 1 one free slot, so one pod stays unplaced: 2 hosts do
    // not survive. With a third, empty host (two free slots) every single loss is absorbed: 3.
    List<Group> g = List.of(Group.plain(new long[] {3000}, 3));
    Topology t = new Topology(2, 1);
    RulePacker.Result layout = RulePacker.fromPacking(new int[] {0, 1, 2}, 3, t);
    assertEquals(2, layout.hosts());
    RulePacker.FailureResult f = RulePacker.hostsToSurvive(g, CPU4, t, layout, 1, false, 5);
    assertEquals(new RulePacker.FailureResult(3, true, true), f);
  }

  @Test
  void hostsToSurvive_slackAbsorbsLoss_noExtraHost() {
    // Hand-worked: 4000m workers, two per host. Four 2000m pods fill w0 and w1 (host 0); six
    // 500m pods fill w2 to 3000m (host 1, one slot free).
    // Losing host 1 displaces 3000m of 500m pods: host 1's free slot is lost with it, and w0, w1
    // are full, so 2 hosts do not survive. Three hosts do: host 2's two slots take any loss.
    List<Group> g =
        List.of(Group.plain(new long[] {2000}, 4), Group.plain(new long[] {500}, 6));
    Topology t = new Topology(2, 1);
    RulePacker.Result layout =
        RulePacker.fromPacking(new int[] {0, 0, 1, 1, 2, 2, 2, 2, 2, 2}, 3, t);
    RulePacker.FailureResult f = RulePacker.hostsToSurvive(g, CPU4, t, layout, 1, false, 5);
    assertEquals(3, f.hosts());
    // With two hosts' worth of failures, four hosts are needed: the two survivors must hold
    // 11000m of pods on at most four workers (16000m), and the layout's own two hosts can be lost
    // together, leaving two empty hosts with four free slots.
    assertEquals(4, RulePacker.hostsToSurvive(g, CPU4, t, layout, 2, false, 5).hosts());
  }

  @Test
  void hostsToSurvive_hostAntiAffinity_handCount() {
    // Hand-worked, two workers per host, 4000m workers. web: two 3000m pods; db: three 1000m
    // pods, at most one per host. Packing: web on w0 and w1 (host 0), db#0 beside web on w0,
    // db#1 and db#2 each on a new host (w2 on host 1, w3 on host 2): 4 workers, 3 hosts (2
    // without the rule). Losing host 0 displaces web, web and db: the webs fit beside the other
    // dbs, but a db needs a host without one, and hosts 1 and 2 have one: 3 hosts fail, 4 hold.
    List<Group> g =
        List.of(
            Group.plain(new long[] {3000}, 2),
            new Group(new long[] {1000}, 3, Set.of(Domain.HOST), Map.of()));
    Topology t = new Topology(2, 1);
    RulePacker.Result r = RulePacker.pack(g, CPU4, t);
    assertEquals(4, r.bins());
    assertEquals(3, r.hosts());
    assertEquals(
        new RulePacker.FailureResult(4, true, true),
        RulePacker.hostsToSurvive(g, CPU4, t, r, 1, false, 5));
  }

  @Test
  void hostsToSurvive_zoneFailure_twoZones() {
    // Hand-worked: one worker per host, two zones (hosts 0, 2 in zone 0; 1, 3 in zone 1). Four
    // 3000m pods need 4 workers = 4 hosts, two per zone. Losing a zone displaces two pods that
    // cannot share a worker and find no free slot: more hosts are needed. With 6 hosts (3 per
    // zone) a lost zone displaces at most two pods onto the other zone's one empty host: not
    // enough; with 7, losing zone 0 (hosts 0, 2, 4, 6) still leaves zone 1 one empty host. With
    // 8 hosts each zone keeps two empty hosts: enough.
    List<Group> g = List.of(Group.plain(new long[] {3000}, 4));
    Topology t = new Topology(1, 2);
    RulePacker.Result layout = RulePacker.fromPacking(new int[] {0, 1, 2, 3}, 4, t);
    RulePacker.FailureResult f = RulePacker.hostsToSurvive(g, CPU4, t, layout, 0, true, 10);
    assertEquals(8, f.hosts());
  }

  @Test
  void hostsToSurvive_bestFitDecreasing_noExtraHost() {
    // Hand-worked, 10000m workers, two per host. w0 holds 4000m (6000m free) and w1 6000m
    // (4000m free) on host 0; w2 on host 1 holds 4000m + 3000m + 3000m (full), host 1's second
    // slot is free. Losing host 1 displaces 4000m, 3000m, 3000m into 6000m + 4000m of room: the
    // 4000m pod must take the 4000m room for the two 3000m pods to fit the 6000m (best fit does;
    // first fit would put 4000m on w0 and strand a 3000m pod). Losing host 0 displaces 6000m and
    // 4000m: one new worker in host 1's free slot takes both. So the layout's 2 hosts survive.
    List<Group> g =
        List.of(
            Group.plain(new long[] {4000}, 2),
            Group.plain(new long[] {3000}, 2),
            Group.plain(new long[] {6000}, 1));
    Topology t = new Topology(2, 1);
    RulePacker.Result layout = RulePacker.fromPacking(new int[] {0, 2, 2, 2, 1}, 3, t);
    assertEquals(2, layout.hosts());
    assertEquals(
        new RulePacker.FailureResult(2, true, true),
        RulePacker.hostsToSurvive(g, new long[] {10000}, t, layout, 1, false, 5));
  }
}
