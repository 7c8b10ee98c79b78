package dev.numafit.pack;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import java.util.SplittableRandom;

/**
 * Bin completion on one dimension: a depth-first search that fills the bins one at a time and
 * tries to pack every item into a given number of bins. The last step of {@link VectorPacker} on
 * one dimension, after the local search ({@link PoolSearch}) and the free-room walk
 * ({@link RoomWalk}).
 *
 * <p>Each bin starts with the largest item left; the search then chooses which other items
 * complete it. A completion is a multiset of item sizes (items of equal size are never told
 * apart, so no two branches differ only by swapping equal items) that leaves at most the waste
 * still allowed: m bins of capacity C holding items that sum to S may leave at most m·C − S unused
 * in all. While completions are listed, a branch ends as soon as even the largest items that could
 * still fit (at most room ÷ smallest size left of them) cannot bring the waste within that
 * allowance. Only maximal completions are tried (no item left over would still fit in the bin): an
 * item moved into a bin's free room from a later bin never costs a bin, so nothing is lost (the
 * dominance idea of bin-completion searches, written here from the idea). Completions are tried
 * fullest first. A state of the search (the items left and the bins left) that was already
 * searched in vain is recognised by a hash of the items left and not searched again.
 *
 * <p>The search runs in restarts: the first tries the completions of equal fill largest items
 * first; each further restart shuffles them (a {@link SplittableRandom} with a fixed seed) and may
 * spend a tenth more nodes than the last. One node is counted per bin started and per step of the
 * enumeration of completions, so the limit is deterministic. At most {@link #MAX_COMPLETIONS}
 * completions are kept per bin, so the search is a heuristic, not a proof: when it finds nothing,
 * nothing is claimed.
 */
final class BinCompletion {
  /** Completions kept per bin (the first found in the enumeration's order, larger items first). */
  static final int MAX_COMPLETIONS = 64;

  /**
   * Largest number of bins, and of distinct sizes, the search is tried on: its recursion is one
   * level per bin and, while it lists a bin's completions, one level per distinct size.
   */
  static final int MAX_DEPTH = 1_000;

  /** Nodes the first restart may spend; each further restart may spend a tenth more. */
  static final long FIRST_RESTART_NODES = 5_000;

  /** Slots of the table of states searched in vain (a power of two; a slot keeps the latest). */
  static final int FAILED_SLOTS = 1 << 16;

  /** Outcome: the bin of each item, or null when nothing was found within the limit; nodes spent. */
  record Result(int[] binOf, long nodes) {}

  private final long cap;
  /** Distinct sizes, largest first. */
  private final long[] val;
  private final int[] cnt;
  /** Items of each distinct size. */
  private final int[][] itemsOfSize;
  private final int distinct;
  private final long[] zobrist;
  private final long[] failed = new long[FAILED_SLOTS];
  private long hash;
  private long limit;
  private long nodes;
  private SplittableRandom shuffle;
  /** Distinct-size indices of the items of each bin so far. */
  private final List<int[]> binContents = new ArrayList<>();

  private BinCompletion(long[] sizes, long cap) {
    this.cap = cap;
    int n = sizes.length;
    long[] sorted = sizes.clone();
    Arrays.sort(sorted);
    int k = 0;
    for (int p = 0; p < n; p++) {
      if (p == 0 || sorted[p] != sorted[p - 1]) {
        k++;
      }
    }
    this.distinct = k;
    this.val = new long[distinct];
    for (int p = n - 1, t = -1; p >= 0; p--) {
      if (p == n - 1 || sorted[p] != sorted[p + 1]) {
        val[++t] = sorted[p];
      }
    }
    this.cnt = new int[distinct];
    int[] sizeIndex = new int[n];
    for (int i = 0; i < n; i++) {
      // val is decreasing: search it for sizes[i].
      int lo = 0;
      int hi = distinct - 1;
      while (lo < hi) {
        int mid = (lo + hi) >>> 1;
        if (val[mid] > sizes[i]) {
          lo = mid + 1;
        } else {
          hi = mid;
        }
      }
      sizeIndex[i] = lo;
      cnt[lo]++;
    }
    this.itemsOfSize = new int[distinct][];
    int[] filled = new int[distinct];
    for (int t = 0; t < distinct; t++) {
      itemsOfSize[t] = new int[cnt[t]];
    }
    for (int i = 0; i < n; i++) {
      itemsOfSize[sizeIndex[i]][filled[sizeIndex[i]]++] = i;
    }
    SplittableRandom z = new SplittableRandom(PoolSearch.SEED ^ 0x9E3779B97F4A7C15L);
    this.zobrist = new long[distinct];
    for (int t = 0; t < distinct; t++) {
      zobrist[t] = z.nextLong();
      hash += cnt[t] * zobrist[t];
    }
  }

