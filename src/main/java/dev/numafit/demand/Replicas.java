package dev.numafit.demand;

import java.util.Objects;

/**
 * How many pods of a workload run at once.
 *
 * @param declared the count the manifest declares (after Kubernetes defaults, FACTS A8)
 * @param peak the count used for sizing at peak (for example an HPA's maxReplicas)
 * @param peakSource where {@code peak} came from, in words ({@code "spec.replicas"},
 *     {@code "HorizontalPodAutoscaler web-hpa maxReplicas"}, {@code "default 1"})
 */
public record Replicas(int declared, int peak, String peakSource) {
  public Replicas {
    Objects.requireNonNull(peakSource, "peakSource");
    if (declared < 0 || peak < 0) {
      throw new IllegalArgumentException("replica counts must be >= 0");
    }
  }
}
