package dev.numafit.pack;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * Packs vector items (pods: demand per resource) into as few equal bins (workers) as it can find.
 *
 * <p>The search follows the heuristics that do well on vector bin packing in "Heuristics for
 * vector bin packing" (2011) and the comparison in
 * "Classification and evaluation of the algorithms for vector bin packing" (Computers &amp; OR,
 * 2025): first-fit-decreasing by the largest normalised demand, then other orders (sum of
 * normalised demands, and demands weighted by how loaded each dimension is overall) and best-fit
 * variants, keeping the best; a minimum-bin-slack fill (one bin at a time, the subset of the
 * remaining items that fills it best); then a local search that removes one bin at a time
 * ({@link PoolSearch}).
 *
 * <p>Deterministic: effort is counted in steps (one step per bin or item examined) against a
 * budget given at construction, never in time, so the same input always gives the same packing.
 * The first pass always completes; later passes stop when the budget runs out and their partial
 * work is discarded. The search also stops as soon as a packing reaches the {@link LowerBound}.
 *
 * <p>Identical items (replicas of one workload) are grouped, so a first-fit pass costs about one
 * step per bin per distinct item, not per item: 150,000 pods of 5,000 workloads pack quickly.
 */
public final class VectorPacker {
  /**
   * Default step budget. On 150,000 pods this keeps packing under half a second (the greedy
   * passes spend it all there); on the published instances a few times more still gains a little
   * (docs/performance.md, "Packing quality on published instances"), which {@code --effort N}
   * buys. The budget is the same whatever the input's size: large inputs simply get fewer passes.
   */
  public static final long DEFAULT_STEP_BUDGET = 2_000_000L;

  /** Seed of the free-room walk's random stream (one above the local search's, fixed). */
  static final long WALK_SEED = PoolSearch.SEED + 1;

  /** Seed of the column dive's perturbation (the local search's plus two). */
  static final long DIVE_SEED = PoolSearch.SEED + 2;

  private final long stepBudget;

  /** A packer with {@link #DEFAULT_STEP_BUDGET}. */
  public VectorPacker() {
    this(DEFAULT_STEP_BUDGET);
  }

  /**
   * @param stepBudget the most steps the optional passes may spend (the first first-fit-decreasing
   *     pass always runs to the end)
   */
  public VectorPacker(long stepBudget) {
    if (stepBudget < 0) {
      throw new IllegalArgumentException("step budget must be >= 0, was " + stepBudget);
    }
    this.stepBudget = stepBudget;
  }

  /** The step budget this packer was built with. */
  public long stepBudget() {
    return stepBudget;
  }

  /**
   * Whether an item fits an empty bin: every demand at most the capacity in its dimension.
   * Callers report items that do not as oversize; {@link #pack} rejects them.
   */
  public static boolean fitsEmptyBin(long[] item, long[] capacity) {
    for (int k = 0; k < capacity.length; k++) {
      if (item[k] > capacity[k]) {
        return false;
      }
    }
    return true;
  }

  /**
   * Packs the items.
   *
   * @param items {@code items[i][k]}: item i's demand in dimension k, all {@code >= 0}
   * @param capacity {@code capacity[k]}: each bin's room in dimension k, {@code >= 0}
   * @throws IllegalArgumentException when an item does not fit an empty bin, a demand is negative
   *     or a row's length differs from the capacity's
   */
  public Packing pack(long[][] items, long[] capacity) {
    return pack(items, capacity, Progress.NONE);
  }

  /**
   * Packs the items, telling {@code progress} how far the dive over the linear relaxation (the
   * step that can take seconds) has come; the packing does not depend on the listener.
   */
  public Packing pack(long[][] items, long[] capacity, Progress progress) {
    Instance in = Instance.of(items, capacity);
    if (in.n == 0) {
      return new Packing(0, new int[0], 0, 0);
    }
    Search s = new Search(in, stepBudget, progress);
    return s.run(LowerBound.of(items, capacity));
  }

