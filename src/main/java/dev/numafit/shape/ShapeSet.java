package dev.numafit.shape;

import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.Objects;

/**
 * Every worker shape derived from one host profile.
 *
 * @param perNode the largest one-node worker of each NUMA node
 * @param oneNode the pool shape: the minimum over the nodes in each dimension
 * @param splits k workers per node, for k = 2 and 4
 * @param spanning shapes wider than a node, smallest first ({@code 2-nodes}, {@code socket},
 *     {@code host}), each spanning more nodes than the one before; used only to say how large an
 *     oversize pod's worker would have to be
 * @param notes what larger nodes leave unused under the pool shape, and the virtual-topology advice
 * @param warnings overcommit and similar warnings
 */
public record ShapeSet(
    List<NodeWorker> perNode,
    WorkerShape oneNode,
    List<WorkerShape> splits,
    List<WorkerShape> spanning,
    List<String> notes,
    List<Diagnostic> warnings) {
  public ShapeSet {
    perNode = List.copyOf(perNode);
    Objects.requireNonNull(oneNode, "oneNode");
    splits = List.copyOf(splits);
    spanning = List.copyOf(spanning);
    notes = List.copyOf(notes);
    warnings = List.copyOf(warnings);
  }
}
