package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.WorkloadId;
import dev.numafit.demand.WorkloadSource;
import dev.numafit.diag.SourceRef;
import java.util.Optional;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * {@link ManifestReader#readLocated} and {@link ManifestReader#readTexts}: the line of each
 * container's {@code resources:} key, the pod template and the replica count, counted by hand in
 * the manifests below (line 1 is the first line of the text).
 */
class ManifestReadLocatedTest {
  private static final String DEPLOY =
      "apiVersion: apps/v1\n"                       // 1
          + "kind: Deployment\n"                    // 2
          + "metadata: {name: web, namespace: shop}\n" // 3
          + "spec:\n"                               // 4
          + "  replicas: 3\n"                       // 5
          + "  template:\n"                         // 6
          + "    spec:\n"                           // 7
          + "      initContainers:\n"               // 8
          + "        - name: warm\n"                // 9
          + "          image: registry.example.com/shop/warm:1\n" // 10
          + "      containers:\n"                   // 11
          + "        - name: app\n"                 // 12
          + "          image: registry.example.com/shop/web:1\n" // 13
          + "          # requests below\n"          // 14
          + "          resources:\n"                // 15
          + "            requests:\n"               // 16
          + "              cpu: 250m\n"             // 17
          + "        - name: side\n"                // 18
          + "          resources: {requests: {cpu: 50m}}\n" // 19
          + "---\n"                                 // 20
          + "apiVersion: autoscaling/v2\n"          // 21
          + "kind: HorizontalPodAutoscaler\n"       // 22
          + "metadata: {name: web, namespace: shop}\n" // 23
          + "spec:\n"                               // 24
          + "  scaleTargetRef: {apiVersion: apps/v1, kind: Deployment, name: web}\n" // 25
          + "  maxReplicas: 9\n"                    // 26
          + "---\n"                                 // 27
          + "apiVersion: batch/v1\n"                // 28
          + "kind: Job\n"                           // 29
          + "metadata: {name: nightly, namespace: shop}\n" // 30
          + "spec:\n"                               // 31
          + "  parallelism: 2\n"                    // 32
          + "  template:\n"                         // 33
          + "    spec:\n"                           // 34
          + "      restartPolicy: Never\n"          // 35
          + "      containers: [{name: run, image: registry.example.com/shop/run:1}]\n"; // 36

  private static WorkloadSource source(ReplicaMode mode, String id) {
    TreeMap<String, String> texts = new TreeMap<>();
    texts.put("shop.yaml", DEPLOY);
    ManifestRead read = new ManifestReader().readTexts(texts, new ReadOptions(mode, false));
    String[] p = id.split("/");
    return read.sources().get(new WorkloadId(p[0], p[1], p[2]));
  }

  private static SourceRef at(int line) {
    return new SourceRef("shop.yaml", line);
  }

  @Test
  void readTexts_blockResources_pointsAtResourcesKey() {
    WorkloadSource s = source(ReplicaMode.PEAK, "shop/Deployment/web");
    assertEquals(at(15), s.container("app"));
  }

  @Test
  void readTexts_flowResources_pointsAtSameLine() {
    assertEquals(at(19), source(ReplicaMode.PEAK, "shop/Deployment/web").container("side"));
  }

  @Test
  void readTexts_containerWithoutResources_pointsAtContainerEntry() {
    assertEquals(at(9), source(ReplicaMode.PEAK, "shop/Deployment/web").container("warm"));
  }

  @Test
  void readTexts_template_pointsAtTemplateKey() {
    assertEquals(at(6), source(ReplicaMode.PEAK, "shop/Deployment/web").podTemplate());
  }

  @Test
  void readTexts_autoscaledAtPeak_replicasAtMaxReplicas() {
    assertEquals(Optional.of(at(26)), source(ReplicaMode.PEAK, "shop/Deployment/web").replicas());
  }

  @Test
  void readTexts_autoscaledDeclared_replicasAtSpecReplicas() {
    assertEquals(Optional.of(at(5)),
        source(ReplicaMode.DECLARED, "shop/Deployment/web").replicas());
  }

  @Test
  void readTexts_job_replicasAtParallelism() {
    assertEquals(Optional.of(at(32)), source(ReplicaMode.PEAK, "shop/Job/nightly").replicas());
  }

  @Test
  void readTexts_admittedPod_keepsContainerRequests() {
    WorkloadSource s = source(ReplicaMode.PEAK, "shop/Deployment/web");
    assertEquals(2, s.admitted().containers().size());
    assertEquals(new java.math.BigDecimal("0.250"),
        s.admitted().containers().get(0).requests().get("cpu"));
  }

  @Test
  void readTexts_json_keyAndValueOnOneLine() {
    TreeMap<String, String> texts = new TreeMap<>();
    texts.put("pod.json", "{\n"
        + "  \"apiVersion\": \"v1\", \"kind\": \"Pod\",\n"
        + "  \"metadata\": {\"name\": \"p\"},\n"
        + "  \"spec\": {\"containers\": [{\"name\": \"c\",\n"
        + "    \"resources\": {\"requests\": {\"cpu\": \"1\"}}}]}\n"
        + "}\n");
    ManifestRead read = new ManifestReader().readTexts(texts, ReadOptions.defaults());
    assertEquals(new SourceRef("pod.json", 5),
        read.sources().get(new WorkloadId("default", "Pod", "p")).container("c"));
  }
}