  /** The items grouped into types (identical vectors), restricted to the dimensions that matter. */
  static final class Instance {
    final int n;
    final int d;
    final long[] cap;
    /** Type demands, flat: {@code w[t * d + k]}. */
    final long[] w;
    final int types;
    final int[] count;
    /** Original item indices of each type, in input order. */
    final int[][] members;
    final int[] typeOfItem;
    /** Smallest demand over types per dimension: a bin with less left can take nothing more. */
    final long[] minW;

    private Instance(
        int n, int d, long[] cap, long[] w, int types, int[] count, int[][] members, int[] typeOf) {
      this.n = n;
      this.d = d;
      this.cap = cap;
      this.w = w;
      this.types = types;
      this.count = count;
      this.members = members;
      this.typeOfItem = typeOf;
      this.minW = new long[d];
      Arrays.fill(minW, Long.MAX_VALUE);
      for (int t = 0; t < types; t++) {
        for (int k = 0; k < d; k++) {
          minW[k] = Math.min(minW[k], w[t * d + k]);
        }
      }
    }

    static Instance of(long[][] items, long[] capacity) {
      int dAll = capacity.length;
      for (int k = 0; k < dAll; k++) {
        if (capacity[k] < 0) {
          throw new IllegalArgumentException("capacity " + k + " is negative: " + capacity[k]);
        }
      }
      boolean[] used = new boolean[dAll];
      for (int i = 0; i < items.length; i++) {
        long[] item = items[i];
        if (item.length != dAll) {
          throw new IllegalArgumentException(
              "item " + i + " has " + item.length + " dimensions, capacity has " + dAll);
        }
        for (int k = 0; k < dAll; k++) {
          if (item[k] < 0) {
            throw new IllegalArgumentException("item " + i + " demand " + k + " is negative");
          }
          if (item[k] > capacity[k]) {
            throw new IllegalArgumentException(
                "item " + i + " exceeds capacity in dimension " + k + ": " + item[k] + " > "
                    + capacity[k]);
          }
        }
      }
      // A dimension binds only when the items together need more than one bin's room there
      // (e.g. the pods limit on a few large pods): leave the others out of every inner loop, so
      // they neither cost time nor sway the search's sizes.
      for (int k = 0; k < dAll; k++) {
        long total = 0;
        for (long[] item : items) {
          if (item[k] > capacity[k] - total) {
            used[k] = true;
            break;
          }
          total += item[k];
        }
      }
      int d = 0;
      int[] dims = new int[dAll];
      for (int k = 0; k < dAll; k++) {
        if (used[k]) {
          dims[d++] = k;
        }
      }
      long[] cap = new long[d];
      for (int j = 0; j < d; j++) {
        cap[j] = capacity[dims[j]];
      }
      // Group identical vectors. The map is only looked up, never iterated: type ids follow
      // first appearance, so the result does not depend on hashing.
      Map<Key, Integer> ids = new HashMap<>();
      int n = items.length;
      int[] typeOf = new int[n];
      long[] w = new long[Math.multiplyExact(n, d)];
      int[] count = new int[n];
      int types = 0;
      for (int i = 0; i < n; i++) {
        if (i > 0 && items[i] == items[i - 1]) {
          // Replicas usually share one row: no need to hash it again.
          typeOf[i] = typeOf[i - 1];
          count[typeOf[i]]++;
          continue;
        }
        long[] v = new long[d];
        for (int j = 0; j < d; j++) {
          v[j] = items[i][dims[j]];
        }
        Integer id = ids.putIfAbsent(new Key(v), types);
        if (id == null) {
          id = types++;
          System.arraycopy(v, 0, w, id * d, d);
        }
        typeOf[i] = id;
        count[id]++;
      }
      int[][] members = new int[types][];
      int[] fill = new int[types];
      for (int t = 0; t < types; t++) {
        members[t] = new int[count[t]];
      }
      for (int i = 0; i < n; i++) {
        int t = typeOf[i];
        members[t][fill[t]++] = i;
      }
      return new Instance(
          n, d, cap, Arrays.copyOf(w, types * d), types, Arrays.copyOf(count, types), members,
          typeOf);
    }

