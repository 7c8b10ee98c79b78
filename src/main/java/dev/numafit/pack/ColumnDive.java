package dev.numafit.pack;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.TreeMap;

/**
 * A packing read off the linear relaxation of the set-cover model of bin packing, fixing one bin
 * at a time (a "diving" heuristic over column generation, written here from the textbook idea):
 * the last step of {@link VectorPacker} on several dimensions.
 *
 * <p>The model: every feasible content of one bin is a column (how many items of each distinct
 * vector it holds); choose columns, as few as possible, so that every item is covered. Its linear
 * relaxation is solved by the revised simplex method over a growing set of columns: a new column
 * enters when the duals make it worth more than one bin (its reduced cost is negative). Such
 * columns are first looked for greedily (each of the {@link #GREEDY_SEEDS} best candidates by
 * dual value per unit of size starts a bin the others fill in that order); when that finds none,
 * by a depth-first search for the bin contents of greatest dual value (a knapsack in every
 * dimension at once), which may spend {@link #PRICE_NODES} nodes. Its branches end on three
 * bounds: by count (no more items fit the room left than the smallest candidates of any one
 * dimension do, so the largest dual values of that many candidates bound what can still be added;
 * strong where few items share a bin), then the fractional knapsack on the sum of the normalised
 * dimensions, then on each dimension alone. The simplex picks the entering column by Devex
 * pricing (reduced cost squared over a reference weight updated from the pivot row at every
 * pivot, written here from the published method), which takes fewer pivots than the most
 * negative reduced cost on these degenerate relaxations. The bins of the packing in hand are the
 * first columns. Once the relaxation is solved, the columns it uses a whole number of times are
 * fixed as bins (or, when none is, the one it uses most), their items leave the model, and the
 * relaxation is solved again for the items left, until none is left. A dive gives up as soon as the
 * bins fixed plus the relaxation's value for the rest, rounded up, cannot beat the best packing so
 * far, when that relaxation is proven solved (its last column search was not cut short at its node
 * limit; otherwise the value may lie above what the items left need). Up to {@link #MAX_DIVES}
 * dives run, each with its own perturbation of the right-hand side and all columns met so far,
 * until one reaches the first relaxation's value rounded up, when that value is a lower bound (its
 * last column search was not cut short).
 *
 * <p>Effort is counted in steps, one per inner-loop operation: per basis entry a pivot or a
 * fresh inversion updates, per column entry priced or weighted, per node and bound term of the
 * column search.
 * When the allowance runs out, the relaxation in hand is rounded (its columns, most used first,
 * while their items are all left) and the rest is placed first fit. Ties are broken by
 * index; the right-hand side is perturbed by tiny amounts from a {@link SplittableRandom} with a
 * fixed seed, against the cycling of degenerate pivots. Same input, same packing. A heuristic: it
 * never claims that a packing does not exist.
 */
final class ColumnDive {
  /** Largest number of distinct item vectors the dive is tried on (its basis is m × m). */
  static final int MAX_TYPES = 1_000;

  /**
   * Largest number of items the dive is tried on: it solves one relaxation per round and a
   * round fixes at least one bin.
   */
  static final int MAX_ITEMS = 5_000;

  /**
   * The dive's allowance per step of the packer's budget. Its steps are inner-loop operations
   * (one basis entry updated, one column entry priced or weighted, one node or bound term of the
   * column search), far cheaper than a step of the local search, so the default budget lets it
   * spend 2 billion of them: at most about 1.5 to 4 seconds on 400 to 500 distinct items (a bound
   * term costs more time than a basis entry), far less on fewer.
   */
  static final long STEPS_PER_BUDGET_STEP = 1_000;

  /** Dives at most, each from all items with its own perturbation. */
  static final int MAX_DIVES = 8;

  /** Nodes one column search may spend before it returns what it found. */
  static final long PRICE_NODES = 200_000;

  /** Columns one column search may add (the best it met). */
  static final int COLUMNS_PER_SEARCH = 20;

  private static final double EPS = 1e-9;

  /**
   * Taken off a relaxation's value before rounding it up to whole bins: the perturbation of the
   * right-hand side (at most 1e-7 of each row) and round-off may lift it a little above a whole
   * number.
   */
  private static final double ROUND_OFF = 1e-3;

  /** Candidates that each start one bin of the quick column search. */
  static final int GREEDY_SEEDS = 30;

  /** Outcome: the bin of each item, or null when the dive found nothing better; steps spent. */
  record Result(int[] binOf, long steps) {}

