package dev.numafit.pack;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Bin elimination by local search: the improvement phase of {@link VectorPacker}.
 *
 * <p>From a feasible packing in m bins, the least-filled bin is emptied and the search tries to
 * fit its items into the other m−1 bins; when it succeeds, m−1 bins are proven enough and it goes
 * on with m−2, until the lower bound or the step budget is reached. Two phases share the budget,
 * each starting from the best packing so far:
 *
 * <ol>
 *   <li>Overflow balancing (the first {@link #BALANCE_SHARE} of the budget): the emptied bin's
 *       items go where they overflow least, then one or two items of an overflowing bin are
 *       exchanged with none, one or two items of another bin, choosing the exchange that lowers
 *       the total overflow (demand over capacity, normalised, summed over dimensions) the most and,
 *       among equals, leaves the bins within capacity fullest (sum of squared fills), so free room
 *       gathers where an overflowing item can go. A short tabu list (an item may not go back to
 *       the bin it left for {@link #TENURE} to twice that many iterations) lets the search cross
 *       plateaus without undoing itself. Strong on one dimension.
 *   <li>Pool exchanges: the emptied bin's items form a pool of unassigned items; a move exchanges
 *       one or two pool items with none, one or two items of one bin (1-0, 2-0, 1-1, 2-1, 1-2,
 *       2-2), keeps that bin within capacity in every dimension and must lower the pool's weight.
 *       Weights start at the item's size (sum over dimensions of demand / capacity); whenever no
 *       move lowers the pool's weight, the items still in the pool grow heavier, so an item that
 *       is hard to place eventually displaces lighter ones (the weighting idea of "Consistent
 *       neighborhood search for one-dimensional bin packing and two-dimensional vector packing",
 *       Computers &amp; OR, 2016, written here from the idea), with a short tabu list as above.
 *       Strong on several dimensions. On one dimension, whenever no move lowers the pool's
 *       weight, a short descent between bins (see {@link #concentrate}) first raises the sum of
 *       squared bin fills, gathering free room in few bins.
 * </ol>
 *
 * <p>Feasibility is always checked per dimension; the normalised sums only rank moves.
 * Deterministic: ties between equally good moves are broken by a {@link SplittableRandom} with the
 * fixed seed {@link #SEED}; effort is counted in steps (one step per candidate exchange or bin
 * examined), never in time, and only complete packings are ever returned.
 */
final class PoolSearch {
  /**
   * Seed of the tie-breaking random stream (the ASCII of "numafit"): fixed, so the same input
   * always gives the same packing.
   */
  static final long SEED = 0x6E756D61666974L;

  /** Pool phase: iterations an item stays barred from the bin it just left. */
  static final int TABU_TENURE = 3;

  /** Share of an item's size added to its weight each time the pool is stuck. */
  static final double WEIGHT_STEP = 0.1;

  /** Share of the budget the first phase (overflow balancing) may spend. */
  static final double BALANCE_SHARE = 0.5;

  /**
   * Iterations an item stays barred from the bin it left in the balancing phase: this plus a
   * random 0..this more, so that cycles of one fixed length cannot persist.
   */
  static final int TENURE = 5;

  private final int n;
  private final int d;
  private final long[] cap;
  /** Demands per item, flat: {@code w[i * d + k]}. */
  private final long[] w;
  private final double[] size;
  private final double[] weight;
  private final SplittableRandom random = new SplittableRandom(SEED);
  private final long budget;
  /** Where the current phase stops. */
  private long limit;
  private long steps;

  // Current partial solution: bins 0..bins-1 and the pool.
  private int bins;
  private long[] res;
  private int[][] itemsOf;
  private int[] countOf;
  private final int[] binOf;
  private final int[] posOf;
  private int[] pool;
  private int poolSize;
  private final int[] tabuBin;
  private final long[] tabuUntil;
  private long iteration;

  // Best complete packing so far.
  private int[] bestBinOf;
  private int bestBins;

  /**
   * @param n items
   * @param d dimensions
   * @param cap room per dimension, every entry {@code > 0}
   * @param w demands, flat {@code w[i * d + k]}
   * @param start a feasible packing: bin of each item, bins numbered from 0 without gaps
   * @param budget steps this search may spend
   */
  PoolSearch(int n, int d, long[] cap, long[] w, int[] start, long budget) {
    this.n = n;
    this.d = d;
    this.cap = cap;
    this.w = w;
    this.budget = budget;
    this.size = new double[n];
    this.weight = new double[n];
    for (int i = 0; i < n; i++) {
      double s = 0;
      for (int k = 0; k < d; k++) {
        s += (double) w[i * d + k] / cap[k];
      }
      size[i] = s;
      weight[i] = s;
    }
    this.binOf = start.clone();
    this.posOf = new int[n];
    this.tabuBin = new int[n];
    this.tabuUntil = new long[n];
    Arrays.fill(tabuBin, -1);
    this.bestBinOf = start.clone();
    int max = -1;
    for (int b : start) {
      max = Math.max(max, b);
    }
    this.bestBins = max + 1;
    this.pool = new int[16];
  }

  /** Steps spent so far. */
  long steps() {
    return steps;
  }

  /** The best packing found (bin of each item); never worse than the start. */
  int[] run(int lowerBound) {
    // Phase 1 balances overflow between bins (strong on one dimension); phase 2 trades with the
    // pool (strong on several). Each starts from the best packing so far.
    limit = (long) (budget * BALANCE_SHARE);
    eliminate(lowerBound, true);
    limit = budget;
    eliminate(lowerBound, false);
    return bestBinOf;
  }

  /** Removes bins one at a time until the lower bound or the phase's limit. */
  private void eliminate(int lowerBound, boolean balancing) {
    load(bestBinOf, bestBins);
    while (bestBins > Math.max(1, lowerBound) && steps < limit) {
      emptyLeastFilled();
      if (!(balancing ? balance() : solve())) {
        return;
      }
      bestBins = bins;
      bestBinOf = binOf.clone();
    }
  }

  // --- state ---------------------------------------------------------------------------------

  private void load(int[] assignment, int binCount) {
    bins = binCount;
    res = new long[binCount * d];
    itemsOf = new int[binCount][];
    countOf = new int[binCount];
    for (int b = 0; b < binCount; b++) {
      System.arraycopy(cap, 0, res, b * d, d);
      itemsOf[b] = new int[8];
    }
    poolSize = 0;
    for (int i = 0; i < n; i++) {
      binOf[i] = -1;
      putInBin(i, assignment[i]);
    }
  }

  /** Moves the items of the bin with the least total size to the pool and drops that bin. */
  private void emptyLeastFilled() {
    int target = -1;
    double least = Double.MAX_VALUE;
    for (int b = 0; b < bins; b++) {
      double fill = 0;
      for (int k = 0; k < d; k++) {
        fill += (double) (cap[k] - res[b * d + k]) / cap[k];
      }
      steps++;
      if (fill < least) {
        least = fill;
        target = b;
      }
    }
    while (countOf[target] > 0) {
      int item = itemsOf[target][countOf[target] - 1];
      takeFromBin(item);
      toPool(item);
    }
    // The last bin takes the emptied bin's number, so bins stay numbered without gaps.
    int last = bins - 1;
    if (target != last) {
      int[] moved = Arrays.copyOf(itemsOf[last], countOf[last]);
      for (int item : moved) {
        takeFromBin(item);
        putInBin(item, target);
      }
      for (int i = 0; i < n; i++) {
        if (tabuBin[i] == last) {
          tabuBin[i] = target;
        } else if (tabuBin[i] == target) {
          tabuBin[i] = -1;
        }
      }
    }
    bins--;
  }

  // --- the search ----------------------------------------------------------------------------

  private int bestBin;
  private int bestIn1;
  private int bestIn2;
  private int bestOut1;
  private int bestOut2;
  private double bestGain;
  private int ties;

  /** Tries to empty the pool into the current bins; false when the budget runs out first. */
  private boolean solve() {
    while (poolSize > 0) {
      if (steps >= limit) {
        return false;
      }
      iteration++;
      if (insertDirect()) {
        continue;
      }
      bestGain = 1e-12;
      bestBin = -1;
      ties = 0;
      for (int b = 0; b < bins && steps < limit; b++) {
        scanBin(b);
      }
      if (bestBin < 0) {
        // Stuck: what is left in the pool is hard to place, so it counts for more from now on.
        for (int j = 0; j < poolSize; j++) {
          int i = pool[j];
          weight[i] += WEIGHT_STEP * Math.max(size[i], 1e-9);
        }
        steps += poolSize;
        if (d == 1) {
          // On one dimension, gather the bins' free room so a pool item may fit as it is.
          concentrate((long) ((limit - steps) * CONCENTRATE_SHARE));
        }
        continue;
      }
      apply();
    }
    return true;
  }

  /** Places a pool item into a bin with room for it as it is (best fit by size); true if any. */
  private boolean insertDirect() {
    boolean placed = false;
    for (int j = 0; j < poolSize; ) {
      int i = pool[j];
      int chosen = -1;
      double chosenSlack = Double.MAX_VALUE;
      for (int b = 0; b < bins; b++) {
        steps++;
        if (!fits(b, i) || tabu(i, b)) {
          continue;
        }
        double slack = slackAfter(b, i);
        if (slack < chosenSlack) {
          chosen = b;
          chosenSlack = slack;
        }
      }
      if (chosen >= 0) {
        fromPool(j);
        putInBin(i, chosen);
        placed = true;
      } else {
        j++;
      }
    }
    return placed;
  }

  /** The best exchange between the pool and bin b, kept if better than what was found so far. */
  private void scanBin(int b) {
    int m = countOf[b];
    int[] items = itemsOf[b];
    int base = b * d;
    long[] room = new long[d];
    // Out-sets: one or two items of the bin (placing pool items into room already free is the
    // direct insertion above).
    for (int o1 = 0; o1 < m; o1++) {
      int y1 = items[o1];
      for (int o2 = o1; o2 < m; o2++) {
        int y2 = o2 == o1 ? -1 : items[o2];
        double outWeight = weight[y1] + (y2 < 0 ? 0 : weight[y2]);
        for (int k = 0; k < d; k++) {
          room[k] = res[base + k] + w[y1 * d + k] + (y2 < 0 ? 0 : w[y2 * d + k]);
        }
        for (int p1 = 0; p1 < poolSize; p1++) {
          int x1 = pool[p1];
          if (tabu(x1, b)) {
            continue;
          }
          for (int p2 = p1; p2 < poolSize; p2++) {
            int x2 = p2 == p1 ? -1 : pool[p2];
            if (x2 >= 0 && tabu(x2, b)) {
              continue;
            }
            steps++;
            double gain = weight[x1] + (x2 < 0 ? 0 : weight[x2]) - outWeight;
            if (gain < bestGain) {
              continue;
            }
            boolean ok = true;
            for (int k = 0; k < d; k++) {
              if (w[x1 * d + k] + (x2 < 0 ? 0 : w[x2 * d + k]) > room[k]) {
                ok = false;
                break;
              }
            }
            if (!ok) {
              continue;
            }
            if (gain > bestGain) {
              ties = 1;
            } else if (random.nextInt(++ties) != 0) {
              continue;
            }
            bestGain = gain;
            bestBin = b;
            bestIn1 = x1;
            bestIn2 = x2;
            bestOut1 = y1;
            bestOut2 = y2;
          }
        }
      }
    }
  }

  private void apply() {
    int b = bestBin;
    for (int y : new int[] {bestOut1, bestOut2}) {
      if (y >= 0) {
        takeFromBin(y);
        toPool(y);
        tabuBin[y] = b;
        tabuUntil[y] = iteration + TABU_TENURE;
      }
    }
    for (int x : new int[] {bestIn1, bestIn2}) {
      if (x >= 0) {
        fromPool(indexInPool(x));
        putInBin(x, b);
      }
    }
  }

  private boolean tabu(int item, int b) {
    return tabuBin[item] == b && tabuUntil[item] > iteration;
  }

  private boolean fits(int b, int i) {
    for (int k = 0; k < d; k++) {
      if (w[i * d + k] > res[b * d + k]) {
        return false;
      }
    }
    return true;
  }

  private double slackAfter(int b, int i) {
    double s = 0;
    for (int k = 0; k < d; k++) {
      s += (double) (res[b * d + k] - w[i * d + k]) / cap[k];
    }
    return s;
  }

  // --- overload balancing --------------------------------------------------------------------

  /** Normalised excess of bin b over its capacity, summed over dimensions. */
  private double excess(int b) {
    double e = 0;
    for (int k = 0; k < d; k++) {
      long r = res[b * d + k];
      if (r < 0) {
        e -= (double) r / cap[k];
      }
    }
    return e;
  }

  /**
   * Places the pool into the bins even where they overflow, then moves and swaps items between
   * bins to bring the total overflow to zero; false when the budget runs out first.
   */
  private boolean balance() {
    while (poolSize > 0) {
      int i = pool[--poolSize];
      int chosen = -1;
      double chosenExcess = Double.MAX_VALUE;
      double chosenSlack = Double.MAX_VALUE;
      for (int b = 0; b < bins; b++) {
        steps++;
        double e = 0;
        double slack = 0;
        for (int k = 0; k < d; k++) {
          long r = res[b * d + k] - w[i * d + k];
          if (r < 0) {
            e -= (double) r / cap[k];
          } else {
            slack += (double) r / cap[k];
          }
        }
        e -= excess(b);
        if (e < chosenExcess || (e == chosenExcess && slack < chosenSlack)) {
          chosen = b;
          chosenExcess = e;
          chosenSlack = slack;
        }
      }
      putInBin(i, chosen);
    }
    double[] ex = new double[bins];
    double total = 0;
    for (int b = 0; b < bins; b++) {
      ex[b] = excess(b);
      total += ex[b];
    }
    double best = total;
    while (true) {
      boolean over = false;
      for (int b = 0; b < bins && !over; b++) {
        for (int k = 0; k < d; k++) {
          if (res[b * d + k] < 0) {
            over = true;
            break;
          }
        }
      }
      if (!over) {
        return true;
      }
      if (steps >= limit) {
        return false;
      }
      iteration++;
      bestDelta = Double.MAX_VALUE;
      bestFuller = -Double.MAX_VALUE;
      mFrom = -1;
      ties = 0;
      for (int a = 0; a < bins && steps < limit; a++) {
        if (ex[a] > 0) {
          scanFrom(a, ex, total, best);
        }
      }
      if (mFrom < 0) {
        // Every move is tabu: let the list age.
        continue;
      }
      for (int i : new int[] {mOut1, mOut2}) {
        if (i >= 0) {
          takeFromBin(i);
          putInBin(i, mTo);
          tabuBin[i] = mFrom;
          tabuUntil[i] = iteration + TENURE + random.nextInt(TENURE + 1);
        }
      }
      for (int j : new int[] {mIn1, mIn2}) {
        if (j >= 0) {
          takeFromBin(j);
          putInBin(j, mFrom);
          tabuBin[j] = mTo;
          tabuUntil[j] = iteration + TENURE + random.nextInt(TENURE + 1);
        }
      }
      total -= ex[mFrom] + ex[mTo];
      ex[mFrom] = excess(mFrom);
      ex[mTo] = excess(mTo);
      total += ex[mFrom] + ex[mTo];
      best = Math.min(best, total);
    }
  }

  private double bestDelta;

  private double bestFuller;

  /** Sum over dimensions of the squared fill of bin b where it is within capacity. */
  private double sqOf(int b) {
    double s = 0;
    for (int k = 0; k < d; k++) {
      long r = res[b * d + k];
      if (r >= 0) {
        double f = 1 - (double) r / cap[k];
        s += f * f;
      }
    }
    return s;
  }
  private int mFrom;
  private int mTo;
  private int mOut1;
  private int mOut2;
  private int mIn1;
  private int mIn2;

  /**
   * The best exchange between overloaded bin a and any other bin b: one or two items of a go to
   * b, none, one or two items of b come back.
   */
  private void scanFrom(int a, double[] ex, double total, double best) {
    long[] ra = new long[d];
    int ma = countOf[a];
    double sqA = sqOf(a);
    for (int p1 = 0; p1 < ma; p1++) {
      for (int p2 = p1; p2 < ma; p2++) {
        int i1 = itemsOf[a][p1];
        int i2 = p2 == p1 ? -1 : itemsOf[a][p2];
        for (int k = 0; k < d; k++) {
          ra[k] = res[a * d + k] + w[i1 * d + k] + (i2 < 0 ? 0 : w[i2 * d + k]);
        }
        for (int b = 0; b < bins; b++) {
          if (b == a) {
            continue;
          }
          if (steps >= limit) {
            return;
          }
          boolean outTabu = tabu(i1, b) || (i2 >= 0 && tabu(i2, b));
          int mb = countOf[b];
          for (int q1 = -1; q1 < mb; q1++) {
            for (int q2 = q1 < 0 ? -1 : q1; q2 < mb; q2++) {
              if (q1 < 0 && q2 >= 0) {
                break;
              }
              int j1 = q1 < 0 ? -1 : itemsOf[b][q1];
              int j2 = q2 == q1 ? -1 : itemsOf[b][q2];
              steps++;
              double exA = 0;
              double exB = 0;
              double sq = 0;
              for (int k = 0; k < d; k++) {
                long back = (j1 < 0 ? 0 : w[j1 * d + k]) + (j2 < 0 ? 0 : w[j2 * d + k]);
                long r1 = ra[k] - back;
                if (r1 < 0) {
                  exA -= (double) r1 / cap[k];
                } else {
                  double f = 1 - (double) r1 / cap[k];
                  sq += f * f;
                }
                long r2 = res[b * d + k] + back - (ra[k] - res[a * d + k]);
                if (r2 < 0) {
                  exB -= (double) r2 / cap[k];
                } else {
                  double f = 1 - (double) r2 / cap[k];
                  sq += f * f;
                }
              }
              // Primary: less overflow. Secondary (on a plateau): fuller feasible bins, so the
              // free room gathers in few bins where an overflowing item can go.
              double delta = exA + exB - ex[a] - ex[b];
              double fuller = sq - sqA - sqOf(b);
              boolean isTabu = outTabu || (j1 >= 0 && tabu(j1, a)) || (j2 >= 0 && tabu(j2, a));
              if (isTabu && !(total + delta < best - 1e-12)) {
                continue;
              }
              if (delta < bestDelta - 1e-12
                  || (delta <= bestDelta + 1e-12 && fuller > bestFuller + 1e-12)) {
                bestDelta = delta;
                bestFuller = fuller;
                ties = 1;
              } else if (!(delta <= bestDelta + 1e-12 && fuller >= bestFuller - 1e-12)
                  || random.nextInt(++ties) != 0) {
                continue;
              }
              mFrom = a;
              mTo = b;
              mOut1 = i1;
              mOut2 = i2;
              mIn1 = j1;
              mIn2 = j2;
            }
          }
        }
      }
    }
  }

  // --- concentrating free room -----------------------------------------------------------------

  /**
   * Share of the steps left in the current phase that one descent towards fuller bins may spend
   * (the descent itself stops earlier at a local optimum).
   */
  static final double CONCENTRATE_SHARE = 0.05;

  /**
   * A descent between bins within capacity that raises the sum of squared bin fills (normalised,
   * summed over dimensions): one or two items of one bin are exchanged with none, one or two
   * items of another, both bins staying within capacity in every dimension. Raising that sum
   * gathers the free room in few bins, which is what makes exactly filled bins appear (the
   * least-filled bin then holds less to place elsewhere). Stops at a local optimum or after
   * {@code maxSteps}; true when anything moved.
   */
  private boolean concentrate(long maxSteps) {
    long stop = Math.min(limit, steps + maxSteps);
    boolean movedAny = false;
    // Walk the pairs of bins cyclically from where the last descent stopped, so that a descent
    // cut short by its step share does not always revisit the same pairs; a full cycle without a
    // move is a local optimum.
    long quiet = 0;
    long pairs = (long) bins * (bins - 1) / 2;
    while (steps < stop && quiet < pairs) {
      if (pairA >= bins - 1 || pairB >= bins) {
        pairA = 0;
        pairB = 1;
      }
      if (improvePair(pairA, pairB, stop)) {
        movedAny = true;
        quiet = 0;
      } else {
        quiet++;
      }
      if (++pairB >= bins) {
        pairA++;
        pairB = pairA + 1;
      }
    }
    return movedAny;
  }

  /** The next pair of bins the descent looks at. */
  private int pairA;

  private int pairB = 1;

  private long[] setSumA = new long[0];
  private int[] setA = new int[0];
  private long[] setSumB = new long[0];
  private int[] setB = new int[0];

  /** Sets of none, one or two items of bin b: their items (pairs) and demand sums; the count. */
  private int setsOf(int b, boolean first) {
    int m = countOf[b];
    int count = 1 + m + m * (m - 1) / 2;
    int[] items = first ? setA : setB;
    long[] sums = first ? setSumA : setSumB;
    if (items.length < 2 * count) {
      items = new int[2 * count];
      sums = new long[count * d];
    } else if (sums.length < count * d) {
      sums = new long[count * d];
    }
    int s = 0;
    for (int p1 = -1; p1 < m; p1++) {
      for (int p2 = p1; p2 < m; p2++) {
        if (p1 < 0 && p2 >= 0) {
          break;
        }
        int i1 = p1 < 0 ? -1 : itemsOf[b][p1];
        int i2 = p2 == p1 ? -1 : itemsOf[b][p2];
        items[2 * s] = i1;
        items[2 * s + 1] = i2;
        for (int k = 0; k < d; k++) {
          sums[s * d + k] = (i1 < 0 ? 0 : w[i1 * d + k]) + (i2 < 0 ? 0 : w[i2 * d + k]);
        }
        s++;
      }
    }
    if (first) {
      setA = items;
      setSumA = sums;
    } else {
      setB = items;
      setSumB = sums;
    }
    return s;
  }

  /** Applies the exchange between bins a and b that raises the sum of squared fills most. */
  private boolean improvePair(int a, int b, long stop) {
    int sa = setsOf(a, true);
    int sb = setsOf(b, false);
    double bestRise = 1e-12;
    int bestS = -1;
    int bestT = -1;
    for (int s = 0; s < sa && steps < stop; s++) {
      for (int t = 0; t < sb; t++) {
        if (s == 0 && t == 0) {
          continue;
        }
        steps++;
        double rise = 0;
        boolean ok = true;
        for (int k = 0; k < d; k++) {
          // delta moves from a to b.
          long delta = setSumA[s * d + k] - setSumB[t * d + k];
          if (delta > res[b * d + k] || -delta > res[a * d + k]) {
            ok = false;
            break;
          }
          double x = (double) delta / cap[k];
          double fa = 1 - (double) res[a * d + k] / cap[k];
          double fb = 1 - (double) res[b * d + k] / cap[k];
          rise += 2 * x * (x + fb - fa);
        }
        if (ok && rise > bestRise) {
          bestRise = rise;
          bestS = s;
          bestT = t;
        }
      }
    }
    if (bestS < 0) {
      return false;
    }
    int[] fromA = {setA[2 * bestS], setA[2 * bestS + 1]};
    int[] fromB = {setB[2 * bestT], setB[2 * bestT + 1]};
    for (int i : fromA) {
      if (i >= 0) {
        takeFromBin(i);
      }
    }
    for (int j : fromB) {
      if (j >= 0) {
        takeFromBin(j);
        putInBin(j, a);
      }
    }
    for (int i : fromA) {
      if (i >= 0) {
        putInBin(i, b);
      }
    }
    return true;
  }

  // --- bookkeeping ---------------------------------------------------------------------------

  private void putInBin(int i, int b) {
    if (countOf[b] == itemsOf[b].length) {
      itemsOf[b] = Arrays.copyOf(itemsOf[b], countOf[b] * 2);
    }
    posOf[i] = countOf[b];
    itemsOf[b][countOf[b]++] = i;
    binOf[i] = b;
    for (int k = 0; k < d; k++) {
      res[b * d + k] -= w[i * d + k];
    }
  }

  private void takeFromBin(int i) {
    int b = binOf[i];
    int p = posOf[i];
    int last = itemsOf[b][--countOf[b]];
    itemsOf[b][p] = last;
    posOf[last] = p;
    binOf[i] = -1;
    for (int k = 0; k < d; k++) {
      res[b * d + k] += w[i * d + k];
    }
  }

  private void toPool(int i) {
    if (poolSize == pool.length) {
      pool = Arrays.copyOf(pool, poolSize * 2);
    }
    pool[poolSize++] = i;
  }

  private void fromPool(int j) {
    // Keep the pool's order (the order moves are scanned in): shift rather than swap.
    System.arraycopy(pool, j + 1, pool, j, poolSize - j - 1);
    poolSize--;
  }

  private int indexInPool(int i) {
    for (int j = 0; j < poolSize; j++) {
      if (pool[j] == i) {
        return j;
      }
    }
    throw new IllegalStateException("item " + i + " is not in the pool");
  }
}
