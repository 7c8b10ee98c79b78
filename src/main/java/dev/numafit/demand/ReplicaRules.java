package dev.numafit.demand;

/**
 * How many pods each workload kind runs at once, with Kubernetes' defaults (FACTS A8, the
 * Deployment, StatefulSet, Job, CronJob and DaemonSet concept pages and the HPA API reference).
 */
public final class ReplicaRules {
  /** The {@code peakSource} of a DaemonSet's count. */
  public static final String ONE_PER_WORKER = "one per worker";

  private ReplicaRules() {}

  /**
   * Deployment, ReplicaSet, StatefulSet and ReplicationController: {@code spec.replicas}, 1 when
   * unset.
   *
   * @param replicas {@code spec.replicas}, or null when absent
   */
  public static Replicas scalable(Integer replicas) {
    if (replicas == null) {
      return new Replicas(1, 1, "default 1");
    }
    return new Replicas(replicas, replicas, "spec.replicas");
  }

  /**
   * A Job runs {@code parallelism} pods at once (default 1; 0 pauses it), never more than its
   * {@code completions} when those are set (a work-queue Job leaves them unset). A CronJob counts
   * one Job of its {@code jobTemplate}.
   */
  public static Replicas job(Integer parallelism, Integer completions) {
    int p = parallelism == null ? 1 : parallelism;
    String source = parallelism == null ? "parallelism default 1" : "spec.parallelism";
    int running = p;
    if (completions != null && completions < p) {
      running = completions;
      source = "spec.completions";
    }
    return new Replicas(running, running, source);
  }

  /** A DaemonSet: one pod per worker; the count is per worker, not a replica count. */
  public static Replicas daemonSet() {
    return new Replicas(1, 1, ONE_PER_WORKER);
  }

  /** A bare Pod: exactly one. */
  public static Replicas pod() {
    return new Replicas(1, 1, "a single Pod");
  }

  /**
   * The count when a HorizontalPodAutoscaler scales the workload: at {@link ReplicaMode#PEAK} its
   * {@code maxReplicas}, naming the autoscaler; at {@link ReplicaMode#DECLARED} the workload's own
   * count is kept.
   *
   * @param autoscaler {@code namespace/name} of the HorizontalPodAutoscaler
   */
  public static Replicas autoscaled(
      Replicas declared, int maxReplicas, String autoscaler, ReplicaMode mode) {
    if (maxReplicas < 0) {
      throw new IllegalArgumentException("maxReplicas must be >= 0, was " + maxReplicas);
    }
    if (mode == ReplicaMode.DECLARED) {
      return declared;
    }
    return new Replicas(
        declared.declared(), maxReplicas, "HorizontalPodAutoscaler " + autoscaler + " maxReplicas");
  }
}