  private final int d;
  private final long[] cap;
  /** Demands per type, flat {@code w[t * d + k]}. */
  private final long[] w;
  private final int types;
  private final double[] norm;
  /** Every column met so far, by content. */
  private final Map<Column, Boolean> known = new HashMap<>();
  private final List<Column> pool = new ArrayList<>();
  private SplittableRandom random;
  /** The relaxation's value over all items, once solved (a bound unless pricing was cut short). */
  private double rootValue = -1;
  private final long allowance;
  private final long seed;
  private long steps;
  private Progress progress = Progress.NONE;
  /** Whether {@link #rootValue} is a lower bound (no column search was cut short). */
  private boolean rootIsBound;

  /** A bin's content: distinct types in increasing order and how many of each. */
  record Column(int[] type, int[] mult) {
    @Override
    public boolean equals(Object o) {
      return o instanceof Column c && Arrays.equals(type, c.type) && Arrays.equals(mult, c.mult);
    }

    @Override
    public int hashCode() {
      return 31 * Arrays.hashCode(type) + Arrays.hashCode(mult);
    }
  }

  private ColumnDive(int d, long[] cap, long[] w, int types, long allowance, long seed) {
    this.d = d;
    this.cap = cap;
    this.w = w;
    this.types = types;
    this.allowance = allowance;
    this.seed = seed;
    this.random = new SplittableRandom(seed);
    this.norm = new double[types];
    for (int t = 0; t < types; t++) {
      double s = 0;
      for (int k = 0; k < d; k++) {
        s += (double) w[t * d + k] / cap[k];
      }
      norm[t] = s;
    }
  }

  /**
   * Dives for a packing in fewer bins than {@code inHand}.
   *
   * @param d dimensions (every capacity above zero)
   * @param cap capacity per dimension
   * @param w demands per type, flat {@code w[t * d + k]}; every type fits an empty bin
   * @param count items of each type
   * @param members the item indices of each type
   * @param typeOf the type of each item
   * @param inHand the packing in hand (bin of each item), whose bins are the first columns
   * @param allowance steps the dive may spend
   * @param seed seed of the perturbation
   * @param progress told the steps spent of the allowance after each relaxation solved, and the
   *     whole allowance when the dive ends
   */
  static Result dive(int d, long[] cap, long[] w, int[] count, int[][] members, int[] typeOf,
      int[] inHand, long allowance, long seed, Progress progress) {
    ColumnDive cd = new ColumnDive(d, cap, w, count.length, allowance, seed);
    cd.progress = progress;
    try {
      return cd.dive(members, typeOf, inHand, count);
    } finally {
      progress.update(Progress.Phase.DIVE, allowance, allowance);
    }
  }

  private Result dive(int[][] members, int[] typeOf, int[] inHand, int[] count) {
    int n = typeOf.length;
    int toBeat = 0;
    for (int b : inHand) {
      toBeat = Math.max(toBeat, b + 1);
    }
    // The bins in hand are good columns to start from.
    List<Map<Integer, Integer>> contents = new ArrayList<>();
    for (int b = 0; b < toBeat; b++) {
      contents.add(new TreeMap<>());
    }
    for (int i = 0; i < n; i++) {
      contents.get(inHand[i]).merge(typeOf[i], 1, Integer::sum);
    }
    for (Map<Integer, Integer> c : contents) {
      if (!c.isEmpty()) {
        remember(columnOf(c));
      }
    }
    // Dives differ by the perturbation alone; the columns met carry over from one to the next.
    List<Column> bins = null;
    int target = toBeat;
    for (int attempt = 0; attempt < MAX_DIVES && steps < allowance; attempt++) {
      random = new SplittableRandom(seed + attempt);
      List<Column> found = run(count.clone(), target);
      if (found != null) {
        bins = found;
        target = found.size();
      }
      if (rootValue >= 0 && rootIsBound && Math.ceil(rootValue - ROUND_OFF) >= target) {
        break;
      }
    }
    if (bins == null) {
      return new Result(null, steps);
    }
    int[] binOf = new int[n];
    Arrays.fill(binOf, -1);
    int[] next = new int[count.length];
    for (int b = 0; b < bins.size(); b++) {
      Column c = bins.get(b);
      for (int j = 0; j < c.type.length; j++) {
        int t = c.type[j];
        for (int m = 0; m < c.mult[j]; m++) {
          binOf[members[t][next[t]++]] = b;
        }
      }
    }
    for (int b : binOf) {
      if (b < 0) {
        throw new IllegalStateException("the dive left an item without a bin");
      }
    }
    return new Result(binOf, steps);
  }

