package dev.numafit.bench;

import dev.numafit.pack.ExactPacker;
import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.VectorPacker;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * The exact mode on the small published vector instances in ../shared/bench (relative to the
 * project root): the 3-dimensional Panigrahy instances with at most MAX_N items (default 60) and
 * the generated 2-dimensional smoke set. Per group (set and item count): how many instances the
 * search proved optimal within the node limit, how many end at the known value, nodes and time.
 * A packing below a proven optimum, a proof that disagrees with a known optimum or a bin over
 * capacity is reported as an error. Run: {@code bench/exact.sh [BENCH_DIR] [NODE_LIMIT] [MAX_N]}.
 */
public final class ExactQuality {
  private ExactQuality() {}

  private static final class Stats {
    int instances;
    int proved;
    int reachedKnown;
    int heuristicReached;
    int errors;
    long nodes;
    long maxNodes;
    long nanos;
    long maxNanos;
  }

  public static void main(String[] args) throws IOException {
    Path root = Path.of(args.length > 0 ? args[0] : "../shared/bench");
    long limit = args.length > 1 ? Long.parseLong(args[1]) : ExactPacker.DEFAULT_NODE_LIMIT;
    int maxN = args.length > 2 ? Integer.parseInt(args[2]) : 60;
    List<Path> indexes =
        List.of(
            root.resolve("vector/instances_vector.csv"),
            root.resolve("vector/instances_generated_2d.csv"));
    if (!Files.isDirectory(root) || indexes.stream().noneMatch(Files::isRegularFile)) {
      System.out.println(
          "benchmark instances not found at " + root.toAbsolutePath().normalize()
              + " (expected vector/instances_vector.csv): nothing to measure");
      return;
    }
    System.out.println("node limit " + limit + ", instances with at most " + maxN + " items");
    System.out.printf(Locale.ROOT, "%-22s %9s %7s %7s %9s %12s %12s %9s %9s%n",
        "group", "instances", "proved", "known", "heur=known", "mean nodes", "max nodes",
        "mean ms", "max ms");
    Map<String, Stats> byGroup = new TreeMap<>();
    for (Path index : indexes) {
      if (!Files.isRegularFile(index)) {
        System.out.println("missing " + index + ", skipped");
        continue;
      }
      for (IndexRow row : IndexRow.read(index)) {
        int n = row.items();
        if (n > maxN) {
          continue;
        }
        PackingQuality.Instance instance = PackingQuality.Instance.read(root.resolve(row.file()));
        long[][] items = instance.items();
        long[] capacity = instance.capacity();
        int known = row.known();
        boolean proven = row.proven();
        String group = row.set() + " n=" + n;
        Stats s = byGroup.computeIfAbsent(group, k -> new Stats());
        long t0 = System.nanoTime();
        Packing heuristic = new VectorPacker().pack(items, capacity);
        ExactPacker.Result r = new ExactPacker(limit).improve(items, capacity, heuristic);
        long ns = System.nanoTime() - t0;
        s.instances++;
        s.nanos += ns;
        s.maxNanos = Math.max(s.maxNanos, ns);
        s.nodes += r.nodes();
        s.maxNodes = Math.max(s.maxNodes, r.nodes());
        int bins = r.packing().bins();
        if (r.provedOptimal()) {
          s.proved++;
        }
        if (bins <= known) {
          s.reachedKnown++;
        }
        if (heuristic.bins() <= known) {
          s.heuristicReached++;
        }
        boolean feasible = PackingQuality.feasible(r.packing(), instance);
        if (!feasible
            || (proven && bins < known)
            || (proven && r.provedOptimal() && bins != known)
            || LowerBound.of(items, capacity) > bins) {
          s.errors++;
          System.out.println("ERROR " + row.file() + ": bins " + bins + ", proved "
              + r.provedOptimal() + ", known " + known + (feasible ? "" : ", over capacity"));
        }
        if (!r.provedOptimal()) {
          System.out.println("  not proved: " + row.file() + " bins " + bins + " (heuristic "
              + heuristic.bins() + ", lower bound " + r.lowerBound() + ", known " + known
              + (proven ? " proven" : " best known") + ")");
        }
      }
    }
    Stats all = new Stats();
    byGroup.forEach(
        (name, s) -> {
          print(name, s);
          all.instances += s.instances;
          all.proved += s.proved;
          all.reachedKnown += s.reachedKnown;
          all.heuristicReached += s.heuristicReached;
          all.errors += s.errors;
          all.nodes += s.nodes;
          all.maxNodes = Math.max(all.maxNodes, s.maxNodes);
          all.nanos += s.nanos;
          all.maxNanos = Math.max(all.maxNanos, s.maxNanos);
        });
    print("all", all);
    System.out.println("proved: optimality proved within the node limit; known: bins <= the"
        + " known value; heur=known: the heuristic alone reached it; time includes the heuristic");
  }

  private static void print(String name, Stats s) {
    System.out.printf(Locale.ROOT, "%-22s %9d %7d %7d %9d %12d %12d %9.1f %9.1f%s%n",
        name, s.instances, s.proved, s.reachedKnown, s.heuristicReached,
        s.instances == 0 ? 0 : s.nodes / s.instances, s.maxNodes,
        s.instances == 0 ? 0 : s.nanos / 1e6 / s.instances, s.maxNanos / 1e6,
        s.errors > 0 ? "  ERRORS " + s.errors : "");
  }
}
