package dev.numafit.bench;

import dev.numafit.demand.ContainerRole;
import dev.numafit.demand.ContainerSpec;
import dev.numafit.demand.EffectivePod;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.demand.PodModel;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SortedMap;
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
import org.openjdk.jmh.infra.Blackhole;

/**
 * The request arithmetic ({@link PodArithmetic#effective}) on the 5,000 pod templates of the
 * benchmark workload ({@link SyntheticFleet}: one init and two app containers each); one operation
 * computes all 5,000. Run: {@code bench/run-jmh.sh PodArithmeticBenchmark}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgs = {"-Xmx1g"})
public class PodArithmeticBenchmark {
  List<PodModel> templates;

  @Setup
  public void setUp() {
    templates = new ArrayList<>();
    for (SyntheticFleet.Deployment d : SyntheticFleet.deployments()) {
      templates.add(
          new PodModel(
              List.of(container("migrate", ContainerRole.INIT, d.initCpu(), d.initMemory())),
              List.of(
                  container("app", ContainerRole.APP, d.appCpu()[0], d.appMemory()[0]),
                  container("proxy", ContainerRole.APP, d.appCpu()[1], d.appMemory()[1])),
              new TreeMap<>(),
              new TreeMap<>(),
              new TreeMap<>(),
              Optional.empty()));
    }
  }

  /** Amounts in base units as the model holds them: cpu in cores, memory in bytes. */
  private static ContainerSpec container(String name, ContainerRole role, long milli, long bytes) {
    SortedMap<String, BigDecimal> requests = new TreeMap<>();
    requests.put("cpu", BigDecimal.valueOf(milli, 3));
    requests.put("memory", BigDecimal.valueOf(bytes));
    return new ContainerSpec(name, role, requests, new TreeMap<>());
  }

  @Benchmark
  public void effective5000Templates(Blackhole bh) {
    for (PodModel p : templates) {
      EffectivePod e = PodArithmetic.effective(p);
      bh.consume(e);
    }
  }
}
