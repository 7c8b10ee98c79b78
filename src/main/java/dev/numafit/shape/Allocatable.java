package dev.numafit.shape;

import dev.numafit.host.ByteUnits;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The kubelet's allocatable for a worker shape (FACTS A4, from the "Reserve Compute Resources for
 * System Daemons" page, K11): capacity − kube-reserved − system-reserved − hard eviction threshold,
 * for cpu (millicores), memory (bytes) and ephemeral-storage (bytes); allocatable pods = maxPods.
 *
 * <p>Pre-allocated hugepages are also taken from allocatable memory, as the kubelet's node status
 * does (kubernetes {@code pkg/kubelet/nodestatus/setters.go}, MachineInfo: "for every huge page
 * reservation, we need to remove it from allocatable memory"). A resource absent from the worker's
 * capacity stays absent: it is not checked, whatever is reserved for it.
 */
public final class Allocatable {
  private Allocatable() {}

  /** Allocatable of {@code shape} under {@code reserve}, {@code pods} included. */
  public static Resources compute(WorkerShape shape, KubeletReserve reserve) {
    return computeDetailed(shape, reserve).allocatable();
  }

  /** Allocatable and its parts, with a warning for every amount clamped at zero. */
  public static AllocatableResult computeDetailed(WorkerShape shape, KubeletReserve reserve) {
    Resources capacity = shape.capacity();
    Resources kube =
        reserve.kubeReserved().orElseGet(
            () -> TieredReserve.forWorker(shape.vcpus(), shape.memoryBytes()));
    Resources eviction = evictionAmounts(capacity, reserve);
    long hugepages = 0;
    for (String name : capacity.names()) {
      if (Resources.isHugepages(name)) {
        hugepages = Math.addExact(hugepages, capacity.get(name));
      }
    }
    List<String> warnings = new ArrayList<>();
    Map<String, Long> out = new TreeMap<>();
    for (Map.Entry<String, Long> e : capacity.asMap().entrySet()) {
      String r = e.getKey();
      long taken = Math.addExact(
          Math.addExact(kube.get(r), reserve.systemReserved().get(r)), eviction.get(r));
      if (r.equals(Resources.MEMORY)) {
        taken = Math.addExact(taken, hugepages);
      }
      long left = e.getValue() - taken;
      if (left < 0) {
        warnings.add(
            r + ": reservations and eviction threshold (" + describe(r, taken)
                + ") exceed the worker's capacity (" + describe(r, e.getValue())
                + "); allocatable clamped at 0");
        left = 0;
      }
      out.put(r, left);
    }
    out.put(Resources.PODS, (long) reserve.maxPods());
    return new AllocatableResult(
        capacity.with(Resources.PODS, reserve.maxPods()),
        kube,
        reserve.systemReserved(),
        eviction,
        Resources.of(out),
        warnings);
  }

  /**
   * Hard eviction thresholds as amounts: a percentage is taken of the worker's capacity of that
   * resource and rounded up to a whole unit, so allocatable is never overstated; resources the
   * worker has no capacity for are left out.
   */
  public static Resources evictionAmounts(Resources capacity, KubeletReserve reserve) {
    Map<String, Long> out = new TreeMap<>(reserve.evictionHard().asMap());
    for (Map.Entry<String, BigDecimal> e : reserve.evictionHardPercent().entrySet()) {
      long cap = capacity.get(e.getKey());
      long amount =
          BigDecimal.valueOf(cap)
              .multiply(e.getValue())
              .divide(BigDecimal.valueOf(100), 0, RoundingMode.CEILING)
              .longValueExact();
      out.put(e.getKey(), amount);
    }
    out.keySet().retainAll(capacity.names());
    return Resources.of(out);
  }

  private static String describe(String resource, long amount) {
    if (resource.equals(Resources.CPU)) {
      return amount + "m";
    }
    if (resource.equals(Resources.MEMORY)
        || resource.equals(Resources.EPHEMERAL_STORAGE)
        || Resources.isHugepages(resource)) {
      return ByteUnits.format(amount);
    }
    return Long.toString(amount);
  }
}