  /** The bins of the dive, or null when it gives up. */
  private List<Column> run(int[] left, int toBeat) {
    List<Column> fixed = new ArrayList<>();
    while (true) {
      int[] rows = activeTypes(left);
      if (rows.length == 0) {
        return fixed.size() < toBeat ? fixed : null;
      }
      Lp lp = new Lp(rows, left);
      if (!lp.solve()) {
        // Out of allowance: round what the relaxation has so far and place the rest first fit.
        return finish(lp, left, fixed, toBeat);
      }
      double z = lp.objective();
      progress.update(Progress.Phase.DIVE, Math.min(steps, allowance), allowance);
      if (fixed.isEmpty() && rootValue < 0) {
        rootIsBound = !lp.cut;
        rootValue = z;
      }
      // Only a relaxation proven solved bounds the bins still needed; one whose column search
      // was cut short may lie above what the items left need, so the dive goes on.
      if (!lp.cut && fixed.size() + Math.ceil(z - ROUND_OFF) >= toBeat) {
        return null;
      }
      // Fix the columns used a whole number of times; when none is, the one used most.
      List<Column> fix = new ArrayList<>();
      List<Integer> copies = new ArrayList<>();
      int most = -1;
      double mostX = -1;
      for (int r = 0; r < lp.m; r++) {
        int j = lp.basis[r];
        if (j < 0) {
          continue;
        }
        double x = lp.xb[r];
        int whole = (int) Math.floor(x + 1e-6);
        if (whole >= 1) {
          fix.add(lp.cols.get(j));
          copies.add(whole);
        } else if (x > mostX + EPS) {
          mostX = x;
          most = j;
        }
      }
      if (fix.isEmpty()) {
        if (most < 0) {
          return null;
        }
        fix.add(lp.cols.get(most));
        copies.add(1);
      }
      for (int f = 0; f < fix.size(); f++) {
        for (int c = 0; c < copies.get(f); c++) {
          Column clipped = clip(fix.get(f), left);
          if (clipped == null) {
            break;
          }
          for (int j = 0; j < clipped.type.length; j++) {
            left[clipped.type[j]] -= clipped.mult[j];
          }
          fixed.add(clipped);
          if (fixed.size() >= toBeat) {
            return null;
          }
        }
      }
    }
  }

  /**
   * Completes the dive without further relaxations: the columns of the current basis, most used
   * first, while their items are all left, then the items still left first fit, largest first.
   * Returns the bins, or null when they are not fewer than {@code toBeat}.
   */
  private List<Column> finish(Lp lp, int[] left, List<Column> fixed, int toBeat) {
    Integer[] rows = new Integer[lp.m];
    for (int r = 0; r < lp.m; r++) {
      rows[r] = r;
    }
    Arrays.sort(rows, (p, q) -> {
      int cmp = Double.compare(lp.xb[q], lp.xb[p]);
      return cmp != 0 ? cmp : Integer.compare(p, q);
    });
    for (int r : rows) {
      int j = lp.basis[r];
      if (j < 0 || lp.xb[r] <= EPS) {
        continue;
      }
      Column c = lp.cols.get(j);
      while (fixed.size() < toBeat && whole(c, left)) {
        for (int i = 0; i < c.type.length; i++) {
          left[c.type[i]] -= c.mult[i];
        }
        fixed.add(c);
        if (lp.xb[r] < 1 + 1e-6 || !whole(c, left)) {
          break;
        }
      }
    }
    // First fit, largest first (by the sum of normalised demands), over new bins.
    Integer[] order = new Integer[types];
    for (int t = 0; t < types; t++) {
      order[t] = t;
    }
    Arrays.sort(order, (p, q) -> {
      int cmp = Double.compare(norm[q], norm[p]);
      return cmp != 0 ? cmp : Integer.compare(p, q);
    });
    List<long[]> room = new ArrayList<>();
    List<Map<Integer, Integer>> content = new ArrayList<>();
    for (int t : order) {
      for (int c = 0; c < left[t]; c++) {
        steps += room.size() + 1;
        int at = -1;
        for (int b = 0; b < room.size() && at < 0; b++) {
          boolean fits = true;
          for (int k = 0; k < d && fits; k++) {
            fits = w[t * d + k] <= room.get(b)[k];
          }
          if (fits) {
            at = b;
          }
        }
        if (at < 0) {
          if (fixed.size() + room.size() + 1 >= toBeat) {
            return null;
          }
          room.add(cap.clone());
          content.add(new TreeMap<>());
          at = room.size() - 1;
        }
        for (int k = 0; k < d; k++) {
          room.get(at)[k] -= w[t * d + k];
        }
        content.get(at).merge(t, 1, Integer::sum);
      }
      left[t] = 0;
    }
    for (Map<Integer, Integer> c : content) {
      fixed.add(columnOf(c));
    }
    return fixed.size() < toBeat ? fixed : null;
  }

  /** How many items of type t fit in {@code room}, at most {@code limit}. */
  private int copiesThatFit(int t, long[] room, int limit) {
    long most = limit;
    for (int k = 0; k < d; k++) {
      long wk = w[t * d + k];
      if (wk > 0) {
        most = Math.min(most, room[k] / wk);
      }
    }
    return (int) most;
  }

  /** Whether every item of the column is still left. */
  private static boolean whole(Column c, int[] left) {
    for (int i = 0; i < c.type.length; i++) {
      if (left[c.type[i]] < c.mult[i]) {
        return false;
      }
    }
    return true;
  }

