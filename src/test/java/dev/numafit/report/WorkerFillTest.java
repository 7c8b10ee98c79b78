package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.plan.Plan;
import dev.numafit.resource.Resources;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Worker fill from a plan's placement, and the fill histogram's buckets. */
class WorkerFillTest {
  private static final long GI = 1L << 30;

  @Test
  void of_placement_sumsPodsOfEachWorkerPlusEveryWorkerDemand() {
    Plan plan = ReportFixtures.hostPlan(true);
    List<WorkerFill> fills = WorkerFill.of(ReportFixtures.demand(), plan);
    assertEquals(plan.placement().orElseThrow().size(), fills.size());
    long pods = 0;
    Resources packed = Resources.EMPTY;
    for (WorkerFill f : fills) {
      pods += f.packed().get(Resources.PODS);
      packed = packed.plus(f.packed());
      assertEquals(plan.perWorkerDemand(), f.everyWorker());
      assertEquals(plan.allocatable(), f.allocatable());
    }
    // Every placed pod is counted once.
    assertEquals(
        plan.placement().orElseThrow().stream().mapToLong(w -> w.pods().size()).sum(), pods);
  }

  @Test
  void of_noPlacement_empty() {
    assertEquals(List.of(), WorkerFill.of(ReportFixtures.demand(), ReportFixtures.hostPlan(false)));
  }

  @Test
  void histogram_bucketEdges_lowerEdgeIncludedAndFullInLastBucket() {
    Resources alloc = Resources.of(Resources.CPU, 10_000L, Resources.MEMORY, 10 * GI);
    List<WorkerFill> fills =
        List.of(
            fill(0, alloc), // 0% → bucket 0
            fill(2_999, alloc), // 29.99% → bucket 2
            fill(3_000, alloc), // exactly 30% → bucket 3
            fill(9_999, alloc), // 99.99% → bucket 9
            fill(10_000, alloc)); // 100% → bucket 9, the last one holds exactly full
    assertArrayEquals(
        new int[] {1, 0, 1, 1, 0, 0, 0, 0, 0, 2}, WorkerFill.histogram(fills, Resources.CPU));
  }

  @Test
  void fraction_countsEveryWorkerDemandToo() {
    WorkerFill f =
        new WorkerFill("w", Resources.of(Resources.CPU, 6_000L), Resources.of(Resources.CPU, 500L),
            Resources.of(Resources.CPU, 13_000L));
    // (6000 + 500) / 13000 = 0.5
    assertEquals(0.5, f.fraction(Resources.CPU), 1e-12);
    assertEquals(6_500, f.used(Resources.CPU));
  }

  private static WorkerFill fill(long cpu, Resources alloc) {
    return new WorkerFill("w", Resources.of(Resources.CPU, cpu), Resources.EMPTY, alloc);
  }
}
