package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.PodModel;
import dev.numafit.diag.Diagnostic;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.ReplicationController;
import io.fabric8.kubernetes.api.model.apps.DaemonSet;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.api.model.apps.StatefulSet;
import io.fabric8.kubernetes.client.utils.KubernetesSerialization;
import java.io.IOException;
import java.math.BigDecimal;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.MissingNode;

/**
 * The shortcut for plain workloads must give exactly what fabric8's full conversion gives, and
 * must step aside whenever it cannot be sure.
 */
class PlainWorkloadsTest {
  private static final KubernetesSerialization K8S = new KubernetesSerialization();

  private static List<LocatedDocument> parse(String name, String text) {
    List<LocatedDocument> docs = new ArrayList<>();
    List<Diagnostic> diags = new ArrayList<>();
    new DocumentReader().read(name, text, name.endsWith(".json"), docs::add, diags);
    return docs;
  }

  /** The pod spec fabric8's full conversion of the whole object yields. */
  private static PodSpec fullConversion(JsonNode root, KnownKind k) {
    return switch (k) {
      case POD -> K8S.convertValue(root, Pod.class).getSpec();
      case DEPLOYMENT -> K8S.convertValue(root, Deployment.class).getSpec().getTemplate().getSpec();
      case REPLICA_SET -> K8S.convertValue(root, ReplicaSet.class).getSpec().getTemplate().getSpec();
      case STATEFUL_SET ->
          K8S.convertValue(root, StatefulSet.class).getSpec().getTemplate().getSpec();
      case DAEMON_SET -> K8S.convertValue(root, DaemonSet.class).getSpec().getTemplate().getSpec();
      case REPLICATION_CONTROLLER ->
          K8S.convertValue(root, ReplicationController.class).getSpec().getTemplate().getSpec();
      default -> throw new IllegalArgumentException(k.toString());
    };
  }

  private static Optional<Integer> fullReplicas(JsonNode root, KnownKind k) {
    return Optional.ofNullable(
        switch (k) {
          case DEPLOYMENT -> K8S.convertValue(root, Deployment.class).getSpec().getReplicas();
          case REPLICA_SET -> K8S.convertValue(root, ReplicaSet.class).getSpec().getReplicas();
          case STATEFUL_SET -> K8S.convertValue(root, StatefulSet.class).getSpec().getReplicas();
          case REPLICATION_CONTROLLER ->
              K8S.convertValue(root, ReplicationController.class).getSpec().getReplicas();
          default -> null;
        });
  }

  private static PlainWorkloads.Plain plain(String yaml) {
    JsonNode root = parse("t.yaml", yaml).get(0).root();
    return PlainWorkloads.of(root, KnownKind.of(root.get("kind").asString()).orElseThrow());
  }

  private static PodSpec spec(PlainWorkloads.Plain p) {
    return p.podSpec() != null ? p.podSpec() : p.template().getSpec();
  }

  private static PodModel model(PodSpec s) {
    LocatedDocument doc =
        new LocatedDocument("t", MissingNode.getInstance(), Map.of(), 0);
    ObjectContext ctx = new ObjectContext(doc, "t");
    PodModel m = PodSpecs.toModel(s, "/spec", ctx);
    assertEquals(List.of(), ctx.errors);
    return m;
  }

