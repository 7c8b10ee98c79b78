package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.QosClass;
import dev.numafit.demand.Workload;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.Severity;
import dev.numafit.resource.Resources;
import java.io.ByteArrayInputStream;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The reader on real public manifests (src/test/resources/corpus, provenance in each SOURCE.md).
 * Expected values are the files' own numbers or the documentation page each example belongs to.
 */
class CorpusTest {
  private static final long MIB = 1L << 20;

  private static Path corpus(String set) {
    try {
      return Path.of(CorpusTest.class.getResource("/corpus/" + set).toURI());
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  private static Demand read(Path... paths) {
    return new ManifestReader()
        .read(
            java.util.Arrays.stream(paths).map(Path::toString).toList(),
            new ByteArrayInputStream(new byte[0]),
            ReadOptions.defaults());
  }

  private static Workload workload(Demand d, String id) {
    return d.workloads().stream()
        .filter(w -> w.id().toString().equals(id))
        .findFirst()
        .orElseThrow(() -> new AssertionError(id + " not found; " + d.diagnostics()));
  }

  private static List<Diagnostic> errors(Demand d) {
    return d.diagnostics().stream().filter(x -> x.severity() == Severity.ERROR).toList();
  }

  @Test
  void read_onlineBoutique_requestsSumToTheFileValues() {
    Demand d = read(corpus("online-boutique").resolve("kubernetes-manifests.yaml"));
    assertEquals(List.of(), errors(d));
    assertEquals(12, d.workloads().size());
    long cpu = 0;
    long memory = 0;
    for (Workload w : d.workloads()) {
      cpu += w.replicas().peak() * w.pod().requests().get("cpu");
      memory += w.replicas().peak() * w.pod().requests().get("memory");
    }
    // The file's own requests, one replica each (replicas unset or 1): cpu 100m (frontend), 200m
    // (adservice), 100m (currencyservice), 200m (cartservice), 70m (the cart's key-value store),
    // 300m (loadgenerator), and 100m for each of recommendation, checkout, email, payment,
    // shipping and productcatalog = 1570m; memory 64 + 180 + 64 + 64 + 200 + 256 + 220 + 5 × 64
    // = 1368Mi.
    assertEquals(1570, cpu);
    assertEquals(1368 * MIB, memory);
    assertEquals(Map.of("Service", 12, "ServiceAccount", 11), d.skippedByKind());
    // The loadgenerator's init container has no requests: it runs alone before the app starts and
    // changes nothing (KEP-753).
    assertEquals(
        Resources.of("cpu", 300L, "memory", 256 * MIB),
        workload(d, "default/Deployment/loadgenerator").pod().requests());
  }

  @Test
  void read_websitePodResources_docsValues() {
    Demand d = read(corpus("k8s-website-pod-resources"));
    assertEquals(List.of(), errors(d));
    // "Assign Memory Resources to Containers and Pods": request 100Mi, limit 200Mi.
    Workload mem = workload(d, "mem-example/Pod/memory-demo");
    assertEquals(100 * MIB, mem.pod().requests().get("memory"));
    assertEquals(200 * MIB, mem.pod().limits().get("memory"));
    // "Assign CPU Resources to Containers and Pods": request 500m, limit 1 CPU.
    Workload cpu = workload(d, "cpu-example/Pod/cpu-demo");
    assertEquals(500, cpu.pod().requests().get("cpu"));
    assertEquals(1000, cpu.pod().limits().get("cpu"));
    // "Configure Quality of Service for Pods": qos-demo is Guaranteed (700m, 200Mi), qos-demo-2 and
    // qos-demo-4 Burstable, qos-demo-3 BestEffort.
    Workload g = workload(d, "qos-example/Pod/qos-demo");
    assertEquals(QosClass.GUARANTEED, g.pod().qos());
    assertEquals(Resources.of("cpu", 700L, "memory", 200 * MIB), g.pod().requests());
    assertEquals(QosClass.BURSTABLE, workload(d, "qos-example/Pod/qos-demo-2").pod().qos());
    assertEquals(QosClass.BEST_EFFORT, workload(d, "qos-example/Pod/qos-demo-3").pod().qos());
    assertEquals(QosClass.BURSTABLE, workload(d, "qos-example/Pod/qos-demo-4").pod().qos());
    // "Assign Pod-level CPU and memory resources" (K6): the pod-level requests (cpu 1, memory
    // 100Mi) and limits (cpu 1, memory 200Mi) replace the containers' values.
    Workload podLevel = workload(d, "pod-resources-example/Pod/pod-resources-demo");
    assertEquals(Resources.of("cpu", 1000L, "memory", 100 * MIB), podLevel.pod().requests());
    assertEquals(Resources.of("cpu", 1000L, "memory", 200 * MIB), podLevel.pod().limits());
    // The sidecar example: init setup 200m/64Mi, sidecar log-shipper 50m/64Mi, app 300m/128Mi.
    // KEP-753 (FACTS A1): max(300m + 50m, 200m, 50m) = 350m; max(128Mi + 64Mi, 64Mi + 0) = 192Mi.
    Workload sidecar = workload(d, "default/Pod/resources-example");
    assertEquals(Resources.of("cpu", 350L, "memory", 192 * MIB), sidecar.pod().requests());
    assertEquals(Resources.of("memory", 192 * MIB), sidecar.pod().limits());
  }

  @Test
  void read_runtimeClassOverhead_overheadAddedFromTheFile() {
    Demand d = read(corpus("runtimeclass-overhead"));
    assertEquals(List.of(), errors(d));
    // runtime-classes.yaml gives the class used here overhead.podFixed cpu 250m, memory 130Mi;
    // the Deployment's container has only a 200m CPU limit, so it requests 200m ("Resource
    // Management for Pods and Containers"), and the pod 200m + 250m = 450m and 0 + 130Mi.
    Workload w = workload(d, "default/Deployment/web-sandbox-2");
    assertEquals(Resources.of("cpu", 450L, "memory", 130 * MIB), w.pod().requests());
    // The overhead also raises the pod's CPU limit ("Pod Overhead", K1).
    assertEquals(Resources.of("cpu", 450L), w.pod().limits());
    // Every RuntimeClass is consumed, none is counted as skipped.
    assertEquals(Map.of("Service", 2), d.skippedByKind());
  }

  @Test
  void read_kubectlJsonLists_itemsAndBackToBackObjects() {
    Path set = corpus("kubectl-testdata-lists-json");
    Demand rcList = read(set.resolve("multi-resource-rclist.json"));
    assertEquals(
        List.of("default/ReplicationController/mock", "default/ReplicationController/mock2"),
        rcList.workloads().stream().map(w -> w.id().toString()).toList());
    // Two JSON objects back to back: a Service and a ReplicationController.
    Demand twoObjects = read(set.resolve("multi-resource-json.json"));
    assertEquals(List.of(), errors(twoObjects));
    assertEquals(Map.of("Service", 1), twoObjects.skippedByKind());
    assertEquals(1, twoObjects.workloads().size());
    Demand yamlList = read(set.resolve("list.yaml"));
    assertEquals(
        1, workload(yamlList, "default/Deployment/list-deployment-test").replicas().peak());
  }

  @Test
  void read_classicCpuManagerExamples_exclusiveCpus() {
    Demand d = read(corpus("k8s-examples-classic-json"));
    assertEquals(List.of(), errors(d));
    // The CPU manager examples: exclusive-N is Guaranteed with N whole CPUs, so the static policy
    // pins N ("Resource managers", K15); "shared" is Burstable and "be" BestEffort.
    for (int n = 1; n <= 4; n++) {
      Workload w = workload(d, "default/Pod/exclusive-" + n);
      assertEquals(QosClass.GUARANTEED, w.pod().qos());
      assertEquals(n, w.pod().exclusiveCpus());
      // memory: "256M" is 256000000 bytes (decimal suffix, Quantity reference K10).
      assertEquals(Resources.of("cpu", 1000L * n, "memory", 256_000_000L), w.pod().requests());
    }
    assertEquals(QosClass.BURSTABLE, workload(d, "default/Pod/shared").pod().qos());
    assertEquals(0, workload(d, "default/Pod/shared").pod().exclusiveCpus());
    assertEquals(QosClass.BEST_EFFORT, workload(d, "default/Pod/be").pod().qos());
    // A JSON Pod with only a 100m CPU limit requests 100m.
    assertEquals(100L, workload(d, "default/Pod/coordinator").pod().requests().get("cpu"));
    // A JSON ReplicationController with replicas 2.
    assertEquals(
        2, workload(d, "default/ReplicationController/webapp-controller").replicas().peak());
    assertTrue(d.skippedByKind().containsKey("PersistentVolumeClaim"));
  }
}
