package dev.numafit.plan;

import static dev.numafit.plan.PlannerTest.ALLOCATABLE;
import static dev.numafit.plan.PlannerTest.demand;
import static dev.numafit.plan.PlannerTest.deployment;
import static dev.numafit.plan.PlannerTest.input;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.pack.Progress;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * What the planner tells a progress listener, and that the plan does not depend on it. The
 * figures are the arithmetic of {@link PlannerTest}'s scenarios (the scheduler's fit rule, FACTS
 * A7).
 */
class PlannerProgressTest {
  /** One call as recorded. */
  record Call(Progress.Phase phase, long done, long total) {}

  static final class Recorder implements Progress {
    final List<Call> calls = new ArrayList<>();

    @Override
    public void update(Phase phase, long done, long total) {
      calls.add(new Call(phase, done, total));
    }
  }

  @Test
  void plan_hostFailures_everyFailureSetReportedInOrderAndSamePlan() {
    // PlannerTest's failure case: 3 replicas × growth 1.5 = 5 pods of 1000m on 4000m workers
    // (4 + 1), one worker per host: 2 hosts. Losing the host of 4 pods leaves 3000m free for
    // them, so 2 hosts do not survive; with 3 hosts each of the 3 sets of one failed host is
    // survived, and the planner reports 3 hosts.
    Demand d = demand(deployment("api", 3, Resources.of("cpu", 1000L)));
    PlanInput in = input(ALLOCATABLE, OptionalInt.of(1), List.of(), Resources.EMPTY, 1, 100,
        "1.5", false);
    Recorder r = new Recorder();
    Plan with = new Planner().plan(d, in, r);
    Plan without = new Planner().plan(d, in);
    assertEquals(without, with);
    assertTrue(!r.calls.isEmpty());
    for (Call c : r.calls) {
      assertEquals(Progress.Phase.FAILURES, c.phase());
      assertTrue(c.done() >= 1 && c.done() <= c.total(), c.toString());
    }
    // The last host count tried is the one reported (3 hosts: 3 sets of one failed host, all
    // survived, so the last call is 3 of 3).
    Call last = r.calls.get(r.calls.size() - 1);
    assertEquals(new Call(Progress.Phase.FAILURES, 3, 3), last);
    assertEquals(OptionalInt.of(3), with.hostsNeeded());
    // With 2 hosts the first set (host 0, the one with 4 pods) already fails: 1 of 2, then 3.
    assertEquals(List.of(new Call(Progress.Phase.FAILURES, 1, 2),
        new Call(Progress.Phase.FAILURES, 1, 3), new Call(Progress.Phase.FAILURES, 2, 3),
        new Call(Progress.Phase.FAILURES, 3, 3)), r.calls);
  }

  @Test
  void plan_moreThanFiftyThousandPods_packingReportedAtStartAndEnd() {
    // 50,001 pods of 1000m: four per 4000m worker (equality fits), ceil(50,001 / 4) = 12,501.
    int pods = Progress.PACK_REPORT_ABOVE + 1;
    Demand d = demand(deployment("api", pods, Resources.of("cpu", 1000L)));
    Recorder r = new Recorder();
    Plan p = new Planner().plan(d, input(ALLOCATABLE), r);
    assertEquals(12_501, p.workersNeeded());
    assertEquals(List.of(new Call(Progress.Phase.PACK, 0, pods),
        new Call(Progress.Phase.PACK, pods, pods)), r.calls);
  }

  @Test
  void plan_fewPodsNoFailures_nothingReported() {
    Recorder r = new Recorder();
    new Planner().plan(demand(deployment("api", 6, Resources.of("cpu", 1000L))),
        input(ALLOCATABLE), r);
    assertEquals(List.of(), r.calls);
  }
}
