package dev.numafit.manifest;

import java.util.List;
import java.util.Optional;

/**
 * The kinds the reader understands, with the apiVersion each is served under today and the older
 * ones it was served under before (still found in old charts and docs). Objects are read with
 * today's schema; the pod template and the fields used here did not change.
 */
enum KnownKind {
  POD("Pod", "v1", List.of()),
  DEPLOYMENT(
      "Deployment", "apps/v1", List.of("extensions/v1beta1", "apps/v1beta1", "apps/v1beta2")),
  REPLICA_SET("ReplicaSet", "apps/v1", List.of("extensions/v1beta1", "apps/v1beta2")),
  STATEFUL_SET("StatefulSet", "apps/v1", List.of("apps/v1beta1", "apps/v1beta2")),
  DAEMON_SET("DaemonSet", "apps/v1", List.of("extensions/v1beta1", "apps/v1beta2")),
  JOB("Job", "batch/v1", List.of()),
  CRON_JOB("CronJob", "batch/v1", List.of("batch/v1beta1", "batch/v2alpha1")),
  REPLICATION_CONTROLLER("ReplicationController", "v1", List.of()),
  HORIZONTAL_POD_AUTOSCALER(
      "HorizontalPodAutoscaler",
      "autoscaling/v2",
      List.of("autoscaling/v2beta1", "autoscaling/v2beta2")),
  LIMIT_RANGE("LimitRange", "v1", List.of()),
  RUNTIME_CLASS("RuntimeClass", "node.k8s.io/v1", List.of("node.k8s.io/v1beta1"));

  final String kind;
  final String current;
  final List<String> older;

  KnownKind(String kind, String current, List<String> older) {
    this.kind = kind;
    this.current = current;
    this.older = older;
  }

  static Optional<KnownKind> of(String kind) {
    for (KnownKind k : values()) {
      if (k.kind.equals(kind)) {
        return Optional.of(k);
      }
    }
    return Optional.empty();
  }

  boolean runsPods() {
    return this != HORIZONTAL_POD_AUTOSCALER && this != LIMIT_RANGE && this != RUNTIME_CLASS;
  }

  /** Current versions; autoscaling/v1 is still served beside v2. */
  boolean isCurrent(String apiVersion) {
    return current.equals(apiVersion)
        || (this == HORIZONTAL_POD_AUTOSCALER && "autoscaling/v1".equals(apiVersion));
  }
}
