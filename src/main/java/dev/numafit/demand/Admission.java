package dev.numafit.demand;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.function.UnaryOperator;

/**
 * The changes the API server makes to a pod before anything schedules it, as pure functions on
 * {@link PodModel}. Apply them in this order, which is the API server's: {@link #limitsAsRequests}
 * (defaulting on decode), {@link #applyLimitDefaults} (LimitRange admission), {@link
 * #applyOverhead} (RuntimeClass admission).
 */
public final class Admission {
  private Admission() {}

  /**
   * A container that sets a limit but no request for a resource requests its limit (Kubernetes
   * "Resource Management for Pods and Containers", FACTS A2). Pod-level {@code spec.resources}: a
   * pod limit without a pod request becomes the pod request only when no container requests that
   * resource (KEP-2837, FACTS A1); otherwise the containers' aggregate stands.
   */
  public static PodModel limitsAsRequests(PodModel pod) {
    PodModel withContainers =
        mapContainers(
            pod,
            c -> {
              TreeMap<String, BigDecimal> requests = new TreeMap<>(c.requests());
              c.limits().forEach(requests::putIfAbsent);
              return new ContainerSpec(c.name(), c.role(), requests, c.limits());
            });
    TreeMap<String, BigDecimal> podRequests = new TreeMap<>(withContainers.podRequests());
    for (Map.Entry<String, BigDecimal> e : withContainers.podLimits().entrySet()) {
      if (!podRequests.containsKey(e.getKey())
          && !anyContainerRequests(withContainers, e.getKey())) {
        podRequests.put(e.getKey(), e.getValue());
      }
    }
    return new PodModel(
        withContainers.initContainers(),
        withContainers.containers(),
        withContainers.overhead(),
        podRequests,
        withContainers.podLimits(),
        withContainers.runtimeClassName());
  }

  /**
   * LimitRange defaults for containers that set no request or no limit for a resource (FACTS A2,
   * "Configure Default Memory Requests and Limits for a Namespace"). Values a container sets are
   * kept. Run after {@link #limitsAsRequests}: a container with only a limit already requests it.
   */
  public static PodModel applyLimitDefaults(PodModel pod, LimitDefaults defaults) {
    if (defaults.isEmpty()) {
      return pod;
    }
    return mapContainers(
        pod,
        c -> {
          TreeMap<String, BigDecimal> requests = new TreeMap<>(c.requests());
          defaults.defaultRequest().forEach(requests::putIfAbsent);
          TreeMap<String, BigDecimal> limits = new TreeMap<>(c.limits());
          defaults.defaultLimit().forEach(limits::putIfAbsent);
          return new ContainerSpec(c.name(), c.role(), requests, limits);
        });
  }

  /**
   * The pod with {@code spec.overhead} set from its RuntimeClass's {@code overhead.podFixed}
   * (Kubernetes "Pod Overhead", FACTS A1 K1): the RuntimeClass admission controller sets it.
   */
  public static PodModel applyOverhead(PodModel pod, SortedMap<String, BigDecimal> podFixed) {
    return new PodModel(
        pod.initContainers(),
        pod.containers(),
        podFixed,
        pod.podRequests(),
        pod.podLimits(),
        pod.runtimeClassName());
  }

  private static boolean anyContainerRequests(PodModel pod, String resource) {
    for (ContainerSpec c : pod.initContainers()) {
      if (c.requests().containsKey(resource)) {
        return true;
      }
    }
    for (ContainerSpec c : pod.containers()) {
      if (c.requests().containsKey(resource)) {
        return true;
      }
    }
    return false;
  }

  private static PodModel mapContainers(PodModel pod, UnaryOperator<ContainerSpec> f) {
    List<ContainerSpec> init = new ArrayList<>();
    pod.initContainers().forEach(c -> init.add(f.apply(c)));
    List<ContainerSpec> app = new ArrayList<>();
    pod.containers().forEach(c -> app.add(f.apply(c)));
    return new PodModel(
        init, app, pod.overhead(), pod.podRequests(), pod.podLimits(), pod.runtimeClassName());
  }
}
