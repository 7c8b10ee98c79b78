package dev.numafit.pack;

import java.util.Arrays;

/**
 * Lower bounds on the number of bins any packing of vector items needs: no packing, however
 * clever, uses fewer. Each bound looks at one dimension at a time and the result is the largest
 * over dimensions, since every dimension must fit on its own.
 *
 * <p>Items are {@code long[n][d]} demands (millicores, bytes or counts), the capacity {@code
 * long[d]}. A dimension with capacity 0 is skipped (its items must be 0 there, or they could not be
 * packed at all).
 */
public final class LowerBound {
  private LowerBound() {}

  /** The continuous bound: max over dimensions of {@code ceil(total demand / capacity)}. */
  public static int continuous(long[][] items, long[] capacity) {
    int d = capacity.length;
    long best = 0;
    for (int k = 0; k < d; k++) {
      if (capacity[k] <= 0) {
        continue;
      }
      long total = 0;
      for (long[] item : items) {
        total = Math.addExact(total, item[k]);
      }
      best = Math.max(best, ceilDiv(total, capacity[k]));
    }
    return Math.toIntExact(best);
  }

  /**
   * Max over dimensions of the number of items whose demand is strictly more than half the
   * capacity: no two of them can share a bin.
   */
  public static int moreThanHalf(long[][] items, long[] capacity) {
    int best = 0;
    for (int k = 0; k < capacity.length; k++) {
      if (capacity[k] <= 0) {
        continue;
      }
      int count = 0;
      for (long[] item : items) {
        if (moreThanHalf(item[k], capacity[k])) {
          count++;
        }
      }
      best = Math.max(best, count);
    }
    return best;
  }

  /**
   * The Martello–Toth bound L2 ("Lower bounds and reduction procedures for the bin packing
   * problem", Discrete Applied Mathematics 28, 1990), per dimension. For a threshold K ≤ C/2, items
   * larger than C−K each need a bin of their own (J1); items in (C/2, C−K] (J2) each need their own
   * bin too and can share it only with items in [K, C/2] (J3); whatever of J3 does not fit the space
   * left beside J2 needs further bins. L2 is the largest such count over K; it is never less than
   * {@link #continuous} or {@link #moreThanHalf} for the same dimension.
   */
  public static int martelloToth(long[][] items, long[] capacity) {
    int best = 0;
    for (int k = 0; k < capacity.length; k++) {
      if (capacity[k] <= 0) {
        continue;
      }
      long[] sizes = new long[items.length];
      for (int i = 0; i < items.length; i++) {
        sizes[i] = items[i][k];
      }
      best = Math.max(best, martelloToth1d(sizes, capacity[k]));
    }
    return best;
  }

  /** The strongest of the bounds above: the one to report. */
  public static int of(long[][] items, long[] capacity) {
    return Math.max(
        martelloToth(items, capacity),
        Math.max(continuous(items, capacity), moreThanHalf(items, capacity)));
  }

  /** L2 for one dimension; {@code sizes} is reordered. */
  static int martelloToth1d(long[] sizes, long c) {
    int n = sizes.length;
    if (n == 0) {
      return 0;
    }
    Arrays.sort(sizes);
    long[] prefix = new long[n + 1];
    for (int i = 0; i < n; i++) {
      prefix[i + 1] = Math.addExact(prefix[i], sizes[i]);
    }
    // Index of the first item strictly above half: everything from there on is "large".
    int firstLarge = firstIndexWhere(sizes, s -> moreThanHalf(s, c));
    long best = 0;
    long previousK = -1;
    // Candidate thresholds: 0 and every distinct size that is at most half the capacity.
    for (int i = -1; i < firstLarge; i++) {
      long kk = i < 0 ? 0 : sizes[i];
      if (kk == previousK) {
        continue;
      }
      previousK = kk;
      // J1: sizes > c - kk; J2: c/2 < size <= c - kk; J3: kk <= size <= c/2.
      int firstJ1 = firstIndexWhere(sizes, s -> s > c - kk);
      int firstJ3 = firstIndexWhere(sizes, s -> s >= kk);
      long j1 = n - firstJ1;
      long j2 = firstJ1 - firstLarge;
      long sumJ2 = prefix[firstJ1] - prefix[firstLarge];
      long sumJ3 = prefix[firstLarge] - prefix[firstJ3];
      long freeBesideJ2 = Math.subtractExact(Math.multiplyExact(j2, c), sumJ2);
      long extra = Math.max(0, ceilDiv(sumJ3 - freeBesideJ2, c));
      best = Math.max(best, j1 + j2 + extra);
    }
    return Math.toIntExact(best);
  }

  static boolean moreThanHalf(long demand, long capacity) {
    // 2 * demand > capacity without overflow for demands up to Long.MAX_VALUE.
    return demand > capacity - demand;
  }

  private interface LongPredicate {
    boolean test(long v);
  }

  /** First index of a sorted array where a monotone predicate turns true (n when never). */
  private static int firstIndexWhere(long[] sorted, LongPredicate p) {
    int lo = 0;
    int hi = sorted.length;
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (p.test(sorted[mid])) {
        hi = mid;
      } else {
        lo = mid + 1;
      }
    }
    return lo;
  }

  private static long ceilDiv(long a, long b) {
    return a <= 0 ? 0 : (a - 1) / b + 1;
  }
}