  /** The column of a bin's content (type → how many). */
  static Column columnOf(Map<Integer, Integer> content) {
    int[] type = new int[content.size()];
    int[] mult = new int[content.size()];
    int j = 0;
    for (Map.Entry<Integer, Integer> e : content.entrySet()) {
      type[j] = e.getKey();
      mult[j++] = e.getValue();
    }
    return new Column(type, mult);
  }

  private int[] activeTypes(int[] left) {
    int m = 0;
    for (int t = 0; t < types; t++) {
      if (left[t] > 0) {
        m++;
      }
    }
    int[] rows = new int[m];
    m = 0;
    for (int t = 0; t < types; t++) {
      if (left[t] > 0) {
        rows[m++] = t;
      }
    }
    return rows;
  }

  /** The column restricted to the items left; null when nothing of it is left. */
  private static Column clip(Column c, int[] left) {
    int len = 0;
    for (int j = 0; j < c.type.length; j++) {
      if (left[c.type[j]] > 0) {
        len++;
      }
    }
    if (len == 0) {
      return null;
    }
    int[] type = new int[len];
    int[] mult = new int[len];
    len = 0;
    for (int j = 0; j < c.type.length; j++) {
      int t = c.type[j];
      if (left[t] > 0) {
        type[len] = t;
        mult[len++] = Math.min(c.mult[j], left[t]);
      }
    }
    return new Column(type, mult);
  }

  /** Adds a column to the pool of columns met, once. */
  private void remember(Column c) {
    if (known.putIfAbsent(c, Boolean.TRUE) == null) {
      pool.add(c);
    }
  }

  /** The restricted master problem over the types left, solved by the revised simplex method. */
  private final class Lp {
    final int m;
    final int[] typeOfRow;
    final int[] rowOfType;
    final double[] b;
    final List<Column> cols = new ArrayList<>();
    /** Rows of each column, parallel to {@code cols}. */
    final List<int[]> colRows = new ArrayList<>();
    final Map<Column, Integer> inLp = new HashMap<>();
    final List<Boolean> basic = new ArrayList<>();
    final boolean[] surplusIn;
    /**
     * Whether the last column search stopped at its node limit: the relaxation is then not proven
     * solved, and its value is no lower bound.
     */
    boolean cut;
    /** Basic variable of each row: a column index, or −(row + 1) for that row's surplus. */
    final int[] basis;
    final double[][] binv;
    final double[] xb;
    final double[] y;
    final int[] left;
    int pivotsSinceRefactor;
    boolean dualsFresh;

    Lp(int[] rows, int[] left) {
      this.m = rows.length;
      this.typeOfRow = rows;
      this.left = left;
      this.rowOfType = new int[types];
      Arrays.fill(rowOfType, -1);
      for (int r = 0; r < m; r++) {
        rowOfType[rows[r]] = r;
      }
      this.b = new double[m];
      for (int r = 0; r < m; r++) {
        // A tiny perturbation keeps degenerate pivots from cycling.
        b[r] = left[rows[r]] * (1 + 1e-7 * random.nextDouble());
      }
      this.basis = new int[m];
      this.binv = new double[m][m];
      this.xb = new double[m];
      this.y = new double[m];
      this.surplusIn = new boolean[m];
      this.surplusWeight = new double[m];
      Arrays.fill(surplusWeight, 1);
      // Start: each type alone, as many of it as fit one bin.
      for (int r = 0; r < m; r++) {
        int t = rows[r];
        int k = Math.min(left[t], fitAlone(t));
        int j = add(new Column(new int[] {t}, new int[] {k}));
        basis[r] = j;
        basic.set(j, true);
        binv[r][r] = 1.0 / k;
        xb[r] = b[r] / k;
      }
      for (Column c : pool) {
        Column clipped = clip(c, left);
        steps += 1 + c.type.length;
        if (clipped != null) {
          add(clipped);
        }
      }
    }

    private int fitAlone(int t) {
      return Math.max(1, copiesThatFit(t, cap, Integer.MAX_VALUE));
    }

    /** Adds a column (once); returns its index. */
    private int add(Column c) {
      Integer seen = inLp.putIfAbsent(c, cols.size());
      if (seen != null) {
        return seen;
      }
      int[] r = new int[c.type.length];
      for (int i = 0; i < r.length; i++) {
        r[i] = rowOfType[c.type[i]];
      }
      cols.add(c);
      colRows.add(r);
      basic.add(false);
      return cols.size() - 1;
    }

    double objective() {
      double z = 0;
      for (int r = 0; r < m; r++) {
        if (basis[r] >= 0) {
          z += xb[r];
        }
      }
      return z;
    }

