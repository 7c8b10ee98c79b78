package dev.numafit.cluster;

import io.fabric8.kubernetes.api.model.ContainerBuilder;
import io.fabric8.kubernetes.api.model.HasMetadata;
import io.fabric8.kubernetes.api.model.Node;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.PodBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.api.model.apps.ReplicaSetBuilder;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A mock API server for the cluster benchmark (bench/cluster-review.sh), run in its own process:
 * 1,500 nodes and 150,000 pods (4,950 Deployments of 30 replicas in 50 namespaces, each pod an
 * app container and a sidecar, plus one log-shipper DaemonSet pod per node), served in pages of
 * 500 like an API server. Writes a kubeconfig for it to the path given and prints "ready".
 *
 * <p>Run: {@code java -cp <test class path> dev.numafit.cluster.BenchClusterServer KUBECONFIG}.
 * The data is invented; sizes are spread deterministically (no random numbers).
 */
public final class BenchClusterServer {
  static final int NODES = 1500;
  static final int DEPLOYMENTS = 4950;
  static final int REPLICAS = 30;

  private BenchClusterServer() {}

  public static void main(String[] args) throws Exception {
    Path kubeconfig = Path.of(args[0]);
    KubernetesMockServer server = new KubernetesMockServer(false);
    server.init();
    List<Node> nodes = new ArrayList<>();
    for (int i = 0; i < NODES; i++) {
      nodes.add(ClusterFixtures.node(String.format("worker-%04d", i), "16", "64Gi", "110",
          "15890m", "62Gi", Map.of("pool", "general")));
    }
    List<ReplicaSet> sets = new ArrayList<>();
    List<Pod> pods = new ArrayList<>();
    int slot = 0;
    for (int d = 0; d < DEPLOYMENTS; d++) {
      String ns = "team-" + (d % 50);
      String name = "svc-" + d;
      sets.add(new ReplicaSetBuilder().withNewMetadata().withNamespace(ns)
          .withName(name + "-6f7d8").withOwnerReferences(ClusterFixtures.owner("Deployment", name))
          .endMetadata().build());
      String cpu = (20 + (d * 7) % 100) + "m";
      String mem = (64 + (d * 13) % 256) + "Mi";
      for (int r = 0; r < REPLICAS; r++) {
        String node = String.format("worker-%04d", slot++ % NODES);
        pods.add(new PodBuilder().withNewMetadata().withNamespace(ns)
            .withName(name + "-6f7d8-" + Integer.toString(r, 36) + "x" + d)
            .addToLabels("app", name)
            .withOwnerReferences(ClusterFixtures.owner("ReplicaSet", name + "-6f7d8"))
            .endMetadata()
            .withNewSpec().withNodeName(node)
            .withContainers(new ContainerBuilder().withName("app").withImage("example.invalid/a")
                .withNewResources().addToRequests("cpu", new Quantity(cpu))
                .addToRequests("memory", new Quantity(mem)).endResources().build(),
                new ContainerBuilder().withName("proxy").withImage("example.invalid/p")
                .withNewResources().addToRequests("cpu", new Quantity("10m"))
                .addToRequests("memory", new Quantity("32Mi")).endResources().build())
            .endSpec().withNewStatus().withPhase("Running").endStatus().build());
      }
    }
    for (Node n : nodes) {
      pods.add(ClusterFixtures.pod("infra", "log-shipper-" + n.getMetadata().getName(),
          "DaemonSet", "log-shipper", n.getMetadata().getName(), "Running",
          Map.of("app", "log-shipper"), ClusterFixtures.container("shipper", "50m", "64Mi")));
    }
    serve(server, ResourceType.NODES, nodes);
    serve(server, ResourceType.REPLICA_SETS, sets);
    serve(server, ResourceType.PODS, pods);
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.NODES, ResourceType.REPLICA_SETS,
        ResourceType.PODS));
    Files.writeString(kubeconfig, String.join("\n",
        "apiVersion: v1", "kind: Config",
        "clusters:", "- name: bench", "  cluster:",
        "    server: " + server.url("").replaceAll("/$", ""),
        "users:", "- name: reader", "  user:", "    token: bench-token",
        "contexts:", "- name: bench", "  context: {cluster: bench, user: reader}",
        "current-context: bench", ""));
    System.out.println("ready " + pods.size() + " pods, " + nodes.size() + " nodes");
    System.out.flush();
    Thread.currentThread().join();
  }

  private static void serve(KubernetesMockServer server, ResourceType type,
      List<? extends HasMetadata> items) {
    int pages = (items.size() + ClusterReader.PAGE_SIZE - 1) / ClusterReader.PAGE_SIZE;
    String base = type.path(Optional.empty());
    for (int p = 0; p < pages; p++) {
      List<? extends HasMetadata> page = items.subList(p * ClusterReader.PAGE_SIZE,
          Math.min(items.size(), (p + 1) * ClusterReader.PAGE_SIZE));
      String cont = p + 1 < pages ? "page-" + (p + 1) : null;
      String path = p == 0 ? base + "?limit=500" : base + "?continue=page-" + p + "&limit=500";
      server.expect().get().withPath(path)
          .andReturn(200, ClusterFixtures.listJson(ClusterFixtures.kindOf(type), page, cont))
          .always();
    }
  }
}