  private static Path corpus() {
    try {
      return Path.of(PlainWorkloadsTest.class.getResource("/corpus").toURI());
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  @Test
  void of_everyPlainCorpusObject_sameReplicasAndPodModelAsFullConversion() throws IOException {
    // The real public manifests in src/test/resources/corpus (provenance in each SOURCE.md).
    List<Path> files;
    try (Stream<Path> walk = Files.walk(corpus())) {
      files =
          walk.filter(f -> f.toString().matches(".*\\.(ya?ml|json)$")).sorted().toList();
    }
    int plainCount = 0;
    int fullCount = 0;
    for (Path f : files) {
      for (LocatedDocument doc : parse(f.toString(), Files.readString(f))) {
        JsonNode root = doc.root();
        Optional<KnownKind> k =
            root.path("kind").isString()
                ? KnownKind.of(root.get("kind").asString())
                : Optional.empty();
        if (k.isEmpty()
            || !List.of(
                    KnownKind.POD,
                    KnownKind.DEPLOYMENT,
                    KnownKind.REPLICA_SET,
                    KnownKind.STATEFUL_SET,
                    KnownKind.DAEMON_SET,
                    KnownKind.REPLICATION_CONTROLLER)
                .contains(k.get())) {
          continue;
        }
        PlainWorkloads.Plain p = PlainWorkloads.of(root, k.get());
        if (p == null) {
          fullCount++;
          continue;
        }
        plainCount++;
        String where = f.getFileName() + ":" + doc.startLine();
        assertEquals(model(fullConversion(root, k.get())), model(spec(p)), where);
        assertEquals(fullReplicas(root, k.get()), Optional.ofNullable(p.replicas()), where);
      }
    }
    // Both paths are exercised: the small examples are plain, the larger real manifests carry
    // probes, volumes or security settings and take the full conversion.
    assertTrue(plainCount >= 5, "plain objects in the corpus: " + plainCount);
    assertTrue(fullCount >= 5, "fully converted objects in the corpus: " + fullCount);
  }

  @Test
  void of_docsResourcesExample_requestsAndLimitsAsWritten() {
    // Kubernetes docs, "Resource Management for Pods and Containers": the frontend Pod, with
    // requests cpu 250m / memory 64Mi and limits cpu 500m / memory 128Mi per container.
    PlainWorkloads.Plain p =
        plain(
            """
            apiVersion: v1
            kind: Pod
            metadata:
              name: frontend
            spec:
              containers:
              - name: app
                image: example.invalid/app:1
                resources:
                  requests:
                    memory: "64Mi"
                    cpu: "250m"
                  limits:
                    memory: "128Mi"
                    cpu: "500m"
            """);
    assertNotNull(p);
    PodModel m = model(p.podSpec());
    // 250m = 0.25 cores; 64Mi = 64 × 2^20 = 67,108,864 bytes (Kubernetes quantity suffixes).
    assertEquals(0, new BigDecimal("0.25").compareTo(m.containers().get(0).requests().get("cpu")));
    assertEquals(
        0, new BigDecimal("67108864").compareTo(m.containers().get(0).requests().get("memory")));
    assertEquals(0, new BigDecimal("0.5").compareTo(m.containers().get(0).limits().get("cpu")));
    assertEquals(
        0, new BigDecimal("134217728").compareTo(m.containers().get(0).limits().get("memory")));
  }

  @Test
  void of_replicasAsText_null() {
    // Jackson would coerce or reject "3"; the full conversion decides and words the error.
    assertNull(
        plain(
            """
            apiVersion: apps/v1
            kind: Deployment
            metadata: {name: web}
            spec:
              replicas: "3"
              template:
                spec:
                  containers: [{name: web}]
            """));
  }

  @Test
  void of_fieldOutsideTheShortList_null() {
    assertNull(
        plain(
            """
            apiVersion: v1
            kind: Pod
            metadata: {name: probed}
            spec:
              containers:
              - name: web
                livenessProbe: {httpGet: {path: /, port: 8080}}
            """));
  }

  @Test
  void of_containersAsMapping_null() {
    assertNull(
        plain(
            """
            apiVersion: apps/v1
            kind: Deployment
            metadata: {name: odd}
            spec:
              template:
                spec:
                  containers:
                    web: {image: example.invalid/app:1}
            """));
  }

  @Test
  void of_kindWithoutShortcut_null() {
    assertNull(
        PlainWorkloads.of(
            parse("t.yaml", "apiVersion: batch/v1\nkind: Job\nmetadata: {name: j}\n")
                .get(0)
                .root(),
            KnownKind.JOB));
  }

  @Test
  void numericalAmount_sameTextReadTwice_sameAmountAsFabric8() {
    // 1.5Gi = 1.5 × 2^30 = 1,610,612,736 bytes (Kubernetes quantity suffixes).
    for (int i = 0; i < 2; i++) {
      Quantity q = new Quantity("1.5Gi");
      assertEquals(q.getNumericalAmount(), PodSpecs.numericalAmount(q));
      assertEquals(0, new BigDecimal("1610612736").compareTo(PodSpecs.numericalAmount(q)));
    }
    // The same number with another suffix is another amount: 1.5 × 10^9.
    assertEquals(
        0, new BigDecimal("1500000000").compareTo(PodSpecs.numericalAmount(new Quantity("1.5G"))));
  }
}
