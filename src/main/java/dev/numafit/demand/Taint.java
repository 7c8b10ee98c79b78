package dev.numafit.demand;

import java.util.Objects;
import java.util.Optional;

/**
 * A taint that every worker of a pool carries, as in "Taints and Tolerations"
 * (kubernetes.io/docs/concepts/scheduling-eviction/taint-and-toleration/).
 *
 * @param key the taint key, not empty
 * @param value the taint value; empty when the taint has none
 * @param effect what the taint does to pods that do not tolerate it
 */
public record Taint(String key, String value, Effect effect) implements Comparable<Taint> {
  /** The taint effects of the Kubernetes API. */
  public enum Effect {
    /** New pods that do not tolerate the taint are not scheduled on the node. */
    NO_SCHEDULE("NoSchedule"),
    /** The scheduler tries to avoid the node; a preference, not a rule. */
    PREFER_NO_SCHEDULE("PreferNoSchedule"),
    /** Pods that do not tolerate it are not scheduled and running ones are evicted. */
    NO_EXECUTE("NoExecute");

    private final String apiName;

    Effect(String apiName) {
      this.apiName = apiName;
    }

    /** The name used in the Kubernetes API. */
    public String apiName() {
      return apiName;
    }

    /** The effect with this API name, if any. */
    public static Optional<Effect> of(String apiName) {
      for (Effect e : values()) {
        if (e.apiName.equals(apiName)) {
          return Optional.of(e);
        }
      }
      return Optional.empty();
    }
  }

  public Taint {
    Objects.requireNonNull(key, "key");
    if (key.isEmpty()) {
      throw new IllegalArgumentException("a taint needs a key");
    }
    value = value == null ? "" : value;
    Objects.requireNonNull(effect, "effect");
  }

  /**
   * Whether a pod that does not tolerate this taint is kept off the node: {@code NoSchedule} and
   * {@code NoExecute} do so; {@code PreferNoSchedule} is only a preference.
   */
  public boolean repels() {
    return effect != Effect.PREFER_NO_SCHEDULE;
  }

  /** {@code key=value:Effect}, or {@code key:Effect} without a value, as kubectl writes it. */
  @Override
  public String toString() {
    return key + (value.isEmpty() ? "" : "=" + value) + ":" + effect.apiName();
  }

  @Override
  public int compareTo(Taint o) {
    return toString().compareTo(o.toString());
  }
}
