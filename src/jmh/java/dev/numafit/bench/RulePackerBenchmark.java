package dev.numafit.bench;

import dev.numafit.pack.RulePacker;
import dev.numafit.pack.RulePacker.Domain;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Packing the synthetic fleet ({@link SyntheticFleet}) under placement rules, at 10,000, 50,000
 * and 150,000 pods (the first Deployments of the fleet up to that many pods). Every Deployment
 * has a rule, in turn: spread over workers (maxSkew 1, DoNotSchedule), required anti-affinity on
 * the worker, spread over physical hosts (maxSkew 1). Eight workers per host, three zones. Run:
 * {@code bench/run-jmh.sh RulePackerBenchmark}, or {@code main} for one timed pass per size.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(value = 1, jvmArgs = {"-Xmx2g"})
public class RulePackerBenchmark {
  static final RulePacker.Topology TOPOLOGY = new RulePacker.Topology(8, 3);

  @Param({"10000", "50000", "150000"})
  int pods;

  List<RulePacker.Group> groups;

  @Setup
  public void setUp() {
    groups = groups(pods);
  }

  /** The fleet's first Deployments up to {@code pods} pods, each with its rule. */
  static List<RulePacker.Group> groups(int pods) {
    List<RulePacker.Group> out = new ArrayList<>();
    int total = 0;
    int i = 0;
    for (SyntheticFleet.Deployment d : SyntheticFleet.deployments()) {
      if (total >= pods) {
        break;
      }
      int n = Math.min(d.replicas(), pods - total);
      total += n;
      long[] row = {d.podCpu(), d.podMemory(), 1};
      RulePacker.Group g =
          switch (i++ % 3) {
            case 0 -> new RulePacker.Group(row, n, Set.of(), Map.of(Domain.WORKER, 1));
            case 1 -> new RulePacker.Group(row, n, Set.of(Domain.WORKER), Map.of());
            default -> new RulePacker.Group(row, n, Set.of(), Map.of(Domain.HOST, 1));
          };
      out.add(g);
    }
    return out;
  }

  @Benchmark
  public RulePacker.Result pack() {
    return RulePacker.pack(groups, PackerBenchmark.ROOM, TOPOLOGY);
  }

  /** One timed pass per size after two warm-up passes (a quick look, not a measurement). */
  public static void main(String[] args) {
    for (int n : new int[] {10_000, 50_000, 150_000}) {
      List<RulePacker.Group> g = groups(n);
      RulePacker.Result r = null;
      long best = Long.MAX_VALUE;
      for (int rep = 0; rep < 3; rep++) {
        long t0 = System.nanoTime();
        r = RulePacker.pack(g, PackerBenchmark.ROOM, TOPOLOGY);
        best = Math.min(best, System.nanoTime() - t0);
      }
      System.out.printf(
          "%d pods: %d workers, %d hosts, %d unplaced, %d ms (best of 3), violations %d%n",
          n, r.bins(), r.hosts(), r.unplaced().size(), best / 1_000_000,
          RulePacker.violations(g, PackerBenchmark.ROOM, TOPOLOGY, r).size());
      if (n <= 50_000) {
        long t0 = System.nanoTime();
        RulePacker.FailureResult f =
            RulePacker.hostsToSurvive(g, PackerBenchmark.ROOM, TOPOLOGY, r, 1, false, 4);
        System.out.printf(
            "  --host-failures 1: %s, %d ms (one pass)%n", f, (System.nanoTime() - t0) / 1_000_000);
      }
    }
  }
}
