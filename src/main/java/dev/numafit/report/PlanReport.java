package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import dev.numafit.plan.PlanComparison;
import dev.numafit.plan.PoolPlan;
import dev.numafit.plan.Unplaceable;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * What {@code numafit plan} prints: one plan per host profile (or --worker shape), their
 * comparison when there are several, and every warning raised on the way.
 *
 * @param demand the workloads the plans were made for (the text report prints a summary)
 * @param plans one per host profile or --worker shape, in the order given
 * @param comparison the plans side by side when there are two or more, else empty
 * @param warnings diagnostics of every severity below error, sorted and without duplicates
 * @param hosts the host behind each plan, by host profile name (by pool name when there are
 *     pools), for the reports that draw hosts; empty when not known (a bare --worker plan has
 *     none)
 * @param pools with a pools file, one per plan in the same order (each pool's {@link
 *     PoolPlan#plan} is the plan at the same index); empty without one
 * @param unplaceable workloads whose node rules no pool satisfies, sorted; reported whenever
 *     not empty
 */
public record PlanReport(
    Demand demand,
    List<dev.numafit.plan.Plan> plans,
    Optional<PlanComparison> comparison,
    List<Diagnostic> warnings,
    SortedMap<String, PlanHost> hosts,
    List<PoolPlan> pools,
    List<Unplaceable> unplaceable) {
  public PlanReport {
    Objects.requireNonNull(demand, "demand");
    plans = List.copyOf(plans);
    Objects.requireNonNull(comparison, "comparison");
    warnings = List.copyOf(new TreeSet<>(warnings));
    hosts = Collections.unmodifiableSortedMap(new TreeMap<>(hosts));
    pools = List.copyOf(pools);
    unplaceable = unplaceable.stream().sorted().toList();
    if (!pools.isEmpty() && pools.size() != plans.size()) {
      throw new IllegalArgumentException("one pool per plan: " + pools.size() + " pools, "
          + plans.size() + " plans");
    }
  }

  /** A report without pools. */
  public PlanReport(
      Demand demand,
      List<dev.numafit.plan.Plan> plans,
      Optional<PlanComparison> comparison,
      List<Diagnostic> warnings,
      SortedMap<String, PlanHost> hosts) {
    this(demand, plans, comparison, warnings, hosts, List.of(), List.of());
  }

  /** A report without host drawings. */
  public PlanReport(
      Demand demand,
      List<dev.numafit.plan.Plan> plans,
      Optional<PlanComparison> comparison,
      List<Diagnostic> warnings) {
    this(demand, plans, comparison, warnings, new TreeMap<>());
  }

  /** The host behind {@code plan}, when known. */
  public Optional<PlanHost> hostOf(dev.numafit.plan.Plan plan) {
    Optional<PoolPlan> pool = poolOf(plan);
    if (pool.isPresent()) {
      return Optional.ofNullable(hosts.get(pool.get().name()));
    }
    return plan.hostProfile().map(hosts::get);
  }

  /** The pool {@code plan} belongs to, when the report has pools. */
  public Optional<PoolPlan> poolOf(dev.numafit.plan.Plan plan) {
    for (int i = 0; i < pools.size(); i++) {
      if (plans.get(i) == plan) {
        return Optional.of(pools.get(i));
      }
    }
    return Optional.empty();
  }
}
