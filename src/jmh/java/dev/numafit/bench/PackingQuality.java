package dev.numafit.bench;

import dev.numafit.cli.Main;
import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.VectorPacker;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Packing quality on the published bin-packing instances in ../shared/bench (relative to the
 * project root).
 *
 * <p>Per set and per half (the even and the odd positions among the set's rows in its index CSV,
 * counted from 0 in file order; the packer's settings were tuned on the even half only): how many
 * instances reach the known value, how many go below a best-known (not proven) value, the mean gap
 * (bins − known) / known, the time and the steps; plain first-fit-decreasing (the packer with a
 * budget of 0 steps: its first pass alone) beside every figure, from the same run. A packing below
 * a proven optimum, over capacity, or with a lower bound above the known value is an error.
 *
 * <p>With {@code --plan-every N}, every N-th instance (by position in the index CSV, from 0) is
 * also written as pods (dimensions as cpu in whole cores, memory in bytes and the extended
 * resource {@code vector.example.com/dim3}) and run through {@code numafit plan --worker ...
 * --kubelet-reserve none --max-pods n} in process; the worker count it reports must equal the
 * direct packer's.
 *
 * <p>Run: {@code bench/quality.sh [BENCH_DIR] [STEP_BUDGET] [--sets a,b] [--every-large N]
 * [--plan-every N]}. {@code --every-large N} keeps every N-th instance (position from 0) of sets
 * with more than 300 instances (only Scholl here).
 */
public final class PackingQuality {
  private PackingQuality() {}

  private static final class Stats {
    int instances;
    int reached;
    int belowBestKnown;
    int errors;
    double gapSum;
    long nanos;
    long steps;
    int ffdReached;
    double ffdGapSum;
    long ffdNanos;

    String row(String name, String half) {
      return String.format(Locale.ROOT, "%-14s %-4s %5d %5d %5d %8.4f %8.4f %3d %8d %6d %11d%s",
          name, half, instances, reached, ffdReached, gapSum / instances, ffdGapSum / instances,
          belowBestKnown, nanos / 1_000_000, ffdNanos / 1_000_000, steps,
          errors > 0 ? "  ERRORS " + errors : "");
    }
  }

  public static void main(String[] args) throws IOException {
    List<String> positional = new ArrayList<>();
    List<String> sets = List.of();
    int everyLarge = 1;
    int planEvery = 0;
    for (int a = 0; a < args.length; a++) {
      switch (args[a]) {
        case "--sets" -> sets = List.of(args[++a].split(","));
        case "--every-large" -> everyLarge = Integer.parseInt(args[++a]);
        case "--plan-every" -> planEvery = Integer.parseInt(args[++a]);
        default -> positional.add(args[a]);
      }
    }
    Path root = Path.of(positional.size() > 0 ? positional.get(0) : "../shared/bench");
    long budget =
        positional.size() > 1 ? Long.parseLong(positional.get(1)) : VectorPacker.DEFAULT_STEP_BUDGET;
    List<Path> indexes =
        List.of(
            root.resolve("vector/instances_vector.csv"),
            root.resolve("vector/instances_generated_2d.csv"),
            root.resolve("1d/instances_1d.csv"));
    if (!Files.isDirectory(root) || indexes.stream().noneMatch(Files::isRegularFile)) {
      System.out.println(
          "benchmark instances not found at " + root.toAbsolutePath().normalize()
              + " (expected vector/instances_vector.csv, 1d/instances_1d.csv): nothing to measure");
      return;
    }
    System.out.println("step budget " + budget + (everyLarge > 1
        ? ", sets over 300 instances: every " + everyLarge + "th" : "")
        + (planEvery > 0 ? ", plan path: every " + planEvery + "th instance" : ""));
    System.out.printf(Locale.ROOT, "%-14s %-4s %5s %5s %5s %8s %8s %3s %8s %6s %11s%n",
        "set", "half", "inst", "reach", "ffd", "gap", "ffd gap", "imp", "ms", "ffd ms", "steps");
    int planChecked = 0;
    int planEqual = 0;
    int planDimsChanged = 0;
    for (Path index : indexes) {
      if (!Files.isRegularFile(index)) {
        System.out.println("missing " + index + ", skipped");
        continue;
      }
      Map<String, List<IndexRow>> rowsBySet = new TreeMap<>();
      for (IndexRow row : IndexRow.read(index)) {
        rowsBySet.computeIfAbsent(row.set(), k -> new ArrayList<>()).add(row);
      }
      for (Map.Entry<String, List<IndexRow>> e : rowsBySet.entrySet()) {
        if (!sets.isEmpty() && !sets.contains(e.getKey())) {
          continue;
        }
        List<IndexRow> rows = e.getValue();
        int step = rows.size() > 300 ? everyLarge : 1;
        // Halves by position in the whole set; rows per published subset where the set has them.
        Map<String, Stats[]> halves = new TreeMap<>();
        for (int r = 0; r < rows.size(); r += step) {
          IndexRow row = rows.get(r);
          Stats[] half = halves.computeIfAbsent(subsetOf(e.getKey(), row.name()),
              k -> new Stats[] {new Stats(), new Stats()});
          Instance in = Instance.read(root.resolve(row.file()));
          int known = row.known();
          boolean proven = row.proven();
          Stats s = half[r % 2];
          long t0 = System.nanoTime();
          Packing ffd = new VectorPacker(0).pack(in.items, in.capacity);
          long t1 = System.nanoTime();
          Packing p = new VectorPacker(budget).pack(in.items, in.capacity);
          long t2 = System.nanoTime();
          s.ffdNanos += t1 - t0;
          s.nanos += t2 - t1;
          s.steps += p.steps();
          s.instances++;
          boolean feasible = feasible(p, in) && feasible(ffd, in);
          int lb = LowerBound.of(in.items, in.capacity);
          if (!feasible || (proven && p.bins() < known) || (proven && lb > known)) {
            s.errors++;
            System.out.println("ERROR " + row.file() + ": bins " + p.bins() + ", lower bound " + lb
                + ", known " + known + (feasible ? "" : ", over capacity"));
          }
          if (p.bins() <= known) {
            s.reached++;
          }
          if (ffd.bins() <= known) {
            s.ffdReached++;
          }
          if (!proven && p.bins() < known) {
            s.belowBestKnown++;
          }
          s.gapSum += (p.bins() - known) / (double) known;
          s.ffdGapSum += (ffd.bins() - known) / (double) known;
          if (planEvery > 0 && r % planEvery == 0) {
            int viaPlan = viaPlan(in, budget);
            int direct = new VectorPacker(budget).pack(asPlanSees(in), planCapacity(in)).bins();
            planChecked++;
            if (viaPlan == direct) {
              planEqual++;
            } else {
              System.out.println("PLAN DIFFERS " + row.file() + ": plan " + viaPlan
                  + " workers, packer on the same dimensions " + direct + " bins");
            }
            if (direct != p.bins()) {
              planDimsChanged++;
              System.out.println("PODS COLUMN CHANGES " + row.file() + ": " + p.bins() + " bins"
                  + " without, " + direct + " with the non-binding pods limit");
            }
          }
        }
        for (Map.Entry<String, Stats[]> h : halves.entrySet()) {
          // A half with no instance (an even --every-large step keeps even positions only) is
          // left out rather than printed as NaN.
          if (h.getValue()[0].instances > 0) {
            System.out.println(h.getValue()[0].row(h.getKey(), "even"));
          }
          if (h.getValue()[1].instances > 0) {
            System.out.println(h.getValue()[1].row(h.getKey(), "odd"));
          }
        }
      }
    }
    System.out.println("inst: instances; reach / ffd: bins <= known value with the packer / with"
        + " first-fit-decreasing alone; gap: mean of (bins - known) / known; imp: below a"
        + " best-known (unproven) value; ms: packer time; steps: packer steps");
    if (planEvery > 0) {
      System.out.println("plan path: " + planEqual + " of " + planChecked
          + " instances gave the same worker count as the packer on the plan's dimensions"
          + " (cpu, memory, pods, third); the pods column changed the count on "
          + planDimsChanged);
    }
  }

  /**
   * The published subset an instance belongs to, by its name: Scholl's three data sets are told
   * apart by their naming schemes (set 1 "NxCxWx_x", set 2 "NxWxBxRx", set 3 "HARDx"); other sets
   * have one row.
   */
  static String subsetOf(String set, String name) {
    if (!set.equals("scholl")) {
      return set;
    }
    if (name.startsWith("HARD")) {
      return "scholl_3";
    }
    return name.matches("N\\dW\\dB\\dR\\d") ? "scholl_2" : "scholl_1";
  }

  /**
   * The instance as pods through {@code numafit plan}: returns the worker count the plan reports.
   */
  private static int viaPlan(Instance in, long budget) throws IOException {
    if (budget % VectorPacker.DEFAULT_STEP_BUDGET != 0) {
      throw new IllegalArgumentException("the plan path needs a budget that is a multiple of "
          + VectorPacker.DEFAULT_STEP_BUDGET + " (--effort N)");
    }
    // The plan orders resources by name; the third name sorts after "memory" so the packer sees
    // the dimensions in the same order as when called directly (normalised sums are added in
    // that order, and their last bits can break ties).
    String[] dims = {"cpu", "memory", "vector.example.com/dim3"};
    int d = in.capacity.length;
    if (d > dims.length) {
      throw new IllegalArgumentException("at most 3 dimensions through plan");
    }
    Path dir = Files.createTempDirectory("numafit-quality");
    try {
      StringBuilder y = new StringBuilder();
      for (int i = 0; i < in.items.length; i++) {
        // Zero-padded names: the plan orders workloads by name, so the packer sees the items in
        // the same order as when called directly.
        y.append("---\napiVersion: v1\nkind: Pod\nmetadata:\n  name: item-")
            .append(String.format(Locale.ROOT, "%06d", i))
            .append("\n  namespace: bench\nspec:\n  containers:\n  - name: main\n    image: bench\n")
            .append("    resources:\n      requests:\n");
        for (int k = 0; k < d; k++) {
          // cpu in whole cores (the worker's cpu must be whole vCPUs), the rest as plain counts.
          y.append("        ").append(dims[k]).append(": \"").append(in.items[i][k])
              .append("\"\n");
        }
      }
      Path file = dir.resolve("pods.yaml");
      Files.writeString(file, y.toString());
      StringBuilder worker = new StringBuilder();
      for (int k = 0; k < d; k++) {
        worker.append(k == 0 ? "" : ",").append(dims[k]).append('=').append(in.capacity[k]);
      }
      if (d == 1) {
        // --worker needs memory above zero; no pod asks for any.
        worker.append(",memory=1Gi");
      }
      String[] args = {
        "plan", "-f", file.toString(), "--worker", worker.toString(), "--kubelet-reserve", "none",
        "--max-pods", Integer.toString(in.items.length), "--effort",
        Long.toString(budget / VectorPacker.DEFAULT_STEP_BUDGET), "-o", "json"
      };
      ByteArrayOutputStream out = new ByteArrayOutputStream();
      ByteArrayOutputStream err = new ByteArrayOutputStream();
      int code =
          Main.run(args, new ByteArrayInputStream(new byte[0]),
              new PrintStream(out, true, StandardCharsets.UTF_8),
              new PrintStream(err, true, StandardCharsets.UTF_8));
      String json = out.toString(StandardCharsets.UTF_8);
      Matcher m = Pattern.compile("\"workersNeeded\"\\s*:\\s*(\\d+)").matcher(json);
      if (!m.find()) {
        throw new IllegalStateException("plan exited " + code + " without workersNeeded: "
            + err.toString(StandardCharsets.UTF_8) + json);
      }
      return Integer.parseInt(m.group(1));
    } finally {
      try (Stream<Path> files = Files.walk(dir)) {
        for (Path f : files.sorted(Comparator.reverseOrder()).toList()) {
          Files.delete(f);
        }
      }
    }
  }

  /**
   * The instance as the plan hands it to the packer: its resources in name order (cpu, memory,
   * pods, then the third dimension's name), each pod counting 1 against a pods limit of n.
   */
  private static long[][] asPlanSees(Instance in) {
    int d = in.capacity.length;
    long[][] rows = new long[in.items.length][];
    for (int i = 0; i < rows.length; i++) {
      long[] v = in.items[i];
      rows[i] = new long[] {v[0] * 1000, d > 1 ? v[1] : 0, 1, d > 2 ? v[2] : 0};
    }
    return rows;
  }

  private static long[] planCapacity(Instance in) {
    int d = in.capacity.length;
    return new long[] {
      in.capacity[0] * 1000, d > 1 ? in.capacity[1] : 1L << 30, in.items.length,
      d > 2 ? in.capacity[2] : 0
    };
  }

  /** Every item in one non-empty bin and no bin over capacity in any dimension. */
  static boolean feasible(Packing p, Instance in) {
    int[] seen = new int[p.bins()];
    for (int i = 0; i < p.items(); i++) {
      seen[p.binOf(i)]++;
    }
    if (p.items() != in.items.length || Arrays.stream(seen).anyMatch(c -> c == 0)) {
      return false;
    }
    for (long[] load : p.loads(in.items)) {
      for (int k = 0; k < in.capacity.length; k++) {
        if (load[k] > in.capacity[k]) {
          return false;
        }
      }
    }
    return true;
  }

  /** One instance: .vbp (vector) or .txt (1-D), formats in ../shared/bench/SOURCES.md. */
  record Instance(long[][] items, long[] capacity) {
    static Instance read(Path file) throws IOException {
      String[] tok = Files.readString(file).trim().split("\\s+");
      int p = 0;
      if (file.toString().endsWith(".vbp")) {
        int d = Integer.parseInt(tok[p++]);
        long[] cap = new long[d];
        for (int k = 0; k < d; k++) {
          cap[k] = Long.parseLong(tok[p++]);
        }
        int m = Integer.parseInt(tok[p++]);
        List<long[]> items = new ArrayList<>();
        for (int i = 0; i < m; i++) {
          long[] v = new long[d];
          for (int k = 0; k < d; k++) {
            v[k] = Long.parseLong(tok[p++]);
          }
          int copies = Integer.parseInt(tok[p++]);
          for (int r = 0; r < copies; r++) {
            items.add(v);
          }
        }
        return new Instance(items.toArray(new long[0][]), cap);
      }
      int n = Integer.parseInt(tok[p++]);
      long[] cap = {Long.parseLong(tok[p++])};
      long[][] items = new long[n][1];
      for (int i = 0; i < n; i++) {
        items[i][0] = Long.parseLong(tok[p++]);
      }
      return new Instance(items, cap);
    }
  }
}
