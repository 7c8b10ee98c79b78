package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.Objects;
import java.util.TreeSet;

/**
 * What {@code numafit plan} prints: one plan per host profile (or --worker shape), their
 * comparison when there are several, and every warning raised on the way.
 *
 * @param demand the workloads the plans were made for (the text report prints a summary)
 * @param plans one per host profile or --worker shape, in the order given
 * @param comparison one row per plan when there are two or more plans, else empty
 * @param warnings diagnostics of every severity below error, sorted and without duplicates
 */
public record PlanReport(
    Demand demand,
    List<dev.numafit.plan.Plan> plans,
    List<ComparisonRow> comparison,
    List<Diagnostic> warnings) {
  public PlanReport {
    Objects.requireNonNull(demand, "demand");
    plans = List.copyOf(plans);
    comparison = List.copyOf(comparison);
    warnings = List.copyOf(new TreeSet<>(warnings));
  }
}
