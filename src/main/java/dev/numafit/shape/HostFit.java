package dev.numafit.shape;

import java.util.List;
import java.util.Optional;

/**
 * How many workers of a given shape one host carries.
 *
 * @param workersPerHost workers that fit by vCPUs and memory (0 when the shape is larger than the
 *     whole host)
 * @param spanning whether each worker is wider than every node, so the hypervisor splits it
 * @param split how such a worker is split, present only when {@code spanning}
 * @param notes per-node remarks (nodes the shape does not fit, what is left unused)
 */
public record HostFit(
    int workersPerHost, boolean spanning, Optional<SpanningSplit> split, List<String> notes) {
  public HostFit {
    if (workersPerHost < 0) {
      throw new IllegalArgumentException("workersPerHost must be >= 0");
    }
    notes = List.copyOf(notes);
  }
}
