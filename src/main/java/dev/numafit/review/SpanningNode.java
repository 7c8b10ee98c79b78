package dev.numafit.review;

import java.util.List;
import java.util.Objects;

/**
 * A node of today's pool larger than the host profile's one-node worker: as a VM it cannot fit one
 * NUMA node of its host.
 *
 * @param over per resource ({@code cpu} in millicores, {@code memory} in bytes): the node's
 *     capacity, the one-node worker's, and by how much it is larger
 */
public record SpanningNode(String node, List<Excess> over) {
  /** One resource by which a node exceeds the one-node worker. */
  public record Excess(String resource, long capacity, long oneNode, long over) {}

  public SpanningNode {
    Objects.requireNonNull(node, "node");
    over = List.copyOf(over);
  }
}
