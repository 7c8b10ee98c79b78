package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.SnapshotFile;
import dev.numafit.cluster.model.ClusterModel;
import io.fabric8.kubernetes.api.model.NodeBuilder;
import io.fabric8.kubernetes.api.model.PodBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.logging.LogManager;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code numafit snapshot} end to end through Main, a kubeconfig file and a mock API server. */
@EnableKubernetesMockClient(crud = true)
class SnapshotCommandTest {
  static KubernetesMockServer server;
  static KubernetesClient client;

  @TempDir Path dir;

  @BeforeAll
  static void populate() throws Exception {
    try (InputStream in = SnapshotCommandTest.class.getResourceAsStream("/logging.properties")) {
      LogManager.getLogManager().readConfiguration(in);
    }
    client.nodes().resource(new NodeBuilder().withNewMetadata().withName("w1")
        .addToLabels("pool", "general").endMetadata().withNewStatus()
        .addToAllocatable("cpu", new Quantity("4")).addToAllocatable("memory", new Quantity("16Gi"))
        .addToAllocatable("pods", new Quantity("110")).endStatus().build()).create();
    client.pods().inNamespace("shop").resource(new PodBuilder().withNewMetadata()
        .withNamespace("shop").withName("cart-1").endMetadata().withNewSpec().withNodeName("w1")
        .addNewContainer().withName("app").withNewResources()
        .addToRequests("cpu", new Quantity("250m")).endResources().endContainer().endSpec()
        .withNewStatus().withPhase("Running").endStatus().build()).create();
  }

  /** A kubeconfig for the mock server; the token must never be printed. */
  private Path kubeconfig() throws Exception {
    Path f = dir.resolve("kubeconfig");
    Files.writeString(f, String.join("\n",
        "apiVersion: v1",
        "kind: Config",
        "clusters:",
        "- name: mock",
        "  cluster:",
        "    server: " + server.url("").replaceAll("/$", ""),
        "    insecure-skip-tls-verify: true",
        "users:",
        "- name: reader",
        "  user:",
        "    token: s3cr3t-token-value",
        "contexts:",
        "- name: mock",
        "  context: {cluster: mock, user: reader}",
        "current-context: mock",
        ""));
    return f;
  }

  @Test
  void snapshot_kubeconfigGiven_writesTheSnapshotFile() throws Exception {
    Path out = dir.resolve("cluster.json");
    CliRun r = CliRun.of("snapshot", "--kubeconfig", kubeconfig().toString(), "--out",
        out.toString(), "--verbose");
    assertEquals(0, r.code(), r.err());
    ClusterModel m = SnapshotFile.read(out);
    assertEquals(1, m.nodes().size());
    assertEquals(1, m.pods().size());
    assertEquals(250, m.pods().get(0).requests().get("cpu"));
    assertTrue(r.err().contains("numafit: GET "), r.err());
    assertFalse(r.err().contains("s3cr3t"), "never print a credential");
    assertTrue(r.err().contains("wrote " + out + ": 1 nodes, 1 pods"), r.err());
  }

  @Test
  void snapshot_unknownContext_inputErrorNamingIt() throws Exception {
    CliRun r = CliRun.of("snapshot", "--kubeconfig", kubeconfig().toString(), "--context",
        "prod", "--out", dir.resolve("x.json").toString());
    assertEquals(2, r.code());
    assertEquals("error: --context prod: no such context in the kubeconfig\n", r.err());
    assertFalse(Files.exists(dir.resolve("x.json")));
  }

  @Test
  void snapshot_missingKubeconfigFile_inputError() {
    CliRun r = CliRun.of("snapshot", "--kubeconfig", dir.resolve("none").toString(), "--out",
        dir.resolve("x.json").toString());
    assertEquals(2, r.code());
    assertEquals(dir.resolve("none") + ": error: cannot read kubeconfig: no such file\n", r.err());
  }

  @Test
  void review_liveThroughKubeconfig_readsTheClusterAndFits() throws Exception {
    CliRun r = CliRun.of("review", "--kubeconfig", kubeconfig().toString(), "--pool",
        "pool=general", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("\"podsConsidered\": 1"), r.out());
  }

  @Test
  void snapshot_stderrIsATerminal_showsProgressPerType() throws Exception {
    // The launcher passes [ -t 2 ] as numafit.stderrTty=1.
    System.setProperty("numafit.stderrTty", "1");
    try {
      CliRun r = CliRun.of("snapshot", "--kubeconfig", kubeconfig().toString(), "--out",
          dir.resolve("p.json").toString());
      assertEquals(0, r.code(), r.err());
      assertTrue(r.err().contains("pods: 1 read, 1 page"), r.err());
    } finally {
      System.clearProperty("numafit.stderrTty");
    }
    CliRun quiet = CliRun.of("snapshot", "--kubeconfig", kubeconfig().toString(), "--out",
        dir.resolve("q.json").toString());
    assertFalse(quiet.err().contains("read,"), quiet.err());
  }
}
