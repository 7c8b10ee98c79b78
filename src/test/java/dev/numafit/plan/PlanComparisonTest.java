package dev.numafit.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

class PlanComparisonTest {
  @Test
  void of_twoProfiles_rowsInOrder_costTimesHosts() {
    // 9 pods of 1000m on 4000m workers → 3 workers. Profile "a": 2 workers per host → 2 hosts,
    // relative cost 1.5 → 3.0. Profile "b" has no cost given → none.
    var demand =
        PlannerTest.demand(PlannerTest.deployment("api", 9, Resources.of("cpu", 1000L)));
    Plan a = new Planner().plan(demand, withProfile("a", 2));
    Plan b = new Planner().plan(demand, withProfile("b", 3));
    PlanComparison c = PlanComparison.of(List.of(a, b), Map.of("a", new BigDecimal("1.5")));
    assertEquals(2, c.rows().size());
    PlanComparison.Row ra = c.rows().get(0);
    assertEquals(Optional.of("a"), ra.hostProfile());
    assertEquals(4, ra.vcpus());
    assertEquals(3, ra.workersNeeded());
    assertEquals(OptionalInt.of(2), ra.hostsNeeded());
    assertEquals(Optional.of(new BigDecimal("3.0")), ra.relativeCostTotal());
    assertEquals("cpu", ra.bindingResource());
    PlanComparison.Row rb = c.rows().get(1);
    assertEquals(OptionalInt.of(1), rb.hostsNeeded());
    assertEquals(Optional.empty(), rb.relativeCost());
    assertEquals(Optional.empty(), rb.relativeCostTotal());
    assertEquals(0, rb.oversizeCount());
  }

  private static PlanInput withProfile(String name, int workersPerHost) {
    PlanInput base = PlannerTest.input(PlannerTest.ALLOCATABLE);
    return new PlanInput(
        Optional.of(name), base.worker(), base.allocatable(), OptionalInt.of(workersPerHost),
        base.spanning(), base.perWorkerExtra(), 0, 100, BigDecimal.ONE, false, List.of(),
        List.of());
  }
}
