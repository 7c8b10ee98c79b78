package dev.numafit.pack;

import java.util.Arrays;
import java.util.Objects;

/**
 * Finds the smallest number of equal bins (workers) that vector items (pods) fit into, and proves
 * it, for inputs small enough to search exhaustively.
 *
 * <p>It starts from a heuristic packing ({@link VectorPacker}: an upper bound) and the {@link
 * LowerBound}, and stops at once when they meet. Otherwise it looks for a packing into one bin
 * fewer than the best known, then one fewer again, by depth-first branch-and-bound: items in
 * decreasing size order (largest normalised demand first), each placed into an open bin or into
 * one new bin. A search for {@code k} bins that ends without a packing proves that {@code k} bins
 * are too few, so the best packing found is optimal.
 *
 * <p>What keeps the search small:
 *
 * <ul>
 *   <li>Identical items (replicas of one workload) go into bins of non-decreasing index, so their
 *       permutations are tried once.
 *   <li>At most one empty bin is tried per item, and of open bins with the same room left only
 *       the first: the others lead to the same subproblem.
 *   <li>Open bins are tried fullest-after-the-placement first (best fit), so a packing, when
 *       there is one, tends to be found early.
 *   <li>The most items one bin can hold (found by a small search before the main one): no
 *       packing uses fewer than {@code ceil(items / that)} bins, and at every node the items
 *       still to place, less the places left in open bins, need new bins by the same count.
 *   <li>At every node, per dimension: the demand still to place, less the room left in open bins
 *       that can still take some remaining item, divided by a bin's room and rounded up, plus the
 *       bins already open, must not exceed {@code k}.
 * </ul>
 *
 * <p>Deterministic and single-threaded: effort is a limit on search nodes (one node per item
 * placement tried), never time. When the limit runs out, the result is the best packing found
 * with {@link Result#provedOptimal()} false. Items are {@code long[n][d]} demands (millicores,
 * bytes or counts), the capacity {@code long[d]}, as for {@link VectorPacker}.
 */
public final class ExactPacker {
  /**
   * Default node limit: with it the search proves 201 of the 220 published and generated vector
   * instances of at most 60 items in ../shared/bench (docs/performance.md, "Exact mode").
   */
  public static final long DEFAULT_NODE_LIMIT = 2_000_000L;

  /** Nodes between two progress reports (a power of two, so the test is a mask). */
  public static final long PROGRESS_EVERY = 1L << 16;

  private final long nodeLimit;

  /** A packer with {@link #DEFAULT_NODE_LIMIT}. */
  public ExactPacker() {
    this(DEFAULT_NODE_LIMIT);
  }

  /**
   * @param nodeLimit the most search nodes to spend, {@code >= 0}; 0 only compares the heuristic
   *     packing with the lower bound
   */
  public ExactPacker(long nodeLimit) {
    if (nodeLimit < 0) {
      throw new IllegalArgumentException("node limit must be >= 0, was " + nodeLimit);
    }
    this.nodeLimit = nodeLimit;
  }

  /** The node limit this packer was built with. */
  public long nodeLimit() {
    return nodeLimit;
  }

  /**
   * The outcome of an exact search.
   *
   * @param packing the best packing found; its {@link Packing#lowerBound()} is {@code
   *     lowerBound}
   * @param provedOptimal whether no packing uses fewer bins than {@code packing}
   * @param nodes search nodes spent (item placements tried)
   * @param lowerBound no packing uses fewer bins: equal to the packing's bins when proved
   *     optimal, else the larger of the {@link LowerBound} of the items and the bound from the
   *     most items one bin can hold
   */
  public record Result(Packing packing, boolean provedOptimal, long nodes, int lowerBound) {
    public Result {
      Objects.requireNonNull(packing, "packing");
      if (nodes < 0) {
        throw new IllegalArgumentException("nodes must be >= 0, was " + nodes);
      }
      if (lowerBound < 0 || lowerBound > packing.bins()) {
        throw new IllegalArgumentException(
            "lower bound " + lowerBound + " outside 0.." + packing.bins());
      }
      if (provedOptimal && lowerBound != packing.bins()) {
        throw new IllegalArgumentException(
            "a proved packing has its bin count as lower bound: " + lowerBound + " vs "
                + packing.bins());
      }
    }
  }