    /** Solves the relaxation; false when the allowance runs out first. */
    boolean solve() {
      double[] alpha = new double[m];
      while (true) {
        if (steps >= allowance) {
          return false;
        }
        if (!dualsFresh) {
          duals();
          dualsFresh = true;
        }
        int enter = Integer.MIN_VALUE;
        double bestRc = 0;
        double bestScore = 0;
        growWeights();
        for (int j = 0; j < cols.size(); j++) {
          if (basic.get(j)) {
            continue;
          }
          double rc = 1;
          int[] r = colRows.get(j);
          int[] mult = cols.get(j).mult;
          for (int i = 0; i < r.length; i++) {
            rc -= y[r[i]] * mult[i];
          }
          steps += 1 + r.length;
          if (rc < -EPS && rc * rc > bestScore * colWeight[j]) {
            bestScore = rc * rc / colWeight[j];
            bestRc = rc;
            enter = j;
          }
        }
        steps += m;
        for (int r = 0; r < m; r++) {
          // A surplus enters when its dual is negative (over-covering a row pays).
          if (!surplusIn[r] && y[r] < -EPS && y[r] * y[r] > bestScore * surplusWeight[r]) {
            bestScore = y[r] * y[r] / surplusWeight[r];
            bestRc = y[r];
            enter = -(r + 1);
          }
        }
        if (enter == Integer.MIN_VALUE) {
          List<Column> found = price();
          if (found.isEmpty()) {
            return true;
          }
          for (Column c : found) {
            add(c);
            remember(c);
          }
          continue;
        }
        column(enter, alpha);
        int leave = -1;
        double bestRatio = Double.MAX_VALUE;
        for (int r = 0; r < m; r++) {
          if (alpha[r] > EPS) {
            double ratio = Math.max(0, xb[r]) / alpha[r];
            if (ratio < bestRatio - 1e-12
                || (ratio <= bestRatio + 1e-12 && leave >= 0 && alpha[r] > alpha[leave])) {
              bestRatio = ratio;
              leave = r;
            }
          }
        }
        if (leave < 0) {
          // Cannot happen with positive costs; give up rather than loop.
          return false;
        }
        int out = basis[leave];
        double enterWeight = enter >= 0 ? colWeight[enter] : surplusWeight[-enter - 1];
        double pivotElement = alpha[leave];
        pivot(enter, leave, alpha, bestRatio);
        updateWeights(enter, out, leave, enterWeight, pivotElement);
        if (pivotsSinceRefactor == 0) {
          dualsFresh = false;
        } else {
          // y ← y + d_q · (row p of the new B⁻¹).
          double[] prow = binv[leave];
          for (int i = 0; i < m; i++) {
            y[i] += bestRc * prow[i];
          }
          steps += m;
        }
      }
    }

    /** Reference weights of the pricing (one per column, one per surplus); 1 at the start. */
    private double[] colWeight = new double[0];
    private final double[] surplusWeight;

    private void growWeights() {
      int old = colWeight.length;
      if (old < cols.size()) {
        colWeight = Arrays.copyOf(colWeight, Math.max(cols.size(), old * 2));
        Arrays.fill(colWeight, old, colWeight.length, 1);
      }
    }

    /**
     * Devex update after a pivot: each non-basic weight grows to at least its pivot-row entry
     * squared times the entering weight; the leaving variable gets the entering weight over the
     * pivot element squared. Reset to 1 when weights grow too large.
     */
    private void updateWeights(int enter, int out, int leave, double enterWeight, double pivot) {
      double[] prow = binv[leave];
      double most = 0;
      for (int j = 0; j < cols.size(); j++) {
        if (basic.get(j)) {
          continue;
        }
        int[] r = colRows.get(j);
        int[] mult = cols.get(j).mult;
        double a = 0;
        for (int i = 0; i < r.length; i++) {
          a += prow[r[i]] * mult[i];
        }
        steps += 1 + r.length;
        double cand = a * a * enterWeight;
        if (cand > colWeight[j]) {
          colWeight[j] = cand;
        }
        most = Math.max(most, colWeight[j]);
      }
      for (int r = 0; r < m; r++) {
        if (!surplusIn[r]) {
          double cand = prow[r] * prow[r] * enterWeight;
          if (cand > surplusWeight[r]) {
            surplusWeight[r] = cand;
          }
        }
      }
      steps += m;
      double leaving = Math.max(enterWeight / (pivot * pivot), 1);
      if (out >= 0) {
        colWeight[out] = leaving;
      } else {
        surplusWeight[-out - 1] = leaving;
      }
      if (most > 1e6) {
        Arrays.fill(colWeight, 1);
        Arrays.fill(surplusWeight, 1);
      }
    }

    private void duals() {
      Arrays.fill(y, 0);
      for (int r = 0; r < m; r++) {
        if (basis[r] >= 0) {
          double[] row = binv[r];
          for (int i = 0; i < m; i++) {
            y[i] += row[i];
          }
          steps += m;
        }
      }
      steps += m;
    }

