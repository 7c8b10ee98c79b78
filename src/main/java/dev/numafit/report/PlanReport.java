package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import dev.numafit.plan.PlanComparison;
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
 * @param hosts the host behind each plan, by host profile name, for the reports that draw hosts;
 *     empty when not known (a bare --worker plan has none)
 */
public record PlanReport(
    Demand demand,
    List<dev.numafit.plan.Plan> plans,
    Optional<PlanComparison> comparison,
    List<Diagnostic> warnings,
    SortedMap<String, PlanHost> hosts) {
  public PlanReport {
    Objects.requireNonNull(demand, "demand");
    plans = List.copyOf(plans);
    Objects.requireNonNull(comparison, "comparison");
    warnings = List.copyOf(new TreeSet<>(warnings));
    hosts = Collections.unmodifiableSortedMap(new TreeMap<>(hosts));
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
    return plan.hostProfile().map(hosts::get);
  }
}
