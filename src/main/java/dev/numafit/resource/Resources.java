package dev.numafit.resource;

import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.function.LongBinaryOperator;

/**
 * An immutable vector of resource amounts keyed by Kubernetes resource name, sorted by name.
 *
 * <p>Units are integers: {@code cpu} in millicores, every other resource ({@code memory},
 * {@code ephemeral-storage}, {@code hugepages-<size>}, extended resources, {@code pods}) in bytes
 * or counts. Absent names are zero; zero entries are dropped so equal vectors compare equal.
 */
public final class Resources {
  public static final String CPU = "cpu";
  public static final String MEMORY = "memory";
  public static final String EPHEMERAL_STORAGE = "ephemeral-storage";
  public static final String PODS = "pods";

  public static final Resources EMPTY = new Resources(new TreeMap<>());

  private final SortedMap<String, Long> amounts;

  private Resources(TreeMap<String, Long> amounts) {
    amounts.values().removeIf(v -> v == 0L);
    this.amounts = Collections.unmodifiableSortedMap(amounts);
  }

  /** A vector from a map of name → amount; zero amounts are dropped. */
  public static Resources of(Map<String, Long> amounts) {
    TreeMap<String, Long> copy = new TreeMap<>();
    amounts.forEach(
        (k, v) -> copy.put(Objects.requireNonNull(k, "resource name"), Objects.requireNonNull(v, k)));
    return new Resources(copy);
  }

  /** A vector from alternating name, amount pairs: {@code of("cpu", 500L, "memory", 1L << 30)}. */
  public static Resources of(Object... nameAmountPairs) {
    if (nameAmountPairs.length % 2 != 0) {
      throw new IllegalArgumentException("expected name, amount pairs");
    }
    TreeMap<String, Long> m = new TreeMap<>();
    for (int i = 0; i < nameAmountPairs.length; i += 2) {
      m.put((String) nameAmountPairs[i], ((Number) nameAmountPairs[i + 1]).longValue());
    }
    return new Resources(m);
  }

  /** Whether a resource name is a hugepages resource ({@code hugepages-2Mi}, {@code hugepages-1Gi}). */
  public static boolean isHugepages(String name) {
    return name.startsWith("hugepages-");
  }

  /** The amount of a resource, zero when absent. */
  public long get(String name) {
    return amounts.getOrDefault(name, 0L);
  }

  /** Names with a non-zero amount, sorted. */
  public java.util.SortedSet<String> names() {
    return Collections.unmodifiableSortedSet(new java.util.TreeSet<>(amounts.keySet()));
  }

  /** The amounts as an unmodifiable sorted map (no zero entries). */
  public SortedMap<String, Long> asMap() {
    return amounts;
  }

  public boolean isEmpty() {
    return amounts.isEmpty();
  }

  public Resources with(String name, long amount) {
    TreeMap<String, Long> m = new TreeMap<>(amounts);
    m.put(name, amount);
    return new Resources(m);
  }

  public Resources without(String name) {
    TreeMap<String, Long> m = new TreeMap<>(amounts);
    m.remove(name);
    return new Resources(m);
  }

  public Resources plus(Resources other) {
    return combine(other, Math::addExact);
  }

  public Resources minus(Resources other) {
    return combine(other, Math::subtractExact);
  }

  /** Per-resource maximum. */
  public Resources max(Resources other) {
    return combine(other, Math::max);
  }

  /** Every amount multiplied by {@code factor}. */
  public Resources times(long factor) {
    TreeMap<String, Long> m = new TreeMap<>();
    amounts.forEach((k, v) -> m.put(k, Math.multiplyExact(v, factor)));
    return new Resources(m);
  }

  /** Whether every amount of this vector is at most the same amount of {@code capacity}. */
  public boolean fitsIn(Resources capacity) {
    for (Map.Entry<String, Long> e : amounts.entrySet()) {
      if (e.getValue() > capacity.get(e.getKey())) {
        return false;
      }
    }
    return true;
  }

  private Resources combine(Resources other, LongBinaryOperator op) {
    TreeMap<String, Long> m = new TreeMap<>();
    java.util.TreeSet<String> keys = new java.util.TreeSet<>(amounts.keySet());
    keys.addAll(other.amounts.keySet());
    for (String k : keys) {
      m.put(k, op.applyAsLong(get(k), other.get(k)));
    }
    return new Resources(m);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Resources r && r.amounts.equals(amounts);
  }

  @Override
  public int hashCode() {
    return amounts.hashCode();
  }

  @Override
  public String toString() {
    return amounts.toString();
  }
}
