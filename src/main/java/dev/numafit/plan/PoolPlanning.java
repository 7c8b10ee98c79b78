package dev.numafit.plan;

import java.util.List;

/**
 * The plans of every worker pool, in the pools' order, and the workloads no pool takes.
 *
 * @param pools one plan per pool, in the order the pools were given
 * @param unplaceable workloads no pool satisfies, sorted by id
 */
public record PoolPlanning(List<PoolPlan> pools, List<Unplaceable> unplaceable) {
  public PoolPlanning {
    pools = List.copyOf(pools);
    unplaceable = unplaceable.stream().sorted().toList();
  }
}
