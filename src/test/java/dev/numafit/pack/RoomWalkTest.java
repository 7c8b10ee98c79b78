package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The one-dimensional walk of free room ({@link RoomWalk}). */
class RoomWalkTest {
  @ParameterizedTest(name = "{0}")
  @CsvSource({
    // file, first-fit-decreasing's bins (seen here), proven optimum (BPPLib.jl data/Bounds.zip,
    // lower bound = upper bound; src/test/resources/bench/SOURCE.md)
    "Falkenauer_u120_00.txt, 49, 48",
    "Falkenauer_u120_08.txt, 51, 50",
  })
  void run_fromFirstFitDecreasing_reachesProvenOptimum(String file, int ffdBins, int optimum)
      throws Exception {
    BenchInstance b = BenchInstance.load(file);
    long[] sizes = b.sizes();
    Packing ffd = new VectorPacker(0).pack(b.items(), b.capacity());
    assertEquals(ffdBins, ffd.bins());
    RoomWalk walk = new RoomWalk(sizes, b.capacity()[0], ffd.binOfItem(), random());
    int[] out = walk.run(ffd.lowerBound(), 2_000_000);
    assertEquals(optimum, assertValid(sizes, b.capacity()[0], out));
    // The limit is checked once per iteration; an iteration costs at most a sample of bins, the
    // exchanges weighed with them and, when a bin empties, one pass over the items.
    assertTrue(walk.steps() <= 2_000_000 + 10_000, "steps " + walk.steps());
  }

  @Property(tries = 300, seed = "20261205")
  void run_randomInstances_validNeverMoreBinsAndDeterministic(@ForAll("instances") long[] in) {
    long cap = in[0];
    long[] sizes = java.util.Arrays.copyOfRange(in, 1, in.length);
    long[][] items = new long[sizes.length][];
    for (int i = 0; i < sizes.length; i++) {
      items[i] = new long[] {sizes[i]};
    }
    Packing ffd = new VectorPacker(0).pack(items, new long[] {cap});
    int[] first = new RoomWalk(sizes, cap, ffd.binOfItem(), random()).run(ffd.lowerBound(), 20_000);
    int[] again = new RoomWalk(sizes, cap, ffd.binOfItem(), random()).run(ffd.lowerBound(), 20_000);
    assertArrayEquals(first, again);
    int bins = assertValid(sizes, cap, first);
    assertTrue(bins <= ffd.bins(), "more bins than the start: " + bins + " > " + ffd.bins());
    assertTrue(bins >= ffd.lowerBound(), "below the lower bound");
  }

  @Provide
  Arbitrary<long[]> instances() {
    return Arbitraries.integers().between(10, 200).flatMap(cap ->
        Arbitraries.longs().between(1, cap).array(long[].class).ofMinSize(1).ofMaxSize(40)
            .map(sizes -> {
              long[] out = new long[sizes.length + 1];
              out[0] = cap;
              System.arraycopy(sizes, 0, out, 1, sizes.length);
              return out;
            }));
  }

  /** Every item in a bin numbered without gaps, no bin empty or over capacity; the bin count. */
  private static int assertValid(long[] sizes, long cap, int[] binOf) {
    int bins = 0;
    for (int b : binOf) {
      assertTrue(b >= 0, "an item in no bin");
      bins = Math.max(bins, b + 1);
    }
    long[] load = new long[bins];
    int[] count = new int[bins];
    for (int i = 0; i < sizes.length; i++) {
      load[binOf[i]] += sizes[i];
      count[binOf[i]]++;
    }
    for (int b = 0; b < bins; b++) {
      assertTrue(count[b] > 0, "bin " + b + " is empty");
      assertTrue(load[b] <= cap, "bin " + b + " over capacity: " + load[b]);
    }
    return bins;
  }

  private static SplittableRandom random() {
    return new SplittableRandom(VectorPacker.WALK_SEED);
  }
}
