package dev.numafit.bench;

import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.VectorPacker;
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

  @Setup
  public void setUp() {
    items = SyntheticFleet.podItems();
  }

  @Benchmark
  public Packing pack() {
    return new VectorPacker().pack(items, ROOM);
  }

  @Benchmark
  public int lowerBound() {
    return LowerBound.of(items, ROOM);
  }
}
