package dev.numafit.cli;

/** {@code --replicas}: size for the HPA's maxReplicas ({@code peak}) or spec.replicas. */
public enum ReplicasOption {
  /** An HPA's maxReplicas where one targets the workload; spec.replicas otherwise. */
  PEAK,
  /** spec.replicas (after Kubernetes defaults), ignoring HPAs. */
  DECLARED
}
