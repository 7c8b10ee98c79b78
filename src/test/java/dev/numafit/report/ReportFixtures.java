package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.demand.EffectivePod;
import dev.numafit.demand.QosClass;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.Workload;
import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import dev.numafit.plan.Oversize;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanComparison;
import dev.numafit.plan.WorkerPlacement;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;

/**
 * Hand-built report values for the writer tests (invented demo data; the arithmetic that made them
 * is tested where it lives).
 */
final class ReportFixtures {
  static final long MI = 1L << 20;
  static final long GI = 1L << 30;

  private ReportFixtures() {}

  static Demand demand() {
    // The Pod Overhead docs example pod (K1): 2250m and 320Mi with overhead, limits equal.
    Workload sandboxed =
        new Workload(
            new WorkloadId("parcel", "Deployment", "customs-scanner"),
            new SourceRef("manifests/customs-scanner.yaml", 3),
            new Replicas(2, 2, "spec.replicas"),
            new EffectivePod(
                Resources.of("cpu", 2250L, "memory", 320 * MI),
                Resources.of("cpu", 2250L, "memory", 320 * MI),
                QosClass.GUARANTEED,
                0,
                List.of()),
            false,
            false,
            List.of());
    Workload web =
        new Workload(
            new WorkloadId("parcel", "Deployment", "route-api"),
            new SourceRef("manifests/route-api.yaml", 2),
            new Replicas(4, 16, "HorizontalPodAutoscaler route-api maxReplicas"),
            new EffectivePod(
                Resources.of("cpu", 800L, "memory", 1088 * MI),
                Resources.of("memory", 1152 * MI),
                QosClass.BURSTABLE,
                0,
                List.of("no limit for cpu")),
            false,
            false,
            List.of());
    Workload daemon =
        new Workload(
            new WorkloadId("parcel", "DaemonSet", "node-telemetry"),
            new SourceRef("manifests/node-agents.yaml", 2),
            new Replicas(1, 1, "one per worker"),
            new EffectivePod(
                Resources.of("cpu", 150L, "memory", 264 * MI),
                Resources.of("memory", 528 * MI),
                QosClass.BURSTABLE,
                0,
                List.of()),
            true,
            false,
            List.of());
    Workload custom =
        new Workload(
            new WorkloadId("parcel", "RouteSolverRun", "weekly"),
            new SourceRef("manifests/custom.yaml", 1),
            new Replicas(3, 3, "spec.workers.replicas"),
            new EffectivePod(
                Resources.of("cpu", 1000L, "memory", 2 * GI),
                Resources.EMPTY,
                QosClass.BURSTABLE,
                0,
                List.of()),
            false,
            true,
            List.of("sized from a custom resource: a guess"));
    return new Demand(
        List.of(sandboxed, daemon, web),
        List.of(custom),
        new TreeMap<>(Map.of("ConfigMap", 1, "Service", 2)),
        List.of(
            Diagnostic.warning(
                new SourceRef("manifests/old.yaml", 4), "extensions/v1beta1 is an old version")));
  }

  static Plan hostPlan(boolean placement) {
    WorkerShape shape = new WorkerShape(ShapeKind.ONE_NODE, 1, 1, 32, 250 * GI, Resources.EMPTY);
    return new Plan(
        Optional.of("two-socket"),
        shape,
        Resources.of("cpu", 31830L, "memory", 244 * GI, "pods", 110L),
        Resources.of("cpu", 150L, "memory", 264 * MI, "pods", 1L),
        Resources.of("cpu", 31680L, "memory", 244 * GI - 264 * MI, "pods", 109L),
        OptionalInt.of(2),
        3,
        2,
        OptionalInt.of(2),
        List.of(
            new Oversize(
                new WorkloadId("parcel", "Deployment", "route-optimizer"),
                Resources.of("cpu", 8320L, "memory", 76 * GI),
                "2-nodes")),
        new TreeMap<>(Map.of("cpu", 0.41234, "memory", 0.1, "pods", 0.0667)),
        "cpu",
        placement
            ? Optional.of(
                List.of(
                    new WorkerPlacement("worker-001", List.of("parcel/Deployment/route-api#0")),
                    new WorkerPlacement("worker-002", List.of())))
            : Optional.empty(),
        List.of("ephemeral-storage"),
        List.of("one virtual socket with all 32 vCPUs, so the guest sees one NUMA node"),
        List.of(),
        OptionalInt.empty(),
        Optional.empty());
  }

  static Plan workerPlan() {
    WorkerShape shape = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 64 * GI, Resources.EMPTY);
    return new Plan(
        Optional.empty(),
        shape,
        Resources.of("cpu", 16000L, "memory", 64 * GI, "pods", 110L),
        Resources.of("cpu", 150L, "memory", 264 * MI, "pods", 1L),
        Resources.of("cpu", 15850L, "memory", 64 * GI - 264 * MI, "pods", 109L),
        OptionalInt.empty(),
        5,
        5,
        OptionalInt.empty(),
        List.of(),
        new TreeMap<>(Map.of("cpu", 0.8, "memory", 0.5)),
        "cpu",
        Optional.empty(),
        List.of(),
        List.of(),
        List.of(),
        OptionalInt.empty(),
        Optional.empty());
  }

  static PlanReport planReport() {
    Plan a = hostPlan(true);
    Plan b = workerPlan();
    return new PlanReport(
        demand(),
        List.of(a, b),
        Optional.of(PlanComparison.of(List.of(a, b), Map.of("two-socket", new BigDecimal("1.5")))),
        demand().diagnostics());
  }
}
