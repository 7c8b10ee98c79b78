package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.Workload;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/** Placement rules read from manifests into {@link Workload#rules()}. */
class PlacementReaderTest {
  static final Path CORPUS = Path.of("src/test/resources/corpus/k8s-website-pod-resources");

  /**
   * A cache Deployment in the shape of the "Assigning Pods to Nodes" page's example (section
   * "More practical use-cases"; kubernetes.io, concepts/scheduling-eviction), written from
   * memory: three replicas labelled app=store, required anti-affinity to app In [store] on
   * kubernetes.io/hostname. Requests added so it can be sized.
   */
  static final String CACHE =
      """
      apiVersion: apps/v1
      kind: Deployment
      metadata:
        name: kvstore-cache
      spec:
        replicas: 3
        selector:
          matchLabels:
            app: store
        template:
          metadata:
            labels:
              app: store
          spec:
            affinity:
              podAntiAffinity:
                requiredDuringSchedulingIgnoredDuringExecution:
                - labelSelector:
                    matchExpressions:
                    - key: app
                      operator: In
                      values:
                      - store
                  topologyKey: "kubernetes.io/hostname"
                - labelSelector:
                    matchLabels:
                      app: web-store
                  topologyKey: "kubernetes.io/hostname"
            containers:
            - name: cache
              image: example.invalid/app:1
              resources:
                requests:
                  cpu: 100m
                  memory: 128Mi
      """;

  private static Workload only(Demand d) {
    assertEquals(1, d.workloads().size(), d.diagnostics().toString());
    return d.workloads().get(0);
  }

  private static Demand readFile(String name) throws IOException {
    TreeMap<String, String> texts = new TreeMap<>();
    texts.put(name, Files.readString(CORPUS.resolve(name), StandardCharsets.UTF_8));
    return new ManifestReader()
        .readTexts(texts, new ReadOptions(ReplicaMode.PEAK, false))
        .demand();
  }

  private static Demand readText(String text) {
    TreeMap<String, String> texts = new TreeMap<>();
    texts.put("cache.yaml", text);
    return new ManifestReader()
        .readTexts(texts, new ReadOptions(ReplicaMode.PEAK, false))
        .demand();
  }

  @Test
  void read_twoSpreadConstraintsExample_bothHardWithMaxSkewOne() throws IOException {
    // kubernetes.io "Pod Topology Spread Constraints" example two-constraints.yaml: maxSkew 1 on
    // the keys "zone" and "node", DoNotSchedule, selecting foo=bar (the pod's own label).
    PlacementRules r =
        only(readFile("pods__topology-spread-constraints__two-constraints.yaml")).rules();
    assertEquals(
        List.of(new PlacementRules.Spread("node", 1, true), new PlacementRules.Spread("zone", 1,
            true)),
        r.spread());
    assertEquals(Set.of(), r.antiAffinityKeys());
  }

  @Test
  void read_preferredAntiAffinityOnly_noRules() throws IOException {
    // kubernetes.io pod-with-pod-affinity.yaml: its anti-affinity is preferred (soft), which a
    // plan does not enforce, and its required podAffinity selects other pods.
    assertEquals(
        PlacementRules.NONE, only(readFile("pods__pod-with-pod-affinity.yaml")).rules());
  }

  @Test
  void read_requiredSelfAntiAffinity_hostnameKey_otherSelectorNoted() {
    PlacementRules r = only(readText(CACHE)).rules();
    assertEquals(Set.of("kubernetes.io/hostname"), r.antiAffinityKeys());
    // The second term selects app=web-store, which is not this pod: noted, not enforced.
    assertEquals(
        List.of("anti-affinity on kubernetes.io/hostname to pods of other workloads is not"
            + " modelled"),
        r.notModelled());
  }

  @Test
  void plan_requiredHostnameAntiAffinity_oneReplicaPerWorker() {
    // Three 100m replicas would fit one 4-vCPU worker; anti-affinity on the hostname needs three.
    Demand d = readText(CACHE);
    WorkerShape w =
        new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 16L << 30, Resources.EMPTY);
    Plan p =
        new Planner()
            .plan(
                d,
                PlanInput.of(
                    w,
                    Resources.of(
                        Resources.CPU, 4000L, Resources.MEMORY, 16L << 30, Resources.PODS,
                        110L)));
    assertEquals(3, p.workersNeeded());
    assertEquals(3, p.lowerBound());
    assertTrue(
        p.notes().stream().anyMatch(n -> n.contains("to pods of other workloads is not")),
        p.notes().toString());
  }
}
