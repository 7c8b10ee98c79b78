package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.LabelExpression;
import dev.numafit.demand.NodeTerm;
import dev.numafit.demand.Taint;
import dev.numafit.demand.Toleration;
import dev.numafit.demand.Workload;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.plan.PoolPlanner;
import dev.numafit.plan.PoolPlanning;
import dev.numafit.plan.WorkerPool;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import java.io.ByteArrayInputStream;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * Node rules of real public manifests (src/test/resources/corpus, provenance in each SOURCE.md):
 * two DaemonSets that tolerate control-plane taints or every taint, and the "Assigning Pods to
 * Nodes" example pod with required and preferred node affinity. Expected values are the files'
 * own fields and requests.
 */
class NodeRulesCorpusTest {
  private static Path corpus(String file) {
    try {
      return Path.of(NodeRulesCorpusTest.class.getResource("/corpus/" + file).toURI());
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  private static Demand read(String... files) {
    return new ManifestReader()
        .read(
            java.util.Arrays.stream(files).map(f -> corpus(f).toString()).toList(),
            new ByteArrayInputStream(new byte[0]),
            ReadOptions.defaults());
  }

  private static Workload only(Demand d, String name) {
    return d.workloads().stream()
        .filter(w -> w.id().toString().endsWith("/" + name))
        .findFirst()
        .orElseThrow(() -> new AssertionError(name + " not read: " + d.diagnostics()));
  }

  private static final String METRICS = "public-daemonsets/node-metrics-daemonset.yaml";
  private static final String NIC = "public-daemonsets/nic-device-plugin-daemonset.yaml";
  private static final String AFFINITY =
      "k8s-website-pod-resources/pods__pod-with-affinity-anti-affinity.yaml";

  @Test
  void read_publicDaemonSets_nodeRulesAsWritten() {
    Workload metrics = only(read(METRICS), "node-metrics");
    // The file: nodeSelector kubernetes.io/os: linux; tolerations: [{operator: Exists}].
    assertEquals(Map.of("kubernetes.io/os", "linux"), metrics.rules().nodeSelector());
    assertEquals(List.of(Toleration.EVERYTHING), metrics.rules().node().tolerations());
    Workload nic = only(read(NIC), "nic-device-plugin");
    // The file: two Exists tolerations with effect NoSchedule, one required term on the arch.
    assertEquals(
        List.of(
            new Toleration("node-role.kubernetes.io/master", true, "",
                Optional.of(Taint.Effect.NO_SCHEDULE)),
            new Toleration("node-role.kubernetes.io/control-plane", true, "",
                Optional.of(Taint.Effect.NO_SCHEDULE))),
        nic.rules().node().tolerations());
    assertEquals(
        List.of(new NodeTerm(List.of(new LabelExpression("kubernetes.io/arch",
            LabelExpression.Operator.IN, List.of("arch-a", "arch-b", "arch-c", "arch-d"))))),
        nic.rules().node().required());
  }

  @Test
  void read_docsAffinityPod_requiredTermKept_preferredNoted() {
    // pod-with-affinity-anti-affinity.yaml ("Assigning Pods to Nodes"): required
    // kubernetes.io/os In [linux, macOs]; two preferred terms (weights 1 and 50).
    Workload pod = only(read(AFFINITY), "with-affinity-anti-affinity");
    assertEquals(
        List.of(new NodeTerm(List.of(new LabelExpression("kubernetes.io/os",
            LabelExpression.Operator.IN, List.of("linux", "macOs"))))),
        pod.rules().node().required());
    assertTrue(
        pod.rules().notModelled().contains(
            "preferred node affinity (2 term(s)) is a preference: noted, not enforced"),
        pod.rules().notModelled().toString());
  }

  @Test
  void plan_controlPlaneGeneralDedicatedPools_daemonSetsCountedWhereTheyMayRun() {
    Demand d = read(METRICS, NIC, AFFINITY);
    WorkerShape w = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 8, 32L << 30, Resources.EMPTY);
    PlanInput in =
        PlanInput.of(w, Resources.of("cpu", 8000L, "memory", 32L << 30, "pods", 110L));
    // "Well-Known Labels, Annotations and Taints" (kubernetes.io): control-plane nodes carry
    // node-role.kubernetes.io/control-plane:NoSchedule.
    Taint controlPlane = new Taint("node-role.kubernetes.io/control-plane", "", Taint.Effect.NO_SCHEDULE);
    Taint dedicated = new Taint("dedicated", "db", Taint.Effect.NO_EXECUTE);
    List<WorkerPool> pools =
        List.of(
            new WorkerPool("control-plane", new TreeMap<>(), List.of(controlPlane), in),
            new WorkerPool("general", new TreeMap<>(), List.of(), in),
            new WorkerPool("dedicated", new TreeMap<>(), List.of(dedicated), in));
    PoolPlanning p = new PoolPlanner(new Planner()).plan(d, pools);
    String metrics = "monitoring/DaemonSet/node-metrics";
    String nic = "kube-system/DaemonSet/nic-device-plugin";
    assertEquals(List.of(nic, metrics), p.pools().get(0).daemonSets());
    assertEquals(List.of(nic, metrics), p.pools().get(1).daemonSets());
    // The device plugin tolerates no NoExecute taint: the dedicated pool does not pay for it.
    assertEquals(List.of(metrics), p.pools().get(2).daemonSets());
    // Requests from the files: node-metrics 102m + 10m, the device plugin 250m.
    assertEquals(362L, p.pools().get(0).plan().perWorkerDemand().get("cpu"));
    assertEquals(362L, p.pools().get(1).plan().perWorkerDemand().get("cpu"));
    assertEquals(112L, p.pools().get(2).plan().perWorkerDemand().get("cpu"));
    // The docs pod tolerates nothing: not the control-plane pool, the first it may use is general.
    assertEquals(List.of("default/Pod/with-affinity-anti-affinity"), p.pools().get(1).workloads());
    assertEquals(List.of(), p.unplaceable());
    // The arch requirement is on a label whose value the plan does not fix: assumed and noted.
    assertTrue(
        p.pools().get(0).plan().notes().stream().anyMatch(n -> n.startsWith(nic + ": kubernetes.io/arch in")),
        p.pools().get(0).plan().notes().toString());
  }

  @Test
  void read_tolerationSecondsOnNoExecute_doesNotCount(@org.junit.jupiter.api.io.TempDir Path tmp)
      throws Exception {
    // "Taints and Tolerations": a NoExecute toleration with tolerationSeconds keeps the pod bound
    // only that long after the taint appears; on a pool tainted from the start the pod would be
    // evicted, so it is no lasting placement. The Equal form without seconds counts.
    Path f = tmp.resolve("p.yaml");
    java.nio.file.Files.writeString(
        f,
        """
        apiVersion: v1
        kind: Pod
        metadata: {name: short-stay, namespace: shop}
        spec:
          tolerations:
            - {key: key1, operator: Equal, value: value1, effect: NoExecute, tolerationSeconds: 3600}
            - {key: key2, operator: Equal, value: value2, effect: NoSchedule}
          containers:
            - name: app
              image: registry.example.com/shop/app:1
              resources: {requests: {cpu: 100m, memory: 64Mi}}
        """);
    Demand d =
        new ManifestReader()
            .read(List.of(f.toString()), new ByteArrayInputStream(new byte[0]),
                ReadOptions.defaults());
    Workload w = only(d, "short-stay");
    assertEquals(
        List.of(new Toleration("key2", false, "value2", Optional.of(Taint.Effect.NO_SCHEDULE))),
        w.rules().node().tolerations());
    assertEquals(
        List.of("toleration of key1 with tolerationSeconds 3600 does not count: the pod is evicted"
            + " after that time"),
        w.rules().notModelled());
  }
}
