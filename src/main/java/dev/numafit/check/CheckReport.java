package dev.numafit.check;

import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeSet;

/**
 * The gate's verdict on a change: every finding with whether it is new and whether it fails the
 * gate, the findings the change resolved, and the capacity before and after.
 *
 * @param worker one line describing the worker shape checked against
 * @param workloads every workload checked (namespace/Kind/name), sorted; JUnit output has one test
 *     case each
 * @param findings head findings, sorted
 * @param resolved baseline findings the change removed, sorted; empty without a baseline
 * @param baselineGiven whether a baseline was compared; without one every finding counts as new
 * @param head workers and hosts the change needs
 * @param base workers and hosts before the change, when a baseline was given
 * @param fleetHosts {@code --fleet-hosts}, when given
 * @param unchecked resources requested that have no capacity, so no rule compared them
 * @param warnings diagnostics below error raised while reading, sorted
 */
public record CheckReport(
    String worker,
    List<String> workloads,
    List<Entry> findings,
    List<Finding> resolved,
    boolean baselineGiven,
    Capacity head,
    Optional<Capacity> base,
    OptionalInt fleetHosts,
    List<String> unchecked,
    List<Diagnostic> warnings) {
  public CheckReport {
    Objects.requireNonNull(worker, "worker");
    workloads = List.copyOf(new TreeSet<>(workloads));
    findings = List.copyOf(findings);
    resolved = List.copyOf(resolved);
    Objects.requireNonNull(head, "head");
    Objects.requireNonNull(base, "base");
    Objects.requireNonNull(fleetHosts, "fleetHosts");
    unchecked = List.copyOf(unchecked);
    warnings = List.copyOf(new TreeSet<>(warnings));
  }

  /**
   * One finding of the change.
   *
   * @param isNew not present in the baseline (by workload and rule); always true without one
   * @param failing whether it fails the gate (its rule is in {@code --fail-on}, and it is new or
   *     {@code --fail-on-existing} was given)
   */
  public record Entry(Finding finding, boolean isNew, boolean failing) {
    public Entry {
      Objects.requireNonNull(finding, "finding");
    }
  }

  /** Findings that fail the gate. */
  public long failingCount() {
    return findings.stream().filter(Entry::failing).count();
  }

  /** Whether the gate passes: no failing finding. */
  public boolean passed() {
    return failingCount() == 0;
  }

  /** New findings only. */
  public List<Entry> newFindings() {
    return findings.stream().filter(Entry::isNew).toList();
  }

  /** Workers the change adds (negative when it removes some); empty without a baseline. */
  public OptionalInt workersDelta() {
    return base.map(b -> OptionalInt.of(head.workers() - b.workers())).orElse(OptionalInt.empty());
  }

  /** Hosts the change adds; empty without a baseline or without a host profile. */
  public OptionalInt hostsDelta() {
    if (base.isEmpty() || head.hosts().isEmpty() || base.get().hosts().isEmpty()) {
      return OptionalInt.empty();
    }
    return OptionalInt.of(head.hosts().getAsInt() - base.get().hosts().getAsInt());
  }

  /**
   * The capacity change in words, {@code +3 workers, +1 host} (a zero change reads {@code +0
   * workers}); empty without a baseline.
   */
  public Optional<String> deltaText() {
    if (workersDelta().isEmpty()) {
      return Optional.empty();
    }
    StringBuilder b = new StringBuilder(signed(workersDelta().getAsInt(), "worker"));
    hostsDelta().ifPresent(h -> b.append(", ").append(signed(h, "host")));
    return Optional.of(b.toString());
  }

  private static String signed(int n, String noun) {
    return (n >= 0 ? "+" : "") + n + " " + noun + (Math.abs(n) == 1 ? "" : "s");
  }
}
