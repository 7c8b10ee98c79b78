package dev.numafit.bench;

import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.VectorPacker;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * Packing quality on the published bin-packing instances in ../shared/bench (relative to the
 * project root): per set, how many instances reach the known value, how many go below a
 * best-known (not proven) value, the mean gap (bins − known) / known, and the time. A packing
 * below a proven optimum or over capacity is reported as an error. Run: {@code bench/quality.sh
 * [BENCH_DIR] [STEP_BUDGET]}.
 */
public final class PackingQuality {
  private PackingQuality() {}

  private static final class SetStats {
    int instances;
    int reached;
    int belowBestKnown;
    int errors;
    double gapSum;
    long nanos;
    long steps;
  }

  public static void main(String[] args) throws IOException {
    Path root = Path.of(args.length > 0 ? args[0] : "../shared/bench");
    long budget = args.length > 1 ? Long.parseLong(args[1]) : VectorPacker.DEFAULT_STEP_BUDGET;
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
    System.out.println("step budget " + budget);
    System.out.printf(Locale.ROOT, "%-14s %9s %8s %9s %9s %8s %10s%n",
        "set", "instances", "reached", "improved", "mean gap", "time ms", "steps");
    for (Path index : indexes) {
      if (!Files.isRegularFile(index)) {
        System.out.println("missing " + index + ", skipped");
        continue;
      }
      Map<String, SetStats> bySet = new TreeMap<>();
      List<String> lines = Files.readAllLines(index);
      List<String> header = List.of(lines.get(0).split(","));
      int setCol = header.indexOf("set");
      int fileCol = header.indexOf("file");
      int knownCol = header.indexOf("known_value");
      int provenCol = header.indexOf("proven_optimal");
      for (String line : lines.subList(1, lines.size())) {
        String[] c = line.split(",", -1);
        Instance in = Instance.read(root.resolve(c[fileCol]));
        int known = Integer.parseInt(c[knownCol]);
        boolean proven = Boolean.parseBoolean(c[provenCol]);
        SetStats s = bySet.computeIfAbsent(c[setCol], k -> new SetStats());
        long t0 = System.nanoTime();
        Packing p = new VectorPacker(budget).pack(in.items, in.capacity);
        s.nanos += System.nanoTime() - t0;
        s.steps += p.steps();
        s.instances++;
        boolean feasible = feasible(p, in);
        int lb = LowerBound.of(in.items, in.capacity);
        if (!feasible || (proven && p.bins() < known) || (proven && lb > known)) {
          s.errors++;
          System.out.println("ERROR " + c[fileCol] + ": bins " + p.bins() + ", lower bound " + lb
              + ", known " + known + (feasible ? "" : ", over capacity"));
        }
        if (p.bins() <= known) {
          s.reached++;
        }
        if (!proven && p.bins() < known) {
          s.belowBestKnown++;
        }
        s.gapSum += (p.bins() - known) / (double) known;
      }
      bySet.forEach(
          (name, s) ->
              System.out.printf(Locale.ROOT, "%-14s %9d %8d %9d %9.4f %8d %10d%s%n",
                  name, s.instances, s.reached, s.belowBestKnown, s.gapSum / s.instances,
                  s.nanos / 1_000_000, s.steps, s.errors > 0 ? "  ERRORS " + s.errors : ""));
    }
    System.out.println("reached: bins <= known value; improved: below a best-known (unproven)"
        + " value; gap: mean of (bins - known) / known");
  }

  private static boolean feasible(Packing p, Instance in) {
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
  private record Instance(long[][] items, long[] capacity) {
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