    long w(int t, int k) {
      return w[t * d + k];
    }
  }

  /** A long[] usable as a hash key. */
  private record Key(long[] v) {
    @Override
    public boolean equals(Object o) {
      return o instanceof Key k && Arrays.equals(k.v, v);
    }

    @Override
    public int hashCode() {
      return Arrays.hashCode(v);
    }
  }

  /** One run of the search: the passes and the budget they share. */
  static final class Search {
    private final Instance in;
    private final long budget;
    private final Progress progress;
    private long steps;

    Search(Instance in, long budget, Progress progress) {
      this.in = in;
      this.budget = budget;
      this.progress = progress;
    }

    private static final long MBS_SHALLOW = 1_000;
    private static final long MBS_DEEP = 200_000;
    Packing run(int lowerBound) {
      int[] best = greedy(order(maxNormKeys()), false, Long.MAX_VALUE);
      int bestBins = binsOf(best);
      long firstPassSteps = steps;
      double[][] orders = {sumNormKeys(), weightedKeys(), maxNormKeys(), weightedKeys()};
      boolean[] bestFit = {false, false, true, true};
      for (int p = 0; p < orders.length && bestBins > lowerBound && steps < budget; p++) {
        // A best-fit pass scans every bin for every distinct item and every bin it fills: skip it
        // when that alone would overrun the budget, rather than spend steps and discard them.
        if (bestFit[p] && ((long) in.types + bestBins) * bestBins > budget - steps) {
          continue;
        }
        // Another order can make the first-fit index search much longer (no single bin has room
        // in every dimension even where each dimension alone does): cap such a pass at a few
        // times what the first pass cost, so a bad order cannot eat the whole budget.
        if (!bestFit[p] && budget - steps < firstPassSteps) {
          continue;
        }
        long cap = bestFit[p] ? budget : Math.min(budget, steps + 4 * firstPassSteps);
        int[] candidate = greedy(order(orders[p]), bestFit[p], cap);
        if (candidate != null && binsOf(candidate) < bestBins) {
          best = candidate;
          bestBins = binsOf(candidate);
        }
      }
      // Bin-by-bin subset search, shallow then deep: a deeper search per bin is not always
      // better overall (it can use up the items that would complete later bins), so keep both.
      double[] keys = sumNormKeys();
      int[] mbsOrderByKey = order(keys);
      for (long perBin : new long[] {MBS_SHALLOW, MBS_DEEP}) {
        if (bestBins <= lowerBound || steps >= budget) {
          break;
        }
        int[] candidate = minimumBinSlack(mbsOrderByKey, keys, bestBins, perBin);
        if (candidate != null && binsOf(candidate) < bestBins) {
          best = candidate;
          bestBins = binsOf(candidate);
        }
      }
      if (bestBins > lowerBound && steps < budget) {
        long[] w = itemDemands();
        PoolSearch pool = new PoolSearch(in.n, in.d, in.cap, w, best, budget - steps);
        best = pool.run(lowerBound);
        steps += pool.steps();
      }
      bestBins = binsOf(best);
      if (in.d >= 2 && bestBins > lowerBound && budget > 0 && in.types <= ColumnDive.MAX_TYPES
          && in.n <= ColumnDive.MAX_ITEMS) {
        // Several dimensions: a dive over the set-cover relaxation, then the local search again
        // from what it found.
        ColumnDive.Result r = ColumnDive.dive(in.d, in.cap, in.w, in.count, in.members,
            in.typeOfItem, best, saturatedTimes(budget, ColumnDive.STEPS_PER_BUDGET_STEP),
            DIVE_SEED, progress);
        steps += r.steps();
        if (r.binOf() != null) {
          best = r.binOf();
          bestBins = binsOf(best);
          if (bestBins > lowerBound) {
            long[] w = itemDemands();
            PoolSearch again = new PoolSearch(in.n, in.d, in.cap, w, best, budget);
            best = again.run(lowerBound);
            steps += again.steps();
            bestBins = binsOf(best);
          }
        }
      }
      if (in.d == 1 && bestBins > lowerBound) {
        long[] sizes = new long[in.n];
        for (int i = 0; i < in.n; i++) {
          sizes[i] = in.w[in.typeOfItem[i]];
        }
        // One dimension: a walk of the free room, then bin completion, each with an allowance as
        // large as the step budget.
        RoomWalk walk = new RoomWalk(sizes, in.cap[0], best, new SplittableRandom(WALK_SEED));
        best = walk.run(lowerBound, budget);
        steps += walk.steps();
        bestBins = binsOf(best);
        long nodesLeft = budget;
        SplittableRandom random = new SplittableRandom(PoolSearch.SEED);
        while (bestBins > lowerBound && nodesLeft > 0) {
          BinCompletion.Result r =
              BinCompletion.search(sizes, in.cap[0], bestBins - 1, nodesLeft, random);
          steps += r.nodes();
          nodesLeft -= r.nodes();
          if (r.binOf() == null) {
            break;
          }
          best = r.binOf();
          bestBins = binsOf(best);
        }
      }
      return new Packing(binsOf(best), best, steps, lowerBound);
    }

