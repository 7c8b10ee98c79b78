package dev.numafit.check;

import dev.numafit.diag.Severity;
import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * The rules of the pre-merge gate. Each id is stable: CI configurations, {@code --fail-on} lists
 * and SARIF consumers key on it. docs/check-rules.md lists them with their meaning.
 */
public enum Rule {
  /** A pod's requests exceed what a one-node worker has left after DaemonSets. */
  POD_EXCEEDS_WORKER(
      "pod-exceeds-worker",
      Severity.ERROR,
      true,
      "Pod larger than a one-node worker",
      "The pod requests more of a resource than a one-node worker has left for pods (the"
          + " kubelet's allocatable less DaemonSets and per-worker demand, scaled by"
          + " --max-utilization). It would sit pending, or force a worker wider than one NUMA"
          + " node. Lower its requests or split the workload."),
  /** A pod's requests exceed even the largest shape the host allows. */
  POD_EXCEEDS_HOST(
      "pod-exceeds-host",
      Severity.ERROR,
      true,
      "Pod larger than a whole host",
      "The pod requests more than even a worker spanning the whole host would have left for"
          + " pods. No worker shape on this host can ever run it."),
  /** A Guaranteed pod pins more whole CPUs than a one-node worker's allocatable holds. */
  EXCLUSIVE_CPUS_EXCEED_WORKER(
      "exclusive-cpus-exceed-worker",
      Severity.ERROR,
      true,
      "Exclusive CPUs beyond a one-node worker",
      "The pod is Guaranteed with integer CPU requests, so the static CPU manager pins whole"
          + " CPUs for it; it pins more than the floor of the one-node worker's allocatable"
          + " cores, so it cannot be admitted there."),
  /** Hugepages beyond the worker's hugepages capacity (or its memory where none is given). */
  HUGEPAGES_EXCEED_WORKER(
      "hugepages-exceed-worker",
      Severity.ERROR,
      true,
      "Hugepages beyond a one-node worker",
      "The pod requests more hugepages of a size than a one-node worker pre-allocates (from the"
          + " host profile or --worker). Where no hugepages capacity is given, its hugepages and"
          + " memory requests together exceed the worker's memory left for pods."),
  /** A container without a CPU or memory request. */
  MISSING_REQUEST(
      "missing-request",
      Severity.WARNING,
      false,
      "Container without a CPU or memory request",
      "A long-running container has no CPU or memory request after limits and LimitRange"
          + " defaults are applied. The scheduler counts it as zero, so sizing is blind to it."
          + " Set requests."),
  /** Limits far above requests. */
  LIMIT_REQUEST_RATIO(
      "limit-request-ratio",
      Severity.WARNING,
      false,
      "Limit far above request",
      "A container's CPU or memory limit is more than --limit-ratio times its request. Workers"
          + " are sized from requests; a pod that uses its limit takes room sizing did not"
          + " count."),
  /** The change needs more hosts than the fleet has. */
  FLEET_CAPACITY(
      "fleet-capacity",
      Severity.ERROR,
      true,
      "Fleet too small",
      "With --fleet-hosts N, the workload at peak (with --host-failures hosts of headroom and"
          + " --max-utilization) needs more than N hosts.");

  private final String id;
  private final Severity severity;
  private final boolean failsByDefault;
  private final String title;
  private final String help;

  Rule(String id, Severity severity, boolean failsByDefault, String title, String help) {
    this.id = id;
    this.severity = severity;
    this.failsByDefault = failsByDefault;
    this.title = title;
    this.help = help;
  }

  /** The stable id, e.g. {@code pod-exceeds-worker}. */
  public String id() {
    return id;
  }

  /** The severity every finding of this rule carries. */
  public Severity severity() {
    return severity;
  }

  /**
   * Whether the rule is in the default {@code --fail-on} set ({@link #FLEET_CAPACITY} only when
   * {@code --fleet-hosts} is given, which is the only time it can fire).
   */
  public boolean failsByDefault() {
    return failsByDefault;
  }

  /** A short title. */
  public String title() {
    return title;
  }

  /** What the rule means and what to do, in a few sentences. */
  public String help() {
    return help;
  }

  /** The rule with this id, if any (case-insensitive). */
  public static Optional<Rule> byId(String id) {
    String want = id.strip().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(r -> r.id.equals(want)).findFirst();
  }

  /** Every id, comma-separated, for messages. */
  public static String ids() {
    return Arrays.stream(values()).map(Rule::id).collect(Collectors.joining(", "));
  }

  @Override
  public String toString() {
    return id;
  }
}
