package dev.numafit.manifest;

import dev.numafit.demand.ReplicaMode;
import java.util.Objects;

/**
 * How {@link ManifestReader} turns manifests into demand.
 *
 * @param replicaMode which count an autoscaled workload is sized at
 * @param includeCustom size custom resources that embed pod templates (flagged as a guess) instead
 *     of only listing them
 */
public record ReadOptions(ReplicaMode replicaMode, boolean includeCustom) {
  public ReadOptions {
    Objects.requireNonNull(replicaMode, "replicaMode");
  }

  /** Peak replicas, custom resources listed but not sized. */
  public static ReadOptions defaults() {
    return new ReadOptions(ReplicaMode.PEAK, false);
  }
}
