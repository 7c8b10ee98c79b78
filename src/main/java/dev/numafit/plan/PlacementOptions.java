package dev.numafit.plan;

import dev.numafit.demand.PlacementRules;
import java.util.Objects;
import java.util.Optional;

/**
 * The user's placement and failure options for a plan, beyond what the manifests declare.
 *
 * @param zones at least 1: hosts are spread evenly over this many zones (host {@code h} in zone
 *     {@code h mod zones}) and workers carry the zone label ({@code --zones})
 * @param zoneFailures 0 or 1: size so that losing one whole zone leaves room for every pod
 *     ({@code --zone-failures})
 * @param spreadReplicasAcross a topology key ({@link PlacementRules#HOST_KEY}, {@link
 *     PlacementRules#HOSTNAME_KEY} or {@link PlacementRules#ZONE_KEY}) over which every workload
 *     of two or more replicas is spread with maxSkew 1, DoNotSchedule ({@code
 *     --spread-replicas-across}); empty for none
 */
public record PlacementOptions(
    int zones, int zoneFailures, Optional<String> spreadReplicasAcross) {
  /** One zone, no zone failure, no added spread. */
  public static final PlacementOptions NONE = new PlacementOptions(1, 0, Optional.empty());

  public PlacementOptions {
    Objects.requireNonNull(spreadReplicasAcross, "spreadReplicasAcross");
    if (zones < 1) {
      throw new IllegalArgumentException("zones must be >= 1, was " + zones);
    }
    if (zoneFailures < 0 || zoneFailures > 1) {
      throw new IllegalArgumentException("zoneFailures must be 0 or 1, was " + zoneFailures);
    }
    if (zoneFailures == 1 && zones < 2) {
      throw new IllegalArgumentException("a zone failure needs at least 2 zones");
    }
  }
}
