package dev.numafit.check;

import dev.numafit.demand.Demand;
import dev.numafit.demand.WorkloadId;
import dev.numafit.demand.WorkloadSource;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.plan.Plan;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * What the rules are evaluated over: the demand read from the manifests with its source lines, the
 * plan made for it on the one-node worker, and the spanning shapes of the host.
 *
 * @param sources per workload, where its containers and replica count are written; a workload
 *     missing here is pointed at by its object's line
 * @param plan the plan for the one-node worker (or the {@code --worker} shape): its allocatable,
 *     room, per-worker demand, workers and hosts
 * @param spanning spanning shapes of the host, smallest first, with their allocatable before
 *     DaemonSets; empty without a host profile
 * @param maxUtilizationPct the {@code --max-utilization} the plan was made with, 1..100
 */
public record CheckInput(
    Demand demand,
    SortedMap<WorkloadId, WorkloadSource> sources,
    Plan plan,
    List<SpanningRoom> spanning,
    int maxUtilizationPct) {
  public CheckInput {
    Objects.requireNonNull(demand, "demand");
    Objects.requireNonNull(plan, "plan");
    sources = Collections.unmodifiableSortedMap(new TreeMap<>(sources));
    spanning = List.copyOf(spanning);
    if (maxUtilizationPct < 1 || maxUtilizationPct > 100) {
      throw new IllegalArgumentException("maxUtilizationPct must be 1..100");
    }
  }
}