  /**
   * Searches for a packing of the items into {@code bins} bins, in restarts, within
   * {@code nodeLimit} nodes.
   *
   * @param sizes the items' sizes, each between 0 and {@code cap}
   * @param cap the bins' capacity
   * @param bins the number of bins to pack into
   * @param nodeLimit nodes the search may spend
   * @param random where each restart's shuffles come from
   */
  static Result search(long[] sizes, long cap, int bins, long nodeLimit, SplittableRandom random) {
    if (sizes.length == 0 || bins <= 0 || bins > MAX_DEPTH || nodeLimit <= 0) {
      return new Result(null, 0);
    }
    long total = 0;
    for (long s : sizes) {
      total += s;
    }
    long waste = (long) bins * cap - total;
    if (waste < 0) {
      return new Result(null, 0);
    }
    BinCompletion bc = new BinCompletion(sizes, cap);
    if (bc.distinct > MAX_DEPTH) {
      return new Result(null, 0);
    }
    long each = FIRST_RESTART_NODES;
    boolean first = true;
    while (bc.nodes < nodeLimit) {
      long before = bc.nodes;
      bc.limit = Math.min(nodeLimit, before + each);
      bc.shuffle = first ? null : random;
      first = false;
      bc.binContents.clear();
      if (bc.fill(bins, waste)) {
        return new Result(bc.assignment(sizes.length), bc.nodes);
      }
      if (bc.nodes <= bc.limit) {
        // The whole (truncated) tree was searched: another order would search the same states.
        break;
      }
      each += each / 10;
    }
    return new Result(null, bc.nodes);
  }

  private int[] assignment(int n) {
    int[] binOf = new int[n];
    int[] used = new int[distinct];
    for (int b = 0; b < binContents.size(); b++) {
      for (int s : binContents.get(b)) {
        binOf[itemsOfSize[s][used[s]++]] = b;
      }
    }
    return binOf;
  }

  /** Fills the remaining {@code binsLeft} bins; true when every item is packed. */
  private boolean fill(int binsLeft, long wasteLeft) {
    int first = 0;
    while (first < distinct && cnt[first] == 0) {
      first++;
    }
    if (first == distinct) {
      return true;
    }
    if (binsLeft == 0 || ++nodes > limit) {
      return false;
    }
    long key = hash * 31 + binsLeft;
    int slot = (int) (key ^ (key >>> 32)) & (FAILED_SLOTS - 1);
    if (failed[slot] == key && key != 0) {
      return false;
    }
    take(first);
    long room = cap - val[first];
    List<int[]> completions = completions(first, room, wasteLeft);
    if (shuffle != null) {
      Collections.shuffle(completions, new Random(shuffle.nextLong()));
    }
    // Fullest first (a stable sort: the enumeration's or the shuffle's order among equals).
    completions.sort((a, b) -> Long.compare(sumOf(b), sumOf(a)));
    for (int[] completion : completions) {
      if (nodes > limit) {
        break;
      }
      long sum = sumOf(completion);
      for (int s : completion) {
        take(s);
      }
      int[] content = Arrays.copyOf(completion, completion.length + 1);
      content[completion.length] = first;
      binContents.add(content);
      if (fill(binsLeft - 1, wasteLeft - (room - sum))) {
        return true;
      }
      binContents.remove(binContents.size() - 1);
      for (int s : completion) {
        putBack(s);
      }
    }
    putBack(first);
    if (nodes <= limit) {
      failed[slot] = key;
    }
    return false;
  }

