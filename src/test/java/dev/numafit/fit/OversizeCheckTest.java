package dev.numafit.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.demand.WorkloadId;
import dev.numafit.fit.OversizeCheck.Option;
import dev.numafit.fit.OversizeCheck.PodRequest;
import dev.numafit.plan.Oversize;
import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

class OversizeCheckTest {
  static final WorkloadId DB = new WorkloadId("ledger", "StatefulSet", "db");
  static final TreeSet<String> CPU_MEM_PODS = new TreeSet<>(Set.of("cpu", "memory", "pods"));

  @Test
  void check_requestEqualToRoom_fits_oneMore_isOversizeByOne() {
    // FACTS check value 16 (kube-scheduler fitsRequest): 500m left, a 500m pod fits, 501m not.
    Resources room = Resources.of("cpu", 500L, "memory", 1L << 30, "pods", 10L);
    var fits = OversizeCheck.check(
        List.of(new PodRequest(DB, Resources.of("cpu", 500L), 0)), CPU_MEM_PODS, room, List.of());
    assertEquals(List.of(), fits.oversize());
    var over = OversizeCheck.check(
        List.of(new PodRequest(DB, Resources.of("cpu", 501L), 0)), CPU_MEM_PODS, room, List.of());
    assertEquals(List.of(new Oversize(DB, Resources.of("cpu", 1L), "none")), over.oversize());
  }

  @Test
  void check_noPodSlotLeft_isOversizeInPods() {
    // FACTS check value 17: a node at maxPods has no room for one more pod ("Too many pods").
    Resources room = Resources.of("cpu", 4000L, "memory", 1L << 30);
    var r = OversizeCheck.check(
        List.of(new PodRequest(DB, Resources.of("cpu", 1L), 0)), CPU_MEM_PODS, room, List.of());
    assertEquals(List.of(new Oversize(DB, Resources.of("pods", 1L), "none")), r.oversize());
  }

  @Test
  void check_smallestSpanningOptionThatHolds_isNamed() {
    Resources room = Resources.of("cpu", 4000L, "memory", 16L << 30, "pods", 100L);
    List<Option> options =
        List.of(
            new Option("2-nodes", Resources.of("cpu", 8000L, "memory", 32L << 30, "pods", 100L)),
            new Option("socket", Resources.of("cpu", 16000L, "memory", 64L << 30, "pods", 100L)),
            new Option("host", Resources.of("cpu", 32000L, "memory", 128L << 30, "pods", 100L)));
    // 40Gi is over the 32Gi two-node worker but within the 64Gi socket worker.
    var r = OversizeCheck.check(
        List.of(new PodRequest(DB, Resources.of("cpu", 2000L, "memory", 40L << 30), 0)),
        CPU_MEM_PODS, room, options);
    assertEquals(
        List.of(new Oversize(DB, Resources.of("memory", 24L << 30), "socket")), r.oversize());
  }

  @Test
  void check_resourceWithoutCapacity_isUnchecked() {
    // hugepages with no pre-allocated pages in the profile, and ephemeral-storage with no
    // figure: not checked, listed, and the pod is not called oversize for them.
    Resources room = Resources.of("cpu", 4000L, "memory", 16L << 30, "pods", 100L);
    var r = OversizeCheck.check(
        List.of(new PodRequest(DB,
            Resources.of("cpu", 100L, "hugepages-2Mi", 80L << 20, "ephemeral-storage", 1L << 40),
            0)),
        CPU_MEM_PODS, room, List.of());
    assertEquals(List.of(), r.oversize());
    assertEquals(new TreeSet<>(List.of("ephemeral-storage", "hugepages-2Mi")), r.unchecked());
  }

  @Test
  void check_exclusiveCpus_listedAndCappedAtWholeCpusOfRoom() {
    // FACTS check value 11: a Guaranteed pod with integer cpu 2 pins 2 CPUs. With 3500m of room
    // three whole CPUs are available, so a 3-CPU pinned pod (3000m) fits, a 4-CPU one does not.
    Resources room = Resources.of("cpu", 3500L, "memory", 16L << 30, "pods", 100L);
    WorkloadId four = new WorkloadId("ledger", "StatefulSet", "wide");
    var r = OversizeCheck.check(
        List.of(
            new PodRequest(DB, Resources.of("cpu", 3000L), 3),
            new PodRequest(four, Resources.of("cpu", 4000L), 4)),
        CPU_MEM_PODS, room, List.of());
    assertEquals(Map.of(DB, 3L, four, 4L), r.exclusiveCpus());
    assertEquals(List.of(new Oversize(four, Resources.of("cpu", 1000L), "none")), r.oversize());
  }
}
