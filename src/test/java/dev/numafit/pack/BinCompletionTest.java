package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/** The one-dimensional bin-completion search ({@link BinCompletion}). */
class BinCompletionTest {
  @Test
  void search_tripletInstance_packsEveryBinExactlyFull() throws Exception {
    // Falkenauer_t60_00 (src/test/resources/bench/SOURCE.md): 60 items whose optimum is n/3 = 20
    // bins by construction, each bin three items filling its 1000 exactly. The local search
    // alone stops at 21 bins on it (PackingQualityFloorTest), so this is the search's own work.
    BenchInstance b = BenchInstance.load("Falkenauer_t60_00.txt");
    long[] sizes = b.sizes();
    BinCompletion.Result r = BinCompletion.search(sizes, 1000, 20, 2_000_000, random());
    assertNotNull(r.binOf(), "no packing into 20 bins within the limit");
    long[] load = loads(sizes, r.binOf(), 20);
    for (long l : load) {
      assertEquals(1000, l, "every bin of a 20-bin packing of this instance is exactly full");
    }
    assertTrue(r.nodes() <= 2_000_000 + BinCompletion.MAX_DEPTH, "nodes " + r.nodes());
  }

  @Test
  void search_fewerBinsThanTheSizesNeed_findsNothingWithoutSearching() {
    // 3 items of 60 in bins of 100: 180 > 1 × 100, so one bin cannot hold them.
    BinCompletion.Result r = BinCompletion.search(new long[] {60, 60, 60}, 100, 1, 1_000, random());
    assertNull(r.binOf());
    assertEquals(0, r.nodes());
  }

  @Test
  void search_onlyPackingIsPairs_findsIt() {
    // Sizes 70, 30, 60, 40 in bins of 100: the sum is 200, so two bins must both be exactly
    // full, which only the pairs {70, 30} and {60, 40} achieve (checked by hand).
    long[] sizes = {70, 60, 40, 30};
    BinCompletion.Result r = BinCompletion.search(sizes, 100, 2, 1_000, random());
    assertNotNull(r.binOf());
    assertEquals(r.binOf()[0], r.binOf()[3]);
    assertEquals(r.binOf()[1], r.binOf()[2]);
    assertTrue(r.binOf()[0] != r.binOf()[1]);
  }

  @Test
  void search_impossibleTarget_endsWithinLimitAndFindsNothing() {
    // Three items of 51 in bins of 100: any two exceed a bin, so 2 bins cannot do though the
    // sizes (153) would fit in 200.
    BinCompletion.Result r = BinCompletion.search(new long[] {51, 51, 51}, 100, 2, 1_000, random());
    assertNull(r.binOf());
    assertTrue(r.nodes() <= 1_000);
  }

  @Test
  void search_sameInput_sameAnswer() throws Exception {
    long[] sizes = BenchInstance.load("Falkenauer_u120_08.txt").sizes();
    BinCompletion.Result a = BinCompletion.search(sizes, 150, 50, 300_000, random());
    BinCompletion.Result b = BinCompletion.search(sizes, 150, 50, 300_000, random());
    assertEquals(a.nodes(), b.nodes());
    if (a.binOf() != null) {
      assertArrayEquals(a.binOf(), b.binOf());
    } else {
      assertNull(b.binOf());
    }
  }

  /**
   * Up to 7 items: a bin's completions are subsets of at most 6 other items, fewer than
   * {@link BinCompletion#MAX_COMPLETIONS}, so the search is complete and must find a packing into
   * exactly the brute-force minimum, and none into one bin fewer.
   */
  @Property(tries = 500, seed = "20261204")
  void search_tinyInstances_agreesWithBruteForce(@ForAll("tiny") long[] sizesAndCap) {
    long cap = sizesAndCap[0];
    long[] sizes = java.util.Arrays.copyOfRange(sizesAndCap, 1, sizesAndCap.length);
    int min = bruteForceMinimum(sizes, cap);
    BinCompletion.Result r = BinCompletion.search(sizes, cap, min, 1_000_000, random());
    assertNotNull(r.binOf(), "no packing into the minimum " + min);
    long[] load = loads(sizes, r.binOf(), min);
    for (long l : load) {
      assertTrue(l <= cap, "bin over capacity");
    }
    if (min > 1) {
      assertNull(BinCompletion.search(sizes, cap, min - 1, 1_000_000, random()).binOf());
    }
  }

  @Provide
  Arbitrary<long[]> tiny() {
    return Arbitraries.integers().between(5, 40).flatMap(cap ->
        Combinators.combine(
                Arbitraries.longs().between(1, cap).array(long[].class).ofMinSize(1).ofMaxSize(7),
                Arbitraries.just((long) cap))
            .as((sizes, c) -> {
              long[] out = new long[sizes.length + 1];
              out[0] = c;
              System.arraycopy(sizes, 0, out, 1, sizes.length);
              return out;
            }));
  }

  /** The fewest bins for the sizes, by trying every assignment to 1, 2, ... bins. */
  static int bruteForceMinimum(long[] sizes, long cap) {
    for (int bins = 1; bins <= sizes.length; bins++) {
      if (assign(sizes, cap, new long[bins], 0)) {
        return bins;
      }
    }
    throw new AssertionError("every item fits a bin of its own");
  }

  private static boolean assign(long[] sizes, long cap, long[] load, int i) {
    if (i == sizes.length) {
      return true;
    }
    for (int b = 0; b < load.length; b++) {
      if (load[b] + sizes[i] <= cap) {
        load[b] += sizes[i];
        boolean ok = assign(sizes, cap, load, i + 1);
        load[b] -= sizes[i];
        if (ok) {
          return true;
        }
      }
    }
    return false;
  }

  private static long[] loads(long[] sizes, int[] binOf, int bins) {
    long[] load = new long[bins];
    for (int i = 0; i < sizes.length; i++) {
      assertTrue(binOf[i] >= 0 && binOf[i] < bins, "item " + i + " in bin " + binOf[i]);
      load[binOf[i]] += sizes[i];
    }
    return load;
  }

  private static SplittableRandom random() {
    return new SplittableRandom(PoolSearch.SEED);
  }
}
