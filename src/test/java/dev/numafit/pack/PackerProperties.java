package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/** Invariants of the packer on random instances (items always fit an empty bin). */
class PackerProperties {
  record Instance(long[][] items, long[] capacity, long budget) {}

  @Provide
  Arbitrary<Instance> instances() {
    Arbitrary<long[]> capacities =
        Arbitraries.integers()
            .between(1, 4)
            .flatMap(
                d ->
                    Arbitraries.longs()
                        .between(1, 1000)
                        .array(long[].class)
                        .ofSize(d));
    return capacities.flatMap(
        cap -> {
          Arbitrary<long[]> item =
              Combinators.combine(
                      Arbitraries.doubles().between(0, 1).array(double[].class).ofSize(cap.length),
                      Arbitraries.of(2, 3, 5, 10, 1000))
                  .as(
                      (fractions, scale) -> {
                        long[] v = new long[cap.length];
                        for (int k = 0; k < cap.length; k++) {
                          // Bias towards small items sometimes, so bins hold many.
                          v[k] = (long) Math.floor(cap[k] * fractions[k] / (scale == 1000 ? 1 : scale));
                          v[k] = Math.min(v[k], cap[k]);
                        }
                        return v;
                      });
          return Combinators.combine(
                  item.array(long[][].class).ofMaxSize(80),
                  Arbitraries.of(0L, 50L, 5_000L, VectorPacker.DEFAULT_STEP_BUDGET))
              .as((items, budget) -> new Instance(items, cap, budget));
        });
  }

  @Property(tries = 300)
  void pack_noBinOverCapacity_inAnyDimension(@ForAll("instances") Instance in) {
    Packing p = new VectorPacker(in.budget()).pack(in.items(), in.capacity());
    for (long[] load : p.loads(in.items())) {
      for (int k = 0; k < in.capacity().length; k++) {
        assertTrue(load[k] <= in.capacity()[k], "bin over capacity in dimension " + k);
      }
    }
  }

  @Property(tries = 300)
  void pack_everyItemPlaced_everyBinUsed(@ForAll("instances") Instance in) {
    Packing p = new VectorPacker(in.budget()).pack(in.items(), in.capacity());
    assertEquals(in.items().length, p.items());
    boolean[] used = new boolean[p.bins()];
    for (int i = 0; i < p.items(); i++) {
      used[p.binOf(i)] = true;
    }
    for (boolean u : used) {
      assertTrue(u, "empty bin counted");
    }
  }

  @Property(tries = 300)
  void pack_binsAtLeastLowerBound(@ForAll("instances") Instance in) {
    Packing p = new VectorPacker(in.budget()).pack(in.items(), in.capacity());
    assertTrue(p.bins() >= LowerBound.of(in.items(), in.capacity()));
  }

  @Property(tries = 200)
  void pack_sameInputTwice_samePacking(@ForAll("instances") Instance in) {
    assertEquals(
        new VectorPacker(in.budget()).pack(in.items(), in.capacity()),
        new VectorPacker(in.budget()).pack(in.items(), in.capacity()));
  }

  @Property(tries = 200)
  void pack_largerBudget_neverWorse(@ForAll("instances") Instance in) {
    // Every pass only replaces the best packing with a strictly better one, so more budget can
    // only help.
    int small = new VectorPacker(0).pack(in.items(), in.capacity()).bins();
    int large = new VectorPacker(in.budget()).pack(in.items(), in.capacity()).bins();
    assertTrue(large <= small);
  }
}
