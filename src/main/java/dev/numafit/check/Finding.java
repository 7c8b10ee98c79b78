package dev.numafit.check;

import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.Severity;
import dev.numafit.diag.SourceRef;
import dev.numafit.resource.Resources;
import java.util.Comparator;
import java.util.Objects;
import java.util.Optional;

/**
 * One thing the gate found.
 *
 * @param workload the workload it is about; empty for the fleet-wide capacity rule
 * @param location the file and line to change: a container's {@code resources:}, the pod template,
 *     or the replica count
 * @param message one sentence with the amounts, e.g. {@code cpu 20 is 4500m over the 15500m a
 *     one-node worker leaves}
 * @param amounts by how much each resource is over (cpu in millicores, bytes or counts); for the
 *     capacity rule {@code hosts} over the fleet; empty for advice rules
 */
public record Finding(
    Rule rule,
    Severity severity,
    Optional<WorkloadId> workload,
    SourceRef location,
    String message,
    Resources amounts)
    implements Comparable<Finding> {
  private static final Comparator<Finding> ORDER =
      Comparator.comparing(Finding::key).thenComparing(Finding::location);

  public Finding {
    Objects.requireNonNull(rule, "rule");
    Objects.requireNonNull(severity, "severity");
    Objects.requireNonNull(workload, "workload");
    Objects.requireNonNull(location, "location");
    Objects.requireNonNull(message, "message");
    Objects.requireNonNull(amounts, "amounts");
  }

  /** A finding at the rule's own severity. */
  public static Finding of(
      Rule rule, Optional<WorkloadId> workload, SourceRef at, String message, Resources amounts) {
    return new Finding(rule, rule.severity(), workload, at, message, amounts);
  }

  /**
   * What identifies the finding across a change: workload and rule, not the line, which moves
   * whenever anything above it is edited.
   */
  public Key key() {
    return new Key(workload.map(WorkloadId::toString).orElse(""), rule);
  }

  /** The workload as printed, or {@code (fleet)} for the capacity rule. */
  public String subject() {
    return workload.map(WorkloadId::toString).orElse("(fleet)");
  }

  @Override
  public int compareTo(Finding o) {
    return ORDER.compare(this, o);
  }

  /** The identity of a finding across a change. */
  public record Key(String workload, Rule rule) implements Comparable<Key> {
    public Key {
      Objects.requireNonNull(workload, "workload");
      Objects.requireNonNull(rule, "rule");
    }

    @Override
    public int compareTo(Key o) {
      int c = workload.compareTo(o.workload);
      return c != 0 ? c : rule.compareTo(o.rule);
    }
  }
}
