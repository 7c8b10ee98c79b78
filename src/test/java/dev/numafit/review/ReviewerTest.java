package dev.numafit.review;

import static dev.numafit.review.Pools.GI;
import static dev.numafit.review.Pools.MI;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.cluster.model.Placement;
import dev.numafit.cluster.model.WorkloadRecord;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.WorkloadId;
import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

public class ReviewerTest {
  /**
   * Ten 4-CPU workers: w01–w07 each run two storefront pods of 1950m, w08–w10 one ledger pod of
   * 2000m, every node a 100m log shipper. Free CPU is then 0 on w01–w07 and 1900m on w08–w10,
   * below every movable pod's request (1950m, 2000m), so no pod can move anywhere: any three
   * removals strand exactly the pods of the removed nodes, and the plan strands the fewest (one
   * per ledger node against two per storefront node).
   */
  public static Pools tenWorkers() {
    Pools p = new Pools();
    for (int i = 1; i <= 10; i++) {
      p.node(String.format("w%02d", i), 4000, 16 * GI);
    }
    for (int i = 1; i <= 7; i++) {
      p.pods("storefront", 2, 1950, GI, String.format("w%02d", i));
    }
    for (int i = 8; i <= 10; i++) {
      p.pods("ledger", 1, 2000, 2 * GI, String.format("w%02d", i));
    }
    return p.daemonOnEveryNode(100, 128 * MI);
  }

  @Test
  void review_tenWorkersToSeven_exactlyTheLedgerPodsArePending() {
    Review r = new Reviewer().review(tenWorkers().model(), Pools.resize(7));
    assertFalse(r.fits());
    assertEquals(List.of("shop/Deployment/ledger"),
        r.pending().stream().map(PendingPod::workload).distinct().toList());
    assertEquals(3, r.pending().size());
    // The scheduler's message (its format from memory; "Insufficient cpu" is the NodeResourcesFit
    // reason, FACTS A7): the seven nodes left each have 0m free.
    for (PendingPod p : r.pending()) {
      assertEquals("0/7 nodes are available: 7 Insufficient cpu.", p.reason(), p.pod());
    }
    assertEquals(List.of("w08", "w09", "w10"),
        r.removals().stream().map(Removal::node).toList());
    assertTrue(r.removals().stream().noneMatch(Removal::safe));
    // Before: (14 × 1950 + 3 × 2000 + 10 × 100) / (10 × 4000) = 34300 / 40000.
    assertEquals(0.8575, r.utilizationBefore().get("cpu"));
    // After: (14 × 1950 + 7 × 100) / (7 × 4000) = 28000 / 28000.
    assertEquals(1.0, r.utilizationAfter().get("cpu"));
    assertEquals(10, r.nodesBefore());
    assertEquals(7, r.nodesAfter());
  }

  @Test
  void review_tenWorkersToNine_fitsAfterMovingTheFewestPods() {
    Pools p = new Pools();
    for (int i = 1; i <= 10; i++) {
      p.node(String.format("w%02d", i), 4000, 16 * GI);
      p.pods("storefront", i == 10 ? 1 : 3, 1000, GI, String.format("w%02d", i));
    }
    Review r = new Reviewer().review(p.model(), Pools.resize(9));
    assertTrue(r.fits());
    // w10 runs one pod, the others three: w10 goes first and its pod fits anywhere (1000m free).
    assertEquals(List.of(new Removal("w10", 1, true, List.of())), r.removals());
    assertEquals(List.of(List.of("shop/storefront-w10-0")), r.drain().rounds());
  }

