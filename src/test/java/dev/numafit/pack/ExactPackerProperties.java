package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * The exact search against the heuristic, the lower bound and a brute force over every set
 * partition, on random small instances (fixed seeds, so every run checks the same cases).
 */
class ExactPackerProperties {
  record Instance(long[][] items, long[] capacity) {}

  private static Arbitrary<Instance> instances(int maxItems) {
    return Arbitraries.integers()
        .between(1, 3)
        .flatMap(
            d ->
                Arbitraries.longs()
                    .between(1, 20)
                    .array(long[].class)
                    .ofSize(d)
                    .flatMap(
                        cap -> {
                          // Each demand anywhere in 0..capacity, duplicates likely (small range),
                          // so grouping identical items is exercised.
                          Arbitrary<long[]> item =
                              Arbitraries.integers()
                                  .between(0, 1000)
                                  .array(int[].class)
                                  .ofSize(d)
                                  .map(
                                      f -> {
                                        long[] v = new long[d];
                                        for (int k = 0; k < d; k++) {
                                          v[k] = cap[k] * f[k] / 1000;
                                        }
                                        return v;
                                      });
                          return item.array(long[][].class)
                              .ofMaxSize(maxItems)
                              .map(items -> new Instance(items, cap));
                        }));
  }

  @Provide
  Arbitrary<Instance> tiny() {
    return instances(8);
  }

  @Provide
  Arbitrary<Instance> small() {
    return instances(30);
  }

  @Property(tries = 400, seed = "20261202")
  void improve_tinyInstances_agreesWithBruteForceWhenProved(@ForAll("tiny") Instance in) {
    // Start from one bin per item, so the search itself, not the heuristic, must find the
    // optimum.
    int n = in.items().length;
    int[] own = new int[n];
    for (int i = 0; i < n; i++) {
      own[i] = i;
    }
    Packing start = new Packing(n, own, 0, Math.min(n, LowerBound.of(in.items(), in.capacity())));
    ExactPacker.Result r = new ExactPacker().improve(in.items(), in.capacity(), start);
    int optimum = bruteForce(in.items(), in.capacity());
    assertTrue(r.packing().bins() >= optimum, "fewer bins than possible: a bug");
    if (r.provedOptimal()) {
      assertEquals(optimum, r.packing().bins());
    }
    // Eight items are few enough that the default limit always finishes.
    assertTrue(r.provedOptimal(), "not proved on at most 8 items");
    assertFeasible(r.packing(), in);
  }

  @Property(tries = 200, seed = "20261203")
  void improve_smallInstances_betweenLowerBoundAndHeuristic(@ForAll("small") Instance in) {
    Packing heuristic = new VectorPacker().pack(in.items(), in.capacity());
    ExactPacker.Result r = new ExactPacker(50_000).improve(in.items(), in.capacity(), heuristic);
    int lower = LowerBound.of(in.items(), in.capacity());
    assertTrue(lower <= r.packing().bins(), "below the lower bound");
    assertTrue(r.packing().bins() <= heuristic.bins(), "worse than the heuristic it started from");
    assertTrue(lower <= r.lowerBound() && r.lowerBound() <= r.packing().bins());
    assertEquals(in.items().length, r.packing().items());
    assertFeasible(r.packing(), in);
  }

  private static void assertFeasible(Packing p, Instance in) {
    assertTrue(BenchInstance.feasible(p, in.items(), in.capacity()), "bin over capacity");
    boolean[] used = new boolean[p.bins()];
    for (int i = 0; i < p.items(); i++) {
      used[p.binOf(i)] = true;
    }
    for (boolean u : used) {
      assertTrue(u, "empty bin counted");
    }
  }

  /** The fewest bins over every set partition of the items (restricted growth strings). */
  static int bruteForce(long[][] items, long[] capacity) {
    if (items.length == 0) {
      return 0;
    }
    int[] bin = new int[items.length];
    return search(items, capacity, bin, 0, 0, items.length);
  }

  private static int search(long[][] items, long[] cap, int[] bin, int i, int used, int best) {
    if (used >= best) {
      return best;
    }
    if (i == items.length) {
      return used;
    }
    for (int b = 0; b <= used; b++) {
      bin[i] = b;
      if (fits(items, cap, bin, i, b)) {
        best = search(items, cap, bin, i + 1, Math.max(used, b + 1), best);
      }
    }
    return best;
  }

  private static boolean fits(long[][] items, long[] cap, int[] bin, int upTo, int b) {
    for (int k = 0; k < cap.length; k++) {
      long load = 0;
      for (int j = 0; j <= upTo; j++) {
        if (bin[j] == b) {
          load += items[j][k];
        }
      }
      if (load > cap[k]) {
        return false;
      }
    }
    return true;
  }
}
