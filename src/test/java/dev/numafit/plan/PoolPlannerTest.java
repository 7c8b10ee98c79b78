package dev.numafit.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.LabelExpression;
import dev.numafit.demand.NodeRules;
import dev.numafit.demand.NodeTerm;
import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.Taint;
import dev.numafit.demand.Toleration;
import dev.numafit.demand.Workload;
import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Optional;
import java.util.TreeMap;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/**
 * Workloads split over pools by their node rules; each case has one valid placement, which
 * follows from the scheduler rules of "Assigning Pods to Nodes" and "Taints and Tolerations"
 * (kubernetes.io, concepts/scheduling-eviction) as named beside each check. Amounts are made up
 * and chosen so the worker counts are plain to work out by hand.
 */
class PoolPlannerTest {
  static final long GI = 1L << 30;
  static final Resources POD = Resources.of("cpu", 1000L, "memory", 2 * GI);
  static final Taint BATCH = new Taint("dedicated", "batch", Taint.Effect.NO_SCHEDULE);

  static TreeMap<String, String> labels(String... kv) {
    TreeMap<String, String> m = new TreeMap<>();
    for (int i = 0; i < kv.length; i += 2) {
      m.put(kv[i], kv[i + 1]);
    }
    return m;
  }

  static WorkerPool pool(String name, TreeMap<String, String> labels, Taint... taints) {
    return new WorkerPool(name, labels, List.of(taints), PlanInput.of(PlannerTest.WORKER,
        PlannerTest.ALLOCATABLE).withPlacementOptions(PlacementOptions.NONE));
  }

  static Workload deployment(String name, int replicas, PlacementRules rules) {
    return PlannerTest.deployment(name, replicas, POD).withRules(rules);
  }

  static Workload daemonSet(String name, Resources requests, PlacementRules rules) {
    return PlannerTest.workload("DaemonSet", name, 1, requests, 0, true).withRules(rules);
  }

  static PlacementRules selector(String... kv) {
    return new PlacementRules(new TreeSet<>(), List.of(), labels(kv), List.of());
  }

  static PlacementRules tolerating(Toleration t) {
    return PlacementRules.NONE.withNode(new NodeRules(List.of(), List.of(t)));
  }

  static PoolPlanning plan(List<WorkerPool> pools, Workload... ws) {
    return new PoolPlanner(new Planner()).plan(PlannerTest.demand(ws), pools);
  }

  @Test
  void plan_selectorMatchesSecondPoolOnly_workloadGoesThere() {
    // "Assigning Pods to Nodes", nodeSelector: disktype=ssd runs only on nodes with that label.
    // Five 1-cpu pods on 4-cpu workers: 2 workers in pool "fast", none in "general".
    PoolPlanning p =
        plan(List.of(pool("general", labels()), pool("fast", labels("disktype", "ssd"))),
            deployment("db", 5, selector("disktype", "ssd")));
    assertEquals(List.of(), p.pools().get(0).workloads());
    assertEquals(0, p.pools().get(0).plan().workersNeeded());
    assertEquals(List.of("shop/Deployment/db"), p.pools().get(1).workloads());
    assertEquals(2, p.pools().get(1).plan().workersNeeded());
    assertEquals(List.of(), p.unplaceable());
  }

  @Test
  void plan_firstPoolTainted_untoleratingWorkloadSkipsIt_toleratingOneStays() {
    // "Taints and Tolerations": a NoSchedule taint keeps pods that do not tolerate it off; a pod
    // with an Exists toleration for the key may run there. First eligible pool in file order.
    List<WorkerPool> pools = List.of(pool("batch", labels(), BATCH), pool("general", labels()));
    PoolPlanning p =
        plan(pools,
            deployment("web", 4, PlacementRules.NONE),
            deployment("crunch", 4,
                tolerating(new Toleration("dedicated", true, "", Optional.empty()))));
    assertEquals(List.of("shop/Deployment/crunch"), p.pools().get(0).workloads());
    assertEquals(List.of("shop/Deployment/web"), p.pools().get(1).workloads());
    assertEquals(1, p.pools().get(0).plan().workersNeeded());
    assertEquals(1, p.pools().get(1).plan().workersNeeded());
  }

