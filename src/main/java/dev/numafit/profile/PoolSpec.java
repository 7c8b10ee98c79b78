package dev.numafit.profile;

import dev.numafit.demand.Taint;
import dev.numafit.diag.SourceRef;
import java.nio.file.Path;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One pool of a WorkerPools file (docs/pools.md), as read: what the plan needs to size it.
 *
 * @param name the pool's name
 * @param labels labels on every worker of the pool
 * @param taints taints on every worker of the pool, in the order written
 * @param hostProfile the pool's host profile, resolved against the pools file's folder; empty to
 *     use the plan's {@code --host-profile}
 * @param worker {@code cpu} (millicores, whole vCPUs) and {@code memory} (bytes) of an explicit
 *     worker; empty for the one-node shape (or the plan's {@code --worker})
 * @param workersPerNode at least 1: with the one-node shape, each NUMA node carries this many
 *     equal workers
 * @param source where the pool starts in the file
 */
public record PoolSpec(
    String name,
    SortedMap<String, String> labels,
    List<Taint> taints,
    Optional<Path> hostProfile,
    Optional<dev.numafit.resource.Resources> worker,
    int workersPerNode,
    SourceRef source) {
  public PoolSpec {
    Objects.requireNonNull(name, "name");
    labels = Collections.unmodifiableSortedMap(new TreeMap<>(labels));
    taints = List.copyOf(taints);
    Objects.requireNonNull(hostProfile, "hostProfile");
    Objects.requireNonNull(worker, "worker");
    Objects.requireNonNull(source, "source");
    if (workersPerNode < 1) {
      throw new IllegalArgumentException("workersPerNode must be >= 1, was " + workersPerNode);
    }
  }
}
