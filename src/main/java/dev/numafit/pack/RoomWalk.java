package dev.numafit.pack;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * A tabu walk of the free room on one dimension: a step of {@link VectorPacker} after the local
 * search ({@link PoolSearch}) and before bin completion ({@link BinCompletion}).
 *
 * <p>Each iteration takes a bin with free room at random and {@link #SAMPLE} other bins at random,
 * and applies the best exchange of none, one or two items of the first with none, one or two items
 * of one of the others that keeps both within capacity and changes the first bin's load. "Best"
 * means the largest rise in the sum of squared bin fills, which gathers free room in fewer bins;
 * the move is applied even when that sum falls (the walk does not stop at a local optimum), but an
 * item may not go back to the bin it just left for {@link #TENURE} to twice that many iterations.
 * Ties are broken by a {@link SplittableRandom} with a fixed seed. When a bin is left empty it is
 * dropped: one bin fewer. The walk stops at the lower bound or when its steps run out (one step per
 * bin looked at and per exchange weighed), so the result is the same for the same input.
 */
final class RoomWalk {
  /** Bins drawn per iteration to trade with the bin that has free room. */
  static final int SAMPLE = 12;

  /** Iterations an item stays barred from the bin it left: this plus a random 0..this more. */
  static final int TENURE = 7;

  private final int n;
  private final long cap;
  private final long[] size;
  private final SplittableRandom random;
  private int bins;
  private final int[] binOf;
  private final long[] load;
  private final int[][] itemsOf;
  private final int[] countOf;
  private final int[] posOf;
  private final int[] tabuBin;
  private final long[] tabuUntil;
  /** The bins with free room, and each bin's place in that list (−1 when full). */
  private final int[] roomy;
  private final int[] roomyPos;
  private int roomyCount;
  private long steps;
  private long iteration;

  /**
   * @param size the items' sizes
   * @param cap the bins' capacity
   * @param start a feasible packing: bin of each item, bins numbered from 0 without gaps
   * @param random where the walk's random choices come from
   */
  RoomWalk(long[] size, long cap, int[] start, SplittableRandom random) {
    this.n = size.length;
    this.cap = cap;
    this.size = size;
    this.random = random;
    this.binOf = new int[n];
    this.posOf = new int[n];
    this.tabuBin = new int[n];
    this.tabuUntil = new long[n];
    Arrays.fill(tabuBin, -1);
    int b = 0;
    for (int x : start) {
      b = Math.max(b, x + 1);
    }
    this.bins = b;
    this.load = new long[bins];
    this.itemsOf = new int[bins][4];
    this.countOf = new int[bins];
    this.roomy = new int[bins];
    this.roomyPos = new int[bins];
    Arrays.fill(roomyPos, -1);
    for (int i = 0; i < n; i++) {
      add(i, start[i]);
    }
    for (int bin = 0; bin < bins; bin++) {
      updateRoomy(bin);
    }
  }

  /** Steps spent so far. */
  long steps() {
    return steps;
  }

  /**
   * Walks until the lower bound or until {@code maxSteps} steps are spent.
   *
   * @return the bin of each item: never more bins than at the start
   */
  int[] run(int lowerBound, long maxSteps) {
    while (bins > lowerBound && steps < maxSteps && roomyCount > 0) {
      iteration++;
      int a = roomy[random.nextInt(roomyCount)];
      int sample = Math.min(bins, SAMPLE);
      steps += sample;
      int ma = countOf[a];
      double best = -Double.MAX_VALUE;
      int ties = 0;
      int bestB = -1;
      int s1 = -1;
      int s2 = -1;
      int t1 = -1;
      int t2 = -1;
      for (int k = 0; k < sample; k++) {
        int b = random.nextInt(bins);
        if (b == a) {
          continue;
        }
        int mb = countOf[b];
        for (int p1 = -1; p1 < ma; p1++) {
          for (int p2 = p1; p2 < ma; p2++) {
            if (p1 < 0 && p2 >= 0) {
              break;
            }
            int x1 = p1 < 0 ? -1 : itemsOf[a][p1];
            int x2 = p2 == p1 ? -1 : itemsOf[a][p2];
            if ((x1 >= 0 && tabu(x1, b)) || (x2 >= 0 && tabu(x2, b))) {
              continue;
            }
            long out = sizeOf(x1) + sizeOf(x2);
            for (int q1 = -1; q1 < mb; q1++) {
              for (int q2 = q1; q2 < mb; q2++) {
                if (q1 < 0 && q2 >= 0) {
                  break;
                }
                int y1 = q1 < 0 ? -1 : itemsOf[b][q1];
                int y2 = q2 == q1 ? -1 : itemsOf[b][q2];
                steps++;
                // x: what bin a gains (and bin b loses); a's load must change.
                long x = sizeOf(y1) + sizeOf(y2) - out;
                if (x == 0 || load[a] + x > cap || load[b] - x > cap) {
                  continue;
                }
                if ((y1 >= 0 && tabu(y1, a)) || (y2 >= 0 && tabu(y2, a))) {
                  continue;
                }
                // Change of fa² + fb² with fills fa = load/cap: 2·dx·(fa − fb + dx).
                double dx = (double) x / cap;
                double delta = 2 * dx * ((double) (load[a] - load[b]) / cap + dx);
                if (delta > best + 1e-12) {
                  best = delta;
                  ties = 1;
                } else if (delta < best - 1e-12 || random.nextInt(++ties) != 0) {
                  continue;
                }
                bestB = b;
                s1 = x1;
                s2 = x2;
                t1 = y1;
                t2 = y2;
              }
            }
          }
        }
      }
      if (bestB >= 0) {
        apply(a, bestB, s1, s2, t1, t2);
      }
    }
    return Arrays.copyOf(binOf, n);
  }

  private void apply(int a, int b, int s1, int s2, int t1, int t2) {
    for (int i : new int[] {s1, s2}) {
      if (i >= 0) {
        remove(i);
      }
    }
    for (int j : new int[] {t1, t2}) {
      if (j >= 0) {
        remove(j);
        add(j, a);
        bar(j, b);
      }
    }
    for (int i : new int[] {s1, s2}) {
      if (i >= 0) {
        add(i, b);
        bar(i, a);
      }
    }
    updateRoomy(a);
    updateRoomy(b);
    if (countOf[a] == 0) {
      dropEmpty(a);
    } else if (countOf[b] == 0) {
      dropEmpty(b);
    }
  }

  private void bar(int item, int from) {
    tabuBin[item] = from;
    tabuUntil[item] = iteration + TENURE + random.nextInt(TENURE + 1);
  }

  private boolean tabu(int item, int b) {
    return tabuBin[item] == b && tabuUntil[item] > iteration;
  }

  private long sizeOf(int item) {
    return item < 0 ? 0 : size[item];
  }

  private void add(int i, int b) {
    if (countOf[b] == itemsOf[b].length) {
      itemsOf[b] = Arrays.copyOf(itemsOf[b], countOf[b] * 2);
    }
    posOf[i] = countOf[b];
    itemsOf[b][countOf[b]++] = i;
    binOf[i] = b;
    load[b] += size[i];
  }

  private void remove(int i) {
    int b = binOf[i];
    int p = posOf[i];
    int last = itemsOf[b][--countOf[b]];
    itemsOf[b][p] = last;
    posOf[last] = p;
    binOf[i] = -1;
    load[b] -= size[i];
  }

  /** Puts bin b in the list of bins with free room, or takes it out, as its load says. */
  private void updateRoomy(int b) {
    boolean hasRoom = load[b] < cap;
    if (hasRoom && roomyPos[b] < 0) {
      roomyPos[b] = roomyCount;
      roomy[roomyCount++] = b;
    } else if (!hasRoom && roomyPos[b] >= 0) {
      int p = roomyPos[b];
      int last = roomy[--roomyCount];
      roomy[p] = last;
      roomyPos[last] = p;
      roomyPos[b] = -1;
    }
  }

  /** Drops the empty bin e: the last bin takes its number, so bins stay numbered without gaps. */
  private void dropEmpty(int e) {
    int last = bins - 1;
    if (e != last) {
      for (int i : Arrays.copyOf(itemsOf[last], countOf[last])) {
        remove(i);
        add(i, e);
      }
      for (int i = 0; i < n; i++) {
        if (tabuBin[i] == last) {
          tabuBin[i] = e;
        } else if (tabuBin[i] == e) {
          tabuBin[i] = -1;
        }
      }
      steps += n;
    }
    // The last bin's number is gone: out of the list of bins with free room.
    if (roomyPos[last] >= 0) {
      int p = roomyPos[last];
      int moved = roomy[--roomyCount];
      roomy[p] = moved;
      roomyPos[moved] = p;
      roomyPos[last] = -1;
    }
    load[last] = 0;
    countOf[last] = 0;
    bins--;
    if (e != last) {
      updateRoomy(e);
    }
  }
}
