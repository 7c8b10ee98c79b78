package dev.numafit.bench;

import dev.numafit.demand.Demand;
import dev.numafit.demand.EffectivePod;
import dev.numafit.demand.QosClass;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.Workload;
import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.SourceRef;
import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.VectorPacker;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Packing the 150,000-pod workload ({@link SyntheticFleet}) onto {@code --worker
 * cpu=16,memory=64Gi} workers with the kubelet's default reservations. Run: {@code
 * bench/run-jmh.sh PackerBenchmark} (builds with {@code -Pbench}).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgs = {"-Xmx1g"})
public class PackerBenchmark {
  /**
   * Room of a 16-vCPU, 64Gi worker: capacity less the tiered kube-reserved (common practice, see
   * docs/): cpu 60 + 10 + 2×5 + 12×2.5 = 110m; memory 0.25×4 + 0.2×4 + 0.1×8 + 0.06×48 = 5.48Gi =
   * 5884105196 bytes rounded up; less the default 100Mi eviction threshold (FACTS A4); maxPods 110.
   */
  static final long[] ROOM = {16_000 - 110, (64L << 30) - 5_884_105_196L - (100L << 20), 110};

  long[][] items;
  Demand demand;
  PlanInput input;

  @Setup
  public void setUp() {
    items = SyntheticFleet.podItems();
    List<Workload> workloads = new ArrayList<>();
    for (SyntheticFleet.Deployment d : SyntheticFleet.deployments()) {
      Resources requests = Resources.of("cpu", d.podCpu(), "memory", d.podMemory());
      workloads.add(
          new Workload(
              new WorkloadId(d.namespace(), "Deployment", d.name()),
              new SourceRef("workload-150k.yaml", 1),
              new Replicas(d.replicas(), d.replicas(), "spec.replicas"),
              new EffectivePod(requests, Resources.EMPTY, QosClass.BURSTABLE, 0, List.of()),
              false,
              false,
              List.of()));
    }
    demand = new Demand(workloads, List.of(), new TreeMap<>(), List.of());
    input =
        PlanInput.of(
            new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 64L << 30, Resources.EMPTY),
            Resources.of("cpu", ROOM[0], "memory", ROOM[1], "pods", ROOM[2]));
  }

  @Benchmark
  public Packing pack() {
    return new VectorPacker().pack(items, ROOM);
  }

  /** The whole planning step: oversize check, packing, lower bound and utilization. */
  @Benchmark
  public Plan plan() {
    return new Planner().plan(demand, input);
  }

  @Benchmark
  public int lowerBound() {
    return LowerBound.of(items, ROOM);
  }
}
