package dev.numafit.shape;

import dev.numafit.resource.Resources;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * The kubelet's hard-eviction signals that reduce allocatable, and the resource each one guards
 * (FACTS A4, K11/K12): {@code memory.available} → memory, {@code nodefs.available} →
 * ephemeral-storage. Other signals (imagefs, inodes, pids) do not change allocatable.
 */
public final class EvictionSignals {
  /** The signal guarding memory. */
  public static final String MEMORY_AVAILABLE = "memory.available";

  /** The signal guarding the node's root filesystem, counted against ephemeral-storage. */
  public static final String NODEFS_AVAILABLE = "nodefs.available";

  private static final Map<String, String> SIGNAL_TO_RESOURCE = new TreeMap<>(Map.of(
      MEMORY_AVAILABLE, Resources.MEMORY,
      NODEFS_AVAILABLE, Resources.EPHEMERAL_STORAGE));

  private EvictionSignals() {}

  /** The resource a signal guards, empty for a signal that does not affect allocatable. */
  public static Optional<String> resourceOf(String signal) {
    return Optional.ofNullable(SIGNAL_TO_RESOURCE.get(signal));
  }

  /** The signal that guards a resource, empty when none does. */
  public static Optional<String> signalOf(String resource) {
    return SIGNAL_TO_RESOURCE.entrySet().stream()
        .filter(e -> e.getValue().equals(resource))
        .map(Map.Entry::getKey)
        .findFirst();
  }
}
