package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import dev.numafit.plan.PlanComparison;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;

/**
 * What {@code numafit plan} prints: one plan per host profile (or --worker shape), their
 * comparison when there are several, and every warning raised on the way.
 *
 * @param demand the workloads the plans were made for (the text report prints a summary)
 * @param plans one per host profile or --worker shape, in the order given
 * @param comparison the plans side by side when there are two or more, else empty
 * @param warnings diagnostics of every severity below error, sorted and without duplicates
 */
public record PlanReport(
    Demand demand,
    List<dev.numafit.plan.Plan> plans,
    Optional<PlanComparison> comparison,
    List<Diagnostic> warnings) {
  public PlanReport {
    Objects.requireNonNull(demand, "demand");
    plans = List.copyOf(plans);
    Objects.requireNonNull(comparison, "comparison");
    warnings = List.copyOf(new TreeSet<>(warnings));
  }
}
