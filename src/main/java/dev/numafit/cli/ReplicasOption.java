package dev.numafit.cli;

import dev.numafit.demand.ReplicaMode;

/** {@code --replicas}: size for the HPA's maxReplicas ({@code peak}) or spec.replicas. */
public enum ReplicasOption {
  /** An HPA's maxReplicas where one targets the workload; spec.replicas otherwise. */
  PEAK,
  /** spec.replicas (after Kubernetes defaults), ignoring HPAs. */
  DECLARED;

  /** The demand package's mode for this option. */
  public ReplicaMode mode() {
    return this == DECLARED ? ReplicaMode.DECLARED : ReplicaMode.PEAK;
  }
}
