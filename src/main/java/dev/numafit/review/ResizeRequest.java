package dev.numafit.review;

import dev.numafit.demand.ReplicaMode;
import dev.numafit.resource.Resources;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * What the user asks the review to check.
 *
 * @param poolKey label key selecting the pool's nodes ({@code --pool key=value})
 * @param poolValue label value selecting the pool's nodes
 * @param nodes node count after the resize; empty keeps today's count
 * @param shape node shape after the resize; empty keeps the pool's nodes as they are
 * @param oneNodeWorker capacity of the host profile's one-node worker (cpu in millicores, memory
 *     in bytes); empty when no host profile was given (no NUMA check)
 * @param hostProfile the host profile's name, for reports
 * @param hostFailures hosts that may fail after the resize with every pod still placed
 * @param hostLabel node label naming the host a worker runs on; empty: {@code workersPerHost}
 *     consecutive nodes (by name) share a host
 * @param workersPerHost workers on one host when no host label is given (one per NUMA node)
 * @param from running pods or declared workloads
 * @param replicas which replica count declared workloads use
 */
public record ResizeRequest(
    String poolKey,
    String poolValue,
    OptionalInt nodes,
    Optional<NodeShape> shape,
    Optional<Resources> oneNodeWorker,
    Optional<String> hostProfile,
    int hostFailures,
    Optional<String> hostLabel,
    int workersPerHost,
    DemandSource from,
    ReplicaMode replicas) {
  public ResizeRequest {
    Objects.requireNonNull(poolKey, "poolKey");
    Objects.requireNonNull(poolValue, "poolValue");
    Objects.requireNonNull(nodes, "nodes");
    Objects.requireNonNull(shape, "shape");
    Objects.requireNonNull(oneNodeWorker, "oneNodeWorker");
    Objects.requireNonNull(hostProfile, "hostProfile");
    Objects.requireNonNull(hostLabel, "hostLabel");
    Objects.requireNonNull(from, "from");
    Objects.requireNonNull(replicas, "replicas");
    if (nodes.isPresent() && nodes.getAsInt() < 1) {
      throw new IllegalArgumentException("--nodes must be 1 or more, got " + nodes.getAsInt());
    }
    if (hostFailures < 0) {
      throw new IllegalArgumentException("--host-failures must be 0 or more");
    }
    if (workersPerHost < 1) {
      throw new IllegalArgumentException("workers per host must be 1 or more");
    }
  }

  /** The pool selector as the user wrote it. */
  public String pool() {
    return poolKey + "=" + poolValue;
  }
}