    /** Demands per item, flat {@code w[i * d + k]}. */
    private long[] itemDemands() {
      long[] w = new long[Math.multiplyExact(in.n, in.d)];
      for (int i = 0; i < in.n; i++) {
        System.arraycopy(in.w, in.typeOfItem[i] * in.d, w, i * in.d, in.d);
      }
      return w;
    }

    private static long saturatedTimes(long a, long b) {
      return Math.multiplyHigh(a, b) != 0 || a * b < 0 ? Long.MAX_VALUE : a * b;
    }

    private static int binsOf(int[] binOfItem) {
      int max = -1;
      for (int b : binOfItem) {
        max = Math.max(max, b);
      }
      return max + 1;
    }

    // --- orderings -------------------------------------------------------------------------

    private double[] maxNormKeys() {
      double[] key = new double[in.types];
      for (int t = 0; t < in.types; t++) {
        double m = 0;
        for (int k = 0; k < in.d; k++) {
          m = Math.max(m, (double) in.w(t, k) / in.cap[k]);
        }
        key[t] = m;
      }
      return key;
    }

    private double[] sumNormKeys() {
      double[] key = new double[in.types];
      for (int t = 0; t < in.types; t++) {
        double s = 0;
        for (int k = 0; k < in.d; k++) {
          s += (double) in.w(t, k) / in.cap[k];
        }
        key[t] = s;
      }
      return key;
    }

    /** Demands weighted by each dimension's total normalised demand: scarce dimensions count more. */
    private double[] weightedKeys() {
      double[] total = new double[in.d];
      for (int t = 0; t < in.types; t++) {
        for (int k = 0; k < in.d; k++) {
          total[k] += (double) in.w(t, k) * in.count[t] / in.cap[k];
        }
      }
      double[] key = new double[in.types];
      for (int t = 0; t < in.types; t++) {
        double s = 0;
        for (int k = 0; k < in.d; k++) {
          s += total[k] * in.w(t, k) / in.cap[k];
        }
        key[t] = s;
      }
      return key;
    }

    /** Types by decreasing key; equal keys keep first-appearance order. */
    private int[] order(double[] key) {
      Integer[] idx = new Integer[in.types];
      for (int t = 0; t < in.types; t++) {
        idx[t] = t;
      }
      Arrays.sort(idx, (a, b) -> {
        int c = Double.compare(key[b], key[a]);
        return c != 0 ? c : Integer.compare(a, b);
      });
      int[] out = new int[in.types];
      for (int t = 0; t < in.types; t++) {
        out[t] = idx[t];
      }
      return out;
    }

    // --- greedy passes ---------------------------------------------------------------------