  private void take(int s) {
    cnt[s]--;
    hash -= zobrist[s];
  }

  private void putBack(int s) {
    cnt[s]++;
    hash += zobrist[s];
  }

  private long sumOf(int[] completion) {
    long s = 0;
    for (int i : completion) {
      s += val[i];
    }
    return s;
  }

  // --- enumeration of completions --------------------------------------------------------------

  private long[] suffix = new long[0];
  private int[] chosen = new int[16];
  private int chosenCount;
  private List<int[]> found;
  /** The smallest size left when a bin's completions are listed (0 when none is left). */
  private long smallest;

  /** Most further items for which the fill bound below is computed (a walk over that many). */
  static final long MAX_MORE = 64;

  /**
   * The maximal completions of a bin with {@code room} left that waste at most {@code wasteLeft},
   * from sizes at index {@code from} on (all items left are there: the bin's first item is the
   * largest).
   */
  private List<int[]> completions(int from, long room, long wasteLeft) {
    if (suffix.length < distinct + 1) {
      suffix = new long[distinct + 1];
    }
    suffix[distinct] = 0;
    for (int s = distinct - 1; s >= from; s--) {
      suffix[s] = suffix[s + 1] + cnt[s] * val[s];
    }
    smallest = 0;
    for (int s = distinct - 1; s >= from; s--) {
      if (cnt[s] > 0) {
        smallest = val[s];
        break;
      }
    }
    found = new ArrayList<>();
    chosenCount = 0;
    enumerate(from, room, wasteLeft);
    return found;
  }

  private void enumerate(int s, long room, long wasteLeft) {
    nodes++;
    if (found.size() >= MAX_COMPLETIONS || nodes > limit) {
      return;
    }
    // Even every item left cannot bring the waste within the allowance.
    if (room - suffix[s] > wasteLeft) {
      return;
    }
    while (s < distinct && (cnt[s] == 0 || val[s] > room)) {
      s++;
    }
    if (s < distinct && room > wasteLeft && smallest > 0 && room / smallest <= MAX_MORE) {
      // At most room / smallest more items fit; the largest that many from here on bound what
      // the bin can still take.
      long most = room / smallest;
      long fill = 0;
      long count = 0;
      int t = s;
      for (; t < distinct && count < most; t++) {
        long take = Math.min(cnt[t], most - count);
        fill += take * val[t];
        count += take;
      }
      nodes += (t - s) / 8;
      if (room - Math.min(fill, room) > wasteLeft) {
        return;
      }
    }
    if (s == distinct) {
      if (room <= wasteLeft && maximal(room)) {
        found.add(Arrays.copyOf(chosen, chosenCount));
      }
      return;
    }
    int most = (int) Math.min(cnt[s], val[s] == 0 ? cnt[s] : room / val[s]);
    for (int take = most; take >= 0; take--) {
      if (chosen.length < chosenCount + take) {
        chosen = Arrays.copyOf(chosen, 2 * (chosenCount + take));
      }
      for (int t = 0; t < take; t++) {
        chosen[chosenCount++] = s;
      }
      cnt[s] -= take;
      enumerate(s + 1, room - take * val[s], wasteLeft);
      cnt[s] += take;
      chosenCount -= take;
      if (found.size() >= MAX_COMPLETIONS || nodes > limit) {
        return;
      }
    }
  }

  /** No item left over fits in the room a completion leaves. */
  private boolean maximal(long room) {
    // cnt holds what is left after the completion; the smallest size left is the last one.
    for (int s = distinct - 1; s >= 0; s--) {
      if (cnt[s] > 0) {
        return val[s] > room;
      }
    }
    return true;
  }
}
