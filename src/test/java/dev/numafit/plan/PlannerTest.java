package dev.numafit.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.EffectivePod;
import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.QosClass;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.Workload;
import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.SourceRef;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * Small plans whose numbers can be checked by hand. The fit rule throughout is the scheduler's
 * (FACTS A7, kube-scheduler fitsRequest): a pod fits while requested + pod request ≤ allocatable,
 * equality fits, and each pod takes one of the node's {@code pods}.
 */
class PlannerTest {
  static final long GI = 1L << 30;

  /** An explicit 4-vCPU, 16Gi worker whose allocatable equals its capacity, maxPods 110. */
  static final WorkerShape WORKER = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 16 * GI, Resources.EMPTY);

  static final Resources ALLOCATABLE =
      Resources.of(Resources.CPU, 4000L, Resources.MEMORY, 16 * GI, Resources.PODS, 110L);

  static Workload deployment(String name, int peak, Resources requests) {
    return workload("Deployment", name, peak, requests, 0, false);
  }

  static Workload workload(
      String kind, String name, int peak, Resources requests, long exclusiveCpus, boolean perWorker) {
    return new Workload(
        new WorkloadId("shop", kind, name),
        new SourceRef("shop.yaml", 1),
        new Replicas(peak, peak, "spec.replicas"),
        new EffectivePod(requests, requests, QosClass.BURSTABLE, exclusiveCpus, List.of()),
        perWorker,
        false,
        List.of());
  }

  static Demand demand(Workload... workloads) {
    return new Demand(List.of(workloads), List.of(), new TreeMap<>(), List.of());
  }

  static PlanInput input(Resources allocatable) {
    return PlanInput.of(WORKER, allocatable);
  }

  static PlanInput input(
      Resources allocatable,
      OptionalInt workersPerHost,
      List<SpanningRoom> spanning,
      Resources perWorkerExtra,
      int hostFailures,
      int pct,
      String growth,
      boolean placement) {
    return new PlanInput(
        Optional.of("two-socket-test"),
        WORKER,
        allocatable,
        workersPerHost,
        spanning,
        perWorkerExtra,
        hostFailures,
        pct,
        new BigDecimal(growth),
        placement,
        List.of(),
        List.of());
  }

  @Test
  void plan_sixOneCpuPods_twoWorkers_utilizationAndBinding() {
    // 4000m allocatable holds exactly four 1000m pods (equality fits), so six pods need 2 workers;
    // the lower bound is ceil(6000 / 4000) = 2. Utilization over 2 workers: cpu 6000/8000 = 0.75,
    // memory 12Gi/32Gi = 0.375, pods 6/220 = 0.02727 → 0.0273. cpu binds, and when cpu is full
    // memory is at 0.375/0.75 = 50%.
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 6, Resources.of("cpu", 1000L, "memory", 2 * GI))),
                input(ALLOCATABLE));
    assertEquals(2, p.workersNeeded());
    assertEquals(2, p.lowerBound());
    assertEquals(Map.of("cpu", 0.75, "memory", 0.375, "pods", 0.0273), p.utilization());
    assertEquals("cpu", p.bindingResource());
    assertTrue(p.notes().contains("cpu runs out at 50% of memory"), p.notes().toString());
    assertEquals(OptionalInt.empty(), p.hostsNeeded());
    assertEquals(List.of(), p.oversize());
  }

  @Test
  void plan_memoryBinds_saysAtWhatShareOfCpu() {
    // 10 vCPU / 10Gi worker, pods of 610m and 1Gi: ten pods fill memory exactly (10Gi) while cpu
    // is at 6100/10000 = 61% — the "memory runs out at 61% of cpu" case. 20 pods → 2 workers.
    Resources alloc = Resources.of("cpu", 10_000L, "memory", 10 * GI, "pods", 110L);
    Plan p =
        new Planner()
            .plan(demand(deployment("cache", 20, Resources.of("cpu", 610L, "memory", GI))),
                input(alloc));
    assertEquals(2, p.workersNeeded());
    assertEquals("memory", p.bindingResource());
    assertEquals(1.0, p.utilization().get("memory"));
    assertEquals(0.61, p.utilization().get("cpu"));
    assertTrue(p.notes().contains("memory runs out at 61% of cpu"), p.notes().toString());
  }

  @Test
  void plan_daemonSetAndPerWorker_areTakenFromEveryWorker() {
    // DaemonSet 500m/1Gi plus --per-worker 500m leave 3000m of cpu, 15Gi of memory and 109 pods
    // (the DaemonSet pod counts against maxPods): three 1000m pods per worker, so six pods → 2.
    // cpu utilization = (6000 + 2 × 1000) / (2 × 4000) = 1.0.
    Workload logs =
        workload("DaemonSet", "log-shipper", 1, Resources.of("cpu", 500L, "memory", GI), 0, true);
    Plan p =
        new Planner()
            .plan(
                demand(logs, deployment("api", 6, Resources.of("cpu", 1000L, "memory", GI))),
                input(
                    ALLOCATABLE, OptionalInt.empty(), List.of(), Resources.of("cpu", 500L), 0,
                    100, "1", false));
    assertEquals(Resources.of("cpu", 1000L, "memory", GI, "pods", 1L), p.perWorkerDemand());
    assertEquals(Resources.of("cpu", 3000L, "memory", 15 * GI, "pods", 109L), p.room());
    assertEquals(2, p.workersNeeded());
    assertEquals(1.0, p.utilization().get("cpu"));
  }

  @Test
  void plan_maxUtilization_scalesAllocatableNotPods() {
    // 50% of 4000m = 2000m: two 1000m pods per worker, six pods → 3 workers. maxPods stays 110.
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 6, Resources.of("cpu", 1000L))),
                input(ALLOCATABLE, OptionalInt.empty(), List.of(), Resources.EMPTY, 0, 50, "1",
                    false));
    assertEquals(Resources.of("cpu", 2000L, "memory", 8 * GI, "pods", 110L), p.room());
    assertEquals(3, p.workersNeeded());
  }

  @Test
  void plan_growthAndHosts_roundUp() {
    // growth 1.5 × peak 3 = 4.5 → 5 pods; four 1000m pods per worker → 2 workers. One host
    // carries 1 worker → 2 hosts, plus 1 host of failure headroom = 3.
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 3, Resources.of("cpu", 1000L))),
                input(ALLOCATABLE, OptionalInt.of(1), List.of(), Resources.EMPTY, 1, 100, "1.5",
                    false));
    assertEquals(2, p.workersNeeded());
    assertEquals(OptionalInt.of(3), p.hostsNeeded());
    assertEquals(OptionalInt.of(1), p.workersPerHost());
  }

  @Test
  void plan_hostsNeeded_ceilOfWorkersPerHost() {
    // 9 pods of 1000m → 3 workers (4 + 4 + 1); 2 workers per host → ceil(3/2) = 2 hosts.
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 9, Resources.of("cpu", 1000L))),
                input(ALLOCATABLE, OptionalInt.of(2), List.of(), Resources.EMPTY, 0, 100, "1",
                    false));
    assertEquals(3, p.workersNeeded());
    assertEquals(OptionalInt.of(2), p.hostsNeeded());
  }

  @Test
  void plan_oversizePods_reportedWithSmallestSpanningShape_andNotPacked() {
    // A 5000m pod exceeds the 4000m worker by 1000m and fits the 2-node worker (8000m); a 20000m
    // pod fits neither the 2-node (8000m) nor the whole host (16000m): "none".
    List<SpanningRoom> spanning =
        List.of(
            new SpanningRoom("2-nodes", Resources.of("cpu", 8000L, "memory", 32 * GI, "pods", 110L)),
            new SpanningRoom("host", Resources.of("cpu", 16_000L, "memory", 64 * GI, "pods", 110L)));
    Plan p =
        new Planner()
            .plan(
                demand(
                    deployment("db", 2, Resources.of("cpu", 5000L)),
                    deployment("huge", 1, Resources.of("cpu", 20_000L)),
                    deployment("web", 1, Resources.of("cpu", 100L))),
                input(ALLOCATABLE, OptionalInt.empty(), spanning, Resources.EMPTY, 0, 100, "1",
                    false));
    assertEquals(
        List.of(
            new Oversize(new WorkloadId("shop", "Deployment", "db"), Resources.of("cpu", 1000L),
                "2-nodes"),
            new Oversize(new WorkloadId("shop", "Deployment", "huge"), Resources.of("cpu", 16_000L),
                "none")),
        p.oversize());
    // Only the web pod is packed.
    assertEquals(1, p.workersNeeded());
    assertEquals(0.025, p.utilization().get("cpu"));
  }

  @Test
  void plan_resourceWithoutCapacity_isUncheckedNotOversize() {
    // ephemeral-storage has no capacity here: listed as not checked, the pod still packs.
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 1,
                    Resources.of("cpu", 100L, "ephemeral-storage", 50 * GI))),
                input(ALLOCATABLE));
    assertEquals(List.of("ephemeral-storage"), p.unchecked());
    assertEquals(List.of(), p.oversize());
    assertEquals(1, p.workersNeeded());
  }

  @Test
  void plan_hugepagesWithCapacity_areChecked() {
    // hugepages-1Gi capacity 2Gi (pre-allocated pages; FACTS A5: no overcommit): a pod asking 3Gi
    // is over by 1Gi.
    Resources alloc = ALLOCATABLE.with("hugepages-1Gi", 2 * GI);
    Plan p =
        new Planner()
            .plan(demand(deployment("dpdk", 1,
                Resources.of("cpu", 1000L, "hugepages-1Gi", 3 * GI))), input(alloc));
    assertEquals(1, p.oversize().size());
    assertEquals(Resources.of("hugepages-1Gi", GI), p.oversize().get(0).exceeds());
    assertEquals(List.of(), p.unchecked());
  }

  @Test
  void plan_maxPods_limitsPodsPerWorker() {
    // FACTS check value 17: maxPods 3 and seven tiny pods → ceil(7/3) = 3 workers, and the pod
    // count binds.
    Resources alloc = Resources.of("cpu", 4000L, "memory", 16 * GI, "pods", 3L);
    Plan p = new Planner().plan(demand(deployment("tiny", 7, Resources.of("cpu", 10L))),
        input(alloc));
    assertEquals(3, p.workersNeeded());
    assertEquals(3, p.lowerBound());
    assertEquals("pods", p.bindingResource());
  }

  @Test
  void plan_placement_namesWorkersAndPods() {
    // Five 1000m pods: FFD puts four on the first worker and one on the second.
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 5, Resources.of("cpu", 1000L))),
                input(ALLOCATABLE, OptionalInt.empty(), List.of(), Resources.EMPTY, 0, 100, "1",
                    true));
    assertEquals(
        List.of(
            new WorkerPlacement(
                "worker-001",
                List.of("shop/Deployment/api#0", "shop/Deployment/api#1", "shop/Deployment/api#2",
                    "shop/Deployment/api#3")),
            new WorkerPlacement("worker-002", List.of("shop/Deployment/api#4"))),
        p.placement().orElseThrow());
  }

  @Test
  void plan_withoutPlacement_hasNone() {
    Plan p = new Planner().plan(demand(deployment("api", 5, Resources.of("cpu", 1000L))),
        input(ALLOCATABLE));
    assertEquals(Optional.empty(), p.placement());
  }

  @Test
  void plan_noPods_zeroWorkers() {
    Plan p = new Planner().plan(demand(), input(ALLOCATABLE));
    assertEquals(0, p.workersNeeded());
    assertEquals(0, p.lowerBound());
    assertEquals("none", p.bindingResource());
  }

  @Test
  void plan_daemonSetsLargerThanWorker_warns() {
    Workload big =
        workload("DaemonSet", "agent", 1, Resources.of("cpu", 5000L), 0, true);
    Plan p = new Planner().plan(demand(big, deployment("api", 1, Resources.of("cpu", 100L))),
        input(ALLOCATABLE));
    assertEquals(1, p.warnings().size());
    assertEquals(
        "warning: per-worker demand (DaemonSets and --per-worker) needs 5000 of cpu but a worker"
            + " has 4000: no other pod fits",
        p.warnings().get(0).format());
    assertEquals(1, p.oversize().size());
  }

  @Test
  void plan_exclusiveCpus_listedInNotes() {
    // FACTS check value 11: a Guaranteed pod with integer cpu 2 gets 2 exclusive CPUs.
    Workload pinned = workload("StatefulSet", "ledger", 1, Resources.of("cpu", 2000L), 2, false);
    Plan p = new Planner().plan(demand(pinned), input(ALLOCATABLE));
    assertTrue(
        p.notes().contains("shop/StatefulSet/ledger pins 2 whole CPUs per pod (static CPU manager)"),
        p.notes().toString());
  }

  @Test
  void plan_sameInputTwice_equalPlans() {
    Demand d =
        demand(
            deployment("api", 7, Resources.of("cpu", 700L, "memory", 3 * GI)),
            deployment("web", 5, Resources.of("cpu", 1300L, "memory", GI)));
    PlanInput in = input(ALLOCATABLE, OptionalInt.of(2), List.of(), Resources.EMPTY, 0, 90, "1.2",
        true);
    assertEquals(new Planner().plan(d, in), new Planner().plan(d, in));
  }

  @Test
  void plan_hostFailureWithHostAntiAffinity_reportsBothCounts() {
    // Hand-worked (see RulePackerTest.hostsToSurvive_hostAntiAffinity_handCount): two workers per
    // host; web: two 3000m pods; db: three 1000m pods with required anti-affinity on our host
    // label. 4 workers on 3 hosts without failures; surviving the loss of any one host needs 4.
    Workload web = deployment("web", 2, Resources.of("cpu", 3000L, "memory", GI));
    Workload db =
        deployment("db", 3, Resources.of("cpu", 1000L, "memory", GI))
            .withRules(PlacementRules.NONE.withAntiAffinity(PlacementRules.HOST_KEY));
    Plan p =
        new Planner()
            .plan(
                demand(web, db),
                input(ALLOCATABLE, OptionalInt.of(2), List.of(), Resources.EMPTY, 1, 100, "1",
                    false));
    assertEquals(4, p.workersNeeded());
    assertEquals(OptionalInt.of(4), p.hostsNeeded());
    assertEquals(OptionalInt.of(3), p.hostsNeededWithoutFailures());
  }

  @Test
  void plan_noFailuresAsked_noCountWithoutFailures() {
    Plan p =
        new Planner()
            .plan(
                demand(deployment("api", 6, Resources.of("cpu", 1000L, "memory", GI))),
                input(ALLOCATABLE, OptionalInt.of(2), List.of(), Resources.EMPTY, 0, 100, "1",
                    false));
    // Six 1000m pods on 4000m workers: 2 workers, one host of two workers (by hand).
    assertEquals(OptionalInt.of(1), p.hostsNeeded());
    assertEquals(OptionalInt.empty(), p.hostsNeededWithoutFailures());
  }
}