    /**
     * First fit (or best fit) of the types in the given order; copies of one type are placed as
     * many at a time as fit, which gives exactly the item-by-item first-fit result. Returns null
     * when the step budget runs out first.
     */
    private int[] greedy(int[] order, boolean bestFit, long limit) {
      int d = in.d;
      Bins bins = new Bins(d, in.cap, in.n);
      int[] placeType = new int[16];
      int[] placeBin = new int[16];
      int[] placeCount = new int[16];
      int placements = 0;
      for (int t : order) {
        int left = in.count[t];
        int from = 0;
        while (left > 0) {
          int chosen = -1;
          long chosenFit = 0;
          double chosenSlack = Double.MAX_VALUE;
          if (!bestFit) {
            chosen = bins.firstFit(in.w, t, from);
            if (chosen >= 0) {
              chosenFit = bins.fitCount(chosen, in.w, t);
            }
          } else {
            for (int b = bins.nextOpen(0); b < bins.size; b = bins.nextOpen(b + 1)) {
              steps++;
              long fit = bins.fitCount(b, in.w, t);
              if (fit == 0) {
                continue;
              }
              double slack = bins.slackAfter(b, in.w, t, Math.min(fit, left));
              if (slack < chosenSlack) {
                chosen = b;
                chosenFit = fit;
                chosenSlack = slack;
              }
            }
          }
          if (steps > limit) {
            return null;
          }
          if (chosen < 0) {
            chosen = bins.open();
            chosenFit = bins.fitCount(chosen, in.w, t);
          }
          int placed = (int) Math.min(chosenFit, left);
          bins.add(chosen, in.w, t, placed, in.minW);
          left -= placed;
          if (!bestFit) {
            // Earlier bins could not take this type; they will not take more copies either.
            from = chosen + 1;
          }
          if (placements == placeType.length) {
            placeType = Arrays.copyOf(placeType, placements * 2);
            placeBin = Arrays.copyOf(placeBin, placements * 2);
            placeCount = Arrays.copyOf(placeCount, placements * 2);
          }
          placeType[placements] = t;
          placeBin[placements] = chosen;
          placeCount[placements] = placed;
          placements++;
        }
      }
      int[] binOfItem = new int[in.n];
      int[] next = new int[in.types];
      for (int p = 0; p < placements; p++) {
        int t = placeType[p];
        for (int c = 0; c < placeCount[p]; c++) {
          binOfItem[in.members[t][next[t]++]] = placeBin[p];
        }
      }
      return binOfItem;
    }

    // --- minimum bin slack ------------------------------------------------------------------

    private int[] mbsRemaining;
    private int[] mbsOrder;
    private double[] mbsKey;
    private int[] mbsAlive;
    private long[] mbsRes;
    private int[] mbsStack;
    private int mbsDepth;
    private int[] mbsBest;
    private int mbsBestDepth;
    private double mbsBestSlack;
    private long mbsLocalSteps;
    private long mbsLimit;

