package dev.numafit.bench;

import dev.numafit.pack.RulePacker;
import dev.numafit.pack.RulePacker.Domain;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
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
 * the worker, spread over physical hosts (maxSkew 1). Eight workers per host, three zones. Also
 * the same pods without rules ({@code packPlain}) and the failure check for losing any one host
 * ({@code hostFailures1}, {@code --host-failures 1}) on the rule packer's layout. Run: {@code
 * bench/run-jmh.sh RulePackerBenchmark}, or {@code main} for timed passes per size.
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
  List<RulePacker.Group> plain;
  RulePacker.Result layout;

  @Setup
  public void setUp() {
    groups = groups(pods);
    plain = plain(groups);
    layout = RulePacker.pack(groups, PackerBenchmark.ROOM, TOPOLOGY);
  }

  /** The same pods without rules. */
  static List<RulePacker.Group> plain(List<RulePacker.Group> groups) {
    List<RulePacker.Group> out = new ArrayList<>();
    for (RulePacker.Group g : groups) {
      out.add(RulePacker.Group.plain(g.demand(), g.count()));
    }
    return out;
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

  @Benchmark
  public RulePacker.Result packPlain() {
    return RulePacker.pack(plain, PackerBenchmark.ROOM, TOPOLOGY);
  }

  @Benchmark
  public RulePacker.FailureResult hostFailures1() {
    return RulePacker.hostsToSurvive(groups, PackerBenchmark.ROOM, TOPOLOGY, layout, 1, false, 4);
  }

  /**
   * Per size: the best of 5 timed passes after 2 untimed ones, for packing under rules, packing
   * without rules and the failure check for one host (a quick look beside JMH; wall-clock time and
   * the load average of the machine are printed with it).
   */
  public static void main(String[] args) {
    for (int n : new int[] {10_000, 50_000, 150_000}) {
      List<RulePacker.Group> g = groups(n);
      List<RulePacker.Group> p = plain(g);
      RulePacker.Result[] r = new RulePacker.Result[2];
      RulePacker.FailureResult[] f = new RulePacker.FailureResult[1];
      long[] rules = best(() -> r[0] = RulePacker.pack(g, PackerBenchmark.ROOM, TOPOLOGY));
      long[] none = best(() -> r[1] = RulePacker.pack(p, PackerBenchmark.ROOM, TOPOLOGY));
      long[] fail =
          best(
              () ->
                  f[0] =
                      RulePacker.hostsToSurvive(
                          g, PackerBenchmark.ROOM, TOPOLOGY, r[0], 1, false, 4));
      System.out.printf(
          "%d pods: rules %d workers, %d hosts, %d unplaced, violations %d, %d ms (cpu %d ms);"
              + " no rules %d workers, %d ms (cpu %d ms); --host-failures 1: %d hosts"
              + " (survives %b), %d ms (cpu %d ms); load average %.1f%n",
          n, r[0].bins(), r[0].hosts(), r[0].unplaced().size(),
          RulePacker.violations(g, PackerBenchmark.ROOM, TOPOLOGY, r[0]).size(), rules[0],
          rules[1], r[1].bins(), none[0], none[1], f[0].hosts(), f[0].survives(), fail[0],
          fail[1],
          ManagementFactory.getOperatingSystemMXBean()
              .getSystemLoadAverage());
    }
  }

  /**
   * Best of 5 timed runs after 2 untimed ones, milliseconds: wall clock, and the CPU time of the
   * running thread in that run (less disturbed by other work on a shared machine).
   */
  private static long[] best(Runnable run) {
    ThreadMXBean mx = ManagementFactory.getThreadMXBean();
    long best = Long.MAX_VALUE;
    long cpu = 0;
    for (int rep = 0; rep < 7; rep++) {
      long c0 = mx.getCurrentThreadCpuTime();
      long t0 = System.nanoTime();
      run.run();
      long t = System.nanoTime() - t0;
      if (rep >= 2 && t < best) {
        best = t;
        cpu = mx.getCurrentThreadCpuTime() - c0;
      }
    }
    return new long[] {best / 1_000_000, cpu / 1_000_000};
  }
}
