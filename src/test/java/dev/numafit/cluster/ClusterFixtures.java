package dev.numafit.cluster;

import io.fabric8.kubernetes.api.model.Container;
import io.fabric8.kubernetes.api.model.ContainerBuilder;
import io.fabric8.kubernetes.api.model.HasMetadata;
import io.fabric8.kubernetes.api.model.Node;
import io.fabric8.kubernetes.api.model.NodeBuilder;
import io.fabric8.kubernetes.api.model.OwnerReference;
import io.fabric8.kubernetes.api.model.OwnerReferenceBuilder;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.PodBuilder;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.PodSpecBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.Status;
import io.fabric8.kubernetes.api.model.StatusBuilder;
import io.fabric8.kubernetes.api.model.Taint;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.api.model.apps.ReplicaSetBuilder;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import io.fabric8.kubernetes.client.utils.KubernetesSerialization;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.logging.LogManager;
import java.util.stream.Stream;

/** Kubernetes objects and API answers for the cluster tests. */
final class ClusterFixtures {
  static final KubernetesSerialization JSON = new KubernetesSerialization();

  static {
    try (InputStream in = ClusterFixtures.class.getResourceAsStream("/logging.properties")) {
      LogManager.getLogManager().readConfiguration(in);
    } catch (IOException ex) {
      throw new UncheckedIOException(ex);
    }
  }

  private ClusterFixtures() {}

  /** Loads logging.properties (quiet mock server); call from a test class's static block. */
  static void quietLogs() {
    // the static initializer does the work
  }

  /** The 19 hotel-reservation Deployments (see src/test/resources/cluster/hotel-reservation). */
  static List<Deployment> hotelDeployments() {
    try {
      Path dir = Path.of(ClusterFixtures.class.getResource("/cluster/hotel-reservation").toURI());
      List<Deployment> out = new ArrayList<>();
      try (Stream<Path> files = Files.list(dir)) {
        for (Path f : files.filter(p -> p.toString().endsWith(".yaml")).sorted().toList()) {
          out.add(JSON.unmarshal(Files.readString(f), Deployment.class));
        }
      }
      return out;
    } catch (IOException ex) {
      throw new UncheckedIOException(ex);
    } catch (URISyntaxException ex) {
      throw new IllegalStateException(ex);
    }
  }

  static Node node(String name, String cpu, String memory, String pods, Map<String, String> labels,
      Taint... taints) {
    return node(name, cpu, memory, pods, cpu, memory, labels, taints);
  }

  static Node node(String name, String cpuCap, String memCap, String pods, String cpuAlloc,
      String memAlloc, Map<String, String> labels, Taint... taints) {
    return new NodeBuilder()
        .withNewMetadata().withName(name).withLabels(new LinkedHashMap<>(labels)).endMetadata()
        .withNewSpec().withTaints(taints).endSpec()
        .withNewStatus()
        .addToCapacity("cpu", new Quantity(cpuCap))
        .addToCapacity("memory", new Quantity(memCap))
        .addToCapacity("pods", new Quantity(pods))
        .addToAllocatable("cpu", new Quantity(cpuAlloc))
        .addToAllocatable("memory", new Quantity(memAlloc))
        .addToAllocatable("pods", new Quantity(pods))
        .endStatus()
        .build();
  }

  static OwnerReference owner(String kind, String name) {
    return new OwnerReferenceBuilder().withApiVersion(kind.equals("ReplicaSet")
            || kind.equals("DaemonSet") || kind.equals("StatefulSet") || kind.equals("Deployment")
            ? "apps/v1" : "batch/v1")
        .withKind(kind).withName(name).withUid(kind + "-" + name).withController(true).build();
  }

  static ReplicaSet replicaSetFor(Deployment d, String hash) {
    return new ReplicaSetBuilder()
        .withNewMetadata().withNamespace(d.getMetadata().getNamespace())
        .withName(d.getMetadata().getName() + "-" + hash)
        .withOwnerReferences(owner("Deployment", d.getMetadata().getName())).endMetadata()
        .withNewSpec().withReplicas(d.getSpec().getReplicas()).withTemplate(d.getSpec().getTemplate())
        .withSelector(d.getSpec().getSelector()).endSpec()
        .build();
  }