    /** B⁻¹ times the entering column. */
    private void column(int enter, double[] alpha) {
      if (enter < 0) {
        int row = -enter - 1;
        for (int r = 0; r < m; r++) {
          alpha[r] = -binv[r][row];
        }
        steps += m;
        return;
      }
      int[] rs = colRows.get(enter);
      int[] mult = cols.get(enter).mult;
      for (int r = 0; r < m; r++) {
        double s = 0;
        double[] row = binv[r];
        for (int i = 0; i < rs.length; i++) {
          s += row[rs[i]] * mult[i];
        }
        alpha[r] = s;
      }
      steps += (long) m * rs.length;
    }

    private void pivot(int enter, int leave, double[] alpha, double theta) {
      for (int r = 0; r < m; r++) {
        xb[r] -= theta * alpha[r];
      }
      xb[leave] = theta;
      double[] prow = binv[leave];
      double a = alpha[leave];
      for (int i = 0; i < m; i++) {
        prow[i] /= a;
      }
      for (int r = 0; r < m; r++) {
        if (r == leave || alpha[r] == 0) {
          continue;
        }
        double f = alpha[r];
        double[] row = binv[r];
        for (int i = 0; i < m; i++) {
          row[i] -= f * prow[i];
        }
        steps += m;
      }
      steps += 3L * m;
      int out = basis[leave];
      if (out >= 0) {
        basic.set(out, false);
      } else {
        surplusIn[-out - 1] = false;
      }
      basis[leave] = enter;
      if (enter >= 0) {
        basic.set(enter, true);
      } else {
        surplusIn[-enter - 1] = true;
      }
      if (++pivotsSinceRefactor >= Math.max(100, m)) {
        refactor();
      }
    }

    /** Inverts the basis afresh (Gauss–Jordan with partial pivoting) and recomputes x_B. */
    private void refactor() {
      pivotsSinceRefactor = 0;
      double[][] a = new double[m][2 * m];
      for (int r = 0; r < m; r++) {
        int j = basis[r];
        if (j < 0) {
          a[-j - 1][r] = -1;
        } else {
          int[] rs = colRows.get(j);
          int[] mult = cols.get(j).mult;
          for (int i = 0; i < rs.length; i++) {
            a[rs[i]][r] = mult[i];
          }
        }
        a[r][m + r] = 1;
      }
      for (int c = 0; c < m; c++) {
        int p = c;
        for (int r = c + 1; r < m; r++) {
          if (Math.abs(a[r][c]) > Math.abs(a[p][c])) {
            p = r;
          }
        }
        if (Math.abs(a[p][c]) < 1e-12) {
          return; // singular by round-off: keep the updated inverse
        }
        double[] tmp = a[p];
        a[p] = a[c];
        a[c] = tmp;
        double piv = a[c][c];
        for (int i = c; i < 2 * m; i++) {
          a[c][i] /= piv;
        }
        for (int r = 0; r < m; r++) {
          if (r != c && a[r][c] != 0) {
            double f = a[r][c];
            for (int i = c; i < 2 * m; i++) {
              a[r][i] -= f * a[c][i];
            }
            steps += 2L * m - c;
          }
        }
      }
      steps += 3L * m * m;
      for (int r = 0; r < m; r++) {
        System.arraycopy(a[r], m, binv[r], 0, m);
      }
      for (int r = 0; r < m; r++) {
        double s = 0;
        for (int i = 0; i < m; i++) {
          s += binv[r][i] * b[i];
        }
        xb[r] = s;
      }
    }

    // --- column search -----------------------------------------------------------------------

    private int[] cand;
    private double[] candVal;
    /** Per candidate: normalised size, items left, demand per dimension ({@code [k * c + j]}). */
    private double[] candNorm;
    private int[] candLeft;
    private long[] candW;
    private long[] room;
    private int[] pick;
    private int[] pickMult;
    private int depth;
    private long nodes;
    private long boundWork;
    private List<Column> found;
    private List<Double> foundVal;
    private double threshold;

