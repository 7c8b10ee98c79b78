package dev.numafit.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.Workload;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.TreeMap;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

/** Invariants of whole plans on random workloads (with placement, so every pod can be traced). */
class PlannerProperties {
  static final long MI = 1L << 20;

  @Provide
  Arbitrary<List<Workload>> workloads() {
    Arbitrary<Workload> w =
        Combinators.combine(
                Arbitraries.integers().between(0, 40),
                Arbitraries.longs().between(0, 6000),
                Arbitraries.longs().between(0, 20_000),
                Arbitraries.of(false, false, false, true))
            .as(
                (replicas, cpu, memMi, daemon) ->
                    PlannerTest.workload(
                        daemon ? "DaemonSet" : "Deployment",
                        "w" + cpu + "-" + memMi + "-" + replicas,
                        replicas,
                        Resources.of("cpu", cpu, "memory", memMi * MI),
                        0,
                        daemon));
    return w.list().ofMaxSize(12).uniqueElements(x -> x.id());
  }

  private static PlanInput input(int pct) {
    return new PlanInput(
        Optional.empty(),
        PlannerTest.WORKER,
        PlannerTest.ALLOCATABLE.with("pods", 30L),
        OptionalInt.of(2),
        List.of(),
        Resources.EMPTY,
        0,
        pct,
        BigDecimal.ONE,
        true,
        List.of(),
        List.of());
  }

  @Property(tries = 200)
  void plan_everyReplicaPlacedOrReportedOversize(
      @ForAll("workloads") List<Workload> ws, @ForAll @IntRange(min = 50, max = 100) int pct) {
    Plan p = new Planner().plan(new Demand(ws, List.of(), new TreeMap<>(), List.of()), input(pct));
    Set<String> oversize = new HashSet<>();
    p.oversize().forEach(o -> oversize.add(o.workload().toString()));
    Map<String, Integer> placed = new HashMap<>();
    for (WorkerPlacement wp : p.placement().orElseThrow()) {
      for (String pod : wp.pods()) {
        placed.merge(pod.substring(0, pod.indexOf('#')), 1, Integer::sum);
      }
    }
    for (Workload w : ws) {
      String id = w.id().toString();
      if (w.perWorker() || w.replicas().peak() == 0) {
        assertEquals(null, placed.get(id), id + " should not be packed");
      } else if (oversize.contains(id)) {
        assertEquals(null, placed.get(id), id + " is oversize and packed");
      } else {
        assertEquals(w.replicas().peak(), placed.getOrDefault(id, 0), id);
      }
    }
  }

  @Property(tries = 200)
  void plan_noWorkerOverItsRoom_andWorkersAtLeastLowerBound(
      @ForAll("workloads") List<Workload> ws, @ForAll @IntRange(min = 50, max = 100) int pct) {
    Plan p = new Planner().plan(new Demand(ws, List.of(), new TreeMap<>(), List.of()), input(pct));
    Map<String, Resources> podRequests = new HashMap<>();
    ws.forEach(w -> podRequests.put(w.id().toString(), w.pod().requests().with("pods", 1L)));
    List<WorkerPlacement> placement = p.placement().orElseThrow();
    assertEquals(p.workersNeeded(), placement.size());
    for (WorkerPlacement wp : placement) {
      Resources load = Resources.EMPTY;
      for (String pod : wp.pods()) {
        load = load.plus(podRequests.get(pod.substring(0, pod.indexOf('#'))));
      }
      // Checked against the room (allocatable scaled, minus DaemonSets), and so against
      // allocatable once the per-worker demand is added back.
      assertTrue(load.fitsIn(p.room()), wp.worker() + " " + load + " > " + p.room());
      assertTrue(load.plus(p.perWorkerDemand()).fitsIn(p.allocatable())
          || !p.perWorkerDemand().fitsIn(p.allocatable()));
    }
    assertTrue(p.workersNeeded() >= p.lowerBound());
    List<String> names = new ArrayList<>();
    placement.forEach(wp -> names.add(wp.worker()));
    List<String> sorted = new ArrayList<>(names);
    sorted.sort(null);
    assertEquals(sorted, names, "worker names sort in order");
  }
}
