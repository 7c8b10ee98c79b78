package dev.numafit.cluster;

import java.util.Optional;

/**
 * Every Kubernetes resource numafit reads, in reading order, with its API path. The only verb used
 * on any of them is {@code list} (docs/rbac.md holds the matching read-only ClusterRole).
 */
public enum ResourceType {
  NODES("", "v1", "nodes", false, "review has no nodes to check or pack onto"),
  RUNTIME_CLASSES("node.k8s.io", "v1", "runtimeclasses", false,
      "declared pods get no RuntimeClass overhead"),
  LIMIT_RANGES("", "v1", "limitranges", true,
      "declared containers without requests get no LimitRange defaults"),
  POD_DISRUPTION_BUDGETS("policy", "v1", "poddisruptionbudgets", true,
      "the drain plan ignores disruption budgets"),
  REPLICA_SETS("apps", "v1", "replicasets", true,
      "pods of Deployments are counted under their ReplicaSet"),
  JOBS("batch", "v1", "jobs", true, "pods of CronJobs are counted under their Job"),
  DEPLOYMENTS("apps", "v1", "deployments", true, "--from declared misses Deployments"),
  STATEFUL_SETS("apps", "v1", "statefulsets", true, "--from declared misses StatefulSets"),
  DAEMON_SETS("apps", "v1", "daemonsets", true, "--from declared misses DaemonSets"),
  CRON_JOBS("batch", "v1", "cronjobs", true, "--from declared misses CronJobs"),
  HORIZONTAL_POD_AUTOSCALERS("autoscaling", "v2", "horizontalpodautoscalers", true,
      "--replicas peak uses declared replicas instead of autoscaler maximums"),
  PODS("", "v1", "pods", true, "no running pods are counted");

  private final String group;
  private final String version;
  private final String plural;
  private final boolean namespaced;
  private final String leavesOut;

  ResourceType(String group, String version, String plural, boolean namespaced, String leavesOut) {
    this.group = group;
    this.version = version;
    this.plural = plural;
    this.namespaced = namespaced;
    this.leavesOut = leavesOut;
  }

  /** The API group; empty for the core group. */
  public String group() {
    return group;
  }

  /** The resource name as RBAC and the API path spell it ({@code poddisruptionbudgets}). */
  public String plural() {
    return plural;
  }

  public boolean namespaced() {
    return namespaced;
  }

  /** What a review loses when this type cannot be read, for {@code --allow-partial}. */
  public String leavesOut() {
    return leavesOut;
  }

  /** {@code pods}, {@code apps/deployments}: how messages name the type. */
  public String display() {
    return group.isEmpty() ? plural : group + "/" + plural;
  }

  /** The collection's URL path, all namespaces or one. */
  public String path(Optional<String> namespace) {
    String base = group.isEmpty() ? "/api/" + version : "/apis/" + group + "/" + version;
    if (namespaced && namespace.isPresent()) {
      return base + "/namespaces/" + namespace.get() + "/" + plural;
    }
    return base + "/" + plural;
  }
}
