package dev.numafit.demand;

import java.util.Objects;
import java.util.Optional;

/**
 * A pod's toleration, matched as "Taints and Tolerations"
 * (kubernetes.io/docs/concepts/scheduling-eviction/taint-and-toleration/) says: operator {@code
 * Exists} ignores the value, {@code Equal} (the default) compares it; an empty key with {@code
 * Exists} matches every key; an empty effect matches every effect.
 *
 * @param key the taint key to tolerate; empty for every key (only with {@code exists})
 * @param exists true for operator {@code Exists}, false for {@code Equal}
 * @param value compared with the taint's value when not {@code exists}; empty when not given
 * @param effect the effect tolerated; empty for every effect
 */
public record Toleration(String key, boolean exists, String value, Optional<Taint.Effect> effect) {
  /** Tolerates every taint: an empty key with {@code Exists}. */
  public static final Toleration EVERYTHING = new Toleration("", true, "", Optional.empty());

  public Toleration {
    key = key == null ? "" : key;
    value = value == null ? "" : value;
    Objects.requireNonNull(effect, "effect");
  }

  /** Whether this toleration tolerates {@code taint}. */
  public boolean tolerates(Taint taint) {
    Objects.requireNonNull(taint, "taint");
    if (effect.isPresent() && effect.get() != taint.effect()) {
      return false;
    }
    if (key.isEmpty()) {
      // An empty key is valid only with Exists; with Equal it tolerates nothing.
      return exists;
    }
    return key.equals(taint.key()) && (exists || value.equals(taint.value()));
  }

  @Override
  public String toString() {
    String k = key.isEmpty() ? "*" : key;
    String op = exists ? " exists" : "=" + value;
    return k + op + effect.map(e -> ":" + e.apiName()).orElse("");
  }
}
