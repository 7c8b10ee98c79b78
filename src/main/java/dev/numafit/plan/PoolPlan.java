package dev.numafit.plan;

import dev.numafit.demand.Taint;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * The plan of one worker pool.
 *
 * @param name the pool's name
 * @param labels the pool's own labels
 * @param taints the pool's taints, sorted
 * @param plan the pool's sizing: shape, workers, hosts, utilization
 * @param workloads printed ids of the workloads placed in this pool, sorted
 * @param daemonSets printed ids of the DaemonSets that run on this pool's workers, sorted
 */
public record PoolPlan(
    String name,
    SortedMap<String, String> labels,
    List<Taint> taints,
    Plan plan,
    List<String> workloads,
    List<String> daemonSets) {
  public PoolPlan {
    Objects.requireNonNull(name, "name");
    labels = Collections.unmodifiableSortedMap(new TreeMap<>(labels));
    taints = List.copyOf(taints);
    Objects.requireNonNull(plan, "plan");
    workloads = workloads.stream().sorted().toList();
    daemonSets = daemonSets.stream().sorted().toList();
  }
}
