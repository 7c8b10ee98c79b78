package dev.numafit.cluster.model;

import dev.numafit.demand.WorkloadId;
import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Objects;

/**
 * One pod of a running cluster, compact: what the review needs and nothing else.
 *
 * @param workload the owning workload resolved through owner references (a ReplicaSet's pods
 *     belong to its Deployment, a Job's to its CronJob); a pod without owner is its own workload
 *     ({@code namespace/Pod/name})
 * @param node {@code spec.nodeName}; empty while the pod is not scheduled
 * @param phase {@code status.phase} ({@code Pending}, {@code Running}, {@code Unknown})
 * @param requests effective pod requests as the scheduler counts them (cpu in millicores, other
 *     resources in bytes or counts; without the {@code pods} count)
 * @param daemon true for a pod owned by a DaemonSet
 * @param budgets PodDisruptionBudgets ({@code namespace/name}) whose selector matches the pod,
 *     sorted
 */
public record PodRecord(
    String namespace,
    String name,
    WorkloadId workload,
    String node,
    String phase,
    Resources requests,
    Placement placement,
    boolean daemon,
    List<String> budgets) {
  public PodRecord {
    Objects.requireNonNull(namespace, "namespace");
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(workload, "workload");
    node = node == null ? "" : node;
    Objects.requireNonNull(phase, "phase");
    Objects.requireNonNull(requests, "requests");
    Objects.requireNonNull(placement, "placement");
    budgets = List.copyOf(budgets);
  }

  /** {@code namespace/name}, how a running pod is named in reports. */
  public String id() {
    return namespace + "/" + name;
  }

  /** Whether the pod is bound to a node. */
  public boolean scheduled() {
    return !node.isEmpty();
  }

  /** Counts as healthy for a disruption budget: bound and {@code Running}. */
  public boolean healthy() {
    return scheduled() && "Running".equals(phase);
  }
}
