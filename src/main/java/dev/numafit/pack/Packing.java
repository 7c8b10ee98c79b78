package dev.numafit.pack;

import java.util.Arrays;

/**
 * The result of a vector bin packing: how many bins (workers) were used, which bin each item (pod)
 * went to, and how many search steps the packer spent.
 *
 * <p>Bins are numbered {@code 0 .. bins-1}, every number is used. Steps are the packer's own count
 * of bins and items it examined; they measure effort independently of the machine.
 */
public final class Packing {
  private final int bins;
  private final int[] binOfItem;
  private final long steps;
  private final int lowerBound;

  /**
   * @param bins bins used, at least the largest bin number plus one
   * @param binOfItem for item {@code i}, the bin it was placed in
   * @param steps search steps spent
   * @param lowerBound the {@link LowerBound} of the instance, at most {@code bins}
   */
  public Packing(int bins, int[] binOfItem, long steps, int lowerBound) {
    if (bins < 0 || steps < 0) {
      throw new IllegalArgumentException("bins and steps must be >= 0");
    }
    if (lowerBound < 0 || lowerBound > bins) {
      throw new IllegalArgumentException(
          "lower bound " + lowerBound + " outside 0.." + bins + ": the packing or bound is wrong");
    }
    for (int b : binOfItem) {
      if (b < 0 || b >= bins) {
        throw new IllegalArgumentException("bin " + b + " outside 0.." + (bins - 1));
      }
    }
    this.bins = bins;
    this.binOfItem = binOfItem.clone();
    this.steps = steps;
    this.lowerBound = lowerBound;
  }

  /** No packing of these items uses fewer bins than this ({@link LowerBound#of}). */
  public int lowerBound() {
    return lowerBound;
  }

  /** Bins used. */
  public int bins() {
    return bins;
  }

  /** The bin of item {@code i}. */
  public int binOf(int item) {
    return binOfItem[item];
  }

  /** A copy of the item → bin assignment. */
  public int[] binOfItem() {
    return binOfItem.clone();
  }

  /** Number of items packed. */
  public int items() {
    return binOfItem.length;
  }

  /** Search steps spent (bins and items examined). */
  public long steps() {
    return steps;
  }

  /** Per bin, the sum of its items' demands: {@code loads[bin][dimension]}. */
  public long[][] loads(long[][] items) {
    if (items.length != binOfItem.length) {
      throw new IllegalArgumentException("expected " + binOfItem.length + " items");
    }
    int d = items.length == 0 ? 0 : items[0].length;
    long[][] loads = new long[bins][d];
    for (int i = 0; i < items.length; i++) {
      long[] row = loads[binOfItem[i]];
      for (int k = 0; k < d; k++) {
        row[k] = Math.addExact(row[k], items[i][k]);
      }
    }
    return loads;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Packing p
        && p.bins == bins
        && p.steps == steps
        && p.lowerBound == lowerBound
        && Arrays.equals(p.binOfItem, binOfItem);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * bins + Long.hashCode(steps)) + Arrays.hashCode(binOfItem);
  }

  @Override
  public String toString() {
    return "Packing[bins=" + bins + ", lowerBound=" + lowerBound + ", items=" + binOfItem.length
        + ", steps=" + steps + "]";
  }
}
