package dev.numafit.cluster.model;

import dev.numafit.demand.Replicas;
import dev.numafit.demand.WorkloadId;
import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * A workload as declared (its template and replica counts), for {@code --from declared}.
 *
 * @param perWorker a DaemonSet: one pod on every matching node
 * @param requests effective requests of one pod after admission (LimitRange defaults,
 *     RuntimeClass overhead), cpu in millicores, other resources in bytes or counts
 */
public record WorkloadRecord(
    WorkloadId id, Replicas replicas, boolean perWorker, Resources requests, Placement placement) {
  public WorkloadRecord {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(replicas, "replicas");
    Objects.requireNonNull(requests, "requests");
    Objects.requireNonNull(placement, "placement");
  }
}
