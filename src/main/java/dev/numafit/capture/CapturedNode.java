package dev.numafit.capture;

import java.util.Collections;
import java.util.List;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One NUMA node of a captured host, with the facts derived for it.
 *
 * @param id the node's number in the profile: 0-based in socket order
 * @param sourceId the node's number on the host (sysfs {@code nodeN} or lscpu's Node column)
 * @param socket the socket, 0-based in package-id order
 * @param cpus online CPUs of the node
 * @param cores physical cores with at least one online thread
 * @param threadsPerCore the fewest online threads any of the node's cores has
 * @param memoryBytes memory: the modules mapped to the node when {@code channels} is not empty,
 *     else the kernel's {@code MemTotal} for the node (or an equal share of the modules)
 * @param memorySource where {@code memoryBytes} came from, in words, for the profile's comments
 * @param hugepages pre-allocated hugepages: page size in KiB → count
 * @param channels the node's memory channels; empty when the population is not known
 * @param channelsConfirmed true when the channels were mapped from the locators with one node per
 *     socket; false when assumed or unknown (the profile marks them "to confirm")
 */
public record CapturedNode(
    int id,
    int sourceId,
    int socket,
    List<Integer> cpus,
    int cores,
    int threadsPerCore,
    long memoryBytes,
    String memorySource,
    SortedMap<Long, Long> hugepages,
    List<CapturedChannel> channels,
    boolean channelsConfirmed) {
  public CapturedNode {
    cpus = List.copyOf(cpus);
    hugepages = Collections.unmodifiableSortedMap(new TreeMap<>(hugepages));
    channels = List.copyOf(channels);
    if (cores < 0 || threadsPerCore < 0 || memoryBytes < 0) {
      throw new IllegalArgumentException("cores, threads and memory must be >= 0");
    }
  }
}
