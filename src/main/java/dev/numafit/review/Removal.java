package dev.numafit.review;

import java.util.List;
import java.util.Objects;

/**
 * One node of the scale-down plan, in removal order.
 *
 * @param moves pods that must move elsewhere (DaemonSet pods go with the node)
 * @param safe whether every one of them fits on the nodes that remain; the plan never picks an
 *     unsafe node while a safe one is left, and lists an unsafe one only when the node count
 *     demands it
 * @param unplaced pods of this node that no remaining node can take
 */
public record Removal(String node, int moves, boolean safe, List<String> unplaced) {
  public Removal {
    Objects.requireNonNull(node, "node");
    unplaced = List.copyOf(unplaced);
  }
}