    /**
     * Fills one bin at a time with the subset of the remaining items that leaves the least
     * normalised slack, the largest remaining item always included: the minimum-bin-slack
     * heuristic of "A new heuristic algorithm for the one-dimensional bin-packing problem" (1999)
     * and its variant in "New heuristics for one-dimensional bin-packing" (2002). The subset
     * search per bin is cut off after a share of the remaining step budget, so it degrades to a
     * greedy fill on large inputs. Returns null when the budget runs out.
     */
    private int[] minimumBinSlack(int[] order, double[] typeKeys, int binsToBeat, long perBin) {
      int d = in.d;
      mbsOrder = order;
      mbsKey = new double[order.length];
      for (int j = 0; j < order.length; j++) {
        mbsKey[j] = typeKeys[order[j]];
      }
      mbsAlive = new int[order.length + 1];
      for (int j = 0; j <= order.length; j++) {
        mbsAlive[j] = j;
      }
      mbsRemaining = in.count.clone();
      mbsRes = new long[d];
      mbsStack = new int[16];
      mbsBest = new int[16];
      int[] binOfItem = new int[in.n];
      int[] nextMember = new int[in.types];
      int left = in.n;
      int bin = 0;
      int first = 0;
      while (left > 0) {
        if (steps >= budget) {
          return null;
        }
        while (mbsRemaining[order[first]] == 0) {
          first++;
        }
        if (bin >= binsToBeat - 1) {
          // Cannot end with fewer bins than the packing it is meant to beat.
          return null;
        }
        // Half the remaining budget spread over the bins still to fill: the budget cannot run
        // out before the last bin that could still beat the best packing.
        long share = (budget - steps) / (2L * (binsToBeat - bin));
        mbsLimit = Math.max(64, Math.min(share, perBin));
        mbsLocalSteps = 0;
        System.arraycopy(in.cap, 0, mbsRes, 0, d);
        mbsDepth = 0;
        take(first);
        mbsBestDepth = 0;
        mbsBestSlack = Double.MAX_VALUE;
        record();
        search(first);
        for (int i = 0; i < mbsDepth; i++) {
          untakeCount(mbsStack[i]);
        }
        for (int i = 0; i < mbsBestDepth; i++) {
          int t = order[mbsBest[i]];
          if (--mbsRemaining[t] == 0) {
            mbsAlive[mbsBest[i]] = mbsBest[i] + 1;
          }
          binOfItem[in.members[t][nextMember[t]++]] = bin;
          left--;
        }
        bin++;
      }
      return binOfItem;
    }

    /** Returns true when a bin with no slack at all was found: nothing can beat it. */
    private boolean search(int from) {
      // An item fits only if its normalised sum is at most the bin's normalised slack, and the
      // order is by that sum: skip straight past the items that are too large.
      int start = Math.max(from, firstKeyAtMost(slack() + 1e-9));
      for (int j = alive(start); j < mbsOrder.length; j = alive(j + 1)) {
        int t = mbsOrder[j];
        if (mbsRemaining[t] == 0) {
          continue;
        }
        steps++;
        if (++mbsLocalSteps > mbsLimit) {
          return true;
        }
        boolean fits = true;
        for (int k = 0; k < in.d; k++) {
          if (in.w(t, k) > mbsRes[k]) {
            fits = false;
            break;
          }
        }
        if (!fits) {
          continue;
        }
        take(j);
        double slack = slack();
        if (slack < mbsBestSlack) {
          record();
        }
        boolean done = slack == 0 || search(j);
        untake();
        if (done) {
          return true;
        }
      }
      return false;
    }

    private int firstKeyAtMost(double x) {
      int lo = 0;
      int hi = mbsKey.length;
      while (lo < hi) {
        int mid = (lo + hi) >>> 1;
        if (mbsKey[mid] <= x) {
          hi = mid;
        } else {
          lo = mid + 1;
        }
      }
      return lo;
    }

    /** The first position at or after j whose type still has items (committed), path-halving. */
    private int alive(int j) {
      while (mbsAlive[j] != j) {
        mbsAlive[j] = mbsAlive[mbsAlive[j]];
        j = mbsAlive[j];
      }
      return j;
    }

    private void take(int j) {
      int t = mbsOrder[j];
      if (mbsDepth == mbsStack.length) {
        mbsStack = Arrays.copyOf(mbsStack, mbsDepth * 2);
      }
      mbsStack[mbsDepth++] = j;
      mbsRemaining[t]--;
      for (int k = 0; k < in.d; k++) {
        mbsRes[k] -= in.w(t, k);
      }
    }

    private void untake() {
      int j = mbsStack[--mbsDepth];
      untakeCount(j);
      int t = mbsOrder[j];
      for (int k = 0; k < in.d; k++) {
        mbsRes[k] += in.w(t, k);
      }
    }

    private void untakeCount(int j) {
      mbsRemaining[mbsOrder[j]]++;
    }

    private double slack() {
      double s = 0;
      for (int k = 0; k < in.d; k++) {
        s += (double) mbsRes[k] / in.cap[k];
      }
      return s;
    }

