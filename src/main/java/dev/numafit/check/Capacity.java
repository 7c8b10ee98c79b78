package dev.numafit.check;

import java.util.OptionalInt;

/**
 * Workers and hosts a plan needs.
 *
 * @param hosts empty without a host profile (a bare {@code --worker} run counts workers only)
 */
public record Capacity(int workers, OptionalInt hosts) {
  public Capacity {
    if (workers < 0) {
      throw new IllegalArgumentException("workers must be >= 0");
    }
    if (hosts == null) {
      hosts = OptionalInt.empty();
    }
  }
}
