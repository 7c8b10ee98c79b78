package dev.numafit.host;

import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Objects;

/**
 * One NUMA node of a host after per-node exceptions are applied.
 *
 * @param id node number, 0-based, in socket order
 * @param socket the socket this node belongs to, 0-based
 * @param cores physical cores
 * @param threadsPerCore hardware threads per core (2 with SMT)
 * @param memoryBytes installed memory: the sum of the DIMMs, or the size given directly
 * @param channels memory channels with their DIMMs; empty when the profile gives memory directly
 * @param channelsConfirmed false when the channel population is unknown (captured without SMBIOS)
 * @param extraCapacity what a worker on this node may use beyond CPU and memory: pre-allocated
 *     hugepages as {@code hugepages-<size>} in bytes, attached devices as extended resource counts
 */
public record NumaNode(
    int id,
    int socket,
    int cores,
    int threadsPerCore,
    long memoryBytes,
    List<MemoryChannel> channels,
    boolean channelsConfirmed,
    Resources extraCapacity) {
  public NumaNode {
    channels = List.copyOf(channels);
    Objects.requireNonNull(extraCapacity, "extraCapacity");
  }

  public int threads() {
    return cores * threadsPerCore;
  }

  public long populatedChannels() {
    return channels.stream().filter(MemoryChannel::populated).count();
  }
}