  @Test
  void plan_noPoolSatisfies_listedUnplaceableWithTermAndTaint_notPacked() {
    // "Assigning Pods to Nodes": required affinity terms must match; "Taints and Tolerations":
    // an untolerated NoSchedule taint keeps the pod off. Neither pool takes "gpu-train".
    PlacementRules rules =
        PlacementRules.NONE.withNode(
            new NodeRules(
                List.of(new NodeTerm(List.of(new LabelExpression("accelerator",
                    LabelExpression.Operator.EXISTS, List.of())))),
                List.of()));
    List<WorkerPool> pools =
        List.of(pool("batch", labels("accelerator", "yes"), BATCH), pool("general", labels()));
    PoolPlanning p = plan(pools, deployment("gpu-train", 3, rules));
    assertEquals(1, p.unplaceable().size());
    Unplaceable u = p.unplaceable().get(0);
    assertEquals("shop/Deployment/gpu-train", u.workload());
    assertEquals(
        "pool batch: taint dedicated=batch:NoSchedule is not tolerated; pool general: required"
            + " node affinity: no term matches (term 1 accelerator exists: the pool's workers"
            + " have no label accelerator)",
        u.reason());
    assertEquals(0, p.pools().get(0).plan().workersNeeded());
    assertEquals(0, p.pools().get(1).plan().workersNeeded());
  }

  @Test
  void plan_daemonSetCostsOnlyPoolsItMatches() {
    // "Taints and Tolerations" and the DaemonSet page ("Running Pods on select Nodes"): a
    // DaemonSet runs on the nodes its selector and tolerations allow. The agent tolerates
    // nothing, so only pool "general" carries its 500m; the Exists-everything agent is on both.
    Resources agent = Resources.of("cpu", 500L, "memory", GI);
    Resources everywhere = Resources.of("cpu", 100L, "memory", GI / 4);
    List<WorkerPool> pools = List.of(pool("batch", labels(), BATCH), pool("general", labels()));
    PoolPlanning p =
        plan(pools,
            daemonSet("agent", agent, PlacementRules.NONE),
            daemonSet("metrics", everywhere, tolerating(Toleration.EVERYTHING)),
            deployment("web", 1, PlacementRules.NONE));
    assertEquals(List.of("shop/DaemonSet/metrics"), p.pools().get(0).daemonSets());
    assertEquals(
        List.of("shop/DaemonSet/agent", "shop/DaemonSet/metrics"), p.pools().get(1).daemonSets());
    // On every worker: DaemonSet requests plus one pod slot each.
    assertEquals(100L, p.pools().get(0).plan().perWorkerDemand().get("cpu"));
    assertEquals(1L, p.pools().get(0).plan().perWorkerDemand().get("pods"));
    assertEquals(600L, p.pools().get(1).plan().perWorkerDemand().get("cpu"));
    assertEquals(2L, p.pools().get(1).plan().perWorkerDemand().get("pods"));
  }

  @Test
  void plan_singleUnlabelledPool_selectorWorkloadUnplaceable_restAsBefore() {
    // Without a pools file the one pool carries no labels of its own: disktype=ssd ("Assigning
    // Pods to Nodes" nodeSelector example) matches nothing there. The other workload's plan is
    // the plan Planner makes for it alone.
    PlanInput in = PlanInput.of(PlannerTest.WORKER, PlannerTest.ALLOCATABLE);
    Workload web = deployment("web", 6, PlacementRules.NONE);
    PoolPlanning p =
        new PoolPlanner(new Planner())
            .plan(PlannerTest.demand(web, deployment("db", 2, selector("disktype", "ssd"))),
                List.of(WorkerPool.single(in)));
    assertEquals(1, p.unplaceable().size());
    assertEquals(
        "nodeSelector disktype=ssd: the pool's workers have no label disktype",
        p.unplaceable().get(0).reason());
    Plan alone = new Planner().plan(PlannerTest.demand(web), in);
    assertEquals(alone, p.pools().get(0).plan());
  }

  @Test
  void plan_daemonSetMatchingNoPool_listedAsRunningNowhere() {
    // A DaemonSet whose nodeSelector no pool has runs no pod ("DaemonSet": pods go only to
    // matching nodes); it is listed, and no pool pays for it.
    PoolPlanning p =
        plan(List.of(pool("general", labels())),
            daemonSet("nic-agent", POD, selector("nic", "fast")));
    assertTrue(p.unplaceable().get(0).daemonSet());
    assertEquals(0L, p.pools().get(0).plan().perWorkerDemand().get("cpu"));
  }
}
