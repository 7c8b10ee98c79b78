package dev.numafit.demand;

/**
 * Which replica count sizing uses for a workload that a HorizontalPodAutoscaler scales.
 *
 * <p>{@link #PEAK} uses the autoscaler's {@code maxReplicas} (the most pods that can run at once);
 * {@link #DECLARED} uses the workload's own {@code spec.replicas}.
 */
public enum ReplicaMode {
  PEAK,
  DECLARED
}