  /**
   * Four 8-CPU workers; n4 runs four checkout pods and one search pod, n1–n3 six catalog pods
   * each, so n4 has the fewest pods and goes. checkout's budget is minAvailable 75%: of 4
   * expected pods ceil(3) = 3 must stay ("Specifying a Disruption Budget for your Application":
   * a percentage rounds up), so 4 − 3 = 1 eviction per round and 4 rounds. search's budget is
   * maxUnavailable 0: zero voluntary evictions (same page), so no round can move it.
   */
  @Test
  void review_budgetsOnTheRemovedNode_fourRoundsAndOneBlockedPod() {
    Pools p = new Pools();
    for (int i = 1; i <= 4; i++) {
      p.node("n" + i, 8000, 32 * GI);
    }
    for (int i = 1; i <= 3; i++) {
      p.pods("catalog", 6, 500, GI, "n" + i);
    }
    p.pods("checkout", 4, 500, GI, "n4", "shop/checkout");
    p.pods("search", 1, 500, GI, "n4", "shop/search");
    p.budget("checkout", "75%", null).budget("search", null, "0");
    Review r = new Reviewer().review(p.model(), Pools.resize(3));
    assertEquals("n4", r.removals().get(0).node());
    assertTrue(r.pending().isEmpty());
    assertEquals(4, r.drain().rounds().size());
    r.drain().rounds().forEach(round -> assertEquals(1, round.size()));
    assertEquals(List.of(new dev.numafit.review.DrainPlan.Blocked("shop/search-n4-0",
        "shop/Deployment/search", List.of("shop/search (maxUnavailable 0)"))),
        r.drain().blocked());
    assertFalse(r.fits(), "a blocking budget means the resize cannot complete");
  }

  @Test
  void review_namespaceLimitedRead_warnsThatOtherNamespacesAreNotCounted() {
    Pools p = tenWorkers();
    p.namespace = Optional.of("shop");
    Review r = new Reviewer().review(p.model(), Pools.resize(10));
    assertTrue(r.warnings().contains("the read was limited to namespace shop: pods of other"
        + " namespaces on the pool's nodes are not counted"), r.warnings().toString());
  }

  @Test
  void review_nodesLargerThanOneNumaNode_listedAsSpanningWithTheExcess() {
    ResizeRequest base = Pools.resize(10);
    ResizeRequest req = new ResizeRequest("pool", "general", OptionalInt.empty(),
        Optional.empty(), Optional.of(Resources.of("cpu", 3000L, "memory", 12 * GI)),
        Optional.of("two-socket"), 0, Optional.empty(), 2, base.from(), base.replicas());
    Review r = new Reviewer().review(tenWorkers().model(), req);
    assertEquals(10, r.spanning().size());
    assertEquals(List.of(new SpanningNode.Excess("cpu", 4000, 3000, 1000),
        new SpanningNode.Excess("memory", 16 * GI, 12 * GI, 4 * GI)), r.spanning().get(0).over());
  }

  @Test
  void review_newShape_packerCountsNodesNeededAtTheLowerBound() {
    Resources cap = Resources.of("cpu", 8000L, "memory", 32 * GI);
    ResizeRequest base = Pools.resize(10);
    ResizeRequest req = new ResizeRequest("pool", "general", OptionalInt.of(5),
        Optional.of(new NodeShape("cpu=8,memory=32Gi", cap, cap.with("pods", 110))),
        Optional.empty(), Optional.empty(), 0, Optional.empty(), 2, base.from(),
        base.replicas());
    Review r = new Reviewer().review(tenWorkers().model(), req);
    // Room per node 8000 − 100 = 7900m: 14 × 1950 + 3 × 2000 = 33300m needs ceil(4.2) = 5.
    assertEquals(OptionalInt.of(5), r.lowerBound());
    assertEquals(OptionalInt.of(5), r.nodesNeeded());
    assertTrue(r.fits(), r.pending().toString());
    assertEquals(5, r.nodesAfter());
  }

  @Test
  void review_unknownPool_rejectedWithTheSelector() {
    ResizeRequest base = Pools.resize(3);
    ResizeRequest req = new ResizeRequest("pool", "gpu", OptionalInt.empty(), Optional.empty(),
        Optional.empty(), Optional.empty(), 0, Optional.empty(), 2, base.from(), base.replicas());
    IllegalArgumentException ex = assertThrows(IllegalArgumentException.class,
        () -> new Reviewer().review(tenWorkers().model(), req));
    assertEquals("--pool pool=gpu: no node has this label (10 nodes read)", ex.getMessage());
  }

