package dev.numafit.cluster;

import static dev.numafit.cluster.ClusterFixtures.container;
import static dev.numafit.cluster.ClusterFixtures.node;
import static dev.numafit.cluster.ClusterFixtures.pod;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.cluster.model.NodeRecord;
import dev.numafit.cluster.model.PodRecord;
import dev.numafit.cluster.model.WorkloadRecord;
import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.ContainerBuilder;
import io.fabric8.kubernetes.api.model.IntOrString;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.apps.DaemonSetBuilder;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.api.model.policy.v1.PodDisruptionBudgetBuilder;
import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Reads a realistic cluster end to end through the real client against the mock API server in
 * CRUD mode: the 19 public hotel-reservation Deployments at 3 replicas with their ReplicaSets and
 * pods, a log DaemonSet on six nodes, a pod with RuntimeClass overhead, a finished Job pod and a
 * PodDisruptionBudget.
 */
@EnableKubernetesMockClient(crud = true)
class ClusterReaderCrudTest {
  static {
    ClusterFixtures.quietLogs();
  }

  static KubernetesClient client;
  static ClusterModel all;

  static final int NODES = 6;
  static final int REPLICAS = 3;

  @BeforeAll
  static void populate() throws Exception {
    for (int i = 1; i <= NODES; i++) {
      // Capacity and allocatable of the example in "Reserve Compute Resources for System Daemons"
      // (16 CPU, 32Gi → 14.5 CPU, 28.5Gi), maxPods 110 (kubelet default, FACTS A4/K13).
      client.nodes().resource(node("w0" + i, "16", "32Gi", "110", "14500m", "29184Mi",
          Map.of("pool", "general"))).create();
    }
    List<Deployment> deployments = ClusterFixtures.hotelDeployments();
    int n = 0;
    for (Deployment d : deployments) {
      d.getMetadata().setNamespace("hotel");
      d.getSpec().setReplicas(REPLICAS);
      client.apps().deployments().inNamespace("hotel").resource(d).create();
      ReplicaSet rs = ClusterFixtures.replicaSetFor(d, "5d8f7c");
      client.apps().replicaSets().inNamespace("hotel").resource(rs).create();
      for (int r = 0; r < REPLICAS; r++) {
        Pod p = ClusterFixtures.podFor(rs, "x" + r, "w0" + (1 + (n++ % NODES)));
        client.pods().inNamespace("hotel").resource(p).create();
      }
    }
    client.apps().daemonSets().inNamespace("infra").resource(new DaemonSetBuilder()
        .withNewMetadata().withNamespace("infra").withName("log-shipper").endMetadata()
        .withNewSpec().withNewSelector().addToMatchLabels("app", "log-shipper").endSelector()
        .withNewTemplate().withNewMetadata().addToLabels("app", "log-shipper").endMetadata()
        .withNewSpec().withContainers(container("shipper", "50m", "64Mi")).endSpec()
        .endTemplate().endSpec().build()).create();
    for (int i = 1; i <= NODES; i++) {
      client.pods().inNamespace("infra").resource(pod("infra", "log-shipper-" + i, "DaemonSet",
          "log-shipper", "w0" + i, "Running", Map.of("app", "log-shipper"),
          container("shipper", "50m", "64Mi"))).create();
    }
    // The pod of the "Pod Overhead" docs page after admission: overhead 250m/120Mi from its
    // RuntimeClass, two containers whose limits 500m/100Mi and 1500m/100Mi became requests.
    Pod overhead = pod("infra", "test-pod", null, null, "w01", "Running", Map.of(),
        limited("busybox-ctr", "500m", "100Mi"), limited("nginx-ctr", "1500m", "100Mi"));
    overhead.getSpec().setOverhead(Map.of("cpu", new Quantity("250m"),
        "memory", new Quantity("120Mi")));
    client.pods().inNamespace("infra").resource(overhead).create();
    client.pods().inNamespace("hotel").resource(pod("hotel", "cleanup-1", "Job", "cleanup",
        "w02", "Succeeded", Map.of(), container("c", "4", "1Gi"))).create();
    client.policy().v1().podDisruptionBudget().inNamespace("hotel").resource(
        new PodDisruptionBudgetBuilder().withNewMetadata().withNamespace("hotel")
            .withName("frontend").endMetadata().withNewSpec()
            .withMinAvailable(new IntOrString(2)).withNewSelector()
            .addToMatchLabels("io.kompose.service", "frontend").endSelector().endSpec().build())
        .create();
    all = read(ConnectionSettings.defaults());
  }

  private static io.fabric8.kubernetes.api.model.Container limited(String name, String cpu,
      String memory) {
    Map<String, Quantity> q = Map.of("cpu", new Quantity(cpu), "memory", new Quantity(memory));
    return new ContainerBuilder().withName(name).withImage("example.invalid/app")
        .withNewResources().withRequests(q).withLimits(q).endResources().build();
  }

  private static ClusterModel read(ConnectionSettings s) throws Exception {
    List<String> log = new ArrayList<>();
    ClusterModel m = new ClusterReader(client, s, ReadProgress.NONE, log::add).read();
    assertTrue(log.stream().allMatch(l -> l.startsWith("GET ")), "only GET requests: " + log);
    return m;
  }

