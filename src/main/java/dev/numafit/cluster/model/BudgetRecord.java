package dev.numafit.cluster.model;

import java.util.Objects;
import java.util.Optional;

/**
 * A PodDisruptionBudget. Which pods it covers is resolved on reading (see {@link
 * PodRecord#budgets()}), so only its limits are kept here.
 *
 * @param minAvailable {@code spec.minAvailable}, when set
 * @param maxUnavailable {@code spec.maxUnavailable}, when set
 */
public record BudgetRecord(
    String namespace,
    String name,
    Optional<IntOrPercent> minAvailable,
    Optional<IntOrPercent> maxUnavailable) {
  public BudgetRecord {
    Objects.requireNonNull(namespace, "namespace");
    Objects.requireNonNull(name, "name");
    minAvailable = minAvailable == null ? Optional.empty() : minAvailable;
    maxUnavailable = maxUnavailable == null ? Optional.empty() : maxUnavailable;
  }

  /** {@code namespace/name}. */
  public String id() {
    return namespace + "/" + name;
  }

  /**
   * Evictions the budget allows now, as the disruption controller computes them
   * ("Specifying a Disruption Budget for your Application"): with {@code minAvailable} the
   * desired healthy count is that value (a percentage of the expected pods, rounded up); with
   * {@code maxUnavailable} it is expected pods minus that value. Allowed = healthy − desired,
   * never below zero. With neither field set nothing limits evictions.
   *
   * @param expected pods the budget covers (the controller's scale)
   * @param healthy of those, how many run now
   */
  public int allowedDisruptions(int expected, int healthy) {
    int desired;
    if (minAvailable.isPresent()) {
      desired = minAvailable.get().of(expected);
    } else if (maxUnavailable.isPresent()) {
      desired = expected - maxUnavailable.get().of(expected);
    } else {
      return Integer.MAX_VALUE;
    }
    return Math.max(0, healthy - desired);
  }

  /** {@code minAvailable 2} or {@code maxUnavailable 25%}, for reports. */
  public String rule() {
    if (minAvailable.isPresent()) {
      return "minAvailable " + minAvailable.get();
    }
    return maxUnavailable.map(m -> "maxUnavailable " + m).orElse("no limit");
  }
}
