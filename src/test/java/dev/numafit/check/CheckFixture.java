package dev.numafit.check;

import dev.numafit.fit.SpanningRoom;
import dev.numafit.manifest.ManifestRead;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.resource.Resources;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.KubeletReserve;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;

/**
 * Builds check inputs the way the CLI does (manifest reader, allocatable, planner), from manifest
 * text and a worker, so tests exercise the real arithmetic.
 */
final class CheckFixture {
  static final long GI = 1L << 30;
  static final long MI = 1L << 20;

  private CheckFixture() {}

  /**
   * The node of the "Reserve Compute Resources for System Daemons" docs example (FACTS A4, check
   * value 6): 16 CPUs, 32Gi; kube-reserved cpu=1,memory=2Gi; system-reserved cpu=500m,memory=1Gi;
   * eviction memory.available 500Mi. Its allocatable is 14.5 CPU and 28.5Gi.
   */
  static WorkerShape docsNode(Resources extra) {
    return new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 32 * GI, extra);
  }

  static KubeletReserve docsReserve() {
    return new KubeletReserve(
        Optional.of(Resources.of("cpu", 1000L, "memory", 2 * GI)),
        Resources.of("cpu", 500L, "memory", GI),
        Resources.of("memory", 500 * MI),
        110);
  }

  static ManifestRead read(String yaml) {
    TreeMap<String, String> texts = new TreeMap<>();
    texts.put("change.yaml", yaml);
    return new ManifestReader().readTexts(texts, ReadOptions.defaults());
  }

  /** Input for the docs node, no spanning shapes, 100% utilization, the given hosts setup. */
  static CheckInput input(
      ManifestRead read, WorkerShape shape, List<SpanningRoom> spanning, OptionalInt perHost) {
    Resources alloc = Allocatable.compute(shape, docsReserve());
    PlanInput in =
        new PlanInput(
            Optional.empty(),
            shape,
            alloc,
            perHost,
            spanning,
            Resources.EMPTY,
            0,
            100,
            BigDecimal.ONE,
            false,
            List.of(),
            List.of());
    Plan plan = new Planner().plan(read.demand(), in);
    return new CheckInput(read.demand(), read.sources(), plan, spanning, 100);
  }

  static List<Finding> findings(String yaml) {
    return CheckEngine.run(
        input(read(yaml), docsNode(Resources.EMPTY), List.of(), OptionalInt.empty()),
        CheckOptions.defaults());
  }

  /** A Deployment {@code name} in namespace {@code shop} with one container's resources block. */
  static String deployment(String name, int replicas, String resources) {
    return "apiVersion: apps/v1\n"
        + "kind: Deployment\n"
        + "metadata:\n"
        + "  name: " + name + "\n"
        + "  namespace: shop\n"
        + "spec:\n"
        + "  replicas: " + replicas + "\n"
        + "  template:\n"
        + "    spec:\n"
        + "      containers:\n"
        + "        - name: app\n"
        + "          image: registry.example.com/shop/app:1\n"
        + resources;
  }
}
