package dev.numafit.check;

import java.math.BigDecimal;
import java.util.Collections;
import java.util.EnumSet;
import java.util.Objects;
import java.util.OptionalInt;
import java.util.Set;
import java.util.SortedSet;
import java.util.TreeSet;

/**
 * What the gate checks and what makes it fail.
 *
 * @param limitRatio a container whose CPU or memory limit is more than this many times its request
 *     gets a {@link Rule#LIMIT_REQUEST_RATIO} finding; above 1
 * @param fleetHosts the hosts the fleet has ({@code --fleet-hosts}); empty leaves capacity
 *     unchecked
 * @param failOn the rules whose findings fail the gate
 * @param failOnExisting fail on findings already present in the baseline too, not only new ones
 */
public record CheckOptions(
    BigDecimal limitRatio, OptionalInt fleetHosts, SortedSet<Rule> failOn, boolean failOnExisting) {
  /**
   * Default limit-to-request ratio above which a limit counts as far above its request: 4. A
   * choice of ours (common practice leaves limits a small multiple of requests), not a published
   * figure.
   */
  public static final BigDecimal DEFAULT_LIMIT_RATIO = BigDecimal.valueOf(4);

  public CheckOptions {
    Objects.requireNonNull(limitRatio, "limitRatio");
    Objects.requireNonNull(fleetHosts, "fleetHosts");
    if (limitRatio.compareTo(BigDecimal.ONE) <= 0) {
      throw new IllegalArgumentException(
          "limit ratio must be above 1, was " + limitRatio.toPlainString());
    }
    if (fleetHosts.isPresent() && fleetHosts.getAsInt() < 1) {
      throw new IllegalArgumentException("fleet hosts must be at least 1");
    }
    failOn = Collections.unmodifiableSortedSet(new TreeSet<>(failOn));
  }

  /**
   * The default {@code --fail-on} set: the oversize and unschedulable rules, and {@link
   * Rule#FLEET_CAPACITY} when the fleet size is given.
   */
  public static SortedSet<Rule> defaultFailOn(boolean fleetGiven) {
    Set<Rule> rules = EnumSet.noneOf(Rule.class);
    for (Rule r : Rule.values()) {
      if (r.failsByDefault() && (r != Rule.FLEET_CAPACITY || fleetGiven)) {
        rules.add(r);
      }
    }
    return new TreeSet<>(rules);
  }

  /** Default options: ratio 4, no fleet size, the default fail set, only new findings fail. */
  public static CheckOptions defaults() {
    return new CheckOptions(DEFAULT_LIMIT_RATIO, OptionalInt.empty(), defaultFailOn(false), false);
  }
}
