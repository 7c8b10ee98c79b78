package dev.numafit.review;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.cluster.model.BudgetRecord;
import dev.numafit.cluster.model.IntOrPercent;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Budget arithmetic against "Specifying a Disruption Budget for your Application". */
class BudgetRecordTest {
  @Test
  void allowedDisruptions_zkPdbMinAvailableTwoOfThree_one() {
    // The page's zk-pdb status: currentHealthy 3, desiredHealthy 2, disruptionsAllowed 1.
    BudgetRecord b = new BudgetRecord("default", "zk-pdb", Optional.of(IntOrPercent.parse("2")),
        Optional.empty());
    assertEquals(1, b.allowedDisruptions(3, 3));
  }

  @Test
  void allowedDisruptions_fiftyPercentOfSeven_fourMustStay() {
    // "if you have 7 Pods and you set minAvailable to 50% ... 4 Pods must be available".
    BudgetRecord b = new BudgetRecord("default", "web", Optional.of(IntOrPercent.parse("50%")),
        Optional.empty());
    assertEquals(3, b.allowedDisruptions(7, 7));
  }

  @Test
  void allowedDisruptions_maxUnavailableOneOfThree_equalsMinAvailableTwo() {
    // The page: for a StatefulSet of size 3 the two zk-pdb specifications mean the same.
    BudgetRecord b = new BudgetRecord("default", "zk-pdb", Optional.empty(),
        Optional.of(IntOrPercent.parse("1")));
    assertEquals(1, b.allowedDisruptions(3, 3));
    assertEquals(0, b.allowedDisruptions(3, 2));
  }

  @Test
  void allowedDisruptions_maxUnavailableZero_none() {
    // "If you set maxUnavailable to 0% or 0 ... you are requiring zero voluntary evictions".
    BudgetRecord b = new BudgetRecord("default", "db", Optional.empty(),
        Optional.of(IntOrPercent.parse("0%")));
    assertEquals(0, b.allowedDisruptions(5, 5));
  }
}
