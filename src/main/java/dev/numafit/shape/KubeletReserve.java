package dev.numafit.shape;

import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * What the kubelet keeps from a worker's capacity (FACTS A4): allocatable = capacity −
 * kube-reserved − system-reserved − eviction threshold; allocatable pods = maxPods.
 *
 * @param kubeReserved explicit kube-reserved; empty means the tiered common-practice default
 * @param evictionHard hard eviction thresholds as amounts ({@code memory} for memory.available)
 * @param evictionHardPercent hard eviction thresholds as a percentage of capacity, by resource
 *     ({@code ephemeral-storage → 10} for {@code nodefs.available<10%}); a resource given here and
 *     in {@code evictionHard} uses the percentage
 */
public record KubeletReserve(
    Optional<Resources> kubeReserved,
    Resources systemReserved,
    Resources evictionHard,
    int maxPods,
    SortedMap<String, BigDecimal> evictionHardPercent) {
  /** Kubelet default eviction-hard memory.available (FACTS A4, K12): 100Mi. */
  public static final long DEFAULT_EVICTION_MEMORY = 100L * 1024 * 1024;

  /** Kubelet default eviction-hard nodefs.available (FACTS A4, K12): 10% of the node's disk. */
  public static final BigDecimal DEFAULT_EVICTION_NODEFS_PERCENT = BigDecimal.TEN;

  /** Kubelet default maxPods (FACTS A4, K13). */
  public static final int DEFAULT_MAX_PODS = 110;

  public KubeletReserve {
    Objects.requireNonNull(kubeReserved, "kubeReserved");
    Objects.requireNonNull(systemReserved, "systemReserved");
    Objects.requireNonNull(evictionHard, "evictionHard");
    Objects.requireNonNull(evictionHardPercent, "evictionHardPercent");
    if (maxPods < 0) {
      throw new IllegalArgumentException("maxPods must be >= 0");
    }
    TreeMap<String, BigDecimal> copy = new TreeMap<>();
    for (Map.Entry<String, BigDecimal> e : evictionHardPercent.entrySet()) {
      BigDecimal p = Objects.requireNonNull(e.getValue(), e.getKey());
      if (p.signum() < 0 || p.compareTo(BigDecimal.valueOf(100)) > 0) {
        throw new IllegalArgumentException(
            "eviction percentage for " + e.getKey() + " must be from 0 to 100, was " + p);
      }
      copy.put(e.getKey(), p);
    }
    evictionHardPercent = Collections.unmodifiableSortedMap(copy);
  }

  /** A reserve with eviction thresholds given as amounts only. */
  public KubeletReserve(
      Optional<Resources> kubeReserved,
      Resources systemReserved,
      Resources evictionHard,
      int maxPods) {
    this(kubeReserved, systemReserved, evictionHard, maxPods, new TreeMap<>());
  }

  /**
   * The kubelet's own defaults as far as they touch allocatable: tiered kube-reserved, no
   * system-reserved, eviction memory.available 100Mi and nodefs.available 10% (K12), maxPods 110.
   * The nodefs threshold only matters when the worker has an ephemeral-storage capacity.
   */
  public static KubeletReserve defaults() {
    TreeMap<String, BigDecimal> pct = new TreeMap<>();
    pct.put(Resources.EPHEMERAL_STORAGE, DEFAULT_EVICTION_NODEFS_PERCENT);
    return new KubeletReserve(
        Optional.empty(),
        Resources.EMPTY,
        Resources.of(Resources.MEMORY, DEFAULT_EVICTION_MEMORY),
        DEFAULT_MAX_PODS,
        pct);
  }

  /** {@code --kubelet-reserve none}: nothing reserved; allocatable equals capacity. */
  public static KubeletReserve none(int maxPods) {
    return new KubeletReserve(
        Optional.of(Resources.EMPTY), Resources.EMPTY, Resources.EMPTY, maxPods);
  }

  /** This reserve with a percentage eviction threshold for {@code resource} (0–100). */
  public KubeletReserve withEvictionPercent(String resource, BigDecimal percent) {
    TreeMap<String, BigDecimal> pct = new TreeMap<>(evictionHardPercent);
    pct.put(resource, percent);
    return new KubeletReserve(
        kubeReserved, systemReserved, evictionHard.without(resource), maxPods, pct);
  }
}
