package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ExactPackerTest {
  @ParameterizedTest
  @CsvSource({
    // Proven optima: the OPT column of results_data/Panigrahy_summary_known.csv in repository
    // Vectorpack/experiments_vector_paper ("Classification and evaluation of the algorithms for
    // vector bin packing", Computers & OR, 2025); files and licence in bench/SOURCE.md.
    "class1_20_3_0.vbp, 6",
    "class7_40_3_1.vbp, 17",
    "class3_40_3_2.vbp, 29",
    "class2_60_3_2.vbp, 48",
    "class9_40_3_0.vbp, 22",
  })
  void improve_publishedVectorInstances_provesPublishedOptimum(String file, int optimum)
      throws Exception {
    BenchInstance b = BenchInstance.load(file);
    ExactPacker.Result r = new ExactPacker().pack(b.items(), b.capacity());
    assertTrue(r.provedOptimal(), file + " not proved within the default node limit");
    assertEquals(optimum, r.packing().bins(), file);
    assertEquals(optimum, r.lowerBound(), file);
    assertTrue(BenchInstance.feasible(r.packing(), b.items(), b.capacity()), file);
  }

  @Test
  void improve_heuristicOneAboveOptimum_findsTheOptimum() throws Exception {
    BenchInstance b = BenchInstance.load("class7_40_3_1.vbp");
    // The plain first-fit-decreasing pass (step budget 0) uses 18 bins here, which is also the
    // published best heuristic value (best_heuristic column of the benchmark index); the proven
    // optimum is 17 (OPT column, bench/SOURCE.md).
    Packing start = new VectorPacker(0).pack(b.items(), b.capacity());
    assertEquals(18, start.bins());
    ExactPacker.Result r = new ExactPacker().improve(b.items(), b.capacity(), start);
    assertEquals(17, r.packing().bins());
    assertTrue(r.provedOptimal());
    assertTrue(r.nodes() > 0, "a proof below the heuristic needs a search");
  }

  @Test
  void improve_withProgress_reportsNodesInOrderAndSameResult() throws Exception {
    BenchInstance b = BenchInstance.load("Falkenauer_u120_08.txt");
    // Not proved at this limit (the search stays one bin above the optimum 50), so it spends
    // every node: several progress reports.
    Packing start = new VectorPacker(0).pack(b.items(), b.capacity());
    java.util.List<long[]> seen = new java.util.ArrayList<>();
    ExactPacker packer = new ExactPacker(300_000);
    ExactPacker.Result watched =
        packer.improve(b.items(), b.capacity(), start,
            (phase, done, total) -> seen.add(new long[] {phase.ordinal(), done, total}));
    ExactPacker.Result plain = packer.improve(b.items(), b.capacity(), start);
    // A listener only watches: the packing, the proof and the node count are the same.
    assertEquals(plain, watched);
    assertEquals(watched.nodes() / ExactPacker.PROGRESS_EVERY, seen.size(), "one report per block");
    assertFalse(seen.isEmpty(), "this search spends " + watched.nodes() + " nodes");
    for (int i = 0; i < seen.size(); i++) {
      assertEquals(Progress.Phase.EXACT.ordinal(), seen.get(i)[0]);
      assertEquals((i + 1) * ExactPacker.PROGRESS_EVERY, seen.get(i)[1]);
      assertEquals(300_000, seen.get(i)[2]);
    }
  }

  @Test
  void improve_limitTooSmall_keepsBestFoundWithoutProof() throws Exception {
    BenchInstance b = BenchInstance.load("class7_40_3_1.vbp");
    Packing start = new VectorPacker(0).pack(b.items(), b.capacity());
    ExactPacker.Result r = new ExactPacker(10).improve(b.items(), b.capacity(), start);
    assertFalse(r.provedOptimal());
    assertEquals(10, r.nodes());
    assertTrue(r.packing().bins() <= start.bins());
    // The lower bound reported is a bound, not a claim about the optimum: at least the
    // instance's LowerBound (16, lower_bound column of the benchmark index) and below the
    // optimum 17 (OPT column), since nothing was proved.
    assertEquals(16, LowerBound.of(b.items(), b.capacity()));
    assertTrue(r.lowerBound() >= 16 && r.lowerBound() < 17, "lower bound " + r.lowerBound());
  }

  @Test
  void improve_zeroLimit_provesOnlyWhenHeuristicMeetsBound() throws Exception {
    // class1_20_3_0: the heuristic reaches 6, the LowerBound is 6 (benchmark index: lower_bound
    // and known_value both 6), so no search is needed.
    BenchInstance b = BenchInstance.load("class1_20_3_0.vbp");
    ExactPacker.Result r = new ExactPacker(0).pack(b.items(), b.capacity());
    assertTrue(r.provedOptimal());
    assertEquals(0, r.nodes());
    assertEquals(6, r.packing().bins());
  }

  @Test
  void improve_published1dInstance_neverClaimsLessThanOptimum() throws Exception {
    // Falkenauer u120_08: proven optimum 50 (BPPLib.jl data/Bounds.zip, bench/SOURCE.md).
    BenchInstance b = BenchInstance.load("Falkenauer_u120_08.txt");
    ExactPacker.Result r = new ExactPacker(200_000).pack(b.items(), b.capacity());
    assertTrue(r.packing().bins() >= 50);
    assertTrue(r.lowerBound() <= 50);
    if (r.provedOptimal()) {
      assertEquals(50, r.packing().bins());
    }
    assertTrue(BenchInstance.feasible(r.packing(), b.items(), b.capacity()));
  }

  @Test
  void improve_sameInputTwice_sameResult() throws Exception {
    BenchInstance b = BenchInstance.load("class9_40_3_0.vbp");
    assertEquals(
        new ExactPacker(5_000).pack(b.items(), b.capacity()),
        new ExactPacker(5_000).pack(b.items(), b.capacity()));
  }

  @Test
  void pack_noItems_usesNoBinsProved() {
    ExactPacker.Result r = new ExactPacker().pack(new long[0][], new long[] {10});
    assertEquals(0, r.packing().bins());
    assertTrue(r.provedOptimal());
  }

  @Test
  void pack_zeroDemandItems_needOneBin() {
    // Items asking nothing still run somewhere: one bin, and no fewer.
    long[][] items = {{0, 0}, {0, 0}, {0, 0}};
    ExactPacker.Result r = new ExactPacker().pack(items, new long[] {4, 4});
    assertEquals(1, r.packing().bins());
    assertTrue(r.provedOptimal());
  }

  @Test
  void improve_startForOtherItems_isRejected() {
    long[][] items = {{3}, {3}};
    Packing wrong = new Packing(1, new int[] {0}, 0, 1);
    assertThrows(
        IllegalArgumentException.class,
        () -> new ExactPacker().improve(items, new long[] {10}, wrong));
  }

  @Test
  void improve_startOverCapacity_isRejected() {
    long[][] items = {{6}, {6}};
    Packing overfull = new Packing(1, new int[] {0, 0}, 0, 1);
    assertThrows(
        IllegalArgumentException.class,
        () -> new ExactPacker().improve(items, new long[] {10}, overfull));
  }

  @Test
  void constructor_negativeLimit_isRejected() {
    assertThrows(IllegalArgumentException.class, () -> new ExactPacker(-1));
  }
}