  /**
   * Packs the items, starting from the default {@link VectorPacker}'s packing.
   *
   * @throws IllegalArgumentException as {@link VectorPacker#pack} does
   */
  public Result pack(long[][] items, long[] capacity) {
    return improve(items, capacity, new VectorPacker().pack(items, capacity));
  }

  /**
   * Searches for a packing with fewer bins than {@code start} and for a proof that none exists.
   *
   * @param start a valid packing of the same items (the heuristic's), the first upper bound
   * @throws IllegalArgumentException as {@link VectorPacker#pack} does, or when {@code start} packs
   *     a different number of items or overfills a bin
   */
  public Result improve(long[][] items, long[] capacity, Packing start) {
    return improve(items, capacity, start, Progress.NONE);
  }

  /**
   * {@link #improve(long[][], long[], Packing)} telling {@code progress} the nodes searched, every
   * {@link #PROGRESS_EVERY} nodes, against the node limit; the result does not depend on it.
   */
  public Result improve(long[][] items, long[] capacity, Packing start, Progress progress) {
    VectorPacker.Instance in = VectorPacker.Instance.of(items, capacity);
    if (start.items() != items.length) {
      throw new IllegalArgumentException(
          "start packs " + start.items() + " items, expected " + items.length);
    }
    for (long[] load : start.loads(items)) {
      for (int k = 0; k < capacity.length; k++) {
        if (load[k] > capacity[k]) {
          throw new IllegalArgumentException("start packing overfills a bin in dimension " + k);
        }
      }
    }
    // Any item needs a bin, so one bin is a bound even when every demand is zero.
    int lower = Math.max(LowerBound.of(items, capacity), items.length > 0 ? 1 : 0);
    if (start.bins() <= lower) {
      return result(start.bins(), start.binOfItem(), start.steps(), true, 0, start.bins());
    }
    Search s = new Search(in, nodeLimit);
    s.progress = progress;
    // No bin holds more than perBin items, so ceil(n / perBin) bins are needed.
    lower = Math.max(lower, Math.toIntExact((in.n + s.perBin - 1L) / s.perBin));
    if (start.bins() <= lower) {
      return result(start.bins(), start.binOfItem(), start.steps(), true, s.nodes, start.bins());
    }
    int[] best = start.binOfItem();
    int bestBins = start.bins();
    for (int target = bestBins - 1; target >= lower; target = bestBins - 1) {
      int[] found = s.run(target);
      if (found != null) {
        best = found;
        bestBins = binsOf(found);
        continue;
      }
      if (s.aborted) {
        return result(bestBins, best, start.steps(), false, s.nodes, lower);
      }
      // The search for `target` bins was complete and found nothing.
      return result(bestBins, best, start.steps(), true, s.nodes, bestBins);
    }
    return result(bestBins, best, start.steps(), true, s.nodes, bestBins);
  }

  private static Result result(
      int bins, int[] binOfItem, long steps, boolean proved, long nodes, int lowerBound) {
    return new Result(new Packing(bins, binOfItem, steps, lowerBound), proved, nodes, lowerBound);
  }

  private static int binsOf(int[] binOfItem) {
    int max = -1;
    for (int b : binOfItem) {
      max = Math.max(max, b);
    }
    return max + 1;
  }

  /** The branch-and-bound; one instance serves every target, sharing the node count. */
  static final class Search {
    private final VectorPacker.Instance in;
    private final int d;
    private final long limit;
    /** Types in search order: decreasing largest normalised demand, then sum, then type id. */
    private final int[] order;
    /** {@code suffixMin[p * d + k]}: smallest demand in dimension k over types order[p..]. */
    private final long[] suffixMin;

    long nodes;
    /** No bin holds more items than this ({@link #maxPerBin}). */
    final int perBin;
    private long cardinalityLimit;
    /** Items in each open bin. */
    private int[] inBin;
    boolean aborted;
    /** Told the node count every {@link #PROGRESS_EVERY} nodes. */
    Progress progress = Progress.NONE;