  /** A pod as the ReplicaSet controller and scheduler would leave it: owned, bound, Running. */
  static Pod podFor(ReplicaSet rs, String suffix, String node) {
    PodSpec spec = new PodSpecBuilder(rs.getSpec().getTemplate().getSpec()).build();
    spec.setNodeName(node);
    // The API server copies a limit into a missing request at admission (FACTS A2).
    for (Container c : spec.getContainers()) {
      if (c.getResources() != null && c.getResources().getLimits() != null) {
        Map<String, Quantity> req = c.getResources().getRequests() == null
            ? new LinkedHashMap<>() : new LinkedHashMap<>(c.getResources().getRequests());
        c.getResources().getLimits().forEach(req::putIfAbsent);
        c.getResources().setRequests(req);
      }
    }
    return new PodBuilder()
        .withNewMetadata().withNamespace(rs.getMetadata().getNamespace())
        .withName(rs.getMetadata().getName() + "-" + suffix)
        .withLabels(rs.getSpec().getTemplate().getMetadata().getLabels())
        .withOwnerReferences(owner("ReplicaSet", rs.getMetadata().getName())).endMetadata()
        .withSpec(spec)
        .withNewStatus().withPhase(node.isEmpty() ? "Pending" : "Running").endStatus()
        .build();
  }

  static Pod pod(String ns, String name, String ownerKind, String ownerName, String node,
      String phase, Map<String, String> labels, Container... containers) {
    PodBuilder b = new PodBuilder()
        .withNewMetadata().withNamespace(ns).withName(name).withLabels(labels).endMetadata()
        .withNewSpec().withNodeName(node.isEmpty() ? null : node).withContainers(containers)
        .endSpec()
        .withNewStatus().withPhase(phase).endStatus();
    if (ownerKind != null) {
      b.editMetadata().withOwnerReferences(owner(ownerKind, ownerName)).endMetadata();
    }
    return b.build();
  }

  static Container container(String name, String cpu, String memory) {
    ContainerBuilder b = new ContainerBuilder().withName(name).withImage("example.invalid/app");
    Map<String, Quantity> req = new LinkedHashMap<>();
    if (cpu != null) {
      req.put("cpu", new Quantity(cpu));
    }
    if (memory != null) {
      req.put("memory", new Quantity(memory));
    }
    return b.withNewResources().withRequests(req).endResources().build();
  }

  /** A list answer of one page, with a continue token when more pages follow. */
  static String listJson(String kind, List<? extends HasMetadata> items, String cont) {
    Map<String, Object> list = new LinkedHashMap<>();
    list.put("apiVersion", "v1");
    list.put("kind", kind);
    Map<String, Object> meta = new LinkedHashMap<>();
    meta.put("resourceVersion", "1000");
    if (cont != null) {
      meta.put("continue", cont);
    }
    list.put("metadata", meta);
    list.put("items", items);
    return JSON.asJson(list);
  }

  static Status status(int code, String reason, String message) {
    return new StatusBuilder().withStatus("Failure").withCode(code).withReason(reason)
        .withMessage(message).build();
  }

  /**
   * Serves an empty first page for every type not in {@code except}, so an expectations-mode
   * server answers a full read.
   */
  static void emptyLists(KubernetesMockServer server, Set<ResourceType> except) {
    for (ResourceType t : EnumSet.complementOf(EnumSet.copyOf(
        except.isEmpty() ? EnumSet.noneOf(ResourceType.class) : except))) {
      server.expect().get().withPath(t.path(java.util.Optional.empty()) + "?limit=500")
          .andReturn(200, listJson(kindOf(t), List.of(), null)).always();
    }
  }

  static String kindOf(ResourceType t) {
    return switch (t) {
      case NODES -> "NodeList";
      case RUNTIME_CLASSES -> "RuntimeClassList";
      case LIMIT_RANGES -> "LimitRangeList";
      case POD_DISRUPTION_BUDGETS -> "PodDisruptionBudgetList";
      case REPLICA_SETS -> "ReplicaSetList";
      case JOBS -> "JobList";
      case DEPLOYMENTS -> "DeploymentList";
      case STATEFUL_SETS -> "StatefulSetList";
      case DAEMON_SETS -> "DaemonSetList";
      case CRON_JOBS -> "CronJobList";
      case HORIZONTAL_POD_AUTOSCALERS -> "HorizontalPodAutoscalerList";
      case PODS -> "PodList";
    };
  }
}
