package dev.numafit.shape;

import java.math.BigDecimal;
import java.util.Objects;

/**
 * How vCPUs are counted when deriving worker shapes.
 *
 * @param vcpuPerThread count one vCPU per hardware thread instead of per physical core (the
 *     hypervisor's NUMA placement counts cores, so the default is false)
 * @param cpuOvercommit vCPUs per counted core or thread; 1 means no overcommit, larger values let a
 *     host carry that many times more vCPUs, at the cost of NUMA locality and steady performance
 */
public record ShapeOptions(boolean vcpuPerThread, BigDecimal cpuOvercommit) {
  public ShapeOptions {
    Objects.requireNonNull(cpuOvercommit, "cpuOvercommit");
    if (cpuOvercommit.signum() <= 0) {
      throw new IllegalArgumentException("cpu overcommit must be > 0, was " + cpuOvercommit);
    }
  }

  /** One vCPU per physical core, no overcommit. */
  public static ShapeOptions defaults() {
    return new ShapeOptions(false, BigDecimal.ONE);
  }

  /** Whether more vCPUs than counted cores or threads are handed out. */
  public boolean overcommitted() {
    return cpuOvercommit.compareTo(BigDecimal.ONE) > 0;
  }
}
