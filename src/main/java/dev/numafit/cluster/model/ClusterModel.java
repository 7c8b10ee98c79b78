package dev.numafit.cluster.model;

import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Everything numafit read from one cluster (live or from a snapshot), sorted: nodes by name, pods
 * by namespace/name, budgets and workloads by id.
 *
 * @param server the API server URL read from (for messages; never a credential)
 * @param namespace the namespace the read was limited to; empty for all namespaces
 * @param missing resource types that could not be read under {@code --allow-partial}, each with
 *     the reason ("poddisruptionbudgets: 403 Forbidden")
 * @param warnings notes from reading (a restarted list, a pod that could not be converted)
 */
public record ClusterModel(
    String server,
    Optional<String> namespace,
    List<NodeRecord> nodes,
    List<PodRecord> pods,
    List<BudgetRecord> budgets,
    List<WorkloadRecord> workloads,
    List<String> missing,
    List<String> warnings) {
  public ClusterModel {
    Objects.requireNonNull(server, "server");
    namespace = namespace == null ? Optional.empty() : namespace;
    nodes = nodes.stream().sorted(Comparator.comparing(NodeRecord::name)).toList();
    pods = pods.stream().sorted(Comparator.comparing(PodRecord::namespace)
        .thenComparing(PodRecord::name)).toList();
    budgets = budgets.stream().sorted(Comparator.comparing(BudgetRecord::id)).toList();
    workloads = workloads.stream().sorted(Comparator.comparing(WorkloadRecord::id)).toList();
    missing = List.copyOf(missing);
    warnings = List.copyOf(warnings);
  }
}