  @Test
  void read_crudCluster_nodesCarryAllocatableOfTheDocsExample() throws Exception {
    ClusterModel m = all;
    assertEquals(NODES, m.nodes().size());
    NodeRecord w = m.nodes().get(0);
    assertEquals("w01", w.name());
    // "Reserve Compute Resources for System Daemons": 16 CPUs → 14.5 CPUs, 32Gi → 28.5Gi.
    assertEquals(16_000, w.capacity().get("cpu"));
    assertEquals(14_500, w.allocatable().get("cpu"));
    assertEquals(28_672L * 1024 * 1024 + 512L * 1024 * 1024, w.allocatable().get("memory"));
    // kubelet maxPods default 110 (Kubelet Configuration v1beta1).
    assertEquals(110, w.allocatable().get("pods"));
    assertEquals(Map.of("pool", "general"), w.labels());
  }

  @Test
  void read_crudCluster_podsResolveToTheirDeploymentWithManifestRequests() throws Exception {
    ClusterModel m = all;
    List<PodRecord> hotel = m.pods().stream().filter(p -> p.namespace().equals("hotel")).toList();
    // 19 Deployments × 3 replicas; the Succeeded Job pod is left out.
    assertEquals(19 * REPLICAS, hotel.size());
    for (PodRecord p : hotel) {
      assertEquals("Deployment", p.workload().kind(), p.id());
      assertTrue(p.name().startsWith(p.workload().name() + "-5d8f7c-"), p.id());
      // Every hotel-reservation container requests cpu: 100m and no memory (the manifests).
      assertEquals(Resources.of("cpu", 100L), p.requests(), p.id());
      assertTrue(p.scheduled() && p.healthy());
    }
    assertEquals(19, hotel.stream().map(PodRecord::workload).distinct().count());
  }

  @Test
  void read_podWithOverhead_countsOverheadAsThePodOverheadPageDoes() throws Exception {
    ClusterModel m = all;
    PodRecord p = m.pods().stream().filter(x -> x.id().equals("infra/test-pod")).findFirst()
        .orElseThrow();
    // "Pod Overhead": 2000m + 250m = 2250m and 200Mi + 120Mi = 320Mi.
    assertEquals(2250, p.requests().get("cpu"));
    assertEquals(320L * 1024 * 1024, p.requests().get("memory"));
    assertEquals("infra/Pod/test-pod", p.workload().toString());
  }

  @Test
  void read_daemonSetPodsAndBudget_markedOnThePods() throws Exception {
    ClusterModel m = all;
    List<PodRecord> daemons = m.pods().stream().filter(PodRecord::daemon).toList();
    assertEquals(NODES, daemons.size());
    assertTrue(daemons.stream().allMatch(
        p -> p.workload().toString().equals("infra/DaemonSet/log-shipper")));
    List<PodRecord> frontend = m.pods().stream()
        .filter(p -> p.workload().toString().equals("hotel/Deployment/frontend")).toList();
    assertEquals(REPLICAS, frontend.size());
    assertTrue(frontend.stream().allMatch(p -> p.budgets().equals(List.of("hotel/frontend"))));
    assertEquals(1, m.budgets().size());
    assertEquals("minAvailable 2", m.budgets().get(0).rule());
  }

  @Test
  void read_declaredWorkloads_replicasAndRequestsFromTheManifests() throws Exception {
    ClusterModel m = all;
    List<WorkloadRecord> deployments = m.workloads().stream()
        .filter(w -> w.id().kind().equals("Deployment")).toList();
    assertEquals(19, deployments.size());
    for (WorkloadRecord w : deployments) {
      assertEquals(REPLICAS, w.replicas().declared(), w.id().toString());
      assertEquals(Resources.of("cpu", 100L), w.requests(), w.id().toString());
    }
    WorkloadRecord ds = m.workloads().stream()
        .filter(w -> w.id().toString().equals("infra/DaemonSet/log-shipper")).findFirst()
        .orElseThrow();
    assertTrue(ds.perWorker());
    assertEquals(Resources.of("cpu", 50L, "memory", 64L * 1024 * 1024), ds.requests());
  }

  @Test
  void snapshot_writtenAndReadBack_equalsTheLiveRead() throws Exception {
    ClusterModel live = all;
    String text = SnapshotFile.toText(live);
    ClusterModel back = SnapshotFile.parse(text, "snap.json");
    assertEquals(live, back);
    // Same model, same bytes.
    assertEquals(text, SnapshotFile.toText(back));
  }

  @Test
  void read_namespaceGiven_readsOnlyThatNamespaceButEveryNode() throws Exception {
    ClusterModel m = read(new ConnectionSettings(Optional.empty(), Optional.empty(),
        Optional.of("infra"), ConnectionSettings.DEFAULT_TIMEOUT, 1, false));
    assertEquals(NODES, m.nodes().size());
    assertEquals(NODES + 1, m.pods().size());
    assertTrue(m.pods().stream().allMatch(p -> p.namespace().equals("infra")));
    assertEquals(Optional.of("infra"), m.namespace());
  }
}