    /** Columns of negative reduced cost under the current duals, best first (may be empty). */
    private List<Column> price() {
      int c = 0;
      cand = new int[m];
      for (int r = 0; r < m; r++) {
        if (y[r] > EPS) {
          cand[c++] = r;
        }
      }
      Integer[] order = new Integer[c];
      for (int i = 0; i < c; i++) {
        order[i] = cand[i];
      }
      Arrays.sort(order, (p, q) -> {
        int cmp = Double.compare(ratio(q), ratio(p));
        return cmp != 0 ? cmp : Integer.compare(p, q);
      });
      steps += m + sortCost(c);
      cand = new int[c];
      candVal = new double[c];
      candNorm = new double[c];
      candLeft = new int[c];
      candW = new long[d * c];
      for (int i = 0; i < c; i++) {
        cand[i] = order[i];
        candVal[i] = y[order[i]];
        int t = typeOfRow[order[i]];
        candNorm[i] = norm[t];
        candLeft[i] = left[t];
        for (int k = 0; k < d; k++) {
          candW[k * c + i] = w[t * d + k];
        }
      }
      room = cap.clone();
      pick = new int[c];
      pickMult = new int[c];
      depth = 0;
      nodes = 0;
      found = new ArrayList<>();
      foundVal = new ArrayList<>();
      threshold = 1 + 1e-7;
      boundWork = 0;
      greedy();
      if (found.isEmpty()) {
        orderByDimension();
        search(0, 0);
        cut = nodes >= PRICE_NODES;
      }
      steps += nodes + boundWork;
      return found;
    }

    private static long sortCost(int c) {
      return (long) c * (64 - Long.numberOfLeadingZeros(c + 1L));
    }

    /**
     * The candidates of each dimension by demand in that dimension, smallest first, and in the
     * order of dual value per unit of that dimension.
     */
    private void orderByDimension() {
      byDim = new int[d][];
      smallest = new int[d][];
      for (int k = 0; k < d; k++) {
        final int dim = k;
        smallest[k] = sortedCandidates((p, q) ->
            Long.compare(w[typeOfRow[cand[p]] * d + dim], w[typeOfRow[cand[q]] * d + dim]));
      }
      for (int k = 0; k < d; k++) {
        final int dim = k;
        byDim[k] = sortedCandidates((p, q) -> {
          long wp = w[typeOfRow[cand[p]] * d + dim];
          long wq = w[typeOfRow[cand[q]] * d + dim];
          // candVal[p] / wp against candVal[q] / wq, zero demand first.
          return Double.compare(candVal[q] * wp, candVal[p] * wq);
        });
      }
    }

    /** Candidate positions sorted by {@code order}, ties by position; counts the sort's steps. */
    private int[] sortedCandidates(Comparator<Integer> order) {
      int c = cand.length;
      steps += sortCost(c);
      Integer[] o = new Integer[c];
      for (int i = 0; i < c; i++) {
        o[i] = i;
      }
      Arrays.sort(o, order.thenComparing(Comparator.naturalOrder()));
      int[] sorted = new int[c];
      for (int i = 0; i < c; i++) {
        sorted[i] = o[i];
      }
      return sorted;
    }

    private double ratio(int r) {
      double s = norm[typeOfRow[r]];
      return s <= 0 ? Double.MAX_VALUE : y[r] / s;
    }

    /** Candidate positions per dimension, by dual value per unit of that dimension, best first. */
    private int[][] byDim;

    /** Upper bound on what candidates from index i on can add within the room left. */
    private double bound(int i, double need) {
      double add = countBound(i);
      if (add <= need) {
        return add;
      }
      return Math.min(add, knapsackBound(i, need));
    }

    /**
     * Largest count of items in one bin for which {@link #countBound} is worked out; beyond it
     * that bound is skipped (it would be weak and slow).
     */
    static final int COUNT_BOUND_MAX = 16;

    /** Candidate positions per dimension, smallest demand first (for {@link #countBound}). */
    private int[][] smallest;

    private final double[] topValues = new double[COUNT_BOUND_MAX + 1];

    /**
     * Bound by count: no more items fit the room left than the smallest candidates of any one
     * dimension do, so the largest values of that many candidates from i on (copies counted)
     * bound what can be added; {@link Double#MAX_VALUE} when the count exceeds {@link
     * #COUNT_BOUND_MAX}.
     */
    private double countBound(int i) {
      int most = Integer.MAX_VALUE;
      for (int k = 0; k < d && most > 0; k++) {
        long roomK = room[k];
        int fit = 0;
        int base = k * cand.length;
        for (int j : smallest[k]) {
          boundWork++;
          long wk = candW[base + j];
          int avail = candLeft[j];
          long copies = wk == 0 ? avail : Math.min(avail, roomK / wk);
          fit += (int) Math.min(copies, COUNT_BOUND_MAX + 1L);
          roomK -= copies * wk;
          if (copies < avail || fit > COUNT_BOUND_MAX) {
            break;
          }
        }
        most = Math.min(most, fit);
      }
      if (most > COUNT_BOUND_MAX) {
        return Double.MAX_VALUE;
      }
      // The `most` largest values from i on, copies counted, in a small array sorted downwards.
      double[] top = topValues;
      int filled = 0;
      for (int j = i; j < cand.length && most > 0; j++) {
        boundWork++;
        double v = candVal[j];
        int copies = Math.min(candLeft[j], most);
        for (int q = 0; q < copies; q++) {
          int at;
          if (filled < most) {
            at = filled++;
          } else if (v > top[most - 1]) {
            at = most - 1;
          } else {
            break;
          }
          while (at > 0 && top[at - 1] < v) {
            top[at] = top[at - 1];
            at--;
          }
          top[at] = v;
        }
      }
      double add = 0;
      for (int q = 0; q < filled; q++) {
        add += top[q];
      }
      return add;
    }

