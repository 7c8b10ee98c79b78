package dev.numafit.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class AllocatableTest {
  private static final long MI = 1L << 20;
  private static final long GI = 1L << 30;

  @Test
  void compute_reserveComputeResourcesExample_matchesDocs() {
    // FACTS check value 6, K11 ("Reserve Compute Resources for System Daemons", example scenario):
    // node 32Gi / 16 CPU / 100Gi storage; kube-reserved cpu=1,memory=2Gi,ephemeral-storage=1Gi;
    // system-reserved cpu=500m,memory=1Gi,ephemeral-storage=1Gi; eviction-hard
    // memory.available<500Mi,nodefs.available<10% → allocatable 14.5 CPU, 28.5Gi, 88Gi.
    WorkerShape node =
        new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 32 * GI,
            Resources.of(Resources.EPHEMERAL_STORAGE, 100 * GI));
    KubeletReserve reserve =
        new KubeletReserve(
                Optional.of(Resources.of("cpu", 1000L, "memory", 2 * GI, "ephemeral-storage", GI)),
                Resources.of("cpu", 500L, "memory", GI, "ephemeral-storage", GI),
                Resources.of("memory", 500 * MI),
                110)
            .withEvictionPercent(Resources.EPHEMERAL_STORAGE, BigDecimal.TEN);

    Resources allocatable = Allocatable.compute(node, reserve);

    assertEquals(14_500L, allocatable.get("cpu")); // 14.5 CPU (K11)
    // K11 states 28.5Gi, counting the 500Mi threshold as half a GiB; exactly it is
    // 32Gi − 2Gi − 1Gi − 500Mi = 29196Mi (28.51Gi), which rounds to the page's figure.
    assertEquals(29 * GI - 500 * MI, allocatable.get("memory"));
    assertEquals(28.5, allocatable.get("memory") / (double) GI, 0.05);
    assertEquals(88 * GI, allocatable.get("ephemeral-storage")); // 88Gi (K11)
    assertEquals(110L, allocatable.get("pods")); // maxPods default 110 (K13)
  }

  @Test
  void compute_percentEviction_isTakenOfCapacity() {
    // K11: nodefs.available<10% of a 100Gi disk is 10Gi; the same percentage of 50Gi is 5Gi.
    WorkerShape node =
        new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 8 * GI,
            Resources.of(Resources.EPHEMERAL_STORAGE, 50 * GI));
    Resources allocatable = Allocatable.compute(node, KubeletReserve.none(110)
        .withEvictionPercent(Resources.EPHEMERAL_STORAGE, BigDecimal.TEN));
    assertEquals(45 * GI, allocatable.get("ephemeral-storage"));
  }

  @Test
  void compute_hugepages_areTakenFromAllocatableMemory() {
    // kubernetes pkg/kubelet/nodestatus/setters.go (MachineInfo): "for every huge page
    // reservation, we need to remove it from allocatable memory". 16Gi − 2Gi of 2Mi pages = 14Gi.
    WorkerShape node =
        new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 16 * GI, Resources.of("hugepages-2Mi", 2 * GI));
    Resources allocatable = Allocatable.compute(node, KubeletReserve.none(110));
    assertEquals(14 * GI, allocatable.get("memory"));
    assertEquals(2 * GI, allocatable.get("hugepages-2Mi"));
  }

  @Test
  void compute_reserveNone_equalsCapacityWithMaxPods() {
    WorkerShape node =
        new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 64 * GI, Resources.of("example.com/vf", 4L));
    assertEquals(
        Resources.of("cpu", 16_000L, "memory", 64 * GI, "example.com/vf", 4L, "pods", 58L),
        Allocatable.compute(node, KubeletReserve.none(58)));
  }

  @Test
  void compute_defaults_useTieredKubeReservedAnd100MiEviction() {
    // Tiered kube-reserved (common practice, from memory) for 16 vCPU / 64Gi: cpu 110m (see
    // TieredReserveTest), memory 5612Mi; eviction memory.available<100Mi (K12).
    WorkerShape node = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 64 * GI, Resources.EMPTY);
    Resources allocatable = Allocatable.compute(node, KubeletReserve.defaults());
    assertEquals(16_000L - 110, allocatable.get("cpu"));
    assertEquals(64 * GI - 5612 * MI - 100 * MI, allocatable.get("memory"));
  }

  @Test
  void compute_resourceWithoutCapacity_staysUnchecked() {
    // nodefs 10% by default, but no ephemeral-storage capacity: nothing to take it from.
    WorkerShape node = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 8 * GI, Resources.EMPTY);
    assertEquals(0L, Allocatable.compute(node, KubeletReserve.defaults()).get("ephemeral-storage"));
  }

  @Test
  void computeDetailed_reserveOverCapacity_clampsAtZeroWithWarning() {
    WorkerShape node = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 1, GI, Resources.EMPTY);
    KubeletReserve reserve =
        new KubeletReserve(
            Optional.of(Resources.of("memory", 2 * GI)), Resources.EMPTY, Resources.EMPTY, 110);
    AllocatableResult r = Allocatable.computeDetailed(node, reserve);
    assertEquals(0L, r.allocatable().get("memory"));
    assertEquals(
        List.of("memory: reservations and eviction threshold (2Gi) exceed the worker's capacity"
            + " (1Gi); allocatable clamped at 0"),
        r.warnings());
  }
}
