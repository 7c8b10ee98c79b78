package dev.numafit.host;

import java.util.OptionalLong;

/**
 * What one NUMA node offers, derived from a {@link HostProfile}.
 *
 * @param node node id
 * @param socket socket id
 * @param cores physical cores
 * @param threads hardware threads (cores × threads per core)
 * @param memoryBytes installed memory in bytes
 * @param channels memory channels listed (0 when memory is given directly)
 * @param populatedChannels channels with at least one DIMM
 * @param peakBandwidthBytesPerSecond populated channels × MT/s × 8 bytes; empty when the speed or
 *     the channel population is unknown
 */
public record NodeFacts(
    int node,
    int socket,
    int cores,
    int threads,
    long memoryBytes,
    int channels,
    int populatedChannels,
    OptionalLong peakBandwidthBytesPerSecond) {}