    /** The fractional knapsack bounds: over the summed room, then each dimension alone. */
    private double knapsackBound(int i, double need) {
      double roomSum = 0;
      for (int k = 0; k < d; k++) {
        roomSum += (double) room[k] / cap[k];
      }
      double add = 0;
      for (int j = i; j < cand.length; j++) {
        boundWork++;
        double s = candNorm[j];
        int avail = candLeft[j];
        if (s <= 0) {
          add += candVal[j] * avail;
          continue;
        }
        double take = Math.min(avail, roomSum / s);
        add += candVal[j] * take;
        roomSum -= take * s;
        if (roomSum <= 0) {
          break;
        }
      }
      if (add <= need) {
        return add;
      }
      // Each dimension alone: the fractional knapsack of that dimension's room.
      for (int k = 0; k < d; k++) {
        double roomK = room[k];
        double addK = 0;
        int base = k * cand.length;
        for (int j : byDim[k]) {
          boundWork++;
          if (j < i) {
            continue;
          }
          long wk = candW[base + j];
          int avail = candLeft[j];
          if (wk == 0) {
            addK += candVal[j] * avail;
            continue;
          }
          double take = Math.min(avail, roomK / wk);
          addK += candVal[j] * take;
          roomK -= take * wk;
          if (roomK <= 0) {
            break;
          }
        }
        add = Math.min(add, addK);
        if (add <= need) {
          return add;
        }
      }
      return add;
    }

    /**
     * The quick way first: each of the first {@link #GREEDY_SEEDS} candidates starts a bin that
     * the others then fill in their order, as many of each as fit.
     */
    private void greedy() {
      for (int s0 = 0; s0 < Math.min(GREEDY_SEEDS, cand.length); s0++) {
        depth = 0;
        System.arraycopy(cap, 0, room, 0, d);
        double value = 0;
        for (int step = 0; step <= cand.length; step++) {
          int j = step == 0 ? s0 : step - 1;
          if (step > 0 && j == s0) {
            continue;
          }
          nodes++;
          int t = typeOfRow[cand[j]];
          int most = copiesThatFit(t, room, left[t]);
          if (most <= 0) {
            continue;
          }
          for (int k = 0; k < d; k++) {
            room[k] -= most * w[t * d + k];
          }
          pick[depth] = t;
          pickMult[depth++] = most;
          value += most * candVal[j];
        }
        if (value > threshold) {
          record(value);
        }
      }
      depth = 0;
      System.arraycopy(cap, 0, room, 0, d);
    }

    private void search(int from, double value) {
      for (int j = from; j < cand.length; j++) {
        if (nodes >= PRICE_NODES) {
          return;
        }
        nodes++;
        if (value + bound(j, threshold - value) <= threshold) {
          return;
        }
        int r = cand[j];
        int t = typeOfRow[r];
        int most = copiesThatFit(t, room, left[t]);
        for (int q = most; q >= 1; q--) {
          for (int k = 0; k < d; k++) {
            room[k] -= q * w[t * d + k];
          }
          pick[depth] = t;
          pickMult[depth] = q;
          depth++;
          double v = value + q * candVal[j];
          if (v > threshold) {
            record(v);
          }
          search(j + 1, v);
          depth--;
          for (int k = 0; k < d; k++) {
            room[k] += q * w[t * d + k];
          }
        }
      }
    }

    private void record(double v) {
      steps += 8 + sortCost(depth) + found.size();
      int[] type = new int[depth];
      int[] mult = new int[depth];
      Integer[] ord = new Integer[depth];
      for (int i = 0; i < depth; i++) {
        ord[i] = i;
      }
      Arrays.sort(ord, (p, q) -> Integer.compare(pick[p], pick[q]));
      for (int i = 0; i < depth; i++) {
        type[i] = pick[ord[i]];
        mult[i] = pickMult[ord[i]];
      }
      Column col = new Column(type, mult);
      if (inLp.containsKey(col)) {
        return;
      }
      int at = 0;
      while (at < foundVal.size() && foundVal.get(at) >= v) {
        at++;
      }
      if (at >= COLUMNS_PER_SEARCH) {
        return;
      }
      found.add(at, col);
      foundVal.add(at, v);
      if (found.size() > COLUMNS_PER_SEARCH) {
        found.remove(found.size() - 1);
        foundVal.remove(foundVal.size() - 1);
      }
      if (found.size() == COLUMNS_PER_SEARCH) {
        threshold = Math.max(threshold, foundVal.get(foundVal.size() - 1));
      }
    }
  }
}
