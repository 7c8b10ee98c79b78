package dev.numafit.manifest;

import dev.numafit.demand.Demand;
import dev.numafit.demand.WorkloadId;
import dev.numafit.demand.WorkloadSource;
import java.util.Collections;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * What {@link ManifestReader#readLocated} returns: the demand, and for each workload read (sized
 * or not) where its pod template, replica count and containers are written.
 */
public record ManifestRead(Demand demand, SortedMap<WorkloadId, WorkloadSource> sources) {
  public ManifestRead {
    Objects.requireNonNull(demand, "demand");
    sources = Collections.unmodifiableSortedMap(new TreeMap<>(sources));
  }
}
