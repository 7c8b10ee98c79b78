package dev.numafit.cluster.model;

import java.util.Objects;

/**
 * A node taint ("Taints and Tolerations", kubernetes.io/docs/concepts/scheduling-eviction/
 * taint-and-toleration/).
 *
 * @param value empty when the taint has no value
 * @param effect {@code NoSchedule}, {@code PreferNoSchedule} or {@code NoExecute}
 */
public record Taint(String key, String value, String effect) implements Comparable<Taint> {
  public Taint {
    Objects.requireNonNull(key, "key");
    value = value == null ? "" : value;
    Objects.requireNonNull(effect, "effect");
  }

  /**
   * Whether the scheduler refuses pods that do not tolerate it: {@code NoSchedule} and {@code
   * NoExecute} do; {@code PreferNoSchedule} is only a preference.
   */
  public boolean blocksScheduling() {
    return !"PreferNoSchedule".equals(effect);
  }

  @Override
  public String toString() {
    return key + (value.isEmpty() ? "" : "=" + value) + ":" + effect;
  }

  @Override
  public int compareTo(Taint o) {
    return toString().compareTo(o.toString());
  }
}
