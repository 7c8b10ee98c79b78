package dev.numafit.shape;

import dev.numafit.resource.Resources;
import java.util.Objects;
import java.util.Optional;

/**
 * What the kubelet keeps from a worker's capacity (FACTS A4): allocatable = capacity −
 * kube-reserved − system-reserved − eviction threshold; allocatable pods = maxPods.
 *
 * @param kubeReserved explicit kube-reserved; empty means the tiered common-practice default
 * @param evictionHard hard eviction thresholds as amounts ({@code memory} for memory.available)
 */
public record KubeletReserve(
    Optional<Resources> kubeReserved,
    Resources systemReserved,
    Resources evictionHard,
    int maxPods) {
  /** Kubelet default eviction-hard memory.available (FACTS A4, K12): 100Mi. */
  public static final long DEFAULT_EVICTION_MEMORY = 100L * 1024 * 1024;

  /** Kubelet default maxPods (FACTS A4, K13). */
  public static final int DEFAULT_MAX_PODS = 110;

  public KubeletReserve {
    Objects.requireNonNull(kubeReserved, "kubeReserved");
    Objects.requireNonNull(systemReserved, "systemReserved");
    Objects.requireNonNull(evictionHard, "evictionHard");
    if (maxPods < 0) {
      throw new IllegalArgumentException("maxPods must be >= 0");
    }
  }

  /** Tiered kube-reserved, no system-reserved, eviction 100Mi, maxPods 110. */
  public static KubeletReserve defaults() {
    return new KubeletReserve(
        Optional.empty(),
        Resources.EMPTY,
        Resources.of(Resources.MEMORY, DEFAULT_EVICTION_MEMORY),
        DEFAULT_MAX_PODS);
  }

  /** {@code --kubelet-reserve none}: nothing reserved; allocatable equals capacity. */
  public static KubeletReserve none(int maxPods) {
    return new KubeletReserve(
        Optional.of(Resources.EMPTY), Resources.EMPTY, Resources.EMPTY, maxPods);
  }
}
