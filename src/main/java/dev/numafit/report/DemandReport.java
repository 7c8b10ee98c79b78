package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.Objects;
import java.util.TreeSet;

/**
 * What {@code numafit demand} prints: the workloads read and every non-error diagnostic.
 *
 * @param warnings warnings and notes (and, with --skip-invalid, the skipped errors), sorted
 */
public record DemandReport(Demand demand, List<Diagnostic> warnings) {
  public DemandReport {
    Objects.requireNonNull(demand, "demand");
    warnings = List.copyOf(new TreeSet<>(warnings));
  }
}
