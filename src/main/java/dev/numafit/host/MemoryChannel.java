package dev.numafit.host;

import java.util.List;
import java.util.Objects;

/**
 * One memory channel of a NUMA node and the DIMMs on it, each size in bytes. An empty list is an
 * unpopulated channel: the node loses that channel's share of bandwidth.
 */
public record MemoryChannel(String name, List<Long> dimmBytes) {
  public MemoryChannel {
    Objects.requireNonNull(name, "name");
    dimmBytes = List.copyOf(dimmBytes);
  }

  public boolean populated() {
    return !dimmBytes.isEmpty();
  }

  public long totalBytes() {
    return dimmBytes.stream().mapToLong(Long::longValue).sum();
  }
}