  @Test
  void review_hostFailure_losesTheBusiestHostAndReportsWhatStrands() {
    ResizeRequest base = Pools.resize(10);
    ResizeRequest req = new ResizeRequest("pool", "general", OptionalInt.empty(),
        Optional.empty(), Optional.empty(), Optional.empty(), 1, Optional.empty(), 2,
        base.from(), base.replicas());
    Review r = new Reviewer().review(tenWorkers().model(), req);
    HostFailureCheck h = r.hostFailures().orElseThrow();
    // Two workers per host by name: w01..w02 carries 4 × 1950m, the most; nothing else has room.
    assertEquals(List.of("w01..w02"), h.hostsLost());
    assertEquals(4, h.pending().size());
    assertFalse(r.fits());
  }

  /**
   * Ten empty 4-CPU workers with a 100m log shipper each (3900m of room): a node holds two
   * storefront pods (2 × 1950m) or one ledger pod (2000m + 1950m would be 3950m). Declared,
   * storefront runs 14 replicas and peaks at 20 under its autoscaler; ledger runs 3.
   */
  static ClusterModel declared() {
    Pools p = new Pools();
    for (int i = 1; i <= 10; i++) {
      p.node(String.format("w%02d", i), 4000, 16 * GI);
    }
    List<WorkloadRecord> ws = List.of(
        new WorkloadRecord(new WorkloadId("shop", "Deployment", "storefront"),
            new Replicas(14, 20, "HorizontalPodAutoscaler storefront maxReplicas"), false,
            Resources.of("cpu", 1950L, "memory", GI), Placement.NONE),
        new WorkloadRecord(new WorkloadId("shop", "Deployment", "ledger"),
            new Replicas(3, 3, "spec.replicas"), false,
            Resources.of("cpu", 2000L, "memory", 2 * GI), Placement.NONE),
        new WorkloadRecord(new WorkloadId("infra", "DaemonSet", "log-shipper"),
            new Replicas(1, 1, "one per node"), true,
            Resources.of("cpu", 100L, "memory", 128 * MI), Placement.NONE));
    ClusterModel m = p.model();
    return new ClusterModel(m.server(), m.namespace(), m.nodes(), m.pods(), m.budgets(), ws,
        List.of(), List.of());
  }

  private static ResizeRequest declaredRequest(ReplicaMode mode) {
    return new ResizeRequest("pool", "general", OptionalInt.empty(), Optional.empty(),
        Optional.empty(), Optional.empty(), 0, Optional.empty(), 2, DemandSource.DECLARED, mode);
  }

  @Test
  void review_declaredReplicas_fitsThreeLedgerAndSevenStorefrontNodes() {
    Review r = new Reviewer().review(declared(), declaredRequest(ReplicaMode.DECLARED));
    assertTrue(r.fits(), r.pending().toString());
    assertEquals(17, r.podsConsidered());
  }

  @Test
  void review_declaredPeak_sixStorefrontPodsPendingWithIndexedIds() {
    Review r = new Reviewer().review(declared(), declaredRequest(ReplicaMode.PEAK));
    assertFalse(r.fits());
    // 3 ledger nodes leave 7 × 2 = 14 storefront slots for 20 pods: 6 pending. Placed in size
    // order, then by id (…#19, #2, #3, #4 … #9), the last six are #4 to #9.
    assertEquals(List.of("shop/Deployment/storefront#4", "shop/Deployment/storefront#5",
        "shop/Deployment/storefront#6", "shop/Deployment/storefront#7",
        "shop/Deployment/storefront#8", "shop/Deployment/storefront#9"),
        r.pending().stream().map(PendingPod::pod).toList());
    assertEquals("0/10 nodes are available: 10 Insufficient cpu.", r.pending().get(0).reason());
    assertTrue(r.drain().rounds().isEmpty(), "nothing is drained when placing declared pods");
  }
}
