package dev.numafit.cluster.model;

import java.util.Objects;

/**
 * A pod toleration. Matching follows "Taints and Tolerations"
 * (kubernetes.io/docs/concepts/scheduling-eviction/taint-and-toleration/): an empty key with
 * {@code Exists} tolerates every taint; operator {@code Exists} ignores the value, {@code Equal}
 * (the default) compares it; an empty effect matches every effect.
 *
 * @param key empty for "every key" (only with {@code Exists})
 * @param operator {@code Equal} or {@code Exists}
 * @param value empty when not given
 * @param effect empty for every effect
 */
public record Toleration(String key, String operator, String value, String effect) {
  public Toleration {
    key = key == null ? "" : key;
    operator = operator == null || operator.isEmpty() ? "Equal" : operator;
    value = value == null ? "" : value;
    effect = effect == null ? "" : effect;
  }

  /** Whether this toleration tolerates {@code taint}. */
  public boolean tolerates(Taint taint) {
    Objects.requireNonNull(taint, "taint");
    if (!effect.isEmpty() && !effect.equals(taint.effect())) {
      return false;
    }
    if (key.isEmpty()) {
      return "Exists".equals(operator);
    }
    if (!key.equals(taint.key())) {
      return false;
    }
    return "Exists".equals(operator) || value.equals(taint.value());
  }
}