    // State of the current search.
    private int target;
    private long[] res;
    private int opened;
    private final long[] remaining;
    private final long[] free;
    /** Items placed on the current path: the depth, indexing the per-depth buffers below. */
    private int placedSoFar;
    private int[][] candidates;
    /** Per bin: the position from which, with at most {@link #deadRoom}, it takes nothing; -1. */
    private int[] deadAt;
    private long[] deadRoom;
    private double[][] slacks;
    /** Bin of each copy placed, per position in {@link #order}: {@code placed[p][c]}. */
    private final int[][] placed;

    Search(VectorPacker.Instance in, long limit) {
      this.in = in;
      this.d = in.d;
      this.limit = limit;
      this.order = order(in);
      this.suffixMin = new long[(in.types + 1) * d];
      Arrays.fill(suffixMin, in.types * d, (in.types + 1) * d, Long.MAX_VALUE);
      for (int p = in.types - 1; p >= 0; p--) {
        for (int k = 0; k < d; k++) {
          suffixMin[p * d + k] = Math.min(suffixMin[(p + 1) * d + k], in.w(order[p], k));
        }
      }
      this.remaining = new long[d];
      this.free = new long[d];
      this.placed = new int[in.types][];
      for (int p = 0; p < in.types; p++) {
        placed[p] = new int[in.count[order[p]]];
      }
      this.perBin = maxPerBin();
    }

    private static int[] order(VectorPacker.Instance in) {
      double[] maxKey = new double[in.types];
      double[] sumKey = new double[in.types];
      for (int t = 0; t < in.types; t++) {
        for (int k = 0; k < in.d; k++) {
          double f = (double) in.w(t, k) / in.cap[k];
          maxKey[t] = Math.max(maxKey[t], f);
          sumKey[t] += f;
        }
      }
      Integer[] idx = new Integer[in.types];
      for (int t = 0; t < in.types; t++) {
        idx[t] = t;
      }
      Arrays.sort(idx, (a, b) -> {
        int c = Double.compare(maxKey[b], maxKey[a]);
        if (c == 0) {
          c = Double.compare(sumKey[b], sumKey[a]);
        }
        return c != 0 ? c : Integer.compare(a, b);
      });
      int[] out = new int[in.types];
      for (int t = 0; t < in.types; t++) {
        out[t] = idx[t];
      }
      return out;
    }

    /**
     * The most items any one bin can hold: the largest j for which some j items fit together. It
     * tries j = 2, 3, ... by a depth-first search over the items (copies of one type taken in
     * order, so each subset is seen once) and stops at the first j with no such subset. The
     * search spends nodes from the same limit; if they run out, or j passes the per-dimension
     * count of smallest items that fit, that count is used (an upper bound, so still valid). It
     * may spend at most a tenth of the node limit.
     */
    private int maxPerBin() {
      if (in.n <= 1) {
        return Math.max(1, in.n);
      }
      // Per dimension, how many of the smallest demands fit one bin: an upper bound.
      int upper = in.n;
      for (int k = 0; k < d; k++) {
        long[] sizes = new long[in.n];
        for (int i = 0; i < in.n; i++) {
          sizes[i] = in.w(in.typeOfItem[i], k);
        }
        Arrays.sort(sizes);
        long load = 0;
        int fit = 0;
        while (fit < in.n && load + sizes[fit] <= in.cap[k]) {
          load += sizes[fit++];
        }
        upper = Math.min(upper, fit);
      }
      // Items by increasing sum of normalised demands, copies of a type adjacent.
      int[] items = new int[in.n];
      int at = 0;
      for (int p = in.types - 1; p >= 0; p--) {
        for (int c = 0; c < in.count[order[p]]; c++) {
          items[at++] = order[p];
        }
      }
      long[] sufMin = new long[(in.n + 1) * d];
      Arrays.fill(sufMin, in.n * d, (in.n + 1) * d, Long.MAX_VALUE);
      for (int i = in.n - 1; i >= 0; i--) {
        for (int k = 0; k < d; k++) {
          sufMin[i * d + k] = Math.min(sufMin[(i + 1) * d + k], in.w(items[i], k));
        }
      }
      // At most a tenth of the nodes: the rest are for the search itself.
      cardinalityLimit = nodes + limit / 10;
      int best = 1;
      for (int j = 2; j <= upper; j++) {
        int found = subsetOf(items, sufMin, j, 0, 0, new long[d]);
        if (found < 0) {
          return upper;
        }
        if (found == 0) {
          return best;
        }
        best = j;
      }
      return upper;
    }

