package dev.numafit.plan;

import dev.numafit.demand.WorkloadId;
import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * A workload whose pod does not fit the one-node worker's room.
 *
 * @param exceeds per resource, by how much the pod's request is over the room
 * @param smallestShape the smallest spanning shape that would hold the pod: {@code 2-nodes},
 *     {@code socket}, {@code host}, or {@code none} (larger than a whole host)
 */
public record Oversize(WorkloadId workload, Resources exceeds, String smallestShape) {
  public Oversize {
    Objects.requireNonNull(workload, "workload");
    Objects.requireNonNull(exceeds, "exceeds");
    Objects.requireNonNull(smallestShape, "smallestShape");
  }
}
