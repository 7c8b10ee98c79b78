package dev.numafit.check;

import dev.numafit.diag.Diagnostic;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;

/**
 * Compares the findings of a change with its baseline and decides which fail the gate. Findings
 * are matched by workload and rule, never by line: editing a file above a workload moves its lines
 * but does not make its old findings new.
 */
public final class Gate {
  private Gate() {}

  /**
   * The verdict.
   *
   * @param workloads every workload checked, as printed ids
   * @param head findings after the change
   * @param base findings before the change; empty when no baseline was given (then every finding
   *     is new)
   */
  public static CheckReport decide(
      String worker,
      List<String> workloads,
      List<Finding> head,
      Optional<List<Finding>> base,
      Capacity headCapacity,
      Optional<Capacity> baseCapacity,
      CheckOptions options,
      List<String> unchecked,
      List<Diagnostic> warnings) {
    Set<Finding.Key> before = new TreeSet<>();
    base.ifPresent(b -> b.forEach(f -> before.add(f.key())));
    Set<Finding.Key> after = new TreeSet<>();
    List<CheckReport.Entry> entries = new ArrayList<>();
    List<Finding> sorted = new ArrayList<>(head);
    sorted.sort(null);
    for (Finding f : sorted) {
      after.add(f.key());
      boolean isNew = !before.contains(f.key());
      boolean failing = options.failOn().contains(f.rule()) && (isNew || options.failOnExisting());
      entries.add(new CheckReport.Entry(f, isNew, failing));
    }
    List<Finding> resolved = new ArrayList<>();
    base.ifPresent(
        b -> b.stream().filter(f -> !after.contains(f.key())).sorted().forEach(resolved::add));
    return new CheckReport(
        worker,
        workloads,
        entries,
        resolved,
        base.isPresent(),
        headCapacity,
        baseCapacity,
        options.fleetHosts(),
        unchecked,
        warnings);
  }
}