    /** 1: some {@code left} more items from index {@code from} fit beside {@code load}; 0: none; -1: out of nodes. */
    private int subsetOf(int[] items, long[] sufMin, int left, int from, int depth, long[] load) {
      if (left == 0) {
        return 1;
      }
      for (int i = from; i <= items.length - left; i++) {
        if (i > from && items[i] == items[i - 1]) {
          continue;
        }
        if (nodes >= cardinalityLimit) {
          return -1;
        }
        nodes++;
        boolean fits = true;
        boolean hopeless = false;
        for (int k = 0; k < d; k++) {
          long w = in.w(items[i], k);
          if (load[k] + w > in.cap[k]) {
            fits = false;
          }
          // Even the smallest demands from i on, left of them, overflow: so do all later i.
          if (load[k] + (long) left * sufMin[i * d + k] > in.cap[k]) {
            hopeless = true;
          }
        }
        if (hopeless) {
          return 0;
        }
        if (!fits) {
          continue;
        }
        for (int k = 0; k < d; k++) {
          load[k] += in.w(items[i], k);
        }
        int r = subsetOf(items, sufMin, left - 1, i + 1, depth + 1, load);
        for (int k = 0; k < d; k++) {
          load[k] -= in.w(items[i], k);
        }
        if (r != 0) {
          return r;
        }
      }
      return 0;
    }

    /** A packing into at most {@code k} bins (item → bin), or null: none, or the limit ran out. */
    int[] run(int k) {
      target = k;
      res = new long[Math.max(1, k) * Math.max(1, d)];
      placedSoFar = 0;
      deadAt = new int[Math.max(1, k)];
      Arrays.fill(deadAt, -1);
      deadRoom = new long[Math.max(1, k) * Math.max(1, d)];
      inBin = new int[Math.max(1, k)];
      candidates = new int[in.n + 1][k + 1];
      slacks = new double[in.n + 1][k + 1];
      opened = 0;
      Arrays.fill(remaining, 0);
      for (int t = 0; t < in.types; t++) {
        for (int j = 0; j < d; j++) {
          remaining[j] += in.w(t, j) * in.count[t];
        }
      }
      if (in.types == 0 || !place(0, in.count[order[0]], 0)) {
        return in.types == 0 ? new int[0] : null;
      }
      int[] binOfItem = new int[in.n];
      for (int p = 0; p < in.types; p++) {
        int[] members = in.members[order[p]];
        for (int c = 0; c < members.length; c++) {
          binOfItem[members[c]] = placed[p][c];
        }
      }
      return binOfItem;
    }

    /**
     * Places the remaining copies of type {@code order[p]} ({@code left} of them, into bins from
     * {@code minBin} on), then every later type. True when everything was placed.
     */
    private boolean place(int p, int left, int minBin) {
      while (left == 0) {
        p++;
        if (p == in.types) {
          return true;
        }
        left = in.count[order[p]];
        minBin = 0;
      }
      if (nodes >= limit) {
        aborted = true;
        return false;
      }
      nodes++;
      if ((nodes & (PROGRESS_EVERY - 1)) == 0) {
        progress.update(Progress.Phase.EXACT, nodes, limit);
      }
      if (!boundHolds(p)) {
        return false;
      }
      int t = order[p];
      int wt = t * d;
      int copy = in.count[t] - left;
      // Candidate bins, fullest after the placement first (best fit): a packing, when there is
      // one, tends to be found sooner.
      int depth = placedSoFar;
      int[] cand = candidates[depth];
      double[] slack = slacks[depth];
      int nc = 0;
      for (int b = minBin; b < opened; b++) {
        if (!fits(b, wt)) {
          continue;
        }
        double sl = 0;
        for (int k = 0; k < d; k++) {
          sl += (double) (res[b * d + k] - in.w[wt + k]) / in.cap[k];
        }
        int at = nc;
        while (at > 0 && slack[at - 1] > sl) {
          at--;
        }
        // Bins with the same room have the same slack, so they sit just before `at`: of such
        // bins only the first (lowest index) is tried, the others lead to the same subproblem.
        if (sameRoomBefore(b, cand, slack, at, sl)) {
          continue;
        }
        System.arraycopy(cand, at, cand, at + 1, nc - at);
        System.arraycopy(slack, at, slack, at + 1, nc - at);
        cand[at] = b;
        slack[at] = sl;
        nc++;
      }
      placedSoFar++;
      for (int c = 0; c < nc; c++) {
        int b = cand[c];
        apply(b, wt, -1);
        placed[p][copy] = b;
        boolean ok = place(p, left - 1, b);
        apply(b, wt, +1);
        if (ok || aborted) {
          placedSoFar--;
          return ok;
        }
      }
      boolean ok = false;
      if (opened < target) {
        int b = opened++;
        System.arraycopy(in.cap, 0, res, b * d, d);
        apply(b, wt, -1);
        placed[p][copy] = b;
        ok = place(p, left - 1, b);
        apply(b, wt, +1);
        opened--;
      }
      placedSoFar--;
      return ok;
    }