    private void record() {
      if (mbsBest.length < mbsDepth) {
        mbsBest = Arrays.copyOf(mbsBest, mbsStack.length);
      }
      System.arraycopy(mbsStack, 0, mbsBest, 0, mbsDepth);
      mbsBestDepth = mbsDepth;
      mbsBestSlack = slack();
    }

    /**
     * Residual room of open bins, flat, with two indexes: a skip list past bins that can take
     * nothing more (for best fit), and a segment tree of per-dimension maxima of the residuals
     * (for first fit: the first bin where every dimension has room is found in about log(bins)
     * steps instead of a scan, which keeps 150,000 pods fast).
     */
    private final class Bins {
      final int d;
      final long[] cap;
      final long[] res;
      /** Union-find style pointer to the next bin at or after b that may still take an item. */
      final int[] next;
      final int leaves;
      final long[] tree;
      int size;

      Bins(int d, long[] cap, int maxBins) {
        this.d = d;
        this.cap = cap;
        this.res = new long[Math.max(1, maxBins) * d];
        this.next = new int[Math.max(1, maxBins) + 1];
        this.leaves = Integer.highestOneBit(Math.max(1, maxBins - 1)) * 2;
        this.tree = new long[2 * leaves * d];
      }

      int open() {
        System.arraycopy(cap, 0, res, size * d, d);
        next[size] = size;
        update(size);
        return size++;
      }

      private void update(int b) {
        int node = leaves + b;
        System.arraycopy(res, b * d, tree, node * d, d);
        for (node >>= 1; node >= 1; node >>= 1) {
          int l = 2 * node * d;
          int r = l + d;
          for (int k = 0; k < d; k++) {
            tree[node * d + k] = Math.max(tree[l + k], tree[r + k]);
          }
        }
      }

      /** The first open bin at or after {@code from} that fits one item of type t, or -1. */
      int firstFit(long[] w, int t, int from) {
        return from >= size ? -1 : find(1, 0, leaves, from, w, t * d);
      }

      private int find(int node, int lo, int hi, int from, long[] w, int wt) {
        if (hi <= from || lo >= size) {
          return -1;
        }
        steps++;
        for (int k = 0; k < d; k++) {
          if (tree[node * d + k] < w[wt + k]) {
            return -1;
          }
        }
        if (hi - lo == 1) {
          // A leaf holds the bin's own residual: every dimension has room.
          return lo;
        }
        int mid = (lo + hi) >>> 1;
        int found = find(2 * node, lo, mid, from, w, wt);
        return found >= 0 ? found : find(2 * node + 1, mid, hi, from, w, wt);
      }

      int nextOpen(int b) {
        if (b >= size) {
          return size;
        }
        int root = b;
        while (root < size && next[root] != root) {
          root = next[root];
        }
        // Path compression keeps later look-ups short.
        while (b < size && next[b] != b) {
          int up = next[b];
          next[b] = root;
          b = up;
        }
        return root;
      }

      long fitCount(int b, long[] w, int t) {
        long m = Long.MAX_VALUE;
        int rb = b * d;
        int wt = t * d;
        for (int k = 0; k < d; k++) {
          long wk = w[wt + k];
          if (wk > 0) {
            long f = res[rb + k] / wk;
            if (f < m) {
              m = f;
              if (m == 0) {
                return 0;
              }
            }
          }
        }
        return m;
      }

      double slackAfter(int b, long[] w, int t, long copies) {
        double s = 0;
        for (int k = 0; k < d; k++) {
          s += (double) (res[b * d + k] - copies * w[t * d + k]) / cap[k];
        }
        return s;
      }

      void add(int b, long[] w, int t, int copies, long[] minW) {
        boolean closed = false;
        for (int k = 0; k < d; k++) {
          long r = res[b * d + k] - copies * w[t * d + k];
          res[b * d + k] = r;
          if (r < minW[k]) {
            closed = true;
          }
        }
        if (closed) {
          next[b] = b + 1;
        }
        update(b);
      }
    }
  }
}
