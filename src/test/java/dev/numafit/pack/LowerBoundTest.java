package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class LowerBoundTest {
  @Test
  void continuous_roundsTotalUp_perDimension_takesTheLargest() {
    // Hand-checked: dimension 0 totals 25 of 10 → ceil(2.5) = 3; dimension 1 totals 8 of 10 → 1.
    long[][] items = {{9, 2}, {8, 2}, {8, 4}};
    assertEquals(3, LowerBound.continuous(items, new long[] {10, 10}));
  }

  @Test
  void moreThanHalf_countsStrictlyAboveHalf_only() {
    // "strictly more than half": 5 of 10 can share a bin with another 5, 6 cannot with anything
    // above half. Two items above half (6, 7) → 2.
    long[][] items = {{5}, {5}, {6}, {7}};
    assertEquals(2, LowerBound.moreThanHalf(items, new long[] {10}));
  }

  @Test
  void martelloToth_beatsBothSimpleBounds_onClassicCase() {
    // Martello–Toth L2 (Discrete Applied Mathematics 28, 1990), hand-checked: capacity 10, items
    // 6,6,6,5,5. L1 = ceil(28/10) = 3; three items above half → 3. With K = 5 the three 6s need
    // their own bins (J1) and the two 5s fit none of them (6+5 > 10), so one more bin: 4, which
    // is also the optimum (5+5 share a bin).
    long[][] items = {{6}, {6}, {6}, {5}, {5}};
    long[] cap = {10};
    assertEquals(3, LowerBound.continuous(items, cap));
    assertEquals(3, LowerBound.moreThanHalf(items, cap));
    assertEquals(4, LowerBound.martelloToth(items, cap));
    assertEquals(4, LowerBound.of(items, cap));
  }

  @Test
  void of_noItems_isZero() {
    assertEquals(0, LowerBound.of(new long[0][], new long[] {10, 10}));
  }

  @Test
  void of_zeroCapacityDimension_isSkipped() {
    // A dimension no bin has (capacity 0) cannot bound anything; items are 0 there.
    long[][] items = {{4, 0}, {4, 0}};
    assertEquals(1, LowerBound.of(items, new long[] {10, 0}));
  }

  @Test
  void of_falkenauerU120_08_equalsProvenOptimum() throws Exception {
    // Proven optimum 50 (BPPLib.jl data/Bounds.zip: lower = upper = 50; see bench/SOURCE.md).
    BenchInstance b = BenchInstance.load("Falkenauer_u120_08.txt");
    assertEquals(50, LowerBound.of(b.items(), b.capacity()));
  }

  @Test
  void of_publishedInstances_neverExceedTheProvenOptimum() throws Exception {
    // A lower bound above a proven optimum would be a bug. Optima from bench/SOURCE.md.
    assertTrue(LowerBound.of(load("Falkenauer_t60_00.txt"), cap("Falkenauer_t60_00.txt")) <= 20);
    assertTrue(LowerBound.of(load("class1_20_3_0.vbp"), cap("class1_20_3_0.vbp")) <= 6);
    assertTrue(LowerBound.of(load("class4_60_3_1.vbp"), cap("class4_60_3_1.vbp")) <= 8);
    assertTrue(LowerBound.of(load("class9_60_3_0.vbp"), cap("class9_60_3_0.vbp")) <= 36);
  }

  @Test
  void of_triplets_equalsThirdOfItemCount() throws Exception {
    // Falkenauer triplet instances fill every bin exactly with three items, so the continuous
    // bound is already n/3 = 20 (the optimum by construction).
    assertEquals(20, LowerBound.of(load("Falkenauer_t60_00.txt"), cap("Falkenauer_t60_00.txt")));
  }

  private static long[][] load(String f) throws Exception {
    return BenchInstance.load(f).items();
  }

  private static long[] cap(String f) throws Exception {
    return BenchInstance.load(f).capacity();
  }
}