    private boolean fits(int b, int wt) {
      for (int k = 0; k < d; k++) {
        if (res[b * d + k] < in.w[wt + k]) {
          return false;
        }
      }
      return true;
    }

    /** Whether a candidate just before {@code at} with slack {@code sl} has b's room. */
    private boolean sameRoomBefore(int b, int[] cand, double[] slack, int at, double sl) {
      for (int c = at - 1; c >= 0 && slack[c] == sl; c--) {
        int a = cand[c];
        boolean same = true;
        for (int k = 0; k < d; k++) {
          if (res[a * d + k] != res[b * d + k]) {
            same = false;
            break;
          }
        }
        if (same) {
          return true;
        }
      }
      return false;
    }

    private void apply(int b, int wt, int sign) {
      inBin[b] -= sign;
      for (int k = 0; k < d; k++) {
        long w = in.w[wt + k];
        res[b * d + k] += sign * w;
        remaining[k] += sign * w;
      }
    }

    /**
     * Per dimension: bins open plus the bins the demand still to place needs beyond the room of
     * open bins that can take some remaining item, at most the target. A bin with less room in
     * some dimension than every remaining item needs there takes nothing more: its room is lost.
     */
    /**
     * Whether the bin with room at {@code res[rb..]} can take some item of the types from position
     * {@code p} on (their copies not yet placed). Smallest types are tried first, so a bin with
     * room usually answers at once.
     */
    private boolean takesSome(int b, int p) {
      int rb = b * d;
      int base = p * d;
      for (int j = 0; j < d; j++) {
        if (res[rb + j] < suffixMin[base + j]) {
          return false;
        }
      }
      // A bin found unable to take anything stays so with less room and fewer types left:
      // remember the room and position where that was seen, to skip the scan below.
      if (deadAt[b] >= 0 && p >= deadAt[b]) {
        boolean within = true;
        for (int j = 0; j < d; j++) {
          if (res[rb + j] > deadRoom[rb + j]) {
            within = false;
            break;
          }
        }
        if (within) {
          return false;
        }
      }
      for (int q = in.types - 1; q >= p; q--) {
        int wq = order[q] * d;
        boolean fits = true;
        for (int j = 0; j < d; j++) {
          if (res[rb + j] < in.w[wq + j]) {
            fits = false;
            break;
          }
        }
        if (fits) {
          return true;
        }
      }
      deadAt[b] = p;
      System.arraycopy(res, rb, deadRoom, rb, d);
      return false;
    }

    private boolean boundHolds(int p) {
      long[] free = this.free;
      Arrays.fill(free, 0);
      long freeSlots = 0;
      for (int b = 0; b < opened; b++) {
        int rb = b * d;
        if (takesSome(b, p)) {
          for (int k = 0; k < d; k++) {
            free[k] += res[rb + k];
          }
          freeSlots += Math.max(0, perBin - inBin[b]);
        }
      }
      long slotsNeeded = (long) in.n - placedSoFar - freeSlots;
      if (slotsNeeded > 0 && opened + (slotsNeeded - 1) / perBin + 1 > target) {
        return false;
      }
      for (int k = 0; k < d; k++) {
        long need = remaining[k] - free[k];
        if (need > 0 && opened + (need - 1) / in.cap[k] + 1 > target) {
          return false;
        }
      }
      return true;
    }
  }
}
