package dev.numafit.check;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.SourceRef;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

class GateTest {
  private static final WorkloadId A = new WorkloadId("shop", "Deployment", "a");
  private static final WorkloadId B = new WorkloadId("shop", "Deployment", "b");

  private static Finding f(WorkloadId id, Rule rule, int line) {
    return Finding.of(rule, Optional.of(id), new SourceRef("x.yaml", line), "m", Resources.EMPTY);
  }

  private static CheckReport decide(
      List<Finding> head, Optional<List<Finding>> base, CheckOptions opts) {
    return Gate.decide("w", List.of("shop/Deployment/a", "shop/Deployment/b"), head, base,
        new Capacity(5, OptionalInt.of(3)),
        base.map(b -> new Capacity(2, OptionalInt.of(2))), opts, List.of(), List.of());
  }

  @Test
  void decide_sameWorkloadAndRuleOnAnotherLine_isExistingAndPasses() {
    // Keyed by workload and rule: an edit above the workload moves its line from 10 to 14.
    CheckReport r = decide(List.of(f(A, Rule.POD_EXCEEDS_WORKER, 14)),
        Optional.of(List.of(f(A, Rule.POD_EXCEEDS_WORKER, 10))), CheckOptions.defaults());
    assertFalse(r.findings().get(0).isNew());
    assertTrue(r.passed());
  }

  @Test
  void decide_existingWithFailOnExisting_fails() {
    CheckOptions opts = new CheckOptions(BigDecimal.TEN, OptionalInt.empty(),
        CheckOptions.defaultFailOn(false), true);
    CheckReport r = decide(List.of(f(A, Rule.POD_EXCEEDS_WORKER, 14)),
        Optional.of(List.of(f(A, Rule.POD_EXCEEDS_WORKER, 10))), opts);
    assertEquals(1, r.failingCount());
  }

  @Test
  void decide_newErrorFails_newWarningDoesNot() {
    CheckReport r = decide(
        List.of(f(A, Rule.POD_EXCEEDS_WORKER, 3), f(B, Rule.MISSING_REQUEST, 4)),
        Optional.of(List.of()), CheckOptions.defaults());
    assertEquals(List.of(true, false),
        r.findings().stream().map(CheckReport.Entry::failing).toList());
    assertFalse(r.passed());
  }

  @Test
  void decide_findingGoneFromHead_listedAsResolved() {
    CheckReport r = decide(List.of(), Optional.of(List.of(f(B, Rule.POD_EXCEEDS_HOST, 9))),
        CheckOptions.defaults());
    assertEquals(1, r.resolved().size());
    assertTrue(r.passed());
  }

  @Test
  void deltaText_threeMoreWorkersOneMoreHost_readsSigned() {
    // Head 5 workers / 3 hosts against base 2 / 2 (see decide above).
    CheckReport r = decide(List.of(), Optional.of(List.of()), CheckOptions.defaults());
    assertEquals(Optional.of("+3 workers, +1 host"), r.deltaText());
  }

  @Test
  void deltaText_withoutBaseline_isEmpty() {
    assertEquals(Optional.empty(), decide(List.of(), Optional.empty(),
        CheckOptions.defaults()).deltaText());
  }

  @Test
  void defaultFailOn_capacityOnlyWithFleet() {
    assertFalse(CheckOptions.defaultFailOn(false).contains(Rule.FLEET_CAPACITY));
    assertTrue(CheckOptions.defaultFailOn(true).contains(Rule.FLEET_CAPACITY));
    assertFalse(CheckOptions.defaultFailOn(true).contains(Rule.MISSING_REQUEST));
  }
}
